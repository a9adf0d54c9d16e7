/**
 * Limits on the work one document may cause. plumbline reads files that its
 * user did not write: a document must not be able to exhaust memory or time
 * by its size, its nesting, or a compressed part that expands enormously.
 * A document over a limit is refused with a message that names the limit,
 * its value, and how to raise it; the rest of the audit goes on.
 *
 * Every limit can be changed in the settings file ("limits": { ... }) and on
 * the scan command line (--max-document-mb, or --limit name=value).
 */

export interface Limits {
  /**
   * Largest document read whole, in MB (10^6 bytes): the file's size for
   * PDF, DOCX, HTML, XML and LaTeX, and the length of the text a reader
   * extracts from it (in millions of characters). Plain-text files larger
   * than `streamTextAboveMb` are scanned as a stream instead and have no
   * size limit.
   */
  maxDocumentMb: number;
  /** Plain-text (.txt, .md) files above this size, in MB, are scanned in chunks with bounded memory. */
  streamTextAboveMb: number;
  /**
   * Largest total uncompressed size of a DOCX's zip entries, in MB: the
   * sizes the zip directory declares are added up before anything is
   * inflated, and the bytes actually inflated are counted as they come out.
   */
  maxUnzippedMb: number;
  /** Largest uncompressed size of one zip entry of a DOCX, in MB, declared or inflated. */
  maxUnzippedEntryMb: number;
  /** Most entries in a DOCX's zip directory. */
  maxZipEntries: number;
  /**
   * Most XML nodes (elements, attributes and runs of text) in the parts of a
   * DOCX that are read (document, footnotes, styles...), counted while they
   * are inflated: each costs the DOCX converter (mammoth) about 1 to 3 KB,
   * and the default keeps its peak under 1 GB for every payload measured (bench/hostile.ts).
   */
  maxDocxXmlNodes: number;
  /**
   * Deepest nesting of elements in HTML, JATS XML and the HTML made from
   * DOCX, and of environments and groups (\begin, braces, \( and \[) in
   * LaTeX; the readers follow each level by recursion.
   */
  maxNestingDepth: number;
  /** Most elements in one HTML or XML document. */
  maxElements: number;
  /** Most pages read from one PDF. */
  maxPdfPages: number;
  /** Largest decoded size of one stream of a PDF (a page's content, a font, an image), in MB, checked before the PDF is read. */
  maxPdfStreamMb: number;
  /** Largest decoded size of all the streams of a PDF together, in MB, checked before the PDF is read. */
  maxPdfDecodedMb: number;
  /**
   * Longest time one document may take, in seconds, counted from the moment
   * a worker thread starts it (never its wait in the queue): a document
   * audited on a worker thread is stopped (the thread is replaced) and
   * pdftotext is killed when it runs longer. PDFs read with pdf-parse, DOCX files and any file over
   * 2 MB are always audited on a worker thread, even with --jobs 1, so they can be stopped; the
   * other documents audited on the main thread are interrupted in their scan and check
   * (auditFile, syncBudget.ts). Also the budget of refit --reported's manuscript and of one
   * record read by merge.
   */
  maxSecondsPerDocument: number;
}

export const defaultLimits: Readonly<Limits> = Object.freeze({
  maxDocumentMb: 200,
  streamTextAboveMb: 64,
  maxUnzippedMb: 100,
  maxUnzippedEntryMb: 50,
  maxZipEntries: 10_000,
  maxDocxXmlNodes: 250_000,
  maxNestingDepth: 1000,
  maxElements: 2_000_000,
  maxPdfPages: 5000,
  maxPdfStreamMb: 128,
  maxPdfDecodedMb: 2000,
  maxSecondsPerDocument: 120,
});

/** How each limit is named in the settings file and after --limit, and what it counts. */
export const limitDescriptions: Record<keyof Limits, { unit: string; what: string }> = {
  maxDocumentMb: { unit: 'MB', what: 'document size' },
  streamTextAboveMb: { unit: 'MB', what: 'size above which text files are streamed' },
  maxUnzippedMb: { unit: 'MB', what: 'uncompressed size of a DOCX' },
  maxUnzippedEntryMb: { unit: 'MB', what: 'uncompressed size of one part of a DOCX' },
  maxZipEntries: { unit: 'entries', what: 'number of entries in a DOCX' },
  maxDocxXmlNodes: { unit: 'nodes', what: 'XML nodes (elements, attributes, text) read from a DOCX' },
  maxNestingDepth: { unit: 'levels', what: 'nesting depth of elements (HTML, XML, DOCX) or environments and groups (LaTeX)' },
  maxElements: { unit: 'elements', what: 'number of elements' },
  maxPdfPages: { unit: 'pages', what: 'number of PDF pages' },
  maxPdfStreamMb: { unit: 'MB', what: 'decoded size of one PDF stream' },
  maxPdfDecodedMb: { unit: 'MB', what: 'decoded size of all the streams of a PDF' },
  maxSecondsPerDocument: { unit: 'seconds', what: 'time for one document' },
};

export const limitNames = Object.keys(defaultLimits) as (keyof Limits)[];

/** The defaults with the given overrides (undefined entries keep the default). */
export function resolveLimits(overrides: Partial<Limits> | undefined): Limits {
  const limits: Limits = { ...defaultLimits };
  if (overrides) {
    for (const name of limitNames) {
      const value = overrides[name];
      if (value !== undefined) limits[name] = value;
    }
  }
  return limits;
}

export const MB = 1_000_000;

/**
 * The end of every refusal: which limit, its value, and how to raise it.
 * "(limit maxUnzippedMb = 100 MB; raise it with --limit maxUnzippedMb=<n> or "limits": {"maxUnzippedMb": <n>} in the settings file)"
 */
export function limitHint(name: keyof Limits, value: number): string {
  const { unit } = limitDescriptions[name];
  const option = name === 'maxDocumentMb' ? '--max-document-mb <n>' : `--limit ${name}=<n>`;
  return `(limit ${name} = ${formatLimit(value)} ${unit}; raise it with ${option} or "limits": {"${name}": <n>} in the settings file)`;
}

/**
 * A reader's message with each limit's hint reworded for a command that
 * takes limits only as --limit name=value and has no settings file (refit):
 * the readers word their hints for scan (limitHint).
 */
export function hintsForLimitOptionOnly(message: string): string {
  let reworded = message;
  for (const name of limitNames) {
    const option = name === 'maxDocumentMb' ? '--max-document-mb <n>' : `--limit ${name}=<n>`;
    reworded = reworded.replaceAll(`raise it with ${option} or "limits": {"${name}": <n>} in the settings file)`, `raise it with --limit ${name}=<n>)`);
  }
  return reworded;
}

/**
 * Why a document (or a record, or a reported manuscript) was stopped by the
 * time budget: "took longer than 120 s and was stopped (limit ...)".
 */
export function timeBudgetReason(seconds: number): string {
  return `took longer than ${formatLimit(seconds)} s and was stopped ${limitHint('maxSecondsPerDocument', seconds)}`;
}

function formatLimit(value: number): string {
  return Number.isInteger(value) ? value.toLocaleString('en-US') : String(value);
}

/** Megabytes with one decimal for messages ("312.4 MB"). */
export function formatMb(bytes: number): string {
  return `${(bytes / MB).toFixed(1)} MB`;
}

/** Checks one override (from the command line or settings): a positive number. Returns an error message or null. */
export function checkLimitValue(name: string, value: number): string | null {
  if (!(limitNames as string[]).includes(name)) return `unknown limit "${name}"; known limits: ${limitNames.join(', ')}`;
  if (!Number.isFinite(value) || value <= 0) return `limit ${name} must be a positive number, got ${value}`;
  return null;
}

/**
 * Limits on an .xlsx data file read by `plumbline refit`, checked before the
 * sheet is parsed (src/refit/xlsx.ts). The spreadsheet reader holds the
 * whole sheet in memory as rows of cells, every row padded to the widest
 * one, and takes time that grows faster than the rows (200,000 rows of 5
 * cells: 15 s and 0.35 GB; 600,000: a stack overflow after 100 s and 1 GB).
 * A CSV file has no such limits: refit streams it. So above a limit the
 * refusal names the file and suggests saving the sheet as CSV.
 */
export interface XlsxLimits {
  /** Rows the first sheet spans (the last row number its rows and cells give). */
  maxRows: number;
  /** Columns it spans (the last column any cell names). */
  maxColumns: number;
  /** Rows times columns: the cells the reader lays out, empty ones included. */
  maxCells: number;
  /** Distinct texts in the shared-strings part, all read into memory. */
  maxSharedStrings: number;
  /** Total size of the parts the reader unpacks (its XML), in MB, declared and as inflated. */
  maxUnzippedMb: number;
}

export const xlsxLimits: Readonly<XlsxLimits> = Object.freeze({
  maxRows: 200_000,
  maxColumns: 1_000,
  maxCells: 2_000_000,
  maxSharedStrings: 1_000_000,
  maxUnzippedMb: 100,
});
