import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { notRegularFileMessage, openRegularFile, readSmallRegularFileSync, specialFileKind } from '../../src/documents/regularFile.js';

const folder = mkdtempSync(join(tmpdir(), 'plumbline-regular-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const fifo = join(folder, 'pipe.txt');
const fifoMade = spawnSync('mkfifo', [fifo]).status === 0;

/** A stat result that is exactly one kind of entry. */
function statsOf(kind: 'file' | 'directory' | 'fifo' | 'char' | 'block' | 'socket') {
  return {
    isFile: () => kind === 'file',
    isDirectory: () => kind === 'directory',
    isFIFO: () => kind === 'fifo',
    isCharacterDevice: () => kind === 'char',
    isBlockDevice: () => kind === 'block',
    isSocket: () => kind === 'socket',
  };
}

describe('specialFileKind and its message', () => {
  it('names every kind of entry that is not a regular file, and nothing for a regular one', () => {
    expect(specialFileKind(statsOf('file'))).toBeNull();
    expect(specialFileKind(statsOf('directory'))).toBe('a folder');
    expect(specialFileKind(statsOf('fifo'))).toBe('a FIFO (named pipe)');
    expect(specialFileKind(statsOf('char'))).toBe('a character device');
    expect(specialFileKind(statsOf('block'))).toBe('a block device');
    expect(specialFileKind(statsOf('socket'))).toBe('a socket');
  });

  it('says where a symbolic link points', () => {
    expect(notRegularFileMessage('a character device', '/dev/zero')).toMatch(/^not a regular file: a symbolic link to \/dev\/zero, a character device; /);
    expect(notRegularFileMessage('a FIFO (named pipe)', null)).toMatch(/^not a regular file: a FIFO \(named pipe\); /);
  });
});

describe('openRegularFile', () => {
  it('opens a regular file and gives its size', async () => {
    const file = join(folder, 'paper.txt');
    writeFileSync(file, 'twelve bytes');
    const opened = await openRegularFile(file);
    expect(opened.ok).toBe(true);
    if (!opened.ok) return;
    expect(opened.size).toBe(12);
    expect((await opened.handle.readFile()).toString()).toBe('twelve bytes');
    await opened.handle.close();
  });

  it.skipIf(!fifoMade)(`refuses a FIFO without waiting for a writer${fifoMade ? '' : ' (skipped: this platform could not create a FIFO)'}`, async () => {
    const opened = await openRegularFile(fifo);
    expect(opened).toEqual({ ok: false, error: notRegularFileMessage('a FIFO (named pipe)', null) });
  });

  it('throws the file system error for a missing file, for the caller to word', async () => {
    await expect(openRegularFile(join(folder, 'missing.txt'))).rejects.toMatchObject({ code: 'ENOENT' });
  });
});

describe('readSmallRegularFileSync', () => {
  it('reads a regular file within the size, and nothing else', () => {
    const file = join(folder, 'paper.bbl');
    writeFileSync(file, '\\bibitem{a} A.');
    expect(readSmallRegularFileSync(file, 100)).toBe('\\bibitem{a} A.');
    expect(readSmallRegularFileSync(file, 5)).toBeNull();
    expect(readSmallRegularFileSync(join(folder, 'missing.bbl'), 100)).toBeNull();
    if (fifoMade) expect(readSmallRegularFileSync(fifo, 100)).toBeNull();
  });
});
