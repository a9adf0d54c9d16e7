/**
 * Sentences of the original text around a result, for checks that read the
 * words next to it (an adjustment named in the same sentence or the one
 * before, a paired design, a table's dimensions). A sentence ends at ".",
 * "!" or "?" followed by white space and a capital letter or "(", or at a
 * blank line; each side is searched a bounded distance, so the cost per
 * result is constant.
 */

export interface Span {
  start: number;
  end: number;
}

/** Farthest a sentence's start is looked for before an offset, and its end after it. */
const REACH_BACK = 600;
const REACH_FORWARD = 400;

function isSpace(code: number): boolean {
  return code === 32 || code === 10 || code === 13 || code === 9;
}

function isCapitalOrBracket(code: number): boolean {
  return (code >= 65 && code <= 90) || code === 40 || code === 91;
}

/** True when a sentence ends just before `at` (the character at `at - 1` is white space after a stop, or a blank line). */
function startsSentence(text: string, at: number): boolean {
  if (at <= 0) return true;
  const before = text.charCodeAt(at - 1);
  if (!isSpace(before)) return false;
  let stop = at - 1;
  while (stop > 0 && isSpace(text.charCodeAt(stop - 1)) && at - stop < 8) stop--;
  if (stop > 0 && /[.!?]/.test(text[stop - 1]!) && isCapitalOrBracket(text.charCodeAt(at))) {
    // "p < .05. The" ends a sentence; "r = .30" has no space after its point.
    return true;
  }
  return /\n[ \t]*\r?\n[ \t]*$/.test(text.slice(Math.max(0, at - 8), at));
}

/** Start of the sentence holding `offset`. */
export function sentenceStart(text: string, offset: number): number {
  const lowest = Math.max(0, offset - REACH_BACK);
  for (let at = offset; at > lowest; at--) if (startsSentence(text, at)) return at;
  return lowest;
}

/** End (exclusive) of the sentence holding `offset`. */
export function sentenceEnd(text: string, offset: number): number {
  const highest = Math.min(text.length, offset + REACH_FORWARD);
  for (let at = offset; at < highest; at++) {
    const code = text.charCodeAt(at);
    if (code === 46 || code === 33 || code === 63) {
      let next = at + 1;
      if (next >= text.length) return next;
      if (!isSpace(text.charCodeAt(next))) continue;
      while (next < text.length && isSpace(text.charCodeAt(next))) next++;
      if (next >= text.length || isCapitalOrBracket(text.charCodeAt(next))) return at + 1;
    } else if (code === 10 && /^\n[ \t]*\r?\n/.test(text.slice(at, at + 8))) {
      return at;
    }
  }
  return highest;
}

/** The sentence holding [start, end). */
export function sentenceAround(text: string, start: number, end: number): Span {
  return { start: sentenceStart(text, start), end: sentenceEnd(text, Math.max(start, end - 1)) };
}

/** The sentence before the one starting at `sentenceStartOffset` (a heading line counts as one), or null at the start of the text. */
export function sentenceBefore(text: string, sentenceStartOffset: number): Span | null {
  let end = sentenceStartOffset;
  while (end > 0 && isSpace(text.charCodeAt(end - 1))) end--;
  if (end === 0) return null;
  return { start: sentenceStart(text, end - 1), end };
}
