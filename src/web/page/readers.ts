/**
 * The document readers as the page runs them. Each format goes through the
 * same reader as on the command line where that reader is pure (HTML, JATS,
 * LaTeX, the PDF page composition and table rebuilding, the DOCX's HTML);
 * only getting the bytes' text differs:
 *
 * - PDF: pdf.js (pdfjs-dist, the version inside pdf-parse) run on this
 *   thread, its text items turned into page text and word boxes by
 *   `pdfjsPageText` exactly as pdf-parse's path does in Node; pdftotext is
 *   a program and has no place in a browser.
 * - DOCX: mammoth's browser build (its own zip reader, JSZip) with the
 *   whole file as an ArrayBuffer. The command line's zip guard
 *   (src/documents/zipGuard.ts) is built on Node's zlib and is not used
 *   here; the page holds the size limit on the file itself and relies on the
 *   tab's own memory limit beyond it (see DEVELOPERS.md).
 * - Text and Markdown: UTF-8 (or UTF-16 with its byte-order mark), refused
 *   with the place of the first bad byte otherwise, as the command line does.
 */
import type { PDFDocumentProxy } from 'pdfjs-dist';
import { formatByExtension, supportedExtensions, type DocumentFormat } from '../../documents/formats.js';
import { htmlToDocument } from '../../documents/html.js';
import { jatsToDocument } from '../../documents/jats.js';
import { latexToDocument } from '../../documents/latex.js';
import { composePages, looksScanned, pdfDocument } from '../../documents/pdfPages.js';
import { pdfjsPageText, type LocatedWord, type PdfJsStyles, type PdfJsViewport } from '../../documents/pdfWords.js';
import { plainTextDocument, detectTextEncoding, invalidUtf8Message, nulBytesMessage } from '../../documents/text.js';
import { DocumentLimitError } from '../../documents/markupLimits.js';
import { decodeMarkup } from '../../documents/decodeMarkup.js';
import type { DocumentText } from '../../documents/types.js';
import { defaultLimits, formatMb, MB } from '../../limits.js';

export type PageReadOutcome = { ok: true; document: DocumentText } | { ok: false; path: string; format: string; error: string };

/**
 * pdf.js, set up on first use (its code is in the page, but run only when a PDF is read, so the page starts
 * sooner). It runs on this thread: the page's policy allows no worker script, and a 30-page PDF reads in
 * about a second (npm run bench -- web).
 */
async function loadPdfjs(): Promise<typeof import('pdfjs-dist')> {
  const [pdfjs, worker] = await Promise.all([import('pdfjs-dist'), import('pdfjs-dist/build/pdf.worker.mjs')]);
  (globalThis as unknown as { pdfjsWorker: unknown }).pdfjsWorker = { WorkerMessageHandler: worker.WorkerMessageHandler };
  return pdfjs;
}

const NO_TEXT_LAYER = 'no text layer: the PDF seems to be scanned images; run OCR first';
const ENCRYPTED = 'encrypted PDF: it needs a password to open; save a copy without a password (or print it to a new PDF) and read that';

/** The format a file's name gives, or null. */
export function formatOfName(name: string): DocumentFormat | null {
  const dot = name.lastIndexOf('.');
  if (dot <= 0) return null;
  return formatByExtension[name.slice(dot).toLowerCase()] ?? null;
}

/** Reads one chosen or dropped file; never throws, a bad file gives its reason. */
export async function readFileInPage(name: string, bytes: Uint8Array): Promise<PageReadOutcome> {
  const format = formatOfName(name);
  if (format === null) return { ok: false, path: name, format: 'unknown', error: `unsupported file type; supported: ${supportedExtensions.join(', ')}` };
  if (bytes.length === 0) return { ok: false, path: name, format, error: 'empty file (0 bytes)' };
  if (bytes.length > defaultLimits.maxDocumentMb * MB) return { ok: false, path: name, format, error: `document too large: ${formatMb(bytes.length)} (limit maxDocumentMb, ${defaultLimits.maxDocumentMb} MB)` };
  try {
    const outcome = await readByFormat(name, format, bytes);
    if (!outcome.ok) return { ok: false, path: name, format, error: outcome.error };
    return outcome;
  } catch (error) {
    if (error instanceof DocumentLimitError) return { ok: false, path: name, format, error: error.message };
    return { ok: false, path: name, format, error: `the ${format.toUpperCase()} reader failed (${error instanceof Error ? error.message : String(error)})` };
  }
}

async function readByFormat(name: string, format: DocumentFormat, bytes: Uint8Array): Promise<{ ok: true; document: DocumentText } | { ok: false; error: string }> {
  switch (format) {
    case 'pdf':
      return readPdfInPage(name, bytes);
    case 'docx':
      return readDocxInPage(name, bytes);
    case 'text':
    case 'markdown': {
      const decoded = decodeText(bytes);
      return decoded.ok ? { ok: true, document: plainTextDocument(name, format, decoded.text) } : decoded;
    }
    case 'html':
      return { ok: true, document: htmlToDocument(decodeMarkup(bytes), name, 'html') };
    case 'jats':
      return jatsToDocument(decodeMarkup(bytes), name);
    case 'latex':
      return { ok: true, document: latexToDocument(decodeMarkup(bytes), name, null) };
  }
}

/** Text files: UTF-8 or UTF-16 with a byte-order mark, as src/documents/text.ts reads them. */
export function decodeText(bytes: Uint8Array): { ok: true; text: string } | { ok: false; error: string } {
  const detected = detectTextEncoding(bytes);
  if (!detected.ok) return detected;
  const body = bytes.subarray(detected.bomLength);
  if (detected.encoding === 'utf-8') {
    if (body.includes(0)) return { ok: false, error: nulBytesMessage(body) };
    try {
      return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(body) };
    } catch {
      return { ok: false, error: invalidUtf8Message(body, detected.bomLength) };
    }
  }
  if (body.length % 2 !== 0) return { ok: false, error: `truncated ${detected.encoding.toUpperCase()} text: an odd number of bytes` };
  return { ok: true, text: new TextDecoder(detected.encoding, { ignoreBOM: true }).decode(body) };
}


function startsWithPdf(bytes: Uint8Array): boolean {
  const head = String.fromCharCode(...bytes.subarray(0, 1024));
  return head.includes('%PDF-');
}

function endsWithEofMarker(bytes: Uint8Array): boolean {
  let tail = '';
  for (const byte of bytes.subarray(Math.max(0, bytes.length - 4096))) tail += String.fromCharCode(byte);
  return tail.includes('%%EOF');
}

async function readPdfInPage(name: string, bytes: Uint8Array): Promise<{ ok: true; document: DocumentText } | { ok: false; error: string }> {
  if (!startsWithPdf(bytes)) return { ok: false, error: 'not a PDF: the file does not start like one' };
  if (!endsWithEofMarker(bytes)) return { ok: false, error: 'truncated PDF: the end-of-file marker is missing, so the file was cut short (an interrupted download or copy?)' };
  // No eval (the page's policy forbids it), no font loading, nothing fetched: only the text and its positions are wanted.
  const pdfjs = await loadPdfjs();
  const task = pdfjs.getDocument({ data: new Uint8Array(bytes), isEvalSupported: false, disableFontFace: true, useSystemFonts: false, stopAtErrors: false, verbosity: 0 });
  let document: PDFDocumentProxy;
  try {
    document = await task.promise;
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    if (/password/i.test(message) || (error as { name?: string }).name === 'PasswordException') return { ok: false, error: ENCRYPTED };
    return { ok: false, error: `corrupt PDF: its structure cannot be read (${message})` };
  }
  try {
    if (document.numPages > defaultLimits.maxPdfPages) return { ok: false, error: `the PDF has ${document.numPages} pages (limit maxPdfPages, ${defaultLimits.maxPdfPages})` };
    const pages: string[] = [];
    const words: LocatedWord[][] = [];
    for (let number = 1; number <= document.numPages; number++) {
      const page = await document.getPage(number);
      const content = await page.getTextContent({ includeMarkedContent: false, disableNormalization: false });
      const built = pdfjsPageText(content.items, page.getViewport({ scale: 1 }) as unknown as PdfJsViewport, content.styles as unknown as PdfJsStyles);
      pages.push(built.text);
      words.push(built.words);
      page.cleanup();
    }
    if (pages.length === 0) return { ok: false, error: 'the PDF has no pages' };
    if (looksScanned(pages)) return { ok: false, error: NO_TEXT_LAYER };
    return { ok: true, document: pdfDocument(name, composePages(pages, words)) };
  } finally {
    await document.destroy();
  }
}

async function readDocxInPage(name: string, bytes: Uint8Array): Promise<{ ok: true; document: DocumentText } | { ok: false; error: string }> {
  if (bytes[0] !== 0x50 || bytes[1] !== 0x4b) return { ok: false, error: 'not a DOCX file (a .docx is a zip archive)' };
  const buffer = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
  try {
    // Images are dropped by the HTML reader anyway: never inline them.
    const mammoth = (await import('mammoth')).default;
    const convertImage = mammoth.images.imgElement(async () => ({ src: '' }));
    const converted = await mammoth.convertToHtml({ arrayBuffer: buffer }, { convertImage });
    return { ok: true, document: htmlToDocument(converted.value, name, 'docx') };
  } catch (error) {
    if (error instanceof DocumentLimitError) return { ok: false, error: error.message };
    const message = error instanceof Error ? error.message : String(error);
    if (/word\/document\.xml|main document part|officeDocument/i.test(message)) return { ok: false, error: 'a zip archive, but not a Word document (it has no word/document.xml part)' };
    return { ok: false, error: `the DOCX could not be read (${message})` };
  }
}
