/**
 * Number parsing for data cells, and exact removal of a column's origin.
 *
 * ## Method
 * Each numeric column is stored as an origin (its first value) plus deltas.
 * When a value shares many leading digits with the origin (|v - o| below
 * 1e-6 |o|), the delta is computed exactly in decimal (BigInt mantissas
 * aligned to a common power of ten) and rounded once to a double; otherwise
 * the double difference is already accurate to a few units in the last place
 * of the delta. This keeps every digit of values such as 1000000000000.4,
 * whose double representation alone carries an error of about 6e-5, i.e.
 * 1e-3 of the spread of the data. Shifting the outcome or a covariate by a
 * constant leaves every sum of squares unchanged when the model has an
 * intercept (the shift lies in the intercept's span).
 *
 * ## References
 * - Chan, T. F., Golub, G. H. & LeVeque, R. J. (1983). Algorithms for
 *   computing the sample variance: analysis and recommendations. The
 *   American Statistician 37(3), 242-247 (shifting data before accumulating).
 * - Simon, S. D. & Lesage, J. P. (1989). Assessing the accuracy of ANOVA
 *   calculations in statistical software. Computational Statistics & Data
 *   Analysis 8, 325-332.
 */

/**
 * A number as a CSV user writes one: decimal digits with an optional sign,
 * decimal point and exponent ("1.5", "-2e3", ".5", "+4."). JavaScript's
 * Number() reads much more: hexadecimal, binary and octal ("0x1F", "0b101",
 * "0o17"), "Infinity", and "" or blanks as 0; a cell written that way is a
 * code or a typo, not a measurement, so it is text here.
 */
const DECIMAL_NUMBER = /^[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?$/;

/**
 * Strict decimal parse (DECIMAL_NUMBER). Returns NaN for anything else:
 * other bases, "Infinity", "NaN", "1,5", blanks, surrounding white space,
 * and numbers too large for a double ("1e999"). With `decimalComma`, a
 * single comma is read as the decimal mark ("1,5").
 */
export function parseCellNumber(text: string, decimalComma = false): number {
  const s = decimalComma && text.includes(',') ? text.replace(',', '.') : text;
  if (!DECIMAL_NUMBER.test(s)) return NaN;
  const v = Number(s);
  return Number.isFinite(v) ? v : NaN;
}

interface Decimal {
  mantissa: bigint;
  exponent: number;
}

const DECIMAL_RE = /^([-+]?)(\d*)(?:\.(\d*))?(?:[eE]([-+]?\d+))?$/;

function parseDecimal(text: string): Decimal | undefined {
  const m = DECIMAL_RE.exec(text.replace(',', '.'));
  if (!m) return undefined;
  const intPart = m[2] ?? '';
  const frac = m[3] ?? '';
  if (intPart.length + frac.length === 0) return undefined;
  const mantissa = BigInt(`${m[1] === '-' ? '-' : ''}${intPart}${frac}` || '0');
  return { mantissa, exponent: Number(m[4] ?? 0) - frac.length };
}

function decimalDifference(a: Decimal, b: Decimal): number {
  const e = Math.min(a.exponent, b.exponent);
  const ma = a.mantissa * 10n ** BigInt(a.exponent - e);
  const mb = b.mantissa * 10n ** BigInt(b.exponent - e);
  return Number(`${(ma - mb).toString()}e${e}`);
}

/** Accumulates a numeric column as origin + delta (see the module comment). */
export class ShiftedColumn {
  /** The first value seen (as a double); deltas are relative to its decimal text. */
  origin = NaN;
  private originText = '';
  private originDecimal: Decimal | undefined;

  /** Delta of a value (already parsed as `value` from `text`) from the origin. */
  delta(text: string, value: number): number {
    if (Number.isNaN(this.origin)) {
      this.origin = value;
      this.originText = text;
      return 0;
    }
    const d = value - this.origin;
    if (Math.abs(d) >= 1e-6 * Math.abs(this.origin) || this.origin === 0) return d;
    if (text === this.originText) return 0;
    if (this.originDecimal === undefined) this.originDecimal = parseDecimal(this.originText);
    const dec = parseDecimal(text);
    if (dec === undefined || this.originDecimal === undefined) return d;
    return decimalDifference(dec, this.originDecimal);
  }
}
