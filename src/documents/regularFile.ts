import { closeSync, constants, fstatSync, openSync, readFileSync, statSync, type Stats } from 'node:fs';
import { lstat, open, readlink, stat, type FileHandle } from 'node:fs/promises';

/**
 * Only regular files are read.
 *
 * A FIFO (named pipe) blocks whoever opens it for reading until something
 * writes to it, which may be never; a device such as /dev/zero or
 * /dev/urandom never ends, so reading it "whole" grows memory until the
 * process dies; a socket cannot be read as a file at all. Any of them can
 * sit in a scanned folder under a document's name, directly or behind a
 * symbolic link, or be named on the command line. Each is refused with a
 * message that says what it is, and becomes that document's unreadable row.
 *
 * The check is made twice: by stat before opening, because opening is
 * itself the step that blocks on a FIFO (and may act on a device), and
 * again on the opened file, because the path may have been replaced in
 * between. The file is opened with O_NONBLOCK, so that if a FIFO was put
 * there after the first check, opening it returns at once instead of
 * waiting for a writer; on a regular file the flag changes nothing.
 */

/** What a file system entry is, in words, when it is not a regular file; null for a regular file. */
export function specialFileKind(stats: Pick<Stats, 'isFile' | 'isDirectory' | 'isFIFO' | 'isCharacterDevice' | 'isBlockDevice' | 'isSocket'>): string | null {
  if (stats.isFile()) return null;
  if (stats.isDirectory()) return 'a folder';
  if (stats.isFIFO()) return 'a FIFO (named pipe)';
  if (stats.isCharacterDevice()) return 'a character device';
  if (stats.isBlockDevice()) return 'a block device';
  if (stats.isSocket()) return 'a socket';
  return 'a special file';
}

/**
 * The refusal of a path that is not a regular file: what it is and, when it
 * was reached through a symbolic link, where the link points ("a symbolic
 * link to /dev/zero, a character device"), so the user can find it.
 */
export function notRegularFileMessage(kind: string, linkTarget: string | null): string {
  const what = linkTarget === null ? kind : `a symbolic link to ${linkTarget}, ${kind}`;
  return `not a regular file: ${what}; plumbline reads only regular files (a FIFO or a device can block or never end)`;
}

/** O_NONBLOCK where the platform has it (not on Windows, which has no FIFOs in the file system). */
export const READ_WITHOUT_WAITING = constants.O_RDONLY | (constants.O_NONBLOCK ?? 0);

export type RegularFileOutcome = { ok: true; handle: FileHandle; size: number } | { ok: false; error: string };

async function linkTargetOf(path: string): Promise<string | null> {
  try {
    return (await lstat(path)).isSymbolicLink() ? await readlink(path) : null;
  } catch {
    return null;
  }
}

/**
 * Opens a path for reading only when it is a regular file; otherwise says
 * why not, without having opened it. The caller closes the handle. Errors
 * of the file system (a missing file, no permission) are thrown, as from
 * fs.open, for the caller's own message.
 */
export async function openRegularFile(path: string): Promise<RegularFileOutcome> {
  const kind = specialFileKind(await stat(path));
  if (kind !== null) return { ok: false, error: notRegularFileMessage(kind, await linkTargetOf(path)) };
  const handle = await open(path, READ_WITHOUT_WAITING);
  try {
    const opened = await handle.stat();
    const openedKind = specialFileKind(opened);
    if (openedKind === null) return { ok: true, handle, size: opened.size };
    await handle.close();
    return { ok: false, error: notRegularFileMessage(openedKind, await linkTargetOf(path)) };
  } catch (error) {
    await handle.close();
    throw error;
  }
}

/**
 * A small file beside a document (a LaTeX .bbl) read synchronously: its
 * text when it is a regular file of at most `maxBytes`, null otherwise
 * (missing, special, too large or unreadable), by the same two checks.
 */
export function readSmallRegularFileSync(path: string, maxBytes: number): string | null {
  try {
    if (specialFileKind(statSync(path)) !== null) return null;
    const descriptor = openSync(path, READ_WITHOUT_WAITING);
    try {
      const opened = fstatSync(descriptor);
      if (specialFileKind(opened) !== null || opened.size > maxBytes) return null;
      return readFileSync(descriptor, 'utf8');
    } finally {
      closeSync(descriptor);
    }
  } catch {
    return null;
  }
}


/**
 * Why a path named by the user (a settings file, a list of documents)
 * cannot be read, when it is not a regular file ("not a regular file: a
 * FIFO (named pipe); ..."); null when it is one, or when it does not exist
 * (the reader then says so in its own words). Checked by stat, without
 * opening: opening a FIFO waits for a writer.
 */
export async function notRegularFileReason(path: string): Promise<string | null> {
  let kind: string | null;
  try {
    kind = specialFileKind(await stat(path));
  } catch {
    return null;
  }
  return kind === null ? null : notRegularFileMessage(kind, await linkTargetOf(path));
}
