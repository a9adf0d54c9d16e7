/**
 * Group descriptive statistics in tables (marked-up tables from the
 * document readers, or tables found in plain text by findTextTables):
 *
 * - groups as rows: a label column and columns headed M (Mean), SD and n, or
 *   one column "M (SD)" with cells "3.47 (1.21)"; several measures side by
 *   side when a spanning header row names each M/SD pair ("Recall",
 *   "Recognition");
 * - groups as columns: rows labelled M (Mean), SD and n, a column per group.
 *
 * A table note or caption stating "n = 30 per group" gives the sizes when
 * no n column does. Every cell is short (readCell caps it), so the work is
 * linear in the size of the table.
 */

import type { DocumentTable } from '../../documents/types.js';
import { decimalSeparatorOf, headerKey, readCell, type DecimalSeparator } from '../tables/cells.js';
import { commaNumberAsPoint } from '../cursor.js';
import { parseReportedNumber } from '../../stats/reportedNumber.js';
import type { ReportedNumber } from '../types.js';

export interface TableGroup {
  label: string;
  mean: ReportedNumber;
  sd: ReportedNumber | null;
  n: number | null;
  nSource: 'group' | 'paragraph' | null;
}

export interface TableMeasure {
  /** Name of the measure: the spanning header over its columns, else the caption. */
  measure: string;
  groups: TableGroup[];
}

export interface DescriptiveTable {
  table: DocumentTable;
  /** The table's number as its caption gives it ("Table 2" -> "2"), or null. */
  number: string | null;
  measures: TableMeasure[];
}

type Role = 'mean' | 'sd' | 'n' | 'mean-sd' | 'other';

function roleOf(cell: string): Role {
  const key = headerKey(cell).replace(/[.:]$/, '');
  if (/^(?:m|mean|means|average)$/.test(key)) return 'mean';
  if (/^(?:sd|s\.d|sds|std\. dev|std dev|standard deviation)$/.test(key)) return 'sd';
  if (/^(?:n|group size|size)$/.test(key)) return 'n';
  if (/^(?:m \(sd\)|mean \(sd\)|means \(sds\)|mean \(standard deviation\))$/.test(key)) return 'mean-sd';
  return 'other';
}

const PER_GROUP = /\bn\s?=\s?(\d{1,5})\s?(?:per|in each|for each|each)\s(?:group|condition|cell|arm)s?\b|\b(\d{1,5})\s(?:per|in each|in every)\s(?:group|condition|cell|arm)\b/i;

/** A cell's number as printed (an equality, not a bound), or null. */
export function numberOf(cell: string | undefined, separator: DecimalSeparator): ReportedNumber | null {
  if (cell === undefined) return null;
  const read = readCell(cell, separator);
  return read.kind === 'number' && read.comparator === '=' ? read.number : null;
}

/** A cell's whole number of at least 1 (a group's n), or null. */
export function countOf(cell: string | undefined, separator: DecimalSeparator): number | null {
  const value = numberOf(cell, separator);
  return value !== null && value.decimals === 0 && Number.isInteger(value.value) && value.value >= 1 ? value.value : null;
}

/** "3.47 (1.21)" -> mean and SD; "3,47 (1,21)" in a table written with decimal commas. */
function pairOf(cell: string | undefined, separator: DecimalSeparator): { mean: ReportedNumber; sd: ReportedNumber } | null {
  if (cell === undefined || cell.length > 40) return null;
  const match = /^\s*(-?\d{0,7}[.,]?\d{1,7})\s?\(\s?(\d{0,7}[.,]?\d{1,7})\s?\)\s*$/.exec(cell.replace(/\u2212/g, '-'));
  if (!match) return null;
  const asPoint = (written: string): string => (separator === ',' ? written.replace(',', '.') : commaNumberAsPoint(written));
  const mean = parseReportedNumber(asPoint(match[1]!));
  const sd = parseReportedNumber(asPoint(match[2]!));
  return mean && sd ? { mean, sd } : null;
}

/** Reads a table as descriptive statistics of groups, or returns null. */
export function readDescriptiveTable(table: DocumentTable): DescriptiveTable | null {
  const rows = table.rows;
  if (rows.length < 2 || rows.length > 200) return null;
  const context = [table.caption ?? '', ...table.notes].join(' ');
  const perGroup = PER_GROUP.exec(context);
  const sharedN = perGroup ? Number(perGroup[1] ?? perGroup[2]) : null;
  const number = /\bTable\s+([A-Z]?\d{1,3}[A-Za-z]?)/.exec(table.caption ?? '')?.[1] ?? null;
  const separator = decimalSeparatorOf(rows);
  const measures = readGroupsAsRows(rows, table.caption ?? '', sharedN, separator) ?? readGroupsAsColumns(rows, table.caption ?? '', sharedN, separator);
  if (measures === null || measures.length === 0) return null;
  return { table, number, measures };
}

function readGroupsAsRows(rows: string[][], caption: string, sharedN: number | null, separator: DecimalSeparator): TableMeasure[] | null {
  const headerCount = rows.findIndex((row) => row.slice(1).some((cell) => readCell(cell, 'either').kind === 'number' || pairOf(cell, separator) !== null));
  if (headerCount < 1 || headerCount > 3) return null;
  const header = rows[headerCount - 1]!;
  const upper = headerCount >= 2 ? rows[headerCount - 2]! : null;
  const roles = header.map((cell, index) => (index === 0 ? 'other' : roleOf(cell)));
  const nColumn = roles.indexOf('n');
  // Each M column opens a measure; its SD is the next SD column before the next M.
  const measures: { meanColumn: number; sdColumn: number | null; paired: boolean; name: string }[] = [];
  roles.forEach((role, column) => {
    if (role === 'mean' || role === 'mean-sd') {
      let sdColumn: number | null = null;
      for (let next = column + 1; next < roles.length && roles[next] !== 'mean' && roles[next] !== 'mean-sd'; next++) {
        if (roles[next] === 'sd') {
          sdColumn = next;
          break;
        }
      }
      let name = caption;
      if (upper !== null) {
        for (let left = column; left >= 1; left--) {
          if ((upper[left] ?? '').trim() !== '') {
            name = `${upper[left]!.trim()} (${caption})`;
            break;
          }
        }
      }
      measures.push({ meanColumn: column, sdColumn, paired: role === 'mean-sd', name });
    }
  });
  if (measures.length === 0) return null;
  if (measures.length > 1 && upper === null) return null; // which measure is which cannot be told
  const out: TableMeasure[] = [];
  for (const measure of measures) {
    const groups: TableGroup[] = [];
    for (const row of rows.slice(headerCount)) {
      const label = (row[0] ?? '').trim();
      if (label === '' || /^(?:total|overall|all|sample)\b/i.test(label)) continue;
      let mean: ReportedNumber | null;
      let sd: ReportedNumber | null;
      if (measure.paired) {
        const pair = pairOf(row[measure.meanColumn], separator);
        mean = pair?.mean ?? null;
        sd = pair?.sd ?? null;
      } else {
        mean = numberOf(row[measure.meanColumn], separator);
        sd = measure.sdColumn === null ? null : numberOf(row[measure.sdColumn], separator);
      }
      if (mean === null) continue;
      const ownN = nColumn >= 0 ? countOf(row[nColumn], separator) : null;
      groups.push({
        label,
        mean,
        sd,
        n: ownN ?? sharedN,
        nSource: ownN !== null ? 'group' : sharedN !== null ? 'paragraph' : null,
      });
    }
    if (groups.length >= 2) out.push({ measure: measure.name, groups });
  }
  return out;
}

function readGroupsAsColumns(rows: string[][], caption: string, sharedN: number | null, separator: DecimalSeparator): TableMeasure[] | null {
  const labels = rows.map((row) => roleOf(row[0] ?? ''));
  const meanRow = labels.indexOf('mean');
  if (meanRow < 1 || labels.filter((role) => role === 'mean').length !== 1) return null;
  const sdRow = labels.indexOf('sd');
  const nRow = labels.indexOf('n');
  const header = rows[0]!;
  const groups: TableGroup[] = [];
  for (let column = 1; column < header.length; column++) {
    const mean = numberOf(rows[meanRow]![column], separator);
    if (mean === null) continue;
    const ownN = nRow >= 0 ? countOf(rows[nRow]![column], separator) : null;
    groups.push({
      label: (header[column] ?? '').trim(),
      mean,
      sd: sdRow >= 0 ? numberOf(rows[sdRow]![column], separator) : null,
      n: ownN ?? sharedN,
      nSource: ownN !== null ? 'group' : sharedN !== null ? 'paragraph' : null,
    });
  }
  return groups.length >= 2 ? [{ measure: caption, groups }] : null;
}
