import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import mammoth from 'mammoth';
import { describe, expect, it } from 'vitest';
import { refitOutputSchema, type RefitOutput } from '../../src/refit/output.js';
import { fixturePath, loadJson, relErr, runRefitInProcess as run } from './helpers.js';

/**
 * `plumbline refit` run as a command on what a new user meets: reported row
 * names with "_" and ".", the order of type I terms, what type III with
 * treatment coding tests, every unreadable cell in one run, identifier
 * columns, level labels, level order, levels left out, declared ranges, the
 * homogeneity-of-slopes test, centring and covariates with few values.
 *
 * Numbers are checked against tests/fixtures/refit/refit_checks.json, written
 * by gen_refit_tables.py (its checks() part) with statsmodels; each check
 * names its source (the fixture's "source" field) in its title.
 */

interface Row { term: string; ss: number; df: number; F: number; p: number }
interface Checks {
  statsmodels: string;
  typeOneByDegree: { file: string; argv: string[]; source: string; terms: Row[]; residual: { ss: number; df: number } };
  slopes: { file: string; argv: string[]; source: string; F: number; df1: number; df2: number; p: number };
  centred: { file: string; argv: string[]; source: string; mean: number; terms: Row[]; residual: { ss: number; df: number } };
  clinics: {
    file: string;
    argv: string[];
    source: string;
    n: number;
    dropped: number;
    levels: string[];
    outsideRows: number[];
    terms: Row[];
    residual: { ss: number; df: number };
    coefficients: Array<{ name: string; estimate: number }>;
  };
}
const ref = loadJson<Checks>('refit/refit_checks.json');
const SM = `statsmodels ${ref.statsmodels}`;
const TOL = 1e-9;


async function json(argv: string[]): Promise<RefitOutput> {
  const { code, out, err } = await run(['refit', ...argv, '--format', 'json']);
  expect(err).toBe('');
  expect(code).toBe(0);
  return refitOutputSchema.parse(JSON.parse(out));
}

function sameTable(label: string, ours: RefitOutput, terms: Row[], residual: { ss: number; df: number }): string[] {
  const failures: string[] = [];
  const cmp = (what: string, a: number | null, b: number) => {
    if (a === null || !(relErr(a, b) <= TOL)) failures.push(`${label} ${what}: plumbline ${a} vs ${SM} ${b}`);
  };
  for (const t of terms) {
    const o = ours.terms.find((x) => x.term === t.term);
    if (o === undefined) {
      failures.push(`${label}: no term ${t.term}`);
      continue;
    }
    cmp(`${t.term} SS`, o.ss, t.ss);
    cmp(`${t.term} df`, o.df, t.df);
    cmp(`${t.term} F`, o.F, t.F);
    cmp(`${t.term} p`, o.p, t.p);
  }
  cmp('residual SS', ours.residual.ss, residual.ss);
  cmp('residual df', ours.residual.df, residual.df);
  return failures;
}

const tmp = mkdtempSync(join(tmpdir(), 'plumbline-refit-levels-'));
function file(name: string, text: string): string {
  const path = join(tmp, name);
  writeFileSync(path, text);
  return path;
}

/** 24 invented rows: outcome y, factor grp (a, b, c), covariate start_height. */
function heightsCsv(): string {
  const lines = ['y,grp,start_height'];
  for (let i = 0; i < 24; i++) {
    const g = ['a', 'b', 'c'][i % 3]!;
    const h = 100 + ((i * 37) % 23);
    lines.push(`${(10 + (i % 3) * 1.3 + 0.05 * h + ((i * 7) % 5) * 0.4).toFixed(2)},${g},${h}`);
  }
  return `${lines.join('\n')}\n`;
}

describe('reported rows named like variables', () => {
  const data = file('heights.csv', heightsCsv());
  const model = ['--model', 'y ~ grp + start_height', '--no-slopes'];

  it('"start_height" and "start.height" in the reported table match the term start_height', async () => {
    const fitted = await json([data, ...model]);
    const f = (t: string) => fitted.terms.find((x) => x.term === t)!.F!.toFixed(2);
    for (const label of ['start_height', 'start.height', 'Start height']) {
      const table = file(`reported-${label.replace(/\W/g, '')}.csv`, `Source,F,df\ngrp,${f('grp')},2\n${label},${f('start_height')},1\n`);
      const o = await json([data, ...model, '--reported', table]);
      const row = o.comparison!.rows.find((r) => r.term === 'start_height')!;
      expect(row.reportedLabel, label).toBe(label);
      expect(o.comparison!.unmatched, label).toEqual([]);
      expect(o.verdict, label).toBe('matches');
    }
  });

  it('--map "Height=start_height" names the term for a row printed "Height"', async () => {
    const fitted = await json([data, ...model]);
    const table = file('reported-height.csv', `Source,F,df\ngrp,${fitted.terms[0]!.F!.toFixed(2)},2\nHeight,${fitted.terms[1]!.F!.toFixed(2)},1\n`);
    // Without the map the row names no term: it is listed as unmatched, and the run exits 1.
    const without = await run(['refit', data, ...model, '--reported', table, '--format', 'json']);
    expect(without.code).toBe(1);
    expect(refitOutputSchema.parse(JSON.parse(without.out)).comparison!.unmatched).toEqual([{ label: 'Height', where: 'table file' }]);
    const o = await json([data, ...model, '--reported', table, '--map', 'Height=start_height']);
    expect(o.comparison!.rows.find((r) => r.term === 'start_height')!.reportedLabel).toBe('Height');
    expect(o.comparison!.unmatched).toEqual([]);
  });
});

describe('type I sums of squares follow the terms ordered by degree', () => {
  const c = ref.typeOneByDegree;
  const data = fixturePath(`refit/${c.file}`);

  it(`an interaction written before a covariate is tested after it (${SM}: ${c.source})`, async () => {
    const o = await json([data, ...c.argv]);
    expect(o.termOrder).toBe('degree');
    expect(o.terms.map((t) => t.term)).toEqual(c.terms.map((t) => t.term));
    expect(sameTable('type I by degree', o, c.terms, c.residual)).toEqual([]);
  });

  it('the method line says the order; --term-order written keeps the written one', async () => {
    const text = await run(['refit', data, ...c.argv]);
    expect(text.out).toContain(
      'Method   type I (sequential) sums of squares, terms in order of degree (main effects and covariates, then interactions): group, site, baseline, group × site',
    );
    const written = await json([data, ...c.argv, '--term-order', 'written']);
    expect(written.terms.map((t) => t.term)).toEqual(['group', 'site', 'group:site', 'baseline']);
    // The covariate's sum of squares now comes after the interaction: not the degree order's.
    const baseline = written.terms.find((t) => t.term === 'baseline')!.ss!;
    expect(relErr(baseline, c.terms.find((t) => t.term === 'baseline')!.ss)).toBeGreaterThan(1e-6);
    const md = await run(['refit', data, ...c.argv, '--format', 'md', '--term-order', 'written']);
    expect(md.out).toContain('terms in the order written: group, site, group × site, baseline');
  });
});

describe('levels: order, labels, reference, levels left out, declared ranges (clinics.csv)', () => {
  const c = ref.clinics;
  const data = fixturePath(`refit/${c.file}`);

  it(`levels in natural case-insensitive order, site4 (no analysed rows) left out with a note; the table agrees with ${SM} (${c.source})`, async () => {
    const o = await json([data, ...c.argv]);
    expect(o.n).toBe(c.n);
    expect(o.droppedRows).toBe(c.dropped);
    expect(o.factors).toEqual([{ name: 'clinic', levels: c.levels, labels: c.levels, reference: 'site1' }]);
    expect(o.notes).toContain('Level "site4" of clinic has no analysed rows once rows with missing values are removed, so it is left out of the model (levels analysed: site1, Site2, Site3, site10).');
    expect(sameTable('clinics', o, c.terms, c.residual)).toEqual([]);
  });

  it(`the reference level (the first) is stated, and --levels changes it; coefficients agree with ${SM}`, async () => {
    const text = await run(['refit', data, ...c.argv, '--no-slopes']);
    expect(text.out).toContain('treatment (dummy) coding, first level as reference (reference clinic = site1)');
    expect(text.out).toContain("Treatment coding: each factor's first level is its reference (clinic = site1)");
    const o = await json([data, ...c.argv, '--coefficients']);
    for (const r of c.coefficients) {
      const ours = o.coefficients!.find((x) => x.name === r.name);
      expect(ours, r.name).toBeDefined();
      expect(relErr(ours!.estimate!, r.estimate), `${r.name} vs ${SM}`).toBeLessThan(TOL);
    }
    // Declared levels are the only ones allowed: site4 (whose rows lack the outcome anyway) is declared missing.
    const reordered = await json([data, ...c.argv, '--levels', 'clinic=Site3,site1,Site2,site10', '--missing', 'clinic=site4']);
    expect(reordered.factors[0]).toMatchObject({ levels: ['Site3', 'site1', 'Site2', 'site10'], reference: 'Site3' });
    expect(relErr(reordered.terms[0]!.F!, o.terms[0]!.F!)).toBeLessThan(1e-12); // the order changes no test
  });

  it('levels numbered past 9 come in numeric order; a factor with many levels shows its first 12 and the count', async () => {
    const rows = ['y,g', ...Array.from({ length: 120 }, (_, i) => `${((i * 37) % 11) + (i % 7) / 10},L${i % 40}`)];
    const many = file('many-levels.csv', `${rows.join('\n')}\n`);
    const { out } = await run(['refit', many, '--model', 'y ~ g']);
    expect(out).toContain('  Levels   g: L0, L1, L2, L3, L4, L5, L6, L7, L8, L9, L10, L11, ... (40 levels)\n');
    expect((await json([many, '--model', 'y ~ g'])).factors[0]!.levels.slice(8, 12)).toEqual(['L8', 'L9', 'L10', 'L11']);
  });

  it('a declared level without analysed rows is an error naming it and the fix', async () => {
    const { code, err } = await run(['refit', data, ...c.argv, '--levels', 'clinic=site1,Site2,Site3,site10,site4']);
    expect(code).toBe(2);
    expect(err).toContain('clinics.csv: Factor \'clinic\': declared level "site4" has no analysed rows; remove it from --levels "clinic=..." or merge it with another level.');
  });

  it('--labels are shown in every format; a label for a level not in the data is an error naming it', async () => {
    const labels = ['--labels', 'clinic=site1:North,Site2:East,Site3:South,site10:West', '--means', 'clinic', '--no-slopes'];
    const o = await json([data, ...c.argv, ...labels]);
    expect(o.factors[0]!.labels).toEqual(['North', 'East', 'South', 'West']);
    expect(o.marginalMeans![0]!.means.map((m) => m.label)).toEqual(['North', 'East', 'South', 'West']);
    const text = (await run(['refit', data, ...c.argv, ...labels])).out;
    expect(text).toContain('Levels   clinic: site1 = North, Site2 = East, Site3 = South, site10 = West');
    expect(text).toMatch(/\n  West\s+\d/);
    const md = (await run(['refit', data, ...c.argv, ...labels, '--format', 'md'])).out;
    expect(md).toContain('- Levels: clinic: site1 = North, Site2 = East, Site3 = South, site10 = West');
    const htmlFile = join(tmp, 'labels.html');
    await run(['refit', data, ...c.argv, ...labels, '--format', 'html', '--output', htmlFile]);
    expect(readFileSync(htmlFile, 'utf8')).toContain('<li>Levels: clinic: site1 = North, Site2 = East, Site3 = South, site10 = West</li>');
    const docxFile = join(tmp, 'labels.docx');
    await run(['refit', data, ...c.argv, ...labels, '--format', 'docx', '--output', docxFile]);
    const { value } = await mammoth.convertToHtml({ path: docxFile });
    expect(value).toContain('Levels: clinic: site1 = North, Site2 = East, Site3 = South, site10 = West');

    const bad = await run(['refit', data, ...c.argv, '--labels', 'clinic=site1:North,site5:Inland']);
    expect(bad.code).toBe(2);
    expect(bad.err).toContain(
      'clinics.csv: Factor \'clinic\': a label is given for level "site5" ("Inland"), but \'clinic\' has no such level in the data (its levels: site1, Site2, Site3, site10). Fix or remove it in --labels "clinic=...".',
    );
    const elsewhere = await run(['refit', data, ...c.argv, '--labels', 'clinik=site1:North']);
    expect(elsewhere.err).toContain(`--labels "clinik=...": 'clinik' is not in the model score ~ clinic + visits (its variables: clinic, visits); give labels for a factor of the model.`);
    const malformed = await run(['refit', data, ...c.argv, '--labels', 'clinic=North']);
    expect(malformed.err).toContain('--labels "clinic=North": "North" is not "<level>:<label>"');
  });

  it('--range reports the values outside it per column, with count and rows, in the command line and the description file', async () => {
    const argv = ['--model', 'score ~ clinic + visits', '--range', 'score=1..40', '--no-slopes'];
    const o = await json([data, ...argv]);
    expect(o.outOfRange).toEqual([{ column: 'score', low: 1, high: 40, count: c.outsideRows.length, rows: c.outsideRows, values: [{ value: '99', count: c.outsideRows.length }] }]);
    const text = (await run(['refit', data, ...argv])).out;
    expect(text).toContain(`2 values of score outside its range 1..40 (99 ×2), rows ${c.outsideRows.join(', ')}: they are in the analysis. If they are missing-value codes, declare them: --missing "score=99".`);
    const spec = file('clinics.analysis.json', JSON.stringify({ model: 'score ~ clinic + visits', ranges: { score: [1, 40] } }));
    const fromFile = await json([data, '--spec', spec]);
    expect(fromFile.outOfRange[0]).toMatchObject({ column: 'score', count: 2, rows: c.outsideRows });
    const none = await json([data, ...argv, '--missing', 'score=99']);
    expect(none.outOfRange).toEqual([]);
    const badRange = await run(['refit', data, ...argv.slice(0, 2), '--range', 'score=40..1']);
    expect(badRange.code).toBe(2);
    expect(badRange.err).toContain('--range "score=...": the range has its lower end above its upper end');
  });

  it(`the slip search tries the values outside --range as missing: a table printed from ${SM} without the 99s is reproduced`, async () => {
    const p = (x: number) => (x < 0.001 ? '< .001' : x.toFixed(3).replace(/^0/, ''));
    const rows = c.terms.map((t) => `${t.term},${t.ss.toFixed(2)},${t.df},${t.F.toFixed(2)},${p(t.p)}`);
    const table = file('clinics-reported.csv', `Source,SS,df,F,p\n${rows.join('\n')}\nError,${c.residual.ss.toFixed(2)},${c.residual.df},,\n`);
    const argv = [data, '--model', 'score ~ clinic + visits', '--coding', 'treatment', '--range', 'score=1..40', '--reported', table];
    const { code, out } = await run(['refit', ...argv, '--format', 'json']);
    expect(code).toBe(1); // the refit keeps the 99s, so the numbers differ
    const o = refitOutputSchema.parse(JSON.parse(out));
    expect(o.explanations![0]).toMatchObject({ slip: 'out-of-range-missing', reproduces: 'all' });
    expect(o.explanations![0]!.description).toBe('values outside the declared ranges removed as missing (score outside 1..40: 2 values), as undeclared missing-value codes would be');
    const text = (await run(['refit', ...argv])).out;
    expect(text).toMatch(/1\. Values outside the declared ranges removed as missing \(score outside 1\.\.40: 2 values\), as undeclared missing-value codes would be: all \d+ reported numbers match/);
  });

  it('a covariate with few whole-number values: said to be numeric, with how to make it a factor', async () => {
    const o = await json([data, ...c.argv]);
    expect(o.notes).toContain(
      "'visits' has only 4 distinct values (1, 2, 3, 4), all whole numbers: it is treated as a numeric covariate (one slope, 1 df). If its values are groups, make it a factor (--factor visits); --covariate visits keeps it numeric without this note.",
    );
    expect((await json([data, ...c.argv, '--covariate', 'visits'])).notes.some((n) => n.includes("'visits'"))).toBe(false);
    const spec = file('clinics-visits.json', JSON.stringify({ model: 'score ~ clinic + visits', missing: { score: '99' } }));
    expect((await json([data, '--spec', spec])).notes).toContain(
      "'visits' has only 4 distinct values (1, 2, 3, 4), all whole numbers: it is treated as a numeric covariate (one slope, 1 df). If its values are groups, make it a factor (\"factors\": {\"visits\": {}}); \"covariates\": [\"visits\"] keeps it numeric without this note.",
    );
  });
});

describe('type III with treatment coding and covariate × factor interactions say what they test', () => {
  it('main effects inside an interaction are simple effects at the reference levels', async () => {
    const data = fixturePath('refit/unbalanced_3x2_cov.csv');
    const { out } = await run(['refit', data, '--model', 'score ~ group * dose + age', '--factor', 'dose', '--coding', 'treatment', '--levels', 'group=lo,mid,hi']);
    expect(out).toContain(
      'With treatment coding, the type III tests of effects inside an interaction are simple effects at the reference levels of the other factors (group at dose = 1; dose at group = lo), not main effects averaged over them. For main effects use sum-to-zero coding (leave out --coding treatment).',
    );
    const sum = await run(['refit', data, '--model', 'score ~ group * dose + age', '--factor', 'dose']);
    expect(sum.out).not.toContain('simple effects');
  });

  const c = ref.centred;
  it(`a covariate × factor interaction: the tests are at covariate = 0, --center tests them at its mean (${SM}: ${c.source})`, async () => {
    const data = fixturePath(`refit/${c.file}`);
    const raw = await json([data, '--model', 'resp ~ arm * baseline']);
    expect(raw.notes.join(' ')).toContain(`so the type III tests of the factors compare the groups where baseline = 0 (baseline's mean is ${c.mean.toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })}), which may lie outside the data. --center tests them at the covariates' means instead.`);
    const centred = await json([data, ...c.argv]);
    expect(centred.centered).toEqual([{ name: 'baseline', at: expect.closeTo(c.mean, 9) as unknown as number }]);
    expect(sameTable('centred', centred, c.terms, c.residual)).toEqual([]);
    // The centred test of arm differs from the one at baseline = 0.
    expect(relErr(raw.terms[0]!.F!, centred.terms[0]!.F!)).toBeGreaterThan(1e-3);
    const text = (await run(['refit', data, ...c.argv])).out;
    expect(text).toMatch(/Covariates centred at their means in their interactions with factors \(baseline = [\d,]+\.\d\d\): the type III tests of the factors are at these values\./);
  });
});

describe('homogeneity of regression slopes', () => {
  const c = ref.slopes;
  const data = fixturePath(`refit/${c.file}`);

  it(`is tested by default in the text report of an ANCOVA, with a plain sentence (${SM}: ${c.source})`, async () => {
    const { out } = await run(['refit', data, ...c.argv]);
    const p = c.p < 0.001 ? '< .001' : `= ${c.p.toFixed(3).replace(/^0\./, '.')}`;
    expect(out).toContain(
      `Homogeneity of regression slopes (baseline × group, baseline × site, baseline × group × site added to the model and tested together): F(${c.df1}, ${c.df2}) = ${c.F.toFixed(2)}, p ${p}.`,
    );
    expect(out).toContain(c.p < 0.05 ? 'does not hold' : 'No evidence that the slope of baseline differs between the groups');
    expect((await run(['refit', data, ...c.argv, '--no-slopes'])).out).not.toContain('Homogeneity of regression slopes');
  });

  it('--slopes puts the test in the JSON output; its numbers agree with statsmodels', async () => {
    expect((await json([data, ...c.argv])).slopes).toBeUndefined();
    const o = await json([data, ...c.argv, '--slopes']);
    const s = o.slopes!;
    if ('error' in s) throw new Error(s.error);
    expect(s.added).toEqual(['baseline:group', 'baseline:site', 'baseline:group:site']);
    expect(s.df1).toBe(c.df1);
    expect(s.df2).toBe(c.df2);
    expect(relErr(s.F!, c.F), `F vs ${SM}`).toBeLessThan(TOL);
    expect(relErr(s.p!, c.p), `p vs ${SM}`).toBeLessThan(1e-8);
  });
});

describe('unreadable cells and identifier columns', () => {
  const lines = ['score,group,age'];
  for (let i = 0; i < 12; i++) lines.push(`${10 + i},${['a', 'b', 'c'][i % 3]},${20 + i}`);
  const bad = [...lines];
  bad[3] = '12,c,n/a';
  bad[5] = 'refused,b,24';
  bad[7] = '16,a';
  bad[9] = '18,c,unknown';
  bad[10] = 'refused,a,29';
  const data = file('bad-cells.csv', `${bad.join('\n')}\n`);

  it('every unreadable cell is reported in one run, with advice in command-line syntax', async () => {
    const { code, err } = await run(['refit', data, '--model', 'score ~ group + age']);
    expect(code).toBe(2);
    expect(err).toBe(
      [
        'plumbline: bad-cells.csv: 5 cells cannot be read; nothing was fitted:',
        '  row 4, column \'age\': "n/a" is not a number, but the column is numeric (a covariate)',
        '  row 6, column \'score\': "refused" is not a number, but the column is numeric (it is the outcome)',
        '  row 8: 2 fields, but the header has 3 columns',
        '  row 10, column \'age\': "unknown" is not a number, but the column is numeric (a covariate)',
        '  row 11, column \'score\': "refused" is not a number, but the column is numeric (it is the outcome)',
        'To fix:',
        '  \'age\': fix the cells, or declare the codes missing with --missing "age=n/a,unknown", or --factor age if the column holds groups.',
        '  \'score\': fix the cells, or declare the codes missing with --missing "score=refused".',
        '  Rows with the wrong number of fields: check for a stray delimiter or an unquoted text cell containing one.',
        '',
      ].join('\n'),
    );
  });

  it('with a description file the advice names its fields', async () => {
    const spec = file('bad-cells.json', JSON.stringify({ model: 'score ~ group + age' }));
    const { err } = await run(['refit', data, '--spec', spec]);
    expect(err).toContain('\'age\': fix the cells, or declare the codes missing with "missing": {"age": "n/a,unknown"} in the description file, or declare the column under "factors" if it holds groups.');
  });

  it('the advice, followed, fits', async () => {
    const { code, err } = await run(['refit', data, '--model', 'score ~ group + age', '--missing', 'age=n/a,unknown', '--missing', 'score=refused']);
    expect(err).toContain('bad-cells.csv, row 8, column 3: 2 fields, but the header has 3 columns');
    expect(code).toBe(2);
    const fixed = file('bad-cells-fixed.csv', `${bad.filter((_, i) => i !== 7).join('\n')}\n`);
    const ok = await json([fixed, '--model', 'score ~ group + age', '--missing', 'age=n/a,unknown', '--missing', 'score=refused']);
    expect(ok.droppedRows).toBe(4);
  });

  it('stops at 20 unreadable cells and says there may be more', async () => {
    const many = ['score,group', ...Array.from({ length: 40 }, (_, i) => `x${i},a`)];
    const { err } = await run(['refit', file('many-bad.csv', `${many.join('\n')}\n`), '--model', 'score ~ group']);
    expect(err).toContain('many-bad.csv: reading stopped at the first 20 cells that cannot be read (there may be more); nothing was fitted:');
    expect(err.match(/is not a number/g)).toHaveLength(20);
  });

  it('an identifier given as a factor is named as one (one row per level)', async () => {
    const rows = ['score,participant,group', ...Array.from({ length: 12 }, (_, i) => `${10 + (i % 5)},P${i + 1},${['a', 'b'][i % 2]}`)];
    const ids = file('ids.csv', `${rows.join('\n')}\n`);
    const { code, err } = await run(['refit', ids, '--model', 'score ~ group + participant']);
    expect(code).toBe(2);
    expect(err).toContain(
      "ids.csv: Factor 'participant' has one analysed row per level (12 levels for 12 rows): it looks like an identifier (a participant number or a name), not a grouping. Leave it out of the model; if it is a measure, make it a covariate (--covariate participant).",
    );
    const numbered = file('ids-numbered.csv', `${rows.map((r, i) => (i === 0 ? r : r.replace(/,P(\d+),/, ',$1,'))).join('\n')}\n`);
    const declared = await run(['refit', numbered, '--model', 'score ~ group + participant', '--factor', 'participant']);
    expect(declared.err).toContain('Leave it out of the model and drop --factor participant; if it is a measure, make it a covariate (--covariate participant).');
  });
});

describe('the description file takes the same', () => {
  it('"termOrder", "center", "slopes", "ranges" and "labels" in --spec give what the options give', async () => {
    const c = ref.centred;
    const data = fixturePath(`refit/${c.file}`);
    const spec = file('centred.json', JSON.stringify({ model: 'resp ~ arm * baseline', center: true, termOrder: 'written', factors: { arm: { labels: { ctl: 'control' } } } }));
    const o = await json([data, '--spec', spec]);
    expect(o.termOrder).toBe('written');
    expect(o.factors[0]!.labels[o.factors[0]!.levels.indexOf('ctl')]).toBe('control');
    expect(sameTable('centred from the file', o, c.terms, c.residual)).toEqual([]);
    const s = ref.slopes;
    const slopesSpec = file('slopes.json', JSON.stringify({ model: 'wellbeing ~ group * site + baseline', missing: { wellbeing: '-9', baseline: '999' }, slopes: true }));
    const withSlopes = await json([fixturePath(`refit/${s.file}`), '--spec', slopesSpec]);
    expect(withSlopes.slopes && 'F' in withSlopes.slopes ? relErr(withSlopes.slopes.F!, s.F) : 1, `F vs ${SM}`).toBeLessThan(TOL);
    const off = await run(['refit', fixturePath(`refit/${s.file}`), '--spec', file('no-slopes.json', JSON.stringify({ model: 'wellbeing ~ group * site + baseline', missing: { wellbeing: '-9', baseline: '999' }, slopes: false }))]);
    expect(off.out).not.toContain('Homogeneity of regression slopes');
  });
});

describe('display names for variables (--name)', () => {
  const data = fixturePath('refit/ancova_3x2.csv');
  const argv = ['--model', 'wellbeing ~ group * site + baseline', '--missing', 'wellbeing=-9', '--missing', 'baseline=999', '--no-slopes'];
  const names = ['--name', 'group=Training group', '--name', 'baseline=Baseline score', '--means', 'group'];

  it('are shown in every format, and reported rows printed with them match their terms', async () => {
    const text = (await run(['refit', data, ...argv, ...names])).out;
    expect(text).toMatch(/\n  Training group × site\s+[\d.]+\s+2\s/);
    expect(text).toMatch(/\n  Baseline score\s+[\d.]+\s+1\s/);
    expect(text).toContain('Estimated marginal means of wellbeing by Training group');
    const md = (await run(['refit', data, ...argv, ...names, '--format', 'md'])).out;
    expect(md).toMatch(/\| Training group × site \| [\d.]+ \| 2 \|/);
    const htmlFile = join(tmp, 'names.html');
    await run(['refit', data, ...argv, ...names, '--format', 'html', '--output', htmlFile]);
    expect(readFileSync(htmlFile, 'utf8')).toContain('<td class="src">Training group × site</td>');
    const docxFile = join(tmp, 'names.docx');
    await run(['refit', data, ...argv, ...names, '--format', 'docx', '--output', docxFile]);
    expect((await mammoth.convertToHtml({ path: docxFile })).value).toContain('<td><p>Baseline score</p></td>');
    const o = await json([data, ...argv, ...names]);
    expect(o.displayNames).toEqual([{ variable: 'group', name: 'Training group' }, { variable: 'baseline', name: 'Baseline score' }]);
    expect(o.terms.map((t) => t.term)).toEqual(['group', 'site', 'baseline', 'group:site']);

    const f = (term: string) => o.terms.find((t) => t.term === term)!.F!.toFixed(2);
    const table = file('names-reported.csv', `Source,F,df\nTraining group,${f('group')},2\nSite,${f('site')},1\nBaseline score,${f('baseline')},1\nTraining group x Site,${f('group:site')},2\n`);
    const compared = await json([data, ...argv, ...names, '--reported', table]);
    expect(compared.comparison!.unmatched).toEqual([]);
    const label = (term: string) => compared.comparison!.rows.find((r) => r.term === term)!.reportedLabel;
    expect(['group', 'site', 'baseline', 'group:site'].map(label)).toEqual(['Training group', 'Site', 'Baseline score', 'Training group x Site']);
    expect(compared.verdict).toBe('matches');
  });

  it('a name for a variable not in the model is an error naming it', async () => {
    const { code, err } = await run(['refit', data, ...argv, '--name', 'grup=Training group']);
    expect(code).toBe(2);
    expect(err).toContain(`--name "grup=...": 'grup' is not in the model wellbeing ~ group * site + baseline (its variables: wellbeing, group, site, baseline); name a variable of the model.`);
  });
});
