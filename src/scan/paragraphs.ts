/**
 * Paragraphs and sentences of a document's text, for the readers that link
 * a result to what is printed before it (factorial cell statistics, post-hoc
 * comparisons): a paragraph is a stretch between blank lines.
 */

export interface Paragraph {
  start: number;
  end: number;
}

/** The paragraphs of a text: stretches between blank lines. */
export function paragraphsOf(text: string): Paragraph[] {
  const paragraphs: Paragraph[] = [];
  const blank = /\n[ \t]*\n/g;
  let start = 0;
  for (let match = blank.exec(text); match !== null; match = blank.exec(text)) {
    paragraphs.push({ start, end: match.index });
    start = match.index + match[0].length;
  }
  paragraphs.push({ start, end: text.length });
  return paragraphs;
}

/** Index of the paragraph holding `offset` (paragraphs in order; binary search). */
export function paragraphOf(paragraphs: readonly Paragraph[], offset: number): number {
  let low = 0;
  let high = paragraphs.length - 1;
  while (low < high) {
    const mid = (low + high + 1) >> 1;
    if (paragraphs[mid]!.start <= offset) low = mid;
    else high = mid - 1;
  }
  return low;
}

/**
 * Start of the sentence holding `offset`: after the last ". " (or "!", "?") before a capital or a bracket,
 * no earlier than `floor` and at most `lookBack` characters back.
 */
export function sentenceStart(text: string, offset: number, floor: number, lookBack: number): number {
  const lowest = Math.max(floor, offset - lookBack);
  for (let at = offset - 1; at > lowest; at--) {
    if (/[.!?]/.test(text[at - 1]!) && /\s/.test(text[at]!) && /[A-Z(]/.test(text[at + 1] ?? '')) return at + 1;
  }
  return lowest;
}
