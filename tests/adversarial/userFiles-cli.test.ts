import { spawnSync } from 'node:child_process';
import { existsSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { builtCliExists, plumbline, reportOf, temporaryFolder } from '../batch/cli.js';

/**
 * The files a user names besides the documents (a settings file, a list of
 * documents, refit's data, analysis description and reported table) are
 * read only when they are regular files: /dev/zero never ends and a FIFO
 * waits for a writer, so either is refused with what it is. A hang shows as
 * the spawn's 60-second timeout (status null).
 *
 * FIFOs are made with mkfifo in the test's folder; a platform that cannot
 * make one, or has no /dev/zero, skips that case, and its name says so.
 */

const folder = temporaryFolder('user-files');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const fifo = join(folder, 'settings-fifo.json');
const madeFifo = spawnSync('mkfifo', [fifo, join(folder, 'list-fifo.txt'), join(folder, 'data-fifo.csv')]).status === 0;
let linkToZero = existsSync('/dev/zero');
try {
  if (linkToZero) {
    symlinkSync('/dev/zero', join(folder, 'zero.json'));
    symlinkSync('/dev/zero', join(folder, 'zero-list.txt'));
  }
} catch {
  linkToZero = false;
}
writeFileSync(join(folder, 'good.txt'), 'Dose affected recall, F(2, 57) = 4.21, p = .020.\n'); // p = .0197 (SciPy 1.10.1 f.sf)
writeFileSync(join(folder, 'data.csv'), 'score,group\n1,a\n2,b\n3,a\n4,b\n5,a\n7,b\n');
const ZERO = 'not a regular file: a symbolic link to /dev/zero, a character device; plumbline reads only regular files (a FIFO or a device can block or never end)';
const FIFO = 'not a regular file: a FIFO (named pipe); plumbline reads only regular files (a FIFO or a device can block or never end)';
const skip = (possible: boolean, what: string): string => (possible ? '' : ` (skipped: this platform could not create ${what})`);

describe.skipIf(!builtCliExists())('--config', () => {
  it.skipIf(!linkToZero)(`naming a link to /dev/zero is refused by name, exit 2${skip(linkToZero, 'a link to /dev/zero')}`, () => {
    const run = plumbline(['scan', 'good.txt', '--config', 'zero.json', '--no-cache'], folder);
    expect(run.status).toBe(2);
    expect(run.stderr).toBe(`plumbline: --config zero.json: ${ZERO}\n`);
  });

  it.skipIf(!madeFifo)(`naming a FIFO does not wait for a writer${skip(madeFifo, 'a FIFO')}`, () => {
    for (const command of [['scan', 'good.txt', '--no-cache'], ['check', 'F(1, 20) = 4.35, p = .05']]) {
      const run = plumbline([...command, '--config', 'settings-fifo.json'], folder);
      expect(run.status).toBe(2);
      expect(run.stderr).toBe(`plumbline: --config settings-fifo.json: ${FIFO}\n`);
    }
  });
});

describe.skipIf(!builtCliExists())('@list files', () => {
  it.skipIf(!linkToZero || !madeFifo)(`a list that is /dev/zero or a FIFO becomes an unreadable row naming it; the other inputs are audited${skip(linkToZero && madeFifo, 'a FIFO or a link to /dev/zero')}`, () => {
    const run = plumbline(['scan', '@zero-list.txt', '@list-fifo.txt', 'good.txt', '--format', 'json', '--no-cache', '--jobs', '1'], folder);
    expect(run.status).toBe(2);
    const documents = reportOf(run).documents;
    expect(documents.find((document) => document.path === 'zero-list.txt')).toMatchObject({ status: 'unreadable', error: `list file ${ZERO}` });
    expect(documents.find((document) => document.path === 'list-fifo.txt')).toMatchObject({ status: 'unreadable', error: `list file ${FIFO}` });
    expect(documents.find((document) => document.path === 'good.txt')).toMatchObject({ status: 'checked' });
  });
});

describe.skipIf(!builtCliExists())('refit', () => {
  it.skipIf(!madeFifo)(`data that is a FIFO is refused by name${skip(madeFifo, 'a FIFO')}`, () => {
    const run = plumbline(['refit', 'data-fifo.csv', '--model', 'score ~ group'], folder);
    expect(run.status).toBe(2);
    expect(run.stderr).toBe(`plumbline: data-fifo.csv: ${FIFO}\n`);
  });

  it.skipIf(!linkToZero)(`--spec and --reported naming /dev/zero are refused by name${skip(linkToZero, 'a link to /dev/zero')}`, () => {
    expect(plumbline(['refit', 'data.csv', '--spec', 'zero.json'], folder).stderr).toBe(`plumbline: --spec zero.json: ${ZERO}\n`);
    expect(plumbline(['refit', 'data.csv', '--model', 'score ~ group', '--reported', 'zero.json'], folder).stderr).toBe(`plumbline: --reported zero.json: ${ZERO}\n`);
  });
});
