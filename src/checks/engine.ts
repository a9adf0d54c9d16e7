import type { ReportedResult, ScanOutput } from '../scan/types.js';
import type { ResolvedConfig } from './config.js';
import { withDocumentDf } from './documentDf.js';
import { DocumentIndex } from './documentIndex.js';
import { fillTemplate } from './format.js';
import { recompute, type Recomputation } from './recompute.js';
import type { Finding, Severity } from './types.js';

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
