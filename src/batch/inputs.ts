import { readFile, stat } from 'node:fs/promises';
import { basename } from 'node:path';
import { fdir } from 'fdir';
import { supportedExtensions } from '../documents/formats.js';

export interface CollectedInputs {
  /** Files to audit, in a stable order, without duplicates. */
  files: string[];
  /** Arguments that named nothing on disk, with the reason. */
  missing: { path: string; reason: string }[];
}

/** Reads a list file: one path per line; blank lines and lines starting with # are ignored. */
async function readListFile(path: string): Promise<string[] | null> {
  try {
    const text = await readFile(path, 'utf8');
    return text
      .split(/\r?\n/)
      .map((line) => line.trim())
      .filter((line) => line !== '' && !line.startsWith('#'));
  } catch {
    return null;
  }
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
 * Every supported document under a folder, sorted; hidden files and folders
 * and node_modules are skipped, and symbolic links to folders are not
 * followed (a link can loop back). A directory crawler (fdir) rather than a
 * glob library: the walk is the whole of what is needed, and a re-audit from
 * the cache spends a large part of its time here (DEVELOPERS.md, "Libraries").
 */
async function documentsUnder(folder: string): Promise<string[]> {
  const found = await new fdir()
    .withRelativePaths()
    .exclude((name) => isSkippedName(name))
    .filter((path) => {
      const name = basename(path);
      return !isSkippedName(name) && supported.has(extensionOf(name));
    })
    .crawl(folder)
    .withPromise();
  const prefix = folder.endsWith('/') ? folder : `${folder}/`;
  return found.sort().map((relative) => prefix + relative);
}

/**
 * Expands the scan command's arguments: folders (walked for supported
 * documents), files (taken as they are, so an unsupported one is reported,
 * not dropped), and list files written as @list.txt (one path per line,
 * relative to the current folder).
 */
export async function collectInputs(args: readonly string[]): Promise<CollectedInputs> {
  const files: string[] = [];
  const missing: CollectedInputs['missing'] = [];
  const pending = [...args];
  while (pending.length > 0) {
    const arg = pending.shift()!;
    if (arg.startsWith('@')) {
      const listed = await readListFile(arg.slice(1));
      if (listed === null) missing.push({ path: arg.slice(1), reason: 'list file not found or not readable' });
      else pending.unshift(...listed.filter((entry) => !entry.startsWith('@')));
      continue;
    }
    let info;
    try {
      info = await stat(arg);
    } catch {
      missing.push({ path: arg, reason: 'no such file or folder' });
      continue;
    }
    if (info.isDirectory()) files.push(...(await documentsUnder(arg)));
    else files.push(arg);
  }
  return { files: [...new Set(files)], missing };
}
