/**
 * The refit tab. Rebuilding a table from raw data runs in plumbline itself:
 * the page sends the data file, the model and the pasted table to the local
 * server of `plumbline web` (127.0.0.1, its own origin, with the token the
 * server wrote into the page), which runs the refit command and sends back
 * its text report. Opened from disk, the page has no server and says so.
 */
import { byId, download } from './dom.js';

/** Base64 of bytes, in slices so that no call gets millions of arguments. */
function base64Of(bytes: Uint8Array): string {
  let binary = '';
  for (let at = 0; at < bytes.length; at += 0x8000) binary += String.fromCharCode(...bytes.subarray(at, at + 0x8000));
  return btoa(binary);
}

interface RefitAnswer {
  exitCode: number;
  output: string;
  errors: string;
}

export function setUpRefitTab(): void {
  const token = document.querySelector<HTMLMetaElement>('meta[name="plumbline-token"]')?.content ?? '';
  const form = byId<HTMLFormElement>('refit-form');
  const submit = byId<HTMLButtonElement>('refit-run');
  const status = byId('refit-status');
  const output = byId('refit-output');
  const save = byId<HTMLButtonElement>('refit-save');
  if (token === '') {
    byId('refit-unavailable').hidden = false;
    submit.disabled = true;
    return;
  }
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
      submit.disabled = true;
      status.textContent = `Fitting ${model} to ${file.name}…`;
      try {
        const response = await fetch('/api/refit', {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', 'X-Plumbline-Token': token },
          body: JSON.stringify({
            name: file.name,
            data: base64Of(new Uint8Array(await file.arrayBuffer())),
            model,
            type: byId<HTMLSelectElement>('refit-type').value,
            factors: byId<HTMLInputElement>('refit-factors').value,
            missing: byId<HTMLInputElement>('refit-missing').value,
            reported: byId<HTMLTextAreaElement>('refit-reported').value,
          }),
        });
        const answer = (await response.json()) as RefitAnswer | { error: string };
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
        status.textContent = `The local plumbline server did not answer (${error instanceof Error ? error.message : String(error)}); is plumbline web still running?`;
      } finally {
        submit.disabled = false;
      }
    })();
  });
}
