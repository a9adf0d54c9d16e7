/**
 * Control characters made visible in the reports people read (console,
 * Markdown, CSV, HTML).
 *
 * A document or a file name is not written by the person reading the
 * report, and a terminal obeys some of the characters it may hold: ESC
 * starts sequences that move the cursor, clear the screen, set the window
 * title or print a hyperlink whose target differs from its text; a
 * carriage return or a backspace writes over what a line already shows;
 * the C1 controls (U+0080 to U+009F) include the one-character form of
 * those sequences. The bidirectional overrides and isolates (U+202A to
 * U+202E, U+2066 to U+2069) reorder the rest of a line in any viewer, so a
 * file name or a p-value can read differently from what it holds.
 *
 * Each such character is written as an escape a reader can see and a
 * terminal ignores: `\x` and two hex digits for the C0 controls, DEL and the
 * C1 controls ("\x1b" for ESC), `\u` and four hex digits for the
 * bidirectional controls ("\u202e"). Lower-case hex, as JavaScript and
 * Python write these escapes. A backslash already in the text is left as it
 * is: an escape shows that a control character stood there, it is not a
 * way to write the text back.
 *
 * The JSON formats keep the text as it was: JSON.stringify escapes the C0
 * controls itself, and a program reading the JSON gets the document's text.
 */

/** Every character this module makes visible: C0 controls, DEL, C1 controls, bidirectional overrides and isolates. */
const HIDDEN_CHARACTER = /[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g;

/** The visible escape of one control character: "\x1b", "\x9b", "\u202e". */
export function escapeOf(character: string): string {
  const code = character.charCodeAt(0);
  return code < 0x100 ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u${code.toString(16).padStart(4, '0')}`;
}

/**
 * The text with every control character written as its visible escape.
 * `keep` lists characters a format needs and that act on nothing there (the
 * HTML report keeps tab, line feed and carriage return, which a browser
 * shows as white space); by default none are kept, so a file name with a
 * line break in it cannot start a forged line of a report.
 */
export function visibleControls(text: string, keep = ''): string {
  return text.replace(HIDDEN_CHARACTER, (character) => (keep.includes(character) ? character : escapeOf(character)));
}

/**
 * Text from a document shown on one line (a result as printed, a message):
 * runs of white space, line breaks included, become one space, as the
 * reports have always shown them, and the controls left are made visible.
 */
export function visibleLine(text: string): string {
  return visibleControls(text.replace(/\s+/g, ' ').trim());
}

/**
 * A copy of a report's data (plain objects, arrays, strings, numbers) with
 * every string's controls made visible, for a formatter that writes its
 * strings in many places (refit's reports: the file names, the reported
 * table's row labels and the manuscript's words quoted in its notes). Made
 * before formatting, so the formatter's own colour sequences are kept.
 */
export function visibleStrings<T>(value: T, keep = ''): T {
  if (typeof value === 'string') return visibleControls(value, keep) as T;
  if (Array.isArray(value)) return value.map((item: unknown) => visibleStrings(item, keep)) as T;
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([key, item]) => [key, visibleStrings(item as unknown, keep)])) as T;
  }
  return value;
}
