import { z } from 'zod';
import type { CheckModule, FindingDraft } from '../types.js';
import { describeStatistic } from '../describe.js';
import { effectAgrees } from '../effectAgreement.js';
import { formatP, formatRange, formatValue } from '../format.js';
import { crossesAlpha, pAgrees, printedSignificance, recomputedSignificance } from '../pAgreement.js';
import { compareWithTypes, describeCellSet, describeSizes, effectName, linkedEffectRanges, TYPE_NAMES } from '../factorialCells.js';
import { roundingInterval } from '../../stats/reportedNumber.js';

const optionsSchema = z
  .object({
    /** A printed p may be truncated rather than rounded (as p-value-mismatch). */
    allowTruncatedP: z.boolean().default(true),
    /** Say, as a note, which type of sums of squares an F follows from when only one does. */
    nameSingleType: z.boolean().default(true),
  })
  .strict();

type Options = z.infer<typeof optionsSchema>;

const F_DIGITS = 2;

/** "I", "I and II", "I, II and III". */
function joinWords(words: readonly string[]): string {
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/**
 * An F test of a factorial between-subjects design against the same effect
 * recomputed from the cell means, SDs and ns printed with it, under sums of
 * squares of types I, II and III.
 */
export const cellStatisticsTestMismatch: CheckModule<Options> = {
  id: 'cell-statistics-test-mismatch',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    mismatch:
      '{statistic} for {effect} does not follow from {cells}{sizes}: recomputed with every mean and SD anywhere within its rounding, {ranges}; the printed {unmatched} no type.{assumed}',
    'single-type': '{statistic} for {effect} follows from {cells} under type {type} sums of squares only ({ranges}): the design is unbalanced, and the types differ.{assumed}',
  },
  run(result, context) {
    const link = result.factorial;
    if (!link || !result.value || result.valueComparator !== '=') return [];
    const ranges = linkedEffectRanges(link);
    if (ranges.length === 0) return [];
    const printedF = roundingInterval(result.value);
    const pes = result.effects.find((effect) => effect.kind === 'partial-eta-squared' && effect.comparator === '=');
    const { byType: checks, reproducedBy, unmatched } = compareWithTypes(ranges, {
      f: printedF,
      pFits: result.p === null ? null : (range) => pAgrees(result.p!, range, context.options.allowTruncatedP),
      partialEtaSquaredFits: pes === undefined ? null : (range) => effectAgrees(pes.value, range),
    });
    const describeRanges = (list: typeof checks): string => {
      // Types that give the same ranges (a balanced design, or an effect the types agree on) are named together.
      const byText = new Map<string, string[]>();
      for (const { type, effect } of list) {
        const f = formatRange(effect.f.low, effect.f.high, (v) => formatValue(v, F_DIGITS));
        const p = formatRange(effect.p.low, effect.p.high, formatP);
        const eta = pes === undefined ? '' : `, partial eta squared ${formatRange(effect.partialEtaSquared.low, effect.partialEtaSquared.high, (v) => formatValue(v, 3))}`;
        const text = `F(${effect.df1}, ${effect.df2}) = ${f}, p = ${p}${eta}`;
        byText.set(text, [...(byText.get(text) ?? []), TYPE_NAMES[type]]);
      }
      return [...byText.entries()].map(([text, types]) => `${types.length === 1 ? 'type' : 'types'} ${joinWords(types)} ${types.length === 1 ? 'gives' : 'give'} ${text}`).join('; ');
    };
    const common = {
      statistic: describeStatistic(result),
      effect: effectName(link),
      cells: describeCellSet(link.set),
      sizes: link.assumedN === null ? describeSizes(link.set, null) : '',
      assumed: link.assumedN === null ? '' : describeSizes(link.set, link.assumedN),
    };
    const cap = link.assumedN === null ? {} : { severityAtMost: 'warn' as const };
    if (reproducedBy.length === 1 && checks.length === 3) {
      if (!context.options.nameSingleType) return [];
      return [{ messageId: 'single-type', severity: 'note', data: { ...common, type: TYPE_NAMES[reproducedBy[0]!.type], ranges: describeRanges(reproducedBy) } }];
    }
    if (reproducedBy.length > 0) return [];
    const pUnion = { low: Math.min(...checks.map((check) => check.effect.p.low)), high: Math.max(...checks.map((check) => check.effect.p.high)) };
    const draft: FindingDraft = {
      messageId: 'mismatch',
      crossesAlpha: crossesAlpha(printedSignificance(result.p, result.notSignificant, context.alpha), recomputedSignificance(pUnion, context.alpha)),
      ...cap,
      data: { ...common, ranges: describeRanges(checks), unmatched: unmatched.length > 0 ? `${joinWords(unmatched)} ${unmatched.length === 1 ? 'fits' : 'fit'}` : 'combination of F, p and partial eta squared fits' },
    };
    return [draft];
  },
};
