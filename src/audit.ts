import { checkResults, type CheckedResult } from './checks/engine.js';
import type { ResolvedConfig } from './checks/config.js';
import { createLineIndex } from './scan/lines.js';
import { scanDocument, type ScannableDocument } from './scan/scanDocument.js';
import { plainTextDocument } from './documents/text.js';
import type { DocumentOutput, StatisticOutput } from './report/model.js';

/** Maps a text offset to its page, when the document has pages. */
export type PageOf = (offset: number) => number | null;

const SURROUNDING_CHARACTERS = 160;

/** Text around a result, cut at word boundaries where possible, for reports that show results in context. */
function surroundingsOf(text: string, start: number, end: number): { before: string; after: string } {
  let before = text.slice(Math.max(0, start - SURROUNDING_CHARACTERS), start);
  let after = text.slice(end, end + SURROUNDING_CHARACTERS);
  if (start > SURROUNDING_CHARACTERS) before = before.replace(/^\S*\s/, '');
  if (end + SURROUNDING_CHARACTERS < text.length) after = after.replace(/\s\S*$/, '');
  return { before, after };
}

function statisticOutput(
  checked: CheckedResult,
  text: string,
  lineOf: ReturnType<typeof createLineIndex>,
  pageOf: PageOf,
): StatisticOutput {
  const { result, recomputation, findings } = checked;
  const { line, column } = lineOf(result.start);
  return {
    kind: result.kind,
    ...(result.symbol ? { symbol: result.symbol } : {}),
    text: result.text,
    location: { page: pageOf(result.start), line, column, start: result.start, end: result.end },
    surroundings: surroundingsOf(text, result.start, result.end),
    df: result.df.map((df) => df.value),
    ...(result.dfFrom ? { dfFrom: result.dfFrom } : {}),
    value: result.value?.value ?? null,
    valueComparator: result.valueComparator,
    p: result.p ? { comparator: result.p.comparator, value: result.p.value.value, text: result.p.value.text } : null,
    notSignificant: result.notSignificant,
    effects: result.effects.map((effect) => ({
      kind: effect.kind,
      comparator: effect.comparator,
      value: effect.value.value,
      text: effect.value.text,
      interval: effect.interval
        ? { level: effect.interval.level, low: effect.interval.low.value, high: effect.interval.high.value }
        : null,
    })),
    recomputed: {
      evaluable: recomputation.evaluable,
      reason: recomputation.reason,
      tails: recomputation.tails,
      p: recomputation.p,
      pLow: recomputation.pRange?.low ?? null,
      pHigh: recomputation.pRange?.high ?? null,
      partialEtaSquared: recomputation.partialEtaSquared,
      partialEtaSquaredLow: recomputation.partialEtaSquaredRange?.low ?? null,
      partialEtaSquaredHigh: recomputation.partialEtaSquaredRange?.high ?? null,
    },
    findings,
  };
}

/** Scans and checks plain text (pasted, or a .txt/.md file): tables and the reference list are found in the text. */
export function auditText(text: string, config: ResolvedConfig, path = '<text>'): DocumentOutput {
  return auditDocument({ ...plainTextDocument(path, 'text', text) }, config, path);
}

/** Scans and checks one document read by a reader. Pure: the document and settings in, the audit out. */
export function auditDocument(
  document: ScannableDocument & { pageOf?: PageOf },
  config: ResolvedConfig,
  path = '<text>',
): DocumentOutput {
  const { text } = document;
  const pageOf = document.pageOf ?? (() => null);
  const scan = scanDocument(document);
  const checked = checkResults(text, scan, config);
  const lineOf = createLineIndex(text);
  return {
    path,
    status: 'checked',
    alpha: scan.context.alpha?.value ?? config.defaultAlpha,
    statistics: checked.map((c) => statisticOutput(c, text, lineOf, pageOf)),
    findings: [],
  };
}

export { buildReport, summarise, unreadableDocument } from './report/build.js';
