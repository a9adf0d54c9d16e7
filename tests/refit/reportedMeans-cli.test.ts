import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import mammoth from 'mammoth';
import { describe, expect, it } from 'vitest';
import { refitOutputSchema } from '../../src/refit/output.js';
import { fixturePath, runRefitInProcess as run } from './helpers.js';

/**
 * Section 4 of the refit workflow through the command: reported rows matched
 * to terms by close names (abbreviations, "x", "*", ":" and any order),
 * ambiguous and unmatched rows listed, and reported adjusted means, pairwise
 * comparisons and contrasts compared with the recomputed ones with the slips
 * searched there too. The recomputed numbers themselves are checked against
 * statsmodels and SciPy in refitTables-cli.test.ts; here the reported files
 * were written from them (rounded as a manuscript prints them).
 */


const DATA = join('corpus-demo', 'refit', 'harbour-walks.csv');
const SPEC = join('corpus-demo', 'refit', 'harbour-walks.analysis.json');
const SLIPS = fixturePath('refit/reported/harbour-means-slips.csv');
const MATCH = fixturePath('refit/reported/harbour-means-match.csv');
const THREE = fixturePath('refit/three_factor_two_covariates.csv');
const THREE_ARGS = ['--model', 'recovery ~ arm * shift * ward + age + baseline', '--missing', 'recovery=-9', '--missing', 'age=999', '--no-slopes'];
const tmp = mkdtempSync(join(tmpdir(), 'plumbline-reported-means-'));

describe('refit: reported rows matched to terms by close names', () => {
  it('matches abbreviations and interactions in any order and with any separator; lists ambiguous and unmatched rows', async () => {
    const { code, out } = await run(['refit', THREE, ...THREE_ARGS, '--reported', fixturePath('refit/reported/three-factor-abbreviated.csv'), '--format', 'json']);
    expect(code).toBe(1);
    const o = refitOutputSchema.parse(JSON.parse(out));
    const c = o.comparison!;
    const by = Object.fromEntries(c.rows.map((r) => [r.term, [r.reportedLabel, r.matchedBy]]));
    expect(by.shift).toEqual(['Shift', 'name']);
    expect(by.ward).toEqual(['W', 'abbreviation']);
    expect(by.baseline).toEqual(['Base', 'abbreviation']);
    expect(by['arm:shift']).toEqual(['S x A', 'abbreviation']); // "A" could be arm or age, but only arm:shift is a term
    expect(by['arm:ward']).toEqual(['Ward*Arm', 'name']);
    expect(by['shift:ward']).toEqual(['ward:shift', 'name']);
    expect(c.ambiguous).toEqual([{ label: 'A', where: 'table file', candidates: ['arm', 'age'] }]);
    expect(c.unmatched.map((u) => u.label)).toEqual(['Mood']);
    expect(c.termsNotReported).toEqual(['arm', 'age', 'arm:shift:ward']);
    expect(c.differs).toBe(0); // every matched number agrees: the verdict is about the rows left unmatched
    expect(o.verdict).toBe('differs');
    const text = await run(['refit', THREE, ...THREE_ARGS, '--reported', fixturePath('refit/reported/three-factor-abbreviated.csv')]);
    expect(text.out).toContain('1 reported row(s) could name more than one term and are left unmatched: "A" (arm or age); say which with --map');
    expect(text.out).toContain('1 reported row(s) name no model term: "Mood"');
    expect(text.out).toContain('Terms no reported row names: arm, age, arm × shift × ward.');
    expect(text.out).toContain('Matched as abbreviations: "W" = ward, "Base" = baseline, "S x A" = arm × shift.');
  });

  it('--map settles an ambiguous row', async () => {
    const { out } = await run(['refit', THREE, ...THREE_ARGS, '--reported', fixturePath('refit/reported/three-factor-abbreviated.csv'), '--map', 'A=arm', '--format', 'json']);
    const c = refitOutputSchema.parse(JSON.parse(out)).comparison!;
    expect(c.ambiguous).toEqual([]);
    expect(c.rows.find((r) => r.term === 'arm')).toMatchObject({ reportedLabel: 'A', matchedBy: 'map' });
  });
});

describe('refit: reported adjusted means, comparisons and contrasts', () => {
  it('a table file of means and Tukey comparisons printed as the refit gives them matches (exit 0)', async () => {
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--reported', MATCH, '--format', 'json']);
    const o = refitOutputSchema.parse(JSON.parse(out));
    expect(o.meansComparison).toMatchObject({ compared: 24, matches: 24, differs: 0, allMatch: true, adjust: { method: 'tukey', from: 'default' } });
    expect(o.meansComparison!.rows.map((r) => r.label)).toEqual(['harbour', 'park', 'indoor', 'harbour - park', 'harbour - indoor', 'park - indoor']);
    expect(o.verdict).toBe('matches');
    expect(code).toBe(0);
  });

  it('names the slips: unadjusted means reported as adjusted, Bonferroni p reported as Tukey (exit 1)', async () => {
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--reported', SLIPS, '--no-slopes']);
    expect(code).toBe(1);
    expect(out).toContain('11 of 28 reported numbers of the means, comparisons and contrasts differ. Comparisons recomputed with the tukey adjustment (as the report states).');
    expect(out).toMatch(/1\. Unadjusted \(observed\) means reported as adjusted means: .*all 3 reported numbers it changes match/);
    expect(out).toMatch(/2\. Bonferroni p and intervals reported as Tukey's \(tukey used here\): all 9 reported numbers it changes match/);
    // A reversed pair ("indoor - park") is compared with its sign turned; the contrast is given by its weights.
    expect(out).toMatch(/indoor - park \(tukey\)\s+indoor - park\s+Difference\s+-1\.78\s+-1\.7805\s+\+0\.0005\s+matches/);
    expect(out).toMatch(/contrast outdoor vs indoor\s+outdoor vs indoor\s+Difference\s+2\.55\s+2\.5514/);
    expect(out).not.toContain('Compared with'); // no ANOVA rows in the file: no empty ANOVA comparison
  });

  it('finds the covariate held at another value than its mean', async () => {
    const at = await run(['refit', DATA, '--spec', SPEC, '--means', 'route', '--at', 'loneliness=4.5', '--format', 'json']);
    const means = refitOutputSchema.parse(JSON.parse(at.out)).marginalMeans![0]!.means;
    const file = join(tmp, 'at.csv');
    writeFileSync(file, ['route,M', ...means.map((m) => `${m.label},${m.mean!.toFixed(2)}`)].join('\n'));
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--reported', file, '--format', 'json']);
    expect(code).toBe(1);
    const e = refitOutputSchema.parse(JSON.parse(out)).meansComparison!.explanations;
    expect(e[0]).toMatchObject({ slip: 'covariate-value', reproduces: 'all', compared: 3 });
    expect(e[0]!.description).toMatch(/^covariate loneliness held at 4\.5\d .*instead of its mean 3\.01$/);
  });

  it('reads a manuscript: a Markdown table of adjusted means and a written comparison with its stated adjustment', async () => {
    const paper = join(tmp, 'paper.md');
    writeFileSync(
      paper,
      [
        '# Results',
        '',
        'Post hoc comparisons were Bonferroni-corrected.',
        '',
        'Table 2. Adjusted means of mood',
        '',
        '| Route | M | SE |',
        '|---|---:|---:|',
        '| harbour | 25.84 | 0.57 |',
        '| park | 24.30 | 0.53 |',
        '| indoor | 22.52 | 0.56 |',
        '',
        'Mood was higher after the harbour route than after the indoor track, t(125) = 4.15, p < .001, and the park and indoor routes did not differ, t(125) = 2.31, p = .068.',
        '',
      ].join('\n'),
    );
    const { out } = await run(['refit', DATA, '--spec', SPEC, '--reported', paper, '--format', 'json']);
    const m = refitOutputSchema.parse(JSON.parse(out)).meansComparison!;
    expect(m.adjust).toEqual({ method: 'bonferroni', from: 'reported' });
    expect(m.rows.filter((r) => r.kind === 'mean').map((r) => r.label)).toEqual(['harbour', 'park', 'indoor']);
    const written = m.rows.filter((r) => r.kind === 'comparison');
    expect(written.map((r) => [r.label, r.adjust])).toEqual([['harbour - indoor', 'bonferroni'], ['park - indoor', 'bonferroni']]);
    expect(written[1]!.numbers.find((n) => n.quantity === 'p')).toMatchObject({ reported: '.068', verdict: 'matches' });
    expect(m.allMatch).toBe(true);
  });

  it('every format shows the comparison: Markdown, HTML and DOCX', async () => {
    const md = await run(['refit', DATA, '--spec', SPEC, '--reported', SLIPS, '--format', 'md']);
    expect(md.out).toContain('## Reported means, comparisons and contrasts against the refit');
    expect(md.out).toContain('| M harbour (route) | harbour | M | 26.14 | 25.8416 | +0.2984 | differs |');
    expect(md.out).toContain('## What reproduces the reported means and comparisons');
    const html = await run(['refit', DATA, '--spec', SPEC, '--reported', SLIPS, '--format', 'html']);
    expect(html.out).toContain('<h2>Reported means, comparisons and contrasts against the refit</h2>');
    expect(html.out).toContain('<td class="differs">differs</td>');
    expect(html.out).toContain('<li>Bonferroni p and intervals reported as Tukey&#39;s'.replace('&#39;', "'"));
    const docx = join(tmp, 'means.docx');
    await run(['refit', DATA, '--spec', SPEC, '--reported', SLIPS, '--format', 'docx', '--output', docx]);
    const { value } = await mammoth.extractRawText({ buffer: readFileSync(docx) });
    expect(value).toContain('Reported means, comparisons and contrasts against the refit');
    expect(value).toContain('Unadjusted (observed) means reported as adjusted means');
  });

  it('a table file with no table it can read names the headers it takes', async () => {
    const file = join(tmp, 'nothing.csv');
    writeFileSync(file, 'a,b\n1,2\n');
    const { code, err } = await run(['refit', DATA, '--spec', SPEC, '--reported', file]);
    expect(code).toBe(2);
    expect(err).toMatch(/nothing\.csv, row 1: no table header found; .*Comparison, Difference, SE, t, p/);
  });
});

describe('refit: adjusted means written in the manuscript\'s text', () => {
  // The recomputed means of the demo's routes (25.84, 24.30, 22.52 with SE 0.57, 0.53, 0.56) are checked against
  // statsmodels in refitTables-cli.test.ts; this text was written from them, as a manuscript prints them.
  const text = (park: string) =>
    `Results\n\nAdjusted for loneliness, mood was highest on the harbour route (M = 25.84, SE = 0.57), lower on the park route (M = ${park}, SE = 0.53) and lowest on the indoor route (M = 22.52, SE = 0.56).\n`;

  it('reads "M = 25.84, SE = 0.57" after the words naming the level, and compares each with the recomputed mean', async () => {
    const file = join(tmp, 'means-in-text.txt');
    writeFileSync(file, text('24.30'));
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--means', 'route', '--reported', file, '--format', 'json']);
    expect(code).toBe(0);
    const m = refitOutputSchema.parse(JSON.parse(out)).meansComparison!;
    expect(m.rows.map((r) => [r.label, r.printedAs])).toEqual([
      ['harbour', 'Adjusted for loneliness, mood was highest on the harbour route'],
      ['park', 'lower on the park route'],
      ['indoor', 'and lowest on the indoor route'],
    ]);
    expect(m).toMatchObject({ compared: 6, matches: 6, allMatch: true });
  });

  it('flags a mean written in the text that the model does not give', async () => {
    const file = join(tmp, 'means-in-text-slip.txt');
    writeFileSync(file, text('24.90'));
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--means', 'route', '--reported', file, '--format', 'json']);
    expect(code).toBe(1);
    const park = refitOutputSchema.parse(JSON.parse(out)).meansComparison!.rows.find((r) => r.label === 'park')!;
    expect(park.numbers.find((n) => n.quantity === 'mean')).toMatchObject({ reported: '24.90', verdict: 'differs' });
  });
});

describe('refit: reported simple comparisons, within the levels of another factor', () => {
  // The recomputed simple comparisons (--within) are checked against statsmodels in refitTables-cli.test.ts; these
  // rows were written from them, rounded as a manuscript prints them.
  const table = (guided: string) =>
    `Pace,Comparison,Difference,SE,t,df,p\nself,harbour - park,0.27,1.09,0.25,125,.967\nguided,harbour - park,${guided},1.11,2.53,125,.033\nguided,harbour - indoor,4.55,1.15,3.97,125,<.001\n`;

  it('compares each row with the comparison within the level its "Pace" column names', async () => {
    const file = join(tmp, 'within.csv');
    writeFileSync(file, table('2.82'));
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--means', 'route', '--within', 'pace', '--reported', file, '--format', 'json']);
    expect(code).toBe(0);
    const m = refitOutputSchema.parse(JSON.parse(out)).meansComparison!;
    expect(m.rows.map((r) => r.label)).toEqual(['harbour - park (pace = self)', 'harbour - park (pace = guided)', 'harbour - indoor (pace = guided)']);
    expect(m).toMatchObject({ compared: 15, matches: 15, allMatch: true });
  });

  it('flags a difference the comparison within that level does not give', async () => {
    const file = join(tmp, 'within-slip.csv');
    writeFileSync(file, table('3.82'));
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--means', 'route', '--within', 'pace', '--reported', file, '--format', 'json']);
    expect(code).toBe(1);
    const guided = refitOutputSchema.parse(JSON.parse(out)).meansComparison!.rows.find((r) => r.label === 'harbour - park (pace = guided)')!;
    expect(guided.numbers.find((n) => n.quantity === 'estimate')).toMatchObject({ reported: '3.82', verdict: 'differs' });
  });
});
