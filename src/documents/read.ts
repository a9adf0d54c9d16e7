import { extname } from 'node:path';
import type { PdfEngineChoice } from './pdf.js';
import { describeContent, sniffContent, type ContentKind } from './sniff.js';
import { readTextDocument } from './text.js';
import { decodeMarkup } from './decodeMarkup.js';
import type { DocumentText, ReadOutcome } from './types.js';
import { formatByExtension, supportedExtensions, type DocumentFormat } from './formats.js';
import { formatMb, limitHint, MB, resolveLimits, type Limits } from '../limits.js';
import { DocumentLimitError } from './markupLimits.js';
import { openRegularFile, readSmallRegularFileSync } from './regularFile.js';

export interface ReadOptions {
  /** Which PDF engine to use: `auto` (default) takes pdftotext when it is installed, pdf-parse otherwise. */
  pdfEngine?: PdfEngineChoice;
  /** Overrides of the limits in src/limits.ts (document size, DOCX expansion, nesting, PDF pages); the rest keep their defaults. */
  limits?: Partial<Limits>;
}

/** What each format's bytes may look like; anything else is a mislabelled file. */
const acceptedContent: Record<Exclude<DocumentFormat, 'text' | 'markdown'>, readonly ContentKind[]> = {
  pdf: ['pdf'],
  docx: ['zip'],
  html: ['html', 'xml', 'text'],
  jats: ['xml', 'text'],
  latex: ['text'],
};

const suggestedExtension: Partial<Record<ContentKind, string>> = { pdf: '.pdf', zip: '.docx', html: '.html', xml: '.xml', text: '.txt' };

export { isSupported, supportedExtensions, type DocumentFormat } from './formats.js';

/**
 * Reads any supported document; never throws for a bad file, returns its reason instead.
 *
 * The extension picks the reader, and the first bytes must agree with it. A
 * mislabelled file (a ".pdf" that is really an HTML page, a ".docx" that is
 * not a zip) is refused with a message that says what the file really is and
 * which extension would read it, rather than read as what it is: guessing
 * silently would hide a wrong download or export from the user, and the
 * outcome has no place for a warning beside a successful read.
 */
export async function readDocument(path: string, options: ReadOptions = {}): Promise<ReadOutcome> {
  const format = formatByExtension[extname(path).toLowerCase()];
  if (!format) return { ok: false, path, format: 'unknown', error: `unsupported file type "${extname(path) || '(none)'}"; supported: ${supportedExtensions.join(', ')}` };
  const limits = resolveLimits(options.limits);
  if (format === 'text' || format === 'markdown') return readTextDocument(path, format, limits);
  let bytes: Buffer;
  try {
    // Only a regular file is opened (regularFile.ts), and its size is checked before a single byte is read: a huge file is refused, not loaded.
    const opened = await openRegularFile(path);
    if (!opened.ok) return { ok: false, path, format, error: opened.error };
    try {
      if (opened.size > limits.maxDocumentMb * MB) return { ok: false, path, format, error: tooLargeMessage(opened.size, limits) };
      bytes = await opened.handle.readFile();
    } finally {
      await opened.handle.close();
    }
  } catch (error) {
    return { ok: false, path, format, error: `cannot read the file (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})` };
  }
  const outcome = await readBytes(path, format, bytes, options, limits);
  if (!outcome.ok) return { ok: false, path, format, error: outcome.error };
  // A small file may still hold a huge text (a compressed PDF or DOCX): the text is held to the same limit.
  const length = outcome.document.text.length;
  if (length > limits.maxDocumentMb * MB) {
    return { ok: false, path, format, error: `the extracted text is too long: ${(length / MB).toFixed(1)} million characters ${limitHint('maxDocumentMb', limits.maxDocumentMb)}` };
  }
  return { ok: true, document: outcome.document };
}

export function tooLargeMessage(size: number, limits: Limits): string {
  return `document too large: ${formatMb(size)} ${limitHint('maxDocumentMb', limits.maxDocumentMb)}`;
}

type BytesOutcome = { ok: true; document: DocumentText } | { ok: false; error: string };

async function readBytes(path: string, format: Exclude<DocumentFormat, 'text' | 'markdown'>, bytes: Buffer, options: ReadOptions, limits: Limits): Promise<BytesOutcome> {
  const content = sniffContent(bytes);
  if (content === 'empty') return { ok: false, error: 'empty file (0 bytes)' };
  if (!acceptedContent[format].includes(content)) return { ok: false, error: mislabelledMessage(format, content) };
  try {
    switch (format) {
      // Each reader and its libraries load on first use: a text-only audit never pays for them.
      case 'pdf':
        return await (await import('./pdf.js')).readPdf(path, bytes, options.pdfEngine ?? 'auto', limits);
      case 'docx':
        return await (await import('./docx.js')).readDocxBytes(path, bytes, limits);
      case 'html':
        return { ok: true, document: (await import('./html.js')).htmlToDocument(decodeMarkup(bytes), path, 'html', limits) };
      case 'jats':
        return (await import('./jats.js')).jatsToDocument(decodeMarkup(bytes), path, limits);
      case 'latex':
        return { ok: true, document: (await import('./latex.js')).latexToDocument(decodeMarkup(bytes), path, readBblBeside(path, limits), limits) };
    }
  } catch (error) {
    if (error instanceof DocumentLimitError) return { ok: false, error: error.message };
    // The readers return their known failures; this is the last guard of the never-throws promise.
    return { ok: false, error: `the ${format.toUpperCase()} reader failed unexpectedly (${error instanceof Error ? error.message : String(error)})` };
  }
}

function mislabelledMessage(format: DocumentFormat, content: ContentKind): string {
  const expected: Record<DocumentFormat, string> = {
    pdf: 'not a PDF',
    docx: 'not a DOCX file (a .docx is a zip archive)',
    html: 'not an HTML page',
    jats: 'not a JATS XML file',
    latex: 'not a LaTeX source file',
    text: 'not text',
    markdown: 'not text',
  };
  const suggestion = suggestedExtension[content];
  const rename = suggestion && suggestion !== `.${format}` ? `; if that is right, rename it to ${suggestion}` : '';
  const oleHint = format === 'docx' && content === 'ole' ? ' (save it from Word as an unprotected .docx)' : '';
  return `${expected[format]}: the file is really ${describeContent(content)}${oleHint}${rename}`;
}


/**
 * For \bibliography{...}: the .bbl that BibTeX wrote next to the .tex, when
 * present. Only a regular file within the document size limit is read: a
 * FIFO or a device under that name would block or never end (regularFile.ts).
 */
function readBblBeside(path: string, limits: Limits): string | null {
  const bbl = path.replace(/\.[^.]+$/, '.bbl');
  if (bbl === path) return null;
  return readSmallRegularFileSync(bbl, limits.maxDocumentMb * MB);
}
