import { z } from 'zod';
import type { CheckModule } from '../types.js';
import type { ReportedEffect, ReportedResult } from '../../scan/types.js';
import { describeEffect, describeStatistic } from '../describe.js';

const optionsSchema = z.object({}).strict();

/**
 * The largest |φ| a chi-square with `df` can carry. φ = √(χ²/N) reaches at
 * most √(min(r, c) − 1) in an r × c table (Cramér, 1946, Mathematical
 * Methods of Statistics, §21.9; from memory); over every table with
 * (r − 1)(c − 1) = df that is the square root of df's largest divisor not
 * above √df: 1 for a 2 × 2 or 2 × k table. Null when the df are unknown or
 * not whole (then only a table size would say).
 */
export function largestPhi(result: ReportedResult): number | null {
  if (result.kind !== 'chi2') return 1;
  const df = result.df[0]?.value;
  if (result.df.length !== 1 || df === undefined || !Number.isInteger(df) || df < 1) return null;
  let divisor = 1;
  for (let a = 1; a * a <= df; a++) if (df % a === 0) divisor = a;
  return Math.sqrt(divisor);
}

/** Effect sizes that are proportions of variance lie in [0, 1]; omega squared may dip below 0 but not above 1. */
function effectOutOfRange(effect: ReportedEffect, result: ReportedResult): string | null {
  const value = effect.value.value;
  switch (effect.kind) {
    case 'partial-eta-squared':
    case 'eta-squared':
    case 'generalized-eta-squared':
    case 'cramers-v':
    case 'r-squared':
      return value < 0 || value > 1 ? 'must lie between 0 and 1' : null;
    case 'adjusted-r-squared':
      return value > 1 ? 'cannot exceed 1' : null;
    case 'omega-squared':
    case 'partial-omega-squared':
      return value > 1 ? 'cannot exceed 1' : null;
    case 'r':
      return Math.abs(value) > 1 ? 'must lie between -1 and 1' : null;
    case 'phi': {
      const bound = largestPhi(result);
      if (bound === null || Math.abs(value) <= bound) return null;
      return bound === 1 ? 'must lie between -1 and 1' : `cannot exceed ${Number(bound.toFixed(3))} in a table with ${result.df[0]!.text} df`;
    }
    default:
      return null;
  }
}

function statisticProblems(result: ReportedResult): string[] {
  const problems: string[] = [];
  const value = result.value?.value;
  if (value !== undefined) {
    if ((result.kind === 'F' || result.kind === 'chi2') && value < 0) problems.push(`${result.kind === 'F' ? 'F' : 'chi-square'} cannot be negative`);
    if (result.kind === 'r' && Math.abs(value) > 1) problems.push('a correlation must lie between -1 and 1');
  }
  result.df.forEach((df, i) => {
    if (df.value <= 0) problems.push(`df${result.df.length > 1 ? i + 1 : ''} = ${df.text} must be positive`);
  });
  if (result.p && (result.p.value.value < 0 || result.p.value.value > 1)) problems.push(`p = ${result.p.value.text} lies outside 0 to 1`);
  return problems;
}

export const impossibleValue: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'impossible-value',
  appliesTo: ['F', 't', 'chi2', 'r', 'z'],
  optionsSchema,
  messages: {
    statistic: 'In {statistic}: {problem}. No data can produce this value; it is probably a typo or a mislabelled quantity.',
    effect: '{effect} is reported with {statistic}, but it {problem}. No data can produce this value.',
  },
  run(result) {
    const statistic = describeStatistic(result);
    return [
      ...statisticProblems(result).map((problem) => ({ messageId: 'statistic', data: { statistic, problem } })),
      ...result.effects.flatMap((effect) => {
        const problem = effectOutOfRange(effect, result);
        return problem ? [{ messageId: 'effect', data: { statistic, effect: describeEffect(effect), problem } }] : [];
      }),
    ];
  },
};
