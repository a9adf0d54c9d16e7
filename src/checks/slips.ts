import type { ReportedNumber, ReportedResult } from '../scan/types.js';
import { parseReportedNumber } from '../stats/reportedNumber.js';
import { fUpperTail } from '../stats/index.js';
import { pAgrees } from './pAgreement.js';
import { dfInterval, pRangeOverBox, recomputedPRange, statisticInterval, type Interval, type Recomputation } from './recompute.js';
import { describeStatistic } from './describe.js';

/** A simple slip that, if it happened, reproduces the printed p. */
export interface Slip {
  id:
    | 'df-typed-as-sample-size'
    | 'r-df-as-sample-size'
    | 'df-digit-typo'
    | 'statistic-digits-transposed'
    | 'neighbour-p-copied'
    | 'f-reported-as-t'
    | 't-reported-as-f';
  explanation: string;
}

function withNumber(original: ReportedNumber, text: string): ReportedNumber | null {
  const parsed = parseReportedNumber(text);
  return parsed ? { ...parsed, decimals: original.decimals } : null;
}

/**
 * Every text that differs from `text` by one swapped pair of neighbouring
 * digits, reading across a decimal point ("3.61" -> "6.31", "3.16"): the
 * point stays where it was typed.
 */
export function adjacentTranspositions(text: string): string[] {
  const digitPositions = [...text].flatMap((character, index) => (/\d/.test(character) ? [index] : []));
  const variants = new Set<string>();
  for (let i = 0; i + 1 < digitPositions.length; i += 1) {
    const left = digitPositions[i]!;
    const right = digitPositions[i + 1]!;
    if (text[left] === text[right]) continue;
    const characters = [...text];
    [characters[left], characters[right]] = [characters[right]!, characters[left]!];
    variants.add(characters.join(''));
  }
  return [...variants];
}

/** Every integer text that differs from `text` in exactly one digit (no leading zero). */
export function singleDigitVariants(text: string): string[] {
  if (!/^\d+$/.test(text)) return [];
  const variants = new Set<string>();
  for (let i = 0; i < text.length; i += 1) {
    for (let digit = 0; digit <= 9; digit += 1) {
      const variant = text.slice(0, i) + digit + text.slice(i + 1);
      if (variant !== text && !(variant.length > 1 && variant.startsWith('0'))) variants.add(variant);
    }
  }
  return [...variants];
}

function fitsPrinted(result: ReportedResult, variant: ReportedResult, allowTruncation: boolean): boolean {
  if (!result.p) return false;
  const alternative = recomputedPRange(variant);
  return alternative !== null && pAgrees(result.p, alternative, allowTruncation);
}

function withDf(result: ReportedResult, index: number, value: number): ReportedResult | null {
  const original = result.df[index];
  if (!original || value <= 0) return null;
  const df = [...result.df];
  df[index] = { ...original, value, text: String(value) };
  return { ...result, df };
}

/** The index of the error (or only) df: df2 for F, df for t and r. */
function errorDfIndex(result: ReportedResult): number | null {
  if (result.kind === 'F') return 1;
  if (result.kind === 't' || result.kind === 'r') return 0;
  return null;
}

function sampleSizeSlips(result: ReportedResult, allowTruncation: boolean): Slip[] {
  const index = errorDfIndex(result);
  if (index === null) return [];
  const printed = result.df[index];
  if (!printed || printed.decimals !== 0) return [];
  const slips: Slip[] = [];
  if (result.kind === 'r') {
    const variant = withDf(result, 0, printed.value - 2);
    if (variant && fitsPrinted(result, variant, allowTruncation)) {
      slips.push({
        id: 'r-df-as-sample-size',
        explanation: `the printed p fits ${describeStatistic(variant)}: the df of r is N - 2, and ${printed.text} looks like N`,
      });
    }
    return slips;
  }
  const groups = result.kind === 'F' ? (result.df[0]?.value ?? 1) + 1 : 2;
  const offsets = [...new Set([groups, 1, 2])];
  for (const offset of offsets) {
    const variant = withDf(result, index, printed.value - offset);
    if (variant && fitsPrinted(result, variant, allowTruncation)) {
      slips.push({
        id: 'df-typed-as-sample-size',
        explanation: `the printed p fits ${describeStatistic(variant)}: ${printed.text} looks like the sample size typed where the df (N - ${offset}) belongs`,
      });
      break;
    }
  }
  return slips;
}

function dfTypoSlips(result: ReportedResult, allowTruncation: boolean): Slip[] {
  const slips: Slip[] = [];
  result.df.forEach((df, index) => {
    const candidates = [...adjacentTranspositions(df.text), ...singleDigitVariants(df.text)];
    for (const candidate of candidates) {
      const variant = withDf(result, index, Number(candidate));
      if (variant && fitsPrinted(result, variant, allowTruncation)) {
        slips.push({
          id: 'df-digit-typo',
          explanation: `the printed p fits ${describeStatistic(variant)}: a digit of the df may be mistyped`,
        });
        return;
      }
    }
  });
  return slips;
}

function transposedStatisticSlips(result: ReportedResult, allowTruncation: boolean): Slip[] {
  if (!result.value) return [];
  for (const candidate of adjacentTranspositions(result.value.text)) {
    const value = withNumber(result.value, candidate);
    if (!value) continue;
    const variant = { ...result, value };
    if (fitsPrinted(result, variant, allowTruncation)) {
      return [
        {
          id: 'statistic-digits-transposed',
          explanation: `the printed p fits ${describeStatistic(variant)}: two digits of the statistic may be swapped`,
        },
      ];
    }
  }
  return [];
}

function neighbourSlips(
  result: ReportedResult,
  neighbours: readonly { result: ReportedResult; recomputation: Recomputation }[],
  allowTruncation: boolean,
): Slip[] {
  if (!result.p) return [];
  for (const neighbour of neighbours) {
    const theirP = neighbour.result.p;
    const theirRange = neighbour.recomputation.pRange;
    if (!theirP || !theirRange) continue;
    const sameP = theirP.comparator === result.p.comparator && theirP.value.text === result.p.value.text;
    if (sameP && pAgrees(theirP, theirRange, allowTruncation)) {
      return [
        {
          id: 'neighbour-p-copied',
          explanation: `the same p is printed for the neighbouring result ${describeStatistic(neighbour.result)}, where it fits: it may have been copied from there`,
        },
      ];
    }
  }
  return [];
}

function squaredSlips(result: ReportedResult, allowTruncation: boolean): Slip[] {
  if (!result.p || !result.value) return [];
  const statistic = statisticInterval(result);
  if (!statistic) return [];
  if (result.kind === 'F' && result.df[0]?.value === 1 && result.df[1]) {
    // F(1, df) = t(df)^2: an F that was really a t gives p = P(|T| > F).
    const range = pRangeOverBox('t', statistic, [dfInterval(result.df[1])]);
    if (pAgrees(result.p, range, allowTruncation)) {
      return [{ id: 'f-reported-as-t', explanation: `the printed p fits t(${result.df[1].text}) = ${result.value.text}: the value may be t, whose square is F` }];
    }
  }
  if (result.kind === 't' && result.df[0]) {
    const df = dfInterval(result.df[0]);
    const range: Interval = {
      low: Math.min(fUpperTail(statistic.high, 1, df.high), fUpperTail(statistic.high, 1, df.low)),
      high: Math.max(fUpperTail(statistic.low, 1, df.low), fUpperTail(statistic.low, 1, df.high)),
    };
    if (pAgrees(result.p, range, allowTruncation)) {
      return [{ id: 't-reported-as-f', explanation: `the printed p fits F(1, ${result.df[0].text}) = ${result.value.text}: the value may be F, the square of t` }];
    }
  }
  return [];
}

/**
 * The slips that reproduce the printed p, most specific first.
 * Only called for results whose printed p does not fit.
 */
export function findSlips(
  result: ReportedResult,
  neighbours: readonly { result: ReportedResult; recomputation: Recomputation }[],
  allowTruncation: boolean,
): Slip[] {
  // Only an exact p can single out a slip: "p < .05" fits many alternatives equally well.
  if (result.p?.comparator !== '=') return [];
  // df worked out from "n = 90" (or from the study's N, or a table's dimensions) were not typed, so no slip of the df can explain the p.
  const dfPrinted = result.dfFrom === undefined;
  return [
    ...(dfPrinted ? sampleSizeSlips(result, allowTruncation) : []),
    ...neighbourSlips(result, neighbours, allowTruncation),
    ...squaredSlips(result, allowTruncation),
    ...transposedStatisticSlips(result, allowTruncation),
    ...(dfPrinted ? dfTypoSlips(result, allowTruncation) : []),
  ];
}

