import { z } from 'zod';
import type { CheckModule } from '../types.js';
import type { ReportedEffect, ReportedNumber } from '../../scan/types.js';
import { describeEffect, describeStatistic } from '../describe.js';
import { formatRange, formatValue } from '../format.js';
import { effectAgrees } from '../effectAgreement.js';
import type { Interval } from '../recompute.js';
import { adjustedRSquared } from '../../stats/index.js';

const optionsSchema = z.object({}).strict();

/** effectAgrees for a value that may be negative (adjusted R² of a weak model): compared on the mirrored side. */
function agrees(printed: ReportedNumber, range: Interval): boolean {
  return printed.value < 0 ? effectAgrees({ ...printed, value: -printed.value }, { low: -range.high, high: -range.low }) : effectAgrees(printed, range);
}

/**
 * Reported R² and adjusted R² against the F that tests the whole model:
 * R² = F df1 / (F df1 + df2), the same as partial eta squared of that F.
 * A value that matches the other of the two is named as the likely slip.
 */
export const rSquaredMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'r-squared-mismatch',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    mismatch:
      '{effect} is reported with {statistic}, but if this F tests the whole model it gives {name} = {recomputed} ({recomputedRange} allowing for rounding).{hint}',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    const rSquaredRange = recomputation?.partialEtaSquaredRange;
    if (!recomputation?.evaluable || !rSquaredRange) return [];
    const [df1, df2] = result.df.map((df) => df.value) as [number, number];
    const adjustedRange: Interval = { low: adjustedRSquared(rSquaredRange.low, df1, df2), high: adjustedRSquared(rSquaredRange.high, df1, df2) };
    const atPrinted = recomputation.partialEtaSquared ?? rSquaredRange.low;
    const ranges = {
      'r-squared': { name: 'R²', range: rSquaredRange, value: atPrinted },
      'adjusted-r-squared': { name: 'adjusted R²', range: adjustedRange, value: adjustedRSquared(atPrinted, df1, df2) },
    };
    return result.effects
      .filter((effect): effect is ReportedEffect & { kind: 'r-squared' | 'adjusted-r-squared' } => effect.kind === 'r-squared' || effect.kind === 'adjusted-r-squared')
      .filter((effect) => effect.comparator === '=' && effect.value.value <= 1) // impossible-value reports the rest
      .filter((effect) => !agrees(effect.value, ranges[effect.kind].range))
      .map((effect) => {
        const expected = ranges[effect.kind];
        const other = ranges[effect.kind === 'r-squared' ? 'adjusted-r-squared' : 'r-squared'];
        const matchesOther = agrees(effect.value, other.range);
        const hint = !matchesOther
          ? ''
          : effect.kind === 'r-squared'
            ? ` The value matches adjusted R² (${formatValue(other.value)}): the adjusted value may be labelled R².`
            : ` The value matches R² before adjustment (${formatValue(other.value)}): the unadjusted value may be labelled adjusted R².`;
        return {
          messageId: 'mismatch',
          ...(matchesOther ? { slip: effect.kind === 'r-squared' ? 'adjusted-r-squared-labelled-r-squared' : 'r-squared-labelled-adjusted' } : {}),
          data: {
            effect: describeEffect(effect),
            statistic: describeStatistic(result),
            name: expected.name,
            recomputed: formatValue(expected.value),
            recomputedRange: formatRange(expected.range.low, expected.range.high, (v) => formatValue(v)),
            hint,
          },
        };
      });
  },
};
