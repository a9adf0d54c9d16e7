import { spawn } from 'node:child_process';
import { accessSync, constants } from 'node:fs';
import { delimiter, join } from 'node:path';
import { findReferenceListRegions } from './plainRegions.js';
import type { DocumentText } from './types.js';
import { defaultLimits, limitHint, type Limits } from '../limits.js';

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
 * Tables are not rebuilt from the page (`tables` stays empty): their rows
 * are in the text as the engine read them.
 */

export type PdfEngine = 'pdf-parse' | 'pdftotext';
export type PdfEngineChoice = 'auto' | PdfEngine;

export type PdfPagesOutcome = { ok: true; pages: string[] } | { ok: false; error: string };

const ENCRYPTED = 'encrypted PDF: it needs a password to open; save a copy without a password (or print it to a new PDF) and read that';
const NO_TEXT_LAYER = 'no text layer: the PDF seems to be scanned images; run OCR first';
/** Below this many visible characters per page on average, a PDF is taken to be scanned images. */
const MIN_CHARACTERS_PER_PAGE = 20;

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
  limits: Pick<Limits, 'maxPdfPages' | 'maxSecondsPerDocument'> = defaultLimits,
): Promise<{ ok: true; document: DocumentText } | { ok: false; error: string }> {
  if (!hasEndOfFileMarker(bytes)) return { ok: false, error: 'truncated PDF: the end-of-file marker is missing, so the file was cut short (an interrupted download or copy?)' };
  const engine = resolvePdfEngine(choice);
  const extracted =
    engine === 'pdftotext'
      ? await pagesWithPdftotext(path, limits.maxPdfPages, limits.maxSecondsPerDocument)
      : await pagesWithPdfParse(bytes, limits.maxPdfPages);
  if (!extracted.ok) return extracted;
  if (extracted.pages.length === 0) return { ok: false, error: 'the PDF has no pages' };
  if (looksScanned(extracted.pages)) return { ok: false, error: NO_TEXT_LAYER };
  return { ok: true, document: pdfDocument(path, withoutPageFurniture(extracted.pages).map(dehyphenate)) };
}

/** A PDF ends with "%%EOF" (possibly followed by a little whitespace or junk); a cut file does not. */
export function hasEndOfFileMarker(bytes: Uint8Array): boolean {
  const tail = Buffer.from(bytes.subarray(Math.max(0, bytes.length - 4096))).toString('latin1');
  return tail.includes('%%EOF');
}

function looksScanned(pages: readonly string[]): boolean {
  const visible = pages.reduce((sum, page) => sum + page.replace(/\s+/g, '').length, 0);
  return visible < MIN_CHARACTERS_PER_PAGE * pages.length;
}

/** A line that is only a page number: "12", "Page 12", "12 of 30", "- 12 -". */
const PAGE_NUMBER_LINE = /^[-\u2013\u2014\s]*(?:page\s+)?\d{1,4}(?:\s*(?:of|\/)\s*\d{1,4})?[-\u2013\u2014\s]*$/i;
/** How many lines at the top and bottom of a page may be running heads, feet or page numbers. */
const FURNITURE_LINES = 3;

function furnitureKey(line: string): string {
  return line.trim().replace(/\d+/g, '#').toLowerCase();
}

/**
 * Drops page furniture that text extraction leaves inside the running text,
 * where it can fall between a result and its p ("F(1, 39) = 0.09,\fJournal of
 * Things\n2\nn.s."): page-number lines, and running heads and feet, i.e.
 * lines among the first or last few of a page that recur (numbers aside) on
 * at least two pages and at least a third of them. Only the edges of pages
 * are touched; body text is never removed.
 */
export function withoutPageFurniture(pages: readonly string[]): string[] {
  const split = pages.map((page) => page.split('\n'));
  const edgeCounts = new Map<string, number>();
  for (const lines of split) {
    const nonEmpty = lines.map((line, index) => ({ line, index })).filter(({ line }) => line.trim() !== '');
    const edges = new Set([...nonEmpty.slice(0, FURNITURE_LINES), ...nonEmpty.slice(-FURNITURE_LINES)].map(({ line }) => furnitureKey(line)));
    for (const key of edges) edgeCounts.set(key, (edgeCounts.get(key) ?? 0) + 1);
  }
  const recurring = (line: string): boolean => {
    const count = edgeCounts.get(furnitureKey(line)) ?? 0;
    return pages.length >= 2 && count >= 2 && count * 3 >= pages.length;
  };
  const isFurniture = (line: string): boolean => PAGE_NUMBER_LINE.test(line) || recurring(line);
  return split.map((lines) => {
    let first = 0;
    let last = lines.length - 1;
    for (let removed = 0; removed < FURNITURE_LINES && first <= last; ) {
      if (lines[first]!.trim() === '') first += 1;
      else if (isFurniture(lines[first]!)) {
        first += 1;
        removed += 1;
      } else break;
    }
    for (let removed = 0; removed < FURNITURE_LINES && last >= first; ) {
      if (lines[last]!.trim() === '') last -= 1;
      else if (isFurniture(lines[last]!)) {
        last -= 1;
        removed += 1;
      } else break;
    }
    return lines.slice(first, last + 1).join('\n');
  });
}

/** Joins the pages with a form feed after each (as pdftotext writes them) and records where each starts. */
export function pdfDocument(path: string, pages: readonly string[]): DocumentText {
  const pageStarts: number[] = [];
  let text = '';
  for (const page of pages) {
    pageStarts.push(text.length);
    text += `${page.trimEnd()}\n\f`; // not /\s+$/, which is quadratic on a long run of spaces
  }
  return { path, format: 'pdf', text, pageOf: (offset) => pageAt(pageStarts, offset, text.length), regions: findReferenceListRegions(text), tables: [] };
}

/** 1-based page holding `offset` (binary search over page starts); null outside the text. */
export function pageAt(pageStarts: readonly number[], offset: number, textLength: number): number | null {
  if (!Number.isInteger(offset) || offset < 0 || offset > textLength || pageStarts.length === 0) return null;
  let low = 0;
  let high = pageStarts.length - 1;
  while (low < high) {
    const middle = (low + high + 1) >> 1;
    if (pageStarts[middle]! <= offset) low = middle;
    else high = middle - 1;
  }
  return low + 1;
}

/** First parts of compounds whose hyphen is real even at a line end ("chi-square", "within-subjects"). */
const COMPOUND_FIRST_PARTS = new Set(['chi', 'self', 'non', 'one', 'two', 'three', 'four', 'within', 'between', 'cross', 'follow', 'well', 'long', 'short', 'high', 'low', 'mixed', 'open', 'post', 'pre', 'semi', 'multi', 'co', 'counter', 'right', 'left', 'time', 'age', 'sex', 'first', 'second', 'third', 'full', 'half', 'small', 'large', 'mid', 'over', 'under', 'test', 'inter', 'intra']);

/**
 * Joins a word hyphenated at a line end when the next line goes on in lower
 * case: "recog-\nnition of" -> "recognition\nof" (the line break moves after
 * the joined word, so lines stay lines). A hyphen after a known first part
 * of a compound is kept ("chi-\nsquare" -> "chi-square"). A hyphen after a
 * digit or a single letter is never touched: "= -\n.32" stays a minus sign,
 * "p-\nvalue" stays as written.
 */
export function dehyphenate(page: string): string {
  // The look-behind starts a try only at the start of a word: without it, a long word with no hyphen is read again from each of its letters.
  return page.replace(/(?<!\p{L})(\p{L}{2,})[-\u00AD\u2010]\n[ \t]*(\p{Ll}[\p{L}\p{M}'’]*)( ?)/gu, (_whole, first: string, rest: string, space: string) => {
    const joiner = COMPOUND_FIRST_PARTS.has(first.toLowerCase()) ? '-' : '';
    return `${first}${joiner}${rest}${space ? '\n' : ''}`;
  });
}

function tooManyPages(pages: number | null, maxPages: number): string {
  return `the PDF has ${pages === null ? 'more than' : ''}${pages === null ? ` ${maxPages}` : pages} pages ${limitHint('maxPdfPages', maxPages)}`;
}

async function pagesWithPdfParse(bytes: Uint8Array, maxPages: number): Promise<PdfPagesOutcome> {
  const { PDFParse, VerbosityLevel } = await import('pdf-parse');
  // pdf.js may detach the buffer it is given; it gets a copy.
  const parser = new PDFParse({ data: new Uint8Array(bytes), verbosity: VerbosityLevel.ERRORS });
  try {
    // The page count comes from the page tree, before any page's text is extracted.
    const { total } = await parser.getInfo();
    if (total > maxPages) return { ok: false, error: tooManyPages(total, maxPages) };
    const result = await parser.getText({ pageJoiner: '' });
    return { ok: true, pages: result.pages.map((page) => page.text) };
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

/** Runs `pdftotext -raw -enc UTF-8 <file> -` and splits its output at form feeds. */
async function pagesWithPdftotext(path: string, maxPages: number, maxSeconds: number): Promise<PdfPagesOutcome> {
  const executable = findPdftotext();
  if (executable === null) return { ok: false, error: 'pdftotext is not installed (it comes with poppler-utils); install it or use --pdf-engine pdf-parse' };
  // One page past the limit is read, to tell a PDF at the limit from one over it.
  const run = await runProcess(executable, ['-raw', '-enc', 'UTF-8', '-eol', 'unix', '-l', String(maxPages + 1), path, '-'], maxSeconds * 1000);
  if (run.timedOut) return { ok: false, error: `pdftotext took longer than ${maxSeconds} s on this PDF and was stopped ${limitHint('maxSecondsPerDocument', maxSeconds)}` };
  if (run.spawnError) return { ok: false, error: `pdftotext could not be started (${run.spawnError})` };
  if (run.code !== 0) return { ok: false, error: describePdftotextFailure(run.code, run.stderr, path) };
  const pages = run.stdout.split('\f');
  // pdftotext ends every page with a form feed, so the last piece is what follows the last page.
  if (pages.length > 1 && pages[pages.length - 1]!.trim() === '') pages.pop();
  if (pages.length > maxPages) return { ok: false, error: tooManyPages(null, maxPages) };
  return { ok: true, pages };
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
}

function runProcess(executable: string, args: string[], timeoutMs: number): Promise<ProcessRun> {
  return new Promise((resolve) => {
    const child = spawn(executable, args, { stdio: ['ignore', 'pipe', 'pipe'], timeout: timeoutMs, killSignal: 'SIGKILL' });
    let timedOut = false;
    const timer = setTimeout(() => {
      timedOut = true;
    }, timeoutMs);
    timer.unref();
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (chunk: Buffer) => out.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => err.push(chunk));
    child.on('error', (error) => {
      clearTimeout(timer);
      resolve({ code: null, stdout: '', stderr: '', spawnError: error.message, timedOut: false });
    });
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      const killedForTime = timedOut && signal === 'SIGKILL';
      resolve({ code, stdout: Buffer.concat(out).toString('utf8'), stderr: Buffer.concat(err).toString('utf8'), spawnError: null, timedOut: killedForTime });
    });
  });
}
