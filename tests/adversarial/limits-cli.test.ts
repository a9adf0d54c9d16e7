import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli, type CliIo } from '../../src/cli/program.js';

const folder = mkdtempSync(join(tmpdir(), 'plumbline-limits-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

async function run(argv: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: CliIo = { stdout: (text) => (out += text), stderr: (text) => (err += text), readStdin: async () => '', color: false };
  const code = await runCli(argv, io);
  return { code, out, err };
}

const page = join(folder, 'page.html');
writeFileSync(page, `<html><body><p>Recall improved, F(2, 57) = 4.21, p = .020.</p>${'<p>filler text</p>'.repeat(80_000)}</body></html>`);

describe('limits from the command line and the settings file', () => {
  it('--max-document-mb refuses a larger document, naming the file, the limit and its value', async () => {
    const { code, out } = await run(['scan', page, '--max-document-mb', '1', '--no-cache', '-j', '1', '-q', '--format', 'json']);
    expect(code).toBe(2);
    const document = JSON.parse(out).documents[0];
    expect(document).toMatchObject({ path: relative(process.cwd(), page), status: 'unreadable' }); // named from where the command runs
    expect(document.error).toMatch(/^document too large: 1\.\d MB \(limit maxDocumentMb = 1 MB; raise it with --max-document-mb <n>/);
    expect((await run(['scan', page, '--max-document-mb', '2', '--no-cache', '-j', '1', '-q'])).code).toBe(0);
  });

  it('--limit name=value sets any limit, and bad names or values are usage errors', async () => {
    const { code, out } = await run(['scan', page, '--limit', 'maxElements=1000', '--no-cache', '-j', '1', '-q', '--format', 'json']);
    expect(code).toBe(2);
    expect(JSON.parse(out).documents[0].error).toMatch(/^more than 1,000 elements \(limit maxElements = 1,000 elements;/);
    expect(await run(['scan', page, '--limit', 'maxColumns=3'])).toMatchObject({ code: 2, err: expect.stringMatching(/^plumbline: --limit: unknown limit "maxColumns"; known limits: maxDocumentMb, /) });
    expect(await run(['scan', page, '--max-document-mb', '-1'])).toMatchObject({ code: 2, err: 'plumbline: --max-document-mb: limit maxDocumentMb must be a positive number, got -1\n' });
    expect(await run(['scan', page, '--limit', 'maxElements'])).toMatchObject({ code: 2, err: 'plumbline: --limit takes name=value, got "maxElements"\n' });
  });

  it('the settings file\'s "limits" apply, the command line wins, and unknown limits are refused', async () => {
    const settings = join(folder, 'settings.json');
    writeFileSync(settings, JSON.stringify({ limits: { maxElements: 1000 } }));
    expect((await run(['scan', page, '-c', settings, '--no-cache', '-j', '1', '-q'])).code).toBe(2);
    expect((await run(['scan', page, '-c', settings, '--limit', 'maxElements=1000000', '--no-cache', '-j', '1', '-q'])).code).toBe(0);
    writeFileSync(settings, JSON.stringify({ limits: { maxPages: 3 } }));
    const bad = await run(['scan', page, '-c', settings]);
    expect(bad.code).toBe(2);
    expect(bad.err).toContain(`${settings}: limits: Unrecognized key: "maxPages"`);
    writeFileSync(settings, JSON.stringify({ limits: { maxPdfPages: 0 } }));
    expect((await run(['scan', page, '-c', settings])).err).toMatch(/limits\.maxPdfPages: Too small/);
  });

  it('a huge settings file is refused without being parsed', async () => {
    const settings = join(folder, 'huge.json');
    writeFileSync(settings, `{"rules": {}, "x": "${'a'.repeat(2_000_000)}"}`);
    expect((await run(['scan', page, '-c', settings])).err).toBe(`plumbline: ${settings}: 2000022 bytes is too large for a settings file (at most 1000000 bytes)\n`);
  });
});
