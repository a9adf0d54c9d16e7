import { z } from 'zod';
import type { CheckModule } from '../types.js';
import type { ContrastLink } from '../../scan/types.js';
import { describeP, describeStatistic } from '../describe.js';
import { formatP, formatRange, formatValue } from '../format.js';
import { crossesAlpha, pAgrees, printedSignificance, recomputedSignificance } from '../pAgreement.js';
import { absoluteRange, contrastRange, describeReading, meets, ratioRange, varianceFactor } from '../contrastRanges.js';
import { roundingInterval } from '../../stats/reportedNumber.js';
import { tTwoTailed } from '../../stats/tDistribution.js';
import type { NumberInterval } from '../../stats/monotoneImage.js';

const optionsSchema = z
  .object({
    /** A printed p may be truncated rather than rounded (as p-value-mismatch). */
    allowTruncatedP: z.boolean().default(true),
  })
  .strict();

type Options = z.infer<typeof optionsSchema>;

const READINGS: Record<ContrastLink['reading'], string> = {
  weights: 'with the printed weights',
  trend: 'with the orthogonal polynomial weights for equally spaced levels, the groups taken in the order printed (an assumption, so this is at most a warning)',
  words: 'with the weights the words give (an assumption, so this is at most a warning)',
};

function weightText(weights: readonly number[]): string {
  return `(${weights.map((w) => formatValue(w, 3)).join(', ')})`;
}

/** A planned contrast of an ANOVA's groups against the same contrast recomputed from their means, ns and the error mean square. */
export const contrastMismatch: CheckModule<Options> = {
  id: 'contrast-mismatch',
  appliesTo: ['t', 'F'],
  optionsSchema,
  messages: {
    mismatch:
      '{statistic}, the contrast "{contrast}" of the groups of {family} ({groups}), does not follow from their means and ns and the error mean square on {df} df {reading}: weights {weights} give {recomputed} ({ranges}); the printed {unmatched}.',
  },
  run(result, context) {
    const link = result.contrast;
    if (!link || !result.value || result.valueComparator !== '=') return [];
    const isF = result.kind === 'F';
    const magnitude = absoluteRange(contrastRange(link, link.weights));
    const factor = varianceFactor(link, link.weights);
    if (!(factor > 0)) return [];
    const printed = roundingInterval({ ...result.value, value: Math.abs(result.value.value) });
    const readings = link.errorReadings.map((reading) => {
      const t = ratioRange(magnitude, reading, factor);
      const statistic = isF ? { low: t.low ** 2, high: t.high ** 2 } : t;
      const p: NumberInterval = { low: tTwoTailed(t.high, link.errorDf), high: tTwoTailed(t.low, link.errorDf) };
      // One-tailed planned contrasts are common: the halved p is a reading too.
      const pFits = result.p === null || pAgrees(result.p, p, context.options.allowTruncatedP) || (!isF && pAgrees(result.p, { low: p.low / 2, high: p.high / 2 }, context.options.allowTruncatedP));
      return { reading, statistic, p, statisticFits: meets(statistic, printed), pFits };
    });
    if (readings.some((r) => r.statisticFits && r.pFits)) return [];
    const unmatched = [!readings.some((r) => r.statisticFits) ? (isF ? 'F' : 't') : null, !readings.some((r) => r.pFits) ? `p (${describeP(result)})` : null].filter((x) => x !== null);
    const centreMeans = link.groups.map((g) => (g.mean.low + g.mean.high) / 2);
    const centreL = centreMeans.reduce((sum, m, i) => sum + link.weights[i]! * m, 0);
    const first = link.errorReadings[0]!;
    const centreT = Math.abs(centreL) / Math.sqrt(((first.meanSquare.low + first.meanSquare.high) / 2) * factor);
    const name = isF ? 'F' : 't';
    const pUnion = { low: Math.min(...readings.map((r) => r.p.low)), high: Math.max(...readings.map((r) => r.p.high)) };
    return [
      {
        messageId: 'mismatch',
        crossesAlpha: crossesAlpha(printedSignificance(result.p, result.notSignificant, context.alpha), recomputedSignificance(pUnion, context.alpha)),
        ...(link.reading !== 'weights' || link.sizesAssumed ? { severityAtMost: 'warn' as const } : {}),
        data: {
          statistic: describeStatistic(result),
          contrast: link.weightsText,
          family: link.family,
          groups: link.groups.map((g) => `${g.label}: n = ${g.n}`).join('; '),
          df: link.errorDf,
          reading: READINGS[link.reading],
          weights: weightText(link.weights),
          recomputed: `${name} = ${formatValue(isF ? centreT ** 2 : centreT, 2)}, two-tailed p = ${formatP(tTwoTailed(centreT, link.errorDf))}`,
          ranges: readings
            .map((r) => `error mean square ${describeReading(r.reading)}, ${formatRange(r.reading.meanSquare.low, r.reading.meanSquare.high, (v) => formatValue(v, 3))}: ${name} ${formatRange(r.statistic.low, r.statistic.high, (v) => formatValue(v, 2))}, p ${formatRange(r.p.low, r.p.high)}`)
            .join('; '),
          unmatched: `${unmatched.join(' and ')} ${unmatched.length > 1 ? 'fit' : 'fits'} no reading`,
        },
      },
    ];
  },
};
