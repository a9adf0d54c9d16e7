/**
 * Prints HTML to PDF with headless Chromium, for the scripts that build the
 * demo documents (corpus-demo/tools/build-documents.mjs) and the labelled
 * corpus in other formats (tests/corpus/formats/build.mjs). Needs Debian's
 * chromium (apt-get install chromium); the PDFs they write are committed.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export function findChromium() {
  for (const name of ['chromium', 'chromium-browser', 'google-chrome']) {
    try {
      return execFileSync('which', [name], { encoding: 'utf8' }).trim();
    } catch {
      // try the next name
    }
  }
  throw new Error('Chromium is needed to print the PDFs: apt-get install chromium');
}

export function printPdf(chromium, html, target) {
  const directory = mkdtempSync(join(tmpdir(), 'plumbline-print-'));
  try {
    const page = join(directory, 'page.html');
    writeFileSync(page, html);
    rmSync(target, { force: true });
    execFileSync(
      chromium,
      ['--headless', '--no-sandbox', '--disable-gpu', '--no-pdf-header-footer', `--user-data-dir=${join(directory, 'profile')}`, `--print-to-pdf=${target}`, `file://${page}`],
      { stdio: 'ignore', timeout: 120_000 },
    );
  } finally {
    rmSync(directory, { recursive: true, force: true });
  }
  if (!existsSync(target)) throw new Error(`Chromium did not write ${target}`);
}
