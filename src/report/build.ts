import { CAUTION } from './caution.js';
import type { DocumentOutput, Report, Summary } from './model.js';
import { toolVersion } from '../version.js';

/** Report assembly: plain data in, plain data out (no scanning, so cached audits need nothing heavier). */

export function unreadableDocument(path: string, error: string, format?: string): DocumentOutput {
  return { path, status: 'unreadable', error, ...(format ? { format } : {}), statistics: [], findings: [] };
}

export function summarise(documents: readonly DocumentOutput[]): Summary {
  const findings = { fail: 0, warn: 0, note: 0 };
  let statistics = 0;
  let flaggedStatistics = 0;
  let crossesAlpha = 0;
  for (const document of documents) {
    statistics += document.statistics.length;
    const all = [...document.findings, ...document.statistics.flatMap((s) => s.findings)];
    flaggedStatistics += document.statistics.filter((s) => s.findings.length > 0).length;
    for (const finding of all) {
      findings[finding.severity] += 1;
      if (finding.crossesAlpha) crossesAlpha += 1;
    }
  }
  const unreadable = documents.filter((d) => d.status === 'unreadable').length;
  return { documents: documents.length, checked: documents.length - unreadable, unreadable, statistics, flaggedStatistics, findings, crossesAlpha };
}

export function buildReport(documents: DocumentOutput[]): Report {
  return { tool: { name: 'plumbline', version: toolVersion() }, caution: CAUTION, documents, summary: summarise(documents) };
}
