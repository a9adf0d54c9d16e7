import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import mammoth from 'mammoth';
import { describe, expect, it } from 'vitest';
import { refitJsonSchema, refitOutputSchema } from '../../src/refit/output.js';
import { fixturePath, runRefitInProcess as run } from './helpers.js';


const demo = (name: string) => join('corpus-demo', 'refit', name);
const DATA = demo('harbour-walks.csv');
const SPEC = demo('harbour-walks.analysis.json');
const PAPER = demo('harbour-walks-manuscript.md');
const tmp = mkdtempSync(join(tmpdir(), 'plumbline-refit-cli-'));

describe('plumbline refit on the demo study', () => {
  it('finds the planted slip: missing-value codes analysed as numbers (exit 1)', async () => {
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--reported', PAPER]);
    expect(code).toBe(1);
    expect(out).toContain('type III sums of squares, sum-to-zero (deviation) coding');
    expect(out).toContain('150 in the file, N = 132 analysed; 18 rows dropped for missing values');
    expect(out).toMatch(/route\s+Route\s+SS\s+1144\.25\s+230\.0230\s+\+914\.2270\s+differs/);
    expect(out).toMatch(/1\. Missing-value codes left in the data as numbers \(mood=99; loneliness=6-8 not removed\): all 27 reported numbers match/);
    expect(out).toContain('The reported error df 143 implies N = 150');
    expect(out).toMatch(/Residual\s+1,661\.00\s+125\s+13\.29/); // thousands separated (APA)
  });

  it('gives the same result with the model and codes on the command line', async () => {
    const { code, out } = await run([
      'refit', DATA, '--model', 'mood ~ route * pace + loneliness', '--missing', 'mood=99', '--missing', 'loneliness=6-8', '--reported', PAPER, '--format', 'json',
    ]);
    expect(code).toBe(1);
    const json = refitOutputSchema.parse(JSON.parse(out));
    expect(json).toMatchObject({ n: 132, droppedRows: 18, type: 3, coding: 'sum', verdict: 'differs' });
    expect(json.terms.map((t) => t.term)).toEqual(['route', 'pace', 'loneliness', 'route:pace']); // by degree
    expect(Object.keys(json.terms[0]!)).toEqual(['term', 'ss', 'df', 'ms', 'F', 'p', 'partialEtaSquared']);
    expect(json.residual.df).toBe(125);
    expect(json.explanations![0]).toMatchObject({ slip: 'missing-codes-kept', reproduces: 'all', matches: 27, compared: 27 });
    expect(json.explanations![0]!.table.residual.df).toBe(143);
    expect(json.impliedN).toMatchObject({ impliedN: 150, analysedN: 132, rowsInFile: 150 });
  });

  it('exits 0 when the reported table matches (here: the slipped refit, reported as written)', async () => {
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--missing', 'mood=1000', '--missing', 'loneliness=1000', '--reported', PAPER]);
    expect(out).toContain('All 27 reported numbers match the refit.');
    expect(code).toBe(0);
  });

  it('exits 0 with nothing reported; the command line overrides the --spec file', async () => {
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, '--type', '1', '--format', 'json']);
    expect(code).toBe(0);
    const json = refitOutputSchema.parse(JSON.parse(out));
    expect(json.type).toBe(1);
    expect(json.verdict).toBe('nothing reported');
    expect(json.comparison).toBeUndefined();
  });

  it('reads numeric columns as factors with --factor, and states the treatment coding', async () => {
    const { code, out } = await run(['refit', fixturePath('refit/unbalanced_3x2_cov.csv'), '--model', 'score ~ group*dose + age', '--factor', 'dose', '--coding', 'treatment']);
    expect(code).toBe(0);
    expect(out).toContain('type III sums of squares, treatment (dummy) coding');
    expect(out).toMatch(/group × dose\s+[\d.]+\s+2\s/);
  });

  it('writes Markdown, a self-contained HTML table and a Word table', async () => {
    const md = await run(['refit', DATA, '--spec', SPEC, '--reported', PAPER, '--format', 'md']);
    expect(md.out).toContain('| Source | *SS* | *df* | *MS* | *F* | *p* | *η*p² |');
    expect(md.out).toContain('## What reproduces the reported numbers');

    const htmlFile = join(tmp, 'table.html');
    expect((await run(['refit', DATA, '--spec', SPEC, '--format', 'html', '--output', htmlFile])).code).toBe(0);
    const html = readFileSync(htmlFile, 'utf8');
    expect(html).toContain('<table class="anova">');
    expect(html).toMatch(/<td class="src">route × pace<\/td><td>44\.24<\/td><td>2<\/td>/);
    expect(html).not.toMatch(/<(link|script|img)\b|src=|href=/);

    const docxFile = join(tmp, 'table.docx');
    const docx = await run(['refit', DATA, '--spec', SPEC, '--format', 'docx', '--output', docxFile]);
    expect(docx.code).toBe(0);
    expect(docx.err).toContain(`wrote ${docxFile}`);
    const { value } = await mammoth.convertToHtml({ path: docxFile });
    expect(value).toContain('<table>');
    expect(value).toContain('route × pace');
    expect(value).toContain('540.07');
    expect(value).toContain('sum-to-zero (deviation) coding');
  });
});

describe('plumbline refit --format docx with a reported table', () => {
  it('carries the comparison, the slip that reproduces the reported numbers and the implied N', async () => {
    const docxFile = join(tmp, 'compared.docx');
    const { code } = await run(['refit', DATA, '--spec', SPEC, '--reported', PAPER, '--format', 'docx', '--output', docxFile]);
    expect(code).toBe(1);
    const { value } = await mammoth.convertToHtml({ path: docxFile });
    expect(value).toContain('<strong>Compared with corpus-demo/refit/harbour-walks-manuscript.md</strong>');
    expect(value).toMatch(/<td><p>route<\/p><\/td><td><p>Route<\/p><\/td><td><p>SS<\/p><\/td><td><p>1144\.25<\/p><\/td><td><p>230\.0230<\/p><\/td><td><p>\+914\.2270<\/p><\/td><td><p>differs<\/p><\/td>/);
    expect(value).toContain('<strong>What reproduces the reported numbers</strong>');
    expect(value).toContain('1. Missing-value codes left in the data as numbers (mood=99; loneliness=6-8 not removed): all 27 reported numbers match');
    expect(value).toContain('The reported error df 143 implies N = 150');
  });
});

describe('plumbline refit input errors (exit 2, with file, row and column)', () => {
  const cases: Array<[string, string[], RegExp]> = [
    ['a ragged row', [fixturePath('refit/ragged.csv'), '--model', 'score ~ group + age'], /ragged\.csv, row 4, column 4: 4 fields, but the header has 3 columns/],
    ['text in a numeric column', [fixturePath('refit/text_in_numeric.csv'), '--model', 'score ~ group + age'], /text_in_numeric\.csv, row 5, column 'age': "n\/a" is not a number/],
    ['an unknown column in the formula', [fixturePath('refit/unbalanced_3x2_cov.csv'), '--model', 'score ~ grup * dose'], /unbalanced_3x2_cov\.csv, row 1 \(header\), column 'grup': the model formula uses "grup", but there is no such column \(did you mean "group"\?\)/],
    ['an empty file', [fixturePath('refit/empty.csv'), '--model', 'score ~ group'], /empty\.csv, row 1, column 1: the file is empty/],
    ['a header without rows', [fixturePath('refit/header_only.csv'), '--model', 'score ~ group'], /header_only\.csv, row 2, column 1: the file has a header but no data rows/],
  ];
  for (const [what, argv, message] of cases) {
    it(what, async () => {
      const { code, err } = await run(['refit', ...argv]);
      expect(code).toBe(2);
      expect(err).toMatch(message);
    });
  }

  it('an unknown factor level', async () => {
    const spec = join(tmp, 'levels.json');
    writeFileSync(spec, JSON.stringify({ model: 'score ~ group + age', factors: { group: { levels: ['lo', 'mid'] } } }));
    const { code, err } = await run(['refit', fixturePath('refit/unbalanced_3x2_cov.csv'), '--spec', spec]);
    expect(code).toBe(2);
    // Every such cell in one run, then the advice in the description file's terms (the analysis came from --spec).
    expect(err).toMatch(/unbalanced_3x2_cov\.csv: 19 cells cannot be read; nothing was fitted:\n  row \d+, column 'group': value "hi" is not one of the declared levels \(lo, mid\)\n/);
    expect(err.match(/value "hi" is not one of the declared levels/g)).toHaveLength(19);
    expect(err).toContain("'group': add the values to the levels (factors.group.levels), or declare them missing (missing.group).");
  });

  it('usage: no model, docx without --output, a bad --missing, a missing file', async () => {
    expect((await run(['refit', DATA])).err).toContain('refit needs a model');
    expect((await run(['refit', DATA, '--spec', SPEC, '--format', 'docx'])).code).toBe(2);
    expect((await run(['refit', DATA, '--spec', SPEC, '--missing', 'mood'])).err).toContain('--missing "mood"');
    const missing = await run(['refit', join(tmp, 'nope.csv'), '--model', 'y ~ a']);
    expect(missing.code).toBe(2);
    expect(missing.err).toContain('no such data file');
    expect(existsSync(join(tmp, 'nope.csv'))).toBe(false);
    expect((await run(['refit', DATA, '--spec', SPEC, '--max-columns', 'many'])).err).toContain('--max-columns must be a whole number from 2 to 4,000, got "many"');
  });

  it('--max-columns below the model width stops with exit code 2 and says how to go on', async () => {
    const { code, err } = await run(['refit', DATA, '--spec', SPEC, '--max-columns', '5']);
    expect(code).toBe(2);
    expect(err).toMatch(/The model has \d+ design columns, more than maxColumns = 5\. The interactions of the factors make the design this wide: drop some interaction terms, or raise the limit with --max-columns \d+/);
  });
});

describe('refit JSON schema', () => {
  it('schema/refit.schema.json is the one generated from the zod model (npm run schema:refit)', () => {
    const committed = JSON.parse(readFileSync('schema/refit.schema.json', 'utf8')) as unknown;
    expect(committed).toEqual(JSON.parse(JSON.stringify(refitJsonSchema())));
  });
});

describe('the workflow in corpus-demo/refit/README.md', () => {
  const readme = readFileSync(demo('README.md'), 'utf8');
  const workflow = ['--labels', 'pace=self:self-paced,guided:guided', '--means', 'route', '--adjust', 'tukey', '--contrast', 'route=0.5,0.5,-1'];

  it('prints what the README shows: the comparison, then the ANCOVA with adjusted means, Tukey, the contrast and the slopes test', async () => {
    const compared = await run(['refit', DATA, '--spec', SPEC, '--reported', PAPER]);
    expect(compared.code).toBe(1);
    expect(readme).toContain(compared.out);
    const { code, out } = await run(['refit', DATA, '--spec', SPEC, ...workflow]);
    expect(code).toBe(0);
    expect(readme).toContain(out);
    expect(out).toMatch(/harbour - indoor\s+3\.32\s+0\.80\s+125\s+4\.15\s+< \.001/);
    expect(out).toMatch(/harbour \+ park vs indoor\s+harbour 0\.5; park 0\.5; indoor -1\s+2\.55\s+0\.68\s+125\s+3\.74\s+< \.001/);
    expect(out).toContain('Homogeneity of regression slopes (loneliness × route, loneliness × pace, loneliness × route × pace added to the model and tested together): F(5, 120) = 0.25');
    expect(out).toContain('harbour  self-paced  22  24.14');
  });

  it('exports the tables as a Word file', async () => {
    const docxFile = join(tmp, 'harbour-walks-tables.docx');
    const { code, err } = await run(['refit', DATA, '--spec', SPEC, ...workflow, '--slopes', '--format', 'docx', '--output', docxFile]);
    expect(code).toBe(0);
    expect(err).toContain(`wrote ${docxFile}`);
    const { value } = await mammoth.convertToHtml({ path: docxFile });
    for (const title of ['Estimated marginal means of mood by route', 'Pairwise comparisons of mood by route, Tukey-Kramer adjustment', 'Planned contrasts of the estimated marginal means of mood']) {
      expect(value).toContain(title);
    }
    expect(value).toContain('harbour + park vs indoor');
    expect(value).toContain('self-paced');
    expect(value).toContain('Homogeneity of regression slopes');
  });
});
