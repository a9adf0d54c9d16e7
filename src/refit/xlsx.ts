import { Readable } from 'node:stream';
import { crc32 } from 'node:zlib';
import { openRegularFile } from '../documents/regularFile.js';
import type { XlsxLimits } from '../limits.js';
import { RefitError } from './errors.js';
import { checkSheetLimits, partsWithinDeclaredLimit, readerFailed, unreadableXlsx } from './xlsxChecks.js';
import { readZipDirectory, readZipEntry, storedZipChunks } from './zipEntries.js';

export { countTags, forEachTag, sheetExtent } from './xlsxChecks.js';

/**
 * Reading the first sheet of an .xlsx file within limits (src/limits.ts,
 * xlsxLimits), checked before the spreadsheet reader (read-excel-file)
 * parses anything:
 *
 * 1. The zip's central directory is walked (zipEntries.ts, with the
 *    walker the DOCX reader uses, src/documents/zipDirectory.ts), and the
 *    sizes it declares for the parts the reader unpacks (its .xml parts)
 *    are added up: above maxUnzippedMb nothing is inflated.
 * 2. Those parts are inflated with the output capped at their declared
 *    sizes, so a part that lies about its size is caught.
 * 3. The first sheet's XML is scanned for the rows and columns its cells
 *    span, as the reader will lay them out (a single cell at XFD1048576
 *    makes it build a million rows of 16,384 cells; the sheet's own
 *    <dimension> is a claim the reader ignores, so it is not trusted
 *    either), and the shared strings are counted.
 * 4. The reader is handed an archive of exactly the parts that were
 *    checked (stored, not compressed), never the original file: it reads
 *    entries by their local headers in file order, which need not agree
 *    with the directory that was checked.
 *
 * Every refusal names the file and suggests saving the sheet as CSV, which
 * refit streams with no limit on rows.
 *
 * The checks themselves are pure (xlsxChecks.ts, zipParts.ts) and shared
 * with the page's reader of the same file's bytes (xlsxBytes.ts).
 */

/** Unpacks the parts the reader would unpack, within the size limit. */
async function unpackWithinLimit(path: string, file: string, limits: XlsxLimits): Promise<Map<string, Buffer>> {
  let opened;
  try {
    opened = await openRegularFile(path);
  } catch (error) {
    throw new RefitError('UNREADABLE_FILE', `${file}: cannot be read (${(error as Error).message}).`, { file });
  }
  if (!opened.ok) throw new RefitError('UNREADABLE_FILE', `${file}: ${opened.error}.`, { file });
  const { handle, size } = opened;
  try {
    const directory = readZipDirectory(handle, size);
    if (!directory.ok) throw unreadableXlsx(file, directory.error);
    const wanted = partsWithinDeclaredLimit(file, directory.value, limits);
    // Each part is inflated no further than its declared size, so the declared total just checked bounds the memory.
    const parts = new Map<string, Buffer>();
    for (const entry of wanted) {
      const part = await readZipEntry(handle, entry);
      if (!part.ok) throw unreadableXlsx(file, part.error);
      parts.set(entry.name, part.value);
    }
    return parts;
  } finally {
    await handle.close();
  }
}

/** The first sheet of an .xlsx file as rows of cells, after the limits are checked; a RefitError naming the file otherwise. */
export async function readXlsxSheet(path: string, file: string, limits: XlsxLimits): Promise<unknown[][]> {
  const parts = await unpackWithinLimit(path, file, limits);
  checkSheetLimits(file, parts, limits);
  try {
    // Loaded on demand: CSV-only runs do not pay for the spreadsheet reader.
    const { readSheet } = await import('read-excel-file/node');
    const archive = Readable.from(storedZipChunks(parts, crc32), { objectMode: false });
    return (await readSheet(archive, { parseNumber: (s: string) => s })) as unknown[][];
  } catch (error) {
    throw readerFailed(file, error);
  }
}
