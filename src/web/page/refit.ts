/**
 * The refit tab. The data file is refitted in the page itself
 * (refitInPage.ts: the refit command's own code), served or opened from
 * disk, and nothing is sent anywhere: a CSV, TSV or TXT file as text, an
 * XLSX file as bytes read within the command's limits
 * (src/refit/xlsxBytes.ts).
 */
import { byId, download } from './dom.js';
import { isTextDataName, isXlsxDataName, refitInPage } from './refitInPage.js';

export function setUpRefitTab(): void {
  const form = byId<HTMLFormElement>('refit-form');
  const submit = byId<HTMLButtonElement>('refit-run');
  const status = byId('refit-status');
  const output = byId('refit-output');
  const save = byId<HTMLButtonElement>('refit-save');
  let lastOutput = '';
  save.addEventListener('click', () => download('plumbline-refit.txt', 'text/plain', lastOutput));
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    void (async () => {
      const file = byId<HTMLInputElement>('refit-data').files?.[0];
      const model = byId<HTMLInputElement>('refit-model').value.trim();
      if (file === undefined) {
        status.textContent = 'Choose a CSV or XLSX file of the raw data first.';
        return;
      }
      if (model === '') {
        status.textContent = 'Give the model, for example: mood ~ route * pace + loneliness';
        return;
      }
      const fields = {
        model,
        type: byId<HTMLSelectElement>('refit-type').value,
        factors: byId<HTMLInputElement>('refit-factors').value,
        missing: byId<HTMLInputElement>('refit-missing').value,
        reported: byId<HTMLTextAreaElement>('refit-reported').value,
      };
      const xlsx = isXlsxDataName(file.name);
      if (!xlsx && !isTextDataName(file.name)) {
        status.textContent = `${file.name}: the page refits CSV, TSV, TXT and XLSX data; save the sheet as one of these.`;
        return;
      }
      submit.disabled = true;
      status.textContent = `Fitting ${model} to ${file.name}…`;
      try {
        const data = xlsx ? { xlsx: new Uint8Array(await file.arrayBuffer()) } : { text: await file.text() };
        const answer = await refitInPage({ name: file.name, ...data, ...fields });
        lastOutput = answer.output;
        output.textContent = answer.output + (answer.errors ? `\n${answer.errors}` : '');
        save.hidden = answer.output === '';
        status.textContent =
          answer.exitCode === 0
            ? 'Refit done: every reported number matches (or none was given).'
            : answer.exitCode === 1
              ? 'Refit done: some reported numbers differ from the refit; see the comparison below.'
              : 'The refit could not be run; the reason is below.';
      } catch (error) {
        status.textContent = `The refit failed in the page (${error instanceof Error ? error.message : String(error)}); plumbline refit on the command line gives the full message.`;
      } finally {
        submit.disabled = false;
      }
    })();
  });
}
