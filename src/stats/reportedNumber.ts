import type { ReportedNumber } from '../scan/types.js';

/**
 * Parses a number as written in a manuscript, keeping its precision.
 *
 * Accepts an optional sign, digits with an optional leading-dot decimal
 * (".021"), and scientific notation written as "1.2e-5", "1.2E-5",
 * "1.2 x 10^-5" or "1.2 × 10-5" (the caret is often lost when copying from
 * PDF). The text must already be normalised to ASCII minus signs and digits
 * (see src/scan/normalise.ts). Returns null for anything else.
 */
export function parseReportedNumber(written: string): ReportedNumber | null {
  const text = written.trim();
  const match = /^([+-]?)(\d*)(?:\.(\d+))?(?:\s*(?:[eE]|[x×*]\s*10\s*(?:\^\s*)?)([+-]?\d{1,3}))?$/.exec(text);
  if (!match) return null;
  const [, sign = '', whole = '', fraction, exponentText] = match;
  if (whole === '' && fraction === undefined) return null;
  const decimals = fraction === undefined ? 0 : fraction.length;
  const exponent = exponentText === undefined ? 0 : Number(exponentText);
  const mantissa = Number(`${sign}${whole === '' ? '0' : whole}.${fraction ?? '0'}`);
  const value = exponent === 0 ? mantissa : Number(`${mantissa}e${exponent}`);
  if (!Number.isFinite(value)) return null;
  return { value, text, decimals, exponent };
}

/** Half a unit in the last written place: 0.005 for "4.21", 0.5e-6 for "1.2e-5". */
export function halfUnitInLastPlace(reported: ReportedNumber): number {
  return 0.5 * 10 ** (reported.exponent - reported.decimals);
}

/**
 * The interval of true values that round to the reported number, [low, high].
 *
 * Common practice: a value written with k decimals stands for anything that
 * rounds to it, i.e. within half a unit in the last place. Both ends are
 * included because manuscripts round half-up, half-even and truncate
 * inconsistently; a check that needs to be lenient should be lenient here.
 */
export function roundingInterval(reported: ReportedNumber): { low: number; high: number } {
  const half = halfUnitInLastPlace(reported);
  return { low: reported.value - half, high: reported.value + half };
}

/** Rounds to a number of decimal places, half away from zero, without binary-float surprises. */
export function roundToDecimals(value: number, decimals: number): number {
  if (!Number.isFinite(value)) return value;
  const scaled = Math.abs(value) * 10 ** decimals;
  // Nudge by a relative epsilon so 1.005 (stored as 1.00499999...) rounds up as typed.
  const rounded = Math.round(scaled * (1 + 1e-12)) / 10 ** decimals;
  return Math.sign(value) * rounded;
}

/** True when `value` rounds to the reported number at the reported precision. */
export function roundsTo(value: number, reported: ReportedNumber): boolean {
  const { low, high } = roundingInterval(reported);
  const slack = 1e-12 * Math.max(1, Math.abs(reported.value));
  return value >= low - slack && value <= high + slack;
}
