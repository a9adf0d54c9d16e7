/**
 * A reader that stops reading the report ("plumbline scan . | head") closes the pipe. The run ends quietly with
 * exit code 141 (128 + SIGPIPE, as a shell reports a program the pipe ended; common practice), and says nothing
 * about a fault in plumbline.
 */
import { spawn } from 'node:child_process';
import { copyFileSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..');
const cli = join(root, 'dist', 'src', 'cli', 'main.js');

/**
 * Ten copies of the demo's text manuscripts under names of their own: a report of a few megabytes, far more
 * than a pipe holds and than the reader takes before it closes the pipe (the demo's own JSON report, about
 * 190 KB, can be taken whole in one read, and the run then ends with nothing left to write).
 */
const folder = mkdtempSync(join(tmpdir(), 'plumbline-pipe-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const manuscripts = readdirSync(join(root, 'corpus-demo')).filter((name) => /\.(txt|md)$/.test(name) && name !== 'README.md');
for (let copy = 0; copy < 10; copy++) for (const name of manuscripts) copyFileSync(join(root, 'corpus-demo', name), join(folder, `${copy}-${name}`));

describe('a report piped to a reader that stops reading', () => {
  it('ends the run quietly, with no fault reported', async () => {
    const child = spawn('node', [cli, 'scan', folder, '--no-cache', '--fail-on', 'never', '--format', 'json'], { stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    // Read the first piece of the report, then close the pipe as "head -c" does.
    await new Promise<void>((resolve) => child.stdout.once('data', () => resolve()));
    child.stdout.destroy();
    const code = await new Promise<number | null>((resolve) => child.on('close', (exit) => resolve(exit)));
    expect(stderr).not.toContain('internal error');
    expect(code).toBe(141);
  });
});
