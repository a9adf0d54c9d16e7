import type { DocumentOutput, FindingOutput, StatisticOutput, Summary, TableNotReadOutput } from './model.js';
import type { DocumentRecord, FindingRecord, ResultRecord, SummaryRecord, TableNotReadRecord, Where } from './jsonLayoutSchema.js';
import { verdictOf } from './verdict.js';

/**
 * The layout of the JSON report and of each JSON Lines record (layout 2).
 *
 * The in-memory model (model.ts) has one field per parsed token and the
 * text around every result; the layout written to files is grouped the way a
 * reviewer reads a result: `where` it is, what was `printed`, what plumbline
 * `recomputed` (with its interval), the `verdict` (worst severity) and `why`
 * (the findings). What belongs to the document (its path, format, alpha, the
 * text around its results) is written once per document: each result names
 * the span of its context window, and the window's text is in the
 * document's `passages`, the stretches of text around results, each written
 * once however many results it surrounds. (Layout 1 wrote the text around
 * each result with it, so a result-dense document repeated most of its text
 * twice per result: bench/dense.ts, line (f).)
 *
 * `documentRecordOf` writes a document in this layout and `documentFromRecord`
 * reads it back into the model, field for field (tests/report/jsonLayout.test.ts
 * holds them to that), so every reader (merge, --resume, the cache, the HTML
 * report of a merge) works on the model whatever layout a file has:
 * `documentFromJson` (jsonLayoutSchema.ts, with the zod schemas of the
 * layout) also reads layout 1, the records written before there was a
 * `layout` field. This module loads no zod: a worker and a cached re-audit
 * write and read records without it.
 */

export const JSON_LAYOUT = 2;

type Location = StatisticOutput['location'];

// ---------------------------------------------------------------- writing

function whereOf(location: Location): Where {
  return { ...(location.page === null ? {} : { page: location.page }), line: location.line, column: location.column, span: [location.start, location.end] };
}

function findingRecordOf(finding: FindingOutput): FindingRecord {
  return {
    rule: finding.rule,
    severity: finding.severity,
    message: finding.message,
    messageId: finding.messageId,
    ...(finding.crossesAlpha ? { changesConclusion: true as const } : {}),
    ...(finding.slip !== undefined ? { slip: finding.slip } : {}),
    ...(finding.pDiscrepancy ? { pDiscrepancy: finding.pDiscrepancy } : {}),
    ...(finding.rowImplies ? { rowImplies: finding.rowImplies } : {}),
  };
}

function printedOf(statistic: StatisticOutput): ResultRecord['printed'] {
  return {
    text: statistic.text,
    test: statistic.kind,
    ...(statistic.symbol ? { symbol: statistic.symbol } : {}),
    df: statistic.df,
    ...(statistic.dfFrom ? { dfFrom: statistic.dfFrom } : {}),
    statistic: statistic.value,
    ...(statistic.valueComparator === '=' ? {} : { comparator: statistic.valueComparator }),
    ...(statistic.p
      ? {
          p: {
            ...(statistic.p.comparator === '=' ? {} : { comparator: statistic.p.comparator }),
            value: statistic.p.value,
            text: statistic.p.text,
            ...(statistic.p.fromMarks !== undefined ? { fromMarks: statistic.p.fromMarks } : {}),
          },
        }
      : {}),
    ...(statistic.notSignificant ? { notSignificant: true as const } : {}),
    ...(statistic.effects.length > 0
      ? {
          effects: statistic.effects.map((effect) => ({
            kind: effect.kind,
            ...(effect.comparator === '=' ? {} : { comparator: effect.comparator }),
            value: effect.value,
            text: effect.text,
            ...(effect.interval ? { interval: effect.interval } : {}),
          })),
        }
      : {}),
  };
}

function recomputedOf(recomputed: StatisticOutput['recomputed']): ResultRecord['recomputed'] {
  const interval = (low: number | null, high: number | null): [number, number] | undefined => (low === null || high === null ? undefined : [low, high]);
  const pInterval = interval(recomputed.pLow, recomputed.pHigh);
  const partialEtaSquaredInterval = interval(recomputed.partialEtaSquaredLow, recomputed.partialEtaSquaredHigh);
  return {
    tails: recomputed.tails,
    ...(recomputed.p === null ? {} : { p: recomputed.p }),
    ...(pInterval ? { pInterval } : {}),
    ...(recomputed.partialEtaSquared === null ? {} : { partialEtaSquared: recomputed.partialEtaSquared }),
    ...(partialEtaSquaredInterval ? { partialEtaSquaredInterval } : {}),
    // recompute() gives a reason with every result it cannot evaluate; the fallback keeps the two apart all the same.
    ...(recomputed.evaluable ? {} : { notEvaluable: recomputed.reason ?? 'not recomputed' }),
  };
}

/** A stretch of the document's text known from the model: a result's text before it, its own text, or its text after it. */
interface Piece {
  at: number;
  text: string;
}

/** The context window of a result: from the start of the text before it to the end of the text after it. */
function contextOf(statistic: StatisticOutput): [number, number] {
  return [statistic.location.start - statistic.surroundings.before.length, statistic.location.end + statistic.surroundings.after.length];
}

/**
 * The passages: the pieces joined where they touch or overlap, in order. The
 * text around results comes from one text, so overlapping pieces agree; a
 * result's own text is a piece only when its length is its span's (it is the
 * text as printed, which a reader may have tidied).
 */
function passagesOf(pieces: Piece[]): Piece[] {
  pieces.sort((a, b) => a.at - b.at);
  const passages: Piece[] = [];
  let current: { at: number; parts: string[]; end: number } | null = null;
  for (const piece of pieces) {
    if (piece.text === '') continue;
    const pieceEnd = piece.at + piece.text.length;
    if (current !== null && piece.at <= current.end) {
      if (pieceEnd > current.end) {
        current.parts.push(piece.text.slice(current.end - piece.at));
        current.end = pieceEnd;
      }
      continue;
    }
    if (current !== null) passages.push({ at: current.at, text: current.parts.join('') });
    current = { at: piece.at, parts: [piece.text], end: pieceEnd };
  }
  if (current !== null) passages.push({ at: current.at, text: current.parts.join('') });
  return passages;
}

/** The text of [from, to) from the passages (sorted, apart), or null when no one passage holds all of it. */
function textIn(passages: readonly Piece[], from: number, to: number): string | null {
  if (from === to) return '';
  let low = 0;
  let high = passages.length - 1;
  while (low <= high) {
    const middle = (low + high) >> 1;
    const passage = passages[middle]!;
    if (passage.at > from) high = middle - 1;
    else if (passage.at + passage.text.length < to) low = middle + 1;
    else return passage.text.slice(from - passage.at, to - passage.at);
  }
  return null;
}

function piecesOf(statistics: readonly StatisticOutput[], withResultText: boolean): Piece[] {
  const pieces: Piece[] = [];
  for (const statistic of statistics) {
    const { start, end } = statistic.location;
    const { before, after } = statistic.surroundings;
    pieces.push({ at: start - before.length, text: before }, { at: end, text: after });
    if (withResultText && statistic.text.length === end - start) pieces.push({ at: start, text: statistic.text });
  }
  return pieces;
}

function givesBackSurroundings(passages: readonly Piece[], statistics: readonly StatisticOutput[]): boolean {
  return statistics.every((statistic) => {
    const [from, to] = contextOf(statistic);
    const { start, end } = statistic.location;
    return textIn(passages, from, start) === statistic.surroundings.before && textIn(passages, end, to) === statistic.surroundings.after;
  });
}

/**
 * The passages of a document's results. A result's own text joins the text
 * before and after it into one passage; should it ever differ from the
 * document's text at its span (a reader that tidied it), the passages are
 * made from the surrounding text alone, which always gives it back.
 */
function documentPassages(statistics: readonly StatisticOutput[]): Piece[] {
  const joined = passagesOf(piecesOf(statistics, true));
  return givesBackSurroundings(joined, statistics) ? joined : passagesOf(piecesOf(statistics, false));
}

function resultRecordOf(statistic: StatisticOutput): ResultRecord {
  return {
    where: {
      ...whereOf(statistic.location),
      in: statistic.inTable ? 'table' : 'text',
      context: contextOf(statistic),
      ...(statistic.alsoAt ? { alsoAt: statistic.alsoAt.map(whereOf) } : {}),
    },
    printed: printedOf(statistic),
    recomputed: recomputedOf(statistic.recomputed),
    verdict: verdictOf(statistic),
    why: statistic.findings.map(findingRecordOf),
  };
}

function tableNotReadRecordOf(table: TableNotReadOutput): TableNotReadRecord {
  return { where: whereOf(table.location), caption: table.caption, reason: table.reason, rowsWithStatistic: table.rowsWithStatistic, rowsRead: table.rowsRead, message: table.message };
}

/** A document in the written layout: document-level context once, then its results grouped as a reviewer reads them. */
export function documentRecordOf(document: DocumentOutput): DocumentRecord {
  return {
    path: document.path,
    layout: JSON_LAYOUT,
    status: document.status,
    ...(document.error !== undefined ? { error: document.error } : {}),
    ...(document.format !== undefined ? { format: document.format } : {}),
    ...(document.alpha !== undefined ? { alpha: document.alpha } : {}),
    ...(document.noResults ? { noResults: document.noResults } : {}),
    results: document.statistics.map(resultRecordOf),
    findings: document.findings.map(findingRecordOf),
    tablesNotRead: document.tablesNotRead.map(tableNotReadRecordOf),
    passages: documentPassages(document.statistics),
  };
}

export function summaryRecordOf(summary: Summary): SummaryRecord {
  return {
    documents: summary.documents,
    checked: summary.checked,
    unreadable: summary.unreadable,
    results: summary.statistics,
    resultsInText: summary.resultsInText,
    resultsInTables: summary.resultsInTables,
    tablesNotRead: summary.tablesNotRead,
    flaggedResults: summary.flaggedStatistics,
    findings: summary.findings,
    changesConclusion: summary.crossesAlpha,
  };
}

// ---------------------------------------------------------------- reading

function locationOf(where: Where): Location {
  return { page: where.page ?? null, line: where.line, column: where.column, start: where.span[0], end: where.span[1] };
}

function findingFrom(record: FindingRecord): FindingOutput {
  return {
    rule: record.rule,
    severity: record.severity,
    crossesAlpha: record.changesConclusion === true,
    message: record.message,
    messageId: record.messageId,
    ...(record.slip !== undefined ? { slip: record.slip } : {}),
    ...(record.pDiscrepancy ? { pDiscrepancy: record.pDiscrepancy } : {}),
    ...(record.rowImplies ? { rowImplies: record.rowImplies } : {}),
  };
}

/**
 * A result back in the model. Null when its context window is not in the
 * passages: a record that was changed by hand, or cut, is not taken for an
 * audit.
 */
function statisticFrom(record: ResultRecord, passages: readonly Piece[]): StatisticOutput | null {
  const { where, printed, recomputed } = record;
  const [from, to] = where.context;
  const [start, end] = where.span;
  const before = textIn(passages, from, start);
  const after = textIn(passages, end, to);
  if (before === null || after === null || from > start || end > to) return null;
  return {
    kind: printed.test,
    ...(printed.symbol ? { symbol: printed.symbol } : {}),
    text: printed.text,
    location: locationOf(where),
    surroundings: { before, after },
    df: printed.df,
    ...(printed.dfFrom ? { dfFrom: printed.dfFrom } : {}),
    value: printed.statistic,
    valueComparator: printed.comparator ?? '=',
    p: printed.p
      ? { comparator: printed.p.comparator ?? '=', value: printed.p.value, text: printed.p.text, ...(printed.p.fromMarks !== undefined ? { fromMarks: printed.p.fromMarks } : {}) }
      : null,
    notSignificant: printed.notSignificant === true,
    inTable: where.in === 'table',
    ...(where.alsoAt ? { alsoAt: where.alsoAt.map(locationOf) } : {}),
    effects: (printed.effects ?? []).map((effect) => ({ kind: effect.kind, comparator: effect.comparator ?? '=', value: effect.value, text: effect.text, interval: effect.interval ?? null })),
    recomputed: {
      evaluable: recomputed.notEvaluable === undefined,
      reason: recomputed.notEvaluable ?? null,
      tails: recomputed.tails,
      p: recomputed.p ?? null,
      pLow: recomputed.pInterval?.[0] ?? null,
      pHigh: recomputed.pInterval?.[1] ?? null,
      partialEtaSquared: recomputed.partialEtaSquared ?? null,
      partialEtaSquaredLow: recomputed.partialEtaSquaredInterval?.[0] ?? null,
      partialEtaSquaredHigh: recomputed.partialEtaSquaredInterval?.[1] ?? null,
    },
    findings: record.why.map(findingFrom),
  };
}

/**
 * A layout-2 record back in the model; null when a result's context is not in its passages. The record is
 * taken as it is: one from outside (a file) is checked with documentRecordSchema first (documentFromJson);
 * the defaults of the layout (comparators "=", no effects) are filled in here, so a record this build
 * wrote needs no schema to be read.
 */
export function documentFromRecord(record: DocumentRecord): DocumentOutput | null {
  const statistics: StatisticOutput[] = [];
  for (const result of record.results) {
    const statistic = statisticFrom(result, record.passages);
    if (statistic === null) return null;
    statistics.push(statistic);
  }
  return {
    path: record.path,
    status: record.status,
    ...(record.error !== undefined ? { error: record.error } : {}),
    ...(record.format !== undefined ? { format: record.format } : {}),
    ...(record.alpha !== undefined ? { alpha: record.alpha } : {}),
    statistics,
    findings: record.findings.map(findingFrom),
    tablesNotRead: record.tablesNotRead.map((table) => ({
      location: locationOf(table.where),
      caption: table.caption,
      reason: table.reason,
      rowsWithStatistic: table.rowsWithStatistic,
      rowsRead: table.rowsRead,
      message: table.message,
    })),
    ...(record.noResults ? { noResults: record.noResults } : {}),
  };
}

export function summaryFromRecord(record: SummaryRecord): Summary {
  return {
    documents: record.documents,
    checked: record.checked,
    unreadable: record.unreadable,
    statistics: record.results,
    resultsInText: record.resultsInText,
    resultsInTables: record.resultsInTables,
    tablesNotRead: record.tablesNotRead,
    flaggedStatistics: record.flaggedResults,
    findings: record.findings,
    crossesAlpha: record.changesConclusion,
  };
}

