import { describe, expect, it } from 'vitest';
import {
  arrangeCells,
  factorialAnovaFromCells,
  factorialAnovaRange,
  factorialTerms,
  MAX_VERTEX_CELLS,
  type FactorialCell,
  type FactorialCellBox,
  type SumOfSquaresType,
} from '../../src/stats/factorialFromCells.js';
import { loadFixture, relativeFailures, type Comparison } from './referenceFixtures.js';

interface FixtureCell {
  levels: string[];
  n: number;
  mean: number;
  sd: number;
  meanRounded: number;
  sdRounded: number;
}
interface FixtureEffect {
  term: number[];
  ss: number;
  df: number;
  f: number;
  p: number;
}
interface FixtureCase {
  label: string;
  factors: string[];
  levels: number[];
  balanced: boolean;
  cells: FixtureCell[];
  anova: Record<'1' | '2' | '3', { effects: FixtureEffect[]; ssResidual: number; dfResidual: number }>;
}

// statsmodels 0.13.5 anova_lm (typ 1, 2, 3; C(., Sum) coding) on simulated raw data, written by
// tests/fixtures/stats/gen_factorial_cells.py together with the exact and the rounded cell statistics.
const fixture = loadFixture<{ cases: FixtureCase[] }>('stats/factorial_cells.json');
const TYPES: SumOfSquaresType[] = [1, 2, 3];

const exactCells = (c: FixtureCase): FactorialCell[] => c.cells.map((cell) => ({ levels: cell.levels, mean: cell.mean, sd: cell.sd, n: cell.n }));
/** The box of values that round to the printed (2-decimal) statistics. */
const printedBoxes = (c: FixtureCase): FactorialCellBox[] =>
  c.cells.map((cell) => ({
    levels: cell.levels,
    mean: { low: cell.meanRounded - 0.005, high: cell.meanRounded + 0.005 },
    sd: { low: cell.sdRounded - 0.005, high: cell.sdRounded + 0.005 },
    n: cell.n,
  }));
const sameTerm = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((f, i) => f === b[i]);

describe('the fixture covers what its generator promises', () => {
  it('two- and three-factor designs, balanced and unbalanced, one with more cells than are enumerated', () => {
    const shapes = fixture.cases.map((c) => `${c.levels.length}:${c.balanced}`);
    for (const shape of ['2:true', '2:false', '3:true', '3:false']) expect(shapes).toContain(shape);
    expect(fixture.cases.some((c) => c.cells.length > MAX_VERTEX_CELLS)).toBe(true);
    // Unbalanced designs make the types differ, which is what lets a reported F name its type.
    const unbalanced = fixture.cases.find((c) => !c.balanced && c.levels.length === 2)!;
    expect(Math.abs(unbalanced.anova['1'].effects[0]!.f - unbalanced.anova['3'].effects[0]!.f)).toBeGreaterThan(0.5);
  });
});

describe('factorial ANOVA from exact cell statistics against statsmodels 0.13.5 anova_lm (gen_factorial_cells.py)', () => {
  for (const c of fixture.cases) {
    for (const type of TYPES) {
      it(`${c.label}, type ${type}: SS, df, F and p of every term to 1e-8 relative`, () => {
        const table = factorialAnovaFromCells(c.levels.length, exactCells(c), type)!;
        const reference = c.anova[String(type) as '1' | '2' | '3'];
        expect(table.effects.map((e) => e.term)).toEqual(reference.effects.map((e) => e.term));
        expect(table.dfWithin).toBe(reference.dfResidual);
        const comparisons: Comparison[] = [{ label: 'SS within', computed: table.ssWithin, reference: reference.ssResidual }];
        for (const effect of table.effects) {
          const expected = reference.effects.find((e) => sameTerm(e.term, effect.term))!;
          expect(effect.df1, `df of ${effect.term.join('x')}`).toBe(expected.df);
          comparisons.push(
            { label: `SS ${effect.term.join('x')}`, computed: effect.ss, reference: expected.ss },
            { label: `F ${effect.term.join('x')}`, computed: effect.f, reference: expected.f },
            { label: `p ${effect.term.join('x')}`, computed: effect.p, reference: expected.p },
          );
        }
        expect(relativeFailures(comparisons, 1e-8)).toEqual([]);
      });
    }
  }
});

describe('the interval from the rounded (printed) cell statistics', () => {
  for (const c of fixture.cases) {
    for (const type of TYPES) {
      it(`${c.label}, type ${type}: holds statsmodels' F and p, and not an F 20% off`, () => {
        const range = factorialAnovaRange(c.levels.length, printedBoxes(c), type)!;
        const reference = c.anova[String(type) as '1' | '2' | '3'];
        expect(range.effects.every((e) => e.highIsExact)).toBe(c.cells.length <= MAX_VERTEX_CELLS);
        for (const effect of range.effects) {
          const expected = reference.effects.find((e) => sameTerm(e.term, effect.term))!;
          const where = `${c.label} type ${type} term ${effect.term.join('x')}: F range [${effect.f.low}, ${effect.f.high}]`;
          expect(effect.f.low, where).toBeLessThanOrEqual(expected.f);
          expect(effect.f.high, where).toBeGreaterThanOrEqual(expected.f);
          expect(effect.p.low, where).toBeLessThanOrEqual(expected.p);
          expect(effect.p.high, where).toBeGreaterThanOrEqual(expected.p);
          const eta = expected.ss / (expected.ss + reference.ssResidual);
          expect(effect.partialEtaSquared.low, where).toBeLessThanOrEqual(eta);
          expect(effect.partialEtaSquared.high, where).toBeGreaterThanOrEqual(eta);
          expect(expected.f * 1.2, where).toBeGreaterThan(effect.f.high);
          expect(expected.f / 1.2, where).toBeLessThan(effect.f.low);
        }
      });
    }
  }
});

describe('the interval: extremes checked against points of the box', () => {
  /** A seeded linear congruential generator, so the sampled points are the same on every run. */
  function seeded(seed: number): () => number {
    let state = seed;
    return () => {
      state = (state * 1103515245 + 12345) % 2147483648;
      return state / 2147483648;
    };
  }

  it('no vertex or inner point goes beyond the range; the largest vertex is its upper end; its lower end is at most the smallest point', () => {
    // A deliberately wide box (half-width 0.5 on means near each other) so the minimum is inside the box, not at a vertex.
    const random = seeded(7);
    const cells: FactorialCellBox[] = [];
    for (const a of ['a1', 'a2']) for (const b of ['b1', 'b2', 'b3']) {
      const mean = 10 + random();
      cells.push({ levels: [a, b], mean: { low: mean - 0.5, high: mean + 0.5 }, sd: { low: 2, high: 2 }, n: 5 + Math.floor(random() * 20) });
    }
    for (const type of TYPES) {
      const range = factorialAnovaRange(2, cells, type)!;
      const largest = range.effects.map(() => 0);
      const smallest = range.effects.map(() => Infinity);
      const at = (pick: (cell: FactorialCellBox, i: number) => number) => {
        const table = factorialAnovaFromCells(2, cells.map((cell, i) => ({ levels: cell.levels, mean: pick(cell, i), sd: 2, n: cell.n })), type)!;
        table.effects.forEach((effect, t) => {
          expect(effect.ss).toBeLessThanOrEqual(range.effects[t]!.ss.high * (1 + 1e-12));
          expect(effect.ss).toBeGreaterThanOrEqual(range.effects[t]!.ss.low * (1 - 1e-12) - 1e-12);
          largest[t] = Math.max(largest[t]!, effect.ss);
          smallest[t] = Math.min(smallest[t]!, effect.ss);
        });
      };
      for (let mask = 0; mask < 1 << cells.length; mask++) at((cell, i) => ((mask >> i) & 1 ? cell.mean.high : cell.mean.low));
      for (let draw = 0; draw < 3000; draw++) at((cell) => cell.mean.low + random() * (cell.mean.high - cell.mean.low));
      range.effects.forEach((effect, t) => {
        expect(largest[t]).toBeCloseTo(effect.ss.high, 9); // the maximum is a vertex, and every vertex was visited
        expect(effect.ss.low).toBeLessThanOrEqual(smallest[t]!);
      });
      // With boxes this wide and overlapping, every term can be made to vanish.
      for (const effect of range.effects) expect(effect.ss.low).toBeLessThan(1e-6);
    }
  });
});

describe('layout and validation', () => {
  it('orders terms by degree, as statsmodels and R order A * B * C', () => {
    expect(factorialTerms(3)).toEqual([[0], [1], [2], [0, 1], [0, 2], [1, 2], [0, 1, 2]]);
  });

  it('names a missing cell, a cell given twice, a bad n and a single level', () => {
    const cell = (a: string, b: string, n = 10) => ({ levels: [a, b], n });
    expect(arrangeCells(2, [cell('a1', 'b1'), cell('a1', 'b2'), cell('a2', 'b1')])).toEqual({ ok: false, reason: expect.stringContaining('a2 / b2 is missing') });
    expect(arrangeCells(2, [cell('a1', 'b1'), cell('a1', 'b1'), cell('a2', 'b1'), cell('a2', 'b2')])).toEqual({ ok: false, reason: expect.stringContaining('a1 / b1 is given twice') });
    expect(arrangeCells(2, [cell('a1', 'b1', 2.5), cell('a1', 'b2'), cell('a2', 'b1'), cell('a2', 'b2')])).toEqual({ ok: false, reason: expect.stringContaining('n = 2.5') });
    expect(arrangeCells(2, [cell('a1', 'b1'), cell('a2', 'b1')])).toEqual({ ok: false, reason: expect.stringContaining('factor 2 has 1 level') });
    expect(factorialAnovaFromCells(2, [cell('a1', 'b1'), cell('a1', 'b2'), cell('a2', 'b1'), cell('a2', 'b2')].map((c) => ({ ...c, mean: 1, sd: -1 })), 3)).toBeNull();
  });

  it('a balanced 2 x 2 by hand: every type gives the textbook SS', () => {
    // Equal n = 10, means 1, 2 (a1) and 3, 6 (a2), SD 1: grand mean 3; SS_A = 20 * (1.5^2 + 1.5^2) = 90,
    // SS_B = 20 * (1^2 + 1^2) = 40, SS_AB = 10 * 4 * 0.5^2 = 10 (interaction contrast (1 - 2 - 3 + 6)/4 = 0.5).
    const cells = [
      { levels: ['a1', 'b1'], mean: 1, sd: 1, n: 10 },
      { levels: ['a1', 'b2'], mean: 2, sd: 1, n: 10 },
      { levels: ['a2', 'b1'], mean: 3, sd: 1, n: 10 },
      { levels: ['a2', 'b2'], mean: 6, sd: 1, n: 10 },
    ];
    for (const type of TYPES) {
      const table = factorialAnovaFromCells(2, cells, type)!;
      expect(table.effects.map((e) => e.ss)).toEqual([expect.closeTo(90, 10), expect.closeTo(40, 10), expect.closeTo(10, 10)]);
      expect(table.dfWithin).toBe(36);
      expect(table.effects[2]!.f).toBeCloseTo(10 / (36 / 36), 10);
    }
  });
});
