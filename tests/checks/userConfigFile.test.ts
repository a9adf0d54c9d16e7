/**
 * The settings file is checked on what was opened, not only by an earlier
 * look at its path: a FIFO or a device in its place is refused when read,
 * and nothing waits for a writer. (The command line looks at the path
 * first too; this is the reader on its own, as a file swapped in between
 * would meet it.)
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readUserConfigFile } from '../../src/checks/userConfig.js';

const folder = mkdtempSync(join(tmpdir(), 'plumbline-settings-'));

describe('readUserConfigFile', () => {
  it('reads a regular settings file', () => {
    const path = join(folder, 'settings.json');
    writeFileSync(path, JSON.stringify({ alpha: 0.01 }));
    expect(readUserConfigFile(path).alpha).toBe(0.01);
  });

  it('refuses a FIFO without waiting for a writer', () => {
    const path = join(folder, 'settings.fifo');
    execFileSync('mkfifo', [path]);
    expect(() => readUserConfigFile(path)).toThrow(/not a regular file: a FIFO/);
  });

  it('refuses a character device (/dev/zero) instead of reading it for ever', () => {
    expect(() => readUserConfigFile('/dev/zero')).toThrow(/not a regular file: a character device/);
  });

  it('names a missing file', () => {
    expect(() => readUserConfigFile(join(folder, 'missing.json'))).toThrow(/missing\.json: file not found/);
  });
});
