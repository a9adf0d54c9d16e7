/**
 * Cell statistics of a factorial design printed as a table: the rows and
 * columns are levels of two or three factors, and each cell holds a mean
 * with its SD (and perhaps its n). The shapes read:
 *
 * - a grid: one or two label columns of row levels, a column per level of
 *   another factor, cells "4.21 (1.10)" (the caption, a header or a note
 *   saying they are means and SDs);
 * - a grid with M, SD (and n) sub-columns under each column level (a
 *   spanning header row above the M/SD row names the levels);
 * - long format: one label column per factor (a factor's level written only
 *   where it changes, the rows below it left blank), then M, SD and n;
 * - group headings: a row holding only a level ("Low load") above the rows
 *   it covers, which then carry that level as one more factor.
 *
 * Marginal rows and columns ("Total", "Overall", "Marginal", "All") are
 * skipped. A label cell in which a plain-text copy ran two label columns
 * together with a gap ("Low     Younger") is split at the gap.
 *
 * Factor names come from the header over a label column ("Age group"), a
 * cell spanning the column levels ("Load" over "Low", "High"), or a word
 * all of a factor's levels share ("Low load", "High load": "load"); a
 * factor nothing names keeps null, and the linker may name it from the
 * F tests' labels by elimination.
 *
 * Only a full factorial (every combination of levels exactly once, every
 * cell with a mean and an SD) of two or three factors is returned: anything
 * else is not a design whose F tests follow from the cells. Work is linear
 * in the table's size; every cell is short (readCell caps it).
 */

import type { DocumentTable } from '../../documents/types.js';
import type { CellDescriptives, FactorialCellSet, ReportedNumber } from '../types.js';
import { decimalSeparatorOf, headerKey, readCell, type DecimalSeparator } from '../tables/cells.js';
import { commaNumberAsPoint } from '../cursor.js';
import { countOf, numberOf } from '../descriptives/readTableDescriptives.js';
import { parseReportedNumber } from '../../stats/reportedNumber.js';

/** Largest table considered (rows); a cell table of a three-factor design is a few dozen rows. */
const MAX_ROWS = 200;
/** Largest number of cells accepted (a 4 x 4 x 4 design, and a little more). */
const MAX_CELLS = 80;

type Role = 'mean' | 'sd' | 'n' | 'mean-sd' | 'other';

/** The role a header cell names. */
export function statisticRole(cell: string): Role {
  const key = headerKey(cell).replace(/[.:]$/, '');
  if (/^(?:m|mean|means|average)$/.test(key)) return 'mean';
  if (/^(?:sd|s\.d|sds|std\. dev|std dev|standard deviation)$/.test(key)) return 'sd';
  if (/^(?:n|group size|size|cell size)$/.test(key)) return 'n';
  if (/^(?:m \(sd\)|mean \(sd\)|means \(sds\)|mean \(standard deviation\)|m \(sd\), n)$/.test(key)) return 'mean-sd';
  return 'other';
}

/** A label naming a margin rather than a level. */
export function isMarginLabel(label: string): boolean {
  return /^(?:total|overall|all|marginal|margin|combined|grand|sample|row means?|column means?|mean|average)\b/i.test(label.trim());
}

/** The caption, headers or notes say the cells are means with SDs in brackets. */
const PAIRS_DECLARED = /\bM\s?\(\s?SD\s?\)|\bmeans?\s?\(\s?(?:SDs?|standard deviations?)\s?\)|\bmeans? and (?:\(\s?)?standard deviations?|\bstandard deviations? in (?:brackets|parenthes[ei]s)/i;

const PER_CELL = /\bn\s?=\s?(\d{1,5})\s?(?:per|in each|for each|each)\s(?:group|condition|cell)s?\b|\b(\d{1,5})\s(?:participants\s|people\s|adults\s|children\s|students\s)?(?:per|in each|in every)\s(?:cell|group|condition)\b/i;

/** "3.47 (1.21)" -> mean and SD (decimal commas in a table written with them). */
export function meanSdPair(cell: string | undefined, separator: DecimalSeparator): { mean: ReportedNumber; sd: ReportedNumber } | null {
  if (cell === undefined || cell.length > 40) return null;
  const match = /^\s*(-?\d{0,7}[.,]?\d{1,7})\s?\(\s?(\d{0,7}[.,]?\d{1,7})\s?\)\s*$/.exec(cell.replace(/\u2212/g, '-'));
  if (!match) return null;
  const asPoint = (written: string): string => (separator === ',' ? written.replace(',', '.') : commaNumberAsPoint(written));
  const mean = parseReportedNumber(asPoint(match[1]!));
  const sd = parseReportedNumber(asPoint(match[2]!));
  return mean && sd ? { mean, sd } : null;
}

/** A cell holding a value (a number or a mean-SD pair), not a label. */
function holdsValue(cell: string, separator: DecimalSeparator): boolean {
  return numberOf(cell, separator) !== null || meanSdPair(cell, separator) !== null;
}

/** A level as written, without footnote marks and surrounding punctuation. */
function cleanLevel(text: string): string {
  let end = text.length;
  // Trailing footnote marks and punctuation ("Older^a", "Older*", "Older:").
  while (end > 0 && /[\s*^†‡§¶:,;.a-z]/.test(text[end - 1]!) && !/[A-Za-z]{2}$/.test(text.slice(0, end))) end--;
  return text.slice(0, end).replace(/\s+/g, ' ').trim();
}

/** Splits a label cell that a copy ran together with its neighbour ("Low     Younger"). */
function splitAtGaps(cell: string): string[] {
  if (!/\S(?:\s{2,}|\t)\S/.test(cell)) return [cell];
  const parts: string[] = [];
  let current = '';
  let spaces = '';
  for (const character of cell.trim()) {
    if (character === ' ' || character === '\t') {
      spaces += character;
      continue;
    }
    if (spaces.length >= 2 || spaces.includes('\t')) {
      parts.push(current);
      current = '';
    } else current += spaces;
    spaces = '';
    current += character;
  }
  parts.push(current);
  return parts;
}

/** Leading cells of a row that hold no value (labels, or blanks standing for the level above). */
function leadingLabelCount(row: readonly string[], separator: DecimalSeparator): number {
  let count = 0;
  while (count < row.length && !holdsValue(row[count]!, separator)) count++;
  return count;
}

/** The word (3 letters or more) every level shares, which names their factor ("Low load", "High load": "load"). */
function sharedWord(levels: readonly string[]): string | null {
  const words = (level: string): string[] => level.toLowerCase().split(/[\s-]+/).filter((word) => /^[a-z]{3,}$/.test(word));
  const [first, ...rest] = levels;
  if (first === undefined || rest.length === 0) return null;
  const shared = words(first).filter((word) => rest.every((level) => words(level).includes(word)));
  return shared.length === 1 ? shared[0]! : null;
}

interface ColumnGroup {
  /** The column level this group stands for, or null when there is only one group (no column factor). */
  level: string | null;
  mean: number;
  sd: number | null;
  n: number | null;
  paired: boolean;
  /** True when the header names M and SD columns (levels then stand in the row above). */
  fromRoles: boolean;
}

/** The value columns' groups: one per level of the column factor (or one group and no column factor). */
function columnGroups(header: readonly string[], upper: readonly string[] | null, labelCount: number, pairsDeclared: boolean, sampleRow: readonly string[][], separator: DecimalSeparator): ColumnGroup[] | null {
  const roles = header.map((cell, index) => (index < labelCount ? 'other' : statisticRole(cell)));
  const groups: ColumnGroup[] = [];
  if (roles.some((role) => role === 'mean' || role === 'mean-sd')) {
    for (let column = labelCount; column < roles.length; column++) {
      const role = roles[column];
      if (role !== 'mean' && role !== 'mean-sd') continue;
      let sd: number | null = null;
      let n: number | null = null;
      for (let next = column + 1; next < roles.length && roles[next] !== 'mean' && roles[next] !== 'mean-sd'; next++) {
        if (roles[next] === 'sd' && sd === null) sd = next;
        if (roles[next] === 'n' && n === null) n = next;
      }
      // An n column before the first M column serves every group ("n | M | SD").
      if (n === null) {
        const before = roles.slice(labelCount, column).lastIndexOf('n');
        if (before >= 0) n = labelCount + before;
      }
      let level: string | null = null;
      if (upper !== null) {
        for (let left = column; left >= labelCount; left--) {
          if ((upper[left] ?? '').trim() !== '') {
            level = cleanLevel(upper[left]!);
            break;
          }
        }
      }
      groups.push({ level, mean: column, sd, n, paired: role === 'mean-sd', fromRoles: true });
    }
    if (groups.length === 1) groups[0]!.level = null;
    else if (groups.some((group) => group.level === null || group.level === '' || isMarginLabel(group.level))) {
      // Side-by-side groups must each be a level; a margin group ("Total") is dropped.
      const kept = groups.filter((group) => group.level !== null && group.level !== '' && !isMarginLabel(group.level));
      if (kept.length < 2) return null;
      return kept;
    }
    return groups;
  }
  // No M/SD header: each value column is a level whose cells are "mean (SD)", when something says so.
  if (!pairsDeclared) return null;
  for (let column = labelCount; column < header.length; column++) {
    const level = cleanLevel(header[column] ?? '');
    if (level === '' || isMarginLabel(level)) continue;
    if (!sampleRow.some((row) => meanSdPair(row[column], separator) !== null)) continue;
    groups.push({ level, mean: column, sd: null, n: null, paired: true, fromRoles: false });
  }
  return groups.length >= 2 ? groups : null;
}

interface BodyRow {
  labels: string[];
  values: string[];
}

/**
 * Reads a table as the cell statistics of a factorial design, or returns
 * null. `tableIndex` is the table's place among the document's tables.
 */
export function readCellTable(table: DocumentTable, tableIndex: number): FactorialCellSet | null {
  if (table.rows.length < 3 || table.rows.length > MAX_ROWS) return null;
  const separator = decimalSeparatorOf(table.rows);
  const rows = table.rows.map((row) => (row.length === 0 ? row : [...splitAtGaps(row[0]!), ...row.slice(1)]));
  let headerCount = rows.findIndex((row) => row.some((cell, index) => index > 0 && holdsValue(cell, separator)));
  // A group heading ("Low load" alone in its row) right above the first values belongs to the body.
  const headingOnly = (row: readonly string[]): boolean => (row[0] ?? '').trim() !== '' && row.slice(1).every((cell) => cell.trim() === '');
  while (headerCount > 1 && headingOnly(rows[headerCount - 1]!)) headerCount--;
  if (headerCount < 1 || headerCount > 3) return null;
  const body = rows.slice(headerCount);
  const labelCount = Math.max(...body.map((row) => (row.some((cell) => holdsValue(cell, separator)) ? leadingLabelCount(row, separator) : 0)));
  if (labelCount < 1 || labelCount > 3) return null;
  const context = [table.caption ?? '', ...table.notes, ...rows.slice(0, headerCount).flat()].join(' ');
  // The header rows laid out as the body is: their label part as wide as the body's.
  const layHeader = (row: readonly string[]): string[] => {
    const leading = leadingLabelCount(row, separator);
    const labels = row.slice(0, Math.min(leading, labelCount));
    const rest = row.slice(labels.length);
    return [...Array.from({ length: labelCount - labels.length }, () => ''), ...labels, ...rest];
  };
  const headers = rows.slice(0, headerCount).map((row) => {
    // A header's label part is as long as the body's when its label cells were split or padded the same way.
    const width = Math.max(...body.map((r) => r.length - leadingLabelCount(r, separator))) + labelCount;
    return row.length >= width ? [...row] : layHeader(row);
  });
  const header = headers[headerCount - 1]!;
  const upper = headerCount >= 2 ? headers[headerCount - 2]! : null;

  // Body rows with their label path (blanks carry the level above) and group headings.
  const bodyRows: BodyRow[] = [];
  let carried: string[] = Array.from({ length: labelCount }, () => '');
  let heading: string | null = null;
  const headingRows: string[] = [];
  let rowsBeforeHeading = 0;
  for (const row of body) {
    const hasValue = row.some((cell) => holdsValue(cell, separator));
    if (!hasValue) {
      const texts = row.map((cell) => cell.trim()).filter((cell) => cell !== '');
      if (texts.length === 1) {
        heading = cleanLevel(texts[0]!);
        headingRows.push(heading);
        carried = Array.from({ length: labelCount }, () => '');
      }
      continue;
    }
    if (heading === null) rowsBeforeHeading++;
    const leading = leadingLabelCount(row, separator);
    const own = row.slice(0, leading).map((cell) => cleanLevel(cell));
    // Fewer label cells than the widest row: they are the innermost levels, the outer ones carried.
    const labels = [...carried.slice(0, labelCount - own.length), ...own].map((label, index) => (label === '' ? (carried[index] ?? '') : label));
    carried = labels;
    bodyRows.push({ labels: heading === null ? labels : [heading, ...labels], values: [...Array.from({ length: labelCount }, () => ''), ...row.slice(leading)] });
  }
  if (headingRows.length > 0 && rowsBeforeHeading > 0) return null;
  const rowFactorCount = labelCount + (headingRows.length > 0 ? 1 : 0);

  const pairsDeclared = PAIRS_DECLARED.test(context);
  const groups = columnGroups(header, upper, labelCount, pairsDeclared, bodyRows.map((row) => row.values), separator);
  if (groups === null) return null;
  const columnFactor = groups[0]!.level !== null;

  const perCell = PER_CELL.exec([table.caption ?? '', ...table.notes].join(' '));
  const statedN = perCell ? Number(perCell[1] ?? perCell[2]) : null;
  const cells: CellDescriptives[] = [];
  for (const row of bodyRows) {
    if (row.labels.some((label) => label === '' || isMarginLabel(label))) continue;
    for (const group of groups) {
      let mean: ReportedNumber | null;
      let sd: ReportedNumber | null;
      if (group.paired) {
        const pair = meanSdPair(row.values[group.mean], separator);
        mean = pair?.mean ?? null;
        sd = pair?.sd ?? null;
      } else {
        mean = numberOf(row.values[group.mean], separator);
        sd = group.sd === null ? null : numberOf(row.values[group.sd], separator);
      }
      if (mean === null || sd === null || sd.value < 0) return null;
      const n = group.n === null ? statedN : countOf(row.values[group.n], separator);
      cells.push({ levels: group.level === null ? [...row.labels] : [...row.labels, group.level], mean, sd, n, start: table.start, end: table.end });
    }
  }
  if (cells.length < 4 || cells.length > MAX_CELLS) return null;

  // Factors: the row label columns (and headings), then the column levels; a dimension with one level is no factor.
  const dimensionCount = rowFactorCount + (columnFactor ? 1 : 0);
  const levelsOf = Array.from({ length: dimensionCount }, (_, d) => [...new Set(cells.map((cell) => cell.levels[d]!))]);
  const labelHeaders = (column: number): string | null => {
    for (let r = headerCount - 1; r >= 0; r--) {
      const text = cleanLevel(headers[r]![column] ?? '');
      if (text !== '' && statisticRole(text) === 'other' && !isMarginLabel(text)) return text;
    }
    return null;
  };
  const names: (string | null)[] = [];
  if (headingRows.length > 0) names.push(null);
  // Under group headings the header over the label column names the rows as a whole, not one factor.
  for (let column = 0; column < labelCount; column++) names.push(headingRows.length > 0 ? null : labelHeaders(column));
  if (columnFactor) names.push(columnFactorName(headers, headerCount, groups));
  const kept = levelsOf.map((levels, d) => (levels.length >= 2 ? d : -1)).filter((d) => d >= 0);
  if (kept.length < 2 || kept.length > 3) return null;
  const factors = kept.map((d) => names[d] ?? sharedWord(levelsOf[d]!));
  const levels = kept.map((d) => levelsOf[d]!);
  const finalCells = cells.map((cell) => ({ ...cell, levels: kept.map((d) => cell.levels[d]!) }));
  if (!isFullFactorial(levels, finalCells)) return null;
  const allN = finalCells.every((cell) => cell.n !== null);
  const someN = finalCells.some((cell) => cell.n !== null);
  return {
    source: 'table',
    factors,
    levels,
    // A table printing some ns and not others gives none that can be trusted for all.
    cells: allN || !someN ? finalCells : finalCells.map((cell) => ({ ...cell, n: null })),
    nSource: allN ? (groups.some((group) => group.n !== null) ? 'cell' : 'statement') : null,
    measure: (table.caption ?? '').slice(0, 200),
    tableIndex,
    tableNumber: /\bTable\s+([A-Z]?\d{1,3}[A-Za-z]?)/.exec(table.caption ?? '')?.[1] ?? null,
    start: table.start,
    end: table.end,
    integerScale: null,
  };
}

/**
 * The name over the column levels: the one cell of the header row above the
 * levels' row that stands over their columns ("Load" over "Low", "High").
 */
function columnFactorName(headers: readonly string[][], headerCount: number, groups: readonly ColumnGroup[]): string | null {
  // Levels over M/SD sub-columns sit in the row above the M/SD row; levels of "mean (SD)" columns in the last row.
  const levelRow = groups[0]!.fromRoles ? headerCount - 2 : headerCount - 1;
  const above = levelRow - 1;
  if (above < 0) return null;
  const first = Math.min(...groups.map((group) => group.mean));
  const texts = headers[above]!.slice(first).map((cell) => cell.trim()).filter((cell) => cell !== '');
  return texts.length === 1 && statisticRole(texts[0]!) === 'other' ? cleanLevel(texts[0]!) : null;
}

/** Every combination of levels exactly once. */
function isFullFactorial(levels: readonly string[][], cells: readonly { levels: readonly string[] }[]): boolean {
  const expected = levels.reduce((product, list) => product * list.length, 1);
  if (cells.length !== expected) return false;
  const seen = new Set(cells.map((cell) => JSON.stringify(cell.levels)));
  return seen.size === expected;
}
