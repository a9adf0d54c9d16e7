import type { ReportedResult, ScanOutput } from '../scan/types.js';
import type { ResolvedConfig } from './config.js';
import { withDocumentDf } from './documentDf.js';
import { DocumentIndex } from './documentIndex.js';
import { fillTemplate } from './format.js';
import { recompute, type Recomputation } from './recompute.js';
import type { Finding, HostedSets, Severity } from './types.js';
import { partitionPoint } from '../sortedSearch.js';

export interface CheckedResult {
  /** The result as checked: as scanned, with df the document gives filled in (dfFrom says so). */
  result: ReportedResult;
  recomputation: Recomputation;
  findings: Finding[];
}

const weight: Record<Severity, number> = { note: 0, warn: 1, fail: 2 };

/** The lighter of two severities; null leaves the other as it is. */
function atMost(severity: Severity, limit: Severity | null | undefined): Severity {
  return limit !== null && limit !== undefined && weight[limit] < weight[severity] ? limit : severity;
}

/**
 * Runs every active rule over every result of one document. Pure: text and scan in, findings out.
 * df that a result does not print but the document states (a study's N for a correlation) are
 * filled in first, and findings that rest on them are at most warnings (checks/documentDf.ts).
 */
export function checkResults(
  text: string,
  scan: ScanOutput,
  config: ResolvedConfig,
  /** Builds the per-document index; replaced only by tests that compare it with a reference. */
  indexDocument: (text: string, document: ScanOutput['context'], results: readonly ReportedResult[]) => DocumentIndex = (t, d, r) => new DocumentIndex(t, d, r),
): CheckedResult[] {
  const { results, severityCaps } = withDocumentDf(scan.results, scan.context, text);
  const recomputations = results.map(recompute);
  const alpha = scan.context.alpha?.value ?? config.defaultAlpha;
  // Built once: rules look up the other results here instead of walking them for every result.
  const documentIndex = indexDocument(text, scan.context, results);
  const hosted = hostSets(scan, results);
  return results.map((result, index) => {
    const findings: Finding[] = [];
    for (const rule of config.rules) {
      if (!rule.module.appliesTo.includes(result.kind)) continue;
      const drafts = rule.module.run(result, {
        text,
        document: scan.context,
        results,
        recomputations,
        index,
        documentIndex,
        ...(hosted.has(index) ? { hostedSets: hosted.get(index)! } : {}),
        alpha,
        options: rule.options,
      });
      for (const draft of drafts) {
        const template = rule.module.messages[draft.messageId];
        if (template === undefined) throw new Error(`${rule.entry.id}: unknown message id ${draft.messageId}`);
        findings.push({
          rule: rule.entry.id,
          severity: atMost(atMost(draft.severity ?? rule.severity, draft.severityAtMost), severityCaps[index]),
          crossesAlpha: draft.crossesAlpha ?? false,
          message: fillTemplate(template, draft.data),
          messageId: draft.messageId,
          data: draft.data,
          ...(draft.slip ? { slip: draft.slip } : {}),
          ...(draft.pDiscrepancy ? { pDiscrepancy: draft.pDiscrepancy } : {}),
          ...(draft.rowImplies ? { rowImplies: draft.rowImplies } : {}),
        });
      }
    }
    return { result, recomputation: recomputations[index]!, findings };
  });
}

/**
 * Which result hosts each set of printed statistics that no result's own
 * link brings to the checks (see CheckContext.hostedSets): group
 * statistics linked to no test, at the first result after them (else the
 * last); factorial cell sets, at their first linked F (else as above).
 * Results are in document order, so each set is placed by binary search.
 */
function hostSets(scan: ScanOutput, results: readonly ReportedResult[]): Map<number, HostedSets> {
  const hosted = new Map<number, HostedSets>();
  if (results.length === 0) return hosted;
  const after = (offset: number): number => {
    const index = partitionPoint(results.length, (i) => results[i]!.start < offset);
    return index < results.length ? index : results.length - 1;
  };
  const entry = (index: number): HostedSets => {
    let sets = hosted.get(index);
    if (sets === undefined) hosted.set(index, (sets = { descriptives: [], cells: [] }));
    return sets;
  };
  const linkedDescriptives = new Set(results.map((result) => result.descriptives).filter((set) => set !== undefined));
  for (const set of scan.descriptives ?? []) if (!linkedDescriptives.has(set)) entry(after(set.end)).descriptives.push(set);
  const firstLinked = new Map<unknown, number>();
  results.forEach((result, index) => {
    if (result.factorial && !firstLinked.has(result.factorial.set)) firstLinked.set(result.factorial.set, index);
  });
  for (const set of scan.cellSets ?? []) entry(firstLinked.get(set) ?? after(set.end)).cells.push(set);
  return hosted;
}
