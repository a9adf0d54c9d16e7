/**
 * The refit tab. A CSV, TSV or TXT data file is refitted in the page itself
 * (refitInPage.ts: the refit command's own code), served or opened from
 * disk, and nothing is sent anywhere. An XLSX file is read by the command's
 * XLSX reader, which needs a file on disk: the page sends it to the local
 * server of `plumbline web` (127.0.0.1, its own origin, with the token the
 * server wrote into the page), which runs the refit command and sends back
 * its text report; opened from disk, the page says to save the sheet as CSV.
 */
import { byId, download } from './dom.js';
import { isTextDataName, refitInPage, type PageRefitAnswer } from './refitInPage.js';

/** Base64 of bytes, in slices so that no call gets millions of arguments. */
function base64Of(bytes: Uint8Array): string {
  let binary = '';
  for (let at = 0; at < bytes.length; at += 0x8000) binary += String.fromCharCode(...bytes.subarray(at, at + 0x8000));
  return btoa(binary);
}

type RefitAnswer = PageRefitAnswer;

/** Sends an XLSX file to the local server, which runs the refit command on it. */
async function refitOnServer(token: string, file: File, fields: { model: string; type: string; factors: string; missing: string; reported: string }): Promise<RefitAnswer | { error: string }> {
  const response = await fetch('/api/refit', {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Plumbline-Token': token },
    body: JSON.stringify({ name: file.name, data: base64Of(new Uint8Array(await file.arrayBuffer())), ...fields }),
  });
  return (await response.json()) as RefitAnswer | { error: string };
}

export function setUpRefitTab(): void {
  const token = document.querySelector<HTMLMetaElement>('meta[name="plumbline-token"]')?.content ?? '';
  const form = byId<HTMLFormElement>('refit-form');
  const submit = byId<HTMLButtonElement>('refit-run');
  const status = byId('refit-status');
  const output = byId('refit-output');
  const save = byId<HTMLButtonElement>('refit-save');
  // Opened from disk there is no server: only the XLSX route needs one, and the note says so.
  if (token === '') byId('refit-unavailable').hidden = false;
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
      const inPage = isTextDataName(file.name);
      if (!inPage && token === '') {
        status.textContent = `${file.name}: opened from a file, the page refits CSV, TSV and TXT data only; save the sheet as CSV, or start the page with plumbline web to refit XLSX.`;
        return;
      }
      submit.disabled = true;
      status.textContent = `Fitting ${model} to ${file.name}…`;
      try {
        const answer = inPage ? await refitInPage({ name: file.name, text: await file.text(), ...fields }) : await refitOnServer(token, file, fields);
        if ('error' in answer) {
          status.textContent = answer.error;
          output.textContent = '';
          return;
        }
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
        if (inPage) {
          status.textContent = `The refit failed in the page (${error instanceof Error ? error.message : String(error)}); plumbline refit on the command line gives the full message.`;
          return;
        }
        status.textContent = `The local plumbline server did not answer (${error instanceof Error ? error.message : String(error)}); is plumbline web still running?`;
      } finally {
        submit.disabled = false;
      }
    })();
  });
}
