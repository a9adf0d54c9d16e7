import { readFile, stat } from 'node:fs/promises';
import fg from 'fast-glob';
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

/** Every supported document under a folder (hidden folders and node_modules skipped), sorted. */
async function documentsUnder(folder: string): Promise<string[]> {
  const extensions = supportedExtensions.map((e) => e.slice(1)).join(',');
  const found = await fg(`**/*.{${extensions}}`, {
    cwd: folder,
    caseSensitiveMatch: false,
    onlyFiles: true,
    followSymbolicLinks: false,
    dot: false,
    ignore: ['**/node_modules/**'],
  });
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
