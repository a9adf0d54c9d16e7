import { htmlToDocument } from './html.js';
import type { DocumentText } from './types.js';

/**
 * DOCX reader: mammoth turns the document into HTML (headings from Word's
 * heading styles, tables as tables, footnotes and endnotes as a list at the
 * end) and the HTML reader reads that, so a Word table comes out as a table
 * with its "Table 1." caption paragraph and "Note." paragraphs, and
 * footnotes are marked. Images, comments and tracked deletions are dropped
 * (mammoth's defaults); text boxes are read in document order.
 */
export async function readDocxBytes(path: string, bytes: Uint8Array): Promise<{ ok: true; document: DocumentText } | { ok: false; error: string }> {
  const mammoth = (await import('mammoth')).default;
  try {
    const converted = await mammoth.convertToHtml({ buffer: Buffer.from(bytes) });
    return { ok: true, document: htmlToDocument(converted.value, path, 'docx') };
  } catch (error) {
    return { ok: false, error: describeDocxError(error) };
  }
}

function describeDocxError(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  if (/word\/document\.xml|main document part|officeDocument/i.test(message)) return 'a zip archive, but not a Word document (it has no word/document.xml part)';
  if (/zip|central directory|end of data|corrupt/i.test(message)) return `damaged DOCX: its zip archive cannot be read (${message})`;
  return `the DOCX could not be read (${message})`;
}
