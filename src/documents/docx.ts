import { htmlToDocument } from './html.js';
import type { DocumentText } from './types.js';
import { defaultLimits, type Limits } from '../limits.js';
import { DocumentLimitError } from './markupLimits.js';
import { openZip, ZipFormatError, type ZipLimits } from './zipGuard.js';

/**
 * DOCX reader: mammoth turns the document into HTML (headings from Word's
 * heading styles, tables as tables, footnotes and endnotes as a list at the
 * end) and the HTML reader reads that, so a Word table comes out as a table
 * with its "Table 1." caption paragraph and "Note." paragraphs, and
 * footnotes are marked. Images, comments and tracked deletions are dropped
 * (mammoth's defaults); text boxes are read in document order.
 *
 * mammoth reads the zip archive through zipGuard.ts (its `{ file }` input),
 * which walks the archive's directory and inflates each part only when it
 * is read, within the limits of src/limits.ts: a zip bomb, a directory that
 * misleads, or XML of millions of tiny elements is refused before mammoth
 * builds anything from it.
 */
export async function readDocxBytes(
  path: string,
  bytes: Uint8Array,
  limits: ZipLimits & Pick<Limits, 'maxNestingDepth' | 'maxElements'> = defaultLimits,
): Promise<{ ok: true; document: DocumentText } | { ok: false; error: string }> {
  // The directory is walked and the declared sizes checked before anything is inflated.
  const opened = openZip(bytes, limits);
  if (!opened.ok) return opened;
  const mammoth = (await import('mammoth')).default;
  try {
    // Images are dropped by the HTML reader anyway: never read (inflate) them or inline them as base64.
    const convertImage = mammoth.images.imgElement(async () => ({ src: '' }));
    // mammoth reads a zip file given as `{ file }` through its exists/read (lib/unzip.js); its typings name only path, buffer and arrayBuffer.
    const input = { file: opened.archive } as unknown as { buffer: Buffer };
    const converted = await mammoth.convertToHtml(input, { convertImage });
    return { ok: true, document: htmlToDocument(converted.value, path, 'docx', limits) };
  } catch (error) {
    if (error instanceof DocumentLimitError || error instanceof ZipFormatError) return { ok: false, error: error.message };
    return { ok: false, error: describeDocxError(error) };
  }
}

function describeDocxError(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  if (/word\/document\.xml|main document part|officeDocument/i.test(message)) return 'a zip archive, but not a Word document (it has no word/document.xml part)';
  if (/zip|central directory|end of data|corrupt/i.test(message)) return `damaged DOCX: its zip archive cannot be read (${message})`;
  return `the DOCX could not be read (${message})`;
}
