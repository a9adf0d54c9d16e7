import { auditText } from '../../../src/audit.js';
import { resolveConfig } from '../../../src/checks/config.js';
import type { Finding } from '../../../src/checks/types.js';

/** Scans and checks a short text and returns one rule's findings per result, with the result's text. */
export function ruleFindings(rule: string, text: string, settings: unknown = {}): { result: string; findings: Finding[] }[] {
  const audit = auditText(text, resolveConfig(settings));
  return audit.statistics.map((statistic) => ({ result: statistic.text, findings: statistic.findings.filter((f) => f.rule === rule) }));
}
