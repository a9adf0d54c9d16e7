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

/** Keywords that may introduce a context statement (normalised text: α is "alpha", dashes are "-"). */
const CONTEXT_ANCHOR =
  /[Aa]lpha|[Ss]ignifican(?:ce|t)|[Oo]ne[- ]?(?:tailed|sided)|1[- ]?tailed|(?:[Uu]ni)?[Dd]irectional|[Ss]phericity|Greenhouse|Huynh|\bN\s{0,2}=|total of|sample of|\b(?:participants|subjects|students|respondents|volunteers|adults|children|adolescents|infants|patients|individuals|undergraduates|people|persons|workers|employees|pupils|dyads|couples|families|observers|listeners|raters|athletes|teachers|parents|mothers|fathers|women|men)\b/g;

/** How far a statement's sentence is searched for around a keyword. */
const SENTENCE_REACH = 300;
/** The slice examined after a keyword (alpha value, sample-size number). */
const FORWARD_REACH = 80;
/** The slice examined before a keyword (a number before "participants", a p before "significant"). */
const BACKWARD_REACH = 100;

/** Reads the document context from the normalised text; offsets are mapped to the original. */
export function readDocumentContext(normalised: NormalisedText): DocumentContext {
  const text = normalised.text;
  const found = new ContextCollector(normalised);
  const anchor = new RegExp(CONTEXT_ANCHOR.source, CONTEXT_ANCHOR.flags);
  for (let match = anchor.exec(text); match !== null; match = anchor.exec(text)) {
    const keyword = match[0];
    const at = match.index;
    if (!isWholeWordStart(text, at) && !keyword.startsWith('N')) continue;
    const first = keyword.charCodeAt(0) | 0x20; // lower-cased first letter
    if (first === 0x61 /* a */ && /^alpha$/i.test(keyword)) found.alpha(readAlphaStatement(text, at));
    else if (first === 0x73 /* s */ && keyword.toLowerCase().startsWith('signific')) found.alpha(readSignificanceStatement(text, at, keyword));
    else if (/tailed|sided|directional/i.test(keyword)) found.oneTailed(readOneTailed(text, at, keyword));
    else if (/^(?:sphericity|Greenhouse|Huynh)$/i.test(keyword)) found.sphericity(readSphericity(text, at, keyword));
    else if (keyword.startsWith('N')) found.sampleSize(readCapitalN(text, at));
    else if (keyword === 'total of' || keyword === 'sample of') found.sampleSize(readCountAfter(text, at, keyword));
    else found.sampleSize(readCountBefore(text, at, keyword));
  }
  return found.finish();
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

/** Prefixes that turn "directional" into its opposite. */
const NEGATING_PREFIX = /(?:non|bi|two|omni)[- ]?$/i;

function readOneTailed(text: string, at: number, keyword: string): Span | null {
  if (/directional/i.test(keyword)) {
    if (NEGATING_PREFIX.test(text.slice(Math.max(0, at - 5), at))) return null;
    // "directional" alone is an adjective of many things; it must qualify a test or hypothesis.
    const after = text.slice(at + keyword.length, at + keyword.length + 20);
    if (!/^\s{1,3}(?:hypothes[ie]s|tests?|predictions?|testing|alternative)/i.test(after)) return null;
  }
  return sentenceAround(text, at, at + keyword.length);
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

/** A count: "1,024" or "86". */
const COUNT = String.raw`(\d{1,3}(?:,\d{3}){1,2}|\d{1,7})`;

/** A count and up to two describing words right before a noun: "86 healthy adults", "120 undergraduate psychology students". */
const COUNT_BEFORE_NOUN = new RegExp(String.raw`(?<![\d.,])` + COUNT + String.raw`\s{1,3}(?:[A-Za-z-]{1,20}\s{1,3}){0,2}$`);

/** Words after a count that mean it is not the sample ("3 participants were excluded"). */
const EXCLUDED_AFTER = /^\s{0,3}(?:(?:were|was|had been|had to be)\s{1,3})?(?:excluded|removed|dropped|omitted|discarded|lost|withdrew|did not|failed|declined)/i;
const EXCLUDED_BEFORE = /(?:exclud\w{0,4}|remov\w{0,4}|dropp\w{0,4}|omitt\w{0,4}|discard\w{0,4}|(?:data|responses) (?:of|from))\s{1,3}(?:the\s{1,3})?(?:data\s{1,3}(?:of|from)\s{1,3})?$/i;

function readCountBefore(text: string, nounAt: number, noun: string): (Span & { value: number }) | null {
  const nounEnd = nounAt + noun.length;
  // The noun must be a whole word ("men" not in "women", "adults" not "adultsx").
  const afterNoun = text.charCodeAt(nounEnd);
  if ((afterNoun >= 97 && afterNoun <= 122) || (afterNoun >= 65 && afterNoun <= 90)) return null;
  const behindStart = Math.max(0, nounAt - 48);
  const behind = text.slice(behindStart, nounAt);
  const match = COUNT_BEFORE_NOUN.exec(behind);
  if (match === null) return null;
  const countAt = behindStart + match.index;
  if (EXCLUDED_AFTER.test(text.slice(nounEnd, nounEnd + 40))) return null;
  if (EXCLUDED_BEFORE.test(text.slice(Math.max(0, countAt - 40), countAt))) return null;
  const value = parseCount(match[1]!);
  if (value === 0) return null;
  return { start: countAt, end: nounEnd, value };
}

/** The count after "total of" / "sample of". */
const COUNT_AFTER = new RegExp(String.raw`^\s{1,3}` + COUNT + String.raw`(?![\d.])`);

/** "a total of 86 ...", "a sample of 64 ...": the span runs from the keyword to the count. */
function readCountAfter(text: string, at: number, keyword: string): (Span & { value: number }) | null {
  const countFrom = at + keyword.length;
  const match = COUNT_AFTER.exec(text.slice(countFrom, countFrom + 24));
  if (match === null) return null;
  const value = parseCount(match[1]!);
  return value === 0 ? null : { start: at, end: countFrom + match[0].length, value };
}

function parseCount(written: string): number {
  return Number(written.replace(/,/g, ''));
}
