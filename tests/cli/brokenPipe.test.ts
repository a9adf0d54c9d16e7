/**
 * A reader that stops reading the report ("plumbline scan . | head") closes the pipe. The run ends quietly with
 * exit code 141 (128 + SIGPIPE, as a shell reports a program the pipe ended; common practice), and says nothing
 * about a fault in plumbline.
 */
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..');
const cli = join(root, 'dist', 'src', 'cli', 'main.js');

describe('a report piped to a reader that stops reading', () => {
  it('ends the run quietly, with no fault reported', async () => {
    const child = spawn('node', [cli, 'scan', join(root, 'corpus-demo'), '--no-cache', '--fail-on', 'never', '--format', 'json'], { stdio: ['ignore', 'pipe', 'pipe'] });
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
