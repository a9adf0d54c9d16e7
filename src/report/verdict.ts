import type { FindingOutput, StatisticOutput } from './model.js';

/**
 * The verdict on a result, in the words the CSV report's `verdict` column and
 * the JSON report's `verdict` field share: the worst severity among its
 * findings, "no flag" for a result checked without findings, "not checked"
 * for one that could not be recomputed and has none.
 */
export const VERDICTS = ['fail', 'warn', 'note', 'no flag', 'not checked'] as const;
export type Verdict = (typeof VERDICTS)[number];

type Severity = FindingOutput['severity'];
const SEVERITY_RANK: Record<Severity, number> = { fail: 3, warn: 2, note: 1 };

export function worstSeverity(findings: readonly FindingOutput[]): Severity | null {
  let worst: Severity | null = null;
  for (const finding of findings) if (worst === null || SEVERITY_RANK[finding.severity] > SEVERITY_RANK[worst]) worst = finding.severity;
  return worst;
}

export function verdictOf(statistic: Pick<StatisticOutput, 'findings' | 'recomputed'>): Verdict {
  return worstSeverity(statistic.findings) ?? (statistic.recomputed.evaluable ? 'no flag' : 'not checked');
}
