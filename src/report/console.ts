import { Chalk, type ChalkInstance } from 'chalk';
import type { DocumentOutput, FindingOutput, Report, StatisticOutput, StreamedReport } from './model.js';
import { visibleControls, visibleLine } from './visible.js';
import { tableNotReadTag } from './tableNotRead.js';
import { countOf, crossesAlphaPhrase, documentResultsPhrase, documentsPhrase, findingsPhrase, noResultsMessage, resultsPhrase, tablesNotReadPhrase } from './wording.js';

export interface ConsoleOptions {
  color: boolean;
  /** Show results without findings too (the check command does). */
  showAll: boolean;
}

function severityLabel(chalk: ChalkInstance, severity: FindingOutput['severity']): string {
  const padded = severity.padEnd(4);
  return severity === 'fail' ? chalk.red.bold(padded) : severity === 'warn' ? chalk.yellow.bold(padded) : chalk.cyan(padded);
}

function where(statistic: StatisticOutput): string {
  const page = statistic.location.page === null ? '' : `page ${statistic.location.page}, `;
  const also = (statistic.alsoAt ?? []).map((place) => `, also line ${place.line}`).join('');
  return `${page}line ${statistic.location.line}:${statistic.location.column}${also}`;
}

function statisticBlock(chalk: ChalkInstance, statistic: StatisticOutput, showAll: boolean): string[] {
  if (statistic.findings.length === 0) {
    if (!showAll) return [];
    const verdict = statistic.recomputed.evaluable ? chalk.green('ok  ') : chalk.gray('skip');
    const reason = statistic.recomputed.evaluable ? '' : chalk.gray(` (not checked: ${visibleLine(statistic.recomputed.reason ?? '')})`);
    return [`  ${chalk.gray(where(statistic))}  ${verdict}  ${visibleLine(statistic.text)}${reason}`];
  }
  const lines = [`  ${chalk.gray(where(statistic))}  ${chalk.bold(visibleLine(statistic.text))}`];
  for (const finding of statistic.findings) {
    const alpha = finding.crossesAlpha ? chalk.red(' [changes the conclusion]') : '';
    lines.push(`    ${severityLabel(chalk, finding.severity)} ${chalk.dim(finding.rule)}${alpha}`);
    lines.push(`         ${visibleLine(finding.message)}`);
  }
  return lines;
}

/** Tables that look like results tables but were not read in full: always shown, so an audit never looks cleaner than it is. */
function tablesNotReadLines(chalk: ChalkInstance, document: DocumentOutput): string[] {
  return document.tablesNotRead.flatMap((table) => {
    const page = table.location.page === null ? '' : `page ${table.location.page}, `;
    return [`  ${chalk.gray(`${page}line ${table.location.line}`)}  ${chalk.yellow(tableNotReadTag(table))}`, `         ${visibleLine(table.message)}`];
  });
}

function documentBlock(chalk: ChalkInstance, document: DocumentOutput, showAll: boolean): string[] {
  // A file name is shown exactly, but with its control characters made visible (src/report/visible.ts).
  const path = visibleControls(document.path);
  if (document.status === 'unreadable') return [chalk.bold(path), `  ${chalk.red('unreadable')}: ${visibleLine(document.error ?? '')}`, ''];
  const body = [...document.statistics.flatMap((s) => statisticBlock(chalk, s, showAll)), ...tablesNotReadLines(chalk, document)];
  const documentFindings = document.findings.flatMap((f) => [`  ${severityLabel(chalk, f.severity)} ${chalk.dim(f.rule)}`, `         ${visibleLine(f.message)}`]);
  // A document without results is always listed, with the reason: an empty one must not look like a clean one.
  const noResults = noResultsMessage(document);
  const noResultsLines = noResults === null ? [] : [`  ${chalk.yellow('no results')}: ${noResults}`];
  if (body.length === 0 && documentFindings.length === 0 && noResults === null) {
    return showAll ? [chalk.bold(path), `  ${chalk.gray(documentResultsPhrase(document))}`, ''] : [];
  }
  return [chalk.bold(path) + chalk.gray(`  (${documentResultsPhrase(document)})`), ...noResultsLines, ...documentFindings, ...body, ''];
}

/** Human-readable report: one block per document, a summary line, and the caution. */
export function formatConsole(report: Report, options: ConsoleOptions): string {
  return [...consolePieces({ caution: report.caution, summary: report.summary, documents: () => report.documents }, options)].join('');
}

/** The console report a piece at a time (one per document, then the summary), for reports too large to hold. */
export function* consolePieces(report: StreamedReport, options: ConsoleOptions): Iterable<string> {
  const chalk = new Chalk({ level: options.color ? 1 : 0 });
  const { summary } = report;
  for (const document of report.documents()) {
    const block = documentBlock(chalk, document, options.showAll);
    if (block.length > 0) yield block.map((line) => `${line}\n`).join('');
  }
  const documents = summary.unreadable > 0 ? `${countOf(summary.documents, 'document')} (${summary.checked} checked, ${chalk.red(`${summary.unreadable} unreadable`)})` : documentsPhrase(summary);
  const crosses = crossesAlphaPhrase(summary);
  const notRead = tablesNotReadPhrase(summary);
  // Results (what was read) and findings (what the rules say of them) are counted apart.
  yield `${documents}; ${resultsPhrase(summary)}; ${findingsPhrase(summary)}` + `${crosses === null ? '' : `; ${crosses}`}${notRead === null ? '' : chalk.yellow(`; ${notRead}`)}.\n`;
  yield `${chalk.gray(report.caution)}\n`;
}
