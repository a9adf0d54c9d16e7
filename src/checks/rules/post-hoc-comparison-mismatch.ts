import { z } from 'zod';
import type { CheckModule } from '../types.js';
import type { PostHocLink } from '../../scan/types.js';
import { describeP, describeStatistic } from '../describe.js';
import { formatP, formatRange, formatValue } from '../format.js';
import { crossesAlpha, pAgrees, printedSignificance, recomputedSignificance } from '../pAgreement.js';
import { roundingInterval } from '../../stats/reportedNumber.js';
import { pairwiseComparisons, sidakAdjusted } from '../../stats/postHoc.js';
import { studentizedRangeUpperTail } from '../../stats/studentizedRange.js';
import { tTwoTailed } from '../../stats/tDistribution.js';
import { fUpperTail } from '../../stats/fDistribution.js';
import type { NumberInterval } from '../../stats/monotoneImage.js';

const optionsSchema = z
  .object({
    /** A printed p may be truncated rather than rounded (as p-value-mismatch). */
    allowTruncatedP: z.boolean().default(true),
  })
  .strict();

type Options = z.infer<typeof optionsSchema>;

const METHOD_NAMES: Record<PostHocLink['method'], string> = {
  tukey: 'Tukey (Tukey-Kramer)',
  bonferroni: 'Bonferroni',
  holm: 'Holm',
  sidak: 'Šidák',
  scheffe: 'Scheffé',
  lsd: "Fisher's LSD",
};

/** |t| over every mean and error mean square the printing allows. */
function absoluteTRange(link: PostHocLink): NumberInterval {
  const first = link.groups[link.first]!;
  const second = link.groups[link.second]!;
  const low = first.mean.low - second.mean.high;
  const high = first.mean.high - second.mean.low;
  const difference = low > 0 ? { low, high } : high < 0 ? { low: -high, high: -low } : { low: 0, high: Math.max(-low, high) };
  const weights = 1 / first.n + 1 / second.n;
  const se = { low: Math.sqrt(link.errorMeanSquare.low * weights), high: Math.sqrt(link.errorMeanSquare.high * weights) };
  return { low: se.high === 0 ? 0 : difference.low / se.high, high: se.low === 0 ? Infinity : difference.high / se.low };
}

/**
 * The method's p at |t| = t: bounds [low, high] (equal but for Holm, whose adjusted p also depends on the
 * other pairs' p: between the unadjusted p and Bonferroni's).
 */
function methodP(link: PostHocLink, t: number): NumberInterval {
  const k = link.groups.length;
  const m = (k * (k - 1)) / 2;
  const df = link.errorDf;
  const unadjusted = tTwoTailed(t, df);
  switch (link.method) {
    case 'lsd':
      return { low: unadjusted, high: unadjusted };
    case 'bonferroni':
      return { low: Math.min(1, m * unadjusted), high: Math.min(1, m * unadjusted) };
    case 'holm':
      return { low: unadjusted, high: Math.min(1, m * unadjusted) };
    case 'sidak': {
      const p = sidakAdjusted(unadjusted, m);
      return { low: p, high: p };
    }
    case 'tukey': {
      const p = studentizedRangeUpperTail(Math.SQRT2 * t, k, df);
      return { low: p, high: p };
    }
    case 'scheffe': {
      const p = fUpperTail((t * t) / (k - 1), k - 1, df);
      return { low: p, high: p };
    }
  }
}

function overlaps(range: NumberInterval, printed: NumberInterval): boolean {
  const slack = 1e-9 * Math.max(1, Math.abs(printed.high));
  return range.low <= printed.high + slack && range.high >= printed.low - slack;
}

/** A pairwise comparison after an ANOVA against the same comparison recomputed from the ANOVA's groups and error term. */
export const postHocComparisonMismatch: CheckModule<Options> = {
  id: 'post-hoc-comparison-mismatch',
  appliesTo: ['t'],
  optionsSchema,
  messages: {
    mismatch:
      '{statistic}, a {method} comparison of {first} (M = {firstMean}) and {second} (M = {secondMean}), does not follow from the groups of {family} ({k} groups, error mean square {mse} on {df} df, pooled from the SDs): they give t = {t} ({tRange} allowing for rounding) and a {method} p of {p} ({pRange}); the printed {unmatched}.{assumed}',
  },
  run(result, context) {
    const link = result.postHoc;
    if (!link || !result.value || result.valueComparator !== '=') return [];
    const tRange = absoluteTRange(link);
    const pRange = { low: methodP(link, tRange.high).low, high: methodP(link, tRange.low).high };
    const printedT = roundingInterval({ ...result.value, value: Math.abs(result.value.value) });
    const tFits = overlaps(tRange, printedT);
    const pFits = result.p === null ? true : pAgrees(result.p, pRange, context.options.allowTruncatedP);
    if (tFits && pFits) return [];
    // The comparison at the printed numbers (centre of every rounding interval). Holm's p needs every pair's p
    // (stats/postHoc.ts computes them all); the others follow from this pair's t alone.
    const centre = link.groups.map((group) => ({ label: group.label, mean: (group.mean.low + group.mean.high) / 2, n: group.n }));
    const mse = (link.errorMeanSquare.low + link.errorMeanSquare.high) / 2;
    const k = link.groups.length;
    const first = centre[link.first]!;
    const second = centre[link.second]!;
    const atCentreT = Math.abs(first.mean - second.mean) / Math.sqrt(mse * (1 / first.n + 1 / second.n));
    let atCentreP = methodP(link, atCentreT).low;
    if (link.method === 'holm') {
      const [i, j] = link.first < link.second ? [link.first, link.second] : [link.second, link.first];
      atCentreP = pairwiseComparisons(centre, mse, link.errorDf, 'holm')?.[i * k - (i * (i + 1)) / 2 + (j - i - 1)]?.p ?? atCentreP;
    }
    const unmatched = [!tFits ? 't' : null, !pFits ? `p (${describeP(result)})` : null].filter((part) => part !== null).join(' and ');
    return [
      {
        messageId: 'mismatch',
        crossesAlpha: crossesAlpha(printedSignificance(result.p, result.notSignificant, context.alpha), recomputedSignificance(pRange, context.alpha)),
        ...(link.sizesAssumed ? { severityAtMost: 'warn' as const } : {}),
        data: {
          statistic: describeStatistic(result),
          method: METHOD_NAMES[link.method],
          first: link.groups[link.first]!.label,
          second: link.groups[link.second]!.label,
          firstMean: link.printedMeans[0].text,
          secondMean: link.printedMeans[1].text,
          family: link.family,
          k,
          mse: formatRange(link.errorMeanSquare.low, link.errorMeanSquare.high, (v) => formatValue(v, 3)),
          df: link.errorDf,
          t: formatValue(atCentreT, 2),
          tRange: formatRange(tRange.low, tRange.high, (v) => formatValue(v, 2)),
          p: formatP(atCentreP),
          pRange: formatRange(pRange.low, pRange.high),
          unmatched: `${unmatched} ${unmatched.includes(' and ') ? 'do' : 'does'} not fit`,
          assumed: link.sizesAssumed ? ' The group sizes are not printed with the groups but worked out elsewhere, so this is at most a warning.' : '',
        },
      },
    ];
  },
};
