/**
 * Scores plumbline on the real corpus (tests/corpus/real/, see its README):
 * each passage is read as a plain-text document, exactly as `plumbline scan`
 * reads a .txt file, scanned and checked, and what was found is compared with
 * the labels computed by compute.py.
 *
 * Run `npm run score:real` for the full print-out (misses and false alarms of
 * the tuning split only: the held-out split is never looked at in detail).
 * tests/corpus/real.test.ts runs the same scoring and holds its floors.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { plainTextDocument } from '../../../src/documents/text.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';
import { checkResults } from '../../../src/checks/engine.js';
import { resolveConfig } from '../../../src/checks/config.js';
import type { ReportedResult, StatisticKind } from '../../../src/scan/types.js';

/** The corpus folder, found from this file whether it runs from tests/ (vitest) or dist/tests/ (node). */
export const REAL_CORPUS_DIRECTORY = (() => {
  const here = dirname(fileURLToPath(import.meta.url));
  return here.includes(`${join('dist', 'tests')}`) ? here.replace(join('dist', 'tests'), 'tests') : here;
})();

export type Split = 'tune' | 'holdout';

export interface RealLabel {
  kind: StatisticKind;
  symbol: string | null;
  span: string;
  start: number;
  end: number;
  valueStart: number;
  valueEnd: number;
  line: number;
  inTable: boolean;
  df: number[];
  dfSource: string;
  value: number;
  valueText: string;
  valueComparator: string;
  p: { comparator: string; value: number; text: string } | null;
  notSignificant: boolean;
  effects: { kind: string; value: number; text: string }[];
  adjusted: string | null;
  tails: string | null;
  pRange: [number, number] | null;
  consistent: boolean | null;
}

export interface RealPassage {
  id: string;
  split: Split;
  language: string;
  origin: string;
  shapes: string[];
  damage: string[];
  text: string;
  results: RealLabel[];
}

export function loadRealCorpus(directory = REAL_CORPUS_DIRECTORY): RealPassage[] {
  const computed = join(directory, 'computed');
  return readdirSync(computed)
    .filter((name) => name.endsWith('.json'))
    .sort()
    .map((name) => {
      const data = JSON.parse(readFileSync(join(computed, name), 'utf8')) as Omit<RealPassage, 'text'>;
      const text = readFileSync(join(directory, 'passages', `${data.id}.txt`), 'utf8');
      return { ...data, text };
    });
}

const NEEDED_DF: Record<StatisticKind, number> = { F: 2, t: 1, chi2: 1, r: 0, z: 0 };

/**
 * A label plumbline can be asked to read: its df are all there (an r may come
 * without df, a z has none). Labels without their df are counted apart: the
 * table they sit in should be listed as not read.
 */
export function isReadable(label: RealLabel): boolean {
  return label.df.length >= NEEDED_DF[label.kind];
}

const close = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b));

function sameDf(found: ReportedResult, label: RealLabel): boolean {
  return found.df.length === label.df.length && found.df.every((d, i) => close(d.value, label.df[i]!));
}

function overlaps(found: ReportedResult, label: RealLabel): boolean {
  const statisticCell = found.tableRow?.cells.statistic;
  if (statisticCell && statisticCell.start === label.valueStart) return true;
  if (found.start < label.end && label.start < found.end) return true;
  // A table result restated in the text is one result printed in two places.
  return (found.alsoAt ?? []).some((place) => place.start < label.end && label.start < place.end);
}

function matches(found: ReportedResult, label: RealLabel): boolean {
  return found.kind === label.kind && found.value !== null && close(found.value.value, label.value) && sameDf(found, label) && overlaps(found, label);
}

function pRight(found: ReportedResult, label: RealLabel): boolean {
  if (found.notSignificant !== label.notSignificant) return false;
  // Marks are not a printed p (the labels leave them out); a bound read from them is not a misreading.
  if (label.p === null) return found.p === null || found.p.fromMarks !== undefined;
  if (found.p === null) return false;
  return found.p.comparator === label.p.comparator && close(found.p.value.value, label.p.value);
}

function effectsRight(found: ReportedResult, label: RealLabel): boolean {
  if (found.effects.length !== label.effects.length) return false;
  const left = [...found.effects];
  for (const want of label.effects) {
    const index = left.findIndex((e) => e.kind === want.kind && close(e.value.value, want.value));
    if (index < 0) return false;
    left.splice(index, 1);
  }
  return true;
}

export interface Outcome {
  passage: RealPassage;
  label: RealLabel;
  found: ReportedResult | null;
  pRight: boolean;
  effectsRight: boolean;
  failed: boolean;
  /** Not found, but inside a table the scan lists as not (fully) read: the audit says it skipped something. */
  listedUnread: boolean;
}

export interface FalseAlarm {
  passage: RealPassage;
  found: ReportedResult;
  failed: boolean;
}

export interface PassageScore {
  passage: RealPassage;
  outcomes: Outcome[];
  falseAlarms: FalseAlarm[];
}

const config = resolveConfig({});

export function scorePassage(passage: RealPassage): PassageScore {
  const document = plainTextDocument(`${passage.id}.txt`, 'text', passage.text);
  const scan = scanDocument(document);
  const checked = checkResults(passage.text, scan, config);
  const taken = new Set<number>();
  const outcomes: Outcome[] = passage.results.map((label) => ({
    passage,
    label,
    found: null,
    pRight: false,
    effectsRight: false,
    failed: false,
    listedUnread: scan.tablesNotRead.some((table) => table.start < label.end && label.start < table.end),
  }));
  // Labels in order; each takes the first found result that matches it and is not taken yet.
  outcomes.forEach((outcome) => {
    // A result printed in two places (alsoAt) may answer the label of each place.
    const index = checked.findIndex((c, i) => (!taken.has(i) || (c.result.alsoAt ?? []).length > 0) && matches(c.result, outcome.label));
    if (index < 0) return;
    taken.add(index);
    const { result, findings } = checked[index]!;
    outcome.found = result;
    outcome.pRight = pRight(result, outcome.label);
    outcome.effectsRight = effectsRight(result, outcome.label);
    outcome.failed = findings.some((f) => f.severity === 'fail');
  });
  // A result read as printed but without the df the label takes from elsewhere in the passage ("F = 0.38, P =
  // .68" after a table that gives its df) is a miss of those df, not a misreading.
  const readWithoutDf = (found: ReportedResult): boolean =>
    found.df.length === 0 && passage.results.some((label) => label.kind === found.kind && found.value !== null && close(found.value.value, label.value) && overlaps(found, label));
  const falseAlarms = checked
    .filter((c, i) => !taken.has(i) && !readWithoutDf(c.result))
    .map((c) => ({ passage, found: c.result, failed: c.findings.some((f) => f.severity === 'fail') }));
  return { passage, outcomes, falseAlarms };
}

export interface Figures {
  passages: number;
  labels: number;
  readable: number;
  found: number;
  recall: number;
  precision: number;
  /** Among matched results: p (and n.s.) read right. */
  pAccuracy: number;
  /** Among matched results: effect sizes read right. */
  effectAccuracy: number;
  consistent: number;
  /** Consistent results (by the labels) that plumbline failed. */
  failsOnConsistent: number;
  failRateOnConsistent: number;
  /** Labels without their df (an F with no df printed anywhere): found anyway, or not. */
  withoutDf: number;
  /** Labels without their df that plumbline read anyway (as printed, with no df: its p cannot be recomputed, other checks still run). */
  withoutDfFound: number;
  /** Every label, with df or without: the share read at its place with its kind, value and df as printed. */
  recallAll: number;
  falseAlarms: number;
  /** Readable labels not found and not inside a table the audit lists as not read: skipped without a word. */
  silentMisses: number;
}

const ratio = (a: number, b: number): number => (b === 0 ? 1 : a / b);

/** Figures for a set of outcomes; `where` picks labels (and false alarms) in tables or in text, or both. */
export function figures(scores: PassageScore[], where: 'all' | 'table' | 'text'): Figures {
  const pick = (inTable: boolean): boolean => where === 'all' || (where === 'table') === inTable;
  const outcomes = scores.flatMap((s) => s.outcomes).filter((o) => pick(o.label.inTable));
  const readable = outcomes.filter((o) => isReadable(o.label));
  const hits = readable.filter((o) => o.found !== null);
  const falseAlarms = scores.flatMap((s) => s.falseAlarms).filter((a) => pick(a.found.tableRow !== undefined));
  const hitsAll = outcomes.filter((o) => o.found !== null);
  const consistent = outcomes.filter((o) => o.label.consistent === true && o.found !== null);
  const failsOnConsistent = consistent.filter((o) => o.failed).length;
  return {
    passages: scores.length,
    labels: outcomes.length,
    readable: readable.length,
    found: hitsAll.length + falseAlarms.length,
    recall: ratio(hits.length, readable.length),
    precision: ratio(hitsAll.length, hitsAll.length + falseAlarms.length),
    pAccuracy: ratio(hitsAll.filter((o) => o.pRight).length, hitsAll.length),
    effectAccuracy: ratio(hitsAll.filter((o) => o.effectsRight).length, hitsAll.length),
    consistent: outcomes.filter((o) => o.label.consistent === true).length,
    failsOnConsistent,
    failRateOnConsistent: ratio(failsOnConsistent, outcomes.filter((o) => o.label.consistent === true).length),
    withoutDf: outcomes.length - readable.length,
    withoutDfFound: outcomes.filter((o) => !isReadable(o.label) && o.found !== null).length,
    recallAll: ratio(hitsAll.length, outcomes.length),
    falseAlarms: falseAlarms.length,
    silentMisses: readable.filter((o) => o.found === null && !o.listedUnread).length,
  };
}

export function scoreCorpus(passages: RealPassage[] = loadRealCorpus()): Record<Split, PassageScore[]> {
  const scores = passages.map(scorePassage);
  return { tune: scores.filter((s) => s.passage.split === 'tune'), holdout: scores.filter((s) => s.passage.split === 'holdout') };
}

function describeLabel(label: RealLabel): string {
  const df = label.df.length ? `(${label.df.join(', ')})` : '';
  const p = label.p ? ` p ${label.p.comparator} ${label.p.text}` : label.notSignificant ? ' n.s.' : '';
  return `${label.kind}${df} ${label.valueComparator} ${label.valueText}${p}`;
}

function describeFound(found: ReportedResult): string {
  const df = found.df.length ? `(${found.df.map((d) => d.text).join(', ')})` : '';
  const p = found.p ? ` p ${found.p.comparator} ${found.p.value.text}` : found.notSignificant ? ' n.s.' : '';
  return `${found.kind}${df} ${found.valueComparator} ${found.value?.text ?? '?'}${p}`;
}

const percent = (x: number): string => `${(100 * x).toFixed(1)}%`;

function figuresLine(name: string, f: Figures): string {
  return (
    `${name.padEnd(14)} labels ${String(f.labels).padStart(4)} (readable ${String(f.readable).padStart(4)})  ` +
    `recall ${percent(f.recall).padStart(6)}  precision ${percent(f.precision).padStart(6)}  ` +
    `p read ${percent(f.pAccuracy).padStart(6)}  effects read ${percent(f.effectAccuracy).padStart(6)}  ` +
    `fails on consistent ${f.failsOnConsistent}/${f.consistent}  false alarms ${f.falseAlarms}  ` +
    `missed silently ${f.silentMisses}/${f.readable - Math.round(f.recall * f.readable)}  ` +
    `without df read ${f.withoutDfFound}/${f.withoutDf}  all labels recall ${percent(f.recallAll)}`
  );
}

/**
 * How a copy can hand over a pipe table's rows: tab-separated, crushed into single spaces, one cell per line
 * with blank lines between cells, one cell per line on consecutive lines (an empty cell an empty line), or
 * aligned by runs of spaces (as a PDF's text laid out by position); tabs, crushed or aligned with a page's
 * running head in the middle of the table (a table that runs over a page break in a PDF); and tabs, crushed or
 * aligned with long row labels wrapped over two lines (a PDF's narrow label column).
 */
export type Rendering =
  | 'tabs'
  | 'crushed'
  | 'cell-per-line'
  | 'consecutive-lines'
  | 'aligned'
  | 'tabs-page-break'
  | 'crushed-page-break'
  | 'aligned-page-break'
  | 'pipe-page-break'
  | 'tabs-wrapped-labels'
  | 'crushed-wrapped-labels'
  | 'aligned-wrapped-labels';
const RENDERINGS: readonly Rendering[] = [
  'tabs',
  'crushed',
  'cell-per-line',
  'consecutive-lines',
  'aligned',
  'tabs-page-break',
  'crushed-page-break',
  'aligned-page-break',
  'pipe-page-break',
  'tabs-wrapped-labels',
  'crushed-wrapped-labels',
  'aligned-wrapped-labels',
];

/** A pipe row's cells, trimmed; a pipe inside brackets is a cell's own ("Pr(>|z|)"), not a border. */
function pipeRowCells(line: string): string[] {
  const inner = line.replace(/^\s*\|\s*/, '').replace(/\s*\|\s*$/, '');
  const cells: string[] = [];
  let depth = 0;
  let from = 0;
  for (let at = 0; at < inner.length; at++) {
    const code = inner.charCodeAt(at);
    if (code === 40) depth++;
    else if (code === 41 && depth > 0) depth--;
    else if (code === 124 && depth === 0) {
      cells.push(inner.slice(from, at).trim());
      from = at + 1;
    }
  }
  cells.push(inner.slice(from).trim());
  return cells;
}

/** Longest row label kept on one line in the wrapped renderings. */
const WRAP_LABELS_OVER = 18;

/**
 * The body rows (not the header rows above a pipe table's separator) whose label is longer than
 * WRAP_LABELS_OVER characters and has two words or more, with the label's first half alone on a line and the
 * rest on the row's line, as a PDF's text gives a label its cell wrapped (values level with the label's last line).
 */
function withWrappedLabels(text: string, render: (row: string[]) => string): string {
  const out: string[] = [];
  let inBlock = false;
  let separatorSeen = false;
  for (const line of text.split('\n')) {
    if (/^\s*\|?\s*-{3,}/.test(line)) {
      separatorSeen = true;
      continue;
    }
    if (!line.includes('|')) {
      inBlock = false;
      out.push(line);
      continue;
    }
    if (!inBlock) {
      inBlock = true;
      separatorSeen = false;
    }
    const row = pipeRowCells(line);
    const words = row[0]!.split(' ');
    if (!separatorSeen || row.length < 3 || row[0]!.length <= WRAP_LABELS_OVER || words.length < 2) {
      out.push(render(row));
      continue;
    }
    const half = Math.ceil(words.length / 2);
    out.push(words.slice(0, half).join(' '));
    out.push(render([words.slice(half).join(' '), ...row.slice(1)]));
  }
  return out.join('\n');
}

/** An invented running head and page number, as a PDF's text puts them where a table runs over a page break. */
const RUNNING_HEAD = 'Journal of Invented Studies 2021, 9, 522 11 of 16';

/**
 * Each block of at least four table rows with a page's running head after its middle row (`render` writes a row
 * as one line); the other lines as they are.
 */
function withPageBreaks(rows: readonly (string | string[])[], render: (row: string[]) => string): string {
  const out: string[] = [];
  let block: string[] = [];
  const flush = (): void => {
    const middle = Math.floor(block.length / 2);
    block.forEach((line, index) => {
      out.push(line);
      if (index === middle && block.length >= 4) out.push(RUNNING_HEAD);
    });
    block = [];
  };
  for (const row of rows) {
    if (Array.isArray(row)) {
      block.push(render(row));
      continue;
    }
    flush();
    out.push(row);
  }
  flush();
  return out.join('\n');
}

/**
 * Each block of pipe lines with at least four rows under its separator, as it is, with a page's running head
 * after the middle one of those rows: a PDF converted to Markdown puts the page's lines between two rows of a
 * table that runs over a page break. The other lines as they are.
 */
function withPageBreakInPipes(text: string): string {
  const out: string[] = [];
  let block: string[] = [];
  const flush = (): void => {
    const separator = block.findIndex((line) => /^\s*\|?\s*:?-{3,}/.test(line));
    const body = block.length - separator - 1;
    const middle = separator + 1 + Math.floor(body / 2);
    block.forEach((line, index) => {
      out.push(line);
      if (separator !== -1 && body >= 4 && index === middle) out.push(RUNNING_HEAD);
    });
    block = [];
  };
  for (const line of text.split('\n')) {
    if (line.includes('|')) {
      block.push(line);
      continue;
    }
    flush();
    out.push(line);
  }
  flush();
  return out.join('\n');
}

/**
 * A passage's pipe rows rendered another way, moving cells but never
 * changing one (separator rows dropped; other lines kept): web pages and
 * PDFs give the same table in each of these renderings.
 */
export function rerender(text: string, rendering: Rendering): string {
  const lines = text.split('\n').filter((line) => !/^\s*\|?\s*-{3,}/.test(line));
  const rows = lines.map((line) => (line.includes('|') ? pipeRowCells(line) : line));
  const tabbed = (row: string[]): string => row.join('\t');
  const crushed = (row: string[]): string => row.filter((cell) => cell !== '').join(' ');
  const aligned = (row: string[]): string => row.map((cell) => (cell === '' ? ' ' : cell)).join('   ');
  if (rendering === 'tabs-page-break') return withPageBreaks(rows, tabbed);
  if (rendering === 'crushed-page-break') return withPageBreaks(rows, crushed);
  if (rendering === 'aligned-page-break') return withPageBreaks(rows, aligned);
  if (rendering === 'pipe-page-break') return withPageBreakInPipes(text);
  if (rendering === 'tabs-wrapped-labels') return withWrappedLabels(text, tabbed);
  if (rendering === 'crushed-wrapped-labels') return withWrappedLabels(text, crushed);
  if (rendering === 'aligned-wrapped-labels') return withWrappedLabels(text, aligned);
  if (rendering === 'tabs') return rows.map((row) => (Array.isArray(row) ? row.join('\t') : row)).join('\n');
  if (rendering === 'crushed') return rows.map((row) => (Array.isArray(row) ? row.filter((cell) => cell !== '').join(' ') : row)).join('\n');
  if (rendering === 'consecutive-lines') return rows.map((row) => (Array.isArray(row) ? row.join('\n') : row)).join('\n');
  if (rendering === 'aligned') return rows.map((row) => (Array.isArray(row) ? row.map((cell) => (cell === '' ? ' ' : cell)).join('   ') : row)).join('\n');
  return rows.map((row) => (Array.isArray(row) ? row.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n') : row)).join('\n\n');
}

function resultKey(result: ReportedResult): string {
  return `${result.kind}|${result.df.map((d) => d.text).join(',')}|${result.value?.text}|${result.p?.comparator ?? ''}${result.p?.value.text ?? ''}`;
}

/**
 * Of the table results read in the tune split's pipe-table passages, the
 * share also read when the same rows come in another rendering.
 */
export function renderingScores(passages: RealPassage[]): Record<Rendering, { piped: number; kept: number; extra: number }> {
  const tableKeys = (text: string): string[] => scanDocument(plainTextDocument('table.txt', 'text', text)).results.filter((r) => r.tableRow).map(resultKey);
  const scores = Object.fromEntries(RENDERINGS.map((rendering) => [rendering, { piped: 0, kept: 0, extra: 0 }])) as Record<Rendering, { piped: number; kept: number; extra: number }>;
  for (const passage of passages.filter((p) => p.split === 'tune' && p.shapes.includes('table:pipe'))) {
    const piped = tableKeys(passage.text);
    // The scanner gives a value's minus sign as '-'; labels keep the printed sign ('−', U+2212): compare them alike.
    const printedValue = (label: RealLabel): string => label.valueText.replace(/\u2212/g, '-');
    const labelKeys = new Set(passage.results.map((label) => `${label.kind}|${label.df.join(',')}|${printedValue(label)}`));
    for (const rendering of RENDERINGS) {
      const other = tableKeys(rerender(passage.text, rendering));
      scores[rendering].piped += piped.length;
      scores[rendering].kept += piped.filter((key) => {
        const at = other.indexOf(key);
        if (at >= 0) other.splice(at, 1);
        return at >= 0;
      }).length;
      // What is left was read from the rendering but not from the pipe rows: a misreading, unless a label of the
      // passage prints that statistic with that value and df (a row the pipe copy misplaced, read right here), or
      // with that value when none were read (a result read with less, its df lost with the layout, not misread).
      const labelValues = new Set(passage.results.map((label) => `${label.kind}||${printedValue(label)}`));
      scores[rendering].extra += other.filter((key) => {
        const [kind, df, value] = key.split('|');
        return !labelKeys.has(`${kind}|${df}|${value}`) && !(df === '' && labelValues.has(`${kind}||${value}`));
      }).length;
    }
  }
  return scores;
}

/**
 * Ways web pages and other programs change characters without changing what
 * is printed: no-break spaces for every space; thin spaces around "<", "="
 * and ">"; full-width brackets; lone carriage returns ending lines; no
 * spaces around "<", "=", ">" ("p<.001", "241.34<0.0001"); and lines of running text wrapped as a PDF's text is
 * (the first space after every WRAP_WIDTH characters of a line of running text of 100 or more, made a line break).
 */
export type CharacterDamage = 'no-break-spaces' | 'thin-spaces' | 'full-width-brackets' | 'carriage-returns' | 'no-spaces-around-signs' | 'wrapped-lines';

/** Width of the lines of running text in the wrapped-lines damage. */
const WRAP_WIDTH = 70;

/** A line of sentences, not a table's row: most of its words are words, not numbers. */
function isRunningText(line: string): boolean {
  const words = line.split(/\s+/).filter((word) => word !== '');
  const numbers = words.filter((word) => /\d/.test(word) && !/[A-Za-z]{2}/.test(word)).length;
  // (Sentences: a full stop closes the line or stands inside it.)
  return words.length >= 12 && numbers <= words.length * 0.25 && /\.(?:\s|$)/.test(line.trimEnd());
}

/** Long lines of running text wrapped at WRAP_WIDTH, each break in place of a space (offsets unchanged). */
function wrapLongLines(text: string): string {
  return text
    .split('\n')
    .map((line) => {
      if (line.length < 100 || line.includes('|') || line.includes('\t') || !isRunningText(line)) return line;
      const characters = [...line];
      let run = 0;
      for (let index = 0; index < characters.length; index++) {
        run++;
        if (run >= WRAP_WIDTH && characters[index] === ' ') {
          characters[index] = '\n';
          run = 0;
        }
      }
      return characters.join('');
    })
    .join('\n');
}

const CHARACTER_DAMAGE: Record<Exclude<CharacterDamage, 'wrapped-lines'>, [RegExp, string]> = {
  'no-break-spaces': [/ /g, '\u00a0'],
  'thin-spaces': [/ (?=[<=>])|(?<=[<=>]) /g, '\u2009'],
  'full-width-brackets': [/[()]/g, '\uff08'],
  'carriage-returns': [/\n/g, '\r'],
  // Not one for one: labels are moved with the characters.
  'no-spaces-around-signs': [/ ?[<=>\u2264\u2265] ?/g, ''],
};

/**
 * `text` with each match of `pattern` changed (full-width brackets: each bracket its own full-width form;
 * signs: kept, their spaces dropped), and the place in the new text of every offset of the old one.
 */
function changeCharacters(text: string, damage: CharacterDamage): { text: string; placeOf: (offset: number) => number } {
  // (One character for one: offsets stay.)
  if (damage === 'wrapped-lines') return { text: wrapLongLines(text), placeOf: (offset) => offset };
  const [pattern, replacement] = CHARACTER_DAMAGE[damage];
  const shifts: { at: number; end: number; shift: number }[] = [];
  let shift = 0;
  const changed = text.replace(pattern, (match: string, at: number) => {
    const written =
      damage === 'full-width-brackets' ? String.fromCharCode(match.charCodeAt(0) + 0xfee0) : damage === 'no-spaces-around-signs' ? match.trim() : replacement;
    shift += written.length - match.length;
    shifts.push({ at, end: at + match.length, shift });
    return written;
  });
  const placeOf = (offset: number): number => {
    // The shift of the last change that ends at or before the offset (an offset inside a change goes to its end).
    let low = 0;
    let high = shifts.length;
    while (low < high) {
      const middle = (low + high) >> 1;
      if (shifts[middle]!.end <= offset) low = middle + 1;
      else high = middle;
    }
    return offset + (low === 0 ? 0 : shifts[low - 1]!.shift);
  };
  return { text: changed, placeOf };
}

/** A passage with its characters changed, its labels moved with them. */
function damaged(passage: RealPassage, damage: CharacterDamage): RealPassage {
  const { text, placeOf } = changeCharacters(passage.text, damage);
  const results = passage.results.map((label) => {
    const [start, end, valueStart, valueEnd] = [placeOf(label.start), placeOf(label.end), placeOf(label.valueStart), placeOf(label.valueEnd)];
    return { ...label, start, end, valueStart, valueEnd, span: text.slice(start, end) };
  });
  return { ...passage, text, results };
}

/** The tune split's recall and false alarms with its passages' characters changed each way. */
export function damageScores(passages: RealPassage[]): Record<CharacterDamage, Figures> {
  const tune = passages.filter((passage) => passage.split === 'tune');
  return Object.fromEntries(
    ([...Object.keys(CHARACTER_DAMAGE), 'wrapped-lines'] as CharacterDamage[]).map((damage) => [damage, figures(tune.map((passage) => scorePassage(damaged(passage, damage))), 'all')]),
  ) as Record<CharacterDamage, Figures>;
}

/** The print-out of `npm run score:real`. */
export function formatScores(
  scores: Record<Split, PassageScore[]>,
  detail: boolean,
  rendered?: Record<Rendering, { piped: number; kept: number; extra: number }>,
  damaged?: Record<CharacterDamage, Figures>,
): string {
  const lines: string[] = [];
  for (const split of ['tune', 'holdout'] as const) {
    const s = scores[split];
    lines.push(`== ${split} split: ${s.length} passages`);
    for (const where of ['all', 'table', 'text'] as const) lines.push(figuresLine(`  ${where}`, figures(s, where)));
  }
  const tune = scores.tune;
  const shapes = [...new Set(tune.flatMap((s) => s.passage.shapes))].sort();
  lines.push('', '== tune split by shape (recall of readable labels in passages of that shape)');
  for (const shape of shapes) {
    const f = figures(tune.filter((s) => s.passage.shapes.includes(shape)), 'all');
    lines.push(`  ${shape.padEnd(26)} ${String(f.readable).padStart(4)} readable  recall ${percent(f.recall).padStart(6)}  precision ${percent(f.precision).padStart(6)}`);
  }
  const languages = [...new Set(tune.map((s) => s.passage.language))].sort();
  lines.push('', '== tune split by language');
  for (const language of languages) {
    const f = figures(tune.filter((s) => s.passage.language === language), 'all');
    lines.push(`  ${language.padEnd(26)} ${String(f.readable).padStart(4)} readable  recall ${percent(f.recall).padStart(6)}  precision ${percent(f.precision).padStart(6)}`);
  }
  if (rendered !== undefined) {
    lines.push('', '== tune pipe tables in other renderings (results read from the pipe rows also read from the same rows; results read otherwise are misreadings)');
    for (const [rendering, score] of Object.entries(rendered)) {
      lines.push(`  ${rendering.padEnd(26)} ${String(score.kept).padStart(4)} of ${score.piped}  ${percent(score.piped === 0 ? 1 : score.kept / score.piped).padStart(6)}  read otherwise ${score.extra}`);
    }
  }
  if (damaged !== undefined) {
    lines.push('', '== tune split with characters changed (recall of readable labels; false alarms; labels move with their characters)');
    for (const [damage, f] of Object.entries(damaged)) {
      lines.push(`  ${damage.padEnd(26)} ${String(f.readable).padStart(4)} readable  recall ${percent(f.recall).padStart(6)}  false alarms ${f.falseAlarms}`);
    }
  }
  if (detail) {
    lines.push('', '== tune split: per passage, misses, misread fields, false alarms and fails on consistent results');
    for (const score of tune) {
      const { passage } = score;
      const readable = score.outcomes.filter((o) => isReadable(o.label));
      const hits = readable.filter((o) => o.found).length;
      lines.push(`-- ${passage.id} (${passage.shapes.join(', ')}): ${hits}/${readable.length} readable found, ${score.falseAlarms.length} false alarms`);
      for (const o of score.outcomes) {
        const where = `line ${o.label.line}${o.label.inTable ? ' table' : ''}`;
        if (!o.found) {
          lines.push(`   ${isReadable(o.label) ? 'miss' : 'miss (no df)'} ${where}: ${describeLabel(o.label)}  | ${o.label.span.replace(/\s+/g, ' ').slice(0, 90)}`);
        } else {
          if (!o.pRight || !o.effectsRight) {
            lines.push(`   misread ${where}: label ${describeLabel(o.label)} [${o.label.effects.map((e) => `${e.kind} ${e.text}`).join(', ')}] found ${describeFound(o.found)} [${o.found.effects.map((e) => `${e.kind} ${e.value.text}`).join(', ')}]`);
          }
          if (o.failed && o.label.consistent === true) lines.push(`   fail on a consistent result ${where}: ${describeLabel(o.label)}`);
        }
      }
      for (const a of score.falseAlarms) lines.push(`   false alarm${a.found.tableRow ? ' (table)' : ''}: ${describeFound(a.found)} | ${a.found.text.replace(/\s+/g, ' ').slice(0, 90)}`);
    }
  }
  return lines.join('\n');
}

// Run as a script: node dist/tests/corpus/real/score.js [--brief]
if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const corpus = loadRealCorpus();
  console.log(formatScores(scoreCorpus(corpus), !process.argv.includes('--brief'), renderingScores(corpus), damageScores(corpus)));
}
