/**
 * Reads the group descriptive statistics of a document (text and tables)
 * and links them to the tests computed from them.
 *
 * A test is linked to the groups written in its own paragraph, between the
 * previous test of the paragraph (or the paragraph's start) and the test
 * itself (or, when there are none, right after the test in the same
 * sentence), or to a descriptive table that its sentence or paragraph
 * names ("Table 1"), or, for the first test of a paragraph, to the groups
 * at the end of the paragraph before (after its last test) when the
 * sentence leading to them and the test's sentence share a word naming
 * the outcome. The number of groups must fit the test: two for an
 * independent t, k for an F(k - 1, df2). Tests whose paragraph speaks of
 * covariates, adjustment, paired, repeated or within-subject measures,
 * interactions or main effects, and every test of a document that declares
 * a within-subjects, mixed or factorial design, are left unlinked: their
 * statistics do not follow from the groups' means and SDs alone.
 *
 * Group sizes come from the group itself (an n beside it or an n column),
 * from a per-group statement in the same paragraph or table note ("n = 30
 * per group"), or from a per-group statement elsewhere in the document when
 * the test's df agree with it.
 *
 * Whole-number measures: a statement in the same paragraph, or in the
 * table's caption, notes or headers, that the measure is a count or a
 * rating on a single k-point item ("on a 7-point scale", "single-item",
 * "number of errors") marks the set as integer-valued; "six-item" or "6
 * items" in the same place gives the number of items averaged.
 */

import type { DocumentTable } from '../../documents/types.js';
import type { DescriptiveSet, GroupDescriptives, IntegerScaleStatement, ReportedResult } from '../types.js';
import { readDescriptiveTable, type DescriptiveTable } from './readTableDescriptives.js';
import { readTextGroups, sentenceEnd, type TextGroup } from './readTextDescriptives.js';
import { partitionPoint } from '../../sortedSearch.js';

export { readTextGroups } from './readTextDescriptives.js';
export { readDescriptiveTable } from './readTableDescriptives.js';

const PARAGRAPH_GUARD =
  /\b(?:covariates?|ANCOVA|MANOVA|adjust(?:ed|ing|ment)|controlling for|paired|repeated[- ]measures?|within[- ](?:subjects?|participants?|person|groups? design)|interactions?|main effects?|mixed|pre[- ]?tests?|post[- ]?tests?|matched|one[- ]sample|simple effects?)\b/i;
const DOCUMENT_GUARD =
  /\b(?:within[- ]subjects?|within[- ]participants?|repeated[- ]measures|mixed|split[- ]plot)\s(?:design|ANOVA|factorial|model)|\b(?:two|three|2|3)[- ]way\b|\bfactorial\b|\b\d\s?[x\u00d7]\s?\d\s(?:between[- ]subjects\s)?design/i;
const PER_GROUP =
  /\bn\s?=\s?(\d{1,5})\s?(?:per|in each|for each|each)\s(?:group|condition|cell|arm)s?\b|\b(\d{1,5})\s(?:[a-z]{1,20}\s){0,2}(?:per|in each|in every)\s(?:group|condition|cell|arm)\b/gi;
const WORD_NUMBERS: Record<string, number> = {
  one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10, eleven: 11, twelve: 12,
};
const INTEGER_SCALE =
  /\b(?:single[- ]item|one[- ]item|(?:\d{1,2}|two|three|four|five|six|seven|eight|nine|ten|eleven)[- ]point\b|number of (?:errors|mistakes|correct|words|items|trials|responses|problems|questions|answers|days|times|visits|steps|drinks|cigarettes|sessions)\b|counts? of\b|whole[- ]numbers?\b|integer[- ]valued\b)/gi;
const ITEM_COUNT = /\b(\d{1,2}|two|three|four|five|six|seven|eight|nine|ten|eleven|twelve)(?:[- ]items?\b|\sitems\b)/i;
const TABLE_REFERENCE = /\bTables?\s([A-Z]?\d{1,3}[A-Za-z]?)\b/g;

/** The table numbers a stretch of text refers to ("Table 2", "Tables 3a"). */
function tableReferences(scope: string): string[] {
  return [...scope.matchAll(TABLE_REFERENCE)].map((match) => match[1]!);
}

/** Words that say nothing of what was measured (a shared one does not make two sentences speak of one outcome). */
const NOT_AN_OUTCOME = new Set([
  'than', 'that', 'this', 'with', 'were', 'was', 'those', 'their', 'there', 'which', 'while', 'whereas', 'both', 'each', 'from',
  'higher', 'lower', 'greater', 'smaller', 'more', 'less', 'fewer', 'group', 'groups', 'condition', 'conditions', 'participants',
  'scores', 'score', 'mean', 'means', 'significant', 'significantly', 'difference', 'differences', 'differed', 'test', 'tests',
  'confirmed', 'showed', 'found', 'between', 'compared', 'comparison', 'also', 'results', 'analysis', 'anova',
]);

/** Content words (four letters or more) of a stretch of text, lower case. */
function contentWords(stretch: string): Set<string> {
  return new Set((stretch.toLowerCase().match(/[a-z]{4,}/g) ?? []).filter((word) => !NOT_AN_OUTCOME.has(word)));
}

/** True when the words before the groups and the words before the test share a word naming what was measured. */
function sameOutcome(measure: string, testSentence: string): boolean {
  const test = contentWords(testSentence);
  return [...contentWords(measure)].some((word) => test.has(word));
}

/** Most characters looked back from a result for its sentence's start. */
const MAX_SENTENCE = 600;

interface Paragraphs {
  starts: number[];
  ends: number[];
}

function paragraphsOf(text: string): Paragraphs {
  const starts = [0];
  const ends: number[] = [];
  const blank = /\n[ \t]*\n/g;
  for (let match = blank.exec(text); match !== null; match = blank.exec(text)) {
    ends.push(match.index);
    starts.push(match.index + match[0].length);
  }
  ends.push(text.length);
  return { starts, ends };
}

function paragraphIndex(paragraphs: Paragraphs, offset: number): number {
  let low = 0;
  let high = paragraphs.starts.length - 1;
  while (low < high) {
    const mid = (low + high + 1) >> 1;
    if (paragraphs.starts[mid]! <= offset) low = mid;
    else high = mid - 1;
  }
  return low;
}

/** Start of the sentence holding `offset`, no earlier than `floor`. */
function sentenceStart(text: string, offset: number, floor: number): number {
  const lowest = Math.max(floor, offset - MAX_SENTENCE);
  for (let at = offset - 1; at > lowest; at--) {
    if (/[.!?]/.test(text[at - 1]!) && /\s/.test(text[at]!) && /[A-Z(]/.test(text[at + 1] ?? '')) return at + 1;
  }
  return lowest;
}

/** Statements in [from, to) that a measure is whole-number ("on a single 7-point item", "number of errors"). */
export function integerStatements(text: string, from: number, to: number): IntegerScaleStatement[] {
  const scope = text.slice(from, to);
  const statements: IntegerScaleStatement[] = [];
  const items = ITEM_COUNT.exec(scope);
  const itemCount = items ? (WORD_NUMBERS[items[1]!.toLowerCase()] ?? Number(items[1])) : 1;
  INTEGER_SCALE.lastIndex = 0;
  for (let match = INTEGER_SCALE.exec(scope); match !== null; match = INTEGER_SCALE.exec(scope)) {
    const single = /^(?:single|one)/i.test(match[0]);
    statements.push({ text: match[0], start: from + match.index, end: from + match.index + match[0].length, items: single ? 1 : itemCount });
  }
  return statements;
}

function requiredGroups(result: ReportedResult): number | null {
  if (result.value === null || result.valueComparator !== '=') return null;
  if (result.kind === 't' && result.df.length === 1) return 2;
  if (result.kind === 'F' && result.df.length === 2) {
    const df1 = result.df[0]!;
    if (df1.decimals === 0 && Number.isInteger(df1.value) && df1.value >= 1 && df1.value <= 11) return df1.value + 1;
  }
  return null;
}

/** The df the test would have with k equal groups of size n (Student / classic ANOVA). */
function dfAgreesWithEqualN(result: ReportedResult, n: number, k: number): boolean {
  const errorDf = result.kind === 'F' ? result.df[1] : result.df[0];
  return errorDf !== undefined && errorDf.decimals === 0 && errorDf.value === k * n - k;
}

interface PerGroupStatement {
  n: number;
  start: number;
}

function perGroupStatements(text: string): PerGroupStatement[] {
  const found: PerGroupStatement[] = [];
  PER_GROUP.lastIndex = 0;
  for (let match = PER_GROUP.exec(text); match !== null; match = PER_GROUP.exec(text)) {
    found.push({ n: Number(match[1] ?? match[2]), start: match.index });
  }
  return found;
}

/** Index of the first group of `groups` (sorted by start) that starts at or after `offset`. */
function firstGroupFrom(groups: readonly TextGroup[], offset: number): number {
  return partitionPoint(groups.length, (index) => groups[index]!.start < offset);
}

/**
 * The groups of `groups` (sorted by start) that lie wholly in [from, to].
 * Found by binary search and a walk over that stretch only, so that a long
 * "paragraph" (PDF text often has no blank lines) costs each result the
 * groups near it, not every group of the document.
 */
export function groupsWithin(groups: readonly TextGroup[], from: number, to: number): TextGroup[] {
  const within: TextGroup[] = [];
  // A group that starts after `to` cannot end by `to`.
  for (let at = firstGroupFrom(groups, from); at < groups.length && groups[at]!.start <= to; at++) {
    if (groups[at]!.end <= to) within.push(groups[at]!);
  }
  return within;
}

/**
 * The per-group statements whose n could give the test's error df with k
 * equal groups (df = k n - k, so n = df / k + 1), in document order.
 */
function perGroupWithN(byN: ReadonlyMap<number, PerGroupStatement[]>, result: ReportedResult, k: number): PerGroupStatement[] {
  const errorDf = result.kind === 'F' ? result.df[1] : result.df[0];
  if (errorDf === undefined) return [];
  return byN.get((errorDf.value + k) / k) ?? [];
}

function fromText(groups: TextGroup[]): GroupDescriptives[] {
  return groups.map((group) => ({
    label: null,
    mean: group.mean,
    sd: group.sd,
    n: group.n,
    nSource: group.n === null ? null : 'group',
    start: group.start,
    end: group.end,
  }));
}

export interface DescriptivesReading {
  /** Every set found, linked or not. */
  sets: DescriptiveSet[];
  /** The set linked to each result (same order as the results given), or null. */
  links: (DescriptiveSet | null)[];
}

/**
 * Reads the document's descriptive statistics and links them to `results`
 * (results read from table rows are not linked). `tables` are the
 * document's tables, distinct and in reading order.
 */
export function readDescriptives(text: string, tables: readonly DocumentTable[], results: readonly ReportedResult[]): DescriptivesReading {
  const paragraphs = paragraphsOf(text);
  const textGroups = readTextGroups(text);
  const groupsByParagraph = new Map<number, TextGroup[]>();
  for (const group of textGroups) {
    const index = paragraphIndex(paragraphs, group.start);
    const list = groupsByParagraph.get(index) ?? [];
    list.push(group);
    groupsByParagraph.set(index, list);
  }
  const perGroup = perGroupStatements(text);
  const documentGuarded = DOCUMENT_GUARD.test(text);
  const descriptiveTables: { reading: DescriptiveTable; index: number }[] = [];
  tables.forEach((table, index) => {
    const reading = readDescriptiveTable(table);
    if (reading !== null) descriptiveTables.push({ reading, index });
  });

  const sets: DescriptiveSet[] = [];
  const usedGroups = new Set<TextGroup>();
  // Everything about a paragraph is read once, however many results it holds (PDF text often has no
  // blank lines, so one "paragraph" can be the whole document): the work stays linear.
  const guardedParagraphs = new Map<number, boolean>();
  const statementsOfParagraph = new Map<number, IntegerScaleStatement[]>();
  const paragraphGuarded = (index: number, start: number, end: number): boolean => {
    let guarded = guardedParagraphs.get(index);
    if (guarded === undefined) guardedParagraphs.set(index, (guarded = PARAGRAPH_GUARD.test(text.slice(start, end))));
    return guarded;
  };
  const referencesOfParagraph = new Map<number, string[]>();
  const paragraphReferences = (index: number, start: number, end: number): string[] => {
    let references = referencesOfParagraph.get(index);
    if (references === undefined) referencesOfParagraph.set(index, (references = tableReferences(text.slice(start, end))));
    return references;
  };
  const paragraphStatements = (index: number, start: number, end: number): IntegerScaleStatement[] => {
    let statements = statementsOfParagraph.get(index);
    if (statements === undefined) statementsOfParagraph.set(index, (statements = integerStatements(text, start, end)));
    return statements;
  };
  const writtenStarts = results.filter((result) => result.tableRow === undefined).map((result) => result.start).sort((a, b) => a - b);
  /** Start of the first written result at or after `offset` (binary search). */
  const nextWrittenStart = (offset: number): number | undefined => {
    let low = 0;
    let high = writtenStarts.length;
    while (low < high) {
      const mid = (low + high) >> 1;
      if (writtenStarts[mid]! < offset) low = mid + 1;
      else high = mid;
    }
    return writtenStarts[low];
  };
  const perGroupByN = new Map<number, PerGroupStatement[]>();
  for (const statement of perGroup) perGroupByN.set(statement.n, [...(perGroupByN.get(statement.n) ?? []), statement]);
  const perGroupByParagraph = new Map<number, PerGroupStatement[]>();
  for (const statement of perGroup) {
    const index = paragraphIndex(paragraphs, statement.start);
    perGroupByParagraph.set(index, [...(perGroupByParagraph.get(index) ?? []), statement]);
  }
  let latestWrittenEnd = -1;
  const links = results.map((result): DescriptiveSet | null => {
    // The end of the latest written result before this one (results come in reading order).
    const previousEnd = latestWrittenEnd;
    if (result.tableRow === undefined) latestWrittenEnd = Math.max(latestWrittenEnd, result.end);
    if (result.tableRow !== undefined || documentGuarded) return null;
    const required = requiredGroups(result);
    if (required === null) return null;
    const paragraph = paragraphIndex(paragraphs, result.start);
    const paragraphStart = paragraphs.starts[paragraph]!;
    const paragraphEnd = paragraphs.ends[paragraph] ?? text.length;
    if (paragraphGuarded(paragraph, paragraphStart, paragraphEnd)) return null;
    const previous = previousEnd >= paragraphStart && previousEnd <= result.start ? previousEnd : paragraphStart;
    const next = nextWrittenStart(result.end) ?? paragraphEnd;
    const inParagraph = groupsByParagraph.get(paragraph) ?? [];
    let chosen = groupsWithin(inParagraph, previous, result.start);
    if (chosen.length === 0) {
      const sentenceStop = sentenceEnd(text, result.end, MAX_SENTENCE);
      chosen = groupsWithin(inParagraph, result.end, Math.min(next, sentenceStop));
    }
    let set: DescriptiveSet | null = null;
    if (chosen.length === required) {
      chosen.forEach((group) => usedGroups.add(group));
      const first = chosen[0]!;
      const measureStart = sentenceStart(text, first.start, paragraphStart);
      const statements = paragraphStatements(paragraph, paragraphStart, paragraphEnd);
      set = {
        source: 'text',
        groups: fromText(chosen),
        measure: text.slice(measureStart, first.start).trim().slice(0, 200),
        tableIndex: null,
        start: first.start,
        end: chosen[chosen.length - 1]!.end,
        integerScale: statements[0] ?? null,
      };
      // Sizes from a per-group statement of the paragraph.
      const local = perGroupByParagraph.get(paragraph) ?? [];
      if (local.length > 0) {
        const n = local[local.length - 1]!.n;
        for (const group of set.groups) if (group.n === null) Object.assign(group, { n, nSource: 'paragraph' });
      }
    } else {
      set = linkTable(text, result, required, descriptiveTables, paragraphStart, paragraphReferences(paragraph, paragraphStart, paragraphEnd));
    }
    // The first test of a paragraph may test the groups of the paragraph before ("... (M = 4.25) ... (M = 3.52).\n\nA t test on
    // comfort confirmed this, t(47) = 2.18"): those after that paragraph's last test, when as many as the test compares and
    // the sentence before them and the test's sentence name the same outcome.
    if (set === null && chosen.length === 0 && previousEnd < paragraphStart && paragraph > 0) {
      const before = paragraph - 1;
      const beforeStart = paragraphs.starts[before]!;
      const beforeEnd = paragraphs.ends[before] ?? paragraphStart;
      if (!paragraphGuarded(before, beforeStart, beforeEnd)) {
        const groups = groupsWithin(groupsByParagraph.get(before) ?? [], Math.max(beforeStart, previousEnd), beforeEnd).filter((group) => !usedGroups.has(group));
        const measureStart = groups.length > 0 ? sentenceStart(text, groups[0]!.start, beforeStart) : 0;
        const measure = groups.length > 0 ? text.slice(measureStart, groups[0]!.start) : '';
        const testSentence = text.slice(sentenceStart(text, result.start, paragraphStart), result.start);
        if (groups.length === required && sameOutcome(measure, testSentence)) {
          groups.forEach((group) => usedGroups.add(group));
          const statements = paragraphStatements(before, beforeStart, beforeEnd);
          set = {
            source: 'text',
            groups: fromText(groups),
            measure: measure.trim().slice(0, 200),
            tableIndex: null,
            start: groups[0]!.start,
            end: groups[groups.length - 1]!.end,
            integerScale: statements[0] ?? null,
          };
          const local = perGroupByParagraph.get(before) ?? [];
          if (local.length > 0) {
            const n = local[local.length - 1]!.n;
            for (const group of set.groups) if (group.n === null) Object.assign(group, { n, nSource: 'paragraph' });
          }
        }
      }
    }
    if (set === null) return null;
    // Sizes from a per-group statement elsewhere, when the test's df agree with it.
    if (set.groups.some((group) => group.n === null)) {
      // Only a statement of n = df / k + 1 can agree with the df: looked up by that n, not by walking every statement.
      const agreeing = perGroupWithN(perGroupByN, result, required).filter((statement) => dfAgreesWithEqualN(result, statement.n, required));
      const statement = agreeing.filter((s) => s.start < result.start).pop() ?? agreeing[0];
      if (statement !== undefined) {
        for (const group of set.groups) if (group.n === null) Object.assign(group, { n: statement.n, nSource: 'document' });
      }
    }
    sets.push(set);
    return set;
  });

  // Unlinked descriptive statistics are reported too (one set per paragraph, one per table measure).
  for (const [index, groups] of groupsByParagraph) {
    const unused = groups.filter((group) => !usedGroups.has(group));
    if (unused.length === 0) continue;
    const start = paragraphs.starts[index]!;
    const end = paragraphs.ends[index] ?? text.length;
    const set: DescriptiveSet = {
      source: 'text',
      groups: fromText(unused),
      measure: '',
      tableIndex: null,
      start: unused[0]!.start,
      end: unused[unused.length - 1]!.end,
      // What the paragraph says of the measure (GRIM on statistics no test is linked to needs it).
      integerScale: paragraphStatements(index, start, end)[0] ?? null,
    };
    // Sizes from a per-group statement of the paragraph, as for linked groups.
    const local = perGroupByParagraph.get(index) ?? [];
    if (local.length > 0) for (const group of set.groups) if (group.n === null) Object.assign(group, { n: local[local.length - 1]!.n, nSource: 'paragraph' });
    sets.push(set);
  }
  // Which table measures are already linked, looked up by table and measure rather than by walking every set.
  const tableMeasureKey = (tableIndex: number, measure: string): string => `${tableIndex}|${measure}`;
  const listed = new Set(sets.filter((set) => set.tableIndex !== null).map((set) => tableMeasureKey(set.tableIndex!, set.measure)));
  for (const { reading, index } of descriptiveTables) {
    for (const measure of reading.measures) {
      if (listed.has(tableMeasureKey(index, measure.measure))) continue;
      sets.push(tableSet(text, reading, index, measure.measure, measure.groups));
      listed.add(tableMeasureKey(index, measure.measure));
    }
  }
  sets.sort((a, b) => a.start - b.start);
  return { sets, links };
}

function tableSet(
  text: string,
  reading: DescriptiveTable,
  index: number,
  measure: string,
  groups: DescriptiveTable['measures'][number]['groups'],
): DescriptiveSet {
  const { table } = reading;
  const header = table.rows.slice(0, 3).flat().join(' ');
  const scope = [table.caption ?? '', ...table.notes, header].join('\n');
  const statement = integerStatements(scope, 0, scope.length)[0] ?? null;
  return {
    source: 'table',
    groups: groups.map((group) => ({ ...group, start: table.start, end: table.end })),
    measure,
    tableIndex: index,
    start: table.start,
    end: table.end,
    // Offsets of a statement in a caption or note are those of the table.
    integerScale: statement === null ? null : { ...statement, start: table.start, end: table.end },
  };
}

function linkTable(
  text: string,
  result: ReportedResult,
  required: number,
  tables: { reading: DescriptiveTable; index: number }[],
  paragraphStart: number,
  paragraphReferences: readonly string[],
): DescriptiveSet | null {
  const sentenceFrom = sentenceStart(text, result.start, paragraphStart);
  const sentence = text.slice(sentenceFrom, sentenceEnd(text, result.end, MAX_SENTENCE));
  const inSentence = tableReferences(sentence);
  const numbers = inSentence.length > 0 ? inSentence : paragraphReferences;
  const candidates = tables.filter(({ reading }) => reading.number !== null && numbers.includes(reading.number));
  const fitting = candidates.flatMap(({ reading, index }) =>
    reading.measures.filter((measure) => measure.groups.length === required).map((measure) => ({ reading, index, measure })),
  );
  let pick = fitting.length === 1 ? fitting[0]! : undefined;
  if (pick === undefined && fitting.length > 1) {
    // Several measures fit: the one whose name (spanning header) the sentence mentions.
    const lower = sentence.toLowerCase();
    const named = fitting.filter(({ measure }) => {
      const name = measure.measure.split(' (')[0]!.trim().toLowerCase();
      return name.length >= 3 && lower.includes(name);
    });
    if (named.length === 1) pick = named[0];
  }
  if (pick === undefined) return null;
  return tableSet(text, pick.reading, pick.index, pick.measure.measure, pick.measure.groups);
}
