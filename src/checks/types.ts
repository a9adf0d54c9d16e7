import type { z } from 'zod';
import type { DescriptiveSet, DocumentContext, FactorialCellSet, ReportedResult, StatisticKind } from '../scan/types.js';
import type { Recomputation } from './recompute.js';
import type { DocumentIndex } from './documentIndex.js';
import type { PDiscrepancy } from './pDiscrepancy.js';

export type Severity = 'fail' | 'warn' | 'note';

/** What a check reports about one result: message id plus the numbers that fill it. */
export interface FindingDraft {
  messageId: string;
  data: Record<string, string | number>;
  /** Overrides the configured severity (e.g. a halved p is a note when one-tailed testing was declared). */
  severity?: Severity;
  /**
   * The most the finding may weigh, whatever the settings say: set when it
   * rests on context read elsewhere in the document that may not apply to
   * this result (a sample size stated for the whole study, a group size
   * stated elsewhere), so a guess is never a fail.
   */
  severityAtMost?: Severity;
  /** True when the discrepancy changes the conclusion at the document's alpha. */
  crossesAlpha?: boolean;
  /** A name for the simple slip that reproduces the reported numbers, when one does. */
  slip?: string;
  /** For a printed p that does not follow from the statistic: how far off it is (checks/pDiscrepancy.ts). */
  pDiscrepancy?: PDiscrepancy;
  /** For a table row that does not add up: the F and p its own numbers imply (rules/table-arithmetic.ts). */
  rowImplies?: RowImplies;
}

/** The F (and its p) that a row of an ANOVA table implies by its own SS, MS and df, over its error row. */
export interface RowImplies {
  /** What the F is made of: "SS / df over SS / df of 'Error'", "MS over MS of 'Error'". */
  from: string;
  statistic: number;
  statisticLow: number;
  statisticHigh: number;
  /** p at that F and the result's df; null when the df are not known. */
  p: number | null;
  pLow: number | null;
  pHigh: number | null;
}

export interface Finding {
  rule: string;
  severity: Severity;
  crossesAlpha: boolean;
  message: string;
  messageId: string;
  data: Record<string, string | number>;
  slip?: string;
  pDiscrepancy?: PDiscrepancy;
  rowImplies?: RowImplies;
}

/** Everything a check may look at besides the result itself. */
export interface CheckContext<Options> {
  /** The original text of the document. */
  text: string;
  document: DocumentContext;
  /** All results of the document, in order, with their recomputations. */
  results: readonly ReportedResult[];
  recomputations: readonly Recomputation[];
  /** Index of the result being checked in `results`. */
  index: number;
  /**
   * What the document's other results and statements say, indexed once per
   * document: ask it rather than walking `results` or the whole text for
   * each result, so checking stays linear in the number of results.
   */
  documentIndex: DocumentIndex;
  /**
   * Sets of printed statistics that no check meets through a result's own
   * link, handed to one result each so that checks of the numbers
   * themselves (GRIM) see them once: group statistics linked to no test,
   * and every factorial cell set (at its first linked F, else at the first
   * result after it, else the last result). Absent when there are none.
   */
  hostedSets?: HostedSets;
  /** Significance level in force: the document's declared alpha, else the configured default. */
  alpha: number;
  options: Options;
}

/** The sets of printed statistics a result hosts (CheckContext.hostedSets). */
export interface HostedSets {
  descriptives: DescriptiveSet[];
  cells: FactorialCellSet[];
}

/**
 * A check: its declarative description lives in rules/<id>.json; the module
 * holds the parts that are code (options schema, message templates, run).
 */
export interface CheckModule<Options = Record<string, unknown>> {
  id: string;
  appliesTo: readonly StatisticKind[];
  optionsSchema: z.ZodType<Options>;
  /** Message templates by id; `{name}` is replaced by data[name]. */
  messages: Record<string, string>;
  run(result: ReportedResult, context: CheckContext<Options>): FindingDraft[];
}
