/** What every document reader returns: the text the scanner reads, and where its parts sit. */

/** Kinds of region a checker may want to treat differently (reference lists are ignored). */
export type RegionKind = 'body' | 'table' | 'caption' | 'footnote' | 'references' | 'heading';

/** A span of the text [start, end) that sits in one kind of region. Spans not covered are body text. */
export interface Region {
  kind: RegionKind;
  start: number;
  end: number;
}

/** Where one cell's text sits in the document text [start, end). */
export interface CellSpan {
  start: number;
  end: number;
}

/** How a table reached the reader: its markup, or the layout of plain text the table finder rebuilt it from. */
export type TableLayout = 'markup' | 'pipe' | 'aligned' | 'crushed' | 'cell-per-line' | 'glued' | 'positions';

/**
 * A table: the one model every reader and the text table finder hand the
 * scanner (DOCX, HTML, JATS and LaTeX from their markup; PDF from word
 * positions; plain text, Markdown and extracted text from its layout).
 *
 * `rows` holds every row's cells as written, header rows included, with
 * spanning cells expanded: a cell that spans columns keeps its text in its
 * first column and leaves '' in the others (`spans` says how far it
 * reaches). Side-by-side blocks (two groups, two outcomes) are columns of
 * the same rows; the scanner finds them from the headers.
 */
export interface DocumentTable {
  /** Offsets of the table's text in `text`. */
  start: number;
  end: number;
  /** Caption or title, if any. */
  caption: string | null;
  /** Notes under the table (often hold df or the meaning of symbols). */
  notes: string[];
  /** Cell texts, row by row, as written (header rows included). */
  rows: string[][];
  /** Number of header rows, when the source says (a thead, th cells); otherwise the scanner decides. */
  headerRows?: number;
  /** Columns each cell spans (1 when absent), parallel to `rows`. */
  spans?: number[][];
  /** Where each cell's text is in the document text, parallel to `rows` (null for an empty or rebuilt cell); otherwise the scanner finds the cells in the table's lines. */
  cells?: (CellSpan | null)[][];
  /** How the table was rebuilt. */
  layout?: TableLayout;
  /**
   * Rows with values that the reader saw but could not rebuild into cells (a run of glued digits that cuts more
   * than one way): left out of `rows`, and counted as not read so the table is listed as not fully read.
   */
  rowsNotRebuilt?: number;
}

export interface DocumentText {
  path: string;
  format: string;
  text: string;
  /** Page of a text offset (1-based), or null for formats without pages. */
  pageOf: (offset: number) => number | null;
  /**
   * Line and column in the file (1-based) of a text offset, for a reader
   * whose text is not the file's own line for line (LaTeX: comments, the
   * preamble and markup are dropped). Absent: the lines of `text` are the
   * ones reported.
   */
  lineOf?: (offset: number) => { line: number; column: number };
  /** Regions other than body text, sorted by start, not overlapping. */
  regions: Region[];
  /** Tables the format marks up as tables; for PDF and plain text they are found in the text instead. */
  tables: DocumentTable[];
}

export type ReadOutcome = { ok: true; document: DocumentText } | { ok: false; path: string; format: string; error: string };
