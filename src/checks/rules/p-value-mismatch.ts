import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeP, describeStatistic, describePRange, quoteFromDocument } from '../describe.js';
import { formatP, formatRange } from '../format.js';
import { crossesAlpha, pAgrees, printedSignificance, recomputedSignificance } from '../pAgreement.js';
import { fitsOnlyWhenHalved, fitsOnlyWithSphericityCorrection } from '../pExplanations.js';
import { fitsOnlyWithPrintedEpsilon, linkedEpsilon } from '../epsilon.js';
import { describeFactor, pDiscrepancy, type PDiscrepancy } from '../pDiscrepancy.js';
import { describeAdjustment, judgeAdjustment, type AdjustmentVerdict } from '../pAdjustment.js';
import { findSlips } from '../slips.js';

const optionsSchema = z
  .object({
    allowTruncatedP: z.boolean().default(true),
    searchSlips: z.boolean().default(true),
  })
  .strict();

type Options = z.infer<typeof optionsSchema>;

/** The sentence a message adds when the text says the p-values were adjusted; '' otherwise. */
function adjustmentNote(verdict: AdjustmentVerdict): string {
  switch (verdict.kind) {
    case 'smaller':
      return ` The text says the p-values were adjusted (${describeAdjustment(verdict.adjustment)}: "${quoteFromDocument(verdict.adjustment.statement, 80)}"), but an adjusted p is never smaller than the unadjusted one.`;
    case 'fits-neither':
      return ` The text says the p-values were adjusted (${describeAdjustment(verdict.adjustment)}: "${quoteFromDocument(verdict.adjustment.statement, 80)}"), which gives an adjusted p of ${formatRange(verdict.range.low, verdict.range.high)}; the printed p fits neither.`;
    default:
      return '';
  }
}

/** The sentence that says how large the discrepancy is: only the last digit, a factor, or an order of magnitude or more. */
function sizeNote(discrepancy: PDiscrepancy): string {
  switch (discrepancy.size) {
    case 'last-digit':
      return discrepancy.truncated
        ? ' The printed p is off only in its last digit: it is the recomputed p truncated instead of rounded.'
        : ' The printed p is off only in its last digit, by one.';
    case 'moderate':
      return ` The printed p is off by ${describeFactor(discrepancy.factor)}.`;
    case 'order-of-magnitude':
      return ` The printed p is off by an order of magnitude or more (${describeFactor(discrepancy.factor)}).`;
  }
}

/** The reported p (or "n.s.") against the p recomputed from the statistic and df. */
export const pValueMismatch: CheckModule<Options> = {
  id: 'p-value-mismatch',
  appliesTo: ['F', 't', 'chi2', 'r', 'z'],
  optionsSchema,
  messages: {
    mismatch:
      '{statistic} gives p = {recomputedP} ({recomputedRange} allowing for rounding), but {printedP} is reported.{sizeNote}{signNote}{adjustmentNote}{alphaNote}{slipNote}',
    notSignificantButIs:
      '{statistic} is marked not significant, but it gives p = {recomputedP} ({recomputedRange} allowing for rounding), below alpha = {alpha}.{adjustmentNote}',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    const range = recomputation?.pRange;
    if (!recomputation?.evaluable || !range) return [];
    const { allowTruncatedP, searchSlips } = context.options;
    const base = {
      statistic: describeStatistic(result),
      recomputedP: formatP(recomputation.p ?? (range.low + range.high) / 2),
      recomputedRange: describePRange(result, formatRange(range.low, range.high)),
      alpha: context.alpha,
    };
    const adjustment = (): AdjustmentVerdict =>
      judgeAdjustment(result, recomputation, context.text, context.document, context.alpha, allowTruncatedP);
    if (!result.p) {
      if (result.notSignificant && recomputedSignificance(range, context.alpha) === true) {
        const verdict = adjustment();
        // An adjusted p can be above alpha: adjusted-p notes what cannot be recomputed.
        if (verdict.kind === 'fits' || verdict.kind === 'unverifiable') return [];
        return [
          {
            messageId: 'notSignificantButIs',
            data: { ...base, adjustmentNote: adjustmentNote(verdict) },
            crossesAlpha: true,
            ...(verdict.kind === 'fits-neither' && verdict.adjustment.where === 'document' ? { severityAtMost: 'warn' as const } : {}),
          },
        ];
      }
      return [];
    }
    const printed = result.p.value.value;
    if (printed < 0 || printed > 1) return []; // impossible-value reports it
    if (pAgrees(result.p, range, allowTruncatedP)) return [];
    if (fitsOnlyWhenHalved(result, recomputation, allowTruncatedP)) return []; // halved-p reports it
    if (fitsOnlyWithSphericityCorrection(result, recomputation, context.document.sphericity.length > 0, allowTruncatedP)) return [];
    if (fitsOnlyWithPrintedEpsilon(result, recomputation, linkedEpsilon(result, context), allowTruncatedP)) return []; // epsilon-df-mismatch reports it
    const verdict = adjustment();
    if (verdict.kind === 'fits' || verdict.kind === 'unverifiable') return []; // consistent, or adjusted-p notes it

    // Against the adjusted p when the text states an adjustment that can be recomputed.
    const comparedRange = verdict.kind === 'fits-neither' ? verdict.range : range;
    const crosses = crossesAlpha(printedSignificance(result.p, false, context.alpha), recomputedSignificance(comparedRange, context.alpha));
    const neighbours = [context.index - 1, context.index + 1]
      .filter((i) => i >= 0 && i < context.results.length)
      .map((i) => ({ result: context.results[i]!, recomputation: context.recomputations[i]! }));
    const slips = searchSlips ? findSlips(result, neighbours, allowTruncatedP) : [];
    const firstSlip = slips[0];
    const discrepancy = pDiscrepancy(result.p, comparedRange, allowTruncatedP);
    return [
      {
        messageId: 'mismatch',
        data: {
          ...base,
          printedP: describeP(result),
          sizeNote: sizeNote(discrepancy),
          signNote: result.p.signLost ? ` The p's sign is missing in the text ("p ${result.p.value.text}") and was read as "${result.p.comparator}"; another sign may have been printed.` : '',
          adjustmentNote: adjustmentNote(verdict),
          alphaNote: crosses ? ` This changes the conclusion at alpha = ${context.alpha}.` : '',
          slipNote: firstSlip ? ` Possible slip: ${firstSlip.explanation}.` : '',
        },
        crossesAlpha: crosses,
        pDiscrepancy: discrepancy,
        // An adjustment stated elsewhere in the document may not cover this result; a p whose sign was lost
        // is compared under a sign that was read, not printed.
        ...((verdict.kind === 'fits-neither' && verdict.adjustment.where === 'document') || result.p.signLost ? { severityAtMost: 'warn' as const } : {}),
        ...(firstSlip ? { slip: firstSlip.id } : {}),
      },
    ];
  },
};
