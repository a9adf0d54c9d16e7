import { documentRecordOf, JSON_LAYOUT, summaryRecordOf } from './jsonLayout.js';
import type { DocumentOutput, Report } from './model.js';

/**
 * The JSON report (layout: src/report/jsonLayout.ts, published as
 * schema/report.schema.json). The header and summary are indented; each
 * document is one line of compact JSON, so a report of thousands of
 * documents stays small, reads line by line with grep, and a re-audit can
 * put an audit kept in the cache into the report as it was stored, without
 * parsing it again (src/batch/entry.ts).
 */
export function formatJson(report: Report): string {
  return formatJsonParts(report, report.documents.map(documentJson));
}

/** The JSON report from its parts, the documents given as their compact JSON (documentJson). */
export function formatJsonParts(head: Pick<Report, 'tool' | 'caution' | 'summary'>, documentTexts: readonly string[]): string {
  return [...jsonReportPieces(head, documentTexts)].join('');
}

/**
 * The same report as pieces in order, for writing one after another: a report of hundreds of thousands of
 * results is more text than one string may hold.
 */
export function* jsonReportPieces(head: Pick<Report, 'tool' | 'caution' | 'summary'>, documentTexts: Iterable<string>): Generator<string> {
  const nested = (value: unknown): string => JSON.stringify(value, null, 2).replace(/\n/g, '\n  ');
  yield `{\n  "layout": ${JSON_LAYOUT},\n  "tool": ${nested(head.tool)},\n  "caution": ${JSON.stringify(head.caution)},\n  "documents": [`;
  let first = true;
  for (const text of documentTexts) {
    yield `${first ? '\n    ' : ',\n    '}${text}`;
    first = false;
  }
  yield `${first ? ']' : '\n  ]'},\n  "summary": ${nested(summaryRecordOf(head.summary))}\n}\n`;
}

/**
 * A document's JSON record (jsonLayout.ts) without its path: what the cache keeps, since the same content may be
 * audited under another name.
 */
export function documentBodyJson(document: DocumentOutput): string {
  return JSON.stringify({ ...documentRecordOf(document), path: undefined });
}

/** A document's compact JSON from its path and body: the path always first, whichever way the document was made. */
export function documentJsonFromBody(path: string, body: string): string {
  const rest = body.slice(1); // after the opening brace
  return `{"path":${JSON.stringify(path)}${rest === '}' ? '' : ','}${rest}`;
}

/** A document as one line of compact JSON (the JSON report's and the JSON Lines' form). */
export function documentJson(document: DocumentOutput): string {
  return documentJsonFromBody(document.path, documentBodyJson(document));
}
