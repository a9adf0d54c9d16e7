/**
 * Statements that p-values were adjusted for multiple comparisons, read from
 * one sentence: the method (Bonferroni, Holm, Šidák, Tukey, Scheffé, FDR /
 * Benjamini-Hochberg, or a plain "corrected" / "adjusted"), the number of
 * comparisons when it is stated ("for 3 comparisons", "α = .05/3"), and
 * whether the sentence speaks of all p-values or of follow-up comparisons.
 *
 * Used twice: by the document context (src/scan/context.ts, statements that
 * hold for the whole document) and by the checks, on the sentence of a
 * result and the sentence before it (src/checks/pAdjustment.ts). The
 * sentence may be original or normalised text, so both "α" and "alpha",
 * "Šidák" and "Sidak", "Scheffé" and "Scheffe" are read.
 *
 * Every pattern is anchored on a keyword and bounded, and the sentence is at
 * most a few hundred characters, so reading stays linear.
 */

import type { PAdjustmentMethod } from './types.js';

export interface AdjustmentReading {
  method: PAdjustmentMethod;
  /** Number of comparisons when stated; null otherwise. */
  comparisons: number | null;
  appliesTo: 'all' | 'post-hoc';
}

/** Any adjustment keyword: a sentence without one states no adjustment (a cheap first test). */
const ANY_KEYWORD = /Benjamini|discovery|FDR|Holm|Hochberg|id[aá]k|Bonferroni|Tukey|Scheff|Dunnett|Games|orrect|djust|\bp\s?[_({-]/i;

/** Named procedures, most specific first (Benjamini-Hochberg before Hochberg, Holm before Bonferroni in "Holm-Bonferroni"). */
const NAMED: ReadonlyArray<[RegExp, PAdjustmentMethod]> = [
  [/\bBenjamini|\bfalse[- ]discovery[- ]rate|\bFDR\b/i, 'fdr'],
  [/\bHolm\b/i, 'holm'],
  [/\bHochberg\b/i, 'hochberg'],
  [/(?<![A-Za-z])(?:Dunn[- ])?[SŠ]id[aá]k(?![A-Za-z])/i, 'sidak'],
  [/\bBonferroni\b/i, 'bonferroni'],
  [/\bTukey\b/i, 'tukey'],
  [/\bScheff[eé](?![A-Za-z])/i, 'scheffe'],
  [/\bDunnett\b/i, 'dunnett'],
  [/\bGames[- \u2013]Howell\b/i, 'games-howell'],
];

/** A p written with its adjustment: "p_adj", "padj", "p-adj", "p(adj)", "p_corr", "p_{Holm}", "p_bonf". */
const P_WITH_ADJUSTMENT = /\bp\s?[_({-]?\s?\{?(adj|adjusted|corr|corrected|bonf|bonferroni|holm|fdr|tukey|sidak|šidák|sidák)(?![A-Za-z])/i;

/** "corrected p", "adjusted alpha": the word tied to p-values. */
const ADJUSTED_P = /\b(?:corrected|adjusted)\s(?:p\b|p[- ]?values?|alpha|α|significance|thresholds?|levels?)/i;
/** "p values were ... corrected": "p values" followed within a few words by the word. */
const P_VALUES = /\bp[- ]?values?\b/i;
const ADJUSTED_AFTER_P_VALUES = /^[^.;]{0,60}?\b(?:corrected|adjusted)\b/i;
/** "p = .04 (corrected)", "p = .04, adjusted". */
const P_THEN_ADJUSTED = /\bp\s?[=<>≤≥]{1,2}\s?0?[.,]\d{1,6}\s?[,([]\s?(?:corrected|adjusted)\b/i;
/** "corrected for", "adjustment for": what follows says whether it is about multiplicity. */
const CORRECTED_FOR = /\b(?:corrected|adjusted|corrections?|adjustments?|correcting|adjusting|controlling)\sfor\s(?:the\s)?([a-z0-9]{1,20})/gi;
const MULTIPLICITY_AFTER_FOR: ReadonlySet<string> = new Set(['multiple', 'multiplicity', 'number', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten', 'eleven', 'twelve']);

/** Words that make a sentence about multiplicity, so a plain "corrected" or "adjusted" in it counts. */
const MULTIPLICITY = /\bmultiple[- ](?:comparisons?|testing|tests)|\bfamily[- ]?wise|\bpost[- ]?hoc\b|\bpairwise\b|\bmultiplicity\b/i;
const GENERIC_WORD = /\b(?:corrected|adjusted|correction|adjustment)\b/i;

/** "corrected" and "adjusted" that are about something else: sphericity, Welch, continuity, reliability, R², means, covariates. */
const OTHER_CORRECTIONS = [
  /\bsphericity|\bGreenhouse|\bHuynh|\bWelch|\bYates|\bcontinuity|\battenuation|\bitem-total|\bcorrected\sitem/i,
  /\b(?:age|sex|gender|baseline|covariate|risk|size|length|error|bias|ties?)-(?:adjusted|corrected)\b/i,
  /\badjusted\s(?:R\b|R2|R²|r-squared|means?|odds|scores?|models?)/i,
];

/** A sentence that says no adjustment was made. */
const NEGATED_WORD = /\b(?:uncorrected|unadjusted)\b/i;
const NEGATION_BEFORE = /\b(?:without|no|not)\s(?:[a-z]{1,20}[\s-]){0,2}$/i;
const ADJUSTMENT_WORDS = /\b(?:correct(?:ed|ion)|adjust(?:ed|ment))\b/gi;

/** Follow-up comparisons, as opposed to every test of the document. */
const POST_HOC = /\bpost[- ]?hoc\b|\bpairwise\b|\bfollow[- ]?up\b|\bsimple[- ]effects?\b|\bcontrasts?\b/i;
const COMPARISONS_WORD = /\bcomparisons?\b/i;
/** Phrases where "comparisons" counts them for the adjustment rather than naming follow-up tests. */
const MULTIPLICITY_COMPARISONS = /multiple[- ]comparisons?|number\sof\scomparisons|(?:for|across|over)\s(?:\d{1,3}|two|three|four|five|six|seven|eight|nine|ten|eleven|twelve)\scomparisons/gi;
/** Procedures that exist only for comparisons between groups. */
const POST_HOC_METHODS: ReadonlySet<PAdjustmentMethod> = new Set(['tukey', 'scheffe', 'dunnett', 'games-howell']);
const ALL_TESTS = /\ball\b|\bevery\b|\beach\b|\bthroughout\b|\bcorrelations\b|\bp[- ]?values\s(?:were|are)\b/i;

const WORD_COUNTS: Readonly<Record<string, number>> = {
  two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10, eleven: 11, twelve: 12,
};
const COMPARISON_NOUNS: ReadonlySet<string> = new Set([
  'comparisons', 'tests', 'contrasts', 'outcomes', 'correlations', 'hypotheses', 'measures', 'analyses', 'endpoints',
]);
/** A count and up to two words after it ("3 comparisons", "six pairwise comparisons"); the words are judged in code. */
const COUNT_AND_WORDS = /(?<![\w.,-])(\d{1,3}|two|three|four|five|six|seven|eight|nine|ten|eleven|twelve)\s([a-z-]{1,20})(?:\s([a-z]{1,20}))?/gi;
const PREPOSITION_BEFORE = /\b(?:for|across|over|by|of|with|among)\s(?:the\s)?$/i;
/** "α = .05/3", "alpha = 0.05 / 6", "p < .05/3". */
const DIVIDED_ALPHA = /(?:\balpha|α|\bp)\s?(?:=|<|<=|≤|of|at)\s?0?\.\d{1,3}\s?\/\s?(\d{1,3})(?!\d|\.\d)/i;

function countOf(written: string): number {
  return WORD_COUNTS[written.toLowerCase()] ?? Number(written);
}

/**
 * The number of comparisons a sentence states, or null: a divided alpha
 * ("α = .05/3"); a count after a preposition and before a word for tests
 * ("for 3 comparisons", "across six tests"); or a count of comparisons or
 * contrasts ("three pairwise comparisons").
 */
export function statedComparisons(sentence: string): number | null {
  const divided = DIVIDED_ALPHA.exec(sentence);
  if (divided !== null) return plausibleCount(countOf(divided[1]!));
  let counted: number | null = null;
  COUNT_AND_WORDS.lastIndex = 0;
  for (let match = COUNT_AND_WORDS.exec(sentence); match !== null; match = COUNT_AND_WORDS.exec(sentence)) {
    const words = [match[2]!.toLowerCase(), (match[3] ?? '').toLowerCase()];
    const count = plausibleCount(countOf(match[1]!));
    if (count === null) continue;
    const afterPreposition = PREPOSITION_BEFORE.test(sentence.slice(Math.max(0, match.index - 16), match.index));
    if (afterPreposition && words.some((word) => COMPARISON_NOUNS.has(word))) return count;
    if (counted === null && words.some((word) => word === 'comparisons' || word === 'contrasts')) counted = count;
  }
  return counted;
}

function plausibleCount(count: number): number | null {
  return Number.isInteger(count) && count >= 2 && count <= 500 ? count : null;
}

/** True when a plain "corrected" or "adjusted" is tied to p-values or to multiplicity. */
function tiedToP(sentence: string): boolean {
  if (ADJUSTED_P.test(sentence) || P_THEN_ADJUSTED.test(sentence)) return true;
  const pValues = P_VALUES.exec(sentence);
  return pValues !== null && ADJUSTED_AFTER_P_VALUES.test(sentence.slice(pValues.index + pValues[0].length, pValues.index + pValues[0].length + 80));
}

/** "corrected for multiple comparisons" (true) against "adjusted for age" (false); null when neither is said. */
function correctedFor(sentence: string): boolean | null {
  let verdict: boolean | null = null;
  CORRECTED_FOR.lastIndex = 0;
  for (let match = CORRECTED_FOR.exec(sentence); match !== null; match = CORRECTED_FOR.exec(sentence)) {
    const word = match[1]!.toLowerCase();
    if (MULTIPLICITY_AFTER_FOR.has(word) || /^\d/.test(word)) return true;
    verdict = false;
  }
  return verdict;
}

/** True when every adjustment word of the sentence is denied ("no correction", "not adjusted", "uncorrected"). */
function negated(sentence: string): boolean {
  if (NEGATED_WORD.test(sentence)) return true;
  let any = false;
  ADJUSTMENT_WORDS.lastIndex = 0;
  for (let match = ADJUSTMENT_WORDS.exec(sentence); match !== null; match = ADJUSTMENT_WORDS.exec(sentence)) {
    any = true;
    if (!NEGATION_BEFORE.test(sentence.slice(Math.max(0, match.index - 40), match.index))) return false;
  }
  return any;
}

/**
 * Reads an adjustment statement from one sentence, or null when the
 * sentence states none. With `requireMultiplicity` (document-wide
 * statements) a plain "corrected" or "adjusted" counts only when it is tied
 * to p-values or multiplicity; next to a result it counts unless it is about
 * something else (a covariate, sphericity, Welch, continuity).
 */
export function readAdjustment(sentence: string, requireMultiplicity: boolean): AdjustmentReading | null {
  if (sentence.length === 0 || !ANY_KEYWORD.test(sentence)) return null;
  let method: PAdjustmentMethod | null = null;
  for (const [pattern, named] of NAMED) {
    if (pattern.test(sentence)) {
      method = named;
      break;
    }
  }
  const pWithAdjustment = P_WITH_ADJUSTMENT.exec(sentence);
  if (method === null && pWithAdjustment !== null) {
    const label = pWithAdjustment[1]!.toLowerCase();
    method = label.startsWith('bonf')
      ? 'bonferroni'
      : label === 'holm'
        ? 'holm'
        : label === 'fdr'
          ? 'fdr'
          : label === 'tukey'
            ? 'tukey'
            : /^(?:s|š)[ií]d/.test(label)
              ? 'sidak'
              : 'unspecified';
  }
  if (method === null) {
    if (!GENERIC_WORD.test(sentence)) return null;
    const forWhat = correctedFor(sentence);
    const aboutMultiplicity = forWhat === true || MULTIPLICITY.test(sentence);
    // "Greenhouse-Geisser corrected p", "adjusted for age": another correction, unless multiplicity is named too.
    if (!aboutMultiplicity && (forWhat === false || OTHER_CORRECTIONS.some((pattern) => pattern.test(sentence)))) return null;
    if (requireMultiplicity && !aboutMultiplicity && !tiedToP(sentence)) return null;
    method = 'unspecified';
  }
  if (pWithAdjustment === null && negated(sentence)) return null;
  const comparisons = statedComparisons(sentence);
  // Post hoc procedures, words for follow-up comparisons and a bare "comparisons" make it about
  // follow-up tests ("for multiple comparisons", "for 3 comparisons" are about multiplicity, not
  // follow-up tests); "all", "every", "p values were" about every test; anything else, follow-up tests.
  const bareComparisons = COMPARISONS_WORD.test(sentence.replace(MULTIPLICITY_COMPARISONS, ''));
  const appliesTo: AdjustmentReading['appliesTo'] =
    POST_HOC_METHODS.has(method) || POST_HOC.test(sentence) || bareComparisons || !ALL_TESTS.test(sentence) ? 'post-hoc' : 'all';
  return { method, comparisons, appliesTo };
}

/** A name for the method as a message gives it. */
export function adjustmentName(method: PAdjustmentMethod): string {
  switch (method) {
    case 'bonferroni':
      return 'Bonferroni';
    case 'sidak':
      return 'Šidák';
    case 'holm':
      return 'Holm';
    case 'hochberg':
      return 'Hochberg';
    case 'fdr':
      return 'false discovery rate (Benjamini-Hochberg)';
    case 'tukey':
      return 'Tukey';
    case 'scheffe':
      return 'Scheffé';
    case 'dunnett':
      return 'Dunnett';
    case 'games-howell':
      return 'Games-Howell';
    case 'unspecified':
      return 'an adjustment for multiple comparisons';
  }
}
