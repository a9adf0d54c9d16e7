/**
 * The weights of a planned contrast as a text gives them:
 *
 * - printed: "contrast (-1, -1, 2)", "weights 1 -1 0", "coefficients of
 *   -3, -1, 1, 3", "contrast weights: .5, .5, -1" (one per group, summing
 *   to zero);
 * - a named polynomial trend: "linear trend", "quadratic contrast" (the
 *   orthogonal polynomial weights for equally spaced levels, the groups in
 *   the order printed);
 * - words: "the two training groups against control", "vocal and
 *   breathing versus no warm-up", "X compared with the other two": each side
 *   names groups by the words of their names, and the sides get weights
 *   1/|side| and -1/|side|.
 *
 * Every reader scans a bounded stretch with loops and short anchored
 * patterns, so the cost is linear in its length.
 */

const KEYWORD = /\b(?:contrasts?(?:\s(?:weights|coefficients))?|weights|coefficients)\b/gi;
/** Most characters after the keyword looked at for the numbers. */
const NUMBERS_REACH = 24;

const MINUS = /[\u2212\u2013\u2012\u2010-]/;

/** The numbers listed from `at` ("(-1, -1, 2)", "1 -1 0", "-.5, -.5, 1"), and where the list ends; null if none. */
function numberList(text: string, at: number, limit: number): { values: number[]; end: number } | null {
  const values: number[] = [];
  let i = at;
  const end = Math.min(text.length, limit);
  const skip = (chars: string): void => {
    while (i < end && chars.includes(text[i]!)) i++;
  };
  skip(' ');
  if (i < end && '([{'.includes(text[i]!)) i++;
  for (;;) {
    skip(' ');
    let sign = 1;
    if (i < end && (text[i] === '+' || MINUS.test(text[i]!))) {
      if (MINUS.test(text[i]!)) sign = -1;
      i++;
    }
    const from = i;
    while (i < end && /[0-9]/.test(text[i]!)) i++;
    if (i < end && text[i] === '.' && /[0-9]/.test(text[i + 1] ?? '')) {
      i++;
      while (i < end && /[0-9]/.test(text[i]!)) i++;
    }
    if (i === from) {
      if (sign === -1) return null;
      break;
    }
    let value = sign * Number(text.slice(from, i));
    // A fraction weight ("1/2").
    if (text[i] === '/' && /[1-9]/.test(text[i + 1] ?? '')) {
      const denominatorFrom = ++i;
      while (i < end && /[0-9]/.test(text[i]!)) i++;
      value /= Number(text.slice(denominatorFrom, i));
    }
    values.push(value);
    if (values.length > 16) return null;
    const before = i;
    skip(' ');
    if (i < end && (text[i] === ',' || text[i] === ';')) i++;
    else if (i === before) break;
  }
  skip(' ');
  if (i < end && ')]}'.includes(text[i]!)) i++;
  return values.length >= 2 ? { values, end: i } : null;
}

/** Weights printed in `stretch` for k groups: the last list of k numbers summing to zero after a contrast keyword. */
export function printedWeights(stretch: string, k: number): { weights: number[]; text: string } | null {
  let found: { weights: number[]; text: string } | null = null;
  const keyword = new RegExp(KEYWORD.source, KEYWORD.flags);
  for (let match = keyword.exec(stretch); match !== null; match = keyword.exec(stretch)) {
    let at = match.index + match[0].length;
    // "of", "=", ":" between the keyword and the numbers.
    const lead = /^\s{0,2}(?:of\s|were\s|are\s|=|:)?/.exec(stretch.slice(at, at + 8));
    at += lead === null ? 0 : lead[0].length;
    const list = numberList(stretch, at, at + NUMBERS_REACH + 8 * k);
    if (list === null || list.values.length !== k) continue;
    const sum = list.values.reduce((a, b) => a + b, 0);
    const scale = Math.max(...list.values.map(Math.abs));
    if (scale === 0 || Math.abs(sum) > 1e-9 * scale * k) continue;
    found = { weights: list.values, text: stretch.slice(match.index, list.end).trim() };
    keyword.lastIndex = list.end;
  }
  return found;
}

const TREND = /\b(linear|quadratic|cubic)\s(?:trends?|contrasts?|components?)\b/i;

/** Orthogonal polynomial weights of a degree for k equally spaced levels (Gram-Schmidt on 1, x, x^2, x^3). */
export function polynomialWeights(k: number, degree: number): number[] | null {
  if (degree < 1 || degree > 3 || k < degree + 1) return null;
  const x = Array.from({ length: k }, (_, i) => i - (k - 1) / 2);
  const basis: number[][] = [x.map(() => 1)];
  for (let d = 1; d <= degree; d++) {
    let v = x.map((xi) => xi ** d);
    for (const b of basis) {
      const projection = v.reduce((sum, vi, i) => sum + vi * b[i]!, 0) / b.reduce((sum, bi) => sum + bi * bi, 0);
      v = v.map((vi, i) => vi - projection * b[i]!);
    }
    basis.push(v);
  }
  return basis[degree]!;
}

/** A named trend in `stretch`, with its weights for k groups in printed order. */
export function trendWeights(stretch: string, k: number): { weights: number[]; text: string } | null {
  const match = TREND.exec(stretch);
  if (match === null) return null;
  const degree = { linear: 1, quadratic: 2, cubic: 3 }[match[1]!.toLowerCase() as 'linear' | 'quadratic' | 'cubic'];
  const weights = polynomialWeights(k, degree);
  return weights === null ? null : { weights, text: match[0] };
}

const CONNECTOR = /\s(?:against|versus|vs\.?|compared (?:with|to)|relative to|with)\s/gi;
/** "with" joins the sides only right after "compared" or "contrasted" ("compared peer training with video training"). */
const OPENS_WITH = /\b(?:compar|contrast)[a-z]*\s$/i;
const OTHERS = /^(?:the\s)?(?:(?:other|remaining)(?:\s(?:two|three|four|five|groups?|conditions?))*|rest|others|all others)\b/i;
const COUNTS: Record<string, number> = { two: 2, three: 3, four: 4, five: 5, both: 2 };
/** Words that name no group in particular. */
const COMMON = new Set(['the', 'group', 'groups', 'condition', 'conditions', 'and', 'with', 'participants', 'those', 'who', 'were', 'that', 'combined', 'together', 'pooled', 'mean', 'means', 'two', 'three', 'four', 'both', 'than', 'from', 'over', 'this', 'contrast', 'planned', 'compared', 'comparing', 'arm', 'arms']);
const MAX_SIDE = 80;

function contentWords(phrase: string): string[] {
  return (phrase.toLowerCase().match(/[a-z][a-z-]{2,}/g) ?? []).filter((word) => !COMMON.has(word));
}

/** Words are the same word, or one the other's plural. */
function sameWord(a: string, b: string): boolean {
  return a === b || a === `${b}s` || b === `${a}s`;
}

/**
 * Indices of the groups a phrase names. A word in one group's name only ("peer" of "peer training") names that
 * group; when the phrase holds such words, only they count, else a word shared by several names ("training" of
 * "the two training groups") names all of them.
 */
function groupsNamed(phrase: string, names: readonly string[][]): number[] {
  const words = contentWords(phrase);
  const has = (word: string): boolean => words.some((w) => sameWord(w, word));
  const owners = (word: string): number => names.filter((name) => name.some((other) => sameWord(other, word))).length;
  const distinct = names.map((name, index) => (name.some((word) => owners(word) === 1 && has(word)) ? index : -1)).filter((index) => index >= 0);
  if (distinct.length > 0) return distinct;
  return names.map((name, index) => (name.some((word) => has(word)) ? index : -1)).filter((index) => index >= 0);
}

/**
 * Weights from words naming the groups on each side of "against" (or "versus", "compared with"), where every
 * group named is named on one side only and a count word ("the two training groups") agrees. Null when the
 * names are not decisive.
 */
export function wordWeights(stretch: string, groupNames: readonly string[]): { weights: number[]; text: string } | null {
  const names = groupNames.map(contentWords);
  // Names must tell the groups apart: no word naming two groups only.
  if (names.some((name) => name.length === 0)) return null;
  CONNECTOR.lastIndex = 0;
  for (let match = CONNECTOR.exec(stretch); match !== null; match = CONNECTOR.exec(stretch)) {
    const leftStart = clauseStart(stretch, match.index);
    if (match[0].trim().toLowerCase() === 'with' && !OPENS_WITH.test(stretch.slice(Math.max(0, leftStart - 20), leftStart))) continue;
    const left = stretch.slice(leftStart, match.index);
    const rightFrom = match.index + match[0].length;
    const right = stretch.slice(rightFrom, clauseEnd(stretch, rightFrom));
    const leftGroups = groupsNamed(left, names);
    if (leftGroups.length === 0) continue;
    let rightGroups = OTHERS.test(right.trim()) ? names.map((_, i) => i).filter((i) => !leftGroups.includes(i)) : groupsNamed(right, names);
    if (rightGroups.length === 0 || rightGroups.some((i) => leftGroups.includes(i))) continue;
    const count = /\b(two|three|four|five|both)\b/i.exec(left);
    if (count !== null && COUNTS[count[1]!.toLowerCase()] !== leftGroups.length) continue;
    const rightCount = /\b(two|three|four|five|both)\b/i.exec(right);
    if (rightCount !== null && COUNTS[rightCount[1]!.toLowerCase()] !== rightGroups.length) continue;
    rightGroups = [...new Set(rightGroups)];
    const weights = names.map((_, i) => (leftGroups.includes(i) ? 1 / leftGroups.length : rightGroups.includes(i) ? -1 / rightGroups.length : 0));
    return { weights, text: `${left.trim()}${match[0]}${right.trim()}` };
  }
  return null;
}

/** Start of the phrase before a connector: after the last clause mark or a word that opens the comparison. */
function clauseStart(stretch: string, at: number): number {
  const floor = Math.max(0, at - MAX_SIDE);
  for (let i = at - 1; i >= floor; i--) {
    if (',;:()'.includes(stretch[i]!)) return i + 1;
  }
  const before = stretch.slice(floor, at);
  const opener = /\b(?:contrast(?:ed|ing)?|compar(?:ed|ing)|of)\s/gi;
  let last = -1;
  for (let m = opener.exec(before); m !== null; m = opener.exec(before)) last = m.index + m[0].length;
  return last >= 0 ? floor + last : floor;
}

/** End of the phrase after a connector: the next clause mark, or a test. */
function clauseEnd(stretch: string, from: number): number {
  const limit = Math.min(stretch.length, from + MAX_SIDE);
  for (let i = from; i < limit; i++) {
    if (',;:()'.includes(stretch[i]!)) return i;
    if (/\s/.test(stretch[i]!) && /^\s(?:[tF]\s?\(|was|were|is|showed|yielded|gave|revealed)\b/.test(stretch.slice(i, i + 12))) return i;
  }
  return limit;
}
