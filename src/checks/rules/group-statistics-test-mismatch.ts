import { z } from 'zod';
import type { CheckModule, FindingDraft } from '../types.js';
import type { DescriptiveSet, ReportedResult } from '../../scan/types.js';
import { describeStatistic } from '../describe.js';
import { formatP, formatRange, formatValue } from '../format.js';
import { roundingInterval } from '../../stats/reportedNumber.js';
import type { NumberInterval } from '../../stats/monotoneImage.js';
import { groupSizeProvenance, groupSizeSeverityCap } from '../groupSizes.js';
import {
  brownForsytheAnovaFromSummary,
  brownForsytheAnovaRange,
  independentTRange,
  oneWayAnovaFromSummary,
  oneWayAnovaRange,
  studentTFromSummary,
  welchAnovaFromSummary,
  welchAnovaRange,
  welchTFromSummary,
  type GroupSummaryBox,
} from '../../stats/summaryStatistics.js';

const optionsSchema = z
  .object({
    /** Characters before the result searched for the word "Welch". */
    welchWordDistance: z.number().int().min(0).max(2000).default(300),
  })
  .strict();

/** The groups as a reader would write them: "M = 4.25, SD = 1.11, n = 24; M = 3.52, ...". */
export function describeGroups(set: DescriptiveSet): string {
  return set.groups
    .map((group) => {
      const parts = [`M = ${group.mean.text}`];
      if (group.sd) parts.push(`SD = ${group.sd.text}`);
      if (group.n !== null) parts.push(`n = ${group.n}`);
      return `${group.label ? `${group.label}: ` : ''}${parts.join(', ')}`;
    })
    .join('; ');
}

/** The groups with mean, SD and n all known, as rounding boxes; null when any is missing. */
export function groupBoxes(set: DescriptiveSet): GroupSummaryBox[] | null {
  const boxes: GroupSummaryBox[] = [];
  for (const group of set.groups) {
    if (group.sd === null || group.n === null || group.n < 2) return null;
    const sd = roundingInterval(group.sd);
    boxes.push({ mean: roundingInterval(group.mean), sd: { low: Math.max(0, sd.low), high: sd.high }, n: group.n });
  }
  return boxes;
}

/** True when the words before the test (or just after it) name Brown and Forsythe's test of means. */
export function saysBrownForsythe(result: ReportedResult, text: string, distance: number): boolean {
  return /\bBrown[- ]{1,3}Forsythe/i.test(text.slice(Math.max(0, result.start - distance), result.end + 40));
}

/** True when the test is said to be Welch's (decimal df, or the word "Welch" near it). */
export function saysWelch(result: ReportedResult, text: string, distance: number): boolean {
  if (result.df.some((df) => df.decimals > 0)) return true;
  return /\bWelch/i.test(text.slice(Math.max(0, result.start - distance), result.end + 40));
}

function overlaps(a: NumberInterval, b: NumberInterval): boolean {
  const slack = 1e-9 * Math.max(1, Math.abs(a.high), Math.abs(b.high));
  return a.low <= b.high + slack && b.low <= a.high + slack;
}

interface Variant {
  name: string;
  statistic: number | null;
  range: NumberInterval;
  p: NumberInterval;
  /** The error df of a test for unequal variances (Welch, Brown-Forsythe): fractional, from the SDs and sizes. */
  df2?: { value: number | null; range: NumberInterval };
}

/**
 * A fractional error df printed with a test that the group statistics
 * reproduce only as a test for unequal variances (Welch, Brown-Forsythe):
 * that df follows from the SDs and sizes too, and is flagged when no
 * matching variant's df range (over the rounding of the SDs) holds it.
 */
function dfFindings(result: ReportedResult, set: DescriptiveSet, matching: readonly Variant[]): FindingDraft[] {
  const printed = result.df[result.df.length - 1];
  if (printed === undefined || printed.decimals === 0) return [];
  const unequal = matching.filter((variant) => variant.df2 !== undefined);
  if (unequal.length === 0) return [];
  const written = roundingInterval(printed);
  if (unequal.some((variant) => overlaps(written, variant.df2!.range))) return [];
  const first = unequal[0]!;
  const cap = groupSizeSeverityCap(set.groups);
  return [
    {
      messageId: 'dfMismatch',
      // The statistic is right; a miscopied df changes the p only a little: a warning at most.
      severityAtMost: cap ?? 'warn',
      data: {
        provenance: groupSizeProvenance(set.groups),
        statistic: describeStatistic(result),
        groups: describeGroups(set),
        variant: first.name,
        printedDf: printed.text,
        recomputedDf: formatValue(first.df2!.value ?? first.df2!.range.low, 2),
        dfRange: formatRange(first.df2!.range.low, first.df2!.range.high, (v) => formatValue(v, 2)),
      },
    },
  ];
}

/** Reported F or t against the same test recomputed from the group means, SDs and sizes. */
export const groupStatisticsTestMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'group-statistics-test-mismatch',
  appliesTo: ['F', 't'],
  optionsSchema,
  messages: {
    mismatch:
      '{statistic} does not follow from the group statistics reported with it ({groups}): they give {variant} {symbol} = {recomputed} ({recomputedRange} allowing for the rounding of every mean and SD), p = {p}{otherVariant}.{provenance}',
    dfMismatch:
      '{statistic} follows from the group statistics reported with it ({groups}) as {variant} test, but its error df {printedDf} does not: the SDs and sizes give df = {recomputedDf} ({dfRange} allowing for the rounding of every SD). The df was miscopied, or comes from another test.{provenance}',
  },
  run(result, context) {
    const set = result.descriptives;
    if (!set || !result.value || result.valueComparator !== '=') return [];
    const boxes = groupBoxes(set);
    if (boxes === null) return [];
    const welchFirst = saysWelch(result, context.text, context.options.welchWordDistance);
    const exact = set.groups.map((group) => ({ mean: group.mean.value, sd: group.sd!.value, n: group.n! }));
    const variants: Variant[] = [];
    if (result.kind === 't') {
      if (boxes.length !== 2) return [];
      const student = independentTRange(boxes[0]!, boxes[1]!, 'student');
      const welch = independentTRange(boxes[0]!, boxes[1]!, 'welch');
      if (student) variants.push({ name: "Student's", statistic: studentTFromSummary(exact[0]!, exact[1]!)?.statistic ?? null, range: student.t, p: student.p });
      if (welch) {
        const exactWelch = welchTFromSummary(exact[0]!, exact[1]!);
        variants.push({ name: "Welch's", statistic: exactWelch?.statistic ?? null, range: welch.t, p: welch.p, df2: { value: exactWelch?.df ?? null, range: welch.df } });
      }
    } else {
      const classic = oneWayAnovaRange(boxes);
      const welch = welchAnovaRange(boxes);
      const brownForsythe = brownForsytheAnovaRange(boxes);
      if (classic) variants.push({ name: 'one-way ANOVA', statistic: oneWayAnovaFromSummary(exact)?.f ?? null, range: classic.f, p: classic.p });
      if (welch) {
        const exactWelch = welchAnovaFromSummary(exact);
        variants.push({ name: "Welch's", statistic: exactWelch?.f ?? null, range: welch.f, p: welch.p, df2: { value: exactWelch?.df2 ?? null, range: welch.df2 } });
      }
      if (brownForsythe) {
        const exactBrownForsythe = brownForsytheAnovaFromSummary(exact);
        const variant = { name: "Brown-Forsythe's", statistic: exactBrownForsythe?.f ?? null, range: brownForsythe.f, p: brownForsythe.p, df2: { value: exactBrownForsythe?.df2 ?? null, range: brownForsythe.df2 } };
        // Named in the text: checked first; otherwise last, after Welch's, the usual test for unequal variances.
        if (saysBrownForsythe(result, context.text, context.options.welchWordDistance)) variants.unshift(variant);
        else variants.push(variant);
      }
    }
    if (welchFirst && variants[0]?.name !== "Brown-Forsythe's") {
      const welchAt = variants.findIndex((variant) => variant.name === "Welch's");
      if (welchAt > 0) variants.unshift(...variants.splice(welchAt, 1));
    }
    const primary = variants[0];
    if (primary === undefined) return [];
    const written = roundingInterval({ ...result.value, value: Math.abs(result.value.value) });
    const matching = variants.filter((variant) => overlaps(written, variant.range));
    if (matching.length > 0) return dfFindings(result, set, matching);
    const secondary = variants[1];
    const statisticValue = (variant: Variant): string => formatValue(Math.abs(variant.statistic ?? variant.range.low), 2);
    const reportedP = context.recomputations[context.index]?.p ?? null;
    const crossesAlpha =
      reportedP !== null && (primary.p.high < context.alpha ? reportedP >= context.alpha : primary.p.low >= context.alpha ? reportedP < context.alpha : false);
    const cap = groupSizeSeverityCap(set.groups);
    return [
      {
        messageId: 'mismatch',
        crossesAlpha,
        // Sizes from a per-group statement rather than printed with the groups are a guess: the severity says so.
        ...(cap ? { severityAtMost: cap } : {}),
        data: {
          provenance: groupSizeProvenance(set.groups),
          statistic: describeStatistic(result),
          groups: describeGroups(set),
          variant: primary.name,
          symbol: result.kind,
          recomputed: statisticValue(primary),
          recomputedRange: formatRange(primary.range.low, primary.range.high, (v) => formatValue(v, 2)),
          p: formatRange(primary.p.low, primary.p.high),
          otherVariant: secondary
            ? `; ${secondary.name} version gives ${statisticValue(secondary)} (${formatRange(secondary.range.low, secondary.range.high, (v) => formatValue(v, 2))})`
            : '',
        },
      },
    ];
  },
};
