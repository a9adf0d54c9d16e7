import { describe, expect, it } from 'vitest';
import { findTextTables, readTableResults } from '../../../src/scan/tables/index.js';
import type { Finding } from '../../../src/checks/types.js';
import { findingsOf, result } from '../helpers.js';

// Definitions of the columns of an ANOVA summary table (MS = SS/df, F = MS/MS_error,
// partial eta squared = SS/(SS + SS_error)); Maxwell, Delaney & Kelley (2018), cited from memory.
// The tables are invented; the arithmetic in the comments was done by hand.
const rule = 'table-arithmetic';

/** Findings of this rule for every table row of `lines`, keyed by row label. */
function tableFindings(lines: string[]): Record<string, Finding[]> {
  const text = lines.join('\n');
  const results = readTableResults(text, findTextTables(text));
  const findings = findingsOf(rule, results, undefined, text);
  return Object.fromEntries(results.map((r, i) => [r.tableRow!.rowLabel, findings[i]!]));
}

const header = 'Table 2. Analysis of variance for recall\nSource | SS | df | MS | F | p | ηp2';

describe(`${rule}: must pass`, () => {
  it('a consistent table (12.40/2 = 6.20; 83.95/57 = 1.4728; 6.20/1.47 = 4.22 within rounding; 12.40/96.35 = .129)', () => {
    const findings = tableFindings([header, 'Condition | 12.40 | 2 | 6.20 | 4.21 | .020 | .13', 'Error | 83.95 | 57 | 1.47 | | |']);
    expect(findings).toEqual({ Condition: [] });
  });

  it('the demo mixed table, where rounding of every cell matters (566.27/2 = 283.135 prints as 283.14)', () => {
    const findings = tableFindings([
      'Source | SS | df | MS | F | p | ηp2',
      'Group | 871.82 | 1 | 871.82 | 4.83 | .031 | .06',
      'Error (between) | 12815.50 | 71 | 180.50 | | |',
      'Session | 566.27 | 2 | 283.14 | 12.64 | < .001 | .15',
      'Session × Group | 152.77 | 2 | 76.38 | 3.41 | .036 | .05',
      'Error (within) | 3180.80 | 142 | 22.40 | | |',
    ]);
    expect(Object.values(findings).flat()).toEqual([]);
  });

  it('a table with F computed from SS and df when MS is not printed (F = (20/1)/(190/95) = 10.0)', () => {
    const findings = tableFindings(['Source | SS | df | F | p', 'Dose | 20.0 | 1 | 10.0 | .002', 'Error | 190.0 | 95 | |']);
    expect(findings).toEqual({ Dose: [] });
  });

  it('results from running text, which have no table row', () => {
    const findings = findingsOf(rule, [result({ kind: 'F', df: ['2', '57'], value: '4.21', p: '= .020' })]);
    expect(findings).toEqual([[]]);
  });

  it('an MS whose last decimal 0 is padding (1.85 / 7 = 0.264 printed 0.260, as 0.26 to three places)', () => {
    const findings = tableFindings([header, 'Condition | 14.6 | 2 | 7.29 | 27.6 | .0005 | .89', 'Error | 1.85 | 7 | 0.260 | | |']);
    expect(findings).toEqual({ Condition: [] });
  });

  it('a table without SS or MS has nothing to check', () => {
    expect(tableFindings(['Source | df | F | p', 'Dose | 1 | 10.0 | .002', 'Error | 95 | |'])).toEqual({ Dose: [] });
  });
});

describe(`${rule}: must flag`, () => {
  it('an effect MS that is not SS / df, naming table, row and cells', () => {
    const { Condition } = tableFindings([header, 'Condition | 12.40 | 2 | 6.80 | 4.21 | .020 | .13', 'Error | 83.95 | 57 | 1.47 | | |']);
    // F = 6.80/1.47 = 4.63 is off too, but F agrees with SS / df = 6.20: one mistyped cell, one finding.
    expect(Condition).toHaveLength(1);
    expect(Condition![0]).toMatchObject({ rule, severity: 'fail', messageId: 'msMismatch' });
    expect(Condition![0]!.message).toBe("In Table 2, row 'Condition': MS = 6.80 but SS / df = 12.40 / 2 = 6.20 (6.1975 to 6.2025 allowing for rounding).");
  });

  it('an F that is not MS / MS error (6.20 / 1.47 = 4.22, printed 2.41)', () => {
    const { Condition } = tableFindings([header, 'Condition | 12.40 | 2 | 6.20 | 2.41 | .099 | .13', 'Error | 83.95 | 57 | 1.47 | | |']);
    expect(Condition!.map((f) => f.messageId)).toEqual(['fMismatch']);
    expect(Condition![0]!.message).toContain("In Table 2, row 'Condition': F = 2.41 but MS / MS of 'Error' = 6.20 / 1.47 = 4.22");
    expect(Condition![0]!.crossesAlpha).toBe(true); // printed p = .099 vs F = 4.22 with p about .02
  });

  it('a partial eta squared that is not SS / (SS + SS error) (12.40 / 96.35 = .129, printed .31)', () => {
    const { Condition } = tableFindings([header, 'Condition | 12.40 | 2 | 6.20 | 4.21 | .020 | .31', 'Error | 83.95 | 57 | 1.47 | | |']);
    expect(Condition!.map((f) => f.messageId)).toEqual(['partialEtaMismatch']);
    expect(Condition![0]!.message).toContain("In Table 2, row 'Condition': partial eta squared = .31 but SS / (SS + SS of 'Error') = 12.40 / (12.40 + 83.95) = .13");
  });

  it('an error row MS that is not SS / df, reported once, with the first effect tested against it', () => {
    const findings = tableFindings([
      'Table 4',
      'Source | SS | df | MS | F | p',
      'Cue | 40.00 | 1 | 40.00 | 10.00 | .003',
      'Tone | 8.00 | 1 | 8.00 | 2.00 | .165',
      'Error | 160.00 | 40 | 5.00 | |',
    ]);
    // 160/40 = 4.00, not 5.00; F = 40/4 = 10 agrees with the SS-based MS but not with 40/5 = 8.
    expect(findings.Cue!.map((f) => f.message)).toContain("In Table 4, row 'Error': MS = 5.00 but SS / df = 160.00 / 40 = 4.00 (3.9999 to 4.0001 allowing for rounding).");
    expect(findings.Tone!.filter((f) => f.message.includes("row 'Error'"))).toEqual([]);
  });

  it('a near miss (F 6.253 where 82.840 / 13.2506 = 6.2518: off by 0.02%, p on the same side) is a warning, not a failure', () => {
    // 516.772 / 39 = 13.2506 (hand arithmetic); the printed F differs in its third decimal only.
    const findings = tableFindings(['Source | SS | df | MS | F | p', 'Method | 82.840 | 1 | 82.840 | 6.253 | .017', 'Error | 516.772 | 39 | 13.2506 | |']);
    expect(findings.Method!.map((f) => [f.messageId, f.severity])).toEqual([['fMismatch', 'warn']]);
  });

  it('an F off by 1% is still a failure (82.840 / 13.2506 = 6.252, printed 6.32)', () => {
    const findings = tableFindings(['Source | SS | df | MS | F | p', 'Method | 82.840 | 1 | 82.840 | 6.32 | .016', 'Error | 516.772 | 39 | 13.2506 | |']);
    expect(findings.Method!.map((f) => [f.messageId, f.severity])).toEqual([['fMismatch', 'fail']]);
  });

  it('names an untitled table by its position', () => {
    const findings = tableFindings(['Source | SS | df | MS | F | p', 'Cue | 40.00 | 1 | 20.00 | 5.00 | .031', 'Error | 160.00 | 40 | 4.00 | |']);
    expect(findings.Cue![0]!.message).toMatch(/^In table 1, row 'Cue': MS = 20\.00 but SS \/ df = 40\.00 \/ 1 = 40\.00/);
  });
});

describe(`${rule}: what the row's own numbers imply`, () => {
  // F from the row's SS and df: (12.40 / 2) / (83.95 / 57) = 6.2 / 1.472807 = 4.20965; its p with df 2 and 57
  // from jStat's F distribution, an implementation independent of plumbline's.
  const ownF = 12.4 / 2 / (83.95 / 57);

  it('an F that is not MS / MS error carries the F and p its SS and df imply, with their rounding intervals', async () => {
    const { default: jStat } = (await import('jstat')) as unknown as { default: { centralF: { cdf: (x: number, a: number, b: number) => number } } };
    const { Condition } = tableFindings([header, 'Condition | 12.40 | 2 | 6.20 | 2.41 | .099 | .13', 'Error | 83.95 | 57 | 1.47 | | |']);
    const implied = Condition![0]!.rowImplies!;
    expect(implied.from).toBe("SS / df over SS / df of 'Error'");
    expect(implied.statistic).toBeCloseTo(ownF, 10);
    // Every SS between 12.395 and 12.405 and every error SS between 83.945 and 83.955.
    expect(implied.statisticLow).toBeCloseTo(12.395 / 2 / (83.955 / 57), 10);
    expect(implied.statisticHigh).toBeCloseTo(12.405 / 2 / (83.945 / 57), 10);
    expect(implied.p).toBeCloseTo(1 - jStat.centralF.cdf(ownF, 2, 57), 8);
    expect(implied.pLow!).toBeLessThan(implied.p!);
    expect(implied.pHigh!).toBeGreaterThan(implied.p!);
    expect(implied.p!).toBeLessThan(0.05); // while the printed F's p is about .099
  });

  it('an effect MS that is not SS / df carries the F its SS and df imply; a row that adds up carries nothing', () => {
    const { Condition } = tableFindings([header, 'Condition | 12.40 | 2 | 6.80 | 4.21 | .020 | .13', 'Error | 83.95 | 57 | 1.47 | | |']);
    expect(Condition![0]!.rowImplies!.statistic).toBeCloseTo(ownF, 10);
    const consistent = tableFindings([header, 'Condition | 12.40 | 2 | 6.20 | 4.21 | .020 | .13', 'Error | 83.95 | 57 | 1.47 | | |']);
    expect(consistent.Condition).toEqual([]);
  });

  it('uses the printed MS where a row prints no SS', () => {
    const { Condition } = tableFindings(['Table 3. ANOVA\nSource | df | MS | F | p', 'Condition | 2 | 6.20 | 2.41 | .099', 'Error | 57 | 1.47 | |']);
    expect(Condition!.map((f) => f.messageId)).toEqual(['fMismatch']);
    expect(Condition![0]!.rowImplies).toMatchObject({ from: "MS over MS of 'Error'" });
    expect(Condition![0]!.rowImplies!.statistic).toBeCloseTo(6.2 / 1.47, 10);
  });
});
