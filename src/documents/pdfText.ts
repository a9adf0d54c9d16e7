/** Text clean-up shared by the PDF reader (pdf.ts) and the table rebuilder (pdfLayout.ts). */

/** First parts of compounds whose hyphen is real even at a line end ("chi-square", "within-subjects"). */
const COMPOUND_FIRST_PARTS = new Set(['chi', 'self', 'non', 'one', 'two', 'three', 'four', 'within', 'between', 'cross', 'follow', 'well', 'long', 'short', 'high', 'low', 'mixed', 'open', 'post', 'pre', 'semi', 'multi', 'co', 'counter', 'right', 'left', 'time', 'age', 'sex', 'first', 'second', 'third', 'full', 'half', 'small', 'large', 'mid', 'over', 'under', 'test', 'inter', 'intra']);

/**
 * Joins a word hyphenated at a line end when the next line goes on in lower
 * case: "recog-\nnition of" -> "recognition\nof" (the line break moves after
 * the joined word, so lines stay lines). A hyphen after a known first part
 * of a compound is kept ("chi-\nsquare" -> "chi-square"). A hyphen after a
 * digit or a single letter is never touched: "= -\n.32" stays a minus sign,
 * "p-\nvalue" stays as written.
 */
export function dehyphenate(page: string): string {
  // The look-behind starts a try only at the start of a word: without it, a long word with no hyphen is read again from each of its letters.
  return page.replace(/(?<!\p{L})(\p{L}{2,})[-\u00AD\u2010]\n[ \t]*(\p{Ll}[\p{L}\p{M}'’]*)( ?)/gu, (_whole, first: string, rest: string, space: string) => {
    const joiner = COMPOUND_FIRST_PARTS.has(first.toLowerCase()) ? '-' : '';
    return `${first}${joiner}${rest}${space ? '\n' : ''}`;
  });
}
