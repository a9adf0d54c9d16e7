import { mkdirSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Report } from '../../src/report/model.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';
import { bin, builtCliExists, temporaryFolder } from '../batch/cli.js';
import type { CliIo } from '../../src/cli/common.js';

/**
 * For any multiset of input files (copies of one paper under other names,
 * empty files, broken files) and any --jobs, a scan with the cache lists
 * every input file exactly once and gives the report that the plainest run
 * (--jobs 1 --no-cache) gives. The cache folder is shared by every case, so
 * later cases mix cache hits, misses and entries written by identical files
 * audited at once. Seeded (fast-check prints the seed and the shrunk case
 * on failure).
 *
 * The built command runs in this process (runCli from dist/, whose worker
 * pool runs on real threads), not as a child process: starting Node twice
 * per case would take most of the time. Paths are therefore named relative
 * to this process's folder, the same way in both runs.
 */

/** What a file may hold, and the names it may have. */
const contents: { bytes: Buffer; extensions: string[] }[] = [
  // p = .0197 and .046 (SciPy 1.10.1 scipy.stats.f.sf): one consistent, one not.
  { bytes: Buffer.from('Dose affected recall, F(2, 57) = 4.21, p = .020, ηp2 = .13.\n'), extensions: ['.txt', '.md', '.TXT'] },
  { bytes: Buffer.from('Age did not, F(1, 44) = 4.21, p = .31.\n'), extensions: ['.txt', '.md'] },
  { bytes: Buffer.from('Participants were thanked and paid.\n'), extensions: ['.txt', '.md'] },
  { bytes: Buffer.alloc(0), extensions: ['.txt', '.md', '.html'] }, // empty
  { bytes: Buffer.from([0x41, 0x20, 0xc3, 0x28, 0x0a]), extensions: ['.txt'] }, // invalid UTF-8: unreadable
  { bytes: Buffer.from('%PDF-1.4\nnot really a PDF\n'), extensions: ['.pdf'] }, // broken
  { bytes: Buffer.from('PK\u0003\u0004 not really a zip'), extensions: ['.docx'] }, // broken
  { bytes: Buffer.from('<html><body><p>Groups differed, t(38) = 2.10, p = .042.</p></body></html>'), extensions: ['.html'] },
];

const fileSpec = fc.record({
  content: fc.nat({ max: contents.length - 1 }),
  extension: fc.nat({ max: 2 }),
  folder: fc.constantFrom('', 'a', 'a/b'),
});

const caseSpec = fc.record({
  files: fc.array(fileSpec, { minLength: 1, maxLength: 12 }),
  jobs: fc.constantFrom(1, 2),
  // How the folder is named: ".", "./" or its absolute path; and whether one file is named again on its own.
  folderArg: fc.constantFrom('.', './', 'absolute'),
  namedAgain: fc.option(fc.nat(), { nil: null }),
});

type RunCli = (argv: readonly string[], io: CliIo) => Promise<number>;

async function scanJson(runCli: RunCli, args: string[]): Promise<Report> {
  let stdout = '';
  let stderr = '';
  const io: CliIo = { stdout: (text) => (stdout += text), stderr: (text) => (stderr += text), readStdin: async () => '', color: false };
  const status = await runCli(['scan', ...args, '--format', 'json', '--fail-on', 'never', '--quiet'], io);
  if (status !== 0 && status !== 2) throw new Error(`exit ${status}: ${stderr}`);
  if (stderr !== '') throw new Error(`unexpected stderr: ${stderr}`);
  return readJsonReport(stdout);
}

describe('scan of any multiset of files', () => {
  it('lists every input once, and equals the --jobs 1 --no-cache run', async () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
    const { runCli } = (await import(join(bin, '..', 'program.js'))) as { runCli: RunCli };
    const sharedCache = join(temporaryFolder('property-cache'), 'cache');
    await fc.assert(
      fc.asyncProperty(caseSpec, async ({ files, jobs, folderArg, namedAgain }) => {
        const dir = temporaryFolder('property');
        const written = files.map((file, index) => {
          const { bytes, extensions } = contents[file.content]!;
          const path = join(file.folder, `f${index}${extensions[file.extension % extensions.length]}`);
          mkdirSync(join(dir, file.folder), { recursive: true });
          writeFileSync(join(dir, path), bytes);
          return path;
        });
        const here = (path: string): string => relative(process.cwd(), join(dir, path));
        const args = [folderArg === 'absolute' ? dir : `${here('')}${folderArg === './' ? '/' : ''}`];
        if (namedAgain !== null) args.push(here(written[namedAgain % written.length]!));
        const [plain, tested] = await Promise.all([
          scanJson(runCli, [here(''), '--jobs', '1', '--no-cache']),
          scanJson(runCli, [...args, '--jobs', String(jobs), '--cache-dir', sharedCache]),
        ]);
        expect(tested.documents.map((d) => d.path)).toEqual(written.map(here).sort());
        expect(tested.documents).toEqual(plain.documents);
        expect(tested.summary).toEqual(plain.summary);
      }),
      { seed: 20240618, numRuns: 4 },
    );
  }, 120_000);
});
