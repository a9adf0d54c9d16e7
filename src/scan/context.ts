/**
 * Document context, read once per manuscript: the declared alpha level,
 * statements of one-tailed testing, stated sample sizes with what they count
 * (the whole sample, a part of it, each group, one test), statements that a
 * sphericity correction was applied, and statements that p-values were
 * adjusted for multiple comparisons.
 *
 * One global regular expression of plain keywords finds candidates in a
 * single pass; each candidate is then examined with small anchored patterns
 * on a bounded slice around it, so the cost stays linear in the text length.
 */

import type { NormalisedText } from './normalise.js';
import { readAdjustment } from './pAdjustment.js';
import type {
  ContextStatement,
  DeclaredAlpha,
  DocumentContext,
  PAdjustmentStatement,
  SampleScope,
  SphericityStatement,
  StatedSampleSize,
} from './types.js';

/**
 * Candidates for context statements, chosen for speed: each alternative
 * starts with the least common letters of its keyword ("lpha" for alpha,
 * "gnifican" for significance), so the regular expression engine can skip
 * most of the text. The keyword's start is recovered afterwards.
 * "\d [a-z]" finds counts followed by a word ("120 participants"); "n ="
 * a group size that may be stated per group ("n = 20 per group"). The
 * adjustment keywords ("onferroni", "djust", "orrect", ...) find statements
 * that p-values were adjusted for multiple comparisons.
 */
const CONTEXT_ANCHOR =
  /lpha|gnifican|ailed|ided|ctional|hericity|Greenh|Huynh|N\s{0,2}=|n\s{0,2}=|\d [A-Za-z]|onferroni|Tukey|Holm|idak|id\u00e1k|cheff|enjamini|ochberg|FDR|alse discovery|Dunnett|Games|djust|orrect/g;

/** How far a statement's sentence is searched for around a keyword. */
const SENTENCE_REACH = 300;
/** The slice examined after a keyword (an alpha value). */
const FORWARD_REACH = 80;
/** The slice examined before a keyword (a p before "significant"). */
const BACKWARD_REACH = 100;

/** Nouns that make a count a sample size ("86 adults"); up to two describing words may stand between. */
const SAMPLE_NOUNS: ReadonlySet<string> = new Set([
  'participants', 'subjects', 'students', 'respondents', 'volunteers', 'adults', 'children', 'adolescents',
  'infants', 'patients', 'individuals', 'undergraduates', 'people', 'persons', 'workers', 'employees', 'pupils',
  'dyads', 'couples', 'families', 'observers', 'listeners', 'raters', 'athletes', 'teachers', 'parents', 'mothers',
  'fathers', 'women', 'men', 'participant', 'volunteers', 'toddlers', 'preschoolers', 'twins', 'clients', 'veterans',
  'girls', 'boys', 'males', 'females',
]);

const TENS = ['twenty', 'thirty', 'forty', 'fifty', 'sixty', 'seventy', 'eighty', 'ninety'];
const UNITS = ['one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine'];
const TEENS = ['ten', 'eleven', 'twelve', 'thirteen', 'fourteen', 'fifteen', 'sixteen', 'seventeen', 'eighteen', 'nineteen'];
/** A count from 10 to 99 in words, then a space and a letter: "Thirty-two healthy", "twelve children". */
const SPELLED_COUNT = new RegExp(`(?:(${TENS.join('|')})(?:[-\\u2010\\u2011 ](${UNITS.join('|')}))?|(${TEENS.join('|')})) (?=[A-Za-z])`, 'gi');

function spelledValue(match: RegExpExecArray): number {
  if (match[3] !== undefined) return 10 + TEENS.indexOf(match[3].toLowerCase());
  return 10 * (TENS.indexOf(match[1]!.toLowerCase()) + 2) + (match[2] === undefined ? 0 : UNITS.indexOf(match[2].toLowerCase()) + 1);
}

/**
 * Whether a count in words is the tail of a larger one ("One hundred and twenty participants"): read alone it
 * would be a wrong sample size, and a wrong N is worse than none.
 */
function endsLargerNumberWord(text: string, at: number): boolean {
  const before = text.slice(Math.max(0, at - 14), at).toLowerCase().replace(/[\s\u2010\u2011-]+/g, ' ').trimEnd();
  const withoutAnd = before.endsWith(' and') ? before.slice(0, -4) : before;
  return withoutAnd.endsWith('hundred') || withoutAnd.endsWith('thousand');
}

/** Reads the document context from the normalised text; offsets are mapped to the original. */
export function readDocumentContext(normalised: NormalisedText): DocumentContext {
  const text = normalised.text;
  const found = new ContextCollector(normalised);
  const anchor = new RegExp(CONTEXT_ANCHOR.source, CONTEXT_ANCHOR.flags);
  // Counts written in words, as a sentence must begin ("Thirty-two healthy subjects were enrolled"), read in
  // their place among the other statements (the collector takes statements in the order of the text).
  const spelled = new RegExp(SPELLED_COUNT.source, SPELLED_COUNT.flags);
  let word = spelled.exec(text);
  const readWordsBefore = (position: number): void => {
    for (; word !== null && word.index < position; word = spelled.exec(text)) {
      if (isWholeWordStart(text, word.index) && !endsLargerNumberWord(text, word.index)) found.sampleSize(readSampleNoun(text, word.index + word[0].length, word.index, spelledValue(word)));
    }
  };
  for (let match = anchor.exec(text); match !== null; match = anchor.exec(text)) {
    readWordsBefore(match.index);
    readCandidate(text, match.index, match[0], found);
  }
  readWordsBefore(text.length);
  return found.finish();
}

/** Recovers the keyword a candidate belongs to and reads its statement into `found`. */
function readCandidate(text: string, at: number, anchor: string, found: ContextCollector): void {
  switch (anchor) {
    case 'lpha':
      if (hasWordBefore(text, at, 'a')) found.alpha(readAlphaStatement(text, at - 1));
      return;
    case 'gnifican': {
      if (!hasWordBefore(text, at, 'si')) return;
      const keywordEnd = at + anchor.length + (text.startsWith('ce', at + anchor.length) ? 2 : text.charCodeAt(at + anchor.length) === 116 ? 1 : 0);
      found.alpha(readSignificanceStatement(text, at - 2, text.slice(at - 2, keywordEnd)));
      return;
    }
    case 'ailed':
      if (hasWordBefore(text, at, 't')) found.oneTailed(readOneTailed(text, at - 1, 'tailed'));
      return;
    case 'ided':
      if (hasWordBefore(text, at, 's')) found.oneTailed(readOneTailed(text, at - 1, 'sided'));
      return;
    case 'ctional':
      if (hasWordBefore(text, at, 'dire') || hasWordBefore(text, at, 'unidire')) {
        found.oneTailed(readDirectional(text, at + anchor.length));
      }
      return;
    case 'hericity':
      if (hasWordBefore(text, at, 'sp')) found.sphericity(readSphericity(text, at - 2, 'sphericity'));
      return;
    case 'Greenh':
      if (isWholeWordStart(text, at)) found.sphericity(readSphericity(text, at, 'Greenhouse'));
      return;
    case 'Huynh':
      if (isWholeWordStart(text, at)) found.sphericity(readSphericity(text, at, 'Huynh'));
      return;
    default: {
      const first = anchor.charCodeAt(0);
      if (first === 78) found.sampleSize(readCapitalN(text, at));
      else if (first === 110) found.sampleSize(readLowerNPerGroup(text, at) ?? readLowerNAfterSampleNoun(text, at));
      else if (first >= 48 && first <= 57) found.sampleSize(readCountBeforeNoun(text, at) ?? readCountWithoutNoun(text, at));
      else found.adjustment(text, at);
    }
  }
}

/**
 * True when `prefix` (compared case-insensitively on its first letter)
 * stands right before `at` and starts a word: "a" + "lpha" is "alpha",
 * but "sha" + "lpha"... is not.
 */
function hasWordBefore(text: string, at: number, prefix: string): boolean {
  const start = at - prefix.length;
  if (start < 0 || !isWholeWordStart(text, start)) return false;
  if ((text.charCodeAt(start) | 0x20) !== prefix.charCodeAt(0)) return false;
  return text.startsWith(prefix.slice(1), start + 1);
}

function isWholeWordStart(text: string, at: number): boolean {
  if (at === 0) return true;
  const before = text.charCodeAt(at - 1);
  return !((before >= 65 && before <= 90) || (before >= 97 && before <= 122) || (before >= 48 && before <= 57) || before === 95);
}

interface Span {
  start: number;
  end: number;
}

/** Document-wide adjustment statements kept; a real document has a handful, and reading stops there. */
const MAX_ADJUSTMENT_STATEMENTS = 100;

/** Keeps what was found, in normalised offsets, and maps it to the original text at the end. */
class ContextCollector {
  private declaredAlpha: (Span & { value: number }) | null = null;
  private readonly oneTailedSpans: Span[] = [];
  private readonly sampleSizeSpans: Array<Span & { value: number }> = [];
  private readonly sphericitySpans: Array<Span & { method: SphericityStatement['method'] }> = [];
  private readonly sampleScopes: SampleScope[] = [];
  private readonly adjustmentSpans: Array<Span & Omit<PAdjustmentStatement, 'text' | 'start' | 'end'>> = [];
  /** End of the last sentence examined for an adjustment: each sentence is read once, however many keywords it holds. */
  private adjustmentExaminedUpTo = -1;

  constructor(private readonly normalised: NormalisedText) {}

  /** A sentence holding an adjustment keyword at `at`: read once, kept when it states a document-wide adjustment. */
  adjustment(text: string, at: number): void {
    if (at < this.adjustmentExaminedUpTo || this.adjustmentSpans.length >= MAX_ADJUSTMENT_STATEMENTS) return;
    const sentence = sentenceAround(text, at, at + 1);
    this.adjustmentExaminedUpTo = sentence.end;
    const found = readAdjustmentStatement(text, sentence);
    if (found !== null) this.adjustmentSpans.push(found);
  }

  /** The first declaration wins: later ones are usually corrected levels for follow-up tests. */
  alpha(found: (Span & { value: number }) | null): void {
    if (found !== null && this.declaredAlpha === null) this.declaredAlpha = found;
  }

  oneTailed(found: Span | null): void {
    if (found === null) return;
    const last = this.oneTailedSpans[this.oneTailedSpans.length - 1];
    if (last !== undefined && last.start === found.start) return; // one statement per sentence
    this.oneTailedSpans.push(found);
  }

  sampleSize(found: (Span & { value: number; scope: SampleScope }) | null): void {
    if (found === null) return;
    const last = this.sampleSizeSpans[this.sampleSizeSpans.length - 1];
    if (last !== undefined && found.start < last.end) return; // "a total of 86 adults": already read once
    this.sampleSizeSpans.push(found);
    this.sampleScopes.push(found.scope);
  }

  sphericity(found: (Span & { method: SphericityStatement['method'] }) | null): void {
    if (found === null) return;
    const sameSentence = this.sphericitySpans.filter((span) => span.start === found.start);
    if (found.method === 'unspecified' && sameSentence.length > 0) return;
    if (sameSentence.some((span) => span.method === found.method)) return;
    // A named method replaces a generic mention of the same sentence.
    const generic = this.sphericitySpans.findIndex((span) => span.start === found.start && span.method === 'unspecified');
    if (generic !== -1) this.sphericitySpans.splice(generic, 1);
    this.sphericitySpans.push(found);
  }

  finish(): DocumentContext {
    const alpha = this.declaredAlpha;
    return {
      alpha: alpha === null ? null : ({ ...this.statement(alpha), value: alpha.value } satisfies DeclaredAlpha),
      oneTailed: this.oneTailedSpans.map((span) => this.statement(span)),
      sampleSizes: this.sampleSizeSpans.map(
        (span, i) => ({ ...this.statement(span), value: span.value, scope: this.sampleScopes[i]! }) satisfies StatedSampleSize,
      ),
      sphericity: this.sphericitySpans.map((span) => ({ ...this.statement(span), method: span.method })),
      pAdjustments: this.adjustmentSpans.map((span) => ({
        ...this.statement(span),
        method: span.method,
        comparisons: span.comparisons,
        appliesTo: span.appliesTo,
      })),
    };
  }

  private statement(span: Span): ContextStatement {
    const start = this.normalised.toOriginal(span.start);
    const end = this.normalised.toOriginalEnd(span.end);
    return { text: this.normalised.original.slice(start, end), start, end };
  }
}

/**
 * The sentence around [start, end): back to the previous ".", "!", "?"
 * followed by a space (or a blank line), forward to the next; each side is
 * cut at SENTENCE_REACH characters.
 */
function sentenceAround(text: string, start: number, end: number): Span {
  let from = start;
  const lowest = Math.max(0, start - SENTENCE_REACH);
  while (from > lowest && !isSentenceBreakBefore(text, from)) from--;
  let to = end;
  const highest = Math.min(text.length, end + SENTENCE_REACH);
  while (to < highest && !isSentenceEnd(text, to)) to++;
  if (to < highest) to++; // keep the full stop
  while (from < to && isSpace(text.charCodeAt(from))) from++;
  return { start: from, end: to };
}

function isSpace(code: number): boolean {
  return code === 32 || code === 10 || code === 13 || code === 9;
}

/** True when a sentence starts at `at` (the text before it ends a sentence or a paragraph). */
function isSentenceBreakBefore(text: string, at: number): boolean {
  const before = text.charCodeAt(at - 1);
  if (!isSpace(before)) return false;
  const mark = text.charCodeAt(at - 2);
  return mark === 46 || mark === 33 || mark === 63 || (before === 10 && mark === 10);
}

function isSentenceEnd(text: string, at: number): boolean {
  const code = text.charCodeAt(at);
  if (code !== 46 && code !== 33 && code !== 63) return code === 10 && text.charCodeAt(at + 1) === 10;
  const after = text.charCodeAt(at + 1);
  return Number.isNaN(after) || isSpace(after);
}

// ---------------------------------------------------------------- alpha

/** A significance level: a small proportion written with a leading "0." or ".". */
const LEVEL = String.raw`(0?\.\d{1,4})(?![\d])`;

/** After "alpha": "alpha = .01", "alpha level of .05", "alpha was set at .005", "alpha < .05". */
const AFTER_ALPHA = new RegExp(
  String.raw`^alpha(?:[ -]?levels?)?\s{0,3}(?:(?:was|is|of)\s{1,3})?(?:(?:set|fixed|chosen|specified)\s{1,3})?(?:(?:at|to|as|of)\s{1,3})?(?:(?:=|<=?|:)\s{0,3})?` +
    LEVEL,
  'i',
);

/** Words that show an "alpha" is a reliability coefficient, not a significance level. */
const RELIABILITY = /cronbach|krippendorff|reliab|internal consistency|ordinal alpha|coefficient alpha/i;

/** Largest value accepted as a declared alpha level. */
const MAX_ALPHA = 0.2;

function readAlphaStatement(text: string, at: number): (Span & { value: number }) | null {
  const match = AFTER_ALPHA.exec(text.slice(at, at + FORWARD_REACH));
  if (match === null) return null;
  const value = Number(match[1]);
  if (!(value > 0 && value <= MAX_ALPHA)) return null;
  const sentence = sentenceAround(text, at, at + match[0].length);
  if (RELIABILITY.test(text.slice(sentence.start, sentence.end))) return null;
  return { ...sentence, value };
}

/** After "significance": "significance level of .10", "significance was set at p < .05". */
const AFTER_SIGNIFICANCE = new RegExp(
  String.raw`^significance(?:\s{1,3}(?:level|threshold|criterion))?\s{0,3}(?:(?:was|is|of)\s{1,3})?(?:(?:set|fixed|accepted|chosen)\s{1,3})?(?:(?:at|to|as|of)\s{1,3})?(?:(?:p|alpha)\s{0,3}(?:=|<=?)\s{0,3})?(?:(?:=|<=?)\s{0,3})?` +
    LEVEL,
  'i',
);

/** Before "significant": "p < .01 was considered", "p values below .01 were deemed statistically". */
const BEFORE_SIGNIFICANT = new RegExp(
  String.raw`\bp(?:[- ]?values?)?\s{0,3}(?:<=?|below|under|less than|smaller than|lower than|of less than)\s{0,3}` +
    LEVEL +
    String.raw`\s{1,3}(?:(?:was|were|is|are)\s{1,3})?(?:considered|deemed|regarded as|taken as|treated as|defined as|accepted as|interpreted as)\s{1,3}(?:statistically\s{1,3})?$`,
  'i',
);

/** "considered (statistically) significant" just before "significant". */
const CONSIDERED_BEFORE = /(?:considered|deemed|regarded as|taken as|treated as|defined as|accepted as|interpreted as)\s{1,3}(?:statistically\s{1,3})?$/i;

/** After "significant": "at p < .01", "if p <= .05", "at the .01 level", "at alpha = .05". */
const AFTER_SIGNIFICANT = new RegExp(
  String.raw`^significant\s{1,3}(?:at|if|when|for)\s{1,3}(?:the\s{1,3})?(?:(?:p|alpha)\s{0,3}(?:=|<=?)\s{0,3})?(?:an?\s{1,3}alpha\s{1,3}(?:level\s{1,3})?of\s{1,3})?` +
    LEVEL,
  'i',
);

function readSignificanceStatement(text: string, at: number, keyword: string): (Span & { value: number }) | null {
  const ahead = text.slice(at, at + FORWARD_REACH);
  let match: RegExpExecArray | null = null;
  let matchStart = at;
  if (/^significance$/i.test(keyword)) {
    match = AFTER_SIGNIFICANCE.exec(ahead);
  } else {
    const behind = text.slice(Math.max(0, at - BACKWARD_REACH), at);
    const before = BEFORE_SIGNIFICANT.exec(behind);
    if (before !== null) {
      match = before;
      matchStart = at - behind.length + before.index;
    } else if (CONSIDERED_BEFORE.test(behind)) {
      // "was significant at p < .05" reports a result; only "considered significant at ..." declares a level.
      match = AFTER_SIGNIFICANT.exec(ahead);
    }
  }
  if (match === null) return null;
  const value = Number(match[1]);
  if (!(value > 0 && value <= MAX_ALPHA)) return null;
  return { ...sentenceAround(text, matchStart, at + keyword.length), value };
}

// ---------------------------------------------------------------- one-tailed

/** What must precede "tailed" / "sided" for a one-tailed statement: "one-", "one ", "one" (joined line break), "1-". */
const ONE_BEFORE = /(?:^|[^A-Za-z0-9])(?:[Oo]ne|1)[- ]?$/;

/** "one-tailed", "one-sided", "1-tailed": the keyword ("tailed" or "sided") starts at `at`. */
function readOneTailed(text: string, at: number, keyword: string): Span | null {
  const before = text.slice(Math.max(0, at - 6), at);
  const one = ONE_BEFORE.exec(before);
  if (one === null) return null;
  const start = at - before.length + one.index + (one[0].length > 0 && !/^[Oo1]/.test(one[0]) ? 1 : 0);
  // "two-tailed rather than one-tailed", "no one-sided tests": not a statement of one-tailed testing.
  if (NEGATED_ONE_TAILED.test(text.slice(Math.max(0, start - 40), start))) return null;
  return sentenceAround(text, start, at + keyword.length);
}

/** Words before "one-tailed" that deny it. */
const NEGATED_ONE_TAILED = /(?:\bnot|\bno|\brather\s{1,3}than|\binstead\s{1,3}of|\bnever)\s{1,3}(?:(?:a|an|the|as|any|using|use)\s{1,3})?$/i;

/** Prefixes that turn "directional" into its opposite. */
const NEGATING_PREFIX = /(?:non|bi|two|omni)[- ]?$/i;

/** "directional hypotheses" / "directional tests"; `end` is just after "directional". */
function readDirectional(text: string, end: number): Span | null {
  const start = text.lastIndexOf('irectional', end) - 1;
  if (start < 0) return null;
  const wordStart = text.charCodeAt(start - 1) === 105 ? start - 3 : start; // "uni"directional
  if (NEGATING_PREFIX.test(text.slice(Math.max(0, wordStart - 5), wordStart))) return null;
  // "directional" alone is an adjective of many things; it must qualify a test or hypothesis.
  const after = text.slice(end, end + 20);
  if (!/^\s{1,3}(?:hypothes[ie]s|tests?|predictions?|testing|alternative)/i.test(after)) return null;
  return sentenceAround(text, wordStart, end);
}

// ---------------------------------------------------------------- sphericity

/**
 * A sentence that mentions sphericity states a correction only if it says
 * "correct..." without negating it; a named correction counts unless negated.
 */
const CORRECTION = /correct/i;
const NO_CORRECTION = /\bno correction|\bnot (?:be )?(?:corrected|violated|needed|necessary|required)|without correction|was met|were met/i;

function readSphericity(text: string, at: number, keyword: string): (Span & { method: SphericityStatement['method'] }) | null {
  const sentence = sentenceAround(text, at, at + keyword.length);
  const said = text.slice(sentence.start, sentence.end);
  if (NO_CORRECTION.test(said)) return null;
  if (keyword === 'Greenhouse' || keyword === 'Huynh') {
    const name = text.slice(at, at + 24);
    const named = keyword === 'Greenhouse' ? /^Greenhouse[- ]{1,3}Geisser/ : /^Huynh[- ]{1,3}Feldt/;
    if (!named.test(name)) return null;
    return { ...sentence, method: keyword === 'Greenhouse' ? 'greenhouse-geisser' : 'huynh-feldt' };
  }
  if (!CORRECTION.test(said)) return null;
  return { ...sentence, method: 'unspecified' };
}

// ---------------------------------------------------------------- p-value adjustments

/** A p-value or test statistic reported in a sentence: such a sentence reports results, it does not state a method for the document. */
const REPORTED_VALUE = /\bp\s?[=<>]\s?0?[.,]\d|\b(?:F|t|r|z|chi\^?2)\s?(?:\([\d.,; N=]{1,20}\)\s?)?=\s?-?\d/;

/**
 * A document-wide statement that p-values were adjusted ("All post hoc
 * comparisons were Bonferroni-corrected", "p values were adjusted with
 * Holm's method"): a sentence naming an adjustment, not reporting results.
 * Statements beside a result are found by the checks, which read the
 * result's own sentence and the one before.
 */
function readAdjustmentStatement(text: string, sentence: Span): (Span & Omit<PAdjustmentStatement, 'text' | 'start' | 'end'>) | null {
  const said = text.slice(sentence.start, sentence.end);
  if (REPORTED_VALUE.test(said)) return null;
  const reading = readAdjustment(said, true);
  return reading === null ? null : { ...sentence, ...reading };
}

// ---------------------------------------------------------------- sample sizes

/** "N = 120" / "N = 1,024" (capital N: the whole sample; a lower-case n is a group). */
const CAPITAL_N = /^N\s{0,2}=\s{0,2}(\d{1,3}(?:,\d{3}){1,2}|\d{1,7})(?!\d|\.\d)/;

/**
 * Before an "N =" that belongs to one test: inside a statistic's brackets
 * ("χ2(2, N = 120)") or after its value or p ("r = .30, N = 90").
 */
const TEST_BEFORE = /(?:[([]\s{0,2}\d{1,5}(?:\.\d{1,3})?\s{0,2}[,;]\s{0,2}|(?:=|<|>)\s{0,2}-?\d{0,5}\.?\d{1,6}\s{0,2}[,;]\s{0,2})$/;
/** After an "N =" that belongs to one test: a statistic follows in the same brackets, "(N = 18, r = −0.595, p = .009)". */
const TEST_AFTER = /^\s{0,2}[,;]\s{0,2}(?:r|rs|\u03c1|rho|t|F|z|\u03c7\s?2|chi2|X2)\s{0,2}(?:\(\s{0,2}\d|=|<|>)/;
/** Before a count of part of the sample: "a subsample (N = 60)", "of these, 40 women", "only 96 participants". */
const SUBSET_BEFORE =
  /(?:\bof\s(?:these|them|whom|those)[,:]?|\bsub-?samples?(?:\sof)?|\bsubsets?(?:\sof)?|\bsub-?groups?(?:\sof)?|\bonly|\bavailable\s(?:for|from)|\b(?:measures?|scores?|ratings?|recordings?|samples?)\s(?:for|from))[\s(]{1,3}(?:the\s)?$/i;
/** After a count and its noun, words that make it part of the sample: "17 men and 31 women", "96 participants completed the follow-up". */
const SUBSET_AFTER =
  /^\s?(?:and\s\d|(?:also\s)?(?:completed|attended|returned)\s(?:the\s)?(?:follow|second|retest|re-test|both|all|post|final|delayed|later)|provided\s[^.;]{0,40}?\b(?:samples?|data)\b|(?:had|with)\s(?:complete|valid|usable|available)|for\swhom)/i;
/** Before the second count of "17 men and 31 women": a count and up to three words, then "and". */
const SECOND_PART_BEFORE = /\d\s(?:[A-Za-z-]{1,20}\s){1,3}and\s$/;
/** Nouns that name a part of a sample ("17 men"). */
const PART_NOUNS: ReadonlySet<string> = new Set(['men', 'women', 'boys', 'girls', 'mothers', 'fathers', 'males', 'females']);
/** After a count (and its noun), words that make it a group's size: "20 in each condition", "(N = 20 per group)". */
const PER_GROUP_AFTER =
  /^\s?(?:(?:(?:were|was)\s(?:randomly\s)?(?:assigned|allocated)\sto\s)?(?:per|in\seach|in\severy|for\seach|each)\s(?:of\s(?:the\s)?(?:[a-z]{1,20}\s)?)?(?:groups?|conditions?|cells?|arms?|treatments?|sites?|classes|schools?)\b|each(?=\s?[),;]))/i;

/**
 * After "N = 12": a group's name and, after a comma, the next group's count and name ("N = 12 control + vehicle,
 * 13 control + Aβ, 12 0.01% EHT + vehicle"): the sizes of the groups one by one, none of them the total.
 */
const GROUP_SIZE_LIST = /^\s(?:[A-Za-z][^\d,;()]{0,40})[,;]\s?(?:and\s)?\d{1,5}\s[^\s,;()]/;

function isGroupSizeList(after: string): boolean {
  const list = GROUP_SIZE_LIST.exec(after);
  if (list === null) return false;
  // ("N = 120 participants, 60 women": a sample noun names the total.)
  const firstWord = /^\s([A-Za-z]+)/.exec(after)![1]!.toLowerCase();
  return !SAMPLE_NOUNS.has(firstWord);
}

function readCapitalN(text: string, at: number): (Span & { value: number; scope: SampleScope }) | null {
  if (!isWholeWordStart(text, at)) return null;
  const match = CAPITAL_N.exec(text.slice(at, at + 24));
  if (match === null) return null;
  const end = at + match[0].length;
  const before = text.slice(Math.max(0, at - 30), at);
  const scope: SampleScope = PER_GROUP_AFTER.test(text.slice(end, end + 50)) || isGroupSizeList(text.slice(end, end + 160))
    ? 'per-group'
    : TEST_BEFORE.test(before) || TEST_AFTER.test(text.slice(end, end + 30))
      ? 'test'
      : SUBSET_BEFORE.test(before)
        ? 'subset'
        : 'total';
  return { start: at, end, value: parseCount(match[1]!), scope };
}

/** "n = 20 per group", "n = 15 in each condition", "(n = 20 each)": a lower-case n is read only as a per-group statement. */
const LOWER_N_PER_GROUP = /^n\s{0,2}=\s{0,2}(\d{1,5})(?!\d|\.\d)/;

function readLowerNPerGroup(text: string, at: number): (Span & { value: number; scope: SampleScope }) | null {
  if (!isWholeWordStart(text, at)) return null;
  const match = LOWER_N_PER_GROUP.exec(text.slice(at, at + 16));
  if (match === null) return null;
  const end = at + match[0].length;
  const after = PER_GROUP_AFTER.exec(text.slice(end, end + 50));
  if (after === null || Number(match[1]) === 0) return null;
  return { start: at, end: end + after[0].length, value: Number(match[1]), scope: 'per-group' };
}

/** A noun for the whole sample right before a bracketed lower-case n: "Questionnaires (n=125)", "participants (n = 86)". */
const WHOLE_SAMPLE_NOUN_BEFORE = /\b(?:participants|respondents|subjects|questionnaires|responses|surveys|sample|students|individuals|volunteers)\s?\(\s?$/i;
/** "of the students (", "20% of participants (": the noun names a part of the sample. */
const PART_OF_NOUN_BEFORE = /(?:\bof|%)\s(?:the\s|these\s|our\s|all\s)?(?:[A-Za-z-]{1,20}\s)?[A-Za-z]{1,20}\s?\(\s?$/i;
/** After the bracket, another group's count: "patients (n = 40) and controls (n = 38)" names parts of the sample. */
const ANOTHER_GROUP_AFTER = /^\s?\)\s?(?:,|;|and\b|vs\.?|versus\b|or\b)/i;

/**
 * "Questionnaires (n=125) were collected": a lower-case n in brackets right after a noun for the whole sample is
 * the study's size, unless another group's count follows ("participants (n = 40) and controls (n = 38)").
 */
function readLowerNAfterSampleNoun(text: string, at: number): (Span & { value: number; scope: SampleScope }) | null {
  if (!isWholeWordStart(text, at)) return null;
  if (!WHOLE_SAMPLE_NOUN_BEFORE.test(text.slice(Math.max(0, at - 20), at))) return null;
  const match = LOWER_N_PER_GROUP.exec(text.slice(at, at + 16));
  if (match === null || Number(match[1]) === 0) return null;
  const end = at + match[0].length;
  if (ANOTHER_GROUP_AFTER.test(text.slice(end, end + 12))) return null;
  // "20% of the students (n = 43)": a part of the sample.
  const part = PART_OF_NOUN_BEFORE.test(text.slice(Math.max(0, at - 60), at));
  return { start: at, end, value: Number(match[1]), scope: part ? 'subset' : 'total' };
}

/** Words after a count that mean it is not the sample ("3 participants were excluded"). */
const EXCLUDED_AFTER = /^\s{0,3}(?:(?:were|was|had been|had to be)\s{1,3})?(?:excluded|removed|dropped|omitted|discarded|lost|withdrew|did not|failed|declined)/i;
const EXCLUDED_BEFORE = /(?:exclud\w{0,4}|remov\w{0,4}|dropp\w{0,4}|omitt\w{0,4}|discard\w{0,4}|(?:data|responses) (?:of|from))\s{1,3}(?:the\s{1,3})?(?:data\s{1,3}(?:of|from)\s{1,3})?$/i;

/** Longest count read backwards from its last digit ("1,024,000"). */
const MAX_COUNT_LENGTH = 9;
/** Describing words allowed between a count and its noun ("120 undergraduate psychology students"). */
const MAX_WORDS_BEFORE_NOUN = 2;
const MAX_WORD_LENGTH = 20;

/** The count whose last digit is at `lastDigitAt`: its start and written form, or null when it is part of something else. */
function countEndingAt(text: string, lastDigitAt: number): { start: number; written: string } | null {
  let countStart = lastDigitAt;
  const lowest = Math.max(0, lastDigitAt - MAX_COUNT_LENGTH);
  while (countStart > lowest && isCountCode(text.charCodeAt(countStart - 1))) countStart--;
  while (text.charCodeAt(countStart) === 44) countStart++; // a comma is not part of the count's start
  const before = text.charCodeAt(countStart - 1);
  if (before === 46 || isLetterCode(before)) return null; // "4.120 ms", "A2 adults"
  // "Year 9 students", "Study 2 participants": a label's number, not a count.
  if (LABEL_BEFORE_NUMBER.test(text.slice(Math.max(0, countStart - 12), countStart))) return null;
  const written = text.slice(countStart, lastDigitAt + 1);
  if (!/^(?:\d{1,3}(?:,\d{3}){1,2}|\d{1,7})$/.test(written)) return null;
  return { start: countStart, written };
}

/** Words whose number labels something ("Year 9", "Grade 3", "Study 2"); a describing word may be one with its number ("120 Year 9 students"). */
const LABEL_BEFORE_NUMBER = /\b(?:year|grade|form|class|stage|study|experiment|wave|phase|session|time|level|table|figure)\s{1,3}$/i;
const LABEL_WORDS: ReadonlySet<string> = new Set(['year', 'grade', 'form', 'class', 'stage']);

/**
 * A count followed by a sample noun: "86 adults", "120 undergraduate
 * psychology students", "1,024 respondents". `lastDigitAt` holds the count's
 * last digit, which a space and a letter follow. Its scope comes from the
 * words around it: "20 participants in each condition" (per group), "17 men
 * and 31 women", "only 96 participants", "96 participants completed the
 * follow-up" (part of the sample); otherwise the whole sample.
 */
function readCountBeforeNoun(text: string, lastDigitAt: number): (Span & { value: number; scope: SampleScope }) | null {
  const count = countEndingAt(text, lastDigitAt);
  if (count === null) return null;
  return readSampleNoun(text, lastDigitAt + 2, count.start, parseCount(count.written));
}

/**
 * The sample noun after a count whose value is `value` and which starts at
 * `countStart`; `at` is the first letter after the count and its space.
 */
function readSampleNoun(text: string, wordsAt: number, countStart: number, value: number): (Span & { value: number; scope: SampleScope }) | null {
  let at = wordsAt;
  // "fifteen of the participants", "12 of our students": a part of the sample, not its size.
  let partOf = false;
  for (let word = 0; word <= MAX_WORDS_BEFORE_NOUN; word++) {
    const wordStart = at;
    const limit = Math.min(text.length, at + MAX_WORD_LENGTH + 1);
    while (at < limit && (isLetterCode(text.charCodeAt(at)) || text.charCodeAt(at) === 45)) at++;
    if (at === wordStart || isLetterCode(text.charCodeAt(at))) return null;
    const noun = text.slice(wordStart, at).toLowerCase();
    // "120 Year 9 students": the label's number belongs to the describing word.
    if (LABEL_WORDS.has(noun) && text.charCodeAt(at) === 32 && isDigitCode(text.charCodeAt(at + 1))) {
      at++;
      const digitsEnd = Math.min(text.length, at + 3);
      while (at < digitsEnd && isDigitCode(text.charCodeAt(at))) at++;
      if (text.charCodeAt(at) !== 32 || !isLetterCode(text.charCodeAt(at + 1))) return null;
      at++;
      continue;
    }
    if (SAMPLE_NOUNS.has(noun)) {
      const after = text.slice(at, at + 60);
      if (EXCLUDED_AFTER.test(after)) return null;
      const before = text.slice(Math.max(0, countStart - 40), countStart);
      if (EXCLUDED_BEFORE.test(before)) return null;
      if (value === 0) return null;
      // "20 participants in each condition": the statement runs to the end of its per-group phrase.
      const perGroup = PER_GROUP_AFTER.exec(after);
      if (perGroup !== null) return { start: countStart, end: at + perGroup[0].length, value, scope: 'per-group' };
      const part = partOf || PART_NOUNS.has(noun) || SUBSET_BEFORE.test(before) || SUBSET_AFTER.test(after) || SECOND_PART_BEFORE.test(before);
      return { start: countStart, end: at, value, scope: part ? 'subset' : 'total' };
    }
    if (noun === 'of' || noun === 'out') partOf = true;
    if (text.charCodeAt(at) !== 32) return null;
    at++;
  }
  return null;
}

/** "20 in each condition", "15 per group" (a count without a sample noun, then a per-group phrase). */
const BARE_PER_GROUP = /^\s(?:[a-z]{1,20}\s){0,2}?(?:per|in\seach|in\severy|for\seach)\s(?:of\sthe\s(?:[a-z]{1,20}\s)?)?(?:groups?|conditions?|cells?|arms?)\b/i;
/** Words that name the count after them the sample's size: "a sample of", "a total sample of", "sample size was". */
const SAMPLE_OF_BEFORE = /\b(?:a|the|our|total|final)\s(?:total\s|final\s|study\s|convenience\s|random\s|representative\s)?sample\s(?:size\s)?(?:of|was|is|comprised|included|consisted\sof)\s$/i;
/** "(the study) was conducted online among 387 …": a study carried out among a count of people names its sample. */
const CONDUCTED_AMONG_BEFORE = /\b(?:conducted|carried\sout|performed)\s(?:[a-z]{1,12}\s){0,2}?among\s$/i;

/** "180 of the 214 participants", "96 out of 120": the first count is part of the second. */
const PART_OF = /^\s(?:out\s)?of\s(?:the\s|all\s|our\s|these\s)?(?:\d{1,3}(?:,\d{3}){1,2}|\d{1,7})(?![\d.,])/i;

/** A count that no sample noun follows, read when it is a per-group size or a part of a stated total. */
function readCountWithoutNoun(text: string, lastDigitAt: number): (Span & { value: number; scope: SampleScope }) | null {
  const count = countEndingAt(text, lastDigitAt);
  if (count === null) return null;
  const value = parseCount(count.written);
  if (value === 0) return null;
  const after = text.slice(lastDigitAt + 1, lastDigitAt + 80);
  // "a sample of 251 first-cycle Peruvian undergraduate mathematics students", "a total sample of 1,024": the
  // sample's size, whatever words describe it.
  const before = text.slice(Math.max(0, count.start - 40), count.start);
  if ((SAMPLE_OF_BEFORE.test(before) || CONDUCTED_AMONG_BEFORE.test(before)) && !PER_GROUP_AFTER.test(after)) {
    return { start: count.start, end: lastDigitAt + 1, value, scope: 'total' };
  }
  const perGroup = BARE_PER_GROUP.exec(after);
  if (perGroup !== null) return { start: count.start, end: lastDigitAt + 1 + perGroup[0].length, value, scope: 'per-group' };
  const part = PART_OF.exec(after);
  if (part !== null) {
    // End before the second count, which is read on its own as the total.
    const ofEnd = lastDigitAt + 1 + part[0].search(/\d/);
    return { start: count.start, end: ofEnd, value, scope: 'subset' };
  }
  return null;
}

function isCountCode(code: number): boolean {
  return (code >= 48 && code <= 57) || code === 44;
}

function isDigitCode(code: number): boolean {
  return code >= 48 && code <= 57;
}

function isLetterCode(code: number): boolean {
  return (code >= 65 && code <= 90) || (code >= 97 && code <= 122);
}

function parseCount(written: string): number {
  return Number(written.replace(/,/g, ''));
}
