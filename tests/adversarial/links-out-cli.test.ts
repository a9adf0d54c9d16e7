import { mkdirSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { pathsOf, plumbline, reportOf, temporaryFolder } from '../batch/cli.js';

/**
 * A scanned folder is audited for what is in it: a symbolic link in it to a
 * file outside it is not followed unless --follow-links asks, and is listed
 * with the reason, never dropped without a word. Links that stay inside the
 * folder are followed (and a file reached twice is audited once).
 */

const folder = temporaryFolder('links-out');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const papers = join(folder, 'papers');
mkdirSync(join(papers, 'sub'), { recursive: true });
mkdirSync(join(folder, 'elsewhere'));
// t(58) = 2.41 gives p = .019 (SciPy 1.10.1 scipy.stats.t.sf(2.41, 58) * 2, computed when the test was written).
writeFileSync(join(papers, 'own.txt'), 'Groups differed, t(58) = 2.41, p = .019.\n');
writeFileSync(join(folder, 'elsewhere', 'private.txt'), 'Groups differed, t(58) = 2.41, p = .019.\n');
symlinkSync(join('..', 'elsewhere', 'private.txt'), join(papers, 'link-out.txt'));
symlinkSync(join('..', 'own.txt'), join(papers, 'sub', 'link-in.txt'));

describe('links out of a scanned folder', () => {
  it('lists a link to a file outside the folder as not read, with the reason, and audits the rest', () => {
    const run = plumbline(['scan', 'papers', '--no-cache', '--quiet', '--format', 'json'], folder);
    expect(pathsOf(run)).toEqual([
      [join('papers', 'link-out.txt'), 'unreadable'],
      [join('papers', 'own.txt'), 'checked'],
    ]);
    const linkOut = reportOf(run).documents.find((document) => document.path.endsWith('link-out.txt'))!;
    expect(JSON.stringify(linkOut)).toContain('outside the scanned folder');
  });

  it('follows it with --follow-links', () => {
    const run = plumbline(['scan', 'papers', '--no-cache', '--quiet', '--format', 'json', '--follow-links'], folder);
    expect(pathsOf(run)).toEqual([
      [join('papers', 'link-out.txt'), 'checked'],
      [join('papers', 'own.txt'), 'checked'],
    ]);
  });
});
