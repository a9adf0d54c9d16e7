/**
 * Runs the built command line's `scan` on one file and returns its document
 * from the JSON report, parsed with the report's schema (the command exits
 * non-zero when it flags something; its report is read all the same).
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

const cli = join(__dirname, '..', '..', 'dist', 'src', 'cli', 'main.js');

export function scanDocumentJson(path: string) {
  let out: string;
  try {
    out = execFileSync('node', [cli, 'scan', path, '--no-cache', '--quiet', '--format', 'json'], { encoding: 'utf8' });
  } catch (error) {
    out = (error as { stdout: string }).stdout;
  }
  return readJsonReport(out).documents[0]!;
}

/** Writes `text` to a file of its own (named `name`, in a new temporary folder) and scans it as above. */
export function scanTextJson(text: string, name = 'document.txt') {
  const path = join(mkdtempSync(join(tmpdir(), 'plumbline-cli-')), name);
  writeFileSync(path, text);
  return scanDocumentJson(path);
}
