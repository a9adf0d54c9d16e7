import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { builtCliExists, plumbline, reportOf, temporaryFolder } from './cli.js';

/**
 * A list of 150,000 inputs through the built command: the arguments, the
 * list's entries and the files are walked one by one, never spread into a
 * call (which overflowed the stack: "Maximum call stack size exceeded").
 * The list names 50 small papers 3,000 times each, under two spellings, so
 * the run audits 50 documents and stays quick; the end-to-end run over a
 * folder of 150,000 distinct documents is a benchmark (bench/inputs.ts).
 */

const folder = temporaryFolder('many-inputs');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const papers = 50;
mkdirSync(join(folder, 'papers'));
for (let index = 0; index < papers; index++) {
  // F(1, 20) = 4.35 gives p = .050 (SciPy 1.10.1 f.sf).
  writeFileSync(join(folder, 'papers', `paper-${index}.txt`), 'Dose affected recall, F(1, 20) = 4.35, p = .050.\n');
}
const entries = Array.from({ length: 150_000 }, (_, index) => `${index % 2 === 0 ? './' : ''}papers/paper-${index % papers}.txt`);
writeFileSync(join(folder, 'all.txt'), `# 150,000 entries\n${entries.join('\n')}\n`);

describe.skipIf(!builtCliExists())('a list of 150,000 inputs', () => {
  it('is read to the end and each file audited once, without a stack overflow', () => {
    const run = plumbline(['scan', '@all.txt', '--format', 'json', '--no-cache', '--jobs', '1'], folder);
    expect(run.stderr).not.toMatch(/Maximum call stack|internal error/);
    expect(run.status).toBe(0);
    const documents = reportOf(run).documents;
    expect(documents).toHaveLength(papers);
    expect(documents.every((document) => document.status === 'checked' && document.statistics.length === 1)).toBe(true);
  });
});
