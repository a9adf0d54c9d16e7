import { RefitError } from './errors.js';

/**
 * Model formulas in Wilkinson-Rogers notation.
 *
 * Supported: `y ~ a + b + a:b`, `a*b` (= a + b + a:b), `a*b*c`, `(a + b)^2`
 * (all interactions up to order 2), covariates (any variable), parentheses,
 * and back-quoted names for columns with spaces (`` `reaction time` ``).
 * A term is a set of variables; an interaction is named by joining its
 * variables with ":" in the order they appear in the formula. Terms keep the
 * written order at the top level; the terms produced by expanding one `*` or
 * `^` product are ordered by degree (main effects, then two-way, ...), as in
 * the usual notation. Type I sums of squares follow this order.
 *
 * ## References
 * - Wilkinson, G. N. & Rogers, C. E. (1973). Symbolic description of
 *   factorial models for analysis of variance. Applied Statistics 22(3),
 *   392-399.
 */

export interface FormulaTerm {
  /** Variables joined with ":" in formula order, e.g. "a:b". */
  name: string;
  variables: string[];
}

export interface ParsedFormula {
  outcome: string;
  terms: FormulaTerm[];
}

type Token =
  | { kind: 'name'; value: string; pos: number }
  | { kind: 'number'; value: number; pos: number }
  | { kind: 'op'; value: '~' | '+' | '-' | '*' | ':' | '^' | '(' | ')'; pos: number };

function syntaxError(formula: string, pos: number, what: string): RefitError {
  return new RefitError(
    'FORMULA_SYNTAX',
    `Model formula "${formula}": ${what} at character ${pos + 1}. ` +
      'Write it like "y ~ a * b + covariate" (operators + * : ^ and parentheses).',
    { field: 'model' },
  );
}

function tokenize(formula: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < formula.length) {
    const ch = formula[i]!;
    if (/\s/.test(ch)) {
      i++;
    } else if ('~+-*:^()'.includes(ch)) {
      tokens.push({ kind: 'op', value: ch as '~', pos: i });
      i++;
    } else if (ch === '`') {
      const end = formula.indexOf('`', i + 1);
      if (end < 0) throw syntaxError(formula, i, 'unclosed back-quote');
      tokens.push({ kind: 'name', value: formula.slice(i + 1, end), pos: i });
      i = end + 1;
    } else if (/[0-9]/.test(ch)) {
      const m = /^[0-9]+/.exec(formula.slice(i))!;
      tokens.push({ kind: 'number', value: Number(m[0]), pos: i });
      i += m[0].length;
    } else if (/[\p{L}_.]/u.test(ch)) {
      const m = /^[\p{L}\p{N}_.]+/u.exec(formula.slice(i))!;
      tokens.push({ kind: 'name', value: m[0], pos: i });
      i += m[0].length;
    } else {
      throw syntaxError(formula, i, `unexpected character '${ch}'`);
    }
  }
  return tokens;
}

/** A term list; each term an ordered, duplicate-free variable list. */
type Terms = string[][];

function sameSet(a: string[], b: string[]): boolean {
  return a.length === b.length && a.every((v) => b.includes(v));
}

function addTerms(into: Terms, more: Terms): Terms {
  const out = into.slice();
  for (const t of more) if (!out.some((u) => sameSet(u, t))) out.push(t);
  return out;
}

function colonTerms(left: Terms, right: Terms): Terms {
  let out: Terms = [];
  for (const l of left) {
    for (const r of right) {
      const merged = l.slice();
      for (const v of r) if (!merged.includes(v)) merged.push(v);
      out = addTerms(out, [merged]);
    }
  }
  return out;
}

/** a*b = a + b + a:b, ordered by degree (stable). */
function starTerms(left: Terms, right: Terms): Terms {
  const all = addTerms(addTerms(left, right), colonTerms(left, right));
  return all
    .map((t, i) => ({ t, i }))
    .sort((x, y) => x.t.length - y.t.length || x.i - y.i)
    .map(({ t }) => t);
}

class Parser {
  private i = 0;
  constructor(
    private readonly formula: string,
    private readonly tokens: Token[],
  ) {}

  private peek(): Token | undefined {
    return this.tokens[this.i];
  }

  private isOp(value: string): boolean {
    const t = this.peek();
    return t !== undefined && t.kind === 'op' && t.value === value;
  }

  private fail(what: string): never {
    const t = this.peek();
    throw syntaxError(this.formula, t ? t.pos : this.formula.length, what);
  }

  parse(): ParsedFormula {
    const first = this.peek();
    if (!first || first.kind !== 'name') this.fail('expected the outcome variable before "~"');
    this.i++;
    if (!this.isOp('~')) this.fail('expected "~" after the outcome');
    this.i++;
    const terms = this.sum();
    if (this.peek()) this.fail(`unexpected '${String(this.peek()!.value)}'`);
    if (terms.length === 0) this.fail('the model has no terms');
    return {
      outcome: (first as { value: string }).value,
      terms: terms.map((variables) => ({ name: variables.join(':'), variables })),
    };
  }

  private sum(): Terms {
    let terms = this.product();
    for (;;) {
      if (this.isOp('+')) {
        this.i++;
        terms = addTerms(terms, this.product());
      } else if (this.isOp('-')) {
        this.fail('removing terms with "-" is not supported; list the terms you want instead');
      } else {
        return terms;
      }
    }
  }

  private product(): Terms {
    let terms = this.interaction();
    while (this.isOp('*')) {
      this.i++;
      terms = starTerms(terms, this.interaction());
    }
    return terms;
  }

  private interaction(): Terms {
    let terms = this.power();
    while (this.isOp(':')) {
      this.i++;
      terms = colonTerms(terms, this.power());
    }
    return terms;
  }

  private power(): Terms {
    const base = this.atom();
    if (!this.isOp('^')) return base;
    this.i++;
    const t = this.peek();
    if (!t || t.kind !== 'number' || t.value < 1) this.fail('expected a positive whole number after "^"');
    this.i++;
    let out = base;
    for (let k = 1; k < (t as { value: number }).value; k++) out = starTerms(out, base);
    // (a+b+c)^2 keeps interactions up to the given order only.
    return out.filter((term) => term.length <= (t as { value: number }).value);
  }

  private atom(): Terms {
    const t = this.peek();
    if (!t) this.fail('expected a variable');
    if (t.kind === 'name') {
      this.i++;
      return [[t.value]];
    }
    if (t.kind === 'number') {
      if (t.value === 1) {
        this.i++;
        return []; // the intercept is always in the model
      }
      this.fail('models without an intercept ("+ 0", "- 1") are not supported');
    }
    if (t.kind === 'op' && t.value === '(') {
      this.i++;
      const inner = this.sum();
      if (!this.isOp(')')) this.fail('expected ")"');
      this.i++;
      return inner;
    }
    this.fail(`unexpected '${String(t.value)}'`);
  }
}

/** Parses "y ~ a*b + c" into the outcome and the expanded, named terms. */
export function parseFormula(formula: string): ParsedFormula {
  return new Parser(formula, tokenize(formula)).parse();
}

/** Every variable of the formula, outcome first, in order of appearance. */
export function formulaVariables(parsed: ParsedFormula): string[] {
  const vars = [parsed.outcome];
  for (const t of parsed.terms) for (const v of t.variables) if (!vars.includes(v)) vars.push(v);
  return vars;
}
