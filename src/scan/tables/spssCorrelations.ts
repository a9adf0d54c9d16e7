/**
 * Correlation tables as statistics software prints them and papers and
 * theses paste them: for each variable three rows, its correlations, their
 * p and the N of each, with the variables named once more as the columns:
 *
 *     Variable Correlation dft DMFT pH
 *     dft Pearson Correlation 1 0.018 −0.217
 *     Sig. (2-tailed) - 0.927 0.266
 *     n 28 28 28
 *     DMFT Pearson Correlation 0.018 1 0.341
 *     Sig. (2-tailed) 0.927 - 0.076
 *     N 28 28 28
 *
 * The rows may come crushed into single spaces, with pipes or with tabs;
 * the column names need not be read (a crushed header of several-word names
 * cannot be cut): the columns are the variables in the order the blocks name
 * them when there are as many blocks as columns, otherwise they are numbered.
 * Each correlation off the diagonal becomes a row "variable × variable | r |
 * p | N" for the table reader, each cell pointing at its place in the text.
 * A one-tailed Sig. row gives no p (plumbline tests r two-tailed); a block
 * whose rows do not hold the same number of cells is left out.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import type { TextLine } from './cells.js';
import { spanOfCell as span, tableOverLines } from './rebuilt.js';

type Line = TextLine;

/** The name of a block's correlation row, after the variable's name. */
const R_ROW = /(?:Pearson(?:'s)? Correlation|Pearson(?:'s)? r|Correlation Coefficient|\bCorrelation)[ \t|]{0,12}(?=[-\u2212\u2013.\d|])/i;
/** A block's p row: "Sig. (2-tailed)", "Significance (2-tailed)", "p (2-tailed)". */
const P_ROW = /^[ \t|]{0,12}(?:Sig\.?|Significance|p) ?\((1|2)[- ]tailed\)[ \t|]{0,12}(?=[-\u2212\u2013.\d|])/i;
/** A p row's name alone on its line, its tails wrapped onto the next with the values ("Significance" / "(2-tailed) 0.303 …"). */
const P_NAME_ALONE = /^[ \t|]{0,12}(?:Sig\.?|Significance)[ \t|]{0,12}$/i;
/** The wrapped rest of a p row's name, then its values. */
const P_TAILS_WRAPPED = /^[ \t|]{0,12}\((1|2)[- ]tailed\)[ \t|]{0,12}(?=[-\u2212\u2013.\d|])/i;
/** A block's N row. */
const N_ROW = /^[ \t|]{0,12}N[ \t|]{0,12}(?=\d)/i;
/** A block's df row, as partial correlations print it instead of N ("Correlation / Significance (2-tailed) / df"). */
const DF_ROW = /^[ \t|]{0,12}df[ \t|]{0,12}(?=\d)/i;
/** Stars standing apart after a p ("0.001 *"): the printed p says it all. */
const STARS_APART = /^\*{1,3}$/;
/** A cell among a block's values: a number (stars or a footnote letter glued on), the diagonal's dash, or "." for none. */
const VALUE = /^(?:[-\u2212\u2013]\s?)?(?:\d+(?:[.,]\d+)?|[.,]\d+)(?:\*{1,3}|[a-h])?$|^[-\u2212\u2013\u2014.]$/;
/** Most lines of one table. */
const MAX_LINES = 600;
/** Most blank lines between a block's rows and between blocks. */
const MAX_BLANKS = 2;

interface Cell {
  text: string;
  start: number;
  end: number;
}

interface Block {
  name: string;
  nameSpan: CellSpan | null;
  r: Cell[];
  p: Cell[] | null;
  oneTailed: boolean;
  n: Cell[] | null;
  /** Partial correlations print each one's df instead of N. */
  df: Cell[] | null;
}

/** The cells of a line's run of values from `from` (split at pipes, tabs or spaces); null unless every piece is a value. */
function valuesOf(line: Line, from: number): Cell[] | null {
  const cells: Cell[] = [];
  const text = line.text;
  // (A minus sign set apart from its number, "− 0.004", is one cell; a hyphen set apart, "- 0.927", is the
  // diagonal's dash and the next cell.)
  const pattern = text.includes('|') ? /[^|]+/g : text.includes('\t') ? /[^\t]+/g : /(?:\u2212\s(?=[.\d]))?\S+/g;
  pattern.lastIndex = from;
  for (let match = pattern.exec(text); match !== null; match = pattern.exec(text)) {
    const raw = match[0];
    const inner = raw.trim();
    if (inner === '' || (STARS_APART.test(inner) && cells.length > 0)) continue;
    if (!VALUE.test(inner)) return null;
    const start = line.start + match.index + raw.indexOf(inner);
    cells.push({ text: inner, start, end: start + inner.length });
  }
  return cells.length > 0 ? cells : null;
}

function nextNonBlank(lines: Line[], from: number): number {
  let blanks = 0;
  for (let index = from; index < lines.length; index++) {
    if (lines[index]!.text.trim() !== '') return index;
    if (++blanks > MAX_BLANKS) return -1;
  }
  return -1;
}

/** Software-printed correlation blocks starting at `lines[first]` (its first correlation row), or null. */
export function readSpssCorrelations(lines: Line[], first: number): { table: DocumentTable; lastLine: number } | null {
  if (!R_ROW.test(lines[first]?.text ?? '')) return null;
  const blocks: Block[] = [];
  let index = first;
  let lastLine = first;
  while (index >= 0 && index < lines.length && index < first + MAX_LINES) {
    const line = lines[index]!;
    const rMatch = R_ROW.exec(line.text);
    if (rMatch === null) break;
    const r = valuesOf(line, rMatch.index + rMatch[0].length);
    if (r === null) break;
    const name = line.text.slice(0, rMatch.index).replace(/\|/g, ' ').trim();
    const nameAt = name === '' ? -1 : line.text.indexOf(name);
    const block: Block = { name, nameSpan: nameAt < 0 ? null : { start: line.start + nameAt, end: line.start + nameAt + name.length }, r, p: null, oneTailed: false, n: null, df: null };
    lastLine = index;
    let next = nextNonBlank(lines, index + 1);
    // (A narrow column wraps the p row's name, "Significance" over "(2-tailed) 0.303 …": its values are on the second line.)
    const wrappedP = next >= 0 && P_NAME_ALONE.test(lines[next]!.text) && next + 1 < lines.length ? P_TAILS_WRAPPED.exec(lines[next + 1]!.text) : null;
    if (wrappedP !== null) next++;
    const pMatch = wrappedP ?? (next < 0 ? null : P_ROW.exec(lines[next]!.text));
    if (pMatch !== null) {
      block.p = valuesOf(lines[next]!, pMatch[0].length);
      block.oneTailed = pMatch[1] === '1';
      lastLine = next;
      next = nextNonBlank(lines, next + 1);
    }
    const nMatch = next < 0 ? null : N_ROW.exec(lines[next]!.text);
    if (nMatch !== null) {
      block.n = valuesOf(lines[next]!, nMatch[0].length);
      lastLine = next;
      next = nextNonBlank(lines, next + 1);
    }
    const dfMatch = next < 0 ? null : DF_ROW.exec(lines[next]!.text);
    if (dfMatch !== null) {
      block.df = valuesOf(lines[next]!, dfMatch[0].length);
      lastLine = next;
      next = nextNonBlank(lines, next + 1);
    }
    blocks.push(block);
    index = next;
  }
  // Kendall's tau (printed as a "Correlation Coefficient" too) has another distribution than r.
  if (blocks.some((block) => /kendall|\btau/i.test(block.name)) || /kendall|\btau/i.test(lines[first - 1]?.text ?? '')) return null;
  const width = blocks[0]?.r.length ?? 0;
  const whole = blocks.filter((block) => block.r.length === width && block.p?.length === width && (block.n === null || block.n.length === width) && (block.df === null || block.df.length === width));
  if (whole.length < 2 || width < 2) return null;
  const columnNames = blocks.length === width ? blocks.map((block, column) => block.name || String(column + 1)) : null;
  const rows: string[][] = [['Variables', 'r', 'p', 'N', 'df']];
  const cells: (CellSpan | null)[][] = [[null, null, null, null, null]];
  for (const block of whole) {
    block.r.forEach((r, column) => {
      const p = block.p![column]!;
      // The diagonal: a correlation of 1 with no p.
      if (/^[-\u2212\u2013\u2014.]$/.test(r.text) || /^[-\u2212\u2013\u2014.]$/.test(p.text)) return;
      const n = block.n?.[column] ?? null;
      const df = block.df?.[column] ?? null;
      const other = columnNames?.[column] ?? String(column + 1);
      rows.push([`${block.name} \u00d7 ${other}`, r.text, block.oneTailed ? '' : p.text, n?.text ?? '', df?.text ?? '']);
      cells.push([block.nameSpan, span(r), block.oneTailed ? null : span(p), n === null ? null : span(n), df === null ? null : span(df)]);
    });
  }
  if (rows.length < 2) return null;
  return { table: tableOverLines(lines[first]!, lines[lastLine]!, null, rows, cells, 'positions'), lastLine };
}
