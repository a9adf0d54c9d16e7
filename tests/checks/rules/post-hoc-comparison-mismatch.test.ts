import { describe, expect, it } from 'vitest';
import { ruleFindings } from './descriptivesHelper.js';
import { loadFixture } from '../../stats/referenceFixtures.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';

const rule = 'post-hoc-comparison-mismatch';

interface Pair {
  first: number;
  second: number;
  t: number;
  pLsd: number;
  pTukey: number;
  pBonferroni: number;
  pHolm: number;
  pSidak: number;
  pScheffe: number;
}
interface FixtureCase {
  label: string;
  means: number[];
  sds: number[];
  ns: number[];
  errorMeanSquare: number;
  errorDf: number;
  pairs: Pair[];
}

// SciPy 1.10.1 scipy.stats.tukey_hsd and statsmodels 0.13.5 multipletests (Bonferroni, Holm, Šidák) on simulated raw
// data, with the groups' means, SDs and ns: tests/fixtures/stats/gen_post_hoc.py. (Scheffé's p there is the formula
// evaluated with SciPy's F distribution, not an outside implementation; see the generator.)
const fixture = loadFixture<{ cases: FixtureCase[] }>('stats/post_hoc.json');
const METHODS = [
  { words: "Tukey's HSD", p: (pair: Pair) => pair.pTukey },
  { words: 'Bonferroni-adjusted', p: (pair: Pair) => pair.pBonferroni },
  { words: 'Holm-adjusted', p: (pair: Pair) => pair.pHolm },
  { words: 'Šidák-adjusted', p: (pair: Pair) => pair.pSidak },
  { words: 'Scheffé', p: (pair: Pair) => pair.pScheffe },
  { words: "Fisher's LSD", p: (pair: Pair) => pair.pLsd },
];

const printedP = (p: number): string => (p < 0.001 ? 'p < .001' : p >= 0.9995 ? 'p = 1.000' : `p = ${p.toFixed(3).slice(1)}`);

/** The groups (2 decimals) and the one-way F in a paragraph, then each comparison in a sentence of its own. */
function manuscript(c: FixtureCase, method: (typeof METHODS)[number], tOf: (pair: Pair) => number = (pair) => pair.t): string {
  const k = c.means.length;
  const groups = c.means.map((mean, g) => `group ${g + 1} (M = ${mean.toFixed(2)}, SD = ${c.sds[g]!.toFixed(2)}, n = ${c.ns[g]})`).join(', ');
  const total = c.ns.reduce((a, b) => a + b, 0);
  const grand = c.means.reduce((sum, mean, g) => sum + c.ns[g]! * mean, 0) / total;
  const f = c.means.reduce((sum, mean, g) => sum + c.ns[g]! * (mean - grand) ** 2, 0) / (k - 1) / c.errorMeanSquare;
  const comparisons = c.pairs
    .map((pair) => `${method.words} comparison of group ${pair.first + 1} (M = ${c.means[pair.first]!.toFixed(2)}) with group ${pair.second + 1} (M = ${c.means[pair.second]!.toFixed(2)}): t(${c.errorDf}) = ${tOf(pair).toFixed(2)}, ${printedP(method.p(pair))}.`)
    .join(' ');
  return `Scores of ${groups} differed, F(${k - 1}, ${c.errorDf}) = ${f.toFixed(2)}, p = .040.\n\n${comparisons}\n`;
}

/**
 * A pair the text lets the reader tell apart: both printed means belong to one group only (in the 4-group case two
 * groups print 18.75, and a comparison naming 18.75 cannot say which it means, so it is not linked).
 */
function identifiable(c: FixtureCase, pair: Pair): boolean {
  const printed = c.means.map((mean) => mean.toFixed(2));
  return printed.filter((mean) => mean === printed[pair.first]).length === 1 && printed.filter((mean) => mean === printed[pair.second]).length === 1;
}

describe(`${rule}: must pass — every comparison SciPy and statsmodels give, from groups rounded as printed`, () => {
  for (const c of fixture.cases) {
    for (const method of METHODS) {
      it(`${c.label}, ${method.words}`, () => {
        const text = manuscript(c, method);
        // Every comparison the text identifies is linked to the two groups it names (so the pass is a real comparison).
        const [, ...scanned] = scanDocument({ text, tables: [], regions: [] }).results;
        expect(scanned.map((result) => (result.postHoc ? [result.postHoc.first, result.postHoc.second] : null))).toEqual(
          c.pairs.map((pair) => (identifiable(c, pair) ? [pair.first, pair.second] : null)),
        );
        const [, ...comparisons] = ruleFindings(rule, text);
        expect(comparisons).toHaveLength(c.pairs.length);
        for (const { result, findings } of comparisons) expect(findings, result).toEqual([]);
      });
    }
  }
});

describe(`${rule}: must flag — a t 20% off, and a p of another method`, () => {
  for (const c of fixture.cases) {
    it(`${c.label}: every t 20% off is flagged, in every method (|t| of 1 or more: below, the rounding of the means hides 20%)`, () => {
      for (const method of METHODS) {
        const [, ...comparisons] = ruleFindings(rule, manuscript(c, method, (pair) => pair.t * 1.2));
        const checkable = c.pairs.map((pair) => identifiable(c, pair) && Math.abs(pair.t) >= 1);
        expect(checkable.filter(Boolean).length).toBeGreaterThan(0);
        for (const [index, { result, findings }] of comparisons.entries()) {
          if (!checkable[index]) continue;
          expect(findings, `${method.words}: ${result}`).toHaveLength(1);
          expect(findings[0]).toMatchObject({ rule, severity: 'fail' });
          expect(findings[0]!.message).toContain('the printed t does not fit');
        }
      }
    });
  }

  it('an unadjusted p printed under a Bonferroni heading (3 groups: the adjusted p is 3 times larger)', () => {
    const c = fixture.cases.find((candidate) => candidate.label === '3 groups, equal n')!;
    const bonferroniWithLsdP = { words: 'Bonferroni-adjusted', p: (pair: Pair) => pair.pLsd };
    const [, ...comparisons] = ruleFindings(rule, manuscript(c, bonferroniWithLsdP));
    // Pairs whose Bonferroni p differs from the LSD p at 3 decimals (not capped at 1, not both below .001) are flagged.
    const differing = c.pairs.map((pair) => printedP(pair.pLsd) !== printedP(pair.pBonferroni));
    expect(differing.some(Boolean)).toBe(true);
    comparisons.forEach(({ result, findings }, index) => {
      expect(findings.length, result).toBe(differing[index] ? 1 : 0);
      if (differing[index]) expect(findings[0]!.message).toContain('the printed p (p =');
    });
  });
});

describe(`${rule}: left alone`, () => {
  const c = fixture.cases.find((candidate) => candidate.label === '3 groups, equal n')!;
  it('a t on other df than the ANOVA error (a two-group t test)', () => {
    const text = manuscript(c, METHODS[1]!).replace(/t\(42\)/g, 't(28)');
    expect(ruleFindings(rule, text).flatMap((entry) => entry.findings)).toEqual([]);
  });
  it('no method named', () => {
    const text = manuscript(c, { words: 'A', p: (pair) => pair.pLsd }, (pair) => pair.t * 1.2);
    expect(ruleFindings(rule, text).flatMap((entry) => entry.findings)).toEqual([]);
  });
});
