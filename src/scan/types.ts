/**
 * The scanner's output: what a manuscript reports, exactly as written.
 *
 * Every number keeps the text it was written with, because "4.20" and "4.2"
 * imply different rounding intervals. Offsets (`start`, `end`) always point
 * into the ORIGINAL text handed to the scanner, never into the normalised copy.
 */

/** A number as it was typed in the manuscript. */
export interface ReportedNumber {
  /** The numeric value ("-.32" -> -0.32, "1.2 x 10^-5" -> 0.000012). */
  value: number;
  /** The characters as normalised (ASCII digits, "-" for any minus sign). */
  text: string;
  /**
   * Decimal places written in the mantissa ("4.20" -> 2, "4" -> 0,
   * "1.2e-5" -> 1, meaning the mantissa 1.2 is rounded to one place).
   */
  decimals: number;
  /** Power of ten for scientific notation ("1.2e-5" -> -5); 0 otherwise. */
  exponent: number;
}

export type StatisticKind = 'F' | 't' | 'chi2' | 'r' | 'z';

/** Where df that were not printed come from (ReportedResult.dfFrom). */
export type DfSource = 'sample-size' | 'study-sample-size' | 'contingency-table' | 'levene-two-groups' | 'text-beside-table';

/**
 * A symbol tested as one of the kinds: "H", a Kruskal-Wallis result, as
 * chi-square; "rs", Spearman's rank correlation ("rs", "r_s", "ρ", or an r
 * introduced as Spearman's), as a correlation under each convention for its
 * p (checks/recompute.ts).
 */
export type StatisticSymbol = 'H' | 'rs';

export type Comparator = '=' | '<' | '>' | '<=' | '>=';

export interface ReportedP {
  comparator: Comparator;
  value: ReportedNumber;
  /** Written as "ps < .001" (one p for several tests). */
  plural: boolean;
  start: number;
  end: number;
  /** Its sign was lost in the text ("p 0.001") and the comparator is a reading, not what was printed. */
  signLost?: boolean;
  /**
   * Not printed as a p: the bound the table's note gives for the marks after
   * the value ("***" with "*** p < .001"); `start` and `end` are the marks'.
   */
  fromMarks?: string;
}

export type EffectKind =
  | 'partial-eta-squared'
  | 'eta-squared'
  | 'generalized-eta-squared'
  | 'omega-squared'
  | 'partial-omega-squared'
  | 'cohens-d'
  | 'hedges-g'
  | 'cohens-f'
  | 'r'
  | 'phi'
  | 'cramers-v'
  | 'r-squared'
  | 'adjusted-r-squared';

export interface ReportedInterval {
  /** Confidence level as a proportion (0.90 for "90% CI"); null when unstated. */
  level: number | null;
  low: ReportedNumber;
  high: ReportedNumber;
}

export interface ReportedEffect {
  kind: EffectKind;
  comparator: Comparator;
  value: ReportedNumber;
  interval: ReportedInterval | null;
  start: number;
  end: number;
}

/** Columns an ANOVA (or t, r, chi-square) table may have, by meaning. */
export type TableColumn = 'ss' | 'df' | 'df1' | 'df2' | 'ms' | 'statistic' | 'p' | 'partial-eta-squared' | 'eta-squared' | 'generalized-eta-squared' | 'omega-squared' | 'cohens-d' | 'r';

/** Where a result read from a table row came from, so table checks can name the cell. */
export interface TableRowOrigin {
  /** 0-based index of the table in the document, in reading order. */
  tableIndex: number;
  /** Caption or title of the table, if any. */
  caption: string | null;
  /** The row's label as written ("Condition", "Group x Time"). */
  rowLabel: string;
  /** The row's numeric cells by meaning, with their offsets in the original text. */
  cells: Partial<Record<TableColumn, ReportedNumber & { start: number; end: number }>>;
  /** The error (residual, within) row the effect is tested against, when the table has one. */
  errorRow: { rowLabel: string; cells: Partial<Record<TableColumn, ReportedNumber & { start: number; end: number }>> } | null;
}

export interface ReportedResult {
  kind: StatisticKind;
  /** The symbol written, when it is not the kind's own (see StatisticSymbol). */
  symbol?: StatisticSymbol;
  /** The original text of the whole result, from the statistic's symbol to its last part. */
  text: string;
  /** Offsets into the original text (end exclusive). */
  start: number;
  end: number;
  /** F: [df1, df2]; t, chi2, r: [df]; z: []. */
  df: ReportedNumber[];
  /** chi-square's "N = 120" inside the parentheses, or the "n = 90" after a correlation written without df. */
  sampleSize: ReportedNumber | null;
  /**
   * Set when the df were not printed but worked out: 'sample-size' from the
   * sample size written with the result ("r = .30, p = .004, n = 90": df =
   * 88); 'study-sample-size' from the one sample size the document states
   * for the whole study ("N = 214": df = 212 for a correlation written
   * without df); 'contingency-table' from a table's dimensions stated with a
   * chi-square ("a 2 × 3 table": df = 2). The last two are set by the checks
   * (checks/documentDf.ts), never by the scanner.
   */
  dfFrom?: DfSource;
  /** The document's statement the df were worked out from (dfFrom 'study-sample-size' or 'contingency-table'). */
  dfStatement?: ContextStatement;
  /** The statistic; null only when not written as a number. */
  value: ReportedNumber | null;
  /** "=" normally; "<" for "F < 1". */
  valueComparator: Comparator;
  p: ReportedP | null;
  /** True when the result is marked "n.s." / "ns" instead of (or beside) a p. */
  notSignificant: boolean;
  effects: ReportedEffect[];
  /** Set when the result was read from a table row rather than from running text. */
  tableRow?: TableRowOrigin;
  /**
   * Where else the same result is printed: a table row's result restated in
   * the text ("F(2, 57) = 4.21, p = .020" in both), reported once with both
   * places.
   */
  alsoAt?: { start: number; end: number }[];
  /**
   * The group means, SDs and sizes the result was computed from, when the
   * document reports them beside it (same paragraph, or a descriptive table
   * the paragraph refers to) for the groups the test compares.
   */
  descriptives?: DescriptiveSet;
  /**
   * The cell statistics of a factorial between-subjects design that this F
   * tests an effect of (its factors named in the result's label), when the
   * document prints them (scan/factorial).
   */
  factorial?: FactorialLink;
  /**
   * For a t written as a pairwise comparison after an ANOVA ("Bonferroni:
   * vocal (M = 78.92) vs none (M = 70.21), t(114) = 4.28"), the ANOVA's
   * groups and error mean square it is computed from (scan/comparisons).
   */
  postHoc?: PostHocLink;
  /**
   * For a t (or an F on one df) written as a planned contrast of an ANOVA's
   * groups ("contrast (-1, -1, 2)", "a linear trend", "the two training
   * groups against control"), its weights and the ANOVA's groups and error
   * terms (scan/contrasts).
   */
  contrast?: ContrastLink;
  /**
   * For an ANOVA's F: the pairwise comparisons printed after it without a t
   * (Tukey's "q = 4.12", a mean difference with only its SE or CI), with the
   * groups and error terms they follow from (scan/contrasts).
   */
  printedComparisons?: { family: ComparisonFamily; items: PrintedComparison[] };
  /** For an F of an analysis of covariance: the groups' sample and the covariates stated (scan/contrasts). */
  ancova?: AncovaLink;
}

/** A group of an ANOVA as the contrast and comparison readers use it: its mean's range over rounding, and its n. */
export interface FamilyGroup {
  label: string;
  mean: { low: number; high: number };
  n: number;
}

/** One way of knowing the error mean square of an ANOVA: pooled from the SDs, printed ("MSE = 0.87"), or MS_between / F. */
export interface ErrorReading {
  source: 'sds' | 'printed' | 'anova';
  meanSquare: { low: number; high: number };
}

/** The groups and error term of the ANOVA a contrast or comparison belongs to. */
export interface ComparisonFamily {
  groups: FamilyGroup[];
  /** Every reading of the error mean square the document allows (at least one). */
  errorReadings: ErrorReading[];
  errorDf: number;
  /** The ANOVA as printed ("F(2, 57) = 4.21"). */
  family: string;
  /** Sizes not printed with the groups but taken from elsewhere. */
  sizesAssumed: boolean;
}

/** A planned contrast linked to its ANOVA's groups. */
export interface ContrastLink extends ComparisonFamily {
  /** One weight per group, in the groups' order. */
  weights: number[];
  /** How the weights were given: printed numbers, a named polynomial trend, or words naming the groups. */
  reading: 'weights' | 'trend' | 'words';
  /** The words that give them ("(-1, -1, 2)", "linear trend", "the two training groups against control"). */
  weightsText: string;
}

/** A pairwise comparison printed without a t: Tukey's q, or a mean difference with its SE or CI. */
export interface PrintedComparison {
  text: string;
  start: number;
  end: number;
  /** The pair (indices into the family's groups), when the means or names printed tell it; null: any pair may be meant. */
  pair: [number, number] | null;
  q: ReportedNumber | null;
  /** q's printed (k, df), when printed ("q(3, 57) = 4.12"). */
  qDf: [number, number] | null;
  difference: ReportedNumber | null;
  se: ReportedNumber | null;
  interval: { level: number; low: ReportedNumber; high: ReportedNumber } | null;
  p: ReportedP | null;
  /** The adjustment named between the ANOVA and the comparison, or null. */
  method: PostHocLink['method'] | null;
}

/** An F of an analysis of covariance, with what the document says of its sample and covariates. */
export interface AncovaLink {
  /** The group effect (df1 = k - 1) or a covariate's own F (df1 = 1). */
  role: 'groups' | 'covariate';
  /** The number of groups and their total size, from the group statistics printed in the paragraph. */
  groups: number;
  totalN: number;
  /** The covariates as the text names them, and how many; null when not countable. */
  covariates: { text: string; count: number } | null;
}

/** A pairwise comparison's family: the groups of the ANOVA before it, its error term, and the adjustment stated. */
export interface PostHocLink {
  method: 'tukey' | 'bonferroni' | 'holm' | 'sidak' | 'scheffe' | 'lsd';
  /** The words that state it ("Tukey's HSD", "Bonferroni-corrected"). */
  methodText: string;
  /** Every group of the family: a label, the range of its mean over the rounding of what is printed, and its n. */
  groups: { label: string; mean: { low: number; high: number }; n: number }[];
  /** Indices into `groups` of the two groups compared, in the order the text names them. */
  first: number;
  second: number;
  /** The means as the comparison prints them. */
  printedMeans: [ReportedNumber, ReportedNumber];
  /** Range of the error mean square, pooled from the groups' (or cells') SDs, and its df. */
  errorMeanSquare: { low: number; high: number };
  errorDf: number;
  /** The ANOVA whose groups these are, as printed ("F(2, 57) = 4.21"). */
  family: string;
  /** Sizes not printed but taken from elsewhere: how sure they are (caps the finding). */
  sizesAssumed: boolean;
}

/** One cell of a factorial design as printed: its level of each factor, and its mean, SD and n. */
export interface CellDescriptives {
  /** The cell's level of each factor, in the set's factor order, as written. */
  levels: string[];
  mean: ReportedNumber;
  sd: ReportedNumber;
  /** null when the document prints no n for the cell. */
  n: number | null;
  start: number;
  end: number;
}

/** The printed cell statistics of a two- or three-factor between-subjects design (one outcome). */
export interface FactorialCellSet {
  source: 'table' | 'text';
  /** Each factor's name as printed (a header, a design statement, a word all its levels share), or null. */
  factors: (string | null)[];
  /** Each factor's levels, in order of first appearance. */
  levels: string[][];
  cells: CellDescriptives[];
  /** Where the ns come from: printed with each cell, a per-cell statement in the table's note or caption, or nowhere. */
  nSource: 'cell' | 'statement' | null;
  /** Words naming what was measured: the table's caption, or the sentence before the values. */
  measure: string;
  /** 0-based index of the table among the document's tables (source 'table'). */
  tableIndex: number | null;
  /** The table's number as its caption gives it ("Table 2" -> "2"). */
  tableNumber: string | null;
  start: number;
  end: number;
  /** The document's statement that the outcome is whole-number, when the table's caption or notes or the paragraph make one. */
  integerScale: IntegerScaleStatement | null;
}

/** An F test linked to the cell statistics of the design it tests. */
export interface FactorialLink {
  set: FactorialCellSet;
  /** The effect's factors, as indices into set.factors, ascending (one for a main effect). */
  term: number[];
  /** The words that named the effect ("Age × Load", "the interaction of age and load"). */
  label: string;
  /** Equal ns per cell worked out from the test's error df, when the set prints none. */
  assumedN: number | null;
}

/** One group's descriptive statistics as reported. */
export interface GroupDescriptives {
  /** The group's name when the table or text gives one. */
  label: string | null;
  mean: ReportedNumber;
  sd: ReportedNumber | null;
  /** Group size; null when the document does not state it. */
  n: number | null;
  /**
   * Where n comes from: written with the group ('group', incl. a table's n
   * column), a per-group statement in the same paragraph or table note
   * ('paragraph'), or a per-group statement elsewhere in the document that
   * the test's df agree with ('document').
   */
  nSource: 'group' | 'paragraph' | 'document' | null;
  /** Offsets of the group's numbers in the original text. */
  start: number;
  end: number;
}

/** A statement that a measure takes whole-number values ("on a single 7-point item", "number of errors"). */
export interface IntegerScaleStatement {
  text: string;
  start: number;
  end: number;
  /** Integer-valued items averaged per person (1 for a single item or a count). */
  items: number;
}

/** The descriptive statistics of the groups of one measure. */
export interface DescriptiveSet {
  source: 'text' | 'table';
  groups: GroupDescriptives[];
  /** Words naming what was measured: the sentence leading to the values, or a table's caption and headers. */
  measure: string;
  /** 0-based index of the table among the document's tables (source 'table'). */
  tableIndex: number | null;
  start: number;
  end: number;
  /** The document's statement that this measure is integer-valued, when it makes one nearby. */
  integerScale: IntegerScaleStatement | null;
}

/** A sentence or phrase of the document that states something the checks need. */
export interface ContextStatement {
  text: string;
  start: number;
  end: number;
}

export interface DeclaredAlpha extends ContextStatement {
  value: number;
}

/**
 * What a stated sample size counts: the whole sample ('total': "N = 214",
 * "214 participants"), a part of it ('subset': "17 men", "cortisol was
 * available for 96 participants", "180 of the 214"), each group
 * ('per-group': "20 in each condition", "n = 20 per group"), or the sample
 * of one test ('test': the N inside "χ2(2, N = 120)" or after "r = .30,").
 */
export type SampleScope = 'total' | 'subset' | 'per-group' | 'test';

export interface StatedSampleSize extends ContextStatement {
  value: number;
  /** Absent when unknown (statements built by hand); the checks then judge by the statement's words. */
  scope?: SampleScope;
}

/** Ways of adjusting p-values for multiple comparisons. */
export type PAdjustmentMethod =
  | 'bonferroni'
  | 'sidak'
  | 'holm'
  | 'hochberg'
  | 'fdr'
  | 'tukey'
  | 'scheffe'
  | 'dunnett'
  | 'games-howell'
  | 'unspecified';

/** A statement that p-values were adjusted for multiple comparisons ("All post hoc p values were Holm-adjusted"). */
export interface PAdjustmentStatement extends ContextStatement {
  method: PAdjustmentMethod;
  /** The number of comparisons when stated ("for 3 comparisons", "alpha = .05/3"); null otherwise. */
  comparisons: number | null;
  /** 'all' for every p of the document; 'post-hoc' for follow-up, pairwise or post hoc comparisons. */
  appliesTo: 'all' | 'post-hoc';
}

export interface SphericityStatement extends ContextStatement {
  method: 'greenhouse-geisser' | 'huynh-feldt' | 'unspecified';
}

/** A mean squared error printed in the text ("MSE = 0.87"), read by src/scan/meanSquareError.ts. */
export interface PrintedMeanSquareError extends ContextStatement {
  value: ReportedNumber;
}

/** A sphericity epsilon printed in the text ("Greenhouse-Geisser epsilon = .72"), read by src/scan/epsilon.ts. */
export interface PrintedEpsilon extends ContextStatement {
  value: ReportedNumber;
  method: 'greenhouse-geisser' | 'huynh-feldt' | 'lower-bound' | 'unspecified';
}

/** What the document says once, read before the results are checked. */
export interface DocumentContext {
  alpha: DeclaredAlpha | null;
  /** Statements of one-tailed / one-sided / directional testing. */
  oneTailed: ContextStatement[];
  /** "N = 120", "120 participants", "a sample of 64 students". */
  sampleSizes: StatedSampleSize[];
  sphericity: SphericityStatement[];
  /**
   * Document-wide statements that p-values (all, or those of post hoc
   * comparisons) were adjusted for multiple comparisons. Absent in contexts
   * built by hand; statements next to a result are found by the checks.
   */
  pAdjustments?: PAdjustmentStatement[];
  /** Sphericity epsilons printed in the text. Absent in contexts built by hand. */
  epsilons?: PrintedEpsilon[];
  /** Mean squared errors printed in the text. Absent in contexts built by hand. */
  meanSquareErrors?: PrintedMeanSquareError[];
}

export interface ScanOutput {
  results: ReportedResult[];
  context: DocumentContext;
  /** Every set of group descriptive statistics found (linked or not to a result). */
  descriptives?: DescriptiveSet[];
  /** Every set of factorial cell statistics found (linked or not to an F test). */
  cellSets?: FactorialCellSet[];
}
