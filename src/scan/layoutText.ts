/**
 * The text the table and descriptive readers work on: the document's text
 * with the characters that only change how it looks written as the ASCII
 * ones those readers test for, one character for one, so that every offset
 * stays the document's own.
 *
 * Web pages give no-break and thin spaces between cells and around "<" and
 * "=" ("p\u00a0<\u00a0.001"), documents typeset in East Asian scripts give
 * full-width brackets and signs ("\uff08n\uff1d58\uff09"), and files from
 * old Macintosh programs end lines with a lone carriage return. The prose
 * scanner reads its own normalised copy (normalise.ts); the table readers
 * match cell shapes character by character on the text as it is, so they
 * get this copy. (Nothing here changes the length: a character that would
 * need two, or none, is left as it is.)
 */

/** Characters rewritten, at least one of which must be present for any work to be done. */
const LAYOUT_CHARACTERS = /[\u00a0\u1680\u2000-\u200b\u202f\u205f\u2060\u3000\ufeff\uff01-\uff5e\r]/;

/** `text` with Unicode and zero-width spaces as " ", full-width ASCII forms as ASCII and lone carriage returns as "\n". */
export function layoutText(text: string): string {
  if (!LAYOUT_CHARACTERS.test(text)) return text;
  let folded = '';
  let copiedTo = 0;
  for (let index = 0; index < text.length; index++) {
    const replacement = replacementAt(text, index);
    if (replacement === null) continue;
    folded += text.slice(copiedTo, index) + replacement;
    copiedTo = index + 1;
  }
  return folded + text.slice(copiedTo);
}

function replacementAt(text: string, index: number): string | null {
  const code = text.charCodeAt(index);
  if (code < 0x80) return code === 0x0d && text.charCodeAt(index + 1) !== 0x0a ? '\n' : null;
  if (code === 0x00a0 || code === 0x1680 || (code >= 0x2000 && code <= 0x200a) || code === 0x202f || code === 0x205f || code === 0x3000) return ' ';
  // A zero-width space, word joiner or byte-order mark stands where a program put a break, not inside a number
  // (one character for one: a space, which the readers skip like any other).
  if (code === 0x200b || code === 0x2060 || code === 0xfeff) return ' ';
  // Full-width forms of "!" to "~" sit 0xfee0 above the ASCII ones.
  if (code >= 0xff01 && code <= 0xff5e) return String.fromCharCode(code - 0xfee0);
  return null;
}

/** A table's cell texts (and caption and notes) with the same characters rewritten. */
export function layoutTable<T extends { caption: string | null; notes: string[]; rows: string[][] }>(table: T): T {
  const changed = [table.caption ?? '', ...table.notes, ...table.rows.flat()].some((cell) => LAYOUT_CHARACTERS.test(cell));
  if (!changed) return table;
  return {
    ...table,
    caption: table.caption === null ? null : layoutText(table.caption),
    notes: table.notes.map(layoutText),
    rows: table.rows.map((row) => row.map(layoutText)),
  };
}
