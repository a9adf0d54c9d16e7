import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { builtCliExists, plumbline, temporaryFolder } from '../batch/cli.js';

/**
 * `check` reads the text it is given. Given the name of a file that exists,
 * it used to audit the name itself, find no result and exit 0, as if the
 * paper were clean; it now stops with a usage error that points to `scan`.
 */

const folder = temporaryFolder('check-path');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

// F(2, 57) = 4.21 -> p = .0197 (SciPy 1.10.1 scipy.stats.f.sf): the file's result is wrong, so a scan exits 1.
writeFileSync(join(folder, 'paper.txt'), 'Dose affected recall, F(2, 57) = 4.21, p = .002.\n');
writeFileSync(join(folder, 'my paper.txt'), 'Dose affected recall, F(2, 57) = 4.21, p = .002.\n');
mkdirSync(join(folder, 'manuscripts'));

describe('plumbline check given a path, in the built command', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  it('an existing file: a usage error (exit 2) that says to use scan, with the command to run, and no report', () => {
    const run = plumbline(['check', 'paper.txt'], folder);
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain('"paper.txt" is a file');
    expect(run.stderr).toContain('use scan: plumbline scan paper.txt');
  });

  it('the suggested command quotes a name with a space, and it audits the file', () => {
    const run = plumbline(['check', 'my paper.txt'], folder);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain("plumbline scan 'my paper.txt'");
    const scan = plumbline(['scan', 'my paper.txt', '--no-cache', '-q'], folder);
    expect(scan.status).toBe(1);
    expect(scan.stdout).toContain('p-value-mismatch');
  });

  it('an existing folder, and the same error with any format', () => {
    const run = plumbline(['check', 'manuscripts', '--format', 'json'], folder);
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain('"manuscripts" is a folder');
  });

  it('text that names no file is checked as before, even text that looks like a file name', () => {
    expect(plumbline(['check', 'missing.txt'], folder)).toMatchObject({ status: 0, stderr: '' });
    const run = plumbline(['check', 'Dose affected recall, F(2, 57) = 4.21, p = .002.'], folder);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('p-value-mismatch');
  });

  it('"-" still reads standard input, even where a file named "-" exists', () => {
    writeFileSync(join(folder, '-'), 'not read\n');
    const run = plumbline(['check', '-'], folder);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('<stdin>');
  });
});
