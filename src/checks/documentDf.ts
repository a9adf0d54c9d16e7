/**
 * Degrees of freedom that a result does not print but the document gives:
 *
 * - a correlation written without df or n ("r = .30, p = .004") in a
 *   document that states one sample size for the whole study ("N = 214",
 *   "214 participants"): df = N - 2. The N may not be this test's sample
 *   (missing data, a subset), so every finding about the result is at most a
 *   warning, and at most a note when the document also states sizes of parts
 *   of the sample or of single tests that differ from it;
 * - a chi-square written without df whose sentence (or the one before)
 *   states the table's dimensions ("a 2 × 3 contingency table", "a 2 x 2
 *   chi-square test"): df = (rows - 1)(columns - 1), findings at most
 *   warnings. A chi-square's N never gives its df, so without dimensions it
 *   stays unchecked.
 *
 * The scanner reads what is written; this is where the checks supply what
 * the rest of the document says, and mark it (ReportedResult.dfFrom) so the
 * messages and the JSON output say where the df came from.
 */

import type { DocumentContext, ReportedNumber, ReportedResult, SampleScope, StatedSampleSize } from '../scan/types.js';
import { sentenceAround, sentenceBefore } from './sentences.js';
import type { Severity } from './types.js';

const perGroupWording = /\b(?:per|each|every)\s(?:group|condition|cell|arm)\b/i;
const subgroupWording = /\b(?:men|women|males?|females?|boys|girls|controls|patients in)\b/i;
const totalWording = /\bN\s*=|\btotal\b|\bin all\b|\boverall\b/i;

/**
 * What a stated sample size counts: its scope as read by the scanner, or,
 * for a statement without one, judged from its words ("17 men" is a part of
 * the sample, "20 per group" a group's size, anything else the whole sample).
 */
export function scopeOf(statement: StatedSampleSize): SampleScope {
  if (statement.scope) return statement.scope;
  if (perGroupWording.test(statement.text)) return 'per-group';
  if (!totalWording.test(statement.text) && subgroupWording.test(statement.text)) return 'subset';
  return 'total';
}

export interface StudySample {
  value: number;
  statement: StatedSampleSize;
  /** 'warn' normally; 'note' when the document also states other sample sizes (parts, groups, single tests). */
  severityAtMost: Severity;
}

/** The sample size the document states for the whole study, when it states exactly one (however often). */
export function studySampleSize(context: DocumentContext): StudySample | null {
  const totals = context.sampleSizes.filter((statement) => scopeOf(statement) === 'total');
  const values = new Set(totals.map((statement) => statement.value));
  if (values.size !== 1) return null;
  const statement = totals[0]!;
  const othersDiffer = context.sampleSizes.some((other) => scopeOf(other) !== 'total' && other.value !== statement.value);
  return { value: statement.value, statement, severityAtMost: othersDiffer ? 'note' : 'warn' };
}

function plainNumber(value: number): ReportedNumber {
  return { value, text: String(value), decimals: 0, exponent: 0 };
}

/** "2 × 3", "2 x 2", "2-by-3" followed closely by a word for a contingency table or a chi-square. */
const DIMENSIONS =
  /(?<![\d.,])(\d{1,2})\s?(?:x|×|X|-?by-?)\s?(\d{1,2})(?![\d.,])(?=[\s-]{1,3}(?:\(?[A-Za-z-]{1,20}\)?\s{1,3}){0,2}(?:contingency|cross-?tab|table|chi|Chi|χ|X2|X²|X\^2))/g;

/** The chi-square's df from table dimensions stated in its sentence or the one before; null when none (or conflicting ones). */
function contingencyDf(text: string, result: ReportedResult): { df: number; statement: { text: string; start: number; end: number } } | null {
  if (result.start >= text.length) return null;
  const own = sentenceAround(text, result.start, Math.min(result.end, text.length));
  const previous = sentenceBefore(text, own.start);
  for (const sentence of previous === null ? [own] : [own, previous]) {
    const said = text.slice(sentence.start, sentence.end);
    const dfs = new Set<number>();
    let first: RegExpExecArray | null = null;
    DIMENSIONS.lastIndex = 0;
    for (let match = DIMENSIONS.exec(said); match !== null; match = DIMENSIONS.exec(said)) {
      const rows = Number(match[1]);
      const columns = Number(match[2]);
      if (rows < 2 || columns < 2) continue;
      dfs.add((rows - 1) * (columns - 1));
      first ??= match;
    }
    if (dfs.size === 1 && first !== null) {
      const start = sentence.start + first.index;
      return { df: [...dfs][0]!, statement: { text: first[0], start, end: start + first[0].length } };
    }
    if (dfs.size > 1) return null;
  }
  return null;
}

export interface DocumentDf {
  /** The results, with df filled in where the document gives them. */
  results: ReportedResult[];
  /** Per result: the most any finding about it may weigh, or null for no limit. */
  severityCaps: (Severity | null)[];
}

/** Fills in df that the results do not print but the document states (see the module comment). */
export function withDocumentDf(results: readonly ReportedResult[], context: DocumentContext, text: string): DocumentDf {
  let study: StudySample | null | undefined;
  const severityCaps: (Severity | null)[] = [];
  const filled = results.map((result): ReportedResult => {
    // df read from the text beside a table may be another analysis's: findings are at most warnings.
    severityCaps.push(result.dfFrom === 'text-beside-table' ? 'warn' : null);
    if (result.df.length > 0 || result.value === null || result.dfFrom !== undefined) return result;
    if (result.kind === 'r' && result.sampleSize === null) {
      study ??= studySampleSize(context);
      if (study === null || study.value < 4) return result;
      severityCaps[severityCaps.length - 1] = study.severityAtMost;
      const { text: statementText, start, end } = study.statement;
      return {
        ...result,
        df: [plainNumber(study.value - 2)],
        dfFrom: 'study-sample-size',
        sampleSize: plainNumber(study.value),
        dfStatement: { text: statementText, start, end },
      };
    }
    if (result.kind === 'chi2' && result.symbol === undefined && result.tableRow === undefined) {
      const found = contingencyDf(text, result);
      if (found === null) return result;
      severityCaps[severityCaps.length - 1] = 'warn';
      return { ...result, df: [plainNumber(found.df)], dfFrom: 'contingency-table', dfStatement: found.statement };
    }
    return result;
  });
  return { results: filled, severityCaps };
}
