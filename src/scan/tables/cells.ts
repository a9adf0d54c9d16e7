/**
 * Reading single table cells: numbers as printed (with comparators, minus
 * glyphs, thousands separators and footnote marks) and column headers by
 * meaning (the usual spellings of SS, df, MS, F, p and effect sizes).
 *
 * Every function here works on one cell, whose length is capped, and uses
 * anchored regular expressions without nested repetition, so the cost per
 * cell is bounded.
 */

import { normaliseText } from '../normalise.js';
import { parseReportedNumber } from '../../stats/reportedNumber.js';
import { keepAnswers } from '../memo.js';
import type { Comparator, EffectKind, ReportedNumber, StatisticKind } from '../types.js';

/** Cells longer than this are text, not numbers or headers. */
const MAX_CELL_LENGTH = 80;

export type CellValue =
  | { kind: 'empty' }
  | { kind: 'ns' }
  | { kind: 'text' }
  | {
      kind: 'number';
      comparator: Comparator;
      number: ReportedNumber;
      /** Offsets of the number (comparator included) inside the cell string. */
      start: number;
      end: number;
      /** The cell marks the number "n.s." too ("0.07, n.s."). */
      notSignificant?: true;
    };

/** "—", "–", "-", "--", "." and "" mark an empty cell. */
const EMPTY_CELL = /^(?:[\s\u2014\u2013\u2012\u2212.\-]*|\s*(?:n\/a|na|n\.a\.|not applicable)[a-h]?\s*)$/i;
const NOT_SIGNIFICANT = /^n\.?\s?s\.?$/i;
/**
 * An optional comparator, an optional sign, the digits with their
 * separators (read by the table's decimal separator, below), an optional
 * exponent, then footnote marks (stars, daggers, one superscript letter).
 * Groups: 1 comparator, 2 sign, 3 digits and separators, 4 exponent.
 */
const NUMBER_CELL =
  /^(?:[pP]\s*)?(?:(<=|>=|\u2264|\u2265|<|>|=)\s*)?(?:([-\u2212\u2013+])\s*)?([\d.,]+)(?:\s*(?:[eE]|[x\u00d7]\s*10\^?)\s*\{?([-\u2212+]?\s?\d{1,4})\}?)?\s*(?:[*\u2020\u2021\u271d\u00a7\u00b6#\u00a5\u0166\u00aa\u00ba^]{1,4}|\(\*{1,3}\)|\+|[a-h]{1,3})?$/;

/** "n.s." after a number ("0.07, n.s.", "0.45 NS", "0.30 (ns)"): a mark that the value is not significant. */
const NS_AFTER_NUMBER = /(?<=\d[*a-h]{0,3}),?\s*\(?(?:[nN]\.\s?[sS]\.?|ns|NS)\)?$/;

/**
 * How a table writes its decimals: '.' ("4.21", thousands "1,234.5") or ','
 * ("4,21", thousands "1.234,5", as in manuscripts from many countries).
 * 'either' only asks whether a cell is a number at all (finding tables).
 */
export type DecimalSeparator = '.' | ',' | 'either';

const POINT_DIGITS = /^(?:[1-9]\d{0,2}(?:,\d{3})+(?:\.\d+)?|\d+(?:\.\d+)?|\.\d+)$/;
const COMMA_DIGITS = /^(?:[1-9]\d{0,2}(?:\.\d{3})+(?:,\d+)?|\d+(?:,\d+)?|,\d+)$/;

/** The digits as a plain decimal ("1,234.5" -> "1234.5"; with ',': "1.234,5" -> "1234.5"), or null. */
function plainDigits(digits: string, separator: DecimalSeparator): string | null {
  if (separator !== ',' && POINT_DIGITS.test(digits)) return digits.replace(/,/g, '');
  if (separator !== '.' && COMMA_DIGITS.test(digits)) return digits.replace(/\./g, '').replace(',', '.');
  return null;
}

/** Numbers that can only be written with a decimal point, or only with a decimal comma (a thousands group has exactly three digits after a non-zero whole part). */
const ONLY_POINT = /^(?:\d*\.\d{1,2}|\d*\.\d{4,}|0\.\d+|[1-9]\d{0,2}(?:,\d{3})+\.\d+)$/;
const ONLY_COMMA = /^(?:\d*,\d{1,2}|\d*,\d{4,}|0,\d+|[1-9]\d{0,2}(?:\.\d{3})+,\d+)$/;

/**
 * A table's decimal separator, from its cells: ',' when some number can only
 * be a decimal comma ("4,21", "0,019") and none can only be a decimal point;
 * '.' otherwise (so "1,234" alone stays a thousand and more, as in English).
 */
export function decimalSeparatorOf(rows: readonly (readonly string[])[]): '.' | ',' {
  let comma = false;
  for (const row of rows) {
    for (const cell of row) {
      if (cell.length > MAX_CELL_LENGTH) continue;
      const digits = NUMBER_CELL.exec(cell.trim())?.[3];
      if (digits === undefined) continue;
      if (ONLY_POINT.test(digits)) return '.';
      if (ONLY_COMMA.test(digits)) comma = true;
    }
  }
  return comma ? ',' : '.';
}

const COMPARATORS: Record<string, Comparator> = {
  '<': '<',
  '>': '>',
  '=': '=',
  '<=': '<=',
  '>=': '>=',
  '\u2264': '<=',
  '\u2265': '>=',
};

/** Reads one cell as written, with the table's decimal separator. */
export function readCell(cell: string, separator: DecimalSeparator = '.'): CellValue {
  if (cell.length > MAX_CELL_LENGTH) return { kind: 'text' };
  // Garbled glyphs ("âˆ’â€‰0.05" for "− 0.05") and thin spaces: read the repaired cell, with offsets mapped back.
  if (GARBLED.test(cell)) {
    const normalised = normaliseText(cell);
    const read = readPlainCell(normalised.text, separator);
    return read.kind === 'number' ? { ...read, start: normalised.toOriginal(read.start), end: normalised.toOriginalEnd(read.end) } : read;
  }
  return readPlainCell(cell, separator);
}

/**
 * Characters that start a garbled (mis-decoded) glyph, spaces a number may hold, a math font's asterisk ("4.21∗∗"),
 * or LaTeX's dollars around a cell a converted table kept ("$68,527.167$").
 */
const GARBLED = /[\u00c2\u00c3\u00e2\u00ce\u00cf\u2009\u202f\u2217\ufe61\uff0a$]/;

function hasDigit(text: string): boolean {
  for (let index = 0; index < text.length; index++) {
    const code = text.charCodeAt(index);
    if (code >= 48 && code <= 57) return true;
  }
  return false;
}

function readPlainCell(cell: string, separator: DecimalSeparator): CellValue {
  if (EMPTY_CELL.test(cell)) return { kind: 'empty' };
  const trimmed = cell.trim();
  if (NOT_SIGNIFICANT.test(trimmed)) return { kind: 'ns' };
  // A number has a digit (plainDigits below asks for one): most words of prose are told apart here, without the patterns.
  if (!hasDigit(trimmed)) return { kind: 'text' };
  const withoutNs = trimmed.replace(NS_AFTER_NUMBER, '');
  const match = NUMBER_CELL.exec(withoutNs);
  if (!match) return { kind: 'text' };
  const [, comparatorText, signText = '', digits = '', exponentText] = match;
  const plain = plainDigits(digits, separator);
  if (plain === null) return { kind: 'text' };
  const sign = signText === '' || signText === '+' ? '' : '-';
  // (A superscript's minus a copy set apart from its digits, "× 10 − 5", is read as "e-5".)
  // ("4.50380E + 0003": a program's exponent with its sign set apart and padded with zeros, read as "e3".)
  const exponent = exponentText === undefined ? '' : `e${exponentText.replace('\u2212', '-').replace(' ', '').replace('+', '').replace(/^(-?)0+(?=\d)/, '$1')}`;
  const number = parseReportedNumber(`${sign}${plain}${exponent}`);
  if (!number) return { kind: 'text' };
  const leading = cell.length - cell.trimStart().length;
  // The number's span: from the comparator (or sign, or first digit) to the last digit.
  const firstAt = comparatorText !== undefined ? trimmed.indexOf(comparatorText) : signText !== '' ? trimmed.indexOf(signText) : trimmed.indexOf(digits);
  const lastDigitEnd = exponentText !== undefined ? trimmed.lastIndexOf(exponentText) + exponentText.length : trimmed.indexOf(digits) + digits.length;
  return {
    kind: 'number',
    comparator: comparatorText === undefined ? '=' : COMPARATORS[comparatorText]!,
    number,
    start: leading + Math.max(0, firstAt),
    end: leading + lastDigitEnd,
    ...(withoutNs.length < trimmed.length ? { notSignificant: true as const } : {}),
  };
}

/** True when the cell is a number (the only kind of cell that marks a data row), with either decimal separator. */
export function isNumberCell(cell: string): boolean {
  return readCell(cell, 'either').kind === 'number';
}

/** What a column holds, read from its header. */
/** A line of the text with its offsets, as the table finders cut it. */
/** A cell of a table copied one cell per line: its text, its offsets in the document, and the index of its line. */
export interface LineCell {
  text: string;
  start: number;
  end: number;
  /** Index of its line. */
  line: number;
}

export interface TextLine {
  start: number;
  end: number;
  text: string;
  /** A lone "|" that closes the cell above it, or a line joined onto that cell (pipeClosed.ts): no cell, no blank line. */
  closesCell?: true;
}

export type ColumnRole =
  | { role: 'label' }
  | { role: 'ss' | 'df' | 'df1' | 'df2' | 'ms' | 'p' | 'n' }
  /** `dfInCell`: the header says the cells hold their df in brackets ("t (df)": "4.842 (15)"). */
  | { role: 'statistic'; kind: StatisticKind; df: ReportedNumber[]; dfInCell?: boolean; pInCell?: boolean; symbol?: 'rs' }
  | { role: 'effect'; effect: EffectKind }
  | { role: 'descriptive' }
  /** A column of written results or of test statistics of varying kinds ("Statistic", "Test", "Effect size"). */
  | { role: 'result' }
  | { role: 'unknown' };

/** Printable ASCII without markup characters (which normalisation would remove or rewrite). */
const PLAIN_HEADER = /^[\x20-\x23\x25-\x29\x2b-\x5b\x5d\x61-\x7a\x7c\x7e]*$/;

/**
 * A header as a comparable key: normalised (Greek spelled out, super- and
 * subscripts as digits), lower case, without markup characters, single spaces.
 */
export function headerKey(header: string): string {
  // (Long texts are no header: answered before the store, which they would only fill.)
  return header.length > MAX_CELL_LENGTH ? '' : keptHeaderKey(header);
}

const keptHeaderKey = keepAnswers(headerKeyOf);

function headerKeyOf(header: string): string {
  // Plain ASCII words need no normalisation; most candidate phrases in running text are such words,
  // and this is called for every word of every line while looking for table headers.
  // (Except a line break a converted table kept in the cell, "Hypothesis <br> df", which normalisation reads as a space.)
  if (PLAIN_HEADER.test(header) && !(header.includes('<') && /<br/i.test(header))) return header.toLowerCase().replace(/\s+/g, ' ').trim();
  // (Lower case first: a header in capitals writes its Greek in capitals too, "Η2P", spelled out only in lower case.)
  return normaliseText(header.toLowerCase())
    .text.toLowerCase()
    .replace(/[_^{}$\\*`]/g, '')
    .replace(/\s+/g, ' ')
    .trim();
}

const ROLE_BY_KEY = new Map<string, ColumnRole>();
function put(keys: string[], role: ColumnRole): void {
  for (const key of keys) ROLE_BY_KEY.set(key, role);
}
put(['source', 'sources', 'effect', 'effects', 'predictor', 'predictors', 'variable', 'variables', 'term', 'factor', 'source of variation', 'source of variance', 'comparison', 'contrast', 'measure', 'model', 'parameter', 'outcome', 'test', 'variable pair', 'association', 'item'], { role: 'label' });
// A table of a sample's characteristics by group names its label column so ("Characteristic" / "Cases n (%)" / "Controls
// n (%)" / "χ2"): common practice in clinical and epidemiological tables.
put(['characteristic', 'characteristics'], { role: 'label' });
put(['ss', 'sum of squares', 'sums of squares', 'type iii ss', 'type iii sum of squares', 'type ii ss', 'type ii sum of squares', 'type i ss', 'type i sum of squares', 'sum sq', 'sum sq.', 'sumsq', 'ss effect'], { role: 'ss' });
put(['df', 'd.f.', 'd.f', 'dfs', 'degrees of freedom', 'dof'], { role: 'df' });
// Both df of an F named in one column, whose cells hold them as a pair ("1, 10").
put(['df, ddf', 'df,ddf', 'ndf, ddf', 'ndf,ddf', 'df1, df2', 'df1,df2', 'num df, den df', 'df (num, den)'], { role: 'df' });
put(['ndf', 'n.d.f.', 'df1', 'df 1', 'num. df', 'num.df', 'n. df', 'df effect', 'effect df', 'df num', 'num df', 'numdf', 'numerator df', 'df numerator', 'dfn', 'df hyp', 'df hypothesis', 'hypothesis df', 'dfeffect', 'dfnum'], { role: 'df1' });
put(['ddf', 'd.d.f.', 'df2', 'df 2', 'd. df', 'd.df', 'den. df', 'den.df', 'denom. df', 'df error', 'error df', 'df den', 'den df', 'dendf', 'denominator df', 'df denominator', 'dfd', 'dfe', 'df residual', 'residual df', 'dferror', 'dfden', 'df res'], { role: 'df2' });
put(['ms', 'mean square', 'mean squares', 'mean sq', 'mean sq.', 'meansq', 'ms effect'], { role: 'ms' });
put(['p', 'p value', 'p-value', 'p-values', 'p values', 'sig', 'sig.', 'significance', 'pr(>f)', 'pr(>|t|)', 'pr(>|z|)', 'pr(>z)', 'pr(>t)', 'pr(>chisq)', 'pr(>chi)', 'prob', 'prob.', 'prob > f', 'prob>f', 'p (two-tailed)', 'two-tailed p', 'p two-tailed', 'sig. (2-tailed)', 'p(two-tailed)', 'pvalue'], { role: 'p' });
put(['n', 'sample size', 'total n'], { role: 'n' });
put(['f', 'f ratio', 'f-ratio', 'f value', 'f-value', 'f statistic', 'f-statistic', 'f change', 'f-test', 'f test', 'f-test statistic', 'f test statistic'], { role: 'statistic', kind: 'F', df: [] });
put(['t', 't value', 't-value', 't statistic', 't-statistic', 't-test', 't test', 't ratio', 't-test statistic', 't test statistic', 't-ratio'], { role: 'statistic', kind: 't', df: [] });
put(['chi2', 'chi-square', 'chi square', 'chi-squared', 'chi squared', 'pearson chi2', 'pearson chi-square', 'chisq', 'x2', 'chi^2', 'chi-square test', 'chi square test', 'chi-square test statistic', 'chi2 test', 'chi-square statistic', 'chi2 statistic'], { role: 'statistic', kind: 'chi2', df: [] });
put(['r', "pearson's r", 'pearson r', 'pearson correlation', 'correlation'], { role: 'statistic', kind: 'r', df: [] });
// Spearman's rank correlation, tested like r under the t approximation or the exact distribution (see types.ts, 'rs').
put(['r value', 'r-value', 'r values', 'r-values'], { role: 'statistic', kind: 'r', df: [] });
put(['rs value', 'rs-value', 'rho value', 'rho-value', 'rho', 'rs', 'r s', 'r_s', 'spearman', "spearman's rho", 'spearman rho', "spearman's r", 'spearman r', 'spearman correlation', "spearman's correlation", 'spearman coefficient', "spearman's rank correlation", 'spearman rank correlation'], { role: 'statistic', kind: 'r', df: [], symbol: 'rs' });
put(['z', 'z value', 'z-value', 'z statistic', 'z-statistic', 'z test', 'z-test', 'z test statistic', 'z-test statistic', 'z-score', 'wald z', 'z score test', "fisher's z", 'fisher\u2019s z', 'fisher z', 'steiger z', "steiger's z"], { role: 'statistic', kind: 'z', df: [] });
put(['etap2', 'eta2p', 'eta p2', 'eta2 p', 'etap 2', 'partial eta2', 'partial eta 2', 'partial eta squared', 'partial eta-squared', 'partial eta', 'eta2 partial', 'eta2partial', 'etapartial2', 'eta 2 p', 'eta p 2', 'partial eta squared (etap2)', 'etap', 'eta p'], { role: 'effect', effect: 'partial-eta-squared' });
put(['eta2', 'eta 2', 'eta squared', 'eta-squared'], { role: 'effect', effect: 'eta-squared' });
put(['etag2', 'eta2g', 'eta g2', 'eta2 g', 'generalized eta squared', 'generalized eta2', 'generalised eta squared', 'generalised eta2', 'ges'], { role: 'effect', effect: 'generalized-eta-squared' });
put(['omega2', 'omega 2', 'omega squared', 'omega-squared'], { role: 'effect', effect: 'omega-squared' });
put(['omegap2', 'omega2p', 'partial omega2', 'partial omega squared'], { role: 'effect', effect: 'partial-omega-squared' });
put(['d', "cohen's d", 'cohens d', 'cohen d', 'cohen\u2019s d', 'effect size d', 'dz', 'd z'], { role: 'effect', effect: 'cohens-d' });
put(['g', "hedges' g", 'hedges g', "hedges's g"], { role: 'effect', effect: 'hedges-g' });
put(['cohen\'s f', 'cohens f', 'f2'], { role: 'effect', effect: 'cohens-f' });
put(["cramer's v", 'cramers v', 'v'], { role: 'effect', effect: 'cramers-v' });
put(['phi'], { role: 'effect', effect: 'phi' });
put(['statistic', 'statistics', 'test statistic', 'test statistics', 'statistical test', 'test value', 'stat', 'stat.', 'effect size', 'effect sizes', 'eff. size', 'es'], { role: 'result' });
// A value with its df: the value of the test the row names (by a section or a footnote), common in tables of a sample's characteristics.
put(['value (df)', 'value(df)', 'values (df)'], { role: 'result' });
put(['m', 'mean', 'means', 'sd', 's.d.', 'se', 's.e.', 'sem', 'mean difference', 'mdiff', 'difference', 'b', 'beta', 'se b', 'estimate', 'std. error', 'standard error', 'min', 'max', 'range', 'median', 'mdn', 'ci', '95% ci', 'lower', 'upper', 'll', 'ul', '%', 'percent', 'm (sd)', 'mean (sd)', 'skew', 'kurtosis', 'alpha', 'ms error', 'mse'], { role: 'descriptive' });

// The same names in the other languages of published papers (French, German, Spanish, Portuguese, Dutch;
// common practice, from memory: how statistics programs and journals in those languages label the columns).
put(['somme des carrés', 'somme des carres', 'sc', 'sc type iii', 'quadratsumme', 'quadratsummen', 'summe der quadrate', 'qs', 'quadratsumme vom typ iii', 'suma de cuadrados', 'suma de cuadrados tipo iii', 'soma dos quadrados', 'soma de quadrados', 'kwadratensom'], { role: 'ss' });
put(['ddl', 'gl', 'fg', 'freiheitsgrade', 'degrés de liberté', 'degres de liberte', 'grados de libertad', 'graus de liberdade', 'vrijheidsgraden'], { role: 'df' });
put(['ddl hypothèse', 'df hypothese', 'hypothese df', 'gl hipótesis', 'gl hipotesis', 'hipótesis gl'], { role: 'df1' });
put(['ddl erreur', 'ddl de l\'erreur', 'df fehler', 'fehler df', 'fehler-df', 'gl error', 'error gl', 'gl del error', 'gl erro', 'gl do erro'], { role: 'df2' });
put(['carré moyen', 'carre moyen', 'moyenne des carrés', 'mittlere quadratsumme', 'mittel der quadrate', 'mq', 'media cuadrática', 'media cuadratica', 'cuadrado medio', 'mc', 'quadrado médio', 'quadrado medio', 'qm', 'gemiddelde kwadraat', 'gemiddelde kwadratensom'], { role: 'ms' });
put(['p-valor', 'valor p', 'valor-p', 'valor de p', 'valeur p', 'valeur-p', 'valeur de p', 'p-wert', 'p wert', 'signifikanz', 'sign.', 'significación', 'significacion', 'significância', 'significancia', 'signification', 'p-waarde', 'p waarde', 'significantie'], { role: 'p' });
put(['partial eta sq', 'partial eta sq.', 'eta squared partial', 'eta cuadrado parcial', 'eta al cuadrado parcial', 'eta2 parcial', 'eta quadrado parcial', 'eta carré partiel', 'eta2 partiel', 'partielles eta-quadrat', 'partielles eta quadrat', 'partielles eta2', 'eta2 partiell'], { role: 'effect', effect: 'partial-eta-squared' });
put(['coeficiente de correlação de pearson', 'coeficiente de correlacao de pearson', 'correlação de pearson', 'correlacao de pearson', 'coeficiente de correlação', 'coeficiente de correlación de pearson', 'coeficiente de correlación', 'correlación de pearson', 'r de pearson', 'coefficient de corrélation de pearson', 'coefficient de corrélation', 'corrélation de pearson', 'korrelationskoeffizient', 'pearson-korrelation', 'korrelation nach pearson', 'correlatiecoëfficiënt', 'pearson correlatie'], { role: 'statistic', kind: 'r', df: [] });
put(['coeficiente de spearman', 'correlação de spearman', 'correlacao de spearman', 'correlación de spearman', 'rho de spearman', 'corrélation de spearman', 'spearman-korrelation'], { role: 'statistic', kind: 'r', df: [], symbol: 'rs' });
put(['valor t', 'valor de t', 'valeur t', 'valeur de t', 't-wert', 't wert', 't-waarde', 'teste t', 'prueba t'], { role: 'statistic', kind: 't', df: [] });
put(['valor f', 'valor de f', 'razão f', 'razon f', 'valeur f', 'valeur de f', 'f-wert', 'f wert', 'f-waarde'], { role: 'statistic', kind: 'F', df: [] });
put(['qui-quadrado', 'qui quadrado', 'qui2', 'chi-carré', 'chi carré', 'chi-kwadraat'], { role: 'statistic', kind: 'chi2', df: [] });
put(['média±dp', 'média ± dp', 'media±de', 'media ± de', 'media (de)', 'média (dp)', 'mw (sd)', 'mw ± sd', 'moyenne (é.-t.)', 'moyenne ± é.-t.'], { role: 'descriptive' });
// Source, F and p columns as statistics programs and journals print them (common practice, from memory):
// abbreviations of "source of variation" in English, Spanish and Portuguese ("SOV", "S.V.", "F.V.", "FV"),
// "Sum Sq" in Portuguese ("SQ"), the calculated F ("F cal", "Fcalc", "F calculado"), and p written as the
// probability of a larger statistic ("Pr > F", "Prob > |t|", "Pr > ChiSq").
put(['sov', 's.o.v.', 's.o.v', 'sv', 's.v.', 's.v', 'fv', 'f.v.', 'f.v', 'sources of variation', 'variation source', 'source of variance', 'fonte de variação', 'fonte de variacao', 'fontes de variação', 'fuente de variación', 'fuente de variacion', 'fuentes de variación', 'causas de variación', 'causa de variação', 'source de variation', 'sources de variation', 'variationsursache', 'variationsquelle', 'quelle'], { role: 'label' });
put(['sq', 'sum of square', 'sum of sq.', 'sum of sq', 'partial ss'], { role: 'ss' });
put(['cm', 'mean of squares', 'mean sum of squares', 'msq'], { role: 'ms' });
put(['f cal', 'f cal.', 'fcal', 'fcal.', 'f-cal', 'f calc', 'f calc.', 'fcalc', 'f-calc', 'f calculated', 'f-calculated', 'calculated f', 'f calculado', 'f calculada', 'f-calculado', 'f obs', 'f obs.', 'f-obs', 'fobs', 'f observed', 'f computed', 'computed f'], { role: 'statistic', kind: 'F', df: [] });
put(['pr > f', 'pr>f', 'pr. > f', 'p > f', 'p>f', 'prob.>f', 'prob. > f', 'pr > fc', 'pr>fc', 'pr > |t|', 'pr>|t|', 'prob > |t|', 'prob>|t|', 'p > |t|', 'p>|t|', 'pr > chisq', 'pr>chisq', 'pr > chi2', 'pr>chi2', 'prob > chi2', 'prob>chi2', 'prob > chisq', 'prob>chisq', 'p > chi2', 'p>chi2', 'significance level', 'level of significance', 'sig. level', 'sig level', 'p level', 'p-level', 'p valor', 'p-valeur', 'probability', 'prob. level', 'probabilidad', 'probabilidade'], { role: 'p' });
put(['chi2 value', 'chi-square value', 'chi square value', 'x2 value', 'chi-square statistic', 'chi-square test', 'chi square test', 'chi2 test'], { role: 'statistic', kind: 'chi2', df: [] });
put(['t stat', 't-stat', 't values', 't-values', 't calculated', 't calc', 'tcalc', 't cal', 'tobs', 't obs', 't observed'], { role: 'statistic', kind: 't', df: [] });
// The labels statistics programs print in those languages' output of a univariate ANOVA (from memory of
// their localised output; common practice): the type III sum of squares, mean square, partial eta squared
// and source column in Portuguese, French, Italian, Dutch and Spanish.
put(['soma dos quadrados tipo iii', 'soma dos quadrados do tipo iii', 'somme des carrés de type iii', 'somme des carres de type iii', 'somma dei quadrati', 'somma dei quadrati di tipo iii', 'kwadratensom type iii', 'type iii kwadratensom', 'suma de cuadrados de tipo iii'], { role: 'ss' });
put(['media dei quadrati', 'media quadratica', 'quadrato medio', 'gemiddelde kwadraten', 'gemiddeld kwadraat'], { role: 'ms' });
put(['eta parcial ao quadrado', 'eta ao quadrado parcial', 'eta-carré partiel', 'eta carre partiel', 'eta-carre partiel', 'eta quadrato parziale', 'eta al quadrato parziale', 'partiële eta-kwadraat', 'partiele eta-kwadraat', 'partiële eta kwadraat', 'eta kwadraat partieel'], { role: 'effect', effect: 'partial-eta-squared' });
put(['fonte', 'fuente', 'bron', 'origine', 'fonte di variazione', 'fonte di variabilità'], { role: 'label' });
// Shortened and run-together spellings, and named variants of F and chi-square (common practice, from tables of
// journals and statistics programs' output).
put(['f stat', 'f-stat', 'f stat.', 'fvalue', 'fratio', 'fobs', 'f obs', 'f observed', 'f-test value', 'f test value', 'welch f', "welch's f", 'f welch', 'welch-f', 'brown-forsythe f'], { role: 'statistic', kind: 'F', df: [] });
put(['chisquare', 'chisquared', 'chi-sq', 'chi sq', 'chi-sq.', 'chi.sq', 'chisq.', 'lr chisq', 'lr chi-square', 'lr chi-sq', 'wald chi-square', 'wald chi square', 'wald chisq', 'wald chi-sq', 'likelihood ratio chi-square', 'likelihood-ratio chi-square'], { role: 'statistic', kind: 'chi2', df: [] });
put(['df1/df2', 'df1 / df2', 'df1; df2', '(df)', '[df]', '(d.f.)', '(dfs)'], { role: 'df' });
// The side named in brackets after "df" ("df (num)", "df (error)"): the qualifier says which df, unlike one after a
// statistic's name, which knownKeyOf drops.
put(['df (num)', 'df (num.)', 'df (numerator)', 'df (effect)', 'df (hypothesis)', 'df (between)', 'df(num)', 'df (n)'], { role: 'df1' });
put(['df (den)', 'df (den.)', 'df (denominator)', 'df (error)', 'df (residual)', 'df (within)', 'df(den)', 'df (d)'], { role: 'df2' });
// A column of marks saying whether each p is under .05 ("p<.05" over "*"), as some programs print beside p.
put(['p<.05', 'p < .05', 'p<0.05', 'p < 0.05', 'p<.01', 'p < .01'], { role: 'descriptive' });
// The df of the model and of the residuals as some programs and authors name them ("df_M", "df_R", "df b", "df w"),
// p as R prints it ("p.value", Tukey's "p adj") and Stata ("P>|z|"), partial eta squared as R's afex prints it
// ("pes"); common practice, from memory of those programs' output.
put(['df b', 'dfb', 'df between', 'df m', 'dfm', 'df model'], { role: 'df1' });
put(['df w', 'dfw', 'df within', 'df r', 'dfr', 'df.res'], { role: 'df2' });
put(['p.value', 'p adj', 'p-adj', 'p.adj', 'padj', 'adjusted p', 'adj. p', 'p adjusted', 'p>|z|', 'p > |z|', 'pr > |z|', 'pr>|z|', 'prob > |z|'], { role: 'p' });
put(['pes'], { role: 'effect', effect: 'partial-eta-squared' });
// Odds, hazard and rate ratios with their intervals beside a regression's tests (common practice).
put(['or [95% ci]', 'or (95% ci)', 'or 95% ci', 'odds ratio', 'odds ratio (95% ci)', 'odds ratio [95% ci]', 'aor (95% ci)', 'aor [95% ci]', 'exp(b)', 'exp(beta)', 'irr (95% ci)', 'hr (95% ci)', 'hr [95% ci]', 'rr (95% ci)'], { role: 'descriptive' });
// The df of a multivariate test's F as tables abbreviate them ("Hyp. df", "Err. df"); common practice.
put(['hyp. df', 'hyp df', 'hyp.df', 'hypoth. df', 'df hyp.'], { role: 'df1' });
put(['err. df', 'err df', 'err.df', 'df err', 'df err.'], { role: 'df2' });
// Minitab's adjusted and sequential sums of squares and mean squares (from memory of its ANOVA output).
put(['adj ss', 'adj. ss', 'seq ss', 'seq. ss'], { role: 'ss' });
put(['adj ms', 'adj. ms', 'seq ms', 'seq. ms'], { role: 'ms' });
put(['g.l.', 'g.l', 'gl.', 'degree of freedom', 'deg. of freedom', 'd.o.f.', 'gdl', 'g.d.l.', 'gradi di libertà'], { role: 'df' });
// The p of statistics software's chi-square and nonparametric output, and correlation coefficients named in full.
put(['asymp. sig. (2-sided)', 'asymp. sig. (2-tailed)', 'asymp. sig.', 'asymptotic sig. (2-sided)', 'asymptotic significance (2-sided)', 'asymptotic significance', 'exact sig. (2-sided)', 'exact sig. (2-tailed)', 'exact sig.', 'exact significance (2-sided)', 'sig. asintótica (bilateral)', 'sig. asintotica (bilateral)', 'sig. exacta (bilateral)', 'sig. assintótica (bilateral)', 'asymptotische signifikanz (2-seitig)', 'two-sided p', 'two-tailed p-value', 'p (two-sided)', 'p two-sided'], { role: 'p' });
put(['correlation coefficient', 'correlation coefficients', 'coefficient of correlation', 'correlation coefficient (r)', 'pearson correlation coefficient', "pearson's correlation coefficient", "pearson's correlation", 'pearson coefficient', 'r coefficient'], { role: 'statistic', kind: 'r', df: [] });
put(["spearman's correlation coefficient", 'spearman correlation coefficient', "spearman's rank correlation coefficient", 'spearman rank correlation coefficient', "spearman's rho coefficient"], { role: 'statistic', kind: 'r', df: [], symbol: 'rs' });
put(['chi 2', 'x 2', 'chi-quadrat', 'chi-quadrado', 'chi-cuadrado', 'chi cuadrado', 'khi2', 'khi-deux', 'khi 2'], { role: 'statistic', kind: 'chi2', df: [] });
put(['moyenne', 'mittelwert', 'media', 'média', 'gemiddelde', 'écart type', 'ecart type', 'écart-type', 'standardabweichung', 'desviación típica', 'desviacion tipica', 'desviación estándar', 'desvio padrão', 'desvio padrao', 'dp', 'standaarddeviatie'], { role: 'descriptive' });

/** Bracketed df after a statistic symbol in a header: "F(1, 170)", "F (2, 57)", "t(58)", "chi2(2)". */
const HEADER_WITH_DF = /^(f|t|r|chi2|chi-square|x2)\s*\(\s*(?:df\s*=\s*)?(\d+(?:\.\d+)?)\s*(?:,\s*(\d+(?:\.\d+)?)\s*)?\)$/;
/** An F header whose df subscript was flattened: "F1,25", "F 2, 57" (the comma is required: "F1" alone is no df). */
const HEADER_WITH_SUBSCRIPT_DF = /^f\s?(\d{1,3})\s?,\s?(\d{1,5})$/;

/**
 * Names of df in brackets at the end of a statistic's header, saying its
 * cells hold their df: "t (df)", "F (dfM, dfR)", "F(df1, df2)", "χ2 (gl)",
 * "F (df effect, df error)".
 */
const DF_NAMES_IN_BRACKETS = / ?[([](?:df|d\.f\.|gl|ddl)[a-z0-9. ]{0,8}(?:[,;/] ?(?:df|d\.f\.|gl|ddl)[a-z0-9. ]{0,8})?[)\]]$/;

/**
 * The key without what real headers add to a known name: a footnote letter
 * glued on ("Cohen db", "P valueb", "F testc"), or "(df)" after a statistic
 * whose cells hold their df in brackets ("t value (df)": "4.842 (15)").
 */
const knownKeyOf = keepAnswers(findKnownKey);

function findKnownKey(key: string): string | null {
  const bare = key.replace(/[.:]$/, '');
  if (ROLE_BY_KEY.has(key)) return key;
  if (ROLE_BY_KEY.has(bare)) return bare;
  // A name written with the equals sign its cells would follow ("P=" over "0.029"), or after the word for it
  // ("Significance P="): the name.
  const withoutEquals = /^(?:significance |sig\. )?([a-z][a-z0-9 .-]{0,20}?) ?=$/.exec(key);
  if (withoutEquals !== null && ROLE_BY_KEY.get(withoutEquals[1]!)?.role === 'p') return withoutEquals[1]!;
  const withoutDf = bare.replace(DF_NAMES_IN_BRACKETS, '');
  if (withoutDf !== bare && ROLE_BY_KEY.get(withoutDf)?.role === 'statistic') return withoutDf;
  // A footnote letter glued on before the df's brackets ("tobsa (df)"): only after a name of two letters or more.
  const withoutDfMark = withoutDf.replace(/(?<=[a-z0-9.])[a-h]$/, '');
  if (withoutDf !== bare && withoutDfMark !== withoutDf && withoutDfMark.length >= 2 && ROLE_BY_KEY.get(withoutDfMark)?.role === 'statistic') return withoutDfMark;
  const withoutMark = bare.replace(/(?<=[a-z0-9.)\]])[a-h]$/, '');
  if (withoutMark !== bare && withoutMark.length >= 2 && ROLE_BY_KEY.has(withoutMark)) return withoutMark;
  // A footnote dagger or section mark ("p†", "p-value‡"), and "P" with a footnote letter ("Pa", "Pb").
  const withoutDagger = bare.replace(/[†‡§¶#]{1,3}$/, '').replace(/[.:]$/, '');
  if (withoutDagger !== bare && withoutDagger.length >= 1 && ROLE_BY_KEY.has(withoutDagger)) return withoutDagger;
  if (/^p[a-e]$/.test(bare)) return 'p';
  // A footnote digit glued on ("ndf3", "P-value2"): only after a name of three letters or more, since a
  // symbol with a digit is a name of its own ("T2", a second time point; "F1", a score).
  const withoutDigit = bare.replace(/(?<=[a-z.)\]])\d$/, '');
  if (withoutDigit !== bare && withoutDigit.length >= 3 && ROLE_BY_KEY.has(withoutDigit)) return withoutDigit;
  // A footnote letter set apart by a space ("df c", "F c", "χ2 b"), after a name of a test's own columns. Not d
  // or g, which are effect sizes ("t d" may be two columns run together), nor f.
  const spacedMark = /^(.{1,30}) [abceh]$/.exec(bare);
  const markedRole = spacedMark === null ? undefined : ROLE_BY_KEY.get(spacedMark[1]!);
  if (markedRole !== undefined && ['p', 'df', 'df1', 'df2', 'statistic', 'effect', 'ss', 'ms'].includes(markedRole.role)) return spacedMark![1]!;
  // A Greek letter as the footnote mark, spelled out by the key ("p-valueβ" -> "p-valuebeta"), after a name of
  // two letters or more.
  const greekMark = /^(.{2,30}?)(?:alpha|beta|gamma|delta)$/.exec(bare);
  if (greekMark !== null && ROLE_BY_KEY.has(greekMark[1]!)) return greekMark[1]!;
  // A qualifier in brackets after a known name: "Cohen d (95% CI)", "t (two-tailed)", "p (adjusted)".
  // (Not df: "F(1, 28)" is read with its df below.)
  const withoutQualifier = HEADER_WITH_DF.test(bare) ? bare : bare.replace(/ ?\([^()]{1,30}\)$/, '');
  if (withoutQualifier !== bare && withoutQualifier.length >= 1 && ROLE_BY_KEY.has(withoutQualifier)) return withoutQualifier;
  return null;
}

/**
 * The footnote letter glued onto a known column name ("Test Statisticsa" -> "a"), or null: a header's key
 * that is no name itself but is one without its last letter, a to h.
 */
export function gluedFootnoteLetter(header: string): string | null {
  const key = headerKey(header).replace(/[.:]$/, '');
  if (ROLE_BY_KEY.has(key)) return null;
  const letter = /(?<=[a-z0-9.)\]])[a-h]$/.exec(key)?.[0];
  return letter !== undefined && key.length > 2 && ROLE_BY_KEY.has(key.slice(0, -1)) ? letter : null;
}

/** "<statistic>, p value (df 1, 24)": groups: the statistic's name, the bracketed df. Bounded pieces, no nested quantifiers. */
const P_NAMED_BEFORE_DF = /^([a-z][a-z0-9 -]{0,20}?) ?[,;] ?p(?:[- ]?values?)? ?(\((?:d\.?f\.?)[ =:]{0,3}\d{1,5}(?: ?[,;/] ?\d{1,6})?\))$/;

/**
 * The header without a ", p" or "(p)" naming the p its cells hold too ("f(1, 66)d, p" -> "f(1, 66)"), or
 * null. A footnote letter is dropped only after a bracket or digit: "f" and "f value" end in letters too.
 */
function withoutPSuffix(key: string): string | null {
  for (const suffix of [', p', ',p', '; p', ';p', ' (p)', '(p)', ' (p-value)', ' (p value)', '(p-value)']) {
    if (key.endsWith(suffix) && key.length > suffix.length) return key.slice(0, key.length - suffix.length).replace(/(?<=[0-9)\]])[a-h]$/, '');
  }
  // "F, p value (df 1, 24)": the statistic and its p named together, their df after both; the df are the statistic's.
  const pThenDf = P_NAMED_BEFORE_DF.exec(key);
  if (pThenDf !== null) return `${pThenDf[1]!} ${pThenDf[2]!}`;
  // "t (df) p": the p after the df's brackets.
  if (/\) ?p$/.test(key)) return key.slice(0, key.length - 1).trimEnd();
  return null;
}

/** The meaning of a column from its header text. */
export function classifyHeader(header: string): ColumnRole {
  const key = headerKey(header);
  if (key === '') return { role: 'unknown' };
  // The df as a subscript written out after the name ("Chisquare (χ^{2 })_{df = 3}"): the statistic's one df.
  const subscriptDf = SUBSCRIPT_DF.exec(header);
  if (subscriptDf !== null) {
    const named = classifyHeader(header.slice(0, subscriptDf.index));
    const df = parseReportedNumber(subscriptDf[1]!);
    return named.role === 'statistic' && named.kind !== 'F' && named.kind !== 'z' && named.df.length === 0 && df !== null ? { role: 'statistic', kind: named.kind, df: [df] } : { role: 'unknown' };
  }
  // "F(1, 66), p" or "χ2 (p)": the statistic's cells hold their p too ("0.11, p > 0.05").
  const beforeP = withoutPSuffix(key);
  if (beforeP !== null) {
    const inner = classifyHeader(beforeP);
    if (inner.role === 'statistic') return { ...inner, pInCell: true };
  }
  // "Effect size (ηp2)", "ES (d)": a generic name with the effect size it holds in brackets.
  // Also without the brackets: "Effect size Cohen's d".
  const namedInBrackets = GENERIC_EFFECT_WITH_NAME.exec(key);
  if (namedInBrackets) {
    const inner = classifyHeader(namedInBrackets[1] ?? namedInBrackets[2]!);
    if (inner.role === 'effect') return inner;
  }
  // "90% CI", "99% CI", "95 % CI": an interval's level with its name.
  if (CI_WITH_LEVEL.test(key)) return { role: 'descriptive' };
  // "χ2 or t", "t/χ2", "F/χ2 value": statistics of more than one kind in one column; a cell's kind is
  // known only from a symbol written in it.
  if (MIXED_STATISTICS.test(key)) return { role: 'result' };
  const named = statisticWithDf(key);
  if (named !== null) return named;
  // An effect's name with its test's statistic and df: "Time effect, F(1,128)", "Group: F(2, 57)", "Sex χ2(1)",
  // "t(58) Time", "F(1, 38)a" (a footnote letter after the brackets).
  const effectWithTest = statisticOfNamedEffect(key);
  if (effectWithTest !== null) return effectWithTest;
  const knownKey = knownKeyOf(key);
  const known = knownKey === null ? undefined : ROLE_BY_KEY.get(knownKey);
  if (known) {
    if (known.role !== 'statistic') return known;
    const dfInCell = DF_NAMES_IN_BRACKETS.test(/[.:]$/.test(key) ? key.slice(0, -1).trimEnd() : key);
    return dfInCell ? { ...known, df: [], dfInCell } : { ...known, df: [] };
  }
  const withDf = HEADER_WITH_DF.exec(key);
  if (withDf) {
    const [, symbol = '', first = '', second] = withDf;
    const kind: StatisticKind = symbol === 'f' ? 'F' : symbol === 't' ? 't' : symbol === 'r' ? 'r' : 'chi2';
    const df = [first, second].filter((text): text is string => text !== undefined).map((text) => parseReportedNumber(text)!);
    const expected = kind === 'F' ? 2 : 1;
    if (df.length === expected) return { role: 'statistic', kind, df };
  }
  const subscript = HEADER_WITH_SUBSCRIPT_DF.exec(key);
  if (subscript) return { role: 'statistic', kind: 'F', df: [parseReportedNumber(subscript[1]!)!, parseReportedNumber(subscript[2]!)!] };
  const qualified = QUALIFIED_STATISTIC.exec(key);
  // "Benefits r", "Pre-test t", "Time (F)": a statistic's symbol after the name of what it tests. F only as a
  // capital, since a lower-case f after a word is a frequency.
  // A capital R is a multiple correlation; a partial one has other df.
  const rSpoilt = qualified?.[1] === 'r' && (/R\)?\s*[.:]?$/.test(header) || /(?:^|[ -])(?:partial|part|semi|multiple|model|adjusted|canonical)(?:[ -]|$)/.test(key));
  // The words before the symbol must not be a column name themselves ("Cohen d t" is two columns run together).
  const prefix = qualified ? key.slice(0, key.lastIndexOf(' ')).trim() : '';
  // (Nor a conjunction, the rest of a header cut in two: "or t" from "χ2 or t".)
  const prefixNamed = qualified !== null && (knownKeyOf(prefix) !== null || prefix.split(' ').some((word) => knownKeyOf(word) !== null || CONJUNCTION.test(word)));
  if (qualified && !rSpoilt && !prefixNamed && (qualified[1] !== 'f' || /F\)?\s*[.:]?$/.test(header))) {
    const kind: StatisticKind = qualified[1] === 'f' ? 'F' : qualified[1] === 't' ? 't' : qualified[1] === 'r' ? 'r' : 'chi2';
    return { role: 'statistic', kind, df: [] };
  }
  return { role: 'unknown' };
}

/** "value" alone after a statistic: a p whose italic P the page lost ("F-value value" for "F-value P value"). */
const LOST_P = /^[-\s]?values?(?:\s?[a-h])?$/i;

/**
 * A header row's roles with a lost p symbol restored: a cell "value" (or "-value") right after a statistic's
 * column, in a row that names no p, is the p column whose italic P a web page's text dropped.
 */
export function withLostPSymbol<T extends ColumnRole | null>(names: readonly string[], roles: T[]): T[] {
  if (roles.some((role) => role?.role === 'p')) return roles;
  return roles.map((role, index) => {
    if (!LOST_P.test(names[index]!.trim())) return role;
    let before = index - 1;
    while (before >= 0 && roles[before] === null) before--;
    return roles[before]?.role === 'statistic' ? ({ role: 'p' } as T) : role;
  });
}

/** A subscript that states one df, ending a header: "_{df = 3}", "_{df=12}". */
const SUBSCRIPT_DF = /_\{ ?df ?= ?(\d{1,4}) ?\} ?$/;

/**
 * A statistic's name with its df, in the spellings real headers use: "F-value (1, 52)", "F value (2,57)",
 * "F(1;44)", "F (2/57)", "Pearson χ2 (1)", "χ2 [1]", "χ2(1 df)", "χ2 value (df = 2)", "t-test (df = 28)",
 * "χ2, df = 1". Null unless the name is a known statistic and the brackets hold exactly its number of df
 * (two for F, one otherwise).
 */
function statisticWithDf(key: string): ColumnRole | null {
  const parts = NAME_WITH_DF_BRACKETS.exec(key) ?? NAME_WITH_DF_AFTER_COMMA.exec(key) ?? NAME_WITH_DF_AFTER_WITH.exec(key);
  if (parts === null) return null;
  const name = parts[1]!.replace(/[- ](?:value|test|ratio|statistic|stat)$/, '');
  const knownName = ROLE_BY_KEY.get(name);
  if (knownName?.role !== 'statistic') return null;
  const df = [parts[2], parts[3]].filter((text): text is string => text !== undefined).map((text) => parseReportedNumber(text)!);
  if (df.length !== (knownName.kind === 'F' ? 2 : 1)) return null;
  return { ...knownName, df };
}

/** A statistic's symbol with its df in brackets, as a header writes it after or before an effect's name. */
const SYMBOL_WITH_DF = String.raw`(?:f|t|r|chi2|x2) ?[(\[] ?\d{1,5}(?:\.\d{1,3})?(?: ?[,;/] ?\d{1,6}(?:\.\d{1,3})?)? ?[)\]]`;
const EFFECT_THEN_TEST = new RegExp(String.raw`^([a-z][a-z0-9'×*/ -]{0,40}?)[,:]? (${SYMBOL_WITH_DF})[a-h]?$`);
const TEST_THEN_EFFECT = new RegExp(String.raw`^(${SYMBOL_WITH_DF})[a-h]?[,:]? ([a-z][a-z0-9'×*/ -]{0,40})$`);
const TEST_WITH_MARK = new RegExp(String.raw`^(${SYMBOL_WITH_DF})[a-h]$`);

/**
 * The statistic and df of a header that names an effect beside them (see classifyHeader), or null. The
 * effect's name must not be a column's name itself ("Cohen d t(58)" is two columns run together), nor hold
 * another statistic.
 */
function statisticOfNamedEffect(key: string): ColumnRole | null {
  const marked = TEST_WITH_MARK.exec(key);
  if (marked) return testWithDf(marked[1]!);
  const match = EFFECT_THEN_TEST.exec(key) ?? TEST_THEN_EFFECT.exec(key);
  if (match === null) return null;
  const [name, test] = EFFECT_THEN_TEST.test(key) ? [match[1]!, match[2]!] : [match[2]!, match[1]!];
  const words = name.trim().split(' ');
  if (knownKeyOf(name.trim()) !== null || words.some((word) => { const role = ROLE_BY_KEY.get(word)?.role; return role !== undefined && role !== 'label'; })) return null;
  return testWithDf(test);
}

/**
 * Whether a header cell names an effect beside its test's statistic and df ("Time F(1, 128)"). Not part of
 * isKnownHeader: in a header of single-spaced words, the words before the symbol may be other columns' names
 * ("Pretest Posttest Time effect, F(1,128)"); where each cell stands alone (one cell per line) it is a name.
 */
export function namesEffectWithTest(cell: string): boolean {
  return statisticOfNamedEffect(headerKey(cell)) !== null;
}

/** The statistic with df a "symbol(df)" key names, with as many df as its kind takes; null otherwise. */
function testWithDf(test: string): ColumnRole | null {
  const role = classifyHeader(test);
  return role.role === 'statistic' && role.df.length === (role.kind === 'F' ? 2 : 1) ? role : null;
}

/** Words that join two names: a header they start or join is more than one column's name. */
const CONJUNCTION = /^(?:or|and|vs\.?|versus|\/)$/;

/** Two or more statistics' symbols in one header, apart by "/", "or", "and" or a comma. */
const MIXED_STATISTICS =
  /^(?:(?:test|statistics?|value)\s*\(\s*)?(?:chi2|chi 2|chi-square|x2|t|f|z|h|u)(?:\s*(?:\/|\bor\b|\band\b|,)\s*(?:chi2|chi 2|chi-square|x2|t|f|z|h|u|fisher(?:'s)?(?: exact)?))+\s*\)?(?:[- ](?:values?|tests?|statistics?))?(?: ?\(df\))?$/;

/** A df value in a header: a whole number or a corrected decimal one. */
const HEADER_DF_NUMBER = String.raw`(\d{1,5}(?:\.\d{1,3})?)`;
/** "<name> (1, 52)", "<name> [1]", "<name> (df = 1)", "<name> (1 df)", "<name> (2/57)", "<name>(1;44)", "<name> (1, N = 82)" (the sample size after the df, as APA writes a chi-square). */
const NAME_WITH_DF_BRACKETS = new RegExp(
  String.raw`^([a-z][a-z0-9'-]{0,20}(?: [a-z0-9'-]{1,20}){0,3}) ?[(\[] ?(?:d\.?f\.? ?[=:]? ?)?${HEADER_DF_NUMBER}(?: ?[,;/] ?${HEADER_DF_NUMBER})? ?(?:d\.?f\.?)?(?: ?[,;] ?n ?= ?\d{1,6})? ?[)\]]$`,
);
/** "<name>, df = 1", "<name>, df 1", "<name> df=1". */
const NAME_WITH_DF_AFTER_COMMA = new RegExp(String.raw`^([a-z][a-z0-9'-]{0,20}(?: [a-z0-9'-]{1,20}){0,3})(?: ?, ?| )d\.?f\.? ?[=:]? ?${HEADER_DF_NUMBER}(?: ?[,;/] ?${HEADER_DF_NUMBER})?$`);

/**
 * "<name> with 88 d.f.", "<name> (χ2) value with 2 df", "<name> with 1 and 52 degrees of freedom": the df after
 * "with", as a header states them for every cell of its column (the symbol in brackets and "value" dropped).
 */
const NAME_WITH_DF_AFTER_WITH = new RegExp(
  String.raw`^([a-z][a-z0-9'-]{0,20}(?: [a-z0-9'-]{1,20}){0,2}?)(?: \((?:chi2|x2|f|t)\))?(?: values?)? with ${HEADER_DF_NUMBER}(?: and ${HEADER_DF_NUMBER})? (?:d\.?f\.?|dfs?|degrees? of freedom)$`,
);

/** A generic name for effect sizes with the one the column holds: "effect size (etap2)", "es (d)", "effect size cohen's d". */
const GENERIC_EFFECT_WITH_NAME = /^(?:effect sizes?|es|eff\. size)(?:\s?\(([^()]{1,20})\)| ([^()]{1,20}))$/;

/** "90% CI", "99% CI", "95 % confidence interval". */
const CI_WITH_LEVEL = /^\d{2}(?:\.\d)? ?% ?(?:ci|confidence interval)$/;

/** A symbol after one to three words naming what it tests: "benefits r", "time (f)", "pre-test t". */
const QUALIFIED_STATISTIC = /^[a-z][a-z0-9'\u2019-]*(?: [a-z0-9'\u2019-]+){0,2} \(?(r|t|f|chi2|x2)\)?[.:]?$/;

/** Words that begin a multi-word header; used to group the single-spaced tokens of a header line copied from a PDF. */
export const isKnownHeader = keepAnswers(namesKnownHeader);

function namesKnownHeader(key: string): boolean {
  if (knownKeyOf(key) !== null || HEADER_WITH_DF.test(key) || HEADER_WITH_SUBSCRIPT_DF.test(key) || statisticWithDf(key) !== null) return true;
  if (CI_WITH_LEVEL.test(key) || MIXED_STATISTICS.test(key)) return true;
  if (GENERIC_EFFECT_WITH_NAME.test(key) && classifyHeader(key).role === 'effect') return true;
  // "Benefits r": a statistic after what it tests (only with its symbol as the phrase's last word).
  if (QUALIFIED_STATISTIC.test(key) && key.includes(' ') && classifyHeader(key).role === 'statistic') return true;
  // (Not "t (df) p" from words run together: in a header read from single-spaced words, the "p" there
  // begins the next column's name, "t value (df) P value".)
  return withoutPSuffix(key) !== null && !/\) ?p$/.test(key) && classifyHeader(key).role === 'statistic';
}

let firstWords: Set<string> | null = null;

/**
 * Whether a word can begin a known header name. Plain ASCII words are looked
 * up in the first words of the vocabulary; anything else (Greek letters,
 * markup) might normalise into one, so it counts as possible. This lets the
 * table finder dismiss lines of prose without trying every phrase in them.
 */
export function couldStartHeader(word: string): boolean {
  if (!PLAIN_HEADER.test(word)) return true;
  if (firstWords === null) {
    // Filled before it is kept: an audit stopped by its time budget mid-fill must not leave half a set behind.
    const words = new Set([...ROLE_BY_KEY.keys()].map((key) => key.split(' ')[0]!));
    for (const word of ['eta', 'etap', 'etag', 'partial', 'omega', 'omegap', 'chi', 'x']) words.add(word);
    firstWords = words;
  }
  const key = word.toLowerCase().replace(/[.:,;]$/, '');
  // A token may carry its bracket ("r (P value)", "F (1, 20)"): its first word decides.
  return firstWords.has(key) || firstWords.has(key.split(' ')[0]!) || HEADER_WITH_DF.test(key) || /^[a-z]{1,3}\(/.test(key);
}

/** Longest header phrase, in words, in the vocabulary. */
export const LONGEST_HEADER_WORDS = 5;

/** A piece of a line: its text and its offsets in that line. */
export interface NamePiece {
  text: string;
  start: number;
  end: number;
}

/**
 * A line of column names run together with single spaces ("t df p Effect
 * size Cohen's d"), cut into its names: the longest known phrase at each
 * word ("Effect size Cohen's d" is one). Null unless every word belongs to a
 * known name and there are at least two names.
 */
export function splitRunTogetherNames(line: string): NamePiece[] | null {
  const words: NamePiece[] = [];
  // Words apart by spaces outside brackets: "Mean (SD)" and "F (1, 20)" stay whole.
  let depth = 0;
  let start = -1;
  for (let at = 0; at <= line.length; at++) {
    const char = line[at];
    if (char === '(' || char === '[') depth++;
    else if (char === ')' || char === ']') depth = Math.max(0, depth - 1);
    const space = char === undefined || ((char === ' ' || char === '\t') && depth === 0);
    if (space && start >= 0) {
      words.push({ text: line.slice(start, at), start, end: at });
      start = -1;
    } else if (!space && start < 0) start = at;
  }
  const names: NamePiece[] = [];
  for (let index = 0; index < words.length; ) {
    let length = Math.min(LONGEST_HEADER_WORDS, words.length - index);
    const phrase = (size: number): string => line.slice(words[index]!.start, words[index + size - 1]!.end);
    while (length > 0 && !isKnownHeader(headerKey(phrase(length)))) length--;
    if (length === 0) return null;
    names.push({ text: phrase(length), start: words[index]!.start, end: words[index + length - 1]!.end });
    index += length;
  }
  return names.length >= 2 ? names : null;
}

/** The kind of statistic a column header names, or null. */
export function statisticKindOf(role: ColumnRole): StatisticKind | null {
  return role.role === 'statistic' ? role.kind : null;
}

/** Every header name the vocabulary knows (lower case), for reading headers whose names ran together. */
export function knownHeaderNames(): readonly string[] {
  return [...ROLE_BY_KEY.keys()];
}

/**
 * A table's title line: "Table 2", "TABLE 2.", "**Table 2**", "# Table 2" (a
 * Markdown heading), "> **Table 4.**", "TABLE IV" (Roman numerals, as
 * engineering journals number tables), and the word in the languages of the
 * corpus (Tabla, Tabela, Tableau, Tabelle, Tab.).
 */
// With the words of the other languages of the corpus (common practice, from memory): Spanish and Portuguese
// "error", "erro", "residuo", "resíduo", "dentro de grupos", "intragrupos"; French "erreur", "résidu",
// "intra-groupes"; German "Fehler", "Residuen", "innerhalb der Gruppen".
export const ERROR_LABEL =
  /^(?:error|pure[- ]error|residuals?|within(?:[- ](?:groups?|cells|subjects|treatments?))?|s\/a|subjects within groups|error term|erro|erreur|fehler|residuen|res[ií]duos?|r[ée]sidus?|r[ée]siduelle|dentro de (?:los )?grupos|intragrupos?|intra-groupes?|innerhalb der gruppen|fout|errore|residui|entro i gruppi)(?![a-zà-ÿ])/;
/** A note line ending a block of cells one per line: "Note.", "*p < .05", "Abbreviations". */
export const CELL_BLOCK_NOTE = /^\s{0,8}(?:(?:\*|_){0,2}Notes?(?:\*|_){0,2}\s*[.:]|\*{1,3}\s*p\s*[<\u2264=]|Abbreviations?\b)/;
/** A Total row is labelled Total and nothing more ("Total phenolics", "Total score" are measures). */
export const TOTAL_LABEL = /^(?:total|corrected total|uncorrected total|total \(corrected\)|total corrected|cor total|gesamt|insgesamt|total corrigido|total corregido)(?:[*\u2020\u2021]{1,3}|[a-d])?[.:]?$/;

/** A header cell naming a column of tests: "Test", "Test Statistic" (a crushed copy's "Test" and "Statistic" as one). */
export const NAMES_TEST_COLUMN = /^\s*tests?(?:\s+statistics?)?\s*$/i;

export const TABLE_TITLE = /^\s{0,8}(?:#{1,6}\s{1,3}|>\s{0,3}|[-*\u2022]\s{1,3})?(?:\*\*|_)?(?:(?:Supplementary|Supplemental|SUPPLEMENTARY|Suppl\.|Appendix|Online) )?(?:Table|TABLE|Tabla|TABLA|Tabela|TABELA|Tableau|TABLEAU|Tabelle|TABELLE|Tab\.)\s+(?:[A-Z]?\d{1,3}[A-Za-z]?|[IVX]{1,5}(?![A-Za-z]))\.?(?:\*\*|_)?(?=[.:\s|]|$)/;
/** A title line with nothing after the number: the title proper follows on the next line. */
export const BARE_TABLE_TITLE = /^\s{0,8}(?:#{1,6}\s{1,3}|>\s{0,3}|[-*\u2022]\s{1,3})?(?:\*\*|_)?(?:(?:Supplementary|Supplemental|SUPPLEMENTARY|Suppl\.|Appendix|Online) )?(?:Table|TABLE|Tabla|TABLA|Tabela|TABELA|Tableau|TABLEAU|Tabelle|TABELLE|Tab\.)\s+(?:[A-Z]?\d{1,3}[A-Za-z]?|[IVX]{1,5}(?![A-Za-z]))\.?(?:\*\*|_)?\s*$/;

/**
 * "t/χ2", "χ2/t", "F/χ2": a row or column naming two statistics, the chi-square for categorical variables and
 * the other for continuous ones (common practice in tables comparing groups). Which one a value is, is told by
 * the cells that go with it (`cells`: the rows above it in a table on its side, or its own row): means with
 * SDs ("2.45 ± 0.19", "12.1 (3.2)") and no counts give the other statistic, counts with percentages and no
 * means give the chi-square; anything else leaves it unread.
 */
const TWO_STATISTICS = /^(?:(chi2|x2|chi 2|x 2)(?: ?\/ ?| or |, ?)(t|f|z)|(t|f|z)(?: ?\/ ?| or |, ?)(chi2|x2|chi 2|x 2))(?: ?(?:values?|tests?))?( ?\(df\))?$/;
const MEAN_WITH_SD = /\d ?\u00b1 ?\d|\d\.\d{1,3} ?\(\d{1,4}\.\d{1,3}\)/;
/** A count with its share: "30 (55.6)", "30 (55.6%)", "12 (9 %)"; a mean with its SD ("12.3 (4.5)") starts with decimals. */
const COUNT_WITH_SHARE = /(?:^|\s)\d{1,5} ?\(\d{1,3}(?:\.\d{1,2})? ?%?\)|\d ?%/;

/** Whether a header names two statistics, one for categorical and one for continuous variables ("t/χ2"). */
export function namesTwoStatistics(name: string): boolean {
  return TWO_STATISTICS.test(headerKey(name));
}

/** Whether such a header says its cells hold their df too ("χ2/t (df)", "t or χ2 (df)"). */
export function twoStatisticsWithDf(name: string): boolean {
  return TWO_STATISTICS.exec(headerKey(name))?.[5] !== undefined;
}

export function statisticOfTwo(name: string, cells: string): ColumnRole | null {
  const match = TWO_STATISTICS.exec(headerKey(name));
  if (match === null) return null;
  const continuous = (match[2] ?? match[3])!;
  const means = MEAN_WITH_SD.test(cells);
  const counts = COUNT_WITH_SHARE.test(cells);
  if (means === counts) return null;
  const kind = counts ? 'chi2' : continuous === 't' ? 't' : continuous === 'f' ? 'F' : 'z';
  // ("χ2/t (df)": each cell holds its value and df, "0.56 (1)".)
  return match[5] !== undefined ? { role: 'statistic', kind, df: [], dfInCell: true } : { role: 'statistic', kind, df: [] };
}

/** A p set under its statistic's value in the same column: "p < .001", "p = .006", "(.006)", "(<.001)", "(p = .02)". */
export const P_UNDER_VALUE = /^\s*(?:[pP]\s?[<=>\u2264\u2265]\s?0?\.\d{1,4}|\(\s?(?:[pP]\s?)?[<=>\u2264\u2265]?\s?0?\.\d{1,4}\s?\))\s*$/;
