/**
 * Links F tests to the cell statistics of the factorial design they test.
 *
 * The effect an F tests is read from its label: a table row's label ("Age
 * × Load", "Load"), or the words before a written F since the previous
 * result or the start of its sentence ("a main effect of load", "the
 * interaction of age and load", "the Age × Load interaction"). A factor is
 * named by its name (a header, a design statement, a word its levels share)
 * or, within an interaction, by one of its levels. A main effect needs the
 * factor's name and no word of another factor (which would make it a
 * simple effect); words of follow-up tests ("simple", "among", "post hoc")
 * link nothing. In a table row's label a part that names no factor is the
 * one factor the set leaves unnamed, if there is exactly one.
 *
 * A link needs the df to be the design's: df1 the effect's (product of its
 * factors' levels minus one) and df2 = N - cells, or, when no n is
 * printed, an equal n per cell that df2 allows (then `assumedN`).
 *
 * Which set: cell statistics in a table the result's sentence (else
 * paragraph) refers to ("Table 2"), or written in the result's paragraph
 * before it, or written in or referred to by the paragraph before; failing those, the only set in the
 * document that fits, when its caption or sentence shares a word of what
 * was measured with the result's paragraph. Ties link nothing.
 *
 * Guards: a paragraph that speaks of covariates, adjusted means, repeated
 * measures or within-subject factors links nothing (the cells' SDs do not
 * give those tests), and a set stays unlinked unless its linked tests name
 * every one of its factors (a "factor" no test names is most likely not
 * one: two outcomes side by side, say).
 */

import type { FactorialCellSet, FactorialLink, ReportedResult } from '../types.js';
import { paragraphOf, sentenceStart as sentenceStartWithin, type Paragraph } from '../paragraphs.js';

export type { Paragraph };


/** Most characters looked back from a result for the words that name it. */
const MAX_LABEL = 400;

function sentenceStart(text: string, offset: number, floor: number): number {
  return sentenceStartWithin(text, offset, floor, MAX_LABEL);
}

const GUARD =
  /\b(?:covariates?|ANCOVA|MANCOVA|adjusted (?:means?|for)|estimated marginal|controlling for|repeated[- ]measures?|within[- ](?:subjects?|participants?)|mixed[- ](?:design|model|ANOVA|effects?)|split[- ]plot|multilevel)\b/i;
const FOLLOW_UP = /\b(?:simple(?: main)? effects?|follow(?:ed)?[- ]?up|post[- ]hoc|pairwise|among|separately|at each level|planned contrasts?|contrasts?)\b/i;
const INTERACTION = /\binteract(?:ion|ed|s)?\b/i;
const STOP_WORDS = new Set([
  'table', 'means', 'mean', 'standard', 'deviations', 'deviation', 'with', 'from', 'that', 'this', 'were', 'was', 'their', 'each',
  'cell', 'cells', 'group', 'groups', 'condition', 'conditions', 'participants', 'scores', 'score', 'by', 'and', 'the', 'note',
  'per', 'between', 'subjects', 'design', 'factor', 'factors', 'level', 'levels', 'statistics', 'descriptive', 'function',
]);

function escapeForPattern(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

function wordPattern(words: string): RegExp {
  return new RegExp(`\\b${words.split(/[\s-]+/).map(escapeForPattern).join('[\\s-]{1,3}')}\\b`, 'i');
}

/** The words that name factor f: its name, and the name's first word when the name has several. */
function namePatterns(set: FactorialCellSet, f: number): RegExp[] {
  const name = set.factors[f];
  if (name === null || name === undefined) return [];
  const patterns = [wordPattern(name)];
  const first = name.split(/[\s-]+/)[0]!;
  if (first !== name && first.length >= 3) patterns.push(wordPattern(first));
  return patterns;
}

function levelPatternsOf(set: FactorialCellSet, f: number): RegExp[] {
  return set.levels[f]!.map((level) => wordPattern(level));
}

function namedByName(label: string, set: FactorialCellSet, f: number): boolean {
  return namePatterns(set, f).some((pattern) => pattern.test(label));
}

function namedByLevel(label: string, set: FactorialCellSet, f: number): boolean {
  return levelPatternsOf(set, f).some((pattern) => pattern.test(label));
}

/** A table row's label cut into the factors it joins ("Age × Load" -> "Age", "Load"). */
function labelParts(label: string): string[] {
  return label
    .split(/\s?[×*:]\s?|\s[xX]\s|\sby\s/)
    .map((part) => part.replace(/\binteraction\b/i, '').trim())
    .filter((part) => part !== '');
}

/** The factor a part of a row label names, by its name, or -1. */
function factorOfPart(part: string, set: FactorialCellSet): number {
  const key = part.toLowerCase();
  const matches = set.factors
    .map((name, f) => ({ name, f }))
    .filter(({ name, f }) => name !== null && (name.toLowerCase() === key || namePatterns(set, f).some((pattern) => pattern.test(part))));
  return matches.length === 1 ? matches[0]!.f : -1;
}

/** The effect a table row's label names, as factor indices, or null. */
export function termOfRowLabel(label: string, set: FactorialCellSet): number[] | null {
  const factorCount = set.factors.length;
  if (/^\s*(?:the\s)?(?:two-way\s)?interaction\s*$/i.test(label)) return factorCount === 2 ? [0, 1] : null;
  const parts = labelParts(label);
  if (parts.length === 0 || parts.length > factorCount) return null;
  const term: number[] = [];
  const unmatched: string[] = [];
  for (const part of parts) {
    const f = factorOfPart(part, set);
    if (f < 0) unmatched.push(part);
    else if (!term.includes(f)) term.push(f);
    else return null;
  }
  if (unmatched.length > 0) {
    // By elimination: one part naming no factor, one factor with no name.
    const unnamed = set.factors.map((name, f) => (name === null ? f : -1)).filter((f) => f >= 0 && !term.includes(f));
    if (unmatched.length !== 1 || unnamed.length !== 1 || !/^[A-Za-z][A-Za-z -]{1,40}$/.test(unmatched[0]!)) return null;
    term.push(unnamed[0]!);
  }
  return term.sort((a, b) => a - b);
}

/** The effect the words before a written F name, as factor indices, or null. */
export function termOfWrittenLabel(label: string, set: FactorialCellSet): number[] | null {
  if (FOLLOW_UP.test(label)) return null;
  const factorCount = set.factors.length;
  const byName = set.factors.map((_, f) => namedByName(label, set, f));
  const byLevel = set.factors.map((_, f) => namedByLevel(label, set, f));
  if (INTERACTION.test(label)) {
    const named = set.factors.map((_, f) => f).filter((f) => byName[f] || byLevel[f]);
    if (/\bthree[- ]way\b/i.test(label)) return factorCount === 3 && (named.length === 0 || named.length === 3) ? [0, 1, 2] : null;
    if (named.length >= 2) return /\btwo[- ]way\b/i.test(label) && named.length !== 2 ? null : named;
    return factorCount === 2 && named.length === 0 ? [0, 1] : null;
  }
  const named = set.factors.map((_, f) => f).filter((f) => byName[f]);
  if (named.length !== 1) return null;
  const only = named[0]!;
  // A word of another factor makes it a simple effect ("the effect of load among older adults").
  if (set.factors.some((_, f) => f !== only && (byName[f] || byLevel[f]))) return null;
  return [only];
}

/** df1 of an effect: the product of its factors' levels minus one. */
function effectDf(set: FactorialCellSet, term: readonly number[]): number {
  return term.reduce((product, f) => product * (set.levels[f]!.length - 1), 1);
}

/** The equal n per cell the error df gives (df2 = cells (n - 1)), or null; the printed ns when there are. */
function sizesAgree(set: FactorialCellSet, df2: number): { ok: boolean; assumedN: number | null } {
  const cells = set.cells.length;
  if (set.cells.every((cell) => cell.n !== null)) {
    const total = set.cells.reduce((sum, cell) => sum + cell.n!, 0);
    return { ok: total - cells === df2, assumedN: null };
  }
  const n = (df2 + cells) / cells;
  return Number.isInteger(n) && n >= 2 ? { ok: true, assumedN: n } : { ok: false, assumedN: null };
}

/** Whole-number df of an F written with "=", or null. */
function integerDf(result: ReportedResult): [number, number] | null {
  if (result.kind !== 'F' || result.value === null || result.valueComparator !== '=' || result.df.length !== 2) return null;
  const [df1, df2] = result.df;
  if (df1!.decimals !== 0 || df2!.decimals !== 0 || !Number.isInteger(df1!.value) || !Number.isInteger(df2!.value)) return null;
  return [df1!.value, df2!.value];
}



const TABLE_REFERENCE = /\bTables?\s([A-Z]?\d{1,3}[A-Za-z]?)\b/g;

function tableReferences(scope: string): string[] {
  return [...scope.matchAll(TABLE_REFERENCE)].map((match) => match[1]!);
}

/** Content words of what a set measured (its caption or the words before it). */
function measureWords(set: FactorialCellSet): string[] {
  const levelWords = new Set(set.levels.flat().flatMap((level) => level.toLowerCase().split(/[\s-]+/)));
  const nameWords = new Set(set.factors.flatMap((name) => (name ?? '').toLowerCase().split(/[\s-]+/)));
  return [...new Set(set.measure.toLowerCase().match(/[a-z]{4,}/g) ?? [])].filter((word) => !STOP_WORDS.has(word) && !levelWords.has(word) && !nameWords.has(word));
}

interface Candidate {
  set: FactorialCellSet;
  term: number[];
  /** The factors the label names by a word of their own (an interaction named by that word alone names none). */
  covers: number[];
  assumedN: number | null;
  score: number;
}

/**
 * For each result (same order), its link to a set of cell statistics, or
 * null. `paragraphs` are the document's [start, end) paragraphs.
 */
export function linkCellSets(text: string, sets: readonly FactorialCellSet[], results: readonly ReportedResult[], paragraphs: readonly Paragraph[]): (FactorialLink | null)[] {
  if (sets.length === 0) return results.map(() => null);
  const usable = sets.filter((set) => !GUARD.test(set.measure));
  const wordsOfSet = new Map(usable.map((set) => [set, measureWords(set)]));
  const guardOfParagraph = new Map<number, boolean>();
  const referencesOfParagraph = new Map<number, string[]>();
  const paragraphReferences = (index: number): string[] => {
    let references = referencesOfParagraph.get(index);
    if (references === undefined) referencesOfParagraph.set(index, (references = tableReferences(text.slice(paragraphs[index]!.start, paragraphs[index]!.end))));
    return references;
  };
  const speaking = new Map<string, boolean>();
  const paragraphSpeaksOf = (index: number, set: FactorialCellSet): boolean => {
    const key = `${index}|${usable.indexOf(set)}`;
    let speaks = speaking.get(key);
    if (speaks === undefined) {
      const lower = text.slice(paragraphs[index]!.start, paragraphs[index]!.end).toLowerCase();
      speaking.set(key, (speaks = (wordsOfSet.get(set) ?? []).some((word) => new RegExp(`\\b${word}`).test(lower))));
    }
    return speaks;
  };
  let previousWrittenEnd = -1;
  const covered = new Map<FactorialCellSet, Set<number>>();
  const links = results.map((result): FactorialLink | null => {
    const previousEnd = previousWrittenEnd;
    if (result.tableRow === undefined) previousWrittenEnd = Math.max(previousWrittenEnd, result.end);
    const df = integerDf(result);
    if (df === null) return null;
    const p = paragraphOf(paragraphs, result.start);
    const paragraph = paragraphs[p]!;
    let guarded = guardOfParagraph.get(p);
    if (guarded === undefined) guardOfParagraph.set(p, (guarded = GUARD.test(text.slice(paragraph.start, paragraph.end))));
    if (guarded) return null;
    const sentenceFrom = sentenceStart(text, result.start, paragraph.start);
    const label =
      result.tableRow !== undefined ? result.tableRow.rowLabel : text.slice(Math.max(sentenceFrom, previousEnd >= paragraph.start ? previousEnd : -1), result.start);
    const sentence = text.slice(sentenceFrom, result.end);
    // A table row's paragraph is its table's; the caption (often apart from the rows) says what was measured.
    // What a paragraph holds is read once per paragraph (PDF text may be one long paragraph): the work stays linear.
    const caption = result.tableRow?.caption ?? '';
    const inSentence = tableReferences(sentence);
    const inParagraph = [...tableReferences(caption), ...paragraphReferences(p)];
    const referencesBefore = (): string[] => (p > 0 && result.tableRow === undefined ? paragraphReferences(p - 1) : []);
    const speaksOf = (set: FactorialCellSet): boolean => {
      const words = wordsOfSet.get(set) ?? [];
      const lowerCaption = caption.toLowerCase();
      return words.some((word) => new RegExp(`\\b${word}`).test(lowerCaption)) || paragraphSpeaksOf(p, set);
    };
    const candidates: Candidate[] = [];
    for (const set of usable) {
      if (set.start >= result.start && set.source === 'text') continue;
      const term = result.tableRow !== undefined ? termOfRowLabel(label, set) : termOfWrittenLabel(label, set);
      if (term === null || effectDf(set, term) !== df[0]) continue;
      const sizes = sizesAgree(set, df[1]);
      if (!sizes.ok) continue;
      let score = 0;
      if (set.tableNumber !== null && inSentence.includes(set.tableNumber)) score = 3;
      else if (set.tableNumber !== null && inParagraph.includes(set.tableNumber)) score = 2;
      else if (set.source === 'text' && set.start >= paragraph.start) score = 2;
      else if (set.source === 'text' && p > 0 && set.start >= paragraphs[p - 1]!.start) score = 1;
      else if (set.tableNumber !== null && referencesBefore().includes(set.tableNumber)) score = 1;
      // Anywhere else: only when the paragraph (or a row's caption) speaks of what the set measured.
      else if (!speaksOf(set)) continue;
      const covers = result.tableRow !== undefined ? term : term.filter((f) => namedByName(label, set, f) || namedByLevel(label, set, f));
      candidates.push({ set, term, covers, assumedN: sizes.assumedN, score });
    }
    if (candidates.length === 0) return null;
    const best = Math.max(...candidates.map((candidate) => candidate.score));
    const top = candidates.filter((candidate) => candidate.score === best);
    if (top.length !== 1) return null;
    const chosen = top[0]!;
    covered.set(chosen.set, new Set([...(covered.get(chosen.set) ?? []), ...chosen.covers]));
    return { set: chosen.set, term: chosen.term, label: label.trim().slice(-120), assumedN: chosen.assumedN };
  });
  // A set whose linked tests do not name every one of its factors is not linked at all.
  return links.map((link) => (link !== null && (covered.get(link.set)?.size ?? 0) === link.set.factors.length ? link : null));
}
