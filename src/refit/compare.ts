import { roundsTo } from '../stats/reportedNumber.js';
import type { FormulaTerm } from './formula.js';
import type { AnovaTable } from './model.js';
import { matchTermDetailed, QUANTITIES, type MatchedBy, type Quantity, type ReportedRow, type ReportedSet, type ReportedValue } from './reportedTable.js';

/**
 * Side-by-side comparison of reported and recomputed ANOVA numbers.
 *
 * A reported number "matches" when the recomputed value rounds to it at the
 * printed precision (4.2 stands for anything in [4.15, 4.25]); "p < .001"
 * matches any recomputed p below .001. Anything else "differs". A
 * quantity the manuscript leaves out is "not reported" and counts neither way.
 */

export type Verdict = 'matches' | 'differs' | 'not reported';

export interface ComparedNumber {
  quantity: Quantity;
  /** As printed, with its comparator ("< .001"); null when not reported. */
  reported: string | null;
  reportedValue: number | null;
  recomputed: number;
  /** reported - recomputed (null when not reported). */
  difference: number | null;
  verdict: Verdict;
}

export interface ComparedRow {
  /** The model term, or "Residual". */
  term: string;
  /** The label printed in the manuscript, or null when the term is not reported. */
  reportedLabel: string | null;
  where: string | null;
  /** How the printed label was matched: by name, through --map or a display name, or as an abbreviation; null when not reported. */
  matchedBy: MatchedBy | null;
  numbers: ComparedNumber[];
}

export interface Comparison {
  rows: ComparedRow[];
  /** Reported rows that name no term of the model. */
  unmatched: Array<{ label: string; where: string }>;
  /** Reported rows whose label could name several terms: not guessed, listed with the terms they could be. */
  ambiguous: Array<{ label: string; where: string; candidates: string[] }>;
  /** Terms of the model no reported row names. */
  termsNotReported: string[];
  compared: number;
  matches: number;
  differs: number;
  /** Every reported number matches (and no reported row is left unmatched or ambiguous). */
  allMatch: boolean;
}

/** True when the recomputed value agrees with the printed one, allowing for its rounding and comparator. */
export function agrees(recomputed: number, reported: ReportedValue): boolean {
  if (!Number.isFinite(recomputed)) return false;
  switch (reported.comparator) {
    case '=':
      return roundsTo(recomputed, reported);
    case '<':
      return recomputed < reported.value;
    case '<=':
      return recomputed <= reported.value || roundsTo(recomputed, reported);
    case '>':
      return recomputed > reported.value;
    case '>=':
      return recomputed >= reported.value || roundsTo(recomputed, reported);
  }
}

function printed(value: ReportedValue): string {
  return value.comparator === '=' ? value.text : `${value.comparator} ${value.text}`;
}

function compareNumber(quantity: Quantity, recomputed: number, reported: ReportedValue | undefined): ComparedNumber {
  if (reported === undefined) {
    return { quantity, reported: null, reportedValue: null, recomputed, difference: null, verdict: 'not reported' };
  }
  return {
    quantity,
    reported: printed(reported),
    reportedValue: reported.value,
    recomputed,
    difference: reported.value - recomputed,
    verdict: agrees(recomputed, reported) ? 'matches' : 'differs',
  };
}

/** Compares the reported numbers with a recomputed table; reported rows are matched to terms by name (see matchTerm). */
export function compareTables(
  table: AnovaTable,
  reported: ReportedSet,
  map: ReadonlyMap<string, string> = new Map(),
): Comparison {
  const byTerm = new Map<string, { row: ReportedRow; by: MatchedBy }>();
  const unmatched: Array<{ label: string; where: string }> = [];
  const ambiguous: Comparison['ambiguous'] = [];
  // Terms of the model the table was computed with (interaction names join their variables with ":").
  const present: FormulaTerm[] = table.terms.map((t) => ({ name: t.term, variables: t.term.split(':') }));
  for (const row of reported.rows) {
    const hit = matchTermDetailed(row.label, present, map);
    if (hit.kind === 'ambiguous') ambiguous.push({ label: row.label, where: row.where, candidates: hit.candidates.map((c) => c.name) });
    else if (hit.kind === 'none' || byTerm.has(hit.term.name)) unmatched.push({ label: row.label, where: row.where });
    else byTerm.set(hit.term.name, { row, by: hit.by });
  }
  const rows: ComparedRow[] = table.terms.map((t) => {
    const matched = byTerm.get(t.term);
    const row = matched?.row;
    return {
      term: t.term,
      reportedLabel: row?.label ?? null,
      where: row?.where ?? null,
      matchedBy: matched?.by ?? null,
      numbers: QUANTITIES.map((q) => compareNumber(q, t[q], row?.values[q])),
    };
  });
  const res = reported.residual;
  rows.push({
    term: 'Residual',
    reportedLabel: res?.label ?? null,
    where: res?.where ?? null,
    matchedBy: res ? 'name' : null,
    numbers: (['ss', 'df', 'ms'] as const).map((q) => compareNumber(q, table.residual[q], res?.values[q])),
  });
  let compared = 0;
  let matches = 0;
  for (const r of rows) {
    for (const n of r.numbers) {
      if (n.verdict === 'not reported') continue;
      compared++;
      if (n.verdict === 'matches') matches++;
    }
  }
  const termsNotReported = table.terms.filter((t) => !byTerm.has(t.term)).map((t) => t.term);
  return {
    rows,
    unmatched,
    ambiguous,
    termsNotReported,
    compared,
    matches,
    differs: compared - matches,
    allMatch: matches === compared && unmatched.length === 0 && ambiguous.length === 0,
  };
}
