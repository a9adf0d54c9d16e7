/**
 * Typed errors of the refit engine. Every error says what went wrong, where
 * (file, row, column, term or cell when there is one) and what to change.
 */

export type RefitErrorCode =
  | 'EMPTY_FILE'
  | 'RAGGED_ROW'
  | 'TEXT_IN_NUMERIC_COLUMN'
  | 'UNKNOWN_LEVEL'
  | 'UNKNOWN_COLUMN'
  | 'UNREADABLE_FILE'
  | 'DATA_TOO_LARGE'
  | 'INVALID_SPEC'
  | 'FORMULA_SYNTAX'
  | 'NO_USABLE_ROWS'
  | 'SINGLE_LEVEL_FACTOR'
  | 'CONSTANT_OUTCOME'
  | 'EMPTY_CELL'
  | 'ALIASED_TERM'
  | 'RESIDUAL_DF'
  | 'TOO_MANY_COLUMNS'
  | 'INVALID_CONTRAST'
  | 'IDENTIFIER_FACTOR'
  | 'UNKNOWN_LABEL'
  | 'UNSUPPORTED';

export interface RefitErrorDetails {
  file?: string;
  /** Row number in the file, counting the header line as row 1. */
  row?: number;
  column?: string;
  term?: string;
  /** Other names the user may have meant (closest first). */
  suggestions?: string[];
  /** Field path in the analysis description, e.g. "factors.group.levels". */
  field?: string;
}

export class RefitError extends Error {
  readonly code: RefitErrorCode;
  readonly details: RefitErrorDetails;

  constructor(code: RefitErrorCode, message: string, details: RefitErrorDetails = {}) {
    super(message);
    this.name = 'RefitError';
    this.code = code;
    this.details = details;
  }
}

/** "file.csv, row 12, column 'age'" (only the parts that are known). */
export function describeLocation(details: RefitErrorDetails): string {
  const parts: string[] = [];
  if (details.file !== undefined) parts.push(details.file);
  if (details.row !== undefined) parts.push(`row ${details.row}`);
  if (details.column !== undefined) parts.push(`column '${details.column}'`);
  return parts.join(', ');
}

/** Levenshtein distance (small strings only: column names). */
export function editDistance(a: string, b: string): number {
  const prev = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    let diag = prev[0]!;
    prev[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const up = prev[j]!;
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      prev[j] = Math.min(up + 1, prev[j - 1]! + 1, diag + cost);
      diag = up;
    }
  }
  return prev[b.length]!;
}

/** Up to three candidates closest to `name` (case-insensitive edit distance), closest first. */
export function closestNames(name: string, candidates: readonly string[]): string[] {
  const lower = name.toLowerCase();
  return candidates
    .map((c) => {
      const cl = c.toLowerCase();
      let d = editDistance(lower, cl);
      if (cl.includes(lower) || lower.includes(cl)) d = Math.min(d, 1);
      return { c, d };
    })
    .filter(({ d }) => d <= Math.max(2, Math.ceil(name.length / 2)))
    .sort((x, y) => x.d - y.d || x.c.localeCompare(y.c))
    .slice(0, 3)
    .map(({ c }) => c);
}
