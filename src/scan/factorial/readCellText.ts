/**
 * Cell statistics of a factorial design written in running text:
 *
 *   "a 2 (age: younger, older) × 2 (load: low, high) between-subjects
 *   design ... In the high-load condition, older adults (M = 3.10, SD =
 *   1.30, n = 20) recalled fewer words than younger adults (M = 3.80, SD =
 *   1.25, n = 20); in the low-load condition, older (M = 3.95, SD = 1.02,
 *   n = 20) and younger adults (M = 4.21, SD = 1.10, n = 20) did not differ."
 *
 * The design statement ("2 (Age: younger vs. older) x 3 (Load: low, medium,
 * high)") gives the factors and their levels; each group of means and SDs
 * (read by readTextGroups) takes, for each factor, the level named last in
 * the words since the previous group, or, when none is named there, the
 * level of the previous group of the same sentence ("older (...) and
 * younger adults (...)" share the load condition named before them). The
 * groups of a paragraph that name a level of every factor form a set when
 * they cover every combination of levels exactly once.
 *
 * Linear: one pass of a bounded pattern for design statements; each group
 * looks at the words since the previous group only.
 */

import type { CellDescriptives, FactorialCellSet } from '../types.js';
import type { TextGroup } from '../descriptives/readTextDescriptives.js';

/** A design statement: factor names and their levels as written. */
export interface DesignStatement {
  factors: string[];
  levels: string[][];
  start: number;
  end: number;
}

// "2 (age: younger, older)": a count, then a name and its levels in brackets (bounded, no nesting).
const FACTOR_IN_BRACKETS = /\b(\d{1,2})\s?\(([^()\n]{3,160})\)/g;
const BETWEEN_FACTORS = /^\s?(?:[x×X*]|by)\s?$/;
/** Words between levels, in a list whose spaces are single ("younger vs. older", "sort, type, or draw"). */
const LEVEL_WORD_SEPARATOR = / (?:vs\.?|versus|and|or) /;

/** Reads "name: level, level" inside the brackets, with as many levels as the count says. */
function factorOf(count: number, inside: string): { name: string; levels: string[] } | null {
  const colon = inside.indexOf(':');
  if (colon < 1 || colon > 40) return null;
  const name = inside.slice(0, colon).trim();
  if (!/^[A-Za-z][A-Za-z -]{0,39}$/.test(name)) return null;
  const list = inside.slice(colon + 1).replace(/\s+/g, ' ');
  const levels = list
    .split(/[,/]/)
    .flatMap((part) => ` ${part.trim()} `.split(LEVEL_WORD_SEPARATOR))
    .map((level) => level.trim().replace(/^(?:and|or) /, ''))
    .filter((level) => level !== '');
  if (levels.length !== count || levels.some((level) => !/^[A-Za-z][A-Za-z0-9 -]{0,39}$/.test(level))) return null;
  return { name, levels };
}

/** Every design statement of two or three factors with named levels. */
export function readDesignStatements(text: string): DesignStatement[] {
  const statements: DesignStatement[] = [];
  let chain: { name: string; levels: string[]; start: number; end: number }[] = [];
  const close = (): void => {
    if (chain.length >= 2 && chain.length <= 3) {
      statements.push({ factors: chain.map((f) => f.name), levels: chain.map((f) => f.levels), start: chain[0]!.start, end: chain[chain.length - 1]!.end });
    }
    chain = [];
  };
  FACTOR_IN_BRACKETS.lastIndex = 0;
  for (let match = FACTOR_IN_BRACKETS.exec(text); match !== null; match = FACTOR_IN_BRACKETS.exec(text)) {
    const factor = factorOf(Number(match[1]), match[2]!);
    const start = match.index;
    const end = start + match[0].length;
    if (factor === null) {
      close();
      continue;
    }
    const previous = chain[chain.length - 1];
    if (previous !== undefined && !BETWEEN_FACTORS.test(text.slice(previous.end, start))) close();
    chain.push({ ...factor, start, end });
  }
  close();
  return statements;
}

function escapeForPattern(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/**
 * Patterns that find a level in text: the level as written (spaces or
 * hyphens between its words), and its first word alone when that word
 * tells the factor's levels apart ("younger adults": "younger").
 */
function levelPatterns(levels: readonly string[]): RegExp[] {
  const firstWords = levels.map((level) => level.split(/[\s-]+/)[0]!.toLowerCase());
  const distinctFirst = new Set(firstWords).size === levels.length;
  return levels.map((level, index) => {
    const words = level.split(/[\s-]+/).map(escapeForPattern);
    const whole = words.join('[\\s-]{1,3}');
    const alternatives = distinctFirst && words.length > 1 ? `${whole}|${escapeForPattern(firstWords[index]!)}` : whole;
    return new RegExp(`\\b(?:${alternatives})\\b`, 'gi');
  });
}

/** Index of the level named last in `window`, or -1. */
function lastLevelNamed(window: string, patterns: readonly RegExp[]): number {
  let best = -1;
  let bestAt = -1;
  patterns.forEach((pattern, level) => {
    pattern.lastIndex = 0;
    for (let match = pattern.exec(window); match !== null; match = pattern.exec(window)) {
      if (match.index >= bestAt) {
        bestAt = match.index;
        best = level;
      }
    }
  });
  return best;
}

const SENTENCE_BREAK = /[.!?;]\s+(?:[A-Z(]|in\b|and\b|whereas\b|while\b)/;
const PER_CELL = /\bn\s?=\s?(\d{1,5})\s?(?:per|in each|for each|each)\s(?:group|condition|cell)s?\b|\b(\d{1,5})\s(?:participants\s|people\s|adults\s|children\s|students\s)?(?:per|in each|in every)\s(?:cell|group|condition)\b/i;

/**
 * The sets of cell statistics written in the paragraphs of `text`, for the
 * design the document states. `groups` are readTextGroups(text) (sorted by
 * start); `paragraphs` the paragraphs' [start, end) offsets.
 */
export function readCellText(text: string, groups: readonly TextGroup[], paragraphs: readonly { start: number; end: number }[]): FactorialCellSet[] {
  const design = readDesignStatements(text)[0];
  if (design === undefined) return [];
  // A level word shared by two factors cannot tell them apart.
  const allWords = design.levels.flat().map((level) => level.toLowerCase());
  if (new Set(allWords).size !== allWords.length) return [];
  const patterns = design.levels.map(levelPatterns);
  const cellCount = design.levels.reduce((product, levels) => product * levels.length, 1);
  const sets: FactorialCellSet[] = [];
  let at = 0;
  for (const paragraph of paragraphs) {
    const inParagraph: TextGroup[] = [];
    while (at < groups.length && groups[at]!.start < paragraph.end) {
      if (groups[at]!.start >= paragraph.start) inParagraph.push(groups[at]!);
      at++;
    }
    if (inParagraph.length < cellCount) continue;
    const assigned: { group: TextGroup; levels: number[] }[] = [];
    let previous: { end: number; levels: number[] } | null = null;
    for (const group of inParagraph) {
      const from = previous?.end ?? paragraph.start;
      const window = text.slice(from, group.start);
      const sameSentence: boolean = previous !== null && !SENTENCE_BREAK.test(window);
      const levels: number[] = patterns.map((factorPatterns, f): number => {
        const named = lastLevelNamed(window, factorPatterns);
        return named >= 0 ? named : sameSentence ? previous!.levels[f]! : -1;
      });
      previous = { end: group.end, levels };
      if (levels.every((level: number) => level >= 0) && group.sd !== null) assigned.push({ group, levels });
    }
    const keys = assigned.map((entry) => entry.levels.join(','));
    if (assigned.length !== cellCount || new Set(keys).size !== cellCount) continue;
    const statement = PER_CELL.exec(text.slice(paragraph.start, paragraph.end));
    const statedN = statement ? Number(statement[1] ?? statement[2]) : null;
    const cells: CellDescriptives[] = assigned.map(({ group, levels }) => ({
      levels: levels.map((level, f) => design.levels[f]![level]!),
      mean: group.mean,
      sd: group.sd!,
      n: group.n ?? statedN,
      start: group.start,
      end: group.end,
    }));
    const allN = cells.every((cell) => cell.n !== null);
    const first = assigned[0]!.group;
    sets.push({
      source: 'text',
      factors: [...design.factors],
      levels: design.levels.map((levels) => [...levels]),
      cells: allN ? cells : cells.map((cell) => ({ ...cell, n: null })),
      nSource: allN ? (assigned.every(({ group }) => group.n !== null) ? 'cell' : 'statement') : null,
      measure: text.slice(paragraph.start, first.start).trim().slice(-200),
      tableIndex: null,
      tableNumber: null,
      start: first.start,
      end: assigned[assigned.length - 1]!.group.end,
      integerScale: null,
    });
  }
  return sets;
}
