import { z } from 'zod';
import type { CheckModule, FindingDraft } from '../types.js';
import type { ReportedEffect } from '../../scan/types.js';
import { describeEffect, describeStatistic } from '../describe.js';
import { formatRange, formatValue } from '../format.js';
import { effectAgrees } from '../effectAgreement.js';
import { statedGroupSizes, tDesign } from '../groupSizes.js';
import type { Interval } from '../recompute.js';

const optionsSchema = z
  .object({
    largestGroupImbalanceRatio: z.number().min(1).default(1.25),
  })
  .strict();

/**
 * The range of d an independent-samples t can give.
 * With sizes: t*sqrt(1/n1 + 1/n2) (Lakens 2013, formula 2), and 2t/sqrt(df),
 * the equal-n shortcut many authors use. Without sizes: from the equal-groups
 * minimum 2t/sqrt(N) up to that times the allowed imbalance factor.
 */
function independentDRange(t: Interval, df: number, sizes: [number, number] | null, imbalance: number): Interval {
  const shortcut = 2 / Math.sqrt(df);
  if (sizes) {
    const exact = Math.sqrt(1 / sizes[0] + 1 / sizes[1]);
    return { low: t.low * Math.min(exact, shortcut), high: t.high * Math.max(exact, shortcut) };
  }
  const equalGroups = 2 / Math.sqrt(df + 2);
  return { low: t.low * equalGroups, high: t.high * Math.max(shortcut, equalGroups * imbalance) };
}

/** dz = t / sqrt(n) with n = df + 1 pairs (Lakens 2013, section on within-subjects designs, cited from memory); also a one-sample d. */
function dzRange(t: Interval, df: number): Interval {
  const n = df + 1;
  return { low: t.low / Math.sqrt(n), high: t.high / Math.sqrt(n) };
}

/**
 * The label a d was written with, canonical ("dz", "dav", "drm", "d"): the
 * characters from the effect's start to its comparator, in the original text.
 */
function dLabel(text: string, effect: ReportedEffect): string {
  const written = text.slice(effect.start, Math.min(effect.end, effect.start + 30));
  const name = /^(.*?)\s*(?:=|<|>|\u2264|\u2265)/.exec(written)?.[1] ?? written;
  const canonical = name.toLowerCase().replace(/[^a-z]/g, '').replace(/^cohens?/, '');
  return canonical === 'dz' || canonical === 'dav' || canonical === 'drm' ? canonical : 'd';
}

const range2 = (interval: Interval): string => formatRange(interval.low, interval.high, (v) => formatValue(v, 2));

export const cohensDMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'cohens-d-mismatch',
  appliesTo: ['t'],
  optionsSchema,
  messages: {
    mismatch:
      '{effect} does not fit {statistic} for two independent groups: {basis} gives d = {recomputedRange}. Check the t, the d, or whether the comparison was paired.',
    pairedDz:
      '{effect} does not fit {statistic} for a paired or within-subject comparison: dz = t / sqrt(n) with n = {n} pairs gives {recomputedRange}.',
    paired:
      '{effect} does not fit {statistic} for a paired or within-subject comparison: dz = t / sqrt(n) with n = {n} pairs gives {dz}, and d_av or d_rm, which depend on the correlation between the two measures, cannot exceed 2t / sqrt(n) = {largest}.{hint}',
    oneSample: '{effect} does not fit {statistic} for a one-sample test: d = t / sqrt(n) with n = {n} gives {recomputedRange}.',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    const df = result.df[0];
    const statistic = recomputation?.statisticRange;
    if (!recomputation?.evaluable || !statistic || !df || df.decimals !== 0 || result.valueComparator !== '=') return [];
    const ds = result.effects.filter((effect) => effect.kind === 'cohens-d' && effect.comparator === '=');
    if (ds.length === 0) return [];
    const design = tDesign(context.text, result.start, result.end);
    const n = df.value + 1;
    const common = (effect: ReportedEffect) => ({ effect: describeEffect(effect), statistic: describeStatistic(result), n });
    if (design === 'one-sample') {
      const expected = dzRange(statistic, df.value);
      return ds
        .filter((effect) => !effectAgrees(effect.value, expected))
        .map((effect) => ({ messageId: 'oneSample', data: { ...common(effect), recomputedRange: range2(expected) } }));
    }
    if (design === 'paired') {
      // Never the independent-groups formula: dz when the d is labelled so, otherwise any paired convention.
      const dz = dzRange(statistic, df.value);
      const anyPaired: Interval = { low: 0, high: 2 * dz.high };
      return ds.flatMap((effect): FindingDraft[] => {
        if (dLabel(context.text, effect) === 'dz') {
          return effectAgrees(effect.value, dz) ? [] : [{ messageId: 'pairedDz', data: { ...common(effect), recomputedRange: range2(dz) } }];
        }
        if (effectAgrees(effect.value, anyPaired)) return [];
        const independent = { low: (2 * statistic.low) / Math.sqrt(df.value), high: (2 * statistic.high) / Math.sqrt(df.value) };
        const misapplied = effectAgrees(effect.value, independent);
        return [
          {
            messageId: 'paired',
            data: {
              ...common(effect),
              dz: range2(dz),
              largest: formatValue(anyPaired.high, 2),
              hint: misapplied ? ' It equals 2t / sqrt(df), the formula for two independent groups, which does not apply to paired data.' : '',
            },
            ...(misapplied ? { slip: 'independent-groups-d-for-paired-t' } : {}),
          },
        ];
      });
    }
    const sizes = statedGroupSizes(context.text, result.start, df.value);
    const expected = independentDRange(statistic, df.value, sizes, context.options.largestGroupImbalanceRatio);
    return ds
      .filter((effect) => !effectAgrees(effect.value, expected))
      .map((effect) => ({
        messageId: 'mismatch',
        data: {
          effect: describeEffect(effect),
          statistic: describeStatistic(result),
          basis: sizes ? `groups of ${sizes[0]} and ${sizes[1]}` : `N = ${df.value + 2} split into two groups`,
          recomputedRange: range2(expected),
        },
      }));
  },
};
