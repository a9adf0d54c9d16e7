import { htmlToDocument } from './html.js';
import type { DocumentText } from './types.js';
import { defaultLimits, type Limits } from '../limits.js';
import { DocumentLimitError } from './markupLimits.js';
import { checkZipExpansion } from './zipGuard.js';

/**
 * DOCX reader: mammoth turns the document into HTML (headings from Word's
 * heading styles, tables as tables, footnotes and endnotes as a list at the
 * end) and the HTML reader reads that, so a Word table comes out as a table
 * with its "Table 1." caption paragraph and "Note." paragraphs, and
 * footnotes are marked. Images, comments and tracked deletions are dropped
 * (mammoth's defaults); text boxes are read in document order.
 */
export async function readDocxBytes(
  path: string,
  bytes: Uint8Array,
  limits: Pick<Limits, 'maxUnzippedMb' | 'maxNestingDepth' | 'maxElements'> = defaultLimits,
): Promise<{ ok: true; document: DocumentText } | { ok: false; error: string }> {
  // A zip bomb is refused before mammoth inflates anything.
  const tooLarge = checkZipExpansion(bytes, limits.maxUnzippedMb);
  if (tooLarge !== null) return { ok: false, error: tooLarge };
  const mammoth = (await import('mammoth')).default;
  try {
    // Images are dropped by the HTML reader anyway: never read (inflate) them or inline them as base64.
    const convertImage = mammoth.images.imgElement(async () => ({ src: '' }));
    const converted = await mammoth.convertToHtml({ buffer: Buffer.from(bytes) }, { convertImage });
    return { ok: true, document: htmlToDocument(converted.value, path, 'docx', limits) };
  } catch (error) {
    if (error instanceof DocumentLimitError) return { ok: false, error: error.message };
    return { ok: false, error: describeDocxError(error) };
  }
}

function describeDocxError(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  if (/word\/document\.xml|main document part|officeDocument/i.test(message)) return 'a zip archive, but not a Word document (it has no word/document.xml part)';
  if (/zip|central directory|end of data|corrupt/i.test(message)) return `damaged DOCX: its zip archive cannot be read (${message})`;
  return `the DOCX could not be read (${message})`;
}
