/**
 * Document context, read once per manuscript: the declared alpha level,
 * statements of one-tailed testing, stated sample sizes, and statements that
 * a sphericity correction was applied.
 *
 * One global regular expression of plain keywords finds candidates in a
 * single pass; each candidate is then examined with small anchored patterns
 * on a bounded slice around it, so the cost stays linear in the text length.
 */

import type { NormalisedText } from './normalise.js';
import type {
  ContextStatement,
  DeclaredAlpha,
  DocumentContext,
  SphericityStatement,
  StatedSampleSize,
} from './types.js';

/**
 * Candidates for context statements, chosen for speed: each alternative
 * starts with the least common letters of its keyword ("lpha" for alpha,
 * "gnifican" for significance), so the regular expression engine can skip
 * most of the text. The keyword's start is recovered afterwards.
 * "\d [a-z]" finds counts followed by a word ("120 participants").
 */
const CONTEXT_ANCHOR = /lpha|gnifican|ailed|ided|ctional|hericity|Greenh|Huynh|N\s{0,2}=|\d [A-Za-z]/g;

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
]);

/** Reads the document context from the normalised text; offsets are mapped to the original. */
export function readDocumentContext(normalised: NormalisedText): DocumentContext {
  const text = normalised.text;
  const found = new ContextCollector(normalised);
  const anchor = new RegExp(CONTEXT_ANCHOR.source, CONTEXT_ANCHOR.flags);
  for (let match = anchor.exec(text); match !== null; match = anchor.exec(text)) {
    readCandidate(text, match.index, match[0], found);
  }
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
    default:
      if (anchor.charCodeAt(0) === 78) found.sampleSize(readCapitalN(text, at));
      else found.sampleSize(readCountBeforeNoun(text, at));
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

/** Keeps what was found, in normalised offsets, and maps it to the original text at the end. */
class ContextCollector {
  private declaredAlpha: (Span & { value: number }) | null = null;
  private readonly oneTailedSpans: Span[] = [];
  private readonly sampleSizeSpans: Array<Span & { value: number }> = [];
  private readonly sphericitySpans: Array<Span & { method: SphericityStatement['method'] }> = [];

  constructor(private readonly normalised: NormalisedText) {}

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

  sampleSize(found: (Span & { value: number }) | null): void {
    if (found === null) return;
    const last = this.sampleSizeSpans[this.sampleSizeSpans.length - 1];
    if (last !== undefined && found.start < last.end) return; // "a total of 86 adults": already read once
    this.sampleSizeSpans.push(found);
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
      sampleSizes: this.sampleSizeSpans.map((span) => ({ ...this.statement(span), value: span.value }) satisfies StatedSampleSize),
      sphericity: this.sphericitySpans.map((span) => ({ ...this.statement(span), method: span.method })),
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
  return sentenceAround(text, start, at + keyword.length);
}

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

// ---------------------------------------------------------------- sample sizes

/** "N = 120" / "N = 1,024" (capital N: the whole sample; a lower-case n is a group). */
const CAPITAL_N = /^N\s{0,2}=\s{0,2}(\d{1,3}(?:,\d{3}){1,2}|\d{1,7})(?![\d.])/;

function readCapitalN(text: string, at: number): (Span & { value: number }) | null {
  if (!isWholeWordStart(text, at)) return null;
  const match = CAPITAL_N.exec(text.slice(at, at + 24));
  if (match === null) return null;
  return { start: at, end: at + match[0].length, value: parseCount(match[1]!) };
}

/** Words after a count that mean it is not the sample ("3 participants were excluded"). */
const EXCLUDED_AFTER = /^\s{0,3}(?:(?:were|was|had been|had to be)\s{1,3})?(?:excluded|removed|dropped|omitted|discarded|lost|withdrew|did not|failed|declined)/i;
const EXCLUDED_BEFORE = /(?:exclud\w{0,4}|remov\w{0,4}|dropp\w{0,4}|omitt\w{0,4}|discard\w{0,4}|(?:data|responses) (?:of|from))\s{1,3}(?:the\s{1,3})?(?:data\s{1,3}(?:of|from)\s{1,3})?$/i;

/** Longest count read backwards from its last digit ("1,024,000"). */
const MAX_COUNT_LENGTH = 9;
/** Describing words allowed between a count and its noun ("120 undergraduate psychology students"). */
const MAX_WORDS_BEFORE_NOUN = 2;
const MAX_WORD_LENGTH = 20;

/**
 * A count followed by a sample noun: "86 adults", "120 undergraduate
 * psychology students", "1,024 respondents". `lastDigitAt` holds the count's
 * last digit, which a space and a letter follow.
 */
function readCountBeforeNoun(text: string, lastDigitAt: number): (Span & { value: number }) | null {
  let countStart = lastDigitAt;
  const lowest = Math.max(0, lastDigitAt - MAX_COUNT_LENGTH);
  while (countStart > lowest && isCountCode(text.charCodeAt(countStart - 1))) countStart--;
  while (text.charCodeAt(countStart) === 44) countStart++; // a comma is not part of the count's start
  const before = text.charCodeAt(countStart - 1);
  if (before === 46 || isLetterCode(before)) return null; // "4.120 ms", "A2 adults"
  const written = text.slice(countStart, lastDigitAt + 1);
  if (!/^(?:\d{1,3}(?:,\d{3}){1,2}|\d{1,7})$/.test(written)) return null;

  let at = lastDigitAt + 2;
  for (let word = 0; word <= MAX_WORDS_BEFORE_NOUN; word++) {
    const wordStart = at;
    const limit = Math.min(text.length, at + MAX_WORD_LENGTH + 1);
    while (at < limit && (isLetterCode(text.charCodeAt(at)) || text.charCodeAt(at) === 45)) at++;
    if (at === wordStart || isLetterCode(text.charCodeAt(at))) return null;
    if (SAMPLE_NOUNS.has(text.slice(wordStart, at).toLowerCase())) {
      if (EXCLUDED_AFTER.test(text.slice(at, at + 40))) return null;
      if (EXCLUDED_BEFORE.test(text.slice(Math.max(0, countStart - 40), countStart))) return null;
      const value = parseCount(written);
      return value === 0 ? null : { start: countStart, end: at, value };
    }
    if (text.charCodeAt(at) !== 32) return null;
    at++;
  }
  return null;
}

function isCountCode(code: number): boolean {
  return (code >= 48 && code <= 57) || code === 44;
}

function isLetterCode(code: number): boolean {
  return (code >= 65 && code <= 90) || (code >= 97 && code <= 122);
}

function parseCount(written: string): number {
  return Number(written.replace(/,/g, ''));
}
