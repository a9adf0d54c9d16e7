/** What every document reader returns: the text the scanner reads, and where its parts sit. */

/** Kinds of region a checker may want to treat differently (reference lists are ignored). */
export type RegionKind = 'body' | 'table' | 'caption' | 'footnote' | 'references' | 'heading';

/** A span of the text [start, end) that sits in one kind of region. Spans not covered are body text. */
export interface Region {
  kind: RegionKind;
  start: number;
  end: number;
}

/** A table found by the reader in the document's own structure (DOCX, HTML, JATS, LaTeX). */
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
}

export interface DocumentText {
  path: string;
  format: string;
  text: string;
  /** Page of a text offset (1-based), or null for formats without pages. */
  pageOf: (offset: number) => number | null;
  /** Regions other than body text, sorted by start, not overlapping. */
  regions: Region[];
  /** Tables the format marks up as tables; for PDF and plain text they are found in the text instead. */
  tables: DocumentTable[];
}

export type ReadOutcome = { ok: true; document: DocumentText } | { ok: false; path: string; format: string; error: string };
