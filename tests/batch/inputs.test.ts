import { linkSync, mkdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { reportedPath } from '../../src/batch/inputs.js';
import { builtCliExists, pathsOf, plumbline, reportOf, temporaryFolder } from './cli.js';

const consistent = 'Dose affected recall, F(2, 57) = 4.21, p = .020.\n'; // p = .0197 (SciPy 1.10.1 scipy.stats.f.sf)
const inconsistent = 'Age did not, F(1, 44) = 4.21, p = .31.\n'; // p = .046 (SciPy 1.10.1 scipy.stats.f.sf)

/**
 * top.txt, a/mid.txt, a/b/top.txt (same name as the top-level file, other
 * content) and a/b/c/deep.txt; the scan of the whole tree must list all four.
 */
function tree(): string {
  const dir = temporaryFolder('paths');
  mkdirSync(join(dir, 'a', 'b', 'c'), { recursive: true });
  writeFileSync(join(dir, 'top.txt'), consistent);
  writeFileSync(join(dir, 'a', 'mid.txt'), consistent);
  writeFileSync(join(dir, 'a', 'b', 'top.txt'), inconsistent);
  writeFileSync(join(dir, 'a', 'b', 'c', 'deep.txt'), consistent);
  return dir;
}

const scanJson = (args: string[], cwd: string) => plumbline(['scan', ...args, '--no-cache', '--format', 'json', '--fail-on', 'never'], cwd);

describe('scan names every file relative to where the user stands', () => {
  expect(builtCliExists(), 'run npm run build first').toBe(true);
  const everything: [string, string][] = [
    ['a/b/c/deep.txt', 'checked'],
    ['a/b/top.txt', 'checked'],
    ['a/mid.txt', 'checked'],
    ['top.txt', 'checked'],
  ];

  it('reads the subfolders of "." and "./" (not ./mid.txt, unreadable), and the absolute path gives the same names', () => {
    const dir = tree();
    for (const arg of ['.', './', dir, `${dir}/`]) {
      const run = scanJson([arg], dir);
      expect(run.status, `${arg}: ${run.stderr}`).toBe(0);
      expect(pathsOf(run), arg).toEqual(everything);
    }
    // The file of the same name in a subfolder is its own document, with its own finding.
    const report = reportOf(scanJson(['.'], dir));
    expect(report.documents.find((d) => d.path === 'a/b/top.txt')?.statistics[0]?.findings.map((f) => f.rule)).toContain('p-value-mismatch');
    expect(report.documents.find((d) => d.path === 'top.txt')?.statistics[0]?.findings).toEqual([]);
  });

  it('names files above the working folder with "..", and a linked folder by the link', () => {
    const dir = tree();
    const up = scanJson(['..', '../..'], join(dir, 'a', 'b'));
    expect(pathsOf(up)).toEqual([
      ['../../top.txt', 'checked'],
      ['../mid.txt', 'checked'],
      ['c/deep.txt', 'checked'],
      ['top.txt', 'checked'],
    ]);
    symlinkSync(join(dir, 'a'), join(dir, 'linked'));
    expect(pathsOf(scanJson(['linked'], dir))).toEqual([
      ['linked/b/c/deep.txt', 'checked'],
      ['linked/b/top.txt', 'checked'],
      ['linked/mid.txt', 'checked'],
    ]);
  });

  it('counts two inputs as one only when they are the same file', () => {
    const dir = tree();
    symlinkSync(join(dir, 'a'), join(dir, 'linked'));
    linkSync(join(dir, 'top.txt'), join(dir, 'hard-link.txt'));
    writeFileSync(join(dir, 'copy.txt'), consistent); // same content, another file: kept
    // The same files named as ".", by absolute path, through the linked folder, and one by one.
    const run = scanJson(['.', dir, 'a', './a', 'linked', 'a/mid.txt', 'linked/mid.txt', `${dir}/top.txt`], dir);
    expect(pathsOf(run)).toEqual([
      ['a/b/c/deep.txt', 'checked'],
      ['a/b/top.txt', 'checked'],
      ['a/mid.txt', 'checked'],
      ['copy.txt', 'checked'],
      ['hard-link.txt', 'checked'], // top.txt by another name: one file, listed once
    ]);
  });

  it('names a missing argument the same way', () => {
    const dir = tree();
    const run = plumbline(['scan', './gone.txt', `${dir}/a/gone.pdf`, 'top.txt', '--no-cache', '--format', 'json'], dir);
    expect(pathsOf(run)).toEqual([
      ['a/gone.pdf', 'unreadable'],
      ['gone.txt', 'unreadable'],
      ['top.txt', 'checked'],
    ]);
    expect(run.status).toBe(2);
  });
});

describe('reportedPath', () => {
  it('is relative to the first working folder the file lies under, else climbs from the first', () => {
    expect(reportedPath('/home/u/papers/a.pdf', ['/home/u'])).toBe('papers/a.pdf');
    expect(reportedPath('/home/a.pdf', ['/home/u'])).toBe('../a.pdf');
    // The shell's name for the working folder (a link) is used when the file lies under it and not under the real one.
    expect(reportedPath('/home/u/link/papers/a.pdf', ['/data/real', '/home/u/link'])).toBe('papers/a.pdf');
    expect(reportedPath('/data/a.pdf', ['/data/real', '/home/u/link'])).toBe('../a.pdf');
  });
});
