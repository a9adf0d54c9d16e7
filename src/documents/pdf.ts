import { spawn } from 'node:child_process';
import { accessSync, constants } from 'node:fs';
import { delimiter, join } from 'node:path';
import { mayHoldTable } from './pdfCompose.js';
import { composePages, looksScanned, pdfDocument } from './pdfPages.js';
import { BboxWordLocator, pdfjsPageText, type LocatedWord, type PdfJsStyles, type PdfJsViewport } from './pdfWords.js';
import type { DocumentText } from './types.js';
import { defaultLimits, formatMb, limitHint, MB, type Limits } from '../limits.js';
import { checkPdfStreams, type PdfStreamLimits } from './pdfStreams.js';

export { dehyphenate } from './pdfText.js';
export { composePages, furnitureRanges, pageAt, pdfDocument, withoutPageFurniture } from './pdfPages.js';

/**
 * PDF reader with two engines that give the same kind of text:
 *
 * - `pdf-parse` (pdf.js inside, pure JavaScript): always available.
 * - `pdftotext` (poppler), spawned with `-raw`: text in the order the PDF's
 *   content stream draws it, which is how pdf.js (inside pdf-parse) reads it
 *   too, so both engines give the same text. Not `-layout`: it keeps the
 *   physical layout, so a two-column page comes out with the columns
 *   interleaved line by line, cutting results in two. Not the default mode
 *   either: its column detection merged lines of neighbouring columns on the
 *   two-column demo PDF whenever a paragraph ran on from one column into the
 *   next. Typesetting programs (LaTeX, word processors, browsers) draw a page
 *   column by column, so content order is reading order. One cost of `-raw`:
 *   a raised superscript may land on the next line ("ηp\n2 = .11"). Every
 *   page ends with a form feed, which gives the page boundaries.
 *
 * Both engines thus read a two-column article column by column. The reader then joins words hyphenated at a
 * line end when the next line goes on in lower case ("recog-\nnition" ->
 * "recognition"), keeps page boundaries (a form feed between pages) for
 * `pageOf`, and marks the reference list found from its heading line.
 *
 * It does not otherwise rewrite the text: ligatures, odd minus signs and
 * flattened sub/superscripts ("F1,44", "ηp2") are left to the scanner, which
 * normalises Unicode itself and reads results split across lines.
 *
 * Tables are rebuilt from the positions of the words (pdfLayout.ts): each
 * engine also gives every word's box, tied to its letters in the page text
 * (pdfWords.ts: `pdftotext -raw -bbox`, or pdf.js's text items), and the
 * lines that held a table's words are replaced by the table written one row
 * per line, cells joined by " | " (pdfCompose.ts), which the document's
 * `tables` describe cell by cell, with a caption and a table region each.
 * The rest of the page reads as before, and so does a page that names no
 * table and holds fewer than six numbers standing alone as cells do, in rows or one to a line (mayHoldTable), or
 * whose words cannot be tied to its text: the word boxes are not looked at
 * (with pdftotext, the second run is made only for a PDF with a page that
 * may hold a table).
 */

export type PdfEngine = 'pdf-parse' | 'pdftotext';
export type PdfEngineChoice = 'auto' | PdfEngine;

/** Each page's text as the engine gives it and, when they could be tied to it, its words with their boxes. */
export type PdfPagesOutcome = { ok: true; pages: string[]; words: (LocatedWord[] | null)[] } | { ok: false; error: string };

const ENCRYPTED = 'encrypted PDF: it needs a password to open; save a copy without a password (or print it to a new PDF) and read that';
const NO_TEXT_LAYER = 'no text layer: the PDF seems to be scanned images; run OCR first';

let pdftotextPath: string | null | undefined;

/** Where `pdftotext` is on PATH, or null; looked up once per process. */
export function findPdftotext(): string | null {
  if (pdftotextPath !== undefined) return pdftotextPath;
  pdftotextPath = null;
  const names = process.platform === 'win32' ? ['pdftotext.exe', 'pdftotext'] : ['pdftotext'];
  for (const directory of (process.env.PATH ?? '').split(delimiter).filter(Boolean)) {
    for (const name of names) {
      const candidate = join(directory, name);
      try {
        accessSync(candidate, constants.X_OK);
        pdftotextPath = candidate;
        return candidate;
      } catch {
        // not here; keep looking
      }
    }
  }
  return null;
}

/** `auto` takes pdftotext when it is installed (it is faster) and pdf-parse otherwise. */
export function resolvePdfEngine(choice: PdfEngineChoice = 'auto'): PdfEngine {
  if (choice !== 'auto') return choice;
  return findPdftotext() !== null ? 'pdftotext' : 'pdf-parse';
}

/** Reads a PDF (whose bytes the caller has already checked start like a PDF). */
export async function readPdf(
  path: string,
  bytes: Uint8Array,
  choice: PdfEngineChoice = 'auto',
  limits: Pick<Limits, 'maxPdfPages' | 'maxSecondsPerDocument' | 'maxDocumentMb'> & PdfStreamLimits = defaultLimits,
): Promise<{ ok: true; document: DocumentText } | { ok: false; error: string }> {
  if (!hasEndOfFileMarker(bytes)) return { ok: false, error: 'truncated PDF: the end-of-file marker is missing, so the file was cut short (an interrupted download or copy?)' };
  // Streams that would decode to gigabytes are refused before either engine decodes them (pdfStreams.ts).
  const streams = await checkPdfStreams(bytes, limits);
  if (streams !== null) return { ok: false, error: streams };
  const engine = resolvePdfEngine(choice);
  const extracted =
    engine === 'pdftotext'
      ? await pagesWithPdftotext(path, limits.maxPdfPages, limits.maxSecondsPerDocument, limits.maxDocumentMb)
      : await pagesWithPdfParse(bytes, limits.maxPdfPages);
  if (!extracted.ok) return extracted;
  if (extracted.pages.length === 0) return { ok: false, error: 'the PDF has no pages' };
  if (looksScanned(extracted.pages)) return { ok: false, error: NO_TEXT_LAYER };
  return { ok: true, document: pdfDocument(path, composePages(extracted.pages, extracted.words)) };
}

export function hasEndOfFileMarker(bytes: Uint8Array): boolean {
  const tail = Buffer.from(bytes.subarray(Math.max(0, bytes.length - 4096))).toString('latin1');
  return tail.includes('%%EOF');
}

function tooManyPages(pages: number | null, maxPages: number): string {
  return `the PDF has ${pages === null ? 'more than' : ''}${pages === null ? ` ${maxPages}` : pages} pages ${limitHint('maxPdfPages', maxPages)}`;
}

/** What is used of a pdf.js document and its pages. */
interface PdfJsPage {
  getViewport(options: { scale: number }): PdfJsViewport;
  getTextContent(options: { includeMarkedContent: boolean; disableNormalization: boolean }): Promise<{ items: unknown[]; styles: PdfJsStyles }>;
  cleanup(): unknown;
}
interface PdfJsDocument {
  getPage(number: number): Promise<PdfJsPage>;
}

/**
 * The pdf.js document inside a pdf-parse parser (loaded once by getInfo).
 * pdf-parse 2 keeps it behind its `load` method, which its getText uses;
 * the text items with their positions are not otherwise given out. Null
 * when a version of pdf-parse has no such method (the PDF is then read with
 * getText, without rebuilt tables; the tests compare both paths).
 */
async function pdfjsDocumentOf(parser: object): Promise<PdfJsDocument | null> {
  const load = (parser as { load?: unknown }).load;
  if (typeof load !== 'function') return null;
  return (await (load as () => Promise<PdfJsDocument>).call(parser)) satisfies PdfJsDocument;
}

async function pagesWithPdfParse(bytes: Uint8Array, maxPages: number): Promise<PdfPagesOutcome> {
  const { PDFParse, VerbosityLevel } = await import('pdf-parse');
  // pdf.js may detach the buffer it is given; it gets a copy.
  const parser = new PDFParse({ data: new Uint8Array(bytes), verbosity: VerbosityLevel.ERRORS });
  try {
    // The page count comes from the page tree, before any page's text is extracted.
    const { total } = await parser.getInfo();
    if (total > maxPages) return { ok: false, error: tooManyPages(total, maxPages) };
    const document = await pdfjsDocumentOf(parser);
    if (document === null) {
      const result = await parser.getText({ pageJoiner: '' });
      return { ok: true, pages: result.pages.map((page) => page.text), words: result.pages.map(() => null) };
    }
    const pages: string[] = [];
    const words: LocatedWord[][] = [];
    for (let number = 1; number <= total; number++) {
      const page = await document.getPage(number);
      // The same options and text as pdf-parse's getText, with the items' positions kept.
      const content = await page.getTextContent({ includeMarkedContent: false, disableNormalization: false });
      const built = pdfjsPageText(content.items, page.getViewport({ scale: 1 }), content.styles);
      pages.push(built.text);
      words.push(built.words);
      page.cleanup();
    }
    return { ok: true, pages, words };
  } catch (error) {
    return { ok: false, error: describePdfParseError(error) };
  } finally {
    await parser.destroy().catch(() => undefined);
  }
}

function describePdfParseError(error: unknown): string {
  const name = error instanceof Error ? error.name : '';
  const message = error instanceof Error ? error.message : String(error);
  if (name === 'PasswordException' || /password/i.test(message)) return ENCRYPTED;
  if (name === 'InvalidPDFException' || name === 'FormatError' || /invalid pdf|bad xref|xref|trailer|startxref/i.test(message)) return `corrupt PDF: its structure cannot be read (${message})`;
  return `the PDF could not be read (${message})`;
}

/**
 * Most bytes of `pdftotext -bbox` output read (about 150 bytes a word, ten
 * times the text): above it the words are not used and the PDF is read
 * without rebuilt tables, as before.
 */
const MAX_BBOX_BYTES = 256 * 1024 * 1024;

/** The last bytes of pdftotext's standard error kept for a failure's message (it may write a warning for every object of a damaged PDF). */
const STDERR_KEPT = 64 * 1024;

/**
 * Runs `pdftotext -raw -enc UTF-8 <file> -` and splits its output at form
 * feeds; then, when a page may hold a table, `pdftotext -raw -bbox` for the
 * words' boxes of the pages from the first to the last such page, which are
 * tied to the text page by page while pdftotext writes them (a page whose
 * words cannot be tied is read without rebuilt tables). The text cannot be
 * had from the word boxes alone (pdfWords.ts), hence two runs; their cost is
 * poppler's, page by page, so the second covers only the pages it must.
 *
 * Both runs are bounded in time (the document's time budget: pdftotext is
 * killed when it runs out) and in output: the text run is stopped once it
 * has written more than `maxDocumentMb` MB (a text that long would be
 * refused after reading anyway: it has at least as many bytes as
 * characters), the word boxes past MAX_BBOX_BYTES (the PDF is then read
 * without rebuilt tables). What pdftotext writes to its standard error is
 * kept only as its last STDERR_KEPT bytes.
 */
async function pagesWithPdftotext(path: string, maxPages: number, maxSeconds: number, maxDocumentMb: number): Promise<PdfPagesOutcome> {
  const executable = findPdftotext();
  if (executable === null) return { ok: false, error: 'pdftotext is not installed (it comes with poppler-utils); install it or use --pdf-engine pdf-parse' };
  // One page past the limit is read, to tell a PDF at the limit from one over it.
  const encoding = ['-enc', 'UTF-8', '-eol', 'unix'];
  const started = Date.now();
  const run = await runProcess(executable, ['-raw', ...encoding, '-l', String(maxPages + 1), path, '-'], maxSeconds * 1000, maxDocumentMb * MB);
  if (run.timedOut) return { ok: false, error: `pdftotext took longer than ${maxSeconds} s on this PDF and was stopped ${limitHint('maxSecondsPerDocument', maxSeconds)}` };
  if (run.spawnError) return { ok: false, error: `pdftotext could not be started (${run.spawnError})` };
  if (run.overflow) {
    return { ok: false, error: `the extracted text is too long: pdftotext wrote more than ${formatMb(maxDocumentMb * MB)} of it and was stopped ${limitHint('maxDocumentMb', maxDocumentMb)}` };
  }
  if (run.code !== 0) return { ok: false, error: describePdftotextFailure(run.code, run.stderr, path) };
  const pages = run.stdout.split('\f');
  // pdftotext ends every page with a form feed, so the last piece is what follows the last page.
  if (pages.length > 1 && pages[pages.length - 1]!.trim() === '') pages.pop();
  if (pages.length > maxPages) return { ok: false, error: tooManyPages(null, maxPages) };
  // The word boxes cost a second run: only for a PDF with a page that may hold a table, within the time left,
  // and only over the pages from the first to the last such page (poppler's work is page by page; the words of
  // the other pages would not be looked at: composePage reads a page that may hold no table as text).
  const timeLeft = maxSeconds * 1000 - (Date.now() - started);
  const mayHold = pages.map(mayHoldTable);
  const first = mayHold.indexOf(true);
  const last = mayHold.lastIndexOf(true);
  if (first === -1 || timeLeft <= 0) return { ok: true, pages, words: pages.map(() => null) };
  // The words are tied to the text as pdftotext writes them, not from its whole output afterwards (pdfWords.ts).
  const locator = new BboxWordLocator(pages.slice(first, last + 1));
  const range = ['-f', String(first + 1), '-l', String(last + 1)];
  const boxes = await runProcess(executable, ['-raw', '-bbox', ...encoding, ...range, path, '-'], timeLeft, MAX_BBOX_BYTES, (chunk) => locator.push(chunk));
  const read = boxes.code === 0 && !boxes.timedOut && !boxes.overflow && boxes.spawnError === null;
  const located = read ? locator.finish() : [];
  return { ok: true, pages, words: pages.map((_, index) => located[index - first] ?? null) };
}

function describePdftotextFailure(code: number | null, stderr: string, path: string): string {
  if (/password/i.test(stderr) || code === 3) return ENCRYPTED;
  const detail = stderr.replaceAll(path, 'the file').trim().split('\n').slice(-2).join('; ');
  if (code === 1) return `corrupt PDF: its structure cannot be read${detail ? ` (${detail})` : ''}`;
  return `pdftotext failed (exit code ${code ?? 'none'}${detail ? `: ${detail}` : ''})`;
}

interface ProcessRun {
  code: number | null;
  stdout: string;
  stderr: string;
  spawnError: string | null;
  timedOut: boolean;
  /** The output passed `maxOutputBytes` and the process was stopped. */
  overflow: boolean;
}

/**
 * Runs a program to its end within `timeoutMs` and `maxOutputBytes` of standard output. With `consume`, each
 * chunk of standard output goes to it as it comes instead of being kept (`stdout` is then empty).
 */
function runProcess(executable: string, args: string[], timeoutMs: number, maxOutputBytes = Infinity, consume?: (chunk: Buffer) => void): Promise<ProcessRun> {
  return new Promise((resolve) => {
    const child = spawn(executable, args, { stdio: ['ignore', 'pipe', 'pipe'], timeout: timeoutMs, killSignal: 'SIGKILL' });
    let timedOut = false;
    const timer = setTimeout(() => {
      timedOut = true;
    }, timeoutMs);
    timer.unref();
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    let outBytes = 0;
    let overflow = false;
    child.stdout.on('data', (chunk: Buffer) => {
      if (overflow) return;
      outBytes += chunk.length;
      if (outBytes > maxOutputBytes) {
        overflow = true;
        out.length = 0;
        child.kill('SIGKILL');
        return;
      }
      if (consume !== undefined) consume(chunk);
      else out.push(chunk);
    });
    let errBytes = 0;
    child.stderr.on('data', (chunk: Buffer) => {
      err.push(chunk);
      errBytes += chunk.length;
      while (errBytes - err[0]!.length >= STDERR_KEPT) errBytes -= err.shift()!.length;
    });
    child.on('error', (error) => {
      clearTimeout(timer);
      resolve({ code: null, stdout: '', stderr: '', spawnError: error.message, timedOut: false, overflow: false });
    });
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      const killedForTime = timedOut && signal === 'SIGKILL';
      resolve({ code, stdout: Buffer.concat(out).toString('utf8'), stderr: Buffer.concat(err).toString('utf8'), spawnError: null, timedOut: killedForTime, overflow });
    });
  });
}
