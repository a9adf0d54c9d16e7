import type { ReportedEffect, ReportedResult } from '../scan/types.js';

const symbolByKind: Record<ReportedResult['kind'], string> = { F: 'F', t: 't', chi2: 'χ²', r: 'r', z: 'z' };

/**
 * The statistic as a reader would write it: "F(1, 44) = 4.21"; df worked
 * out from a sample size or a table's dimensions are said to be so.
 */
export function describeStatistic(result: ReportedResult): string {
  const symbol = result.symbol ?? symbolByKind[result.kind];
  const value = result.value ? ` ${result.valueComparator} ${result.value.text}` : '';
  const dfText = result.df.map((d) => d.text).join(', ');
  if (result.dfFrom === 'sample-size' && result.sampleSize) {
    return `${symbol}${value} (n = ${result.sampleSize.text}, so df = ${dfText})`;
  }
  if (result.dfFrom === 'study-sample-size' && result.sampleSize) {
    return `${symbol}${value} (no df printed; df = ${dfText} from the N = ${result.sampleSize.text} the document states for the study, which may not be this test's sample)`;
  }
  if (result.dfFrom === 'contingency-table') {
    const table = result.dfStatement ? `the ${quoteFromDocument(result.dfStatement.text, 40)} table` : 'the table';
    return `${symbol}${value} (no df printed; df = ${dfText} from ${table} stated with it)`;
  }
  if (result.dfFrom === 'text-beside-table') {
    return `${symbol}(${dfText})${value} (no df in the table; df = ${dfText} from the text beside it)`;
  }
  if (result.dfFrom === 'levene-two-groups') {
    return `${symbol}(${dfText})${value} (Levene's test, no df printed; df = 1 and the pooled t test's ${result.df[1]!.text} from the same row)`;
  }
  const df = result.df.length > 0 ? `(${result.df.map((d) => d.text).join(', ')})` : '';
  return `${symbol}${df}${value}`;
}

/**
 * The range of recomputed p as a message gives it, before "allowing for
 * rounding": for Spearman's rs it spans the conventions in use too.
 */
export function describePRange(result: ReportedResult, range: string): string {
  return result.symbol === 'rs' ? `${range}, over the usual conventions for the p of Spearman's rs and` : range;
}

/** The printed p as a reader would write it: "p = .021". */
export function describeP(result: ReportedResult): string {
  if (!result.p) return result.notSignificant ? 'n.s.' : 'no p';
  if (result.p.fromMarks !== undefined) return `the mark "${result.p.fromMarks}" (p ${result.p.comparator} ${result.p.value.text} by the table's note)`;
  return `p ${result.p.comparator} ${result.p.value.text}`;
}

const effectSymbol: Record<ReportedEffect['kind'], string> = {
  'partial-eta-squared': 'ηp²',
  'eta-squared': 'η²',
  'generalized-eta-squared': 'ηG²',
  'omega-squared': 'ω²',
  'partial-omega-squared': 'ωp²',
  'cohens-d': 'd',
  'hedges-g': 'g',
  'cohens-f': 'f',
  r: 'r',
  phi: 'φ',
  'cramers-v': 'V',
  'r-squared': 'R²',
  'adjusted-r-squared': 'R²adj',
};

export function describeEffect(effect: ReportedEffect): string {
  return `${effectSymbol[effect.kind]} ${effect.comparator} ${effect.value.text}`;
}

/**
 * A sentence of the document quoted in a message: whitespace (line breaks
 * from the page) collapsed to single spaces, and cut at a word boundary
 * with an ellipsis when longer than maxLength, so a quote never ends
 * mid-word.
 */
export function quoteFromDocument(text: string, maxLength: number): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  if (flat.length <= maxLength) return flat;
  const cut = flat.slice(0, maxLength);
  const lastSpace = cut.lastIndexOf(' ');
  return `${(lastSpace > maxLength / 2 ? cut.slice(0, lastSpace) : cut).replace(/[\s,;:]+$/, '')}…`;
}
