/**
 * The built command line (`node dist/src/cli/main.js scan <file> --format
 * json`) on a manuscript printing group statistics with Welch's and
 * Brown-Forsythe's F. The groups and the true F and df come from
 * tests/fixtures/stats/welch_brown_forsythe.json (statsmodels 0.13.5
 * anova_oneway, use_var "unequal" and "bf", on simulated data; generator
 * gen_welch_brown_forsythe.py beside it).
 */
import { describe, expect, it } from 'vitest';
import { loadFixture } from '../stats/referenceFixtures.js';
import { scanTextJson } from './scanDocumentJson.js';

interface Case { label: string; groups: Array<{ printedMean: number; printedSd: number; n: number }>; welch: { f: number; df2: number }; brownForsythe: { f: number; df2: number } }
const unequal = loadFixture<{ cases: Case[] }>('stats/welch_brown_forsythe.json').cases.find((c) => c.label === '4 groups, one wide group')!;
const groups = unequal.groups.map((g) => `(M = ${g.printedMean.toFixed(2)}, SD = ${g.printedSd.toFixed(2)}, n = ${g.n})`).join(', ');

describe('plumbline scan: Welch and Brown-Forsythe F checked against the group statistics printed with them', () => {
  it("passes the right F and df, and warns of Welch's df printed with Brown-Forsythe's F", () => {
    const text = [
      `Scores differed across the four sites ${groups}, Welch's F(3, ${unequal.welch.df2.toFixed(2)}) = ${unequal.welch.f.toFixed(2)}, p = .002.`,
      '',
      `In the replication the sites differed again ${groups}, Brown-Forsythe F(3, ${unequal.welch.df2.toFixed(2)}) = ${unequal.brownForsythe.f.toFixed(2)}, p < .001.`,
    ].join('\n');
    const document = scanTextJson(text);
    expect(document.statistics).toHaveLength(2);
    const flagsOf = (i: number) => document.statistics[i]!.findings.filter((f) => f.rule === 'group-statistics-test-mismatch');
    expect(flagsOf(0)).toEqual([]);
    const [finding] = flagsOf(1);
    expect(finding).toMatchObject({ severity: 'warn' });
    expect(finding!.message).toContain(`as Brown-Forsythe's test, but its error df ${unequal.welch.df2.toFixed(2)} does not: the SDs and sizes give df = ${unequal.brownForsythe.df2.toFixed(2)}`);
  });
});
