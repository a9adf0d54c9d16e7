import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import { normaliseText } from '../../src/scan/normalise.js';
import { chiSquareUpperTail, fUpperTail, noncentralFCdf, rTwoTailed, tTwoTailed, zTwoTailed } from '../../src/stats/index.js';
import { parseReportedNumber, roundingInterval } from '../../src/stats/reportedNumber.js';

/**
 * Properties of the scanner and the statistics core over random inputs.
 * Runs are seeded (fast-check prints the seed and the shrunk counterexample
 * on failure; rerun with that seed to reproduce).
 */
const seed = 20240611;
const runs = (numRuns: number) => ({ seed, numRuns });

/** Pieces that look like the parts of a result, mixed with arbitrary Unicode. */
const fragment = fc.oneof(
  fc.constantFrom('F', 't', 'r', 'z', 'Z', 'χ2', 'chi-square', 'X2', 'p', 'ps', 'ηp2', 'η²', 'd', 'g', 'ω2', 'CI', '95%', 'N', 'df', 'n.s.', 'ns'),
  fc.constantFrom('(', ')', '[', ']', ',', ';', ' ', '  ', '\n', '\r\n', '\r', '=', '<', '>', '≤', '≥', '−', '–', '-', '.', '*', '_', '×', '10^', 'e-', '\u00a0', '\ufeff', '\u200b'),
  fc.integer({ min: 0, max: 99999 }).map(String),
  fc.double({ min: -1000, max: 1000, noNaN: true }).map((value) => value.toFixed(3)),
  fc.string({ unit: 'grapheme', maxLength: 6 }),
  fc.string({ unit: 'binary', maxLength: 4 }),
);
const noisyText = fc.array(fragment, { maxLength: 80 }).map((parts) => parts.join(''));

/** What the normalised text of a result's start must hold: its symbol or the symbol's flattened form. */
const SYMBOL: Record<string, RegExp> = { F: /^F/, t: /^t/, r: /^r/, z: /^[zZ]/, chi2: /^(?:chi|[xXcC])/ };

describe('scanText on random text', () => {
  it('never throws, and every result points at text that holds it', () => {
    fc.assert(
      fc.property(noisyText, (text) => {
        const { results } = scanText(text);
        for (const result of results) {
          expect(result.start).toBeGreaterThanOrEqual(0);
          expect(result.end).toBeGreaterThan(result.start);
          expect(result.end).toBeLessThanOrEqual(text.length);
          // The result's text is the original text between its offsets...
          expect(result.text).toBe(text.slice(result.start, result.end));
          // ...and starts with the statistic's symbol (as written, or flattened: "χ2" -> "chi2", "*F*" -> "F").
          expect(normaliseText(result.text).text).toMatch(SYMBOL[result.kind]!);
          // Its p and effect sizes lie inside it.
          for (const part of [...(result.p ? [result.p] : []), ...result.effects]) {
            expect(part.start).toBeGreaterThanOrEqual(result.start);
            expect(part.end).toBeLessThanOrEqual(result.end);
            expect(part.end).toBeGreaterThan(part.start);
          }
        }
        // Results come in document order and do not overlap.
        for (let index = 1; index < results.length; index++) expect(results[index]!.start).toBeGreaterThanOrEqual(results[index - 1]!.end);
      }),
      runs(1500),
    );
  });

  it('never throws on arbitrary strings, long ones included', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 3000 }), (text) => {
        scanText(text);
      }),
      runs(200),
    );
  });
});

describe('recomputed p-values lie in [0, 1]', () => {
  const df = fc.double({ min: 1e-3, max: 1e6, noNaN: true });
  const statistic = fc.double({ min: 0, max: 1e6, noNaN: true });
  const inUnit = (p: number): void => {
    expect(p).toBeGreaterThanOrEqual(0);
    expect(p).toBeLessThanOrEqual(1);
  };
  it('F, chi-square, t, z, r and the noncentral F', () => {
    fc.assert(fc.property(statistic, df, df, (f, df1, df2) => inUnit(fUpperTail(f, df1, df2))), runs(300));
    fc.assert(fc.property(statistic, df, (x, k) => inUnit(chiSquareUpperTail(x, k))), runs(300));
    fc.assert(fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), df, (t, k) => inUnit(tTwoTailed(t, k))), runs(300));
    fc.assert(fc.property(fc.double({ min: -1e3, max: 1e3, noNaN: true }), (z) => inUnit(zTwoTailed(z))), runs(300));
    fc.assert(fc.property(fc.double({ min: -1, max: 1, noNaN: true }), fc.integer({ min: 1, max: 1e6 }), (r, k) => inUnit(rTwoTailed(r, k))), runs(300));
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1000, noNaN: true }), fc.double({ min: 0.5, max: 1000, noNaN: true }), fc.double({ min: 1, max: 1e4, noNaN: true }), fc.double({ min: 0, max: 500, noNaN: true }), (f, df1, df2, lambda) =>
        inUnit(noncentralFCdf(f, df1, df2, lambda)),
      ),
      runs(100),
    );
  });
});

describe('rounding intervals', () => {
  it('contain the reported value, and every value in them rounds to it', () => {
    const written = fc
      .tuple(fc.boolean(), fc.nat({ max: 99999 }), fc.nat({ max: 6 }), fc.option(fc.integer({ min: -30, max: 30 }), { nil: undefined }))
      .map(([negative, digits, decimals, exponent]) => {
        const mantissa = (digits / 10 ** decimals).toFixed(decimals);
        return `${negative ? '-' : ''}${mantissa}${exponent === undefined ? '' : `e${exponent}`}`;
      });
    fc.assert(
      fc.property(written, (text) => {
        const reported = parseReportedNumber(text)!;
        expect(reported).not.toBeNull();
        const { low, high } = roundingInterval(reported);
        expect(low).toBeLessThanOrEqual(reported.value);
        expect(high).toBeGreaterThanOrEqual(reported.value);
        const width = 10 ** (reported.exponent - reported.decimals);
        expect(Math.abs(high - low - width)).toBeLessThanOrEqual(1e-9 * width + 4 * Number.EPSILON * Math.abs(reported.value));
      }),
      runs(500),
    );
  });
});

describe('formatting a result and scanning it back gives the same numbers', () => {
  type Kind = 'F' | 't' | 'chi2' | 'r' | 'z';
  const decimal = (max: number, places: number) => fc.integer({ min: 1, max: max * 10 ** places }).map((n) => (n / 10 ** places).toFixed(places));
  const result = fc.record({
    kind: fc.constantFrom<Kind>('F', 't', 'chi2', 'r', 'z'),
    df1: fc.integer({ min: 1, max: 20 }),
    df2: fc.integer({ min: 2, max: 900 }),
    value: decimal(99, 2),
    p: fc.oneof(decimal(0.999, 3).map((p) => p.replace(/^0/, '')), fc.constantFrom('.001', '.01', '.05')),
    pComparator: fc.constantFrom('=', '<'),
    eta: fc.option(decimal(0.99, 2).map((value) => value.replace(/^0/, '')), { nil: null }),
    style: fc.constantFrom('plain', 'unicode', 'markdown', 'compact'),
  });

  it('for F, t, chi-square, r and z in several typographic styles', () => {
    fc.assert(
      fc.property(result, (generated) => {
        const { kind, df1, df2, style } = generated;
        const value = kind === 'r' ? `.${generated.value.replace('.', '').slice(0, 2).padStart(2, '0')}` : generated.value;
        const minus = style === 'unicode' ? '\u2212' : '-';
        const signed = kind === 't' || kind === 'z' ? `${minus}${value}` : value;
        const symbol = { F: 'F', t: 't', chi2: style === 'unicode' ? 'χ2' : 'chi2', r: 'r', z: 'z' }[kind];
        const italic = style === 'markdown' ? `*${symbol}*` : symbol;
        const df = kind === 'F' ? (style === 'compact' ? `(${df1},${df2})` : `(${df1}, ${df2})`) : kind === 'z' ? '' : `(${kind === 'chi2' ? df1 : df2})`;
        const p = style === 'markdown' ? `*p* ${generated.pComparator} ${generated.p}` : `p ${generated.pComparator} ${generated.p}`;
        const eta = kind === 'F' && generated.eta !== null ? `, ${style === 'unicode' ? 'ηp²' : 'partial eta squared'} = ${generated.eta}` : '';
        const text = `The effect was clear, ${italic}${df} = ${signed}, ${p}${eta}.`;
        const { results } = scanText(text);
        expect(results, text).toHaveLength(1);
        const found = results[0]!;
        expect(found.kind).toBe(kind);
        const expectedDf = kind === 'F' ? [df1, df2] : kind === 'z' ? [] : [kind === 'chi2' ? df1 : df2];
        expect(found.df.map((d) => d.value)).toEqual(expectedDf);
        expect(found.value?.value).toBe(Number(signed.replace('\u2212', '-')));
        expect(found.p?.value.value).toBe(Number(generated.p));
        expect(found.p?.comparator).toBe(generated.pComparator);
        if (eta !== '') expect(found.effects.map((e) => e.value.value)).toEqual([Number(generated.eta)]);
      }),
      runs(400),
    );
  });
});
