/**
 * Degrees of freedom a table's caption or note states for every test of the
 * table: "df = 2, 57", "all F tests have 2 and 57 degrees of freedom",
 * "numerator df = 2, denominator df = 57", "F(2, 57)", "gl = 2; 57".
 *
 * Common practice (no single source): when every test of a table shares its
 * df, journals print them once above or below the table instead of in a
 * column. The words are those of the languages of the real corpus (English,
 * Spanish "gl", Portuguese "graus de liberdade", French "ddl", German "FG").
 */
import { normaliseText } from '../normalise.js';
import type { ReportedNumber } from '../types.js';
import { parseReportedNumber } from '../../stats/reportedNumber.js';

export interface NoteDf {
  /** "df = 1, 170", "dfs = (2, 57)", "F(1, 170)". */
  pair: ReportedNumber[];
  /** "df = 58". */
  single: ReportedNumber | null;
  /** "error df = 57", "df error = 57". */
  error: ReportedNumber | null;
  /** Read from the lines beside the table, not its caption or notes: findings resting on them are at most warnings. */
  besideTable?: boolean;
  /**
   * The footnote marker the statement of `pair` or `single` opens with ("a df = 1."): they are the df of the cells
   * carrying that marker ("0.80a"), not of every test of the table.
   */
  mark?: string;
  /**
   * Columns or rows the note names as taking other df ("d.f. = 1,28 except for daily sperm production where …
   * d.f. = 1,27"): the words that name them and their pair. The table reader gives that pair to the block or row
   * so named, `pair` to the others, and no pair at all when it finds no block or row so named.
   */
  exceptions?: NoteDfException[];
}

export interface NoteDfException {
  /** The words after "except (for)", lower case: "daily sperm production". */
  name: string;
  pair: ReportedNumber[];
  /**
   * Set for df stated name by name ("df: Group 2, 57; Time 1, 57"): the name must be the row's or block's whole
   * name (words "effect" and "interaction" aside), since "Group x Time" is not "Group". An exception's name may be
   * part of a longer title ("daily sperm production (x 10^6)").
   */
  wholeName?: true;
}

/** The footnote marker a df statement's sentence opens with ("a df = 1.", "† df = 2"): the statement is that footnote's. */
function footnoteMarkBefore(text: string, index: number): string | undefined {
  const before = text.slice(Math.max(0, index - 400), index);
  const sentenceStart = Math.max(before.lastIndexOf('. '), before.lastIndexOf('; '), before.lastIndexOf('\n'));
  const opening = FOOTNOTE_OPENING.exec(before.slice(sentenceStart + 1));
  return opening?.[1];
}
const FOOTNOTE_OPENING = /^\s{0,3}([a-h]|[\u2020\u2021\u00a7\u00b6*])\s{0,2}[:.)]?\s{0,2}$/;

const NUMBER = String.raw`(\d{1,6}(?:\.\d{1,3})?)`;
/** The word for degrees of freedom, standing apart from the letters around it. */
const DF_WORD = String.raw`(?<![A-Za-z])(?:dfs?|d\.f\.|DF|gl|g\.l\.|ddl|d\.d\.l\.|FG|degrees of freedom|grados de libertad|graus de liberdade|degr[ée]s de libert[ée]|Freiheitsgrade)(?: {0,2}\([A-Za-z ,]{1,30}\))?(?![A-Za-z])`;
/** "for all tests", "for every effect": what the df are stated for. */
const FOR_ALL = String.raw`(?: {1,3}for {1,3}(?:(?:all|every|each|the) {1,3}(?:[A-Za-z-]{1,12} {1,3}){0,2}?(?:tests?|effects?|analyses|comparisons|F(?:-| )?(?:tests|values|ratios))|(?:the {1,3})?F(?:(?:-| )(?:tests?|values?|ratios?))?(?![A-Za-z])))?`;
/** Between the two numbers of a pair: a comma, semicolon, slash or "and" (English, Spanish, Portuguese, French, German). */
const PAIR_SEPARATOR = String.raw` {0,3}(?:[,;/]|(?:and|y|e|et|und)(?![A-Za-z])) {0,3}`;
/** A few words in brackets after a number: "2 (between groups) and 57 (within groups)". */
const ASIDE = String.raw`(?: {0,2}\([A-Za-z -]{1,30}\))?`;

/** "df = 2, 57", "df: 2 and 57", "degrees of freedom (2, 57)", "df 2, 57", "gl = 2; 57", "df were 2 and 57". */
const DF_PAIR = new RegExp(`${DF_WORD}${FOR_ALL} {0,3}(?:[=:] {0,3}|(?:were|are|of) {1,3}|(?=[([])| {1,3}(?=\\d))[([]? {0,2}${NUMBER}${ASIDE}${PAIR_SEPARATOR}${NUMBER}(?!\\.?\\d)`, 'i');
/** "df = 58", "df: 58". */
const DF_SINGLE = new RegExp(`${DF_WORD}${FOR_ALL} {0,3}[=:] {0,3}\\(? {0,2}${NUMBER}(?!\\.?\\d)`, 'i');
/** "2 and 57 degrees of freedom", "(2, 57 df)". */
/** "2 numerator and 57 denominator degrees of freedom". */
const SIDES_THEN_DF = new RegExp(`(?<![\\d.])${NUMBER} {1,3}(?:numerator|effect|hypothesis) {1,3}(?:and {1,3})?${NUMBER} {1,3}(?:denominator|error) {1,3}(?:degrees of freedom|dfs?|d\\.f\\.)(?![A-Za-z])`, 'i');
const PAIR_THEN_DF = new RegExp(`(?<![\\d.])${NUMBER}${PAIR_SEPARATOR}${NUMBER} {1,3}${DF_WORD}`, 'i');
/**
 * "tests with 1 df", "have 1 degree of freedom", "on 2 d.f.": one df stated after its number. (A word before the
 * number that gives the df to the tests, so that "1 df" in other words, "the 1 df contrast", is not taken.)
 */
const SINGLE_THEN_DF = new RegExp(`(?<![A-Za-z])(?:with|on|have|has|had) {1,3}${NUMBER} {1,3}(?:dfs?|d\\.f\\.|DF|degrees? of freedom)(?![A-Za-z])`, 'i');
/** "F(2, 57)", "F[2, 57]", "F (2, 57)", "F(2/57)", "Fs(2, 57)", and the subscript run onto the symbol: "F2,57", "F2, 57". */
const F_WITH_DF = new RegExp(`(?<![A-Za-z])Fs?(?: {0,2}[([] {0,2}${NUMBER} {0,2}[,;/] {0,2}${NUMBER} {0,2}[)\\]]|${NUMBER}, {0,1}${NUMBER}(?!\\.?\\d))`);

/** Sides of an F test named beside df: the effect's side and the error's side. */
// (With their abbreviations: "num df", "ndf", "dfn"; "den df", "ddf", "dfd", "dfe".)
const EFFECT_SIDE = String.raw`(?:numerator|num\.?|n|effect|hypothesis|between(?:[ -]groups?)?|treatments?|model)`;
const ERROR_SIDE = String.raw`(?:denominator|denom\.?|den\.?|d|e|error|residuals?|within(?:[ -]groups?)?)`;
/** "numerator df = 2", "df effect = 2", "df(between) = 2", "df_between = 2", "dfeffect = 2", "df1 = 2" (digit: 1 or 2). */
function namedDfPattern(side: string, digit: string): RegExp {
  const sideFirst = `(?<![A-Za-z])${side}(?: {0,2}|-)(?:dfs?|d\\.f\\.|degrees of freedom)`;
  const dfFirst = `(?<![A-Za-z])(?:dfs?|d\\.f\\.) {0,2}(?:\\( {0,2}${side} {0,2}\\)|_{0,1}${side}|${digit})`;
  return new RegExp(`(?:${sideFirst}|${dfFirst})(?![A-Za-z]) {0,3}[=:] {0,3}${NUMBER}(?!\\.?\\d)`, 'i');
}
const EFFECT_DF = namedDfPattern(EFFECT_SIDE, '1');
const ERROR_DF = namedDfPattern(ERROR_SIDE, '2');
/** "df: treatment = 2, error = 57": both sides named after one word for df. */
const SIDES_AFTER_DF = new RegExp(
  `${DF_WORD} {0,3}[=:]? {0,3}\\(? {0,2}(?:treatments?|effects?|between(?: groups)?|model|hypothesis|numerator) {0,2}[=:] {0,2}${NUMBER} {0,2}[,;] {0,2}(?:and {1,3})?(?:error|residuals?|within(?: groups)?|denominator) {0,2}[=:] {0,2}${NUMBER}(?!\\.?\\d)`,
  'i',
);

const number = (text: string): ReportedNumber => parseReportedNumber(text)!;

/** Words without which a note states no df (DF_WORD's, loosely). */
const MAY_STATE_DF = /df|d\.\s?f|degree|freedom|\bgl\b|g\.l\.|\bddl\b|d\.d\.l|\bfg\b|grados|graus|degr|freiheit/i;

/** Whether a note states no df at all. */
export function statesNoDf(noteDf: NoteDf): boolean {
  return noteDf.pair.length === 0 && noteDf.single === null && noteDf.error === null && (noteDf.exceptions ?? []).length === 0;
}

/**
 * Reads the df a caption or note states for the whole table; empty when it
 * states none. With `statementsOnly`, for the running text beside a table, a
 * result's own df ("F(1, 40) = 5.2" in a sentence) are not taken: only words
 * that state df ("df = 2, 57", "2 and 57 degrees of freedom").
 */
export function readNoteDf(note: string, statementsOnly = false): NoteDf {
  const none: NoteDf = { pair: [], single: null, error: null };
  // (Most notes and the lines around most tables state no df: passed over before the patterns are tried.)
  if (!MAY_STATE_DF.test(note) && (statementsOnly || !note.includes('F'))) return none;
  const text = normaliseText(note.slice(0, 2000)).text;
  const sides = SIDES_AFTER_DF.exec(text) ?? SIDES_THEN_DF.exec(text);
  if (sides) return { ...none, pair: [number(sides[1]!), number(sides[2]!)], error: number(sides[2]!) };
  const effectMatch = EFFECT_DF.exec(text);
  const errorMatch = ERROR_DF.exec(text);
  const error = errorMatch ? number(errorMatch[1]!) : null;
  if (effectMatch && error) return { ...none, pair: [number(effectMatch[1]!), error], error };
  // What is left once the named error df is taken out: "df = 2, error df = 57" leaves "df = 2".
  const rest = errorMatch ? text.slice(0, errorMatch.index) + text.slice(errorMatch.index + errorMatch[0].length) : text;
  // df stated name by name ("df: Group 2, 57; Time 1, 57", "df = 2, 57 for Group and 1, 57 for Time"): each
  // named row's or block's own pair, kept by the table reader only when every name is one of its rows or blocks.
  const named = readNamedPairs(rest);
  if (named.length > 0) return { ...none, error, exceptions: named };
  const pair = DF_PAIR.exec(rest) ?? PAIR_THEN_DF.exec(rest);
  // df stated for one effect ("df = 2, 57 for Group and 1, 57 for Time") are that row's, not every row's.
  if (pair && statedForOneEffect(rest.slice(pair.index + pair[0].length))) return { ...none, error };
  // Another pair stated besides ("d.f. = 1,28 except for daily sperm production where ... d.f. = 1,27"): which
  // column takes which cannot be told from the note, so none is taken.
  if (pair && statesOtherPair(rest, pair)) {
    const exception = exceptionAfter(rest, pair);
    return exception === null ? { ...none, error } : { ...none, pair: [number(pair[1]!), number(pair[2]!)], error, exceptions: [exception] };
  }
  if (pair) return withMark({ ...none, pair: [number(pair[1]!), number(pair[2]!)], error }, footnoteMarkBefore(rest, pair.index));
  const single = DF_SINGLE.exec(rest) ?? SINGLE_THEN_DF.exec(rest);
  // Several different df stated one by one ("df = 1 for sex, df = 2 for education") belong to different rows:
  // which row takes which cannot be told from the note, so none is taken.
  // (As for a pair: a df stated for one effect, "with 1 df for Sex", is that row's.)
  if (single && (statesOtherDf(rest, single) || statedForOneEffect(rest.slice(single.index + single[0].length)))) return { ...none, error };
  if (single) {
    const first = number(single[1]!);
    return withMark(error ? { pair: [first, error], single: first, error } : { ...none, single: first }, footnoteMarkBefore(rest, single.index));
  }
  const fMatch = statementsOnly ? null : F_WITH_DF.exec(rest);
  // Two F's with different df ("F(1, 58) for Group, F(2, 116) for Time"): which test takes which is not said for
  // every test, so neither pair is taken.
  if (fMatch && writesOtherFPair(rest, fMatch)) return { ...none, error };
  if (fMatch) {
    const [first, second] = fMatch[1] !== undefined ? [fMatch[1], fMatch[2]!] : [fMatch[3]!, fMatch[4]!];
    return withMark({ ...none, pair: [number(first), number(second)], error }, footnoteMarkBefore(rest, fMatch.index));
  }
  return { ...none, error };
}

/** Whether the text writes another F with df besides the one read, with another pair ("F(1, 58) … F(2, 116)"). */
function writesOtherFPair(text: string, first: RegExpExecArray): boolean {
  const pairOf = (match: RegExpExecArray): string => (match[1] !== undefined ? `${Number(match[1])},${Number(match[2])}` : `${Number(match[3])},${Number(match[4])}`);
  const every = new RegExp(F_WITH_DF.source, 'g');
  for (let match = every.exec(text); match !== null; match = every.exec(text)) if (pairOf(match) !== pairOf(first)) return true;
  return false;
}

function withMark(noteDf: NoteDf, mark: string | undefined): NoteDf {
  return mark === undefined ? noteDf : { ...noteDf, mark };
}

/** After df: "for" and a name other than all the tests ("for Group", not "for all tests", "for the F tests"). */
const FOR_ONE_EFFECT = /^ {0,3}(?:for|in) {1,3}(?!(?:all|every|each|both)(?![A-Za-z])|the {1,3}(?:F|tests?|effects?|analys[ie]s|models?|comparisons)(?![A-Za-z])|F(?:-| )?(?:tests?|values?|ratios?)(?![A-Za-z]))[A-Za-z]/i;

function statedForOneEffect(after: string): boolean {
  return FOR_ONE_EFFECT.test(after);
}

/** Whether the note states another single df besides the one read ("df = 1 … df = 2"). */
function statesOtherDf(text: string, first: RegExpExecArray): boolean {
  for (const pattern of [DF_SINGLE, SINGLE_THEN_DF]) {
    const every = new RegExp(pattern.source, 'gi');
    for (let match = every.exec(text); match !== null; match = every.exec(text)) if (Number(match[1]) !== Number(first[1])) return true;
  }
  return false;
}

/** "except for daily sperm production where", "except in the recall task (", "apart from Group,": the name between. */
const EXCEPT_NAME = /(?<![A-Za-z])(?:except|apart from|other than|but)(?: {1,3}(?:for|in|when|with))?(?: {1,3}the)? {1,3}([A-Za-z][A-Za-z0-9 '-]{2,60}?)(?= {0,3}(?:[,;:(]|where|which|whose|as|because|with|for which|in which|\.|$))/i;

/**
 * The one exception a note states after its pair: "except for <name> … <other pair>", the other pair after the
 * name, and no third pair. Null otherwise.
 */
function exceptionAfter(text: string, first: RegExpExecArray): NoteDfException | null {
  const after = text.slice(first.index + first[0].length);
  const named = EXCEPT_NAME.exec(after.slice(0, 400));
  if (named === null) return null;
  const every = new RegExp(DF_PAIR.source, 'gi');
  const others: RegExpExecArray[] = [];
  for (let match = every.exec(after); match !== null; match = every.exec(after)) {
    if (Number(match[1]) !== Number(first[1]) || Number(match[2]) !== Number(first[2])) others.push(match);
  }
  if (others.length !== 1 || others[0]!.index < named.index + named[0].length) return null;
  // Nor a pair stated before the first one (the exception would then be ambiguous).
  if (statesOtherPair(text.slice(0, first.index), first)) return null;
  const other = others[0]!;
  return { name: named[1]!.trim().toLowerCase(), pair: [number(other[1]!), number(other[2]!)] };
}

/** Whether the note states another pair of df besides the one read ("df = 1, 28 ... df = 1, 27"). */
function statesOtherPair(text: string, first: RegExpExecArray): boolean {
  const every = new RegExp(DF_PAIR.source, 'gi');
  for (let match = every.exec(text); match !== null; match = every.exec(text)) {
    if (Number(match[1]) !== Number(first[1]) || Number(match[2]) !== Number(first[2])) return true;
  }
  return false;
}

// ------------------------------------------------------------ df stated name by name

/** An effect's name as a note writes it: a letter, then letters, spaces, apostrophes, hyphens and "*" (an interaction "Group x Time"). */
const EFFECT_NAME = String.raw`(\p{L}[\p{L}\p{M} '*-]{0,40}?)`;
/** "Group 2, 57", "Group x Time: 2, 57", "Group (2, 57)", "Group: df = 2, 57". */
const NAME_THEN_PAIR = new RegExp(
  String.raw`${EFFECT_NAME} {0,2}(?:[:=] {0,2})?(?:(?:dfs?|d\.f\.) {0,2}[=:]? {0,2})?\(? {0,2}${NUMBER}${PAIR_SEPARATOR}${NUMBER}(?!\.?\d) {0,2}\)?`,
  'iuy',
);
/** "2, 57 for Group", "(2, 57) for the Group x Time interaction". */
const PAIR_THEN_NAME = new RegExp(
  String.raw`\(? {0,2}${NUMBER}${PAIR_SEPARATOR}${NUMBER}(?!\.?\d) {0,2}\)? {1,3}(?:for|in) {1,3}(?:the {1,3})?${EFFECT_NAME}(?= {0,3}(?:[;,.)]|and |$))`,
  'iuy',
);
/** Between two named pairs: ";", "," or "and". */
const LIST_SEPARATOR = / {0,3}(?:[;,]|,? and(?= )) {0,3}/y;
/** After the word for df, before the list: "df: ", "degrees of freedom were ". */
const LIST_START = / {0,3}(?:[=:]|were|are)? {0,3}/y;
/** Words that open what is not an effect's name ("for all tests", "in each model", "of the F tests"). */
const NOT_A_NAME = /^(?:for|in|of|with|all|each|every|both|the|these|those|were|are|and|error|residuals?|within|between|numerator|denominator|effects?|tests?|f)(?![\p{L}])/iu;

/** A name a row label or block title can be compared with: lower case, interactions written one way. */
export function effectNameKey(name: string): string {
  return name.toLowerCase().replace(/\s+/g, ' ').replace(/ ?[*\u00d7] ?| x /g, ' x ').replace(/ {2,}/g, ' ').trim();
}

/** An effect's name without the words that only say it is one ("main effect of", "interaction", "effect"). */
export function bareEffectName(key: string): string {
  return key.replace(/(?:^| )(?:main )?(?:effects?|interactions?)(?: of)?(?= |$)/g, ' ').replace(/\s+/g, ' ').trim();
}

function namedPair(name: string, first: string, second: string): NoteDfException | null {
  const key = effectNameKey(name);
  if (key.length < 3 || NOT_A_NAME.test(key)) return null;
  return { name: key, pair: [number(first), number(second)], wholeName: true };
}

/**
 * The pairs a note states name by name after its word for df: "df: Group 2, 57; Time 1, 57; Group x Time 2, 57"
 * (two names at least: one name before one pair may be a phrase, "for all tests: 1, 48") or "df = 2, 57 for
 * Group and 1, 57 for Time" (one or more). Empty when the note states none, or a name twice with two pairs.
 */
function readNamedPairs(text: string): NoteDfException[] {
  const word = new RegExp(DF_WORD, 'gi');
  for (let match = word.exec(text); match !== null; match = word.exec(text)) {
    LIST_START.lastIndex = match.index + match[0].length;
    const start = LIST_START.exec(text) === null ? match.index + match[0].length : LIST_START.lastIndex;
    for (const [pattern, least, nameFirst] of [
      [NAME_THEN_PAIR, 2, true],
      [PAIR_THEN_NAME, 1, false],
    ] as const) {
      const found = namedPairList(text, start, pattern, nameFirst);
      if (found.length >= least && new Set(found.map((entry) => entry.name)).size === found.length) return found;
    }
  }
  return [];
}

function namedPairList(text: string, start: number, pattern: RegExp, nameFirst: boolean): NoteDfException[] {
  const found: NoteDfException[] = [];
  for (let at = start; ; ) {
    pattern.lastIndex = at;
    const match = pattern.exec(text);
    if (match === null) break;
    const entry = nameFirst ? namedPair(match[1]!, match[2]!, match[3]!) : namedPair(match[3]!, match[1]!, match[2]!);
    if (entry === null) break;
    found.push(entry);
    LIST_SEPARATOR.lastIndex = pattern.lastIndex;
    if (LIST_SEPARATOR.exec(text) === null) break;
    at = LIST_SEPARATOR.lastIndex;
  }
  return found;
}
