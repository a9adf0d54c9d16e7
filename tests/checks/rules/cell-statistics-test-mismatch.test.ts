import { describe, expect, it } from 'vitest';
import { ruleFindings } from './descriptivesHelper.js';
import { loadFixture } from '../../stats/referenceFixtures.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';

const rule = 'cell-statistics-test-mismatch';

interface FixtureCell {
  levels: string[];
  n: number;
  meanRounded: number;
  sdRounded: number;
}
interface FixtureEffect {
  term: number[];
  df: number;
  f: number;
  p: number;
}
interface FixtureCase {
  label: string;
  levels: number[];
  balanced: boolean;
  cells: FixtureCell[];
  anova: Record<'1' | '2' | '3', { effects: FixtureEffect[]; dfResidual: number }>;
}

// statsmodels 0.13.5 anova_lm (typ 1, 2, 3; C(., Sum) coding) on simulated raw data, with the cell statistics
// rounded to 2 decimals as a paper prints them: tests/fixtures/stats/gen_factorial_cells.py.
const fixture = loadFixture<{ cases: FixtureCase[] }>('stats/factorial_cells.json');
const NAMES = ['Dose', 'Timing', 'Setting'];
const TYPES = ['1', '2', '3'] as const;

function printedP(p: number): string {
  return p < 0.001 ? 'p < .001' : `p = ${p.toFixed(3).replace(/^0/, '')}`;
}

/** The cells as a long-format table (ns printed), as a manuscript prints them. */
function cellTable(c: FixtureCase): string {
  const factors = c.levels.map((_, f) => NAMES[f]!);
  const lines = ['Table 1', 'Scores by condition', '', `| ${factors.join(' | ')} | n | M | SD |`, `|${' --- |'.repeat(factors.length + 3)}`];
  for (const cell of c.cells) lines.push(`| ${cell.levels.join(' | ')} | ${cell.n} | ${cell.meanRounded.toFixed(2)} | ${cell.sdRounded.toFixed(2)} |`);
  return lines.join('\n');
}

/** Each effect written in a sentence of its own, with F (2 decimals) and p (3 decimals) as `fOf` gives them. */
function writtenEffects(c: FixtureCase, type: (typeof TYPES)[number], fOf: (effect: FixtureEffect) => number = (e) => e.f): string {
  const table = c.anova[type];
  return table.effects
    .map((effect) => {
      const name = effect.term.map((f) => NAMES[f]!).join(' × ');
      const words = effect.term.length === 1 ? `There was a main effect of ${name}` : `The ${name} interaction was tested`;
      return `${words}, F(${effect.df}, ${table.dfResidual}) = ${fOf(effect).toFixed(2)}, ${printedP(effect.p)}.`;
    })
    .join(' ');
}

function manuscript(c: FixtureCase, type: (typeof TYPES)[number], fOf?: (effect: FixtureEffect) => number): string {
  return `${cellTable(c)}\n\nScores (Table 1) were analysed in a between-subjects ANOVA. ${writtenEffects(c, type, fOf)}\n`;
}

describe(`${rule}: must pass — every F statsmodels gives, under each type, from cells rounded as printed`, () => {
  for (const c of fixture.cases) {
    for (const type of TYPES) {
      it(`${c.label}, type ${type}`, () => {
        const text = manuscript(c, type);
        // Every F is linked to the cells, to the effect it names (so the pass below is a real comparison).
        const scanned = scanDocument({ text, tables: [], regions: [] }).results;
        expect(scanned.map((result) => result.factorial?.term)).toEqual(c.anova[type].effects.map((effect) => effect.term));
        const checked = ruleFindings(rule, text);
        expect(checked).toHaveLength(c.anova[type].effects.length);
        for (const { result, findings } of checked) {
          // Nothing above a note; and every result is linked (a note or nothing, never unexamined: see the flag test below).
          expect(findings.filter((finding) => finding.severity !== 'note'), result).toEqual([]);
        }
      });
    }
  }
});

/**
 * The F of an effect 20% off: up, or down when 20% up would land near the F of another type (in an unbalanced
 * design the types differ, and an F that another type gives is that type's, not a slip).
 */
function offByTwentyPercent(c: FixtureCase, effect: FixtureEffect): number {
  const sameTerm = (other: FixtureEffect) => other.term.join() === effect.term.join();
  const others = TYPES.map((type) => c.anova[type].effects.find(sameTerm)!.f);
  const up = effect.f * 1.2;
  return others.some((f) => Math.abs(up - f) < 0.1 * f) ? effect.f / 1.2 : up;
}

describe(`${rule}: must flag — an F 20% off, under each type`, () => {
  for (const c of fixture.cases) {
    for (const type of TYPES) {
      it(`${c.label}, type ${type}: every effect flagged, as a fail (ns printed)`, () => {
        const checked = ruleFindings(rule, manuscript(c, type, (effect) => offByTwentyPercent(c, effect)));
        for (const { result, findings } of checked) {
          expect(findings, result).toHaveLength(1);
          expect(findings[0]).toMatchObject({ rule, severity: 'fail', messageId: 'mismatch' });
          expect(findings[0]!.message).toContain('the printed F fits no type');
        }
      });
    }
  }
});

describe(`${rule}: the type named when only one reproduces the F`, () => {
  const c = fixture.cases.find((candidate) => candidate.label === '2x3 unbalanced')!;
  // statsmodels: the main effect of A is F = 6.930 (type I), 3.702 (II), 6.715 (III); B 10.436 (I, II), 8.161 (III).
  it('type II main effect of Dose: only type II gives it', () => {
    const [dose] = ruleFindings(rule, manuscript(c, '2'));
    expect(dose!.findings).toHaveLength(1);
    expect(dose!.findings[0]).toMatchObject({ severity: 'note', messageId: 'single-type' });
    expect(dose!.findings[0]!.message).toContain('under type II sums of squares only');
  });
  it('type I and II main effect of Timing: two types give it, no note', () => {
    const [, timing] = ruleFindings(rule, manuscript(c, '1'));
    expect(timing!.findings).toEqual([]);
  });
  it('the note can be turned off', () => {
    const [dose] = ruleFindings(rule, manuscript(c, '2'), { rules: { [rule]: { options: { nameSingleType: false } } } });
    expect(dose!.findings).toEqual([]);
  });
});

describe(`${rule}: partial eta squared and p`, () => {
  // An invented balanced 2 x 2, 20 per cell. By hand (common practice, balanced two-way ANOVA): grand mean 3.765,
  // MSE = mean of the SDs squared = 1.3757; SS age = 40 x 2 x 0.24^2 = 4.608, F = 3.35; SS load = 40 x 2 x 0.315^2 = 7.938,
  // F = 5.77; SS interaction = 20 x 4 x 0.11^2 = 0.968, F = 0.70 (p from scipy.stats.f.sf, SciPy 1.10.1: .071, .019, .404),
  // so partial eta squared of the interaction is about .009, never .50.
  const cells = ['Table 1', 'Recall, M (SD)', '', '| Age | Low load | High load |', '| --- | --- | --- |', '| Younger | 4.21 (1.10) | 3.80 (1.25) |', '| Older | 3.95 (1.02) | 3.10 (1.30) |', '', 'Note. n = 20 per cell.'].join('\n');
  it('flags a partial eta squared that no type gives when F and p do fit', () => {
    const text = `${cells}\n\nRecall (Table 1): there was a main effect of age, F(1, 76) = 3.35, p = .071, and of load, F(1, 76) = 5.77, p = .019. The interaction of age and load was not significant, F(1, 76) = 0.70, p = .404, ηp² = .50.\n`;
    const found = ruleFindings(rule, text);
    expect(found.map((entry) => entry.findings.map((finding) => finding.messageId))).toEqual([[], [], ['mismatch']]);
    expect(found[2]!.findings[0]!.message).toContain('the printed partial eta squared fits no type');
  });
});

describe(`${rule}: ns not printed`, () => {
  const cells = ['Table 1', 'Recall, M (SD)', '', '| Age | Low load | High load |', '| --- | --- | --- |', '| Younger | 4.21 (1.10) | 3.80 (1.25) |', '| Older | 3.95 (1.02) | 3.10 (1.30) |'].join('\n');
  it('equal ns are worked out from the error df, said so, and a miss is at most a warning', () => {
    const text = `${cells}\n\nRecall (Table 1): there was a main effect of age, F(1, 76) = 3.35, p = .071, and of load, F(1, 76) = 9.00, p = .004.\n`;
    const [age, load] = ruleFindings(rule, text);
    expect(age!.findings).toEqual([]);
    expect(load!.findings).toHaveLength(1);
    expect(load!.findings[0]).toMatchObject({ severity: 'warn' });
    expect(load!.findings[0]!.message).toContain('equal ns of 20 per cell are assumed from the error df');
  });
});
