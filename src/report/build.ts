import { CAUTION } from './caution.js';
import type { DocumentOutput, Report, Summary } from './model.js';
import { toolVersion } from '../version.js';

/** Report assembly: plain data in, plain data out (no scanning, so cached audits need nothing heavier). */

export function unreadableDocument(path: string, error: string, format?: string): DocumentOutput {
  return { path, status: 'unreadable', error, ...(format ? { format } : {}), statistics: [], findings: [], tablesNotRead: [] };
}

/** What one document adds to a report's summary; kept beside a cached audit so the summary needs no parsing. */
export interface DocumentTally {
  unreadable: boolean;
  statistics: number;
  resultsInTables: number;
  tablesNotRead: number;
  flaggedStatistics: number;
  findings: { fail: number; warn: number; note: number };
  crossesAlpha: number;
}

export function tallyOf(document: DocumentOutput): DocumentTally {
  const findings = { fail: 0, warn: 0, note: 0 };
  let crossesAlpha = 0;
  const count = (finding: DocumentOutput['findings'][number]): void => {
    findings[finding.severity] += 1;
    if (finding.crossesAlpha) crossesAlpha += 1;
  };
  document.findings.forEach(count);
  for (const statistic of document.statistics) statistic.findings.forEach(count);
  return {
    unreadable: document.status === 'unreadable',
    statistics: document.statistics.length,
    resultsInTables: document.statistics.filter((s) => s.inTable).length,
    tablesNotRead: document.tablesNotRead.length,
    flaggedStatistics: document.statistics.filter((s) => s.findings.length > 0).length,
    findings,
    crossesAlpha,
  };
}

export function summaryOfTallies(tallies: readonly DocumentTally[]): Summary {
  const findings = { fail: 0, warn: 0, note: 0 };
  let statistics = 0;
  let resultsInTables = 0;
  let tablesNotRead = 0;
  let flaggedStatistics = 0;
  let crossesAlpha = 0;
  let unreadable = 0;
  for (const tally of tallies) {
    statistics += tally.statistics;
    resultsInTables += tally.resultsInTables;
    tablesNotRead += tally.tablesNotRead;
    flaggedStatistics += tally.flaggedStatistics;
    crossesAlpha += tally.crossesAlpha;
    if (tally.unreadable) unreadable += 1;
    findings.fail += tally.findings.fail;
    findings.warn += tally.findings.warn;
    findings.note += tally.findings.note;
  }
  return {
    documents: tallies.length,
    checked: tallies.length - unreadable,
    unreadable,
    statistics,
    resultsInText: statistics - resultsInTables,
    resultsInTables,
    tablesNotRead,
    flaggedStatistics,
    findings,
    crossesAlpha,
  };
}

export function summarise(documents: readonly DocumentOutput[]): Summary {
  return summaryOfTallies(documents.map(tallyOf));
}

/** What every report starts with: the tool and the caution. */
export function reportHead(): Pick<Report, 'tool' | 'caution'> {
  return { tool: { name: 'plumbline', version: toolVersion() }, caution: CAUTION };
}

export function buildReport(documents: DocumentOutput[]): Report {
  return { ...reportHead(), documents, summary: summarise(documents) };
}
