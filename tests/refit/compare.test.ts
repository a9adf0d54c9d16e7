import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { agrees, compareTables } from '../../src/refit/compare.js';
import { parseFormula } from '../../src/refit/formula.js';
import { fitModel } from '../../src/refit/model.js';
import {
  columnMeaning,
  matchTerm,
  parseCell,
  parseTermMap,
  readAnovaRows,
  readReported,
  tablesInText,
  textResults,
} from '../../src/refit/reportedTable.js';
import { fixturePath } from './helpers.js';

const spec = { factors: { group: { levels: ['lo', 'mid', 'hi'] }, dose: {} }, covariates: ['age'], model: 'score ~ group*dose + age' };
const terms = parseFormula(spec.model).terms;
const tmp = mkdtempSync(join(tmpdir(), 'plumbline-refit-'));

describe('reading reported numbers', () => {
  it('knows the usual column headers', () => {
    expect(['Source', 'Effect', ''].map(columnMeaning)).toEqual(['label', 'label', 'label']);
    expect(['SS', 'Type III Sum of Squares', 'sum_sq'].map(columnMeaning)).toEqual(['ss', 'ss', 'ss']);
    expect(['df', 'd.f.', 'MS', 'Mean Square', 'F', 'F value', 'p', 'Sig.', 'Pr(>F)'].map(columnMeaning)).toEqual(['df', 'df', 'ms', 'ms', 'F', 'F', 'p', 'p', 'p']);
    expect(['Partial Eta Squared', 'ηp²', 'η²p', 'partial η2', 'pes'].map(columnMeaning)).toEqual(Array(5).fill('partialEtaSquared'));
    expect(columnMeaning('Observed power')).toBeNull();
  });

  it('keeps printed decimals and comparators', () => {
    expect(parseCell('4.20')).toMatchObject({ value: 4.2, decimals: 2, comparator: '=' });
    expect(parseCell('< .001')).toMatchObject({ value: 0.001, comparator: '<' });
    expect(parseCell('p < .001')).toMatchObject({ value: 0.001, comparator: '<' });
    expect(parseCell('6.12**')).toMatchObject({ value: 6.12, decimals: 2 });
    expect(parseCell('.000')).toMatchObject({ value: 0, decimals: 3 });
    expect(parseCell('—')).toBeNull();
    expect(parseCell('')).toBeNull();
  });

  it('matches row labels to terms: case, ×, x, *, by, and --map', () => {
    expect(matchTerm('Group', terms)?.name).toBe('group');
    expect(matchTerm('Dose × Group', terms)?.name).toBe('group:dose');
    expect(matchTerm('group x dose', terms)?.name).toBe('group:dose');
    expect(matchTerm('GROUP*DOSE', terms)?.name).toBe('group:dose');
    expect(matchTerm('Group by Dose', terms)?.name).toBe('group:dose');
    expect(matchTerm('Age group', terms)).toBeNull();
    const map = parseTermMap(['Treatment arm=group', 'Age in years=age']);
    expect(matchTerm('Treatment arm × Dose', terms, map)?.name).toBe('group:dose');
    expect(matchTerm('Age in years', terms, map)?.name).toBe('age');
    expect(() => parseTermMap(['nonsense'])).toThrow(/--map "nonsense"/);
  });

  it('reads a table with any column order and a subset of columns; the error row apart', () => {
    const table = readAnovaRows(
      [
        ['p', 'F', 'Source', 'df'],
        ['.001', '8.20', 'Group', '2'],
        ['', '', 'Error', '45'],
        ['', '', 'Total', '52'],
      ],
      'test',
    )!;
    expect(table.rows).toHaveLength(1);
    expect(table.rows[0]!.label).toBe('Group');
    expect(table.rows[0]!.values.F!.text).toBe('8.20');
    expect(table.residual!.values.df!.value).toBe(45);
  });

  it('finds pipe tables and space-aligned tables in text', () => {
    const text = ['Intro.', '', '| Source | SS | df |', '|---|---:|---:|', '| A | 1.00 | 1 |', '', 'Source    SS     df   F', 'A         1.00   1    2.00', 'Error     9.00   18'].join('\n');
    const found = tablesInText(text);
    expect(found.map((t) => t.line)).toEqual([3, 7]);
    expect(found[0]!.cells).toEqual([['Source', 'SS', 'df'], ['A', '1.00', '1']]);
    expect(found[1]!.cells[2]).toEqual(['Error', '9.00', '18', '']);
  });

  it('assigns written F results to the term their sentence names', () => {
    const text =
      'The main effect of group was significant, F(2, 45) = 8.20, p = .001. Dose mattered too, F(1, 45) = 4.10, p = .049. ' +
      'The group by dose interaction was not, F(2, 45) = 1.20, p = .311, ηp² = .051.';
    const found = textResults(text, terms);
    expect(found.map((f) => f.term.name)).toEqual(['group', 'dose', 'group:dose']);
    expect(found[2]!.row.values.partialEtaSquared!.text).toBe('.051');
    expect(found[0]!.errorDf!.value).toBe(45);
  });

  it('reads a CSV table file and an HTML manuscript table', async () => {
    const csv = join(tmp, 'table.csv');
    writeFileSync(csv, 'Source,Sum of Squares,df,Mean Square,F,Sig.\nGroup,183.02,2,91.51,37.53,<.001\nError,109.71,45,2.44,,\n');
    const fromCsv = await readReported(csv, terms);
    expect(fromCsv.sources).toEqual(['table file']);
    expect(fromCsv.rows[0]!.values.p).toMatchObject({ comparator: '<', value: 0.001 });
    const html = join(tmp, 'paper.html');
    writeFileSync(
      html,
      '<html><body><p>Results follow.</p><table><caption>Table 1</caption><tr><th>Source</th><th>F</th><th>p</th></tr>' +
        '<tr><td>Group × Dose</td><td>2.60</td><td>.086</td></tr></table></body></html>',
    );
    const fromHtml = await readReported(html, terms);
    expect(fromHtml.rows[0]!.label).toBe('Group × Dose');
    expect(fromHtml.sources[0]).toMatch(/manuscript table 1/);
  });

  it('refuses a table file without a recognisable header', async () => {
    const csv = join(tmp, 'nothing.csv');
    writeFileSync(csv, 'a,b\n1,2\n');
    await expect(readReported(csv, terms)).rejects.toThrow(/nothing\.csv, row 1: no table header found; name the columns of an ANOVA table like Source, SS/);
  });
});

describe('comparing', () => {
  it('allows for the printed rounding', () => {
    const v = (t: string) => parseCell(t)!;
    expect(agrees(4.2149, v('4.21'))).toBe(true);
    expect(agrees(4.2151, v('4.21'))).toBe(false);
    expect(agrees(4.25, v('4.2'))).toBe(true);
    expect(agrees(0.0004, v('< .001'))).toBe(true);
    expect(agrees(0.0011, v('< .001'))).toBe(false);
    expect(agrees(0.0004, v('.000'))).toBe(true);
    expect(agrees(45, v('45'))).toBe(true);
    expect(agrees(44, v('45'))).toBe(false);
  });

  it('puts each reported number beside the recomputed one with the difference and a verdict', async () => {
    const table = (await fitModel(fixturePath('refit/unbalanced_3x2_cov.csv'), spec)).anova();
    const group = table.terms[0]!;
    const csv = join(tmp, 'compare.csv');
    writeFileSync(csv, `Source,F,df,p\nGroup,${group.F.toFixed(2)},2,< .001\nGroup x Dose,9.99,2,.5\nPlacebo,1.00,1,.3\n`);
    const comparison = compareTables(table, await readReported(csv, terms));
    const groupRow = comparison.rows.find((r) => r.term === 'group')!;
    expect(groupRow.reportedLabel).toBe('Group');
    expect(groupRow.numbers.find((n) => n.quantity === 'F')).toMatchObject({ verdict: 'matches', reported: group.F.toFixed(2) });
    expect(groupRow.numbers.find((n) => n.quantity === 'p')).toMatchObject({ verdict: 'matches', reported: '< .001' });
    expect(groupRow.numbers.find((n) => n.quantity === 'ss')!.verdict).toBe('not reported');
    const interaction = comparison.rows.find((r) => r.term === 'group:dose')!.numbers.find((n) => n.quantity === 'F')!;
    expect(interaction.verdict).toBe('differs');
    expect(interaction.difference).toBeCloseTo(9.99 - table.terms.find((t) => t.term === 'group:dose')!.F, 12);
    expect(comparison.rows.find((r) => r.term === 'age')!.reportedLabel).toBeNull();
    expect(comparison.unmatched).toEqual([{ label: 'Placebo', where: 'table file' }]);
    expect(comparison.allMatch).toBe(false);
    expect(comparison.compared).toBe(6);
    expect(comparison.matches).toBe(4);
  });
});
