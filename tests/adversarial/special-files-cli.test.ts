import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { builtCliExists, peakMemoryRunner, plumbline, reportOf, temporaryFolder, type Run } from '../batch/cli.js';

/**
 * Only regular files are read (src/documents/regularFile.ts). The built
 * command is run on FIFOs, device nodes and symbolic links to devices,
 * named on the command line and found in a scanned folder, with and without
 * the cache and on one thread or two: each is refused with a message that
 * says what it is and becomes its document's unreadable row, the other
 * documents are audited, and the run ends quickly in little memory.
 *
 * Special files are made with mkfifo and mknod in the test's folder. A
 * platform that cannot make one skips that case, and its name says so.
 */

const folder = temporaryFolder('special');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** Runs a command that makes a special file; whether the platform allowed it. */
function made(command: string, args: string[]): boolean {
  const result = spawnSync(command, args, { encoding: 'utf8' });
  return result.status === 0;
}

// The folder a user scans: a good paper among a FIFO, a device node and a link to /dev/zero, each named like a document.
const papers = join(folder, 'papers');
mkdirSync(papers);
writeFileSync(join(papers, 'good.txt'), 'Dose affected recall, F(2, 57) = 4.21, p = .020.\n'); // p = .0197 (SciPy 1.10.1 f.sf)
const fifoInFolder = made('mkfifo', [join(papers, 'pipe.txt')]) && made('mkfifo', [join(papers, 'pipe.pdf')]) && made('mkfifo', [join(papers, 'pipe.docx')]);
// Character device 1,5 is /dev/zero on Linux; creating a device node needs a privilege many platforms withhold.
const deviceInFolder = made('mknod', [join(papers, 'device.txt'), 'c', '1', '5']);
let linkToZero = existsSync('/dev/zero');
try {
  if (linkToZero) symlinkSync('/dev/zero', join(papers, 'zero.txt'));
} catch {
  linkToZero = false;
}
// A FIFO named directly on the command line, and a LaTeX paper whose .bbl beside it is a FIFO.
const fifoDirect = made('mkfifo', [join(folder, 'direct.txt')]);
writeFileSync(join(folder, 'paper.tex'), '\\begin{document}Dose affected recall, F(2, 57) = 4.21, p = .020. \\bibliography{refs}\\end{document}\n');
const fifoBbl = made('mkfifo', [join(folder, 'paper.bbl')]);

/** Runs the command and measures its time and peak memory (tests/batch/cli.ts). */
const timed = peakMemoryRunner(folder);

function skipNote(possible: boolean, what: string): string {
  return possible ? '' : ` (skipped: this platform could not create ${what})`;
}

function errorOf(run: Run, path: string): string | undefined {
  return reportOf(run).documents.find((document) => document.path === path)?.error;
}

describe('only regular files are read, in the built command', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  for (const options of [['--no-cache', '--jobs', '1'], ['--jobs', '1'], ['--no-cache', '--jobs', '2'], ['--jobs', '2']]) {
    it.skipIf(!fifoInFolder)(`FIFOs named like a .txt, .pdf and .docx in a scanned folder (${options.join(' ')})${skipNote(fifoInFolder, 'a FIFO')}`, () => {
      const run = timed(['scan', 'papers', '--format', 'json', '-q', '--cache-dir', join(folder, 'cache'), ...options]);
      expect(run.status).toBe(2); // unreadable documents
      expect(run.seconds).toBeLessThan(30);
      expect(run.peakMb).toBeLessThan(500);
      const report = reportOf(run);
      for (const name of ['pipe.txt', 'pipe.pdf', 'pipe.docx']) {
        expect(errorOf(run, `papers/${name}`), name).toMatch(/^not a regular file: a FIFO \(named pipe\); plumbline reads only regular files/);
      }
      // The audit still ends with its report: the good paper is audited.
      expect(report.documents.find((document) => document.path === 'papers/good.txt')).toMatchObject({ status: 'checked', statistics: [expect.anything()] });
    });
  }

  it.skipIf(!deviceInFolder)(`a device node named like a .txt in a scanned folder${skipNote(deviceInFolder, 'a device node (mknod needs a privilege)')}`, () => {
    const run = timed(['scan', 'papers', '--format', 'json', '-q', '--no-cache', '--jobs', '1']);
    expect(run.status).toBe(2);
    expect(run.seconds).toBeLessThan(30);
    expect(run.peakMb).toBeLessThan(500);
    expect(errorOf(run, 'papers/device.txt')).toMatch(/^not a regular file: a character device;/);
  });

  it.skipIf(!linkToZero)(`a symbolic link to /dev/zero named like a .txt, in a scanned folder and named directly${skipNote(linkToZero, 'a link to /dev/zero')}`, () => {
    for (const args of [['papers'], ['papers/zero.txt']]) {
      const run = timed(['scan', ...args, '--format', 'json', '-q', '--jobs', '1', '--cache-dir', join(folder, 'cache')]);
      expect(run.status).toBe(2);
      expect(run.seconds).toBeLessThan(30);
      expect(run.peakMb).toBeLessThan(500); // reading /dev/zero "whole" grew without bound
      expect(errorOf(run, 'papers/zero.txt')).toBe(
        'not a regular file: a symbolic link to /dev/zero, a character device; plumbline reads only regular files (a FIFO or a device can block or never end)',
      );
    }
  });

  it.skipIf(!fifoDirect)(`a FIFO named directly on the command line does not block${skipNote(fifoDirect, 'a FIFO')}`, () => {
    for (const cache of [['--no-cache'], []]) {
      const run = timed(['scan', 'direct.txt', '--format', 'json', '-q', '--jobs', '1', '--cache-dir', join(folder, 'cache'), ...cache]);
      expect(run.status).toBe(2);
      expect(run.seconds).toBeLessThan(30);
      expect(errorOf(run, 'direct.txt')).toMatch(/^not a regular file: a FIFO \(named pipe\);/);
    }
    // The text report names the file and says why.
    const text = plumbline(['scan', 'direct.txt', '-q', '--no-cache'], folder);
    expect(text.stdout).toContain('direct.txt\n  unreadable: not a regular file: a FIFO (named pipe);');
  });

  it.skipIf(!fifoBbl)(`a FIFO where a LaTeX paper's .bbl would be is passed over, and the paper is read${skipNote(fifoBbl, 'a FIFO')}`, () => {
    const run = timed(['scan', 'paper.tex', '--format', 'json', '-q', '--no-cache', '--jobs', '1']);
    expect(run.status).toBe(0);
    expect(run.seconds).toBeLessThan(30);
    expect(reportOf(run).documents[0]).toMatchObject({ path: 'paper.tex', status: 'checked', statistics: [expect.anything()] });
  });
});
