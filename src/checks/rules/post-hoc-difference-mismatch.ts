import { z } from 'zod';
import type { CheckModule, FindingDraft } from '../types.js';
import type { ComparisonFamily, ErrorReading, PrintedComparison } from '../../scan/types.js';
import { describeStatistic } from '../describe.js';
import { formatRange, formatValue } from '../format.js';
import { pAgrees } from '../pAgreement.js';
import { absoluteRange, describeReading, meets, ratioRange } from '../contrastRanges.js';
import { roundingInterval } from '../../stats/reportedNumber.js';
import { criticalMultiplier, POST_HOC_METHODS, type PostHocMethod } from '../../stats/postHoc.js';
import { studentizedRangeUpperTail } from '../../stats/studentizedRange.js';
import type { NumberInterval } from '../../stats/monotoneImage.js';

const optionsSchema = z
  .object({
    /** A printed p may be truncated rather than rounded (as p-value-mismatch). */
    allowTruncatedP: z.boolean().default(true),
  })
  .strict();

type Options = z.infer<typeof optionsSchema>;

type Family = ComparisonFamily;

interface PairRanges {
  difference: NumberInterval;
  se: NumberInterval;
  q: NumberInterval;
}

function pairRanges(family: Family, i: number, j: number, reading: ErrorReading): PairRanges {
  const a = family.groups[i]!;
  const b = family.groups[j]!;
  const difference = { low: a.mean.low - b.mean.high, high: a.mean.high - b.mean.low };
  const factor = 1 / a.n + 1 / b.n;
  return {
    difference,
    se: { low: Math.sqrt(reading.meanSquare.low * factor), high: Math.sqrt(reading.meanSquare.high * factor) },
    q: ratioRange(absoluteRange(difference), reading, factor / 2),
  };
}

/** Critical multipliers by method, level, k, m and df: the studentized range quantile is costly, and every pair and reading asks for the same few. */
const criticalCache = new Map<string, number>();
function critical(method: PostHocMethod, level: number, k: number, m: number, df: number): number {
  const key = `${method}|${level}|${k}|${m}|${df}`;
  let value = criticalCache.get(key);
  if (value === undefined) {
    if (criticalCache.size > 1000) criticalCache.clear();
    criticalCache.set(key, (value = criticalMultiplier(method, level, k, m, df)));
  }
  return value;
}

/** Does some orientation of the pair, under the given method, reproduce everything the item prints? */
function reproduces(item: PrintedComparison, family: Family, ranges: PairRanges, methods: readonly PostHocMethod[], allowTruncatedP: boolean): boolean {
  const k = family.groups.length;
  const df = family.errorDf;
  if (item.q !== null) {
    if (!meets(ranges.q, roundingInterval(item.q))) return false;
    if (item.p !== null) {
      const p = { low: studentizedRangeUpperTail(ranges.q.high, k, df), high: studentizedRangeUpperTail(ranges.q.low, k, df) };
      if (!pAgrees(item.p, p, allowTruncatedP)) return false;
    }
  }
  if (item.se !== null && !meets(ranges.se, roundingInterval(item.se))) return false;
  for (const sign of [1, -1]) {
    const d = sign === 1 ? ranges.difference : { low: -ranges.difference.high, high: -ranges.difference.low };
    if (item.difference !== null && !meets(d, roundingInterval(item.difference))) continue;
    if (item.interval === null) return true;
    const { level, low, high } = item.interval;
    const m = (k * (k - 1)) / 2;
    for (const method of methods) {
      const c = critical(method, level, k, m, df);
      const lower = { low: d.low - c * ranges.se.high, high: d.high - c * ranges.se.low };
      const upper = { low: d.low + c * ranges.se.low, high: d.high + c * ranges.se.high };
      if (meets(lower, roundingInterval(low)) && meets(upper, roundingInterval(high))) return true;
    }
  }
  return false;
}

/** The pairs an item may mean: the one its clause names, or every pair. */
function candidatePairs(item: PrintedComparison, k: number): [number, number][] {
  if (item.pair !== null) return [item.pair];
  const pairs: [number, number][] = [];
  for (let i = 0; i < k; i++) for (let j = i + 1; j < k; j++) pairs.push([i, j]);
  return pairs;
}

/**
 * Pairwise comparisons printed after an ANOVA without a t (Tukey's q, a mean difference with its SE or CI),
 * against the same comparison recomputed from the ANOVA's group means, ns and error mean square.
 */
export const postHocDifferenceMismatch: CheckModule<Options> = {
  id: 'post-hoc-difference-mismatch',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    mismatch:
      '"{item}", printed after {statistic} as a comparison of {pair}, does not follow from the groups\' means and ns and the error mean square on {df} df ({readings}): {recomputed}.{assumed}',
  },
  run(result, context) {
    if (!result.printedComparisons) return [];
    const { items, family } = result.printedComparisons;
    const drafts: FindingDraft[] = [];
    const k = family.groups.length;
    for (const item of items) {
      // A q printed with other (k, df) belongs to another family.
      if (item.qDf !== null && (item.qDf[0] !== k || item.qDf[1] !== family.errorDf)) continue;
      const methods = item.method !== null ? [item.method] : POST_HOC_METHODS;
      const pairs = candidatePairs(item, k);
      const fits = pairs.some(([i, j]) => family.errorReadings.some((reading) => reproduces(item, family, pairRanges(family, i, j, reading), methods, context.options.allowTruncatedP)));
      if (fits) continue;
      const shown = pairs.length === 1 ? pairs[0]! : null;
      const reading = family.errorReadings[0]!;
      const recomputed =
        shown === null
          ? `no pair of the ${k} groups gives these numbers`
          : (() => {
              const r = pairRanges(family, shown[0], shown[1], reading);
              const parts = [`difference ${formatRange(r.difference.low, r.difference.high, (v) => formatValue(v, 2))}`, `SE ${formatRange(r.se.low, r.se.high, (v) => formatValue(v, 3))}`];
              if (item.q !== null) parts.push(`q ${formatRange(r.q.low, r.q.high, (v) => formatValue(v, 2))}`);
              return `with the error mean square ${describeReading(reading)}, they give ${parts.join(', ')}${item.interval !== null ? `, and ${item.method === null ? 'no method\'s' : `no ${item.method}`} interval matches` : ''}`;
            })();
      drafts.push({
        messageId: 'mismatch',
        ...(family.sizesAssumed || shown === null ? { severityAtMost: 'warn' as const } : {}),
        data: {
          item: item.text,
          statistic: describeStatistic(result),
          pair: shown === null ? 'a pair of its groups not named' : `${family.groups[shown[0]]!.label} and ${family.groups[shown[1]]!.label}`,
          df: family.errorDf,
          readings: family.errorReadings.map((r) => `${describeReading(r)} ${formatRange(r.meanSquare.low, r.meanSquare.high, (v) => formatValue(v, 3))}`).join('; '),
          recomputed,
          assumed: shown === null ? ' The pair is not named, so every pair was tried; this is at most a warning.' : '',
        },
      });
    }
    return drafts;
  },
};
