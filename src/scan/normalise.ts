/**
 * Normalisation: an ASCII-leaning copy of the manuscript that the recogniser
 * can read with simple character tests, plus a map from every offset of the
 * copy back to the original, so results point at the characters as written.
 *
 * Only characters that matter for reading statistics are rewritten: minus and
 * dash glyphs, Unicode spaces, invisible characters, ligatures, full-width
 * forms, super- and subscripts, comparison signs, the multiplication sign,
 * curly quotes, mathematical alphanumeric letters, and the Greek letters used
 * for test statistics and effect sizes (spelled out: η -> "eta", χ -> "chi").
 * Words broken by a hyphen at a line end are joined again. Markdown (and
 * Word-to-text) emphasis markers around short spans are dropped, so "*t*(46.8)",
 * "**F**(2, 57)", "_p_ = .03", "*p*s" and "*η*p2" read as "t(46.8)", "F(2, 57)",
 * "p = .03", "ps" and "etap2"; "F_{1,44}", "η_p^2" and "1.2*10^-5" are kept.
 * LaTeX and MathJax left in web text are read as the formula they stand for:
 * "$", "$$", "\(" and "\)" are dropped, Greek letters and relations are
 * spelled as above ("$$\chi^2$$(2, N = 188)" -> "chi^2(2, N = 188)",
 * "\(\eta_{p}^{2}\)" -> "eta_{p}^{2}", "\leq" -> "<="), and font commands
 * keep their argument ("\textit{F}(1, 52)" -> "F(1, 52)").
 *
 * Linear time: one pass of a single regular expression finds the characters
 * that need work; the plain-ASCII stretches between them are copied as whole
 * slices, and a document with nothing to rewrite is returned as is.
 */

export interface NormalisedText {
  /** The original text, unchanged. */
  readonly original: string;
  /** The normalised copy that the recogniser reads. */
  readonly text: string;
  /** Original offset of the character at normalised `offset` (use for start offsets). */
  toOriginal(offset: number): number;
  /** Original offset just after the character before normalised `offset` (use for exclusive end offsets). */
  toOriginalEnd(offset: number): number;
}

/**
 * Characters needing work: anything outside ASCII, "*" and "_" (possible
 * emphasis markers; one class with the non-ASCII range, because a separate
 * alternative makes the search markedly slower), "$" and "\\" (LaTeX left in
 * web text), "<" (inline markup left in text: "<i>F</i>", "χ<sup>2</sup>"),
 * and an ASCII hyphen at a line end.
 */
const NEEDS_WORK = /[^\x00-\x23\x25-\x29\x2B-\x3B\x3D-\x5B\x5D\x5E\x60-\x7F]|-[ \t]*\r?\n/g;

/** An inline tag that only styles its content (HTML, JATS and MathML names), opening or closing, at `lastIndex`. */
const LINE_BREAK_TAG = /<br\s?\/?>/iy;
const INLINE_TAG = /<\/?(?:i|b|u|em|strong|italic|bold|sup|sub|span|font|small|sc|mml:[a-z]{1,12}|math|mi|mn|mo|mrow|msup|msub|msubsup|mtext|inline-formula)(?:\s[^<>]{0,200})?\/?>/iy;

/** Single-character replacements (the value may be empty, or longer than one character). */
const REPLACEMENTS: ReadonlyMap<number, string> = buildReplacementTable();

function buildReplacementTable(): Map<number, string> {
  const table = new Map<number, string>();
  const put = (codes: number[], replacement: string): void => {
    for (const code of codes) table.set(code, replacement);
  };
  // Glyphs typeset for a minus sign or a dash; in statistics they all read as "-".
  put([0x2212, 0x2010, 0x2011, 0x2012, 0x2013, 0x2014, 0x2015, 0x2043, 0xfe58, 0xfe63, 0x2796], '-');
  // Unicode spaces.
  put([0x00a0, 0x1680, 0x202f, 0x205f, 0x3000], ' ');
  for (let code = 0x2000; code <= 0x200a; code++) table.set(code, ' ');
  put([0x2028, 0x2029, 0x0085], '\n');
  // Invisible characters: soft hyphen, zero-width space/joiners, word joiner, byte-order mark.
  put([0x00ad, 0x200b, 0x200c, 0x200d, 0x2060, 0xfeff, 0x180e], '');
  // Ligatures.
  table.set(0xfb00, 'ff');
  table.set(0xfb01, 'fi');
  table.set(0xfb02, 'fl');
  table.set(0xfb03, 'ffi');
  table.set(0xfb04, 'ffl');
  put([0xfb05, 0xfb06], 'st');
  // Superscripts and subscripts.
  const superscriptDigits = [0x2070, 0x00b9, 0x00b2, 0x00b3, 0x2074, 0x2075, 0x2076, 0x2077, 0x2078, 0x2079];
  superscriptDigits.forEach((code, digit) => table.set(code, String(digit)));
  for (let digit = 0; digit <= 9; digit++) table.set(0x2080 + digit, String(digit));
  put([0x207a, 0x208a], '+');
  put([0x207b, 0x208b], '-');
  put([0x207c, 0x208c], '=');
  put([0x207d, 0x208d], '(');
  put([0x207e, 0x208e], ')');
  table.set(0x209a, 'p'); // subscript p, as in η with subscript p
  table.set(0x1d56, 'p'); // modifier small p
  // Comparison signs.
  put([0x2264, 0x2266, 0x2a7d], '<=');
  put([0x2265, 0x2267, 0x2a7e], '>=');
  put([0xfe64], '<');
  put([0xfe65], '>');
  put([0xfe66], '=');
  // Multiplication signs (the middle dot is handled by context: between digits it is a decimal point).
  put([0x00d7, 0x2715, 0x2a2f], 'x');
  put([0x22c5, 0x2219], '*');
  // Asterisks of math and wide fonts, as PDF copies give a table's significance marks ("4.21∗∗").
  put([0x2217, 0xfe61, 0xff0a], '*');
  table.set(0x2024, '.');
  table.set(0x210e, 'h'); // the italic h that math fonts take from the letterlike block
  // Quotes and primes.
  put([0x2018, 0x2019, 0x201a, 0x201b, 0x2032, 0x02bc, 0x02b9, 0x00b4], "'");
  put([0x201c, 0x201d, 0x201e, 0x201f, 0x2033], '"');
  // Greek letters used for statistics, effect sizes, alpha levels and sphericity epsilon.
  table.set(0x03b1, 'alpha');
  table.set(0x03b2, 'beta');
  table.set(0x03b5, 'epsilon');
  table.set(0x03f5, 'epsilon');
  table.set(0x03b7, 'eta');
  table.set(0x03c7, 'chi');
  table.set(0x03a7, 'chi');
  table.set(0x03c6, 'phi');
  table.set(0x03d5, 'phi');
  table.set(0x03a6, 'phi');
  table.set(0x03c9, 'omega');
  table.set(0x03c1, 'rho'); // Spearman's rho
  table.set(0x03a9, 'omega');
  // Accented letters that occur in effect-size names ("Cramér's V").
  put([0x00e9, 0x00e8, 0x00ea, 0x00eb], 'e');
  // Full-width ASCII (digits, letters, punctuation, "＝").
  for (let code = 0xff01; code <= 0xff5e; code++) table.set(code, String.fromCharCode(code - 0xfee0));
  return table;
}

/** One stretch of the map: normalised offsets from `normStart` come from original offsets from `origStart`. */
interface Segment {
  normStart: number;
  origStart: number;
  /** -1: offsets advance together; otherwise the whole stretch stands for `origLength` original characters. */
  origLength: number;
}

/** Replacement characters are gathered and turned into one string per run, not one piece each. */
const PENDING_FLUSH = 4096;
/** Gaps up to this length between replacements are gathered with them. */
const SHORT_COPY = 24;

class NormalisationBuilder {
  private readonly pieces: string[] = [];
  /** Character codes of replacements not yet turned into a piece. */
  private readonly pending: number[] = [];
  private normLength = 0;
  readonly segments: Segment[] = [{ normStart: 0, origStart: 0, origLength: -1 }];

  constructor(private readonly original: string) {}

  /** Copies original[from, to) unchanged. */
  copy(from: number, to: number): void {
    if (to <= from) return;
    this.continueLinearAt(from);
    if (to - from <= SHORT_COPY) {
      // Between close replacements: one piece per short gap would be mostly overhead.
      for (let at = from; at < to; at++) this.pending.push(this.original.charCodeAt(at));
      if (this.pending.length >= PENDING_FLUSH) this.flushPending();
    } else {
      this.flushPending();
      this.pieces.push(this.original.slice(from, to));
    }
    this.normLength += to - from;
  }

  /** Writes `replacement` for original[from, from + length). */
  replace(from: number, length: number, replacement: string): void {
    if (replacement.length === length && length === 1) {
      // Same width: the linear stretch stays valid.
      this.continueLinearAt(from);
    } else if (replacement.length > 0) {
      this.segments.push({ normStart: this.normLength, origStart: from, origLength: length });
    }
    for (let index = 0; index < replacement.length; index++) this.pending.push(replacement.charCodeAt(index));
    if (this.pending.length >= PENDING_FLUSH) this.flushPending();
    this.normLength += replacement.length;
  }

  /** Makes sure the normalised offset now being written maps linearly onto `origOffset`. */
  private continueLinearAt(origOffset: number): void {
    const last = this.segments[this.segments.length - 1]!;
    const continues = last.origLength === -1 && last.origStart + (this.normLength - last.normStart) === origOffset;
    if (continues) return;
    if (last.normStart === this.normLength) this.segments.pop();
    this.segments.push({ normStart: this.normLength, origStart: origOffset, origLength: -1 });
  }

  private flushPending(): void {
    if (this.pending.length === 0) return;
    this.pieces.push(String.fromCharCode.apply(null, this.pending));
    this.pending.length = 0;
  }

  finish(): string {
    this.flushPending();
    return this.pieces.join('');
  }
}

class SegmentMap implements NormalisedText {
  private readonly normStarts: Int32Array;
  private readonly origStarts: Int32Array;
  private readonly origLengths: Int32Array;

  constructor(
    readonly original: string,
    readonly text: string,
    segments: Segment[],
  ) {
    this.normStarts = new Int32Array(segments.length);
    this.origStarts = new Int32Array(segments.length);
    this.origLengths = new Int32Array(segments.length);
    for (let index = 0; index < segments.length; index++) {
      const segment = segments[index]!;
      this.normStarts[index] = segment.normStart;
      this.origStarts[index] = segment.origStart;
      this.origLengths[index] = segment.origLength;
    }
  }

  toOriginal(offset: number): number {
    if (offset >= this.text.length) return this.toOriginalEnd(this.text.length);
    const index = this.segmentOf(offset);
    const length = this.origLengths[index]!;
    const origStart = this.origStarts[index]!;
    return length === -1 ? origStart + (offset - this.normStarts[index]!) : origStart;
  }

  toOriginalEnd(offset: number): number {
    if (offset <= 0) return 0;
    const lastIncluded = Math.min(offset, this.text.length) - 1;
    const index = this.segmentOf(lastIncluded);
    const length = this.origLengths[index]!;
    const origStart = this.origStarts[index]!;
    if (length === -1) return origStart + (lastIncluded - this.normStarts[index]!) + 1;
    return origStart + length;
  }

  /** Index of the last segment starting at or before `offset` (binary search). */
  private segmentOf(offset: number): number {
    let low = 0;
    let high = this.normStarts.length - 1;
    while (low < high) {
      const middle = (low + high + 1) >> 1;
      if (this.normStarts[middle]! <= offset) low = middle;
      else high = middle - 1;
    }
    return low;
  }
}

class IdentityMap implements NormalisedText {
  constructor(readonly original: string) {}
  get text(): string {
    return this.original;
  }
  toOriginal(offset: number): number {
    return Math.min(Math.max(offset, 0), this.original.length);
  }
  toOriginalEnd(offset: number): number {
    return Math.min(Math.max(offset, 0), this.original.length);
  }
}

/**
 * After one character needing work, the next few characters are checked by
 * hand before going back to the regular expression: in text dense with
 * symbols, one regular-expression call per character would dominate.
 */
const NEARBY_SEARCH = 24;

/** Normalises `original`; see the module comment for what is rewritten. */
export function normaliseText(original: string): NormalisedText {
  NEEDS_WORK.lastIndex = 0;
  let match = NEEDS_WORK.exec(original);
  if (match === null) return new IdentityMap(original);

  const builder = new NormalisationBuilder(original);
  const closers = new EmphasisClosers();
  let copiedUpTo = 0;
  let at = match.index;
  while (at !== -1) {
    builder.copy(copiedUpTo, at);
    const code = original.charCodeAt(at);
    copiedUpTo = code === 42 || code === 95 ? rewriteMarkerRun(original, at, builder, closers) : rewriteAt(original, at, builder);
    at = nextNeedingWorkNearby(original, copiedUpTo);
    if (at === -1) {
      NEEDS_WORK.lastIndex = copiedUpTo;
      match = NEEDS_WORK.exec(original);
      at = match === null ? -1 : match.index;
    }
  }
  builder.copy(copiedUpTo, original.length);
  return new SegmentMap(original, builder.finish(), builder.segments);
}

/** The next offset within NEARBY_SEARCH characters that needs work, or -1 (the caller then asks NEEDS_WORK). */
function nextNeedingWorkNearby(text: string, from: number): number {
  const limit = Math.min(text.length, from + NEARBY_SEARCH);
  for (let at = from; at < limit; at++) {
    const code = text.charCodeAt(at);
    if (code >= 128 || code === 42 || code === 95 || code === 36 || code === 92) return at;
    if (code === 45 && isLineEndHyphen(text, at)) return at;
  }
  return -1;
}

/** An ASCII hyphen followed by optional spaces and a line break (what NEEDS_WORK matches for "-"). */
function isLineEndHyphen(text: string, at: number): boolean {
  let cursor = at + 1;
  while (text.charCodeAt(cursor) === 32 || text.charCodeAt(cursor) === 9) cursor++;
  if (text.charCodeAt(cursor) === 13) cursor++;
  return text.charCodeAt(cursor) === 10;
}

/**
 * Whether the "À" at `at` stands where a minus sign would: right before a number ("À2.28", "À.34"; the letter
 * never touches a digit in words), after "=", "¼", a bracket, a separator or the start of a cell or line.
 */
function symbolFontMinus(text: string, at: number): boolean {
  const next = text.charCodeAt(at + 1);
  if (!isDigitAt(text, at + 1) && !(next === 46 && isDigitAt(text, at + 2))) return false;
  const previous = at === 0 ? 10 : text.charCodeAt(at - 1);
  return previous === 32 || previous === 9 || previous === 10 || previous === 13 || previous === 124 || previous === 61 || previous === 0x00bc || previous === 40 || previous === 91 || previous === 59 || previous === 44;
}

/** Whether the "¼" at `at` stands where an "=" would: after a word or bracket (and a space), before a number. */
function symbolFontEquals(text: string, at: number): boolean {
  let after = at + 1;
  if (text.charCodeAt(after) === 32) after++;
  const next = text.charCodeAt(after);
  // (A number after it may start with a minus sign, or with the "À" the same fonts give for one.)
  const number = isDigitAt(text, after) || ((next === 46 || next === 45 || next === 0x2212 || next === 0x00c0) && isDigitAt(text, after + 1));
  let before = at - 1;
  if (text.charCodeAt(before) === 32) before--;
  const previous = text.charCodeAt(before);
  const word = (previous >= 65 && previous <= 90) || (previous >= 97 && previous <= 122) || previous === 41 || previous === 93 || (previous >= 48 && previous <= 57) || previous > 0x036f;
  return number && word && before >= 0;
}

/** Rewrites the character(s) found at `at`; returns the original offset up to which input is consumed. */
function rewriteAt(original: string, at: number, builder: NormalisationBuilder): number {
  const code = original.charCodeAt(at);

  // Hyphen (ASCII, soft or typographic) at a line end: join a word broken across lines.
  if (code === 45 || code === 0x00ad || code === 0x2010) {
    const joinedUpTo = lineEndHyphenationEnd(original, at);
    if (joinedUpTo !== -1) {
      builder.replace(at, joinedUpTo - at, '');
      return joinedUpTo;
    }
    if (code === 45) {
      builder.copy(at, at + 1);
      return at + 1;
    }
  }

  if (code === 0x00e2 || code === 0x00c2 || code === 0x00c3 || code === 0x00ce || code === 0x00cf || code === 0x0101 || code === 0x0100 || code === 0x0106 || code === 0x012a || code === 0x013b) {
    const repaired = mojibakeAt(original, at);
    if (repaired !== null) {
      builder.replace(at, repaired.length, repaired.replacement);
      return at + repaired.length;
    }
  }

  if (code === 36) {
    // "$" or "$$" around inline or display mathematics.
    const length = original.charCodeAt(at + 1) === 36 ? 2 : 1;
    builder.replace(at, length, '');
    return at + length;
  }
  if (code === 92) return rewriteLatexCommand(original, at, builder);

  if (code === 60) {
    // Inline markup left in text (Markdown converted from publishers' XML, text copied from web pages):
    // "<i>F</i>(2, 57)", "χ<sup>2</sup>", "η<sub>p</sub><sup>2</sup>". The tags go, their content stays.
    INLINE_TAG.lastIndex = at;
    const tag = INLINE_TAG.exec(original);
    if (tag !== null) {
      builder.replace(at, tag[0].length, '');
      return at + tag[0].length;
    }
    // "Hypothesis <br> df": a line break a converted table keeps inside a cell reads as a space.
    LINE_BREAK_TAG.lastIndex = at;
    const lineBreak = LINE_BREAK_TAG.exec(original);
    if (lineBreak !== null) {
      builder.replace(at, lineBreak[0].length, ' ');
      return at + lineBreak[0].length;
    }
    builder.copy(at, at + 1);
    return at + 1;
  }

  if (code === 0x00c0 && symbolFontMinus(original, at)) {
    // "t(40) = À2.28": a symbol font's minus sign that PDF text extraction gives as "À", read as a minus only
    // right after an "=" (or its "¼") or a bracket and before a number.
    builder.replace(at, 1, '-');
    return at + 1;
  }

  if (code === 0x00bc && symbolFontEquals(original, at)) {
    // "p ¼ 0.03", "F(1, 40) ¼ 5.20": a symbol font's "=" that PDF text extraction gives as "¼" (as it gives "<"
    // as "b"), read as "=" only between a statistic, a p or a bracket and a number.
    builder.replace(at, 1, '=');
    return at + 1;
  }

  if (code === 0x00b7) {
    // Middle dot: a decimal point between digits ("0·05"), a multiplication sign elsewhere.
    const betweenDigits = isDigitAt(original, at - 1) && isDigitAt(original, at + 1);
    builder.replace(at, 1, betweenDigits ? '.' : 'x');
    return at + 1;
  }

  const replacement = REPLACEMENTS.get(code);
  if (replacement !== undefined) {
    builder.replace(at, 1, replacement);
    return at + 1;
  }

  if (code >= 0xd800 && code <= 0xdbff) {
    const mathematical = mathematicalAlphanumeric(original.codePointAt(at) ?? 0);
    if (mathematical !== null) {
      builder.replace(at, 2, mathematical);
      return at + 2;
    }
    builder.copy(at, at + 2);
    return at + 2;
  }

  builder.copy(at, at + 1);
  return at + 1;
}

/** Longest emphasised span (between its markers) whose markers are dropped; "**Psychological safety**" fits. */
const MAX_EMPHASIS_SPAN = 64;
/** Longest marker run read as emphasis ("***" is bold italic). */
const MAX_MARKER_RUN = 3;
/** Most emphasis spans open at the same time (nesting is shallow in real text). */
const MAX_OPEN_EMPHASIS = 4;

/** Closing emphasis markers found ahead of the normalisation pass, to be dropped when it reaches them. */
class EmphasisClosers {
  private readonly positions: number[] = [];
  private readonly lengths: number[] = [];

  /** Length of the pending closing marker at `position` (removing it), or 0; forgets closers already passed. */
  take(position: number): number {
    for (let index = this.positions.length - 1; index >= 0; index--) {
      const at = this.positions[index]!;
      if (at > position) continue;
      const length = at === position ? this.lengths[index]! : 0;
      this.positions.splice(index, 1);
      this.lengths.splice(index, 1);
      if (length > 0) return length;
    }
    return 0;
  }

  has(position: number): boolean {
    return this.positions.includes(position);
  }

  /** Records a closer; false when too many spans are open already. */
  add(position: number, length: number): boolean {
    if (this.positions.length >= MAX_OPEN_EMPHASIS) return false;
    this.positions.push(position);
    this.lengths.push(length);
    return true;
  }
}

/**
 * A run of "*" or "_" at `at`. It is dropped when it closes an emphasis span
 * opened earlier, or when it opens one: it follows neither a letter nor a
 * digit, a non-space follows it, and a run of the same marker and length
 * closes it on the same line within MAX_EMPHASIS_SPAN characters, with no
 * space before it (and, for "_", no letter, digit or "{" after it, so snake_case,
 * "η_p^2" and "\chi_{2}^{2}" stay). "*" may close inside a word ("*p*s", "*η*p2"), as in
 * Markdown. Anything else (multiplication "2*3", "F_{1,44}", footnote stars
 * "p < .05*", list bullets "* item") is copied unchanged.
 */
function rewriteMarkerRun(original: string, at: number, builder: NormalisationBuilder, closers: EmphasisClosers): number {
  const marker = original.charCodeAt(at);
  let runEnd = at + 1;
  while (runEnd < original.length && original.charCodeAt(runEnd) === marker && runEnd - at <= MAX_MARKER_RUN) runEnd++;
  const length = runEnd - at;

  const closing = closers.take(at);
  if (closing > 0) {
    builder.replace(at, closing, '');
    return at + closing;
  }
  // ("_{" opens a LaTeX subscript, "\chi^{2}_{1}", never emphasis.)
  if (length <= MAX_MARKER_RUN && !isWordCharacterBefore(original, at) && !(marker === 95 && original.charCodeAt(runEnd) === 123)) {
    const closer = findEmphasisCloser(original, runEnd, marker, length);
    if (closer !== -1 && !closers.has(closer) && closers.add(closer, length)) {
      builder.replace(at, length, '');
      return runEnd;
    }
  }
  builder.copy(at, runEnd);
  return runEnd;
}

/** Start of the run that closes an emphasis span whose text starts at `from`, or -1. */
function findEmphasisCloser(text: string, from: number, marker: number, length: number): number {
  const first = text.charCodeAt(from);
  if (Number.isNaN(first) || isSpaceOrBreak(first)) return -1;
  const limit = Math.min(text.length, from + MAX_EMPHASIS_SPAN);
  let at = from + 1;
  while (at < limit) {
    const code = text.charCodeAt(at);
    if (code === 10 || code === 13) return -1;
    if (code !== marker) {
      at++;
      continue;
    }
    let runEnd = at + 1;
    while (runEnd < limit + MAX_MARKER_RUN && text.charCodeAt(runEnd) === marker) runEnd++;
    if (runEnd - at === length) {
      // A run of the same length after a space cannot close this span but may open the next
      // ("*a *b*"): leave it to that one, which also keeps this search short.
      if (isSpaceOrBreak(text.charCodeAt(at - 1))) return -1;
      if (marker === 42 || (!isWordCharacterAt(text, runEnd) && text.charCodeAt(runEnd) !== 123)) return at;
    }
    at = runEnd;
  }
  return -1;
}

function isSpaceOrBreak(code: number): boolean {
  return code === 32 || code === 9 || code === 10 || code === 13 || code === 0x00a0;
}

const LETTER_OR_DIGIT = /[\p{L}\p{N}]/u;

/** True when a letter or digit (of any script) ends just before `at`. */
function isWordCharacterBefore(text: string, at: number): boolean {
  if (at === 0) return false;
  const code = text.charCodeAt(at - 1);
  if (code < 128) return isDigitAt(text, at - 1) || isAsciiLetterAt(text, at - 1);
  const start = code >= 0xdc00 && code <= 0xdfff && at >= 2 ? at - 2 : at - 1;
  return LETTER_OR_DIGIT.test(String.fromCodePoint(text.codePointAt(start) ?? 32));
}

/** True when a letter or digit (of any script) starts at `at`. */
function isWordCharacterAt(text: string, at: number): boolean {
  if (at >= text.length) return false;
  const code = text.charCodeAt(at);
  if (code < 128) return isDigitAt(text, at) || isAsciiLetterAt(text, at);
  return LETTER_OR_DIGIT.test(String.fromCodePoint(text.codePointAt(at) ?? 32));
}

function isDigitAt(text: string, at: number): boolean {
  const code = text.charCodeAt(at);
  return code >= 48 && code <= 57;
}

function isAsciiLetterAt(text: string, at: number): boolean {
  const code = text.charCodeAt(at);
  return (code >= 65 && code <= 90) || (code >= 97 && code <= 122);
}

/**
 * For a hyphen at `at` that ends a line inside a word ("signif-\nicant"),
 * the original offset where the word continues; -1 when this is not such a
 * hyphen. Only a letter before and a lower-case letter after count, so
 * "Greenhouse-\nGeisser" and "F(1, 44) = -\n2.1" are left alone.
 */
function lineEndHyphenationEnd(text: string, at: number): number {
  if (!isAsciiLetterAt(text, at - 1)) return -1;
  let cursor = at + 1;
  const limit = Math.min(text.length, at + 12);
  while (cursor < limit && (text.charCodeAt(cursor) === 32 || text.charCodeAt(cursor) === 9)) cursor++;
  if (text.charCodeAt(cursor) === 13) cursor++;
  if (text.charCodeAt(cursor) !== 10) return -1;
  cursor++;
  while (cursor < limit && (text.charCodeAt(cursor) === 32 || text.charCodeAt(cursor) === 9)) cursor++;
  const next = text.charCodeAt(cursor);
  return next >= 97 && next <= 122 ? cursor : -1;
}

/**
 * Mathematical alphanumeric symbols (U+1D400-U+1D7FF), which PDFs typeset
 * with math fonts produce for italic F, t, p, η, χ...: their plain letter,
 * or null when the code point is not one of them.
 */
function mathematicalAlphanumeric(codePoint: number): string | null {
  if (codePoint >= 0x1d400 && codePoint <= 0x1d6a3) {
    const index = (codePoint - 0x1d400) % 52;
    return String.fromCharCode(index < 26 ? 65 + index : 97 + index - 26);
  }
  if (codePoint >= 0x1d6a8 && codePoint <= 0x1d7c9) {
    const index = (codePoint - 0x1d6a8) % 58;
    return MATH_GREEK[index] ?? null;
  }
  if (codePoint >= 0x1d7ce && codePoint <= 0x1d7ff) {
    return String((codePoint - 0x1d7ce) % 10);
  }
  return null;
}

/** Position within each mathematical Greek alphabet -> spelled-out name, for the letters the scanner reads. */
const MATH_GREEK: Readonly<Record<number, string>> = {
  21: 'phi',
  22: 'chi',
  24: 'omega',
  26: 'alpha',
  27: 'beta',
  30: 'epsilon',
  32: 'eta',
  42: 'rho',
  47: 'phi',
  48: 'chi',
  50: 'omega',
  52: 'epsilon',
  55: 'phi',
  56: 'rho',
};

/** LaTeX commands spelled the way the scanner reads their glyphs (see REPLACEMENTS). */
const LATEX_WORDS: ReadonlyMap<string, string> = new Map([
  ['alpha', 'alpha'],
  ['beta', 'beta'],
  ['chi', 'chi'],
  ['Chi', 'chi'],
  ['eta', 'eta'],
  ['omega', 'omega'],
  ['Omega', 'omega'],
  ['phi', 'phi'],
  ['varphi', 'phi'],
  ['Phi', 'phi'],
  ['rho', 'rho'],
  ['epsilon', 'epsilon'],
  ['varepsilon', 'epsilon'],
  ['le', '<='],
  ['leq', '<='],
  ['leqslant', '<='],
  ['ge', '>='],
  ['geq', '>='],
  ['geqslant', '>='],
  ['lt', '<'],
  ['gt', '>'],
  ['times', 'x'],
  ['cdot', '*'],
  ['left', ''],
  ['right', ''],
]);

/** Font and text commands whose short argument is kept without its braces: "\textit{F}" -> "F". */
const LATEX_FONT_COMMANDS = new Set(['text', 'textit', 'textrm', 'textbf', 'textsf', 'mathit', 'mathrm', 'mathbf', 'mathsf', 'mathcal', 'emph', 'boldsymbol', 'bm', 'operatorname', 'mbox']);
/** Longest argument of a font command that is unwrapped. */
const MAX_FONT_ARGUMENT = 24;
/** Longest command name read. */
const MAX_COMMAND_NAME = 14;

/**
 * A backslash at `at`: "\(" "\)" "\[" "\]" are dropped, "\," and the other
 * spacing commands become a space, Greek letters and relations are spelled
 * out, a font command keeps its argument. Anything else is copied as it is.
 */
function rewriteLatexCommand(original: string, at: number, builder: NormalisationBuilder): number {
  const next = original.charCodeAt(at + 1);
  if (next === 40 || next === 41 || next === 91 || next === 93) {
    builder.replace(at, 2, '');
    return at + 2;
  }
  if (next === 44 || next === 59 || next === 58 || next === 32) {
    builder.replace(at, 2, ' ');
    return at + 2;
  }
  if (next === 33) {
    builder.replace(at, 2, '');
    return at + 2;
  }
  let nameEnd = at + 1;
  while (nameEnd < original.length && nameEnd - at <= MAX_COMMAND_NAME && isAsciiLetterAt(original, nameEnd)) nameEnd++;
  const name = original.slice(at + 1, nameEnd);
  const word = LATEX_WORDS.get(name);
  if (word !== undefined && !isAsciiLetterAt(original, nameEnd)) {
    builder.replace(at, nameEnd - at, word);
    return nameEnd;
  }
  if (LATEX_FONT_COMMANDS.has(name) && original.charCodeAt(nameEnd) === 123) {
    const close = original.indexOf('}', nameEnd + 1);
    const argument = close === -1 ? '' : original.slice(nameEnd + 1, close);
    if (close !== -1 && argument.length <= MAX_FONT_ARGUMENT && !/[{\n\\]/.test(argument)) {
      builder.replace(at, nameEnd + 1 - at, '');
      for (let cursor = nameEnd + 1; cursor < close; ) {
        const code = original.charCodeAt(cursor);
        if (code >= 128 || code === 36) cursor = rewriteAt(original, cursor, builder);
        else {
          builder.copy(cursor, cursor + 1);
          cursor++;
        }
      }
      builder.replace(close, 1, '');
      return close + 1;
    }
  }
  builder.copy(at, at + 1);
  return at + 1;
}

/**
 * Characters whose UTF-8 bytes, read as Windows-1252 by a web page or a
 * copy, become two or three characters ("âˆ’" for "−", "â€‰" for a thin
 * space, "Î·" for "η", "Ï‡" for "χ"): the statistics-bearing glyphs the
 * scanner reads, and common punctuation around them.
 */
const MOJIBAKE_TARGETS = [
  0x2212, 0x2013, 0x2014, 0x2009, 0x202f, 0x2002, 0x2003, 0x00a0, 0x2264, 0x2265, 0x00d7, 0x00b7, 0x00b1, 0x00b2, 0x00b3, 0x00b9, 0x2070,
  0x2074, 0x2075, 0x2076, 0x2077, 0x2078, 0x2079, 0x2080, 0x2081, 0x2082, 0x2083, 0x2084, 0x2085, 0x2086, 0x2087, 0x2088, 0x2089, 0x03b7, 0x03c7, 0x03c1, 0x03c9,
  0x03c6, 0x03b1, 0x03b2, 0x03b5, 0x2018, 0x2019, 0x201c, 0x201d, 0x2032, 0x00e9,
];

/** Windows-1252 characters for the bytes 0x80-0x9f (other bytes read as Latin-1). */
const CP1252_HIGH = [
  0x20ac, 0x81, 0x201a, 0x192, 0x201e, 0x2026, 0x2020, 0x2021, 0x2c6, 0x2030, 0x160, 0x2039, 0x152, 0x8d, 0x17d, 0x8f, 0x90, 0x2018, 0x2019, 0x201c, 0x201d, 0x2022,
  0x2013, 0x2014, 0x2dc, 0x2122, 0x161, 0x203a, 0x153, 0x9d, 0x17e, 0x178,
];

/**
 * The lead bytes of those characters as Windows-1257 (Baltic) reads them, where a page's text comes out as
 * "āˆ’" for "−": the lead byte in the Baltic code page, the bytes after it as in Windows-1252.
 */
const CP1257_LEAD: ReadonlyMap<number, number> = new Map([
  [0xe2, 0x0101],
  [0xc2, 0x0100],
  [0xc3, 0x0106],
  [0xce, 0x012a],
  [0xcf, 0x013b],
]);

const MOJIBAKE: ReadonlyMap<string, string> = (() => {
  const table = new Map<string, string>();
  const encoder = new TextEncoder();
  const asCp1252 = (byte: number): string => String.fromCharCode(byte >= 0x80 && byte <= 0x9f ? CP1252_HIGH[byte - 0x80]! : byte);
  for (const target of MOJIBAKE_TARGETS) {
    const character = String.fromCharCode(target);
    const bytes = [...encoder.encode(character)];
    const repaired = REPLACEMENTS.get(target) ?? character;
    table.set(bytes.map(asCp1252).join(''), repaired);
    const baltic = CP1257_LEAD.get(bytes[0]!);
    if (baltic !== undefined) table.set(String.fromCharCode(baltic) + bytes.slice(1).map(asCp1252).join(''), repaired);
  }
  return table;
})();

/** The repair of a garbled character at `at` (see MOJIBAKE), or null. */
function mojibakeAt(text: string, at: number): { length: number; replacement: string } | null {
  for (const length of [3, 2]) {
    const replacement = MOJIBAKE.get(text.slice(at, at + length));
    if (replacement !== undefined) return { length, replacement };
  }
  return null;
}
