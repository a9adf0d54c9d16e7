import { parseReportedNumber, roundingInterval } from '../stats/reportedNumber.js';
import type { NumberInterval } from '../stats/monotoneImage.js';

/**
 * The input of `plumbline cells`: a design's cell statistics as printed
 * (CSV/TSV, or JSON), and the F tests reported for it. Pure: text in,
 * cells and reported effects out, or an error naming the place (file,
 * line, column or JSON field) and what is wrong.
 *
 * CSV or TSV: a header naming the factor columns (one to three) and
 * `mean`, `sd` and optionally `n` (case-insensitive; `m` and `s` too), one
 * line per cell; blank lines and lines starting with `#` are skipped.
 * JSON: { "factors": [...], "cells": [{ <factor>: level, "n", "mean", "sd" }],
 * "reported": ["<effect>: F(1, 84) = 5.23, p = .025, pes = .06", ...] }.
 * Numbers keep their printed decimals (write them as strings in JSON to keep
 * trailing zeros: "4.20" stands for 4.195 to 4.205, 4.2 for 4.15 to 4.25).
 */

export interface PrintedValue {
  value: number;
  text: string;
  interval: NumberInterval;
}

export interface InputCell {
  levels: string[];
  /** null when the file gives no n (equal ns are then assumed). */
  n: number | null;
  mean: PrintedValue;
  sd: PrintedValue;
  /** Where the cell was read: "line 3" or "cells[2]". */
  where: string;
}

export interface ReportedEffect {
  text: string;
  /** Factor names of the effect, as written (matched to the design's factors later). */
  factors: string[];
  df1: number;
  df2: number;
  f: PrintedValue;
  p: { relation: '=' | '<' | '>'; value: PrintedValue } | null;
  partialEtaSquared: PrintedValue | null;
}

export interface CellsInput {
  factors: string[];
  cells: InputCell[];
  reported: ReportedEffect[];
}

export class CellsInputError extends Error {}

const MEAN_NAMES = new Set(['mean', 'm']);
const SD_NAMES = new Set(['sd', 's']);
const N_NAMES = new Set(['n']);

/** A printed number with its rounding interval, or null when the text is not a plain number. */
export function printedValue(text: string): PrintedValue | null {
  const parsed = parseReportedNumber(text.replace(/^\u2212/, '-'));
  if (parsed === null) return null;
  return { value: parsed.value, text: parsed.text, interval: roundingInterval(parsed) };
}

function splitCsvLine(line: string, delimiter: string): string[] {
  return line.split(delimiter).map((field) => field.trim().replace(/^"(.*)"$/, '$1'));
}

/** Cell statistics from CSV or TSV text (tab-separated when the header holds a tab). */
export function parseCellsCsv(text: string, file: string): CellsInput {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
  const headerIndex = lines.findIndex((line) => line.trim() !== '' && !line.trimStart().startsWith('#'));
  if (headerIndex < 0) throw new CellsInputError(`${file}: the file is empty; a header line (factor columns, mean, sd, n) is needed`);
  const delimiter = lines[headerIndex]!.includes('\t') ? '\t' : ',';
  const header = splitCsvLine(lines[headerIndex]!, delimiter);
  const lower = header.map((name) => name.toLowerCase());
  const column = (names: Set<string>) => lower.findIndex((name) => names.has(name));
  const meanColumn = column(MEAN_NAMES);
  const sdColumn = column(SD_NAMES);
  const nColumn = column(N_NAMES);
  const headerLine = headerIndex + 1;
  if (meanColumn < 0) throw new CellsInputError(`${file}, line ${headerLine}: no column named "mean" (or "m") in the header`);
  if (sdColumn < 0) throw new CellsInputError(`${file}, line ${headerLine}: no column named "sd" (or "s") in the header`);
  const factorColumns = header.map((_, i) => i).filter((i) => i !== meanColumn && i !== sdColumn && i !== nColumn);
  checkFactorNames(factorColumns.map((i) => header[i]!), `${file}, line ${headerLine}`);
  const cells: InputCell[] = [];
  lines.forEach((line, index) => {
    if (index <= headerIndex || line.trim() === '' || line.trimStart().startsWith('#')) return;
    const where = `${file}, line ${index + 1}`;
    const fields = splitCsvLine(line, delimiter);
    if (fields.length !== header.length) throw new CellsInputError(`${where}: ${fields.length} fields, but the header has ${header.length} columns`);
    const levels = factorColumns.map((i) => fields[i]!);
    const emptyLevel = levels.findIndex((level) => level === '');
    if (emptyLevel >= 0) throw new CellsInputError(`${where}, column "${header[factorColumns[emptyLevel]!]}": the level is empty`);
    cells.push({
      levels,
      n: nColumn < 0 ? null : wholeNumber(fields[nColumn]!, `${where}, column "${header[nColumn]}"`),
      mean: numberField(fields[meanColumn]!, `${where}, column "${header[meanColumn]}"`),
      sd: sdField(fields[sdColumn]!, `${where}, column "${header[sdColumn]}"`),
      where: `line ${index + 1}`,
    });
  });
  if (cells.length === 0) throw new CellsInputError(`${file}: the header is followed by no cell lines`);
  return { factors: factorColumns.map((i) => header[i]!), cells, reported: [] };
}

function checkFactorNames(names: readonly string[], where: string): void {
  if (names.length < 2 || names.length > 3) {
    throw new CellsInputError(`${where}: ${names.length} factor column${names.length === 1 ? '' : 's'} (${names.join(', ') || 'none'}); two or three are needed besides mean, sd and n`);
  }
  const seen = new Set<string>();
  for (const name of names) {
    if (name === '') throw new CellsInputError(`${where}: a factor column has no name`);
    if (seen.has(name.toLowerCase())) throw new CellsInputError(`${where}: the column "${name}" is named twice`);
    seen.add(name.toLowerCase());
  }
}

function numberField(text: string, where: string): PrintedValue {
  const value = printedValue(text);
  if (value === null) throw new CellsInputError(`${where}: "${text}" is not a number`);
  return value;
}

function sdField(text: string, where: string): PrintedValue {
  const value = numberField(text, where);
  if (value.value < 0) throw new CellsInputError(`${where}: the SD ${text} is negative`);
  return value;
}

function wholeNumber(text: string, where: string): number {
  const value = Number(text);
  if (!/^\d+$/.test(text) || !(value >= 1)) throw new CellsInputError(`${where}: n "${text}" is not a whole number of at least 1`);
  return value;
}

/** A JSON value as printed text: strings as they are, numbers in their shortest form. */
function jsonText(value: unknown): string | null {
  if (typeof value === 'string') return value.trim();
  if (typeof value === 'number' && Number.isFinite(value)) return String(value);
  return null;
}

/** Line and column of a character offset, counted from 1. */
function lineAndColumn(text: string, offset: number): string {
  const before = text.slice(0, offset).split('\n');
  return `line ${before.length}, column ${before[before.length - 1]!.length + 1}`;
}

/** Cell statistics and reported effects from JSON text (see the module comment for its shape). */
export function parseCellsJson(text: string, file: string): CellsInput {
  let data: unknown;
  try {
    data = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (error) {
    const message = (error as Error).message;
    const position = /position (\d+)/.exec(message);
    throw new CellsInputError(`${file}${position ? `, ${lineAndColumn(text, Number(position[1]))}` : ''}: not valid JSON (${message})`);
  }
  if (typeof data !== 'object' || data === null || Array.isArray(data)) throw new CellsInputError(`${file}: the file must hold one JSON object with "factors" and "cells"`);
  const record = data as Record<string, unknown>;
  const factors = record.factors;
  if (!Array.isArray(factors) || !factors.every((name) => typeof name === 'string')) {
    throw new CellsInputError(`${file}, field "factors": a list of the factors' names is needed, e.g. ["dose", "time"]`);
  }
  checkFactorNames(factors as string[], `${file}, field "factors"`);
  if (!Array.isArray(record.cells) || record.cells.length === 0) throw new CellsInputError(`${file}, field "cells": a list of cells is needed`);
  const cells = record.cells.map((entry: unknown, index: number): InputCell => {
    const where = `${file}, cells[${index}]`;
    if (typeof entry !== 'object' || entry === null || Array.isArray(entry)) throw new CellsInputError(`${where}: a cell must be an object`);
    const cell = new Map(Object.entries(entry as Record<string, unknown>).map(([key, value]) => [key.toLowerCase(), value]));
    const levels = (factors as string[]).map((name) => {
      const level = jsonText(cell.get(name.toLowerCase()));
      if (level === null || level === '') throw new CellsInputError(`${where}: no level of "${name}"`);
      return level;
    });
    const field = (names: Set<string>, label: string): string | null => {
      const key = [...names].find((name) => cell.has(name));
      if (key === undefined) return null;
      const value = jsonText(cell.get(key));
      if (value === null) throw new CellsInputError(`${where}.${key}: the ${label} must be a number or a string holding one`);
      return value;
    };
    const mean = field(MEAN_NAMES, 'mean');
    const sd = field(SD_NAMES, 'SD');
    const n = field(N_NAMES, 'n');
    if (mean === null) throw new CellsInputError(`${where}: no "mean"`);
    if (sd === null) throw new CellsInputError(`${where}: no "sd"`);
    return {
      levels,
      n: n === null ? null : wholeNumber(n, `${where}.n`),
      mean: numberField(mean, `${where}.mean`),
      sd: sdField(sd, `${where}.sd`),
      where: `cells[${index}]`,
    };
  });
  const reported = record.reported ?? [];
  if (!Array.isArray(reported) || !reported.every((entry) => typeof entry === 'string')) {
    throw new CellsInputError(`${file}, field "reported": a list of strings such as "dose: F(1, 84) = 5.23, p = .025" is needed`);
  }
  return { factors: factors as string[], cells, reported: (reported as string[]).map((entry, index) => parseReportedEffect(entry, `${file}, reported[${index}]`)) };
}

/** Plain unsigned decimal number: digits with an optional fraction, or a leading-dot fraction. */
const NUMBER = String.raw`(\d+(?:\.\d+)?|\.\d+)`;
const F_PART = new RegExp(String.raw`^F\s*\(\s*(\d+)\s*,\s*(\d+)\s*\)\s*=\s*${NUMBER}$`, 'i');
const P_PART = new RegExp(String.raw`^p\s*(=|<|>)\s*${NUMBER}$`, 'i');
const ETA_PART = new RegExp(String.raw`^(?:pes|ηp2|ηp²|η²p|ηp\^2|partial eta squared|partial eta2)\s*=\s*${NUMBER}$`, 'i');

/** "dose x time", "dose × time", "dose*time", "dose:time" -> ["dose", "time"] (a name may hold spaces). */
function factorNamesOf(effect: string): string[] {
  const names: string[] = [];
  for (const piece of effect.split(/[×*:]/)) {
    // Words split once on white space; the word "x" between two names joins them.
    let current: string[] = [];
    for (const word of piece.trim().split(/\s+/)) {
      if (word.toLowerCase() === 'x' && current.length > 0) {
        names.push(current.join(' '));
        current = [];
      } else if (word !== '') current.push(word);
    }
    if (current.length > 0) names.push(current.join(' '));
  }
  return names;
}

/**
 * One reported effect: "<effect>: F(df1, df2) = value[, p = value][, pes = value]",
 * the effect named by its factors joined by " x ", "×", "*" or ":"
 * ("dose x time"); p may be written "p < .001".
 */
export function parseReportedEffect(text: string, where: string): ReportedEffect {
  const colon = text.indexOf(':');
  const firstF = text.search(/F\s*\(/);
  // The effect's name ends at the colon before "F(", so "dose:time: F(...)" keeps its own colon.
  const nameEnd = firstF < 0 ? colon : text.lastIndexOf(':', firstF);
  if (nameEnd <= 0) throw new CellsInputError(`${where}: "${text}" does not start with the effect's name and a colon ("dose x time: F(1, 84) = 5.23")`);
  const factors = factorNamesOf(text.slice(0, nameEnd));
  const parts = text.slice(nameEnd + 1).replace(/\(\s*(\d+)\s*,\s*(\d+)\s*\)/, '($1;$2)').split(',').map((part) => part.trim().replace(';', ','));
  const fMatch = F_PART.exec(parts[0] ?? '');
  if (fMatch === null || factors.length === 0) throw new CellsInputError(`${where}: "${text}" has no "F(df1, df2) = value" after the effect's name`);
  let p: ReportedEffect['p'] = null;
  let partialEtaSquared: PrintedValue | null = null;
  for (const part of parts.slice(1)) {
    const pMatch = P_PART.exec(part);
    const etaMatch = ETA_PART.exec(part);
    if (pMatch) p = { relation: pMatch[1] as '=' | '<' | '>', value: printedValue(pMatch[2]!)! };
    else if (etaMatch) partialEtaSquared = printedValue(etaMatch[1]!);
    else throw new CellsInputError(`${where}: "${part}" is neither "p = value" nor "pes = value" (partial eta squared)`);
  }
  return { text, factors, df1: Number(fMatch[1]), df2: Number(fMatch[2]), f: printedValue(fMatch[3]!)!, p, partialEtaSquared };
}
