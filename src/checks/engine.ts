import type { ReportedResult, ScanOutput } from '../scan/types.js';
import type { ResolvedConfig } from './config.js';
import { fillTemplate } from './format.js';
import { recompute, type Recomputation } from './recompute.js';
import type { Finding } from './types.js';

export interface CheckedResult {
  result: ReportedResult;
  recomputation: Recomputation;
  findings: Finding[];
}

/** Runs every active rule over every result of one document. Pure: text and scan in, findings out. */
export function checkResults(text: string, scan: ScanOutput, config: ResolvedConfig): CheckedResult[] {
  const recomputations = scan.results.map(recompute);
  const alpha = scan.context.alpha?.value ?? config.defaultAlpha;
  return scan.results.map((result, index) => {
    const findings: Finding[] = [];
    for (const rule of config.rules) {
      if (!rule.module.appliesTo.includes(result.kind)) continue;
      const drafts = rule.module.run(result, {
        text,
        document: scan.context,
        results: scan.results,
        recomputations,
        index,
        alpha,
        options: rule.options,
      });
      for (const draft of drafts) {
        const template = rule.module.messages[draft.messageId];
        if (template === undefined) throw new Error(`${rule.entry.id}: unknown message id ${draft.messageId}`);
        findings.push({
          rule: rule.entry.id,
          severity: draft.severity ?? rule.severity,
          crossesAlpha: draft.crossesAlpha ?? false,
          message: fillTemplate(template, draft.data),
          messageId: draft.messageId,
          data: draft.data,
          ...(draft.slip ? { slip: draft.slip } : {}),
        });
      }
    }
    return { result, recomputation: recomputations[index]!, findings };
  });
}
