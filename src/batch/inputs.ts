import * as fs from 'node:fs';
import { realpathSync, type Dirent } from 'node:fs';
import { realpath, stat } from 'node:fs/promises';
import { basename, isAbsolute, join, relative, resolve, sep } from 'node:path';
import { fdir } from 'fdir';
import { supportedExtensions } from '../documents/formats.js';
import { openRegularFile } from '../documents/regularFile.js';
import { mapConcurrently } from './concurrently.js';

export interface CollectedInputs {
  /** Files to audit, each once, named relative to where the user stands (reportedPath), sorted. */
  files: string[];
  /** Arguments that named nothing on disk, with the reason. */
  missing: { path: string; reason: string }[];
}

/**
 * Reads a list file: one path per line; blank lines and lines starting with
 * # are ignored. Only a regular file is read (src/documents/regularFile.ts):
 * a list named /dev/zero would never end and a FIFO would wait for ever, so
 * either is refused with what it is.
 */
async function readListFile(path: string): Promise<{ ok: true; entries: string[] } | { ok: false; reason: string }> {
  let text: string;
  try {
    const opened = await openRegularFile(path);
    if (!opened.ok) return { ok: false, reason: `list file ${opened.error}` };
    try {
      text = await opened.handle.readFile('utf8');
    } finally {
      await opened.handle.close();
    }
  } catch {
    return { ok: false, reason: 'list file not found or not readable' };
  }
  const entries: string[] = [];
  for (const line of text.split(/\r?\n/)) {
    const entry = line.trim();
    if (entry !== '' && !entry.startsWith('#')) entries.push(entry);
  }
  return { ok: true, entries };
}

const supported = new Set(supportedExtensions);

/** The extension of a file name in lower case (".PDF" counts as ".pdf"); "" when it has none. */
function extensionOf(name: string): string {
  const dot = name.lastIndexOf('.');
  return dot > 0 ? name.slice(dot).toLowerCase() : '';
}

/** Hidden entries (a leading dot) and node_modules are never walked into. */
function isSkippedName(name: string): boolean {
  return name.startsWith('.') || name === 'node_modules';
}

/**
 * A directory entry that is a FIFO, a device or a socket, presented as a
 * file; every other entry as it is. fdir lists only files, folders and
 * links, and would pass over the others without a word.
 */
function specialAsFile(entry: Dirent): Dirent {
  if (entry.isFile() || entry.isDirectory() || entry.isSymbolicLink()) return entry;
  return Object.assign(Object.create(entry) as Dirent, { isFile: () => true });
}

/**
 * The file system as the folder walk sees it: the real one, except that
 * special entries are listed as files (specialAsFile). One named like a
 * document then reaches the reader, which refuses it by name ("not a
 * regular file", src/documents/regularFile.ts), so the user learns that a
 * FIFO or a device sits among the papers instead of finding it missing.
 */
function specialEntriesAsFiles(links: Set<string>): typeof fs {
  const seen = (folder: string, entries: Dirent[]): Dirent[] => {
    for (const entry of entries) if (entry.isSymbolicLink()) links.add(join(folder, entry.name));
    return entries.map(specialAsFile);
  };
  return {
    ...fs,
    readdir: ((path: string, options: { withFileTypes: true }, callback: (error: NodeJS.ErrnoException | null, entries: Dirent[]) => void) =>
      fs.readdir(path, options, (error, entries) => callback(error, error ? entries : seen(path, entries)))) as unknown as typeof fs.readdir,
    readdirSync: ((path: string, options: { withFileTypes: true }) => seen(path, fs.readdirSync(path, options))) as unknown as typeof fs.readdirSync,
  };
}

/** What a folder walk found: the documents, and the links it did not follow out of the folder. */
interface Walked {
  documents: string[];
  linksOut: string[];
}

/** Whether `path` lies inside `folder` (both real paths). */
function isInside(path: string, folder: string): boolean {
  const rest = relative(folder, path);
  return rest !== '' && !isAbsolute(rest) && rest !== '..' && !rest.startsWith(`..${sep}`);
}

/**
 * The real path of a link's target when it is a regular file; null when it resolves to nothing or to something
 * else (a device, a FIFO: the reader refuses those and says what they are).
 */
async function targetOf(link: string): Promise<string | null> {
  try {
    const target = await realpath(link);
    return (await stat(target)).isFile() ? target : null;
  } catch {
    return null;
  }
}

/**
 * Every supported document under a folder, as absolute paths; hidden files
 * and folders and node_modules are skipped, and symbolic links to folders
 * are not followed (a link can loop back). FIFOs, devices and links to them
 * named like documents are listed, for the reader to refuse. A directory crawler (fdir) rather
 * than a glob library: the walk is the whole of what is needed, and a
 * re-audit from the cache spends a large part of its time here
 * (DEVELOPERS.md, "Libraries").
 *
 * The folder is crawled by its absolute path and the paths come back whole:
 * fdir 6.5's relative paths drop the subfolders when the root is "." or
 * "./" (a/mid.txt came back as mid.txt), so paths are made relative here,
 * by reportedPath, never by fdir.
 */
async function documentsUnder(folder: string, followLinks: boolean): Promise<Walked> {
  const links = new Set<string>();
  const found = await new fdir({ fs: specialEntriesAsFiles(links) })
    .withFullPaths()
    .exclude((name) => isSkippedName(name))
    .filter((path) => {
      const name = basename(path);
      return !isSkippedName(name) && supported.has(extensionOf(name));
    })
    .crawl(folder)
    .withPromise();
  found.sort(); // the order of the folder listing is the file system's; this one is the same on every run
  if (followLinks) return { documents: found, linksOut: [] };
  // A link to a file outside the folder is not followed unless asked (--follow-links): auditing a folder reads
  // what is in it, not what a link in it points to elsewhere on the machine. A dangling link, or one to a device
  // or a FIFO, is left to the reader, which says what it is.
  const inside = await realpath(folder).catch(() => folder);
  const linked = found.filter((path) => links.has(path));
  const targets = await mapConcurrently(linked, IDENTITY_CHECKS_AT_ONCE, targetOf);
  const out = new Set(linked.filter((_, index) => targets[index] !== null && !isInside(targets[index]!, inside)));
  return { documents: found.filter((path) => !out.has(path)), linksOut: [...out] };
}

/** Why a link out of a scanned folder was not read. */
export const LINK_OUT_REASON = 'a link to a file outside the scanned folder, not followed (--follow-links follows it)';

/**
 * The folders a path is reported relative to: the process's working folder
 * and, when the shell stands in the same folder through a symbolic link, the
 * shell's name for it ($PWD), so that an absolute path typed through the
 * link is reported as the user sees it. Arguments themselves are resolved
 * against the process's folder only, as the system resolves "..".
 */
export function workingFolders(): string[] {
  const physical = process.cwd();
  const logical = process.env.PWD;
  if (!logical || logical === physical || !isAbsolute(logical)) return [physical];
  try {
    return realpathSync(logical) === realpathSync(physical) ? [physical, logical] : [physical];
  } catch {
    return [physical];
  }
}

/**
 * How a file is named in reports: relative to where the user stands,
 * whatever form the argument took (".", "./", "..", absolute, a linked
 * folder), so the same file always gets the same name in one place and two
 * files never share one. Among several names for the working folder
 * (workingFolders), the first under which the file lies wins; a file
 * outside all of them is named from the first ("../papers/a.pdf"). A path
 * that cannot be made relative (another drive) stays absolute.
 */
export function reportedPath(absolute: string, bases: readonly string[]): string {
  let fallback: string | null = null;
  for (const base of bases) {
    const path = relative(base, absolute);
    if (path === '' || isAbsolute(path)) continue;
    if (path !== '..' && !path.startsWith(`..${sep}`)) return path;
    fallback ??= path;
  }
  return fallback ?? absolute;
}

/**
 * A file's identity: two paths name the same file when device and inode
 * agree (links, "./a" and "a"); and whether it is a folder (a link to a
 * folder named like a document). A FIFO or a device has an identity too: it
 * is an input, which the reader refuses.
 */
async function identityOf(path: string): Promise<{ id: string; folder: boolean } | null> {
  try {
    const info = await stat(path, { bigint: true });
    return { id: `${info.dev}:${info.ino}`, folder: info.isDirectory() };
  } catch {
    return null; // gone since it was listed: the reader will say why
  }
}

/** Whether a named path is a folder, something else, or nothing that can be read (with the reason). */
async function kindOf(absolute: string): Promise<{ folder: boolean; reason: null } | { folder: null; reason: string }> {
  try {
    return { folder: (await stat(absolute)).isDirectory(), reason: null };
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    return { folder: null, reason: code === 'ENOENT' || code === 'ENOTDIR' || !code ? 'no such file or folder' : `cannot open (${code})` };
  }
}

/** At most this many stat calls in flight while telling what paths are and which are the same file. */
const IDENTITY_CHECKS_AT_ONCE = 64;

/**
 * The files to audit, each once: paths that resolve to the same file
 * (the same device and inode, reached through "." and an absolute path, a
 * linked folder or a hard link) are one input, reported under the first
 * name given; different files are always kept, whatever their names or
 * contents. Sorted by the reported name.
 */
async function distinctFiles(candidates: readonly { absolute: string; explicit: boolean }[], bases: readonly string[]): Promise<string[]> {
  const byPath = new Map<string, boolean>();
  for (const { absolute, explicit } of candidates) if (!byPath.has(absolute)) byPath.set(absolute, explicit);
  const paths = [...byPath.keys()];
  const identities = await mapConcurrently(paths, IDENTITY_CHECKS_AT_ONCE, identityOf);
  const seen = new Set<string>();
  const files: string[] = [];
  paths.forEach((absolute, index) => {
    const identity = identities[index] ?? null;
    // A walked entry that is gone, or is a folder (a link to one named like a document), is not a document.
    if ((identity === null || identity.folder) && !byPath.get(absolute)) return;
    if (identity !== null) {
      if (seen.has(identity.id)) return;
      seen.add(identity.id);
    }
    files.push(reportedPath(absolute, bases));
  });
  return files.sort();
}

/**
 * Expands the scan command's arguments: folders (walked for supported
 * documents), files (taken as they are, so an unsupported one is reported,
 * not dropped), and list files written as @list.txt (one path per line,
 * relative to the current folder). `bases` are the names of the folder the
 * user stands in (workingFolders); the first resolves relative arguments.
 */
export async function collectInputs(args: readonly string[], bases: readonly string[] = workingFolders(), options: { followLinks?: boolean } = {}): Promise<CollectedInputs> {
  const here = bases[0]!;
  const candidates: { absolute: string; explicit: boolean }[] = [];
  const missing: CollectedInputs['missing'] = [];
  // Every array here may hold hundreds of thousands of paths (a folder or a list of a whole corpus):
  // they are walked one by one, never spread into a call, which overflows the stack near 120,000.
  // What each named path is, is asked of the file system many paths at a time.
  const kinds = (paths: readonly string[]) => mapConcurrently(paths, IDENTITY_CHECKS_AT_ONCE, (path) => kindOf(resolve(here, path)));
  // Then taken in the order given: a folder's documents take its place.
  const add = async (paths: readonly string[]): Promise<void> => {
    const found = await kinds(paths);
    for (let index = 0; index < paths.length; index++) {
      const absolute = resolve(here, paths[index]!);
      const kind = found[index]!;
      if (kind.folder === null) missing.push({ path: reportedPath(absolute, bases), reason: kind.reason });
      else if (kind.folder) {
        const walked = await documentsUnder(absolute, options.followLinks === true);
        for (const path of walked.documents) candidates.push({ absolute: path, explicit: false });
        for (const path of walked.linksOut) missing.push({ path: reportedPath(path, bases), reason: LINK_OUT_REASON });
      }
      else candidates.push({ absolute, explicit: true });
    }
  };
  for (const arg of args) {
    if (!arg.startsWith('@')) {
      await add([arg]);
      continue;
    }
    // A list's entries take its place in the order of the arguments; a list does not name other lists.
    const list = resolve(here, arg.slice(1));
    const listed = await readListFile(list);
    if (!listed.ok) {
      missing.push({ path: reportedPath(list, bases), reason: listed.reason });
      continue;
    }
    await add(listed.entries.filter((entry) => !entry.startsWith('@')));
  }
  const missingOnce = [...new Map(missing.map((entry) => [entry.path, entry])).values()];
  return { files: await distinctFiles(candidates, bases), missing: missingOnce };
}
