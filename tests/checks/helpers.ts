import { parseReportedNumber } from '../../src/stats/reportedNumber.js';
import type {
  Comparator,
  DocumentContext,
  EffectKind,
  ReportedNumber,
  ReportedResult,
  StatisticKind,
} from '../../src/scan/types.js';
import { resolveConfig } from '../../src/checks/config.js';
import { checkResults } from '../../src/checks/engine.js';
import type { Finding } from '../../src/checks/types.js';

export function num(text: string): ReportedNumber {
  const parsed = parseReportedNumber(text);
  if (!parsed) throw new Error(`test helper: cannot parse "${text}"`);
  return parsed;
}

export interface ResultSpec {
  kind: StatisticKind;
  df?: string[];
  value: string;
  valueComparator?: Comparator;
  p?: string; // e.g. "= .046", "< .05"
  ns?: boolean;
  effects?: { kind: EffectKind; value: string; ci?: [string, string]; level?: number | null }[];
  start?: number;
}

/** Builds a ReportedResult as the scanner would, from short strings, so checks are tested apart from the scanner. */
export function result(spec: ResultSpec): ReportedResult {
  const start = spec.start ?? 0;
  const pMatch = spec.p ? /^(<=|>=|=|<|>)\s*(.+)$/.exec(spec.p.trim()) : null;
  if (spec.p && !pMatch) throw new Error(`test helper: bad p "${spec.p}"`);
  return {
    kind: spec.kind,
    text: `${spec.kind} = ${spec.value}`,
    start,
    end: start + 20,
    df: (spec.df ?? []).map(num),
    sampleSize: null,
    value: num(spec.value),
    valueComparator: spec.valueComparator ?? '=',
    p: pMatch ? { comparator: pMatch[1] as Comparator, value: num(pMatch[2]!), plural: false, start, end: start } : null,
    notSignificant: spec.ns ?? false,
    effects: (spec.effects ?? []).map((effect) => ({
      kind: effect.kind,
      comparator: '=',
      value: num(effect.value),
      interval: effect.ci ? { level: effect.level === undefined ? 0.9 : effect.level, low: num(effect.ci[0]), high: num(effect.ci[1]) } : null,
      start,
      end: start,
    })),
  };
}

export function emptyContext(overrides: Partial<DocumentContext> = {}): DocumentContext {
  return { alpha: null, oneTailed: [], sampleSizes: [], sphericity: [], ...overrides };
}

/** Runs the whole default rule set and returns the findings of one rule per result. */
export function findingsOf(
  ruleId: string,
  results: ReportedResult[],
  context: DocumentContext = emptyContext(),
  text = '',
): Finding[][] {
  const config = resolveConfig({});
  return checkResults(text, { results, context }, config).map((checked) => checked.findings.filter((f) => f.rule === ruleId));
}

/** The checked results (with df the document gives filled in) and all their findings. */
export function checkedOf(results: ReportedResult[], context: DocumentContext = emptyContext(), text = '') {
  return checkResults(text, { results, context }, resolveConfig({}));
}

/** Findings of one rule for a single result. */
export function flagsOf(ruleId: string, spec: ResultSpec, context?: DocumentContext, text?: string): Finding[] {
  return findingsOf(ruleId, [result(spec)], context, text)[0]!;
}
