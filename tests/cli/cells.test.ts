import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { builtCliExists, plumbline, temporaryFolder } from '../batch/cli.js';
import { loadFixture } from '../stats/referenceFixtures.js';

/** `plumbline cells` run as a user runs it (the built command; `npm test` builds first). */

interface CellsJson {
  equalNAssumed: { n: number; from: string } | null;
  tables: Array<{ type: number; effects: Array<{ effect: string; f: number; range: { f: { low: number; high: number } } }> }>;
  reported: Array<{ effect: string; reproducedBy: number[]; verdict: string; unmatched: string[]; severity: string | null }>;
}

const folder = temporaryFolder('cells');
const write = (name: string, text: string): string => {
  writeFileSync(join(folder, name), text);
  return name;
};

// An invented study: a reminder (none, text) by its timing (morning, evening), minutes of practice, unequal ns.
const invented = write(
  'reminders.csv',
  ['# invented example', 'reminder,timing,n,mean,sd', 'none,morning,18,21.40,6.12', 'none,evening,25,19.85,5.73', 'text,morning,22,27.90,6.48', 'text,evening,15,22.10,5.95', ''].join('\n'),
);

describe('plumbline cells', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  it('an invented unbalanced 2 x 2: names the type that reproduces each reported F, and flags one no type gives', () => {
    const run = plumbline(
      [
        'cells', invented, '--format', 'json',
        // F at the printed cells: type I 13.755, type III 9.999; timing 6.460 (I, II) and 7.055 (III); interaction 2.359.
        '--reported', 'reminder: F(1, 76) = 10.00, p = .002',
        '--reported', 'timing: F(1, 76) = 6.46, p = .013, pes = .08',
        '--reported', 'reminder x timing: F(1, 76) = 2.36, p = .129',
        '--reported', 'reminder: F(1, 76) = 12.00',
      ],
      folder,
    );
    expect(run.stderr).toBe('');
    expect(run.status).toBe(1);
    const output = JSON.parse(run.stdout) as CellsJson;
    expect(output.equalNAssumed).toBeNull();
    expect(output.reported.map((check) => [check.effect, check.reproducedBy, check.verdict])).toEqual([
      ['reminder', [3], 'reproduced'],
      ['timing', [1, 2], 'reproduced'],
      ['reminder × timing', [1, 2, 3], 'reproduced'],
      ['reminder', [], 'not reproduced'],
    ]);
    expect(output.reported[3]!.unmatched).toEqual(['F']);
    expect(output.reported[3]!.severity).toBe('fail');
  });

  it('the text output says which type, and the equal ns it assumed when the file gives none (a warning, exit 0)', () => {
    const text = plumbline(['cells', invented, '--reported', 'reminder: F(1, 76) = 10.00, p = .002'], folder);
    expect(text.status).toBe(0);
    expect(text.stdout).toContain('Type III (sum-to-zero coding)');
    expect(text.stdout).toContain('reproduced by type III only');
    const withoutN = write('without-n.csv', 'reminder,timing,mean,sd\nnone,morning,21.40,6.12\nnone,evening,19.85,5.73\ntext,morning,27.90,6.48\ntext,evening,22.10,5.95\n');
    const run = plumbline(['cells', withoutN, '--reported', 'reminder: F(1, 76) = 13.00'], folder);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('equal ns of 20 per cell are assumed (from the reported error df)');
    expect(run.stdout).toContain('WARN: not reproduced by any type');
  });

  it('bad input: the file, the line and what is wrong, exit 2', () => {
    const bad = write('bad.csv', 'reminder,timing,n,mean,sd\nnone,morning,18,21.40,6.12\nnone,evening,25,19.8x,5.73\n');
    const badRun = plumbline(['cells', bad], folder);
    expect(badRun.status).toBe(2);
    expect(badRun.stderr).toContain('bad.csv, line 3, column "mean": "19.8x" is not a number');
    const missing = write('missing.csv', 'reminder,timing,n,mean,sd\nnone,morning,18,21.40,6.12\nnone,evening,25,19.85,5.73\ntext,morning,22,27.90,6.48\n');
    expect(plumbline(['cells', missing], folder).stderr).toContain('missing.csv: the cell text / evening is missing');
    const ragged = write('ragged.csv', 'reminder,timing,n,mean,sd\nnone,morning,18,21.40\n');
    expect(plumbline(['cells', ragged], folder).stderr).toContain('ragged.csv, line 2: 4 fields, but the header has 5 columns');
    const json = write('cells.json', '{"factors": ["a", "b"],\n "cells": [\n  {"a": "x", "b": "y", "n": 3, "mean": "1.0",}\n]}\n');
    expect(plumbline(['cells', json], folder).stderr).toMatch(/cells\.json, line 3, column \d+: not valid JSON/);
    const unknownEffect = plumbline(['cells', invented, '--reported', 'dose: F(1, 76) = 3.00'], folder);
    expect(unknownEffect.status).toBe(2);
    expect(unknownEffect.stderr).toContain('"dose" is not an effect of the design (factors: reminder, timing)');
  });
});

interface FixtureCase {
  label: string;
  factors: string[];
  cells: Array<{ levels: string[]; n: number; meanRounded: number; sdRounded: number }>;
  anova: Record<string, { effects: Array<{ term: number[]; f: number; p: number; df: number }>; dfResidual: number }>;
}

describe('plumbline cells on a statsmodels fixture case (gen_factorial_cells.py)', () => {
  // statsmodels 0.13.5 anova_lm on the raw data; the command sees only the 2-decimal cell statistics.
  const fixture = loadFixture<{ cases: FixtureCase[] }>('stats/factorial_cells.json');
  const unbalanced = fixture.cases.find((c) => c.label === '2x2x2 unbalanced')!;
  const json = write(
    'fixture.json',
    JSON.stringify({
      factors: unbalanced.factors,
      cells: unbalanced.cells.map((cell) => ({
        ...Object.fromEntries(unbalanced.factors.map((name, f) => [name, cell.levels[f]])),
        n: cell.n,
        mean: cell.meanRounded.toFixed(2),
        sd: cell.sdRounded.toFixed(2),
      })),
    }),
  );
  const reportedOf = (type: string, scale = 1) =>
    unbalanced.anova[type]!.effects.flatMap((effect) => [
      '--reported',
      `${effect.term.map((f) => unbalanced.factors[f]).join(' x ')}: F(${effect.df}, ${unbalanced.anova[type]!.dfResidual}) = ${(effect.f * scale).toFixed(2)}`,
    ]);

  for (const type of ['1', '2', '3']) {
    it(`every statsmodels type ${type} F, printed to 2 decimals, is reproduced by type ${type}`, () => {
      const run = plumbline(['cells', json, '--format', 'json', ...reportedOf(type)], folder);
      expect(run.stderr).toBe('');
      expect(run.status).toBe(0);
      const output = JSON.parse(run.stdout) as CellsJson;
      expect(output.reported).toHaveLength(7);
      for (const check of output.reported) expect(check.reproducedBy, check.effect).toContain(Number(type));
    });
  }

  it('the same Fs 20% larger are not reproduced by any type (exit 1)', () => {
    const run = plumbline(['cells', json, '--format', 'json', ...reportedOf('3', 1.2)], folder);
    expect(run.status).toBe(1);
    const output = JSON.parse(run.stdout) as CellsJson;
    expect(output.reported.every((check) => check.verdict === 'not reproduced')).toBe(true);
  });

  it('in this unbalanced design the type I F of A is reproduced by type I only', () => {
    const run = plumbline(['cells', json, '--format', 'json', ...reportedOf('1').slice(0, 2)], folder);
    expect((JSON.parse(run.stdout) as CellsJson).reported[0]!.reproducedBy).toEqual([1]);
  });
});
