/**
 * The built command on context that real documents give: a study's N for a
 * correlation without df, adjusted p-values, paired t tests, and scoped
 * sample sizes. `npm test` builds first; running vitest alone needs
 * `npm run build`.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { StatisticOutput } from '../../src/report/model.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

const bin = join('dist', 'src', 'cli', 'main.js');

function check(text: string): { status: number | null; statistics: StatisticOutput[] } {
  expect(existsSync(bin), `${bin} missing: run npm run build`).toBe(true);
  const run = spawnSync('node', [bin, 'check', text, '--format', 'json'], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
  const report = readJsonReport(run.stdout);
  return { status: run.status, statistics: report.documents[0]!.statistics };
}

describe('plumbline check --format json: context from the rest of the document', () => {
  it('1. a correlation without df is checked with df = N - 2 from the study N, marked in the JSON, at most a warning', () => {
    // r = .30 with df = 212: p = 7.96e-6 (SciPy 1.10.1, 2 * scipy.stats.t.sf(r * sqrt(df / (1 - r^2)), df)).
    const { status, statistics } = check('We recruited 214 participants. Liking correlated with age, r = .30, p = .004.');
    const [r] = statistics;
    expect(r).toMatchObject({ kind: 'r', df: [212], dfFrom: 'study-sample-size' });
    expect(r!.recomputed.p).toBeCloseTo(7.96e-6, 7);
    expect(r!.findings).toMatchObject([{ rule: 'p-value-mismatch', severity: 'warn' }]);
    expect(r!.findings[0]!.message).toContain('N = 214 the document states for the study');
    expect(status).toBe(0); // nothing at fail
  });

  it('1a. a study "conducted online among 387 cyberspace users" states its N, whatever words name the people', () => {
    // r = .23 with df = 385: p = 4.8e-6 (SciPy 1.10.1, 2 * scipy.stats.t.sf(r * sqrt(df / (1 - r^2)), df)), under .001 as printed.
    const { statistics } = check('This descriptive study was conducted online among 387 Iranian cyberspace users. Attitude correlated with practice (r = 0.23, p <0.001).');
    expect(statistics[0]).toMatchObject({ kind: 'r', df: [385], dfFrom: 'study-sample-size' });
    expect(statistics[0]!.findings).toEqual([]);
    // A study conducted in a year or on a number of days names no sample.
    expect(check('The study was conducted in 2019 over 30 days. Attitude correlated with practice (r = 0.23, p <0.001).').statistics[0]!.df).toEqual([]);
  });

  it('1b. a count in words that is the tail of a larger one ("One hundred and twenty participants") is not taken for the study N', () => {
    const { statistics } = check('One hundred and twenty participants took part. Liking correlated with age, r = .30, p = .004.');
    expect(statistics).toHaveLength(1);
    expect(statistics[0]!.df).toEqual([]);
    expect(statistics[0]!.dfFrom).toBeUndefined();
    // The same sentence with the count alone ("Twenty participants") gives df = 18.
    expect(check('Twenty participants took part. Liking correlated with age, r = .30, p = .004.').statistics[0]).toMatchObject({ df: [18], dfFrom: 'study-sample-size' });
  });

  it('2. an adjusted p larger than the unadjusted one is a note saying why, not a mismatch', () => {
    // t(28) = 2.10: p = .0449 (SciPy 1.10.1, 2 * scipy.stats.t.sf); the printed Tukey p is .135.
    const { status, statistics } = check('Pairwise comparisons were Tukey-corrected. Group A scored higher than group B, t(28) = 2.10, p = .135.');
    expect(statistics[0]!.findings).toMatchObject([{ rule: 'adjusted-p', severity: 'note' }]);
    expect(statistics[0]!.findings[0]!.message).toContain('depends on the number of groups');
    expect(status).toBe(0);
  });

  it('3. a paired t test is judged by the paired conventions for d, never by 2t / sqrt(df)', () => {
    // t(29) = 3.10: dz = 3.10 / sqrt(30) = 0.57, 2 dz = 1.13 (Lakens 2013, within-subjects designs, cited from memory); for independent
    // groups d would be at least 2 * 3.10 / sqrt(31) = 1.11, so d = 0.57 would be flagged there.
    const fine = check('A paired-samples t test showed a gain, t(29) = 3.10, p = .004, d = 0.57.');
    expect(fine.statistics[0]!.findings).toEqual([]);
    const wrong = check('A paired-samples t test showed a gain, t(29) = 3.10, p = .004, d = 1.25.');
    expect(wrong.statistics[0]!.findings).toMatchObject([{ rule: 'cohens-d-mismatch', severity: 'warn', messageId: 'paired' }]);
  });

  it('4. df above the stated total, with a per-group size also stated, is a note rather than a fail', () => {
    // t(52) = 2.10: p = .0406 (SciPy 1.10.1), so only df-exceeds-sample speaks.
    const unclear = check('A total of 48 adults took part, 20 in each condition. The groups differed, t(52) = 2.10, p = .041.');
    expect(unclear.statistics[0]!.findings).toMatchObject([{ rule: 'df-exceeds-sample', severity: 'note', messageId: 'unclearScope' }]);
    expect(unclear.status).toBe(0);
    const sure = check('A total of 48 adults took part. The groups differed, t(52) = 2.10, p = .041.');
    expect(sure.statistics[0]!.findings).toMatchObject([{ rule: 'df-exceeds-sample', severity: 'fail' }]);
    expect(sure.status).toBe(1);
  });

  it('5. "N = 12 control, 13 drug, ..." lists the groups\' sizes one by one: none of them is the total the df are held to', () => {
    // F(2, 34) = 4.42: p = .0196 (SciPy 1.10.1, scipy.stats.f.sf), so only df-exceeds-sample could speak.
    const listed = check('Errors differed between groups, F(2, 34) = 4.42, p = .020 (N = 12 control + vehicle, 13 control + drug, 12 drug + vehicle).');
    expect(listed.statistics[0]!.findings).toEqual([]);
    expect(listed.status).toBe(0);
    // ("N = 12 participants, 6 women": a sample noun makes it the total, and F(2, 34) cannot come from 12.)
    const total = check('Errors differed between groups, F(2, 34) = 4.42, p = .020 (N = 12 participants, 6 women, 6 men).');
    expect(total.statistics[0]!.findings).toMatchObject([{ rule: 'df-exceeds-sample', severity: 'fail' }]);
  });
});

