/**
 * Tables whose test columns state their df in the header and whose cells give the statistic with significance
 * marks, copied one cell per line (or with a crushed header line over cells stacked one per line):
 *
 *     Table 4 Results of two-way ANCOVA analyses
 *     Measure
 *     Posttest adjusted means and standard error
 *     Reading level effect
 *     F (1,128)
 *     Training condition effect
 *     F (1,128)
 *     Word identification
 *     Accelerated
 *     47.9a (1.39)
 *     9.69**
 *     η2 = .18
 *     .14, n.s.
 *
 * Rows no reader rebuilds (labels spread over several cells, an effect's cells on its block's first row only,
 * an effect size on its own line under the statistic), but a header whose every test column names the same
 * statistic with the same df ("F (1,128)" twice) ties a df to any cell of that statistic, whatever its column:
 * the cell needs no place, only to be known as a statistic's. A cell is taken as one where a table of this kind
 * marks its statistics and nothing else: a number with stars, or with "n.s." (common practice: the marks give
 * the p where no p column is printed), standing at the end of its row's run of values (after the descriptive
 * cells, "47.9a (1.39)"), at most as many in a run as the header names test columns. An effect size written on
 * the next line ("η2 = .18") is the statistic's. Unmarked numbers are left unread: nothing says whether they
 * are a statistic or a descriptive value.
 *
 * Not read at all when the header names a p, df or a statistic without its df (other readers take those
 * tables), when its test columns differ in statistic or df (a cell's column would have to be guessed), or when
 * a marked number stands before an unmarked one in a run (a descriptive column may carry marks too).
 *
 * Linear in the block's lines; looked at only after a "Table N" title.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { tableUnderTitle } from './rebuilt.js';
import { CELL_BLOCK_NOTE, classifyHeader, readCell, TABLE_TITLE, type LineCell, type TextLine } from './cells.js';

type Line = TextLine;

/** Most lines after the title looked at. */
const MAX_LINES = 400;
/** Most blank lines in a row inside the block. */
const MAX_BLANK_RUN = 2;
/** Longest cell; a longer line is a caption line before the first value, and prose after it. */
const MAX_CELL_LENGTH = 120;
/** Longest header line (a crushed header holds every column's name). */
const MAX_HEADER_LINE = 400;
/** Fewest marked statistic cells that make the block worth reading so. */
const MIN_MARKED_CELLS = 2;

/** A statistic's symbol with its df in brackets: "F (1,128)", "F(1, 58)", "t(80)", "χ2(2)". */
const STATISTIC_WITH_DF = /(?<![\p{L}\d])(?:F|t|\u03c7\u00b2|\u03c72|\u03c7 2|X2)\s?\(\s?\d{1,6}(?:\.\d{1,3})?(?:\s?,\s?\d{1,6}(?:\.\d{1,3})?)?\s?\)/gu;
/**
 * A number with decimals and significance stars or daggers: "9.69**", "−2.10*". (A statistic prints decimals; a
 * whole number is a count or a size.)
 */
const STARRED_NUMBER = /^[-\u2212]?\d{0,6}\.\d{1,4}[*\u2020\u2021]{1,3}$/;
/** A number with decimals closed by a comma before "n.s." ("0.0,", ".14,") or standing bare before it. */
const NUMBER_BEFORE_NS = /^[-\u2212]?\d{0,6}\.\d{1,4},?$/;
/** "n.s.", "ns", "NS". */
const NOT_SIGNIFICANT = /^n\.?s\.?$/i;
/** A cell that opens with a number: a value (a descriptive one too, "47.9a (1.39)"). */
const OPENS_WITH_NUMBER = /^[-\u2212]?\.?\d/;
/** Three letters in a row: a cell of words, even when it opens with a number ("3. Pretest score = 32.48"). */
const WORDS = /\p{L}{3}/u;

interface Cell extends LineCell {
  /** Spaces only: an empty cell. */
  empty: boolean;
}

/** A statistic with its marks and the effect size written under it. */
interface MarkedCell {
  statistic: Cell;
  effect: { symbol: string; value: Cell } | null;
  label: string;
}

/** The marked statistic cells of a titled block whose header names one statistic with one df, or null. */
export function readMarkedStatisticCells(lines: Line[], titleLine: number): { table: DocumentTable; lastLine: number } | null {
  const title = lines[titleLine];
  if (title === undefined || !TABLE_TITLE.test(title.text)) return null;
  const block = collectBlock(lines, titleLine + 1);
  if (block === null) return null;
  const name = sharedStatisticName(block.headerLines);
  if (name === null) return null;
  const marked = markedCells(block.body, name.columns);
  if (marked === null || marked.length < MIN_MARKED_CELLS) return null;
  // (The effect sizes get a column when every one is of the same kind: one header names them all.)
  const symbols = new Set(marked.flatMap((cell) => (cell.effect === null ? [] : [cell.effect.symbol])));
  const effectName = symbols.size === 1 ? [...symbols][0]! : null;
  const rows: string[][] = [['', name.text, ...(effectName !== null ? [effectName] : [])]];
  const spans: (CellSpan | null)[][] = [[null, null, ...(effectName !== null ? [null] : [])]];
  for (const cell of marked) {
    const effect = effectName !== null ? [cell.effect?.value ?? null] : [];
    rows.push([cell.label, cell.statistic.text, ...effect.map((value) => value?.text ?? '')]);
    spans.push([null, spanOf(cell.statistic), ...effect.map((value) => (value === null ? null : spanOf(value)))]);
  }
  const lastCell = block.body[block.body.length - 1]!;
  return {
    table: tableUnderTitle(title, lastCell.end, rows, spans, 'positions'),
    lastLine: lastCell.line,
  };
}

/**
 * The lines before the first value (caption, header and the first row's labels), and the cells from the first
 * value on: one per non-blank line, up to a note, another title, a line of prose or a gap of blank lines. Null
 * when no value follows.
 */
function collectBlock(lines: Line[], from: number): { headerLines: Line[]; body: Cell[] } | null {
  const headerLines: Line[] = [];
  const body: Cell[] = [];
  let blankRun = 0;
  for (let index = from; index < lines.length && index - from <= MAX_LINES; index++) {
    const line = lines[index]!;
    const text = line.text.trim();
    if (text === '') {
      // (A line of spaces only is an empty cell; a line with nothing at all is a gap between cells.)
      if (body.length > 0 && line.text.length > 0) {
        body.push({ text: '', start: line.start, end: line.start, line: index, empty: true });
        continue;
      }
      if (++blankRun > MAX_BLANK_RUN) break;
      continue;
    }
    blankRun = 0;
    if (CELL_BLOCK_NOTE.test(text) || TABLE_TITLE.test(text)) break;
    const opensValue = OPENS_WITH_NUMBER.test(text) || effectOf(text) !== null;
    if (body.length === 0 && !opensValue) {
      if (text.length > MAX_HEADER_LINE) return null;
      headerLines.push(line);
      continue;
    }
    if (text.length > MAX_CELL_LENGTH) break;
    const start = line.start + line.text.indexOf(text);
    body.push({ text, start, end: start + text.length, line: index, empty: false });
  }
  while (body.length > 0 && body[body.length - 1]!.empty) body.pop();
  return body.length === 0 ? null : { headerLines, body };
}

/**
 * The statistic every test column of the header names, with its df ("F (1,128)"), and how many such columns the
 * header names; null when there is none, when two differ (in statistic or df), or when the header also names a
 * p, df, a written result or a statistic without its df.
 */
function sharedStatisticName(headerLines: Line[]): { text: string; columns: number } | null {
  let name: string | null = null;
  let key: string | null = null;
  let columns = 0;
  for (const line of headerLines) {
    const text = line.text.trim();
    if (/^From:\s/.test(text)) continue;
    for (const match of text.matchAll(STATISTIC_WITH_DF)) {
      const role = classifyHeader(match[0]);
      if (role.role !== 'statistic' || role.df.length !== (role.kind === 'F' ? 2 : 1)) return null;
      const thisKey = `${role.kind} ${role.df.map((df) => df.value).join(',')}`;
      if (key !== null && thisKey !== key) return null;
      key = thisKey;
      name ??= match[0];
      columns++;
    }
    // (What is left must name no other test column: a p, df, or a statistic whose df are elsewhere.)
    for (const word of text.replace(STATISTIC_WITH_DF, ' ').split(/[\s,;]+/)) {
      if (word === '') continue;
      const role = classifyHeader(word).role;
      if (role === 'p' || role === 'df' || role === 'df1' || role === 'df2' || role === 'result' || role === 'statistic') return null;
    }
  }
  return name === null ? null : { text: name, columns };
}

/**
 * The marked statistic cells of the body, each with the effect size on the line after it and the text cells
 * before its run of values as its label; null when a run holds a marked number before an unmarked one, or more
 * marked cells than the header has test columns.
 */
function markedCells(body: Cell[], columns: number): MarkedCell[] | null {
  const found: MarkedCell[] = [];
  let label: string[] = [];
  let index = 0;
  while (index < body.length) {
    const cell = body[index]!;
    if (!cell.empty && !OPENS_WITH_NUMBER.test(cell.text) && effectOf(cell.text) === null) {
      label.push(cell.text);
      index++;
      continue;
    }
    if (!cell.empty && WORDS.test(cell.text) && effectOf(cell.text) === null && splitMarked(cell) === null) {
      label.push(cell.text);
      index++;
      continue;
    }
    // A run of values: descriptive cells first, then the marked statistics.
    const inRun: MarkedCell[] = [];
    let unmarkedAfterMarked = false;
    /** The body index of the last cell that held a marked statistic. */
    let lastMarkedAt = -1;
    for (; index < body.length; index++) {
      const value = body[index]!;
      if (value.empty) continue;
      const effect = effectOf(value.text);
      if (effect !== null) {
        const last = inRun[inRun.length - 1];
        // (An effect size right under a marked statistic is that statistic's; elsewhere it belongs to no statistic read here.)
        if (last !== undefined && last.effect === null && lastMarkedAt === index - 1) last.effect = { symbol: effect.symbol, value: { ...value, text: effect.value, start: value.end - effect.value.length } };
        continue;
      }
      if (!OPENS_WITH_NUMBER.test(value.text) || WORDS.test(value.text)) break;
      const statistics = splitMarked(value);
      if (statistics === null) {
        if (inRun.length > 0) unmarkedAfterMarked = true;
        continue;
      }
      for (const statistic of statistics) inRun.push({ statistic, effect: null, label: labelOf(label) });
      lastMarkedAt = index;
    }
    if (unmarkedAfterMarked || inRun.length > columns) return null;
    found.push(...inRun);
    label = [];
  }
  return found;
}

/**
 * The marked statistics a cell holds, one or more side by side (".10, n.s. 15.05***", two columns' cells on one
 * line), each as a cell of its own; null when the cell holds anything else (an unmarked number among them too).
 */
function splitMarked(cell: Cell): Cell[] | null {
  const words: { text: string; start: number }[] = [];
  let at = 0;
  for (const word of cell.text.split(' ')) {
    if (word !== '') words.push({ text: word, start: cell.start + at });
    at += word.length + 1;
  }
  const statistics: Cell[] = [];
  for (let index = 0; index < words.length; index++) {
    const word = words[index]!;
    if (STARRED_NUMBER.test(word.text)) {
      statistics.push({ text: word.text, start: word.start, end: word.start + word.text.length, line: cell.line, empty: false });
      continue;
    }
    const next = words[index + 1];
    if (!NUMBER_BEFORE_NS.test(word.text) || next === undefined || !NOT_SIGNIFICANT.test(next.text)) return null;
    const end = next.start + next.text.length;
    statistics.push({ text: cell.text.slice(word.start - cell.start, end - cell.start), start: word.start, end, line: cell.line, empty: false });
    index++;
  }
  return statistics.length === 0 || statistics.some((statistic) => readCell(statistic.text, 'either').kind !== 'number') ? null : statistics;
}

/**
 * A row's label from the text cells before its values, without the names of what its descriptive cells hold
 * ("Accelerated M" / "SD" over a mean and its SD): a label ending in "SD" reads as a row of descriptive values.
 */
function labelOf(cells: readonly string[]): string {
  const words = cells.join(' ').split(' ');
  while (words.length > 0 && classifyHeader(words[words.length - 1]!).role === 'descriptive') words.pop();
  return words.join(' ');
}

/** An effect size written with its symbol ("η2 = .18", "d = 0.41"): the symbol and the value's text; null otherwise. */
function effectOf(text: string): { symbol: string; value: string } | null {
  const equals = text.indexOf('=');
  if (equals <= 0 || text.indexOf('=', equals + 1) !== -1) return null;
  const symbol = text.slice(0, equals).trim();
  const value = text.slice(equals + 1).trim();
  if (symbol.length > 12 || classifyHeader(symbol).role !== 'effect' || readCell(value, 'either').kind !== 'number') return null;
  return { symbol, value };
}

function spanOf(cell: { start: number; end: number }): CellSpan {
  return { start: cell.start, end: cell.end };
}
