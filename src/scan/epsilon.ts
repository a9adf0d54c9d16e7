/**
 * Sphericity epsilons printed in the text: "epsilon = .72", "Greenhouse-
 * Geisser epsilon = 0.72", "(epsilonGG = .68)", "HF epsilon of .81" (the
 * normaliser writes the Greek letter as "epsilon"). A check compares each
 * with the df of the F test beside it: a corrected df is the uncorrected df
 * times epsilon (Greenhouse & Geisser 1959; Huynh & Feldt 1976).
 *
 * One global search for the literal keyword finds candidates; each is read
 * with a short anchored pattern on a bounded slice after it (and the words
 * just before it for the method), so the cost is linear in the text length.
 */

import { parseReportedNumber } from '../stats/reportedNumber.js';
import type { NormalisedText } from './normalise.js';
import type { PrintedEpsilon } from './types.js';

const KEYWORD = /epsilon/gi;
/** What may follow the keyword: a hat, a subscript naming the method, "=" (or ":" or "of"), the value in (0, 1]. */
const AFTER_KEYWORD =
  /^\u0302?[ _-]?(GG|HF|LB|G-G|H-F)?\s{0,2}(?:\(\s{0,2}(GG|HF|LB)\s{0,2}\)\s{0,2})?(?:=|:|of\b)\s{0,2}(0?\.\d{1,4}|1(?:\.0{1,4})?)(?!\d|\.\d)/i;
/** How far before the keyword a method's name is looked for ("Greenhouse-Geisser corrected, epsilon = .72"). */
const METHOD_REACH = 60;
const AFTER_REACH = 40;

/** Every printed epsilon, in text order, with offsets into the original text. */
export function readEpsilons(normalised: NormalisedText): PrintedEpsilon[] {
  const text = normalised.text;
  const found: PrintedEpsilon[] = [];
  const keyword = new RegExp(KEYWORD.source, KEYWORD.flags);
  for (let match = keyword.exec(text); match !== null; match = keyword.exec(text)) {
    const at = match.index;
    if (at > 0 && /[A-Za-z]/.test(text[at - 1]!)) continue;
    const after = AFTER_KEYWORD.exec(text.slice(at + match[0].length, at + match[0].length + AFTER_REACH));
    if (after === null) continue;
    const value = parseReportedNumber(after[3]!);
    if (value === null || !(value.value > 0 && value.value <= 1)) continue;
    const end = at + match[0].length + after[0].length;
    found.push({
      value,
      method: methodOf(after[1] ?? after[2], text.slice(Math.max(0, at - METHOD_REACH), at)),
      text: normalised.original.slice(normalised.toOriginal(at), normalised.toOriginalEnd(end)),
      start: normalised.toOriginal(at),
      end: normalised.toOriginalEnd(end),
    });
    keyword.lastIndex = end;
  }
  return found;
}

/** The method from a subscript ("GG"), else from the nearest name just before the keyword. */
function methodOf(tag: string | undefined, before: string): PrintedEpsilon['method'] {
  const upper = tag?.toUpperCase().replace('-', '');
  if (upper === 'GG') return 'greenhouse-geisser';
  if (upper === 'HF') return 'huynh-feldt';
  if (upper === 'LB') return 'lower-bound';
  const greenhouse = lastIndexOf(before, /Greenhouse[- ]{1,3}Geisser|\bGG\b/g);
  const huynh = lastIndexOf(before, /Huynh[- ]{1,3}Feldt|\bHF\b/g);
  const lower = lastIndexOf(before, /lower[- ]bound/gi);
  const nearest = Math.max(greenhouse, huynh, lower);
  if (nearest < 0) return 'unspecified';
  return nearest === greenhouse ? 'greenhouse-geisser' : nearest === huynh ? 'huynh-feldt' : 'lower-bound';
}

function lastIndexOf(text: string, pattern: RegExp): number {
  let last = -1;
  for (let match = pattern.exec(text); match !== null; match = pattern.exec(text)) last = match.index;
  return last;
}
