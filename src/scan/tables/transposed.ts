/**
 * Tables printed on their side: the tests are columns and the statistics
 * are rows, each row named by its statistic ("T (14)", "F (1, 28)", "t",
 * "df", "P", "η2") and holding one value per column:
 *
 *     Subtest      Rhythm     Melodies   Chords
 *     T (14)       10.07      3.48       −0.61
 *     P            <0.0001*   0.004*     0.55
 *
 * Copies give such a table one cell per line, as pipe rows or as crushed
 * lines; this reader does not need to know which: it reads the cells after
 * a "Table N" title in order, and wherever a cell names a statistic it takes
 * the run of values after it. A run under a p name (or df, or an effect
 * size) is paired with the earlier statistic run of the same length that
 * has none yet, value by value. The pairs become a table of one row per
 * test ("statistic | df | p | effect"), with each cell pointing at where it
 * is printed, for the table reader to read like any other.
 *
 * A statistic run is kept only when a p run of its length pairs with it:
 * a lone row of numbers under a statistic's name says too little.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { tableUnderTitle } from './rebuilt.js';
import { classifyHeader, ERROR_LABEL, headerKey, readCell, statisticOfTwo, TABLE_TITLE, TOTAL_LABEL, type ColumnRole, type LineCell, type TextLine } from './cells.js';

type Line = TextLine;

type Cell = LineCell;

/** Most lines after the title looked at. */
const MAX_LINES = 400;
/** Most blank lines in a row inside the table. */
const MAX_BLANK_RUN = 2;
/** A longer line is prose and ends the table (once a statistic's row was seen). */
const MAX_CELL_LENGTH = 120;
/** Most values in one statistic's run (columns of one table). */
const MAX_RUN = 60;

const NOTE = /^\s{0,8}(?:(?:\*|_){0,2}Notes?(?:\*|_){0,2}\s*[.:]|\*{1,3}\s*p\s*[<\u2264=]|\d{1,2}\.\s+\*)/;

type RunKind = 'statistic' | 'p' | 'df' | 'effect';

interface Run {
  kind: RunKind;
  name: Cell;
  role: ColumnRole;
  values: Cell[];
  /** Index of the statistic run this run was paired with (p, df and effect runs). */
  pairedWith?: number;
}

/** A transposed table after the title at `lines[titleLine]`, or null. */
export function readTransposedTable(lines: Line[], titleLine: number): { table: DocumentTable; lastLine: number } | null {
  const title = lines[titleLine];
  if (title === undefined || !TABLE_TITLE.test(title.text)) return null;
  const cells = collectCells(lines, titleLine + 1);
  const runs = readRuns(cells, (nameLine) => lines.slice(titleLine + 1, nameLine).map((line) => line.text).join('\n'));
  pairRuns(runs);
  const kindOf = (run: Run): string => (run.role.role === 'statistic' ? run.role.kind : '');
  const paired = runs.filter((run, index) => run.kind === 'statistic' && runs.some((other) => other.kind === 'p' && other.pairedWith === index));
  if (paired.length === 0) return null;
  // The rows of one kind of statistic (the first paired one), so that the rebuilt table has one set of df columns.
  const kind = kindOf(paired[0]!);
  const header = kind === 'F' ? ['', 'F', 'df1', 'df2', 'p'] : ['', kind, 'df', 'p'];
  const effectNames: string[] = [];
  for (const run of runs) {
    if (run.kind === 'effect' && run.pairedWith !== undefined && kindOf(runs[run.pairedWith]!) === kind && !effectNames.includes(run.name.text)) effectNames.push(run.name.text);
  }
  const labels = readLabelRun(cells);
  const rows: string[][] = [[...header, ...effectNames]];
  const spans: (CellSpan | null)[][] = [rows[0]!.map(() => null)];
  let lastCell = paired[0]!.name;
  runs.forEach((run, index) => {
    if (run.kind !== 'statistic' || kindOf(run) !== kind) return;
    const partners = runs.filter((other) => other.pairedWith === index);
    const p = partners.find((other) => other.kind === 'p');
    if (p === undefined) return;
    const errorDf = kind === 'F' ? errorDfOf(runs, run, labels) : null;
    const dfRun = errorDf?.run ?? partners.find((other) => other.kind === 'df');
    const labelDf = dfInName(run.name);
    // Row names from the label column printed before the values (column by column), when it names each test.
    const rowNames = labels !== null && labels.length >= run.values.length && labels.slice(run.values.length).every(isErrorOrTotal) ? labels : null;
    run.values.forEach((printed, at) => {
      // A value printed with its df ("4.21 (2, 57)") gives the value and the df apart.
      const withDf = isValue(printed) ? null : partsOf(printed, VALUE_WITH_DF_CELL);
      const value = withDf?.[0] ?? printed;
      const row: string[] = [rowNames?.[at]?.text ?? `${run.name.text} [${at + 1}]`, value.text];
      // (The name is not the row's start: the result is read from its value to its p.)
      const rowSpans: (CellSpan | null)[] = [null, spanOf(value)];
      const dfCell = dfRun?.values[at];
      const dfWidth = kind === 'F' ? 2 : 1;
      const printedDf: (Cell | null)[] =
        withDf !== null ? withDf.slice(1) : errorDf !== null && dfCell !== undefined ? [dfCell, errorDf.cell] : dfCell !== undefined ? (partsOf(dfCell, DF_PAIR_CELL) ?? [dfCell]) : labelDf;
      // (Two df printed for a t, or one for an F, say something else: the row is read without them.)
      const dfCells = printedDf.length === 0 || printedDf.length === dfWidth || (kind === 'F' && printedDf.length === 1 && dfCell !== undefined) ? printedDf : [];
      for (let slot = 0; slot < dfWidth; slot++) {
        const dfCell = dfCells[slot] ?? null;
        row.push(dfCell?.text ?? '');
        rowSpans.push(dfCell === null ? null : spanOf(dfCell));
      }
      row.push(p.values[at]!.text);
      rowSpans.push(spanOf(p.values[at]!));
      for (const name of effectNames) {
        const effect = partners.find((other) => other.kind === 'effect' && other.name.text === name);
        row.push(effect?.values[at]?.text ?? '');
        rowSpans.push(effect?.values[at] ? spanOf(effect.values[at]!) : null);
      }
      rows.push(row);
      spans.push(rowSpans);
    });
    for (const partner of partners) {
      const last = partner.values[partner.values.length - 1]!;
      if (last.end > lastCell.end) lastCell = last;
    }
  });
  if (rows.length < 2) return null;
  return {
    table: tableUnderTitle(title, lastCell.end, rows, spans, 'positions'),
    lastLine: lastCell.line,
  };
}

/**
 * The row labels of a table copied column by column: the cells after a label column's name ("Source",
 * "Effect") up to the next column's name or value, or null. (A PDF's text often gives a table so, one
 * column after another: "Source / Group / Time / Error / df / 1 / 2 / 114 / F / 4.21 / 3.15 / p / ...".)
 */
function readLabelRun(cells: (Cell | null)[]): Cell[] | null {
  const first = cells.findIndex((cell) => cell !== null && cell.text.length <= 40 && classifyHeader(cell.text).role === 'label');
  if (first < 0) return null;
  const labels: Cell[] = [];
  for (let at = first + 1; at < cells.length && labels.length < MAX_RUN; at++) {
    const cell = cells[at];
    if (cell === null || cell === undefined || isValue(cell) || cell.text.length > 80) break;
    if (classifyHeader(cell.text).role !== 'unknown') break;
    labels.push(cell);
  }
  return labels.length > 0 ? labels : null;
}

function isErrorOrTotal(label: Cell): boolean {
  const key = headerKey(label.text);
  return ERROR_LABEL.test(key) || TOTAL_LABEL.test(key);
}

/**
 * The error df of an F run in a table copied column by column: a df run one value longer than the F run
 * (or two, with a Total), where the labels after the tests' own name the error term (and the total). The
 * error df is the df printed at the error term's place; the run's first values are the tests' own df.
 */
function errorDfOf(runs: Run[], statistic: Run, labels: Cell[] | null): { run: Run; cell: Cell } | null {
  if (labels === null) return null;
  const count = statistic.values.length;
  if (runs.some((run) => run.kind === 'df' && run.pairedWith !== undefined && runs[run.pairedWith] === statistic)) return null;
  for (const run of runs) {
    if (run.kind !== 'df' || run.pairedWith !== undefined || run.values.length !== labels.length) continue;
    const extra = run.values.length - count;
    if (extra < 1 || extra > 2) continue;
    const after = labels.slice(count);
    if (!ERROR_LABEL.test(headerKey(after[0]!.text)) || !after.slice(1).every((label) => TOTAL_LABEL.test(headerKey(label.text)))) continue;
    // Whole numbers only: the test's df and the error's.
    if (!run.values.every((cell) => /^\d{1,6}$/.test(cell.text))) continue;
    return { run, cell: run.values[count]! };
  }
  return null;
}

function spanOf(cell: Cell): CellSpan {
  return { start: cell.start, end: cell.end };
}

/** The df printed in a statistic's name, "T (14)", "F (1, 28)", as cells pointing into the name. */
function dfInName(name: Cell): (Cell | null)[] {
  // (Or written out as a subscript after the name: "Chisquare (χ^{2 })_{df = 3}".)
  const match = /\(\s*(\d+(?:\.\d+)?)\s*(?:,\s*(\d+(?:\.\d+)?)\s*)?\)/.exec(name.text) ?? /_\{ ?df ?= ?(\d{1,4}) ?\} ?$/.exec(name.text);
  if (!match) return [];
  const found: Cell[] = [];
  let from = match.index;
  for (const written of [match[1], match[2]]) {
    if (written === undefined) continue;
    const offset = name.text.indexOf(written, from);
    from = offset + written.length;
    found.push({ text: written, start: name.start + offset, end: name.start + offset + written.length, line: name.line });
  }
  return found;
}

/** What a name cell starts: a statistic's run, a p, df or effect-size run, or nothing. */
function runKindOf(role: ColumnRole): RunKind | null {
  if (role.role === 'statistic') return 'statistic';
  if (role.role === 'p') return 'p';
  if (role.role === 'df') return 'df';
  if (role.role === 'effect') return 'effect';
  return null;
}

function isValue(cell: Cell): boolean {
  return readCell(cell.text, 'either').kind === 'number';
}

/** A df pair as one cell of a df row: "2, 57", "(2, 57)", "2/57", "1.87; 108.2" (a point for decimals only). */
const DF_PAIR_CELL = /^\(? ?(\d{1,4}(?:\.\d{1,2})?) ?[,;/] ?(\d{1,5}(?:\.\d{1,2})?) ?\)?$/;
/** A statistic with its df in brackets as one cell of a statistic's row: "4.21 (2, 57)", "−2.10 [58]", "3.4(1,40)**". */
const VALUE_WITH_DF_CELL = /^([-\u2212]?(?:\d{1,4}(?:\.\d{1,4})?|\.\d{1,4})\*{0,3}) ?[([] ?(\d{1,4}(?:\.\d{1,2})?)(?: ?[,;] ?(\d{1,5}(?:\.\d{1,2})?))? ?[)\]]\*{0,3}$/;

/** Whether a cell can stand in a run of this kind: a number, or a df pair (df rows), or a value with its df (statistic rows). */
function isRunValue(cell: Cell, kind: RunKind): boolean {
  if (isValue(cell)) return true;
  if (kind === 'df') return DF_PAIR_CELL.test(cell.text);
  if (kind === 'statistic') return VALUE_WITH_DF_CELL.test(cell.text);
  return false;
}

/** The parts of a cell matched by `pattern`'s groups, as cells pointing into it. */
function partsOf(cell: Cell, pattern: RegExp): Cell[] | null {
  const match = pattern.exec(cell.text);
  if (!match) return null;
  const parts: Cell[] = [];
  let from = 0;
  for (const written of match.slice(1)) {
    if (written === undefined) continue;
    const offset = cell.text.indexOf(written, from);
    from = offset + written.length;
    parts.push({ text: written, start: cell.start + offset, end: cell.start + offset + written.length, line: cell.line });
  }
  return parts;
}

/** Every name cell with the run of values right after it (an empty cell or a text cell ends a run). */
function readRuns(cells: (Cell | null)[], textAbove: (line: number) => string = () => ''): Run[] {
  const runs: Run[] = [];
  for (let index = 0; index < cells.length; index++) {
    const cell = cells[index];
    if (cell === null || cell === undefined || cell.text.length > 40) continue;
    const named = classifyHeader(cell.text);
    const role = named.role === 'result' ? (statisticOfTwo(cell.text, textAbove(cell.line)) ?? named) : named;
    const kind = runKindOf(role);
    if (kind === null) continue;
    const values: Cell[] = [];
    let at = index + 1;
    while (at < cells.length && values.length < MAX_RUN) {
      const next = cells[at];
      if (next === null || next === undefined || !isRunValue(next, kind)) break;
      values.push(next);
      at++;
    }
    if (values.length === 0) continue;
    runs.push({ kind, name: cell, role, values });
    index = at - 1;
  }
  return runs;
}

/** Pairs each p, df and effect run with the earliest statistic run of its length that has no such partner yet. */
function pairRuns(runs: Run[]): void {
  runs.forEach((run, index) => {
    if (run.kind === 'statistic') return;
    for (let candidate = 0; candidate < runs.length; candidate++) {
      const statistic = runs[candidate]!;
      if (statistic.kind !== 'statistic' || statistic.values.length !== run.values.length) continue;
      if (runs.some((other) => other.pairedWith === candidate && other.kind === run.kind && (run.kind !== 'effect' || other.name.text === run.name.text))) continue;
      // The partner stands after its statistic, or (df) right before it.
      if (candidate > index && !(run.kind === 'df' && candidate === index + 1)) continue;
      run.pairedWith = candidate;
      return;
    }
  });
}

/**
 * The cells after the title, in reading order: a line with pipes gives its
 * cells, a line with wide gaps its columns, a crushed line its name and its
 * trailing values, any other line one cell; a line of spaces is an empty
 * cell (null), which ends a run.
 */
function collectCells(lines: Line[], from: number): (Cell | null)[] {
  const cells: (Cell | null)[] = [];
  let blankRun = 0;
  let statisticSeen = false;
  let closedCopy = false;
  for (let index = from; index < lines.length && index - from <= MAX_LINES; index++) {
    const line = lines[index]!;
    // (A pipe that closes the cell above it, or a line joined onto it: no cell, and no blank line either. In such a
    // copy a lone pipe after one is an empty cell between pipes, which a pipe row's pieces skip too: "Z" / "|" / "|" /
    // "-4.576" reads as "| Z | | -4.576 |" does.)
    if (line.closesCell === true) {
      closedCopy = true;
      continue;
    }
    if (closedCopy && line.text.trim() === '|') continue;
    if (line.text.length === 0) {
      if (++blankRun > MAX_BLANK_RUN) break;
      continue;
    }
    blankRun = 0;
    if (line.text.trim() === '' || /^[\s|]+$/.test(line.text)) {
      cells.push(null);
      continue;
    }
    const trimmed = line.text.trim();
    if (NOTE.test(line.text) || (index > from && TABLE_TITLE.test(line.text))) break;
    if (trimmed.length > MAX_CELL_LENGTH) {
      if (statisticSeen) break;
      continue;
    }
    for (const piece of piecesOf(line.text)) {
      if (piece === null) {
        cells.push(null);
        continue;
      }
      const cell = { text: piece.text, start: line.start + piece.start, end: line.start + piece.end, line: index };
      if (classifyHeader(cell.text).role === 'statistic') statisticSeen = true;
      cells.push(cell);
    }
  }
  return cells;
}

/** A line's cells with offsets in the line (null for an empty cell between pipes). */
function piecesOf(text: string): ({ text: string; start: number; end: number } | null)[] {
  if (text.includes('|')) {
    const pieces: ({ text: string; start: number; end: number } | null)[] = [];
    let start = 0;
    for (const part of text.split('|')) {
      const end = start + part.length;
      const inner = part.trim();
      if (inner !== '') pieces.push({ text: inner, start: start + part.indexOf(inner), end: start + part.indexOf(inner) + inner.length });
      start = end + 1;
    }
    return pieces;
  }
  // (Words apart by wide gaps: found only for such a line, not for every line of prose.)
  if (/\t| {2,}/.test(text.trim())) return [...text.matchAll(/\S+(?: \S+)*/g)].map((match) => ({ text: match[0], start: match.index!, end: match.index! + match[0].length }));
  // A line of prose after the title that does not end in a number or a bracket is one cell: neither a crushed
  // row's values nor a df pair can end it. (Said before the pieces below are looked for; they come out as one
  // cell for such a line too.)
  if (!endsLikeValue(text)) return [onePiece(text)];
  // A crushed df row of pairs ("df 2, 57 1, 57") or statistic row of values with df ("F 4.21 (2, 57) 2.11 (1, 57)").
  const withPairs = crushedPairPieces(text);
  if (withPairs !== null) return withPairs;
  // A crushed line: a name, then values apart by single spaces ("T (14) 10.07 3.48 −0.61"); the chi-square
  // symbol's 2 set apart ("χ 2 0.918 30.810") belongs to the name.
  const words = [...text.matchAll(/\S+/g)];
  if (words.length >= 2 && /^[\u03c7\u03a7]$/.test(words[0]![0]) && /^[2\u00b2]$/.test(words[1]![0])) words.splice(0, 2, Object.assign([`${words[0]![0]} ${words[1]![0]}`], { index: words[0]!.index!, input: text }) as RegExpExecArray);
  let first = words.length;
  while (first > 0 && readCell(words[first - 1]![0], 'either').kind === 'number') first--;
  if (first === 0 || first === words.length) return [onePiece(text)];
  const nameEnd = words[first - 1]!.index! + words[first - 1]![0].length;
  const nameStart = words[0]!.index!;
  return [
    { text: text.slice(nameStart, nameEnd), start: nameStart, end: nameEnd },
    ...words.slice(first).map((word) => ({ text: word[0], start: word.index!, end: word.index! + word[0].length })),
  ];
}

/** The whole line, trimmed, as one cell. */
function onePiece(text: string): { text: string; start: number; end: number } {
  const inner = text.trim();
  return { text: inner, start: text.indexOf(inner), end: text.indexOf(inner) + inner.length };
}

/**
 * Whether the line's last word could be a value: it ends in a digit, a closing bracket or a star (the ends of
 * CRUSHED_DF_PAIR and CRUSHED_VALUE_WITH_DF), or it reads as a number (readCell, which also takes "n.s."-like
 * marks). Otherwise piecesOf gives the line as one cell.
 */
function endsLikeValue(text: string): boolean {
  let end = text.length;
  while (end > 0 && /\s/.test(text[end - 1]!)) end--;
  if (end === 0) return false;
  const last = text.charCodeAt(end - 1);
  if ((last >= 48 && last <= 57) || last === 41 || last === 93 || last === 42) return true;
  let start = end;
  while (start > 0 && !/\s/.test(text[start - 1]!)) start--;
  return readCell(text.slice(start, end), 'either').kind === 'number';
}

/** One value of a crushed df row or statistic row (see crushedPairPieces), standing between spaces. */
const CRUSHED_DF_PAIR = /(?<=\s)\(? ?\d{1,4}(?:\.\d{1,2})? ?[,;/] ?\d{1,5}(?:\.\d{1,2})? ?\)?(?=\s|$)/g;
const CRUSHED_VALUE_WITH_DF = /(?<=\s)[-\u2212]?(?:\d{1,4}(?:\.\d{1,4})?|\.\d{1,4})\*{0,3} ?[([] ?\d{1,4}(?:\.\d{1,2})?(?: ?[,;] ?\d{1,5}(?:\.\d{1,2})?)? ?[)\]]\*{0,3}(?=\s|$)/g;

/**
 * A crushed line whose values are df pairs under a df name ("df 2, 57 1, 57 2, 57") or values with
 * their df under a statistic's name ("F 4.21 (2, 57) 2.11 (1, 57)"): the name, then one piece per
 * value, or null. The pieces must run from after the name to the end of the line with only spaces
 * between them. (Pairs only under a df name: under any other, "4,21" is a number with a decimal comma.)
 */
function crushedPairPieces(text: string): { text: string; start: number; end: number }[] | null {
  const trimmedEnd = text.trimEnd().length;
  for (const pattern of [CRUSHED_DF_PAIR, CRUSHED_VALUE_WITH_DF]) {
    const units = [...text.matchAll(pattern)];
    if (units.length === 0 || units[units.length - 1]!.index! + units[units.length - 1]![0].length !== trimmedEnd) continue;
    // The run of units that reaches the end of the line, with nothing but spaces between them.
    let first = units.length - 1;
    while (first > 0 && text.slice(units[first - 1]!.index! + units[first - 1]![0].length, units[first]!.index!).trim() === '') first--;
    const nameText = text.slice(0, units[first]!.index!).trim();
    if (!/\p{L}/u.test(nameText)) continue;
    const role = classifyHeader(nameText).role;
    if (role !== (pattern === CRUSHED_DF_PAIR ? 'df' : 'statistic')) continue;
    const nameStart = text.indexOf(nameText);
    return [
      { text: nameText, start: nameStart, end: nameStart + nameText.length },
      ...units.slice(first).map((unit) => ({ text: unit[0], start: unit.index!, end: unit.index! + unit[0].length })),
    ];
  }
  return null;
}
