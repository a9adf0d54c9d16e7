/**
 * Mean squared errors printed with an F test: "F(2, 57) = 4.21, MSE =
 * 0.87", "MS_error = 12.4", "MSe = 3.10". The scanner passes over them
 * while reading a result (they are reported alongside, not recorded); this
 * module records them with their offsets so a check can tie each to the F
 * in its sentence.
 *
 * One global search for the literal "MS" finds candidates, each read with a
 * short anchored pattern on a bounded slice, so the cost is linear in the
 * text length.
 */

import { parseReportedNumber } from '../stats/reportedNumber.js';
import type { NormalisedText } from './normalise.js';
import type { PrintedMeanSquareError } from './types.js';

const KEYWORD = /MS/g;
/** "MSE", "MSe", "MS_error", "MS error", "MS_E", "MS(error)", then "=" and a positive number. */
const AFTER_KEYWORD = /^(?:E|e|_?E\b|_?e\b|[ _(]?(?:error|Error|residual|within)\)?)\s{0,2}=\s{0,2}(\d{1,9}(?:,\d{3}){0,3}(?:\.\d{1,6})?|\.\d{1,6})(?!\d|\.\d)/;
const AFTER_REACH = 40;

/** Every printed mean squared error, in text order, with offsets into the original text. */
export function readMeanSquareErrors(normalised: NormalisedText): PrintedMeanSquareError[] {
  const text = normalised.text;
  const found: PrintedMeanSquareError[] = [];
  const keyword = new RegExp(KEYWORD.source, KEYWORD.flags);
  for (let match = keyword.exec(text); match !== null; match = keyword.exec(text)) {
    const at = match.index;
    if (at > 0 && /[A-Za-z0-9]/.test(text[at - 1]!)) continue;
    const after = AFTER_KEYWORD.exec(text.slice(at + 2, at + 2 + AFTER_REACH));
    if (after === null) continue;
    const value = parseReportedNumber(after[1]!.replace(/,/g, ''));
    if (value === null || !(value.value > 0)) continue;
    const end = at + 2 + after[0].length;
    found.push({
      value,
      text: normalised.original.slice(normalised.toOriginal(at), normalised.toOriginalEnd(end)),
      start: normalised.toOriginal(at),
      end: normalised.toOriginalEnd(end),
    });
    keyword.lastIndex = end;
  }
  return found;
}
