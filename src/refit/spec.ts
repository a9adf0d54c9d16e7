import { z } from 'zod';
import { RefitError } from './errors.js';
import { parseFormula, type ParsedFormula } from './formula.js';
import { parseCellNumber } from './numeric.js';

/**
 * The analysis description: our own JSON format, validated with zod.
 *
 * ```json
 * { "outcome": "score",
 *   "factors": { "group": { "levels": [1, 2, 3], "labels": { "1": "control" } } },
 *   "covariates": ["age"],
 *   "missing": { "score": "-99", "age": ">=200", "group": [9] },
 *   "rename": { "GRP": "group" },
 *   "model": "score ~ group + age",
 *   "type": 3, "coding": "sum",
 *   "ranges": { "score": "0..100" }, "termOrder": "degree", "center": false, "slopes": true }
 * ```
 */

/**
 * Default for maxColumns. Fitting time grows about with the cube of the
 * column count: a one-way design on 20,000 rows took 17 s with 1,000
 * columns, 95 s with 2,000 and 11 minutes with 4,000 (2 cores, 2026). A
 * four-way factorial of five-level factors has 625 columns.
 */
export const DEFAULT_MAX_COLUMNS = 1000;

/**
 * The most maxColumns may be raised to. The fit holds the triangular
 * factor and a batch of cell blocks in memory (a one-way design of 4,000
 * levels: 0.5 GB at its peak) and its time grows with the cube of the
 * column count (11 minutes at 4,000); 200,000 columns would need
 * terabytes and years, so a larger value is refused rather than tried.
 */
export const MAX_COLUMNS_CEILING = 4000;
export const MAX_COLUMNS_CEILING_REASON =
  'a wider fit needs hours and gigabytes of memory: its time grows with the cube of the number of columns and its memory with the square';

const levelCode = z.union([z.string(), z.number()]);

/** The adjustments of pairwise comparisons (marginalMeans.ts). */
export const ADJUSTMENT_NAMES = ['tukey', 'bonferroni', 'holm', 'sidak', 'scheffe', 'none'] as const;

const missingCodes = z.union([
  z.string().min(1),
  z.number(),
  z.array(z.union([z.number(), z.string()])).min(1),
]);

/**
 * An object whose keys are names the user chose (columns, level codes),
 * read into a Map. Column names such as "constructor", "toString" or
 * "__proto__" are ordinary names here: looked up in a plain object they
 * would find Object.prototype's members (a factor "toString" would seem
 * declared), and zod's own record drops a "__proto__" key without a word.
 * Every own key is kept, and each value is checked with `value`, its
 * problems reported under the key's path.
 */
function namedEntries<T extends z.ZodType>(value: T) {
  return z
    .custom<Record<string, z.input<T>>>((input) => typeof input === 'object' && input !== null && !Array.isArray(input), {
      message: 'expected an object of names',
    })
    .transform((input, context) => {
      const entries = new Map<string, z.output<T>>();
      for (const [key, item] of Object.entries(input)) {
        const checked = value.safeParse(item);
        if (checked.success) entries.set(key, checked.data);
        else for (const issue of checked.error.issues) context.issues.push({ ...issue, path: [key, ...issue.path] } as never);
      }
      return entries;
    });
}

const factorSchema = z
  .object({
    levels: z.array(levelCode).min(1).optional(),
    labels: namedEntries(z.string()).optional(),
  })
  .strict();

export const analysisSpecSchema = z
  .object({
    outcome: z.string().min(1).optional(),
    factors: namedEntries(factorSchema).default(() => new Map()),
    covariates: z.array(z.string().min(1)).default([]),
    missing: namedEntries(missingCodes).default(() => new Map()),
    rename: namedEntries(z.string().min(1)).default(() => new Map()),
    model: z.string().min(1),
    type: z.union([z.literal(1), z.literal(2), z.literal(3)]).default(3),
    coding: z.enum(['sum', 'treatment']).default('sum'),
    /**
     * Most design columns fitted. A factor with thousands of levels (an
     * identifier read as a factor) would make the fit take hours; past this
     * the refit stops with an error naming the factor.
     */
    maxColumns: z.number().int().min(2).max(MAX_COLUMNS_CEILING).default(DEFAULT_MAX_COLUMNS),
    /** Estimated marginal means to report: a factor ("group") or a combination of factors ("group:time"). */
    means: z.array(z.string().min(1)).default([]),
    /** Pairwise comparisons of every set of means in `means`. */
    pairwise: z.boolean().default(false),
    /** Adjustment of the pairwise comparisons' p-values and intervals (default tukey); giving it asks for the comparisons. */
    adjust: z.enum(ADJUSTMENT_NAMES).optional(),
    /** Planned contrasts of the marginal means of a factor or combination, weights in the levels' order or by level. */
    contrasts: z
      .array(
        z
          .object({
            term: z.string().min(1),
            weights: z.union([z.array(z.number()).min(2), namedEntries(z.number())]),
            name: z.string().min(1).optional(),
          })
          .strict(),
      )
      .default([]),
    /** How marginal means weight the levels of the factors they average over: equally, or by their share of the analysed rows. */
    weights: z.enum(['equal', 'proportional']).default('equal'),
    /** Print the regression coefficients of the design columns. */
    coefficients: z.boolean().default(false),
    /** Simple comparisons: the means of each `means` term compared within each level of this factor. */
    within: z.string().min(1).optional(),
    /** Values at which covariates are held for marginal means and contrasts (default: their means). */
    at: namedEntries(z.number()).default(() => new Map()),
    /** Levene's test of equal variances across the cells of the factors, centred on the cells' medians or means. */
    levene: z.enum(['median', 'mean']).optional(),
    /**
     * Order of the terms (type I sums of squares follow it): by degree, main effects and covariates first, then
     * two-way interactions and so on (the written order within a degree), or as written.
     */
    termOrder: z.enum(['degree', 'written']).default('degree'),
    /** Values each numeric column may take, "1..5" or [1, 5]: cells outside are reported (usually undeclared missing-value codes). */
    ranges: namedEntries(z.union([z.string().min(1), z.tuple([z.number(), z.number()])])).default(() => new Map()),
    /** Centre every covariate at its mean over the analysed rows where it enters an interaction with a factor. */
    center: z.boolean().default(false),
    /** Test the homogeneity of regression slopes (covariate × factor interactions added to the model). */
    slopes: z.boolean().optional(),
    /** Names shown for variables in the tables ("route": "Walking route"); reported rows printed with them match their terms. */
    names: namedEntries(z.string().min(1)).default(() => new Map()),
    /** How advice in messages is written: options of the command line, or fields of the description file. */
    advice: z.enum(['command-line', 'description']).default('description'),
  })
  .strict();

export type AnalysisSpecInput = z.input<typeof analysisSpecSchema>;
export type AnalysisSpec = z.output<typeof analysisSpecSchema>;

/** A missing-value rule for one column: literal codes, closed ranges and comparisons. */
export interface MissingRule {
  /** Codes compared as text (after trimming), e.g. "9", "refused". */
  text: Set<string>;
  /** Codes compared as numbers. */
  numbers: number[];
  ranges: Array<[number, number]>;
  comparisons: Array<{ op: '<' | '<=' | '>' | '>='; value: number }>;
}

const NUM = String.raw`[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?`;
const RANGE_RE = new RegExp(`^(${NUM})\\s*(?:-|to|\\.\\.)\\s*(${NUM})$`);
const CMP_RE = new RegExp(`^(<=|>=|<|>)\\s*(${NUM})$`);

/** Parses "6,7,8", "6-8", ">=6", [6,7,8] or 9 into a rule; `field` names the spec field in errors. */
export function parseMissingRule(codes: string | number | Array<string | number>, field: string): MissingRule {
  const rule: MissingRule = { text: new Set(), numbers: [], ranges: [], comparisons: [] };
  const pieces: Array<string | number> = Array.isArray(codes)
    ? codes
    : typeof codes === 'number'
      ? [codes]
      : codes.split(',').map((s) => s.trim()).filter((s) => s.length > 0);
  for (const piece of pieces) {
    if (typeof piece === 'number') {
      rule.numbers.push(piece);
      continue;
    }
    const s = piece.trim();
    const cmp = CMP_RE.exec(s);
    const range = RANGE_RE.exec(s);
    if (cmp) {
      rule.comparisons.push({ op: cmp[1] as '<', value: Number(cmp[2]) });
    } else if (range) {
      const lo = Number(range[1]);
      const hi = Number(range[2]);
      if (!(lo <= hi)) {
        throw new RefitError('INVALID_SPEC', `${field}: range "${s}" has its lower end above its upper end; write it as "low-high".`, { field });
      }
      rule.ranges.push([lo, hi]);
    } else if (s.length > 0) {
      rule.text.add(s);
      // The same reading of numbers as the data's cells: "0x10" is a text code, not 16.
      const n = parseCellNumber(s);
      if (!Number.isNaN(n)) rule.numbers.push(n);
    }
  }
  return rule;
}

/** True when the (trimmed, non-empty) cell text or its numeric value matches the rule. */
export function isMissingCode(rule: MissingRule, text: string, value: number): boolean {
  if (rule.text.has(text)) return true;
  if (Number.isNaN(value)) return false;
  for (const n of rule.numbers) if (n === value) return true;
  for (const [lo, hi] of rule.ranges) if (value >= lo && value <= hi) return true;
  for (const { op, value: v } of rule.comparisons) {
    if (op === '<' ? value < v : op === '<=' ? value <= v : op === '>' ? value > v : value >= v) return true;
  }
  return false;
}

/** A validated analysis description with its formula parsed. */
export interface ResolvedSpec extends AnalysisSpec {
  outcome: string;
  formula: ParsedFormula;
  missingRules: Map<string, MissingRule>;
  /** Declared ranges of numeric columns, [low, high] inclusive. */
  rangeBounds: Map<string, [number, number]>;
}

/** Terms ordered by degree (number of variables), the written order kept within a degree. */
export function orderTerms<T extends { variables: readonly string[] }>(terms: readonly T[], order: 'degree' | 'written'): T[] {
  if (order === 'written') return terms.slice();
  return terms
    .map((t, i) => ({ t, i }))
    .sort((a, b) => a.t.variables.length - b.t.variables.length || a.i - b.i)
    .map(({ t }) => t);
}

const RANGE_TEXT = new RegExp(`^\\s*(${NUM})\\s*(?:\\.\\.|to)\\s*(${NUM})\\s*$`);

/** "1..5", "1 to 5" or [1, 5] -> [1, 5]; `field` names the place in errors. */
export function parseRange(value: string | readonly [number, number], field: string): [number, number] {
  let lo: number;
  let hi: number;
  if (typeof value === 'string') {
    const m = RANGE_TEXT.exec(value);
    if (!m) {
      throw new RefitError('INVALID_SPEC', `${field}: "${value}" is not a range; write it as "low..high", e.g. "1..5".`, { field });
    }
    lo = Number(m[1]);
    hi = Number(m[2]);
  } else {
    [lo, hi] = value;
  }
  if (!(lo <= hi)) throw new RefitError('INVALID_SPEC', `${field}: the range has its lower end above its upper end; write it as "low..high", e.g. "1..5".`, { field });
  return [lo, hi];
}

/** Validates a parsed JSON value; errors name the offending field. */
export function parseAnalysisSpec(input: unknown): ResolvedSpec {
  const result = analysisSpecSchema.safeParse(input);
  if (!result.success) {
    const issue = result.error.issues[0]!;
    const field = issue.path.map(String).join('.') || '(top level)';
    const extra = result.error.issues.length > 1 ? ` (and ${result.error.issues.length - 1} more problem(s))` : '';
    throw new RefitError('INVALID_SPEC', `Analysis description, field "${field}": ${issue.message}${extra}.`, { field });
  }
  const spec = result.data;
  const written = parseFormula(spec.model);
  const formula = { ...written, terms: orderTerms(written.terms, spec.termOrder) };
  if (spec.outcome !== undefined && spec.outcome !== formula.outcome) {
    throw new RefitError(
      'INVALID_SPEC',
      `Analysis description, field "outcome": "${spec.outcome}" differs from the model's outcome "${formula.outcome}"; make them the same.`,
      { field: 'outcome' },
    );
  }
  for (const name of spec.factors.keys()) {
    if (spec.covariates.includes(name)) {
      throw new RefitError('INVALID_SPEC', `Analysis description: "${name}" is listed both under "factors" and "covariates"; keep one.`, {
        field: `factors.${name}`,
      });
    }
    if (name === formula.outcome) {
      throw new RefitError('INVALID_SPEC', `Analysis description: the outcome "${name}" cannot also be a factor.`, { field: `factors.${name}` });
    }
  }
  const variables = new Set(formula.terms.flatMap((t) => t.variables));
  const checkTerm = (term: string, field: string, what: string) => {
    const names = term.split(':').map((n) => n.trim());
    for (const name of names) {
      if (name === '' || !variables.has(name)) {
        throw new RefitError(
          'INVALID_SPEC',
          `${what} "${term}": ${name === '' ? 'an empty factor name' : `'${name}' is not in the model ${spec.model}`} (its factors and covariates: ${[...variables].join(', ')}); name factors of the model, one or several joined by ":", e.g. "${[...variables][0] ?? 'group'}".`,
          { field },
        );
      }
    }
    if (new Set(names).size !== names.length) {
      throw new RefitError('INVALID_SPEC', `${what} "${term}" names a factor twice; name each factor once.`, { field });
    }
  };
  spec.means.forEach((term, i) => checkTerm(term, `means.${i}`, 'Marginal means'));
  for (const name of spec.at.keys()) {
    if (!variables.has(name)) {
      throw new RefitError('INVALID_SPEC', `Covariate value "${name}": '${name}' is not in the model ${spec.model} (its factors and covariates: ${[...variables].join(', ')}).`, {
        field: `at.${name}`,
      });
    }
  }
  spec.contrasts.forEach((c, i) => checkTerm(c.term, `contrasts.${i}.term`, 'Contrast'));
  if (spec.within !== undefined) {
    checkTerm(spec.within, 'within', 'Comparisons within');
    if (spec.within.includes(':')) {
      throw new RefitError('INVALID_SPEC', `Comparisons within "${spec.within}": name one factor, whose levels each get their own comparisons.`, { field: 'within' });
    }
    spec.means.forEach((term, i) => {
      if (term.split(':').map((n) => n.trim()).includes(spec.within!)) {
        throw new RefitError(
          'INVALID_SPEC',
          `Marginal means "${term}" are to be compared within each level of '${spec.within}', so they cannot include '${spec.within}' itself; name the other factor(s), e.g. "${term.split(':').map((n) => n.trim()).filter((n) => n !== spec.within).join(':') || 'group'}".`,
          { field: `means.${i}` },
        );
      }
    });
  }
  if ((spec.pairwise || spec.adjust !== undefined || spec.within !== undefined) && spec.means.length === 0) {
    throw new RefitError('INVALID_SPEC', 'Pairwise comparisons compare marginal means: name the factor whose means to compare (--means <factor>, or "means" in the description).', {
      field: 'pairwise',
    });
  }
  const missingRules = new Map<string, MissingRule>();
  for (const [column, codes] of spec.missing) {
    missingRules.set(column, parseMissingRule(codes, `missing.${column}`));
  }
  for (const [name, factor] of spec.factors) {
    if ((factor.labels?.size ?? 0) > 0 && !variables.has(name)) {
      throw new RefitError(
        'INVALID_SPEC',
        `${spec.advice === 'command-line' ? `--labels "${name}=..."` : `factors.${name}.labels`}: '${name}' is not in the model ${spec.model} (its variables: ${[...variables].join(', ')}); give labels for a factor of the model.`,
        { field: `factors.${name}.labels` },
      );
    }
  }
  for (const name of spec.names.keys()) {
    if (!variables.has(name) && name !== formula.outcome) {
      throw new RefitError(
        'INVALID_SPEC',
        `${spec.advice === 'command-line' ? `--name "${name}=..."` : `names.${name}`}: '${name}' is not in the model ${spec.model} (its variables: ${[formula.outcome, ...variables].join(', ')}); name a variable of the model.`,
        { field: `names.${name}` },
      );
    }
  }
  const rangeBounds = new Map<string, [number, number]>();
  for (const [column, range] of spec.ranges) rangeBounds.set(column, parseRange(range, spec.advice === 'command-line' ? `--range "${column}=..."` : `ranges.${column}`));
  return { ...spec, outcome: formula.outcome, formula, missingRules, rangeBounds };
}
