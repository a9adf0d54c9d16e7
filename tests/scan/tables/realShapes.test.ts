/**
 * Table shapes as real documents give them, each read from a passage of the
 * real corpus (tests/corpus/real/passages/<id>.txt; source, licence and
 * attribution in tests/corpus/real/labels/<id>.json). The expected values
 * are the passage's own printed numbers, read by eye.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { plainTextDocument } from '../../../src/documents/text.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';
import { findTextTables } from '../../../src/scan/tables/index.js';
import type { ReportedResult } from '../../../src/scan/types.js';

const passage = (id: string): string => readFileSync(join(__dirname, '..', '..', 'corpus', 'real', 'passages', `${id}.txt`), 'utf8');

function scan(id: string) {
  const text = passage(id);
  return { text, ...scanDocument(plainTextDocument(`${id}.txt`, 'text', text)) };
}

function summary(result: ReportedResult): string {
  const df = result.df.map((d) => d.text).join(', ');
  const p = result.p ? ` p ${result.p.comparator} ${result.p.value.text}` : result.notSignificant ? ' ns' : '';
  return `${result.kind}(${df}) ${result.valueComparator} ${result.value?.text}${p}`;
}

describe('real table shapes', () => {
  it('one cell per line, df in the header "F(1,367)", footnote letters on p (prose-07)', () => {
    const { results } = scan('prose-07');
    const tabled = results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(14);
    expect(summary(tabled[0]!)).toBe('F(1, 367) = 5.31 p = .022');
    expect(summary(tabled[6]!)).toBe('F(1, 367) = 13.75 p < .001');
    expect(tabled[4]!.valueComparator).toBe('<');
  });

  it('one cell per line with pipes, split-plot error rows (soft-07)', () => {
    const { results } = scan('soft-07');
    expect(results.map(summary)).toEqual([
      'F(1, 18) = 0.33 p = 0.5714',
      'F(3, 54) = 13.51 p < .0001',
      'F(3, 54) = 1.40 p = 0.2518',
      'F(2, 36) = 71.44 p < .0001',
      'F(2, 36) = 0.37 p = 0.6916',
      'F(6, 108) = 1.03 p = 0.4085',
      'F(6, 108) = 1.05 p = 0.4002',
    ]);
  });

  it('cells run together, cut by the printed decimals and MS = SS/df (soft-01)', () => {
    const { text, results } = scan('soft-01');
    const [table] = findTextTables(text);
    expect(table!.layout).toBe('glued');
    expect(table!.rows[1]).toEqual(['Corrected model', '3251.202a', '12', '270.933', '38.319', '0.000', '0.774']);
    expect(results.map((result) => `${result.tableRow!.rowLabel}: ${summary(result)}`).slice(0, 3)).toEqual([
      'Corrected model: F(12, 134) = 38.319 p = 0.000',
      'Intercept: F(1, 134) = 60.554 p = 0.000',
      'Pretest: F(1, 134) = 262.328 p = 0.000',
    ]);
    for (const result of results) expect(text.slice(result.tableRow!.cells.statistic!.start, result.tableRow!.cells.statistic!.end)).toBe(result.value!.text);
  });

  it('blank lines between rows, "t value (df)" cells, a footnote letter as a cell (tab-01)', () => {
    const { results } = scan('tab-01');
    expect(results).toHaveLength(14);
    expect(summary(results[0]!)).toBe('t(15) = 4.842 p < .001');
    expect(results[0]!.effects.map((effect) => [effect.kind, effect.value.text])).toEqual([['cohens-d', '1.21']]);
  });

  it('a pipe header without its label column, both df in one cell "2, 180" (tab-06)', () => {
    const { results } = scan('tab-06');
    expect(results).toHaveLength(19);
    expect(summary(results[0]!)).toBe('F(2, 180) = 87.41 p < 0.001');
    expect(results[0]!.effects[0]!.value.text).toBe('0.52');
  });

  it('side-by-side blocks with M (SD) cells before them and N/A cells after them (tab-02)', () => {
    const { results } = scan('tab-02');
    expect(results.slice(0, 3).map(summary)).toEqual(['t(33) = 3.48 p = .001', 't(62) = 0.17 p = .87', 't(29) = 1.48 p = .15']);
    expect(results[1]!.effects[0]!.interval).not.toBeNull();
  });

  it('lists results tables it cannot read in full, with the reason (soft-09 and web-02: statistics read without df)', () => {
    expect(scan('soft-09').tablesNotRead.map((table) => table.reason)).toEqual(['read-without-df']);
    const web02 = scan('web-02');
    // Each variable's chi-square stands on its own row above the rows of counts of its categories ("≤50 62 (29.4%)
    // …"), which are kept in the table as rows that hold no test: every chi-square is read, none with df (none printed).
    expect(web02.results.map(summary).slice(0, 3)).toEqual(['chi2() = 5.343 p = 0.254', 'chi2() = 2.494 p = 0.287', 'chi2() = 5.827 p = 0.437']);
    expect(web02.results).toHaveLength(10);
    expect(web02.tablesNotRead.map((table) => [table.reason, table.end])).toEqual([['read-without-df', web02.text.trimEnd().length]]);
  });
});

describe('real table shapes: blocks side by side', () => {
  it('titles spanning the blocks give each block its numerator df, "D. df" its denominator (soft-04)', () => {
    const { results, tablesNotRead } = scan('soft-04');
    expect(tablesNotRead).toEqual([]);
    expect(results.slice(0, 3).map(summary)).toEqual(['F(1, 686.1) = 676.4 p < 0.01', 'F(7, 679.0) = 181.9 p < 0.01', 'F(7, 677.9) = 128.5 p < 0.01']);
  });

  it('df pairs with decimals, one with a decimal comma typed by mistake (more-04)', () => {
    const { results } = scan('more-04');
    expect(results.find((result) => result.value?.text === '10.72')!.df.map((df) => df.value)).toEqual([2.67, 58.83]);
  });
});

describe('a table result restated in the text', () => {
  it('is one result with both places (tab-06 with its first row restated below it)', () => {
    const text = `${passage('tab-06')}\nPerceived restoration differed by location, F(2, 180) = 87.41, p < 0.001.\n`;
    const results = scanDocument(plainTextDocument('tab-06.txt', 'text', text)).results;
    const restored = results.filter((result) => result.value?.text === '87.41');
    expect(restored).toHaveLength(1);
    expect(restored[0]!.tableRow).toBeDefined();
    expect(restored[0]!.alsoAt).toHaveLength(1);
    expect(text.slice(restored[0]!.alsoAt![0]!.start, restored[0]!.alsoAt![0]!.end)).toBe('F(2, 180) = 87.41, p < 0.001');
  });

  it('stays two results when the text prints other numbers', () => {
    const text = `${passage('tab-06')}\nPerceived restoration differed by location, F(2, 180) = 87.41, p = .04.\n`;
    expect(scanDocument(plainTextDocument('tab-06.txt', 'text', text)).results.filter((result) => result.value?.text === '87.41')).toHaveLength(2);
  });
});

describe('real table shapes: headers whose spanning cells lost their widths in the copy', () => {
  // divf-01: "F (dfM, dfR) | p | η² | T0–1 | T0–2 | F (dfM, dfR) | p | η²" over rows whose T0–1 and T0–2
  // each hold two cells (d and its CI), and group rows that lost the two cells spanning them.
  it('spreads the header over the columns, reads "9.34 (2, 98)" under "F (dfM, dfR)", and leaves the within-group d alone', () => {
    const tabled = scan('divf-01').results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(12);
    expect(summary(tabled[0]!)).toBe('F(2, 98) = 9.34 p < 0.001');
    expect(summary(tabled[1]!)).toBe('F(4, 98) = 0.57 p = 0.687');
    expect(tabled[1]!.effects.map((effect) => [effect.kind, effect.value.text])).toEqual([['eta-squared', '0.02']]);
    expect(summary(tabled[8]!)).toBe('F(1.48, 72.71) = 1.19 p = 0.3');
  });
});

describe('real table shapes: correlation tables', () => {
  it('reads "Benefits r" and "Barriers r" columns with df from the N column, and the Fisher\'s Z beside them, each with the p its stars give (divf-02)', () => {
    // The legend "*p < .05, **p < .005, ***p < .001" stands three lines under the table, after other notes.
    const tabled = scan('divf-02').results.filter((result) => result.tableRow);
    const depression = tabled.filter((result) => result.tableRow!.rowLabel.startsWith('DASS-Depression'));
    expect(depression.map(summary)).toEqual(['r(464) = 0.03', 'r(464) = 0.725 p < .001', 'z() = 12.314 p < .001']);
    expect(depression.map((result) => result.p?.fromMarks ?? null)).toEqual([null, '***', '***']);
    expect(depression[2]!.effects).toEqual([]);
    const swls = tabled.filter((result) => result.tableRow!.rowLabel.startsWith('SWLS'));
    expect(swls.map(summary)).toEqual(['r(480) = 0.271 p < .001', 'r(480) = 0.092 p < .05', 'z() = 2.719 p < .005']);
  });

  it('reads crushed "r (P value)" blocks, "−0.50 (<.001)", with N from a caption three lines up (divf-03)', () => {
    const tabled = scan('divf-03').results.filter((result) => result.tableRow);
    expect(tabled.slice(0, 2).map(summary)).toEqual(['r(73) = -0.06 p = .60', 'r(73) = -0.50 p < .001']);
  });
});

describe('a header named "Model R" or "Partial r" is not a Pearson r column', () => {
  it('leaves both alone', async () => {
    const { classifyHeader } = await import('../../../src/scan/tables/cells.js');
    expect(classifyHeader('Model R').role).toBe('unknown');
    expect(classifyHeader('Partial r').role).toBe('unknown');
    expect(classifyHeader('Benefits r')).toMatchObject({ role: 'statistic', kind: 'r' });
    expect(classifyHeader('Sex f').role).toBe('unknown');
  });
});

describe('real table shapes: crushed side-by-side blocks whose short rows leave cells out', () => {
  // web-06: "n Mean SD p (d) 1-β r p 1-β" twice; the Low SOC rows fill every column, "0.048* (0.51)" under
  // "p (d)"; the High SOC rows print neither "p (d)" nor the first 1-β, so which of "0.28 0.134 0.32" is r is
  // not decided by the cells: those rows are left unread rather than guessed.
  it('reads the full rows with df from each block\'s n and reads nothing wrong from the short rows', () => {
    const { results, tablesNotRead } = scan('web-06');
    expect(results.map(summary)).toEqual([
      'r(30) = 0.47 p = 0.007',
      'r(14) = 0.17 p = 0.525',
      'r(30) = 0.39 p = 0.029',
      'r(14) = 0.14 p = 0.602',
      'r(30) = -0.44 p = 0.012',
      'r(14) = -0.19 p = 0.474',
    ]);
    expect(tablesNotRead.map((table) => table.reason)).toEqual(['cells-not-placed']);
  });
});

describe('real table shapes: tables printed on their side', () => {
  // divc-04: columns are subtests, rows are "T (14)" and "P", one cell per line, a second block after an empty cell.
  it('pairs the "T (14)" row with the "P" row value by value, df from the row name (divc-04)', () => {
    const tabled = scan('divc-04').results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(15);
    expect(tabled.slice(0, 5).map(summary)).toEqual(['t(14) = 10.07 p < 0.0001', 't(14) = 3.48 p = 0.004', 't(14) = -0.61 p = 0.55', 't(14) = 5.37 p < 0.0001', 't(14) = 1.51 p = 0.16']);
  });

  it('reads the same shape as pipe rows, and nothing from a statistic row without a p row', () => {
    const piped = scanDocument(plainTextDocument('side.txt', 'text', 'Table 3. Tests against chance\n| | Rhythm | Chords |\n| t(20) | 2.10 | 0.45 |\n| p | .048 | .66 |\n')).results;
    expect(piped.map(summary)).toEqual(['t(20) = 2.10 p = .048', 't(20) = 0.45 p = .66']);
    const alone = scanDocument(plainTextDocument('side.txt', 'text', 'Table 3. Scores\n| | Rhythm | Chords |\n| t(20) | 2.10 | 0.45 |\n| M | 3.1 | 2.2 |\n')).results;
    expect(alone).toEqual([]);
  });
});

describe('a measure whose name starts with "Total" is not a Total row', () => {
  it('reads the "Total phenolics" row (divd-02)', () => {
    const tabled = scan('divd-02').results.filter((result) => result.tableRow);
    expect(tabled.filter((result) => result.tableRow!.rowLabel.startsWith('Total phenolics')).map(summary)).toEqual(['F(1, 19) = 0.86 p = 0.365', 'F(1, 198) = 11.85 p = 0.001', 'F(1, 198) = 0.49 p = 0.483']);
  });
});

describe('a column named by an abbreviation its notes define', () => {
  // divc-03: "ES" over the effect sizes, and under the table "ES effect size (Cohen’s d)"; rows of non-significant
  // tests leave ES empty.
  it('reads ES as Cohen\'s d, and reads the rows that leave it empty', () => {
    const tabled = scan('divc-03').results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(17);
    expect(tabled[0]!.effects.map((effect) => [effect.kind, effect.value.text])).toEqual([['cohens-d', '0.69']]);
    expect(tabled.find((result) => result.value?.text === '2.157')?.effects).toEqual([]);
  });
});

describe('a crushed row with a written result, its effect size, an interval and a p with a second p in brackets', () => {
  // divc-06: "PHQ-9e –0.53 –0.24 –0.53 F(2,75)=0.31 .008 0.000-0.048 .74 (.99f)" under
  // "Statistic | Effect size (ηp2) | 90% CI | P value".
  it('gives the written F the row\'s partial eta squared and its first p', () => {
    const results = scan('divc-06').results;
    const first = results.find((result) => result.value?.text === '0.31')!;
    expect(summary(first)).toBe('F(2, 75) = 0.31 p = .74');
    expect(first.effects.map((effect) => [effect.kind, effect.value.text])).toEqual([['partial-eta-squared', '.008']]);
  });
});

describe('a correlation matrix (divl-08)', () => {
  // Lower triangle after M and SD columns, stars as tokens of their own, "N = 60" and the stars' legend in the note,
  // a footnote digit between a label and its M ("3. BDI 1 19.2 10.83").
  it('reads every correlation with df N - 2, its row and column, and the p bound its stars give', () => {
    const { text, results } = scan('divl-08');
    const tabled = results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(36);
    expect(tabled.every((result) => result.kind === 'r' && result.df[0]?.value === 58 && result.dfFrom === 'sample-size')).toBe(true);
    const bdi = tabled.find((result) => result.tableRow!.rowLabel === 'BDI 1 \u00d7 GAD' || result.tableRow!.rowLabel === 'BDI \u00d7 GAD')!;
    expect(bdi.value?.text).toBe('0.47');
    expect(bdi.p).toMatchObject({ comparator: '<', fromMarks: '***' });
    expect(bdi.p!.value.text).toBe('0.001');
    expect(text.slice(bdi.start, bdi.end)).toBe('0.47 ***');
    const unmarked = tabled.find((result) => result.value?.value === -0.14)!;
    expect(unmarked.tableRow!.rowLabel).toBe('Age \u00d7 GAD');
    expect(unmarked.p).toBeNull();
    const last = tabled[tabled.length - 1]!;
    expect(last.tableRow!.rowLabel).toBe('Sad face, other-shape RTs \u00d7 Neutral face, other-shape RTs');
    expect(last.value?.text).toBe('0.81');
  });

  it('reads the same matrix from pipe rows with the marks glued to the values', () => {
    const { text } = scan('divl-08');
    // Each matrix line as pipe cells: the label (up to its first number after the variable's own), then one
    // cell per number with its stars glued on, as a web page's table gives it.
    const asPipes = (line: string): string => {
      const words = line.split(' ');
      const firstNumber = words.findIndex((word, index) => index > 0 && /^[\u2212-]?\d*\.?\d+$/.test(word));
      const cells = [words.slice(0, firstNumber).join(' ')];
      for (const word of words.slice(firstNumber)) {
        if (/^\*{1,3}$/.test(word)) cells[cells.length - 1] += word;
        else cells.push(word);
      }
      return `| ${cells.join(' | ')} |`;
    };
    const piped = text
      .split('\n')
      .map((line) => (/^\d\. /.test(line) || line.startsWith('Variables') ? asPipes(line) : /variables?$/.test(line) ? `| ${line} |` : line))
      .join('\n');
    const results = scanDocument(plainTextDocument('matrix.txt', 'text', piped)).results.filter((result) => result.tableRow);
    expect(results).toHaveLength(36);
    expect(results.filter((result) => result.p?.fromMarks === '***')).toHaveLength(scan('divl-08').results.filter((result) => result.p?.fromMarks === '***').length);
  });

  it('is not read as a correlation matrix when nothing says it holds correlations', () => {
    const text = passage('divl-08').replace(/Correlations between/, 'Values of').replace(/correlat/gi, 'relat');
    const results = scanDocument(plainTextDocument('matrix.txt', 'text', text)).results.filter((result) => result.tableRow);
    expect(results).toEqual([]);
  });
});

describe('PDF text with rows run together and Spearman columns (divl-02)', () => {
  // "- TABLE 5 |" title, a header "Name Side ρ P ρ P ρ P ρ P", two or three rows glued onto each line, no N printed.
  it('reads every ρ with its P as a Spearman correlation without df, row by row', () => {
    const { results } = scan('divl-02');
    const tabled = results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(84);
    expect(tabled.every((result) => result.kind === 'r' && result.symbol === 'rs' && result.df.length === 0)).toBe(true);
    // (The "Side" cell of BI is a lone dash, which stays with the label.)
    expect(tabled.slice(0, 5).map((result) => `${result.tableRow!.rowLabel}: ${result.value?.value} p ${result.p?.comparator} ${result.p?.value.text}`)).toEqual([
      'BI \u2212: -0.26 p = 0.138',
      'BI \u2212: 0.058 p = 0.743',
      'BI \u2212: -0.154 p = 0.383',
      'BI \u2212: 0.184 p = 0.296',
      'FTRS Healthy: -0.038 p = 0.829',
    ]);
    expect(tabled.find((result) => result.tableRow!.rowLabel.startsWith('MOCA'))?.value?.value).toBe(0.005);
  });
});

describe('rows of another table under an ANOVA header (divl-03)', () => {
  // Two tables' captions and rows interleaved by the PDF's columns: the descriptive rows of Table 1 ("Healthy 32
  // 42.3 15.4 13 19") stand under Table 2's header "One-way ANOVA SS Df MS F P".
  it('reads none of them (placed under SS, df and MS they do not keep MS = SS/df), only the ANOVA row with its Error row', () => {
    const tabled = scan('divl-03').results.filter((result) => result.tableRow);
    expect(tabled.map(summary)).toEqual(['F(2, 29) = 0.3843 p = 0.6844']);
  });
});

describe('a Portuguese table with decimal commas and rows of one value between its rows (divm-01)', () => {
  // "Coeficiente de correlação de Pearson | Valor de p" over rows "Idade -0,148 0,057 *", with rows that print a
  // p alone ("Sexo 0,939", a t test's) and subgroup rows of M (DP) ("Feminino 8,5 (1,5)") in between.
  it('reads each correlation with its p and nothing from the rows of one value', () => {
    const tabled = scan('divm-01').results.filter((result) => result.tableRow);
    expect(tabled.map((result) => `${result.tableRow!.rowLabel}: r = ${result.value?.value}, p ${result.p?.comparator} ${result.p?.value.value}`)).toEqual([
      'Idade: r = -0.148, p = 0.057',
      'CCEB (1 MD): r = -0.136, p = 0.08',
      'Escolaridade, anos: r = -0.058, p = 0.455',
      'Suporte social de acordo com o MOS: r = -0.063, p = 0.08',
      'Duração da doença, anos: r = 0.081, p = 0.455',
      'Conhecimento sobre o diabetes de acordo com o SKILLD: r = -0.09, p = 0.248',
      'ICFT: r = 0.317, p < 0.001',
      'IMC, kg/m2(6 MD): r = 0.192, p = 0.015',
      'SAHLPA: r = -0.121, p = 0.12',
    ]);
  });
});

describe('correlation tables whose columns are named by variables', () => {
  it('reads a grid of r with stars, one cell per line, the columns named by the outcomes (divo-04)', () => {
    // "Table 2 Correlations amongst ..." over "BDQ Physical / BDQ Mental-health / BDQ Functional / SF-12 Wellbeing",
    // rows "HDRS / .72** / .70** / .77*** / -.49*", a footnote letter set apart after some stars ("-.51* a").
    const tabled = scan('divo-04').results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(44);
    const hdrs = tabled.filter((result) => result.tableRow!.rowLabel.startsWith('HDRS'));
    expect(hdrs.map((result) => `${result.tableRow!.rowLabel}: ${result.value?.value} ${result.p?.fromMarks ?? ''}`)).toEqual([
      'HDRS \u00d7 BDQ Physical: 0.72 **',
      'HDRS \u00d7 BDQ Mental-health: 0.7 **',
      'HDRS \u00d7 BDQ Functional: 0.77 ***',
      'HDRS \u00d7 SF-12 Wellbeing: -0.49 *',
    ]);
    expect(tabled.every((result) => result.kind === 'r' && result.df.length === 0)).toBe(true);
  });

  it('reads three named matrices side by side, upper triangles with a dash on the diagonal, df from the note\'s N (divn-07)', () => {
    const tabled = scan('divn-07').results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(30);
    expect(tabled.every((result) => result.df[0]?.value === 278)).toBe(true);
    expect(tabled.slice(0, 5).map((result) => `${result.tableRow!.rowLabel}: ${result.value?.value}`)).toEqual([
      'STAI \u00d7 TAI: 0.5',
      'STAI \u00d7 SAQ-S: 0.43',
      'STAI \u00d7 MARS: 0.5',
      'STAI \u00d7 WA*: -0.26', // (the row label prints a footnote star: "WA*")
      'Trait \u00d7 Test: 0.57',
    ]);
  });

  it('leaves a table alone when its caption does not say it holds correlations, or says they are partial', () => {
    for (const caption of ['Table 2 Scores amongst', 'Table 2 Partial correlations amongst']) {
      const text = passage('divo-04').replace('Table 2 Correlations amongst', caption);
      expect(scanDocument(plainTextDocument('grid.txt', 'text', text)).results.filter((result) => result.tableRow)).toEqual([]);
    }
  });
});

describe('a Spearman grid in one cell per line, its caption on a long line of its own (divq-07)', () => {
  // The pipe rows of divq-07 rendered one cell per line: cells moved, never changed.
  it('reads the coefficients as Spearman correlations, each with the p bound of its daggers', () => {
    const lines = passage('divq-07')
      .split('\n')
      .filter((line) => !/^\s*\|?\s*-{3,}/.test(line))
      .map((line) => (line.includes('|') ? line.replace(/^\s*\|\s*/, '').replace(/\s*\|\s*$/, '').split(/\s*\|\s*/).map((cell) => (cell === '' ? ' ' : cell)).join('\n\n') : line))
      .join('\n\n');
    const tabled = scanDocument(plainTextDocument('grid.txt', 'text', lines)).results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(18);
    expect(tabled.every((result) => result.kind === 'r' && result.symbol === 'rs')).toBe(true);
    expect(tabled.slice(0, 2).map((result) => `${result.tableRow!.rowLabel}: ${result.value?.value} p ${result.p?.comparator} ${result.p?.value.text}`)).toEqual([
      'Gait speed \u00d7 MMSE: 0.449 p < 0.01',
      'Gait speed \u00d7 ACE-R: 0.43 p < 0.01',
    ]);
  });
});

describe('a numbered correlation matrix with dashes in the other triangle and a trailing pipe (divt-02)', () => {
  it('reads each r below the diagonal with df N − 2 from the caption (the excerpt ends before the note defining the marks: no p)', () => {
    const { results } = scan('divt-02');
    const tabled = results.filter((result) => result.tableRow);
    expect(tabled).toHaveLength(66);
    expect(tabled.every((result) => result.kind === 'r' && result.df.map((df) => df.text).join() === '75')).toBe(true);
    const first = tabled[0]!;
    expect([first.value?.text, first.p]).toEqual(['0.58', null]);
  });
});

describe('the same numbered matrix crushed into single spaces (divt-02 re-rendered)', () => {
  it('keeps the first row of dashes as a row and reads the correlations below the diagonal', () => {
    const lines = passage('divt-02')
      .split('\n')
      .filter((line) => !/^\s*-{3}\|/.test(line))
      .map((line) => (line.includes('|') ? line.split('|').map((cell) => cell.trim()).filter((cell) => cell !== '').join(' ') : line));
    const results = scanDocument(plainTextDocument('crushed.txt', 'text', lines.join('\n'))).results.filter((result) => result.tableRow);
    expect(results.length).toBeGreaterThanOrEqual(60);
    expect(results.every((result) => result.kind === 'r' && Math.abs(result.value!.value) <= 1)).toBe(true);
  });
});

describe('the same numbered matrix one cell per line (divt-02 re-rendered)', () => {
  it('reads the numbered header, the caption line under the title, and the correlations below the diagonal', () => {
    const lines = passage('divt-02')
      .split('\n')
      .filter((line) => !/^\s*-{3}\|/.test(line))
      .flatMap((line) => (line.includes('|') ? line.split('|').map((cell) => cell.trim()).filter((cell) => cell !== '') : [line]));
    const results = scanDocument(plainTextDocument('lines.txt', 'text', lines.join('\n\n'))).results.filter((result) => result.tableRow);
    expect(results).toHaveLength(66);
    expect(results.every((result) => result.kind === 'r' && result.df.map((df) => df.text).join() === '75')).toBe(true);
  });
});

describe("group columns of M (SD) before F and p columns, crushed, no df anywhere (divb-07)", () => {
  it('reads each F beside its p without df, after the M (SD) cells the row gives back to its label', () => {
    const { results } = scan('divb-07');
    const row = results.filter((result) => result.tableRow && result.text.startsWith('APA duration'));
    expect(row.map((result) => [result.value?.text, result.df.length, result.p?.value.text])).toEqual([
      ['0.628', 0, '0.537'],
      ['0.393', 0, '0.532'],
      ['0.086', 0, '0.918'],
    ]);
  });
});

describe('footnote letters standing apart in a crushed header (divq-06: "X 2 a P b")', () => {
  it('names no column by the letters, so each chi-square is read beside its p (no df printed)', () => {
    const { results } = scan('divq-06');
    const tabled = results.filter((result) => result.tableRow);
    expect(tabled.length).toBeGreaterThanOrEqual(9);
    expect(tabled[0]!.kind).toBe('chi2');
    expect([tabled[0]!.value?.text, tabled[0]!.df.length, tabled[0]!.p?.value.text]).toEqual(['7.658', 0, '.022']);
  });
});

describe('groups\' "M ± SD" cells before t, p and d, one cell per line, no df (divt-01)', () => {
  it('reads each t beside its printed p without df; a t whose p is only stars is not read without df', () => {
    const { results } = scan('divt-01');
    const tabled = results.filter((result) => result.tableRow);
    expect(tabled.length).toBeGreaterThanOrEqual(8);
    expect(tabled.every((result) => result.kind === 't' && result.df.length === 0 && result.p !== null && result.p.fromMarks === undefined)).toBe(true);
    expect(tabled.map((result) => result.value?.text)).toContain('2.08');
  });
});

describe('a table whose header and rows a copy glued together (divx-02: "Variabledf1df2FpPartial eta-squared%")', () => {
  it('is listed as not read, never skipped without a word', () => {
    const { results, tablesNotRead } = scan('divx-02');
    expect(results.filter((result) => result.tableRow)).toEqual([]);
    expect(tablesNotRead.map((table) => table.reason)).toEqual(['layout-not-recognised']);
  });
});

describe('a statistic header carries its df in the spellings real tables use', () => {
  // Common practice: tables name the df beside the statistic in many spellings; each is the column's df.
  it.each([
    ['F-value (1, 52)', 'F', [1, 52]],
    ['F value (2,57)', 'F', [2, 57]],
    ['F(1;44)', 'F', [1, 44]],
    ['F (2/57)', 'F', [2, 57]],
    ['t-test (df = 28)', 't', [28]],
    ['χ 2 (1)', 'chi2', [1]],
    ['χ2 [1]', 'chi2', [1]],
    ['Pearson χ2 (1)', 'chi2', [1]],
    ['χ2(1 df)', 'chi2', [1]],
    ['χ2 test (df=1)', 'chi2', [1]],
    ['χ2 value (1 df)', 'chi2', [1]],
    ['χ2, df = 2', 'chi2', [2]],
  ])('%s', async (header, kind, df) => {
    const { classifyHeader } = await import('../../../src/scan/tables/cells.js');
    const role = classifyHeader(header);
    expect(role).toMatchObject({ role: 'statistic', kind });
    expect(role.role === 'statistic' ? role.df.map((number) => number.value) : null).toEqual(df);
  });

  it('takes no df from brackets that hold something else, or from too few numbers for F', async () => {
    const { classifyHeader } = await import('../../../src/scan/tables/cells.js');
    for (const header of ['F (p)', 't (two-tailed)', 'r (n = 120)', 'F value (3)']) {
      const role = classifyHeader(header);
      expect(role.role === 'statistic' ? role.df : []).toEqual([]);
    }
  });
});

describe('real table shapes: survey questions as row labels, years as column names (divt-06)', () => {
  // One cell per line: "Question | 2011 | 2012 | χ2 (1) | P"; each question's "Yes" row prints the χ2 and p,
  // its "No" row only counts; five questions are longer than a cell usually is; "0.07, n.s." under P.
  it('reads each question\'s chi-square with df 1 from the header, its p and the "n.s." beside it', () => {
    const { results } = scan('divt-06');
    expect(results.map(summary)).toEqual([
      'chi2(1) = 13.612 p < 0.01',
      'chi2(1) = 24.198 p < 0.01',
      'chi2(1) = 3.362 p = 0.07',
      'chi2(1) = 0.565 p = 0.45',
      'chi2(1) = 1.087 p = 0.30',
      'chi2(1) = 7.071 p < 0.01',
      'chi2(1) = 21.275 p < 0.01',
      'chi2(1) = 10.285 p < 0.01',
      'chi2(1) = 3.288 p = 0.07',
    ]);
    expect(results.filter((result) => result.notSignificant)).toHaveLength(4);
  });
});

describe('real table shapes: one column for two kinds of statistic (dvya-10)', () => {
  // "χ2 or t" heads a column of chi-squares and t values, with Fisher's exact statistics marked "a"; a row of
  // counts "0 | 0" under the χ2 and p columns. Which kind a bare value is cannot be read, and a count is no p.
  it('reads no statistic of a guessed kind, and no count as a p', () => {
    const { results } = scan('dvya-10');
    expect(results.filter((result) => result.tableRow !== undefined && result.value?.text === '0.86')).toEqual([]);
    expect(results.filter((result) => result.p?.value.text === '0')).toEqual([]);
  });

  it('keeps the mixed header whole and reads a cell that writes its symbol', async () => {
    const { classifyHeader } = await import('../../../src/scan/tables/cells.js');
    for (const header of ['χ2 or t', 't/χ2', 'F/χ2 value', 'Test (χ2/t)']) expect(classifyHeader(header).role).toBe('result');
    expect(classifyHeader('or t').role).toBe('unknown');
  });
});

describe('real table shapes: df printed in front of each F, run onto the cell before (dvyc-01)', () => {
  // Crushed: "Treatment Time Interaction / mean mean F P F P F P" over "Corg … 18.66 47.43 (1, 6) 43.7 0.001 (1, 6)
  // 0.0 0.951 2.5 0.165": each effect's df stand before its F; the interaction prints none.
  it('gives each F the df printed before it and reads the p the df were run onto', () => {
    const { results } = scan('dvyc-01');
    const corg = results.filter((result) => result.tableRow?.rowLabel.startsWith('Corg'));
    expect(corg.map(summary)).toEqual(['F(1, 6) = 43.7 p = 0.001', 'F(1, 6) = 0.0 p = 0.951', 'F() = 2.5 p = 0.165']);
    const doc = results.filter((result) => result.tableRow?.rowLabel === 'DOC:DON');
    expect(doc.map(summary)).toEqual(['F(1, 6) = 0.0 p = 0.909', 'F(1.6, 9.9) = 14.4 p = 0.002', 'F() = 0.8 p = 0.454']);
  });
});

describe('df stated in a table caption in the ways captions state them', () => {
  it('takes no df from a note that states different df one by one (which row takes which cannot be told)', () => {
    const text = 'Table 2. Chi-square tests (df = 1 for sex; df = 2 for education)\n\nVariable | χ2 | p\nSex | 2.40 | .121\nEducation | 1.53 | .465\n';
    const { results } = scanDocument(plainTextDocument('caption.txt', 'text', text));
    expect(results.every((result) => result.df.length === 0)).toBe(true);
  });

  // Common practice: a caption may give the df every F of the table shares.
  it.each([
    'One-way ANOVA (degrees of freedom: 2, 57)',
    'ANOVA results; all F tests have 2 and 57 degrees of freedom',
    'Results of ANOVA (df1 = 2, df2 = 57)',
    'ANOVA (df = 2/57)',
    'ANOVA, degrees of freedom (2, 57)',
    'ANOVA (df 2, 57)',
    'ANOVA; degrees of freedom (df) = 2, 57',
    'Numerator df = 2, denominator df = 57',
    'Between-groups df = 2; within-groups df = 57',
    'ANOVA (df effect = 2, df error = 57)',
    'ANOVA (df_between = 2, df_within = 57)',
    'ANOVA (hypothesis df = 2, error df = 57)',
    'ANOVA; df = 2 (between groups) and 57 (within groups)',
    'The degrees of freedom were 2 and 57',
    'ANOVA (d.f. = 2 and 57)',
    'ANOVA F-values (2, 57 df)',
    'Results of ANOVA. For all F tests, df = 2, 57.',
    'ANOVA, F[2, 57]',
    'F values (F2,57)',
    // Spanish "gl" (grados de libertad), French "ddl", German "FG", Portuguese "graus de liberdade".
    'Análisis de varianza (gl = 2, 57)',
    'Analyse de variance (ddl = 2; 57)',
    'Varianzanalyse (FG = 2, 57)',
    'Análise de variância (graus de liberdade = 2 e 57)',
    'ANOVA (ndf = 2, ddf = 57)',
    'F statistics (num df = 2, den df = 57)',
    'ANOVA (dfn = 2, dfd = 57)',
    'ANOVA; df for all tests: 2, 57',
    'The degrees of freedom for all tests were 2 and 57.',
    'ANOVA. Degrees of freedom (numerator, denominator) = 2, 57',
    'ANOVA (df: treatment = 2, error = 57)',
    'Degrees of freedom for F are 2 and 57',
    'The F tests had 2 numerator and 57 denominator degrees of freedom',
    'Results of ANOVA, F(2/57)',
  ])('%s', (caption) => {
    const text = `Table 2. ${caption}\n\nMeasure | F | p\nAnxiety | 4.21 | .020\nDepression | 0.52 | .597\n`;
    const { results } = scanDocument(plainTextDocument('caption.txt', 'text', text));
    expect(results.map(summary)).toEqual(['F(2, 57) = 4.21 p = .020', 'F(2, 57) = 0.52 p = .597']);
  });
});

describe('df stated in the lines beside a table, not in its caption or notes', () => {
  // Common practice: a web or PDF copy loses what ties a caption or a note to its table (two blank lines, a
  // wrapped caption, a note without "Note.", a sentence under the table); the df it states are still the table's.
  const body = 'Variable F p\nAnxiety 4.21 .020\nDepression 1.05 .357';
  it.each([
    ['a caption two blank lines above', `Text.\n\nTable 2. Group differences (df = 2, 57)\n\n\n${body}\n\nMore.`],
    ['a caption wrapped over two lines', `Text.\n\nTable 2 Group differences on the three scales between the\nthree groups of participants (df = 2, 57)\n${body}\n\nMore.`],
    ['a line above without "Table"', `Text.\n\nGroup differences on three scales (df = 2, 57)\n${body}\n\nMore.`],
    ['a Spanish note', `Text.\n\nTable 2. Group differences\n${body}\nNota. gl = 2, 57.\n\nMore.`],
    ['a note in capitals', `Text.\n\nTable 2. Group differences\n${body}\nNOTE: df = 2, 57.\n\nMore.`],
    ['a footnote letter', `Text.\n\nTable 2. Group differences\n${body}\nᵃ df = 2, 57.\n\nMore.`],
    ['a sentence under the table', `Text.\n\nTable 2. Group differences\n${body}\nF-values have 2 and 57 degrees of freedom.\n\nMore.`],
  ])('%s', (_, text) => {
    const { results } = scanDocument(plainTextDocument('beside.txt', 'text', text));
    expect(results.map(summary)).toEqual(['F(2, 57) = 4.21 p = .020', 'F(2, 57) = 1.05 p = .357']);
    expect(results.every((result) => result.dfFrom === 'text-beside-table')).toBe(true);
  });

  it("takes no result's own df from a sentence beside the table", () => {
    const text = `The interaction was significant, F(1, 40) = 5.20, p = .028.\n\nTable 2. Group differences\n${body}\n\nMore.`;
    const table = scanDocument(plainTextDocument('beside.txt', 'text', text)).results.filter((result) => result.tableRow);
    expect(table.map(summary)).toEqual(['F() = 4.21 p = .020', 'F() = 1.05 p = .357']);
  });

  it('takes no df from beside a table whose caption states them', () => {
    const text = `Text (df = 3, 96).\nTable 2. Group differences (df = 2, 57)\n${body}\n\nMore.`;
    const { results } = scanDocument(plainTextDocument('beside.txt', 'text', text));
    expect(results.map(summary)).toEqual(['F(2, 57) = 4.21 p = .020', 'F(2, 57) = 1.05 p = .357']);
    expect(results.some((result) => result.dfFrom !== undefined)).toBe(false);
  });
});

describe('real table shapes: correlation matrices whose cells ran together (dvyb-09, dvya-08, dvyb-05)', () => {
  it('cuts a numbered lower triangle with hyphen minus signs and a run-together header "1234567891011121314"', () => {
    const { results } = scan('dvyb-09');
    const correlations = results.filter((result) => result.kind === 'r');
    // 15 variables, lower triangle without diagonal: 15 × 14 / 2.
    expect(correlations).toHaveLength(105);
    expect(summary(correlations[0]!)).toBe('r() = .61');
    expect(correlations.filter((result) => result.value!.value < 0)).toHaveLength(44);
  });

  it('cuts rows with stars and the diagonal "1" run onto the last value ("0.49**1")', () => {
    const { results } = scan('dvya-08');
    const correlations = results.filter((result) => result.kind === 'r');
    expect(correlations).toHaveLength(45);
    expect(correlations.map((result) => result.value!.text).slice(0, 3)).toEqual(['0.49', '0.59', '0.43']);
    expect(correlations.some((result) => result.value!.value === 1)).toBe(false);
  });

  it('cuts a grid named by variables, the header names run together ("MotivationRehearsalOrganization…")', () => {
    const { results } = scan('dvyb-05');
    const correlations = results.filter((result) => result.kind === 'r');
    expect(correlations).toHaveLength(42);
    expect(correlations[0]!.tableRow?.rowLabel).toBe('Intrinsic × Rehearsal');
  });

  it('reads no run-together numbers as correlations under a title that does not say so', () => {
    const text = passage('dvyb-09').replace('Correlation matrix.', 'Matrix of distances.');
    const { results } = scanDocument(plainTextDocument('distances.txt', 'text', text));
    expect(results.filter((result) => result.kind === 'r')).toEqual([]);
  });
});

describe('real table shapes: correlations as statistics software prints them (dvzb-04)', () => {
  // Crushed: per variable a "Pearson Correlation" row, a "Sig. (2-tailed)" row with "-" on the diagonal and an
  // "n" row; the header's several-word names ("Buffering Capacity") cannot be cut, the blocks name the columns.
  it('reads every correlation off the diagonal with its p and df N - 2 from its N row', () => {
    const { results } = scan('dvzb-04');
    const correlations = results.filter((result) => result.kind === 'r');
    expect(correlations).toHaveLength(20);
    expect(correlations.every((result) => result.df[0]?.value === 26)).toBe(true);
    expect(correlations.map(summary).slice(0, 2)).toEqual(['r(26) = 0.018 p = 0.927', 'r(26) = -0.217 p = 0.266']);
    expect(correlations[0]!.tableRow?.rowLabel).toBe('Dental Caries dft × DMFT');
  });

  it("reads no Kendall's tau as a Pearson r", () => {
    const text = [
      "Kendall's tau_b",
      'Anxiety Correlation Coefficient 1.000 .310 .120',
      'Sig. (2-tailed) . .010 .300',
      'N 60 60 60',
      'Mood Correlation Coefficient .310 1.000 .200',
      'Sig. (2-tailed) .010 . .090',
      'N 60 60 60',
    ].join('\n');
    const { results } = scanDocument(plainTextDocument('kendall.txt', 'text', text));
    expect(results.filter((result) => result.kind === 'r')).toEqual([]);
  });
});

describe('a statistic\'s df in a header row of their own', () => {
  // Common practice: "χ2" over "(df = 1)" in a two-row header; a web copy drops the empty cell over the labels.
  it('gives the chi-square column the df named under it, also when the copy shifted that row', () => {
    const text = 'Table 2. Association of sex with outcomes\n\nVariable | Male | Female | χ2 | p\n | n (%) | n (%) | (df = 1) | \nSmoking | 40 (20) | 30 (15) | 4.21 | .040\nDrinking | 50 (25) | 45 (22) | 0.52 | .471\n';
    const { results } = scanDocument(plainTextDocument('df-row.txt', 'text', text));
    expect(results.map(summary)).toEqual(['chi2(1) = 4.21 p = .040', 'chi2(1) = 0.52 p = .471']);
  });

  it('takes no bare "(1)" under a statistic as its df (a model\'s number)', () => {
    const text = 'Table 2. Models\n\nPredictor | t | p\n | (1) | \nAge | 2.10 | .040\nSex | 0.52 | .610\n';
    const { results } = scanDocument(plainTextDocument('models.txt', 'text', text));
    expect(results.every((result) => result.df.length === 0)).toBe(true);
  });
});

describe('real table shapes: marked F cells under two "F (1,128)" columns, one cell per line (divg-01)', () => {
  // One cell per line: effect titles over two "F (1,128)" columns; an effect's cells on its block's first row only,
  // "9.69**", "η2 = .18" and ".14, n.s." after the row's M (SE). Both columns give the same df, so each marked F
  // takes them whatever its column.
  it('reads every marked F with the header\'s df and no table is listed as not read', () => {
    const { results, tablesNotRead } = scan('divg-01');
    expect(results.map((result) => [result.value?.text, result.df.map((df) => df.value)])).toEqual(
      ['9.69', '.14', '0.0', '3.23', '4.18', '0.22', '.58', '0.11'].map((text) => [text, [1, 128]]),
    );
    expect(tablesNotRead).toEqual([]);
  });

  it('keeps the "n.s." printed after a statistic without a p, and the stars as marks only', () => {
    const { results } = scan('divg-01');
    expect(results.filter((result) => result.notSignificant).length).toBe(6);
    expect(results.every((result) => result.p === null || result.p.fromMarks !== undefined)).toBe(true);
  });
});

describe('real table shapes: z tests as a spreadsheet prints them (divt-09)', () => {
  // Pipe rows of a spreadsheet's "z-Test: Two Sample for Means" in a translated version: "z" and
  // "P(Z⇐z) Double tail" rows, two comparisons side by side in the first output.
  it('reads each z with its two-tailed p, one test per value column', () => {
    const { results } = scan('divt-09');
    expect(results.map(summary)).toEqual(['z() = 0.37569033 p = 0.82665995', 'z() = 3.68211902 p = 0.00280069', 'z() = 3.36602499 p = 0.03578167', 'z() = 1.99365115 p = 0.04172116']);
  });
});

describe('real table shapes: each block prints its p before its statistic (dvzb-08)', () => {
  // Crushed: "p-value rs-value" under each of four outcomes; "< 0.001*" in one p cell.
  it('pairs each rs with the p printed before it', () => {
    const { results } = scan('dvzb-08');
    expect(results).toHaveLength(36);
    expect(results.slice(0, 2).map(summary)).toEqual(['r() = 0.12 p = 0.31', 'r() = 0.02 p = 0.42']);
    expect(results[0]!.symbol).toBe('rs');
  });
});

describe('real table shapes from the last batches (dvzd, dvze)', () => {
  it('reads separate "ndf3" and "ddf3" columns, a footnote digit glued on (dvzd-02)', () => {
    const { results } = scan('dvzd-02');
    expect(summary(results[0]!)).toBe('F(1, 55) = 0.23 p = 0.6371');
    // "179–186" in the ddf column is a range, not a df: those F keep their numerator df only.
    expect(results.find((result) => result.value?.text === '65.09')!.df.map((df) => df.value)).toEqual([3]);
  });

  it('reads a "df, ddf" column of pairs and a "n.s." or "*" set apart after each F (dvzd-01)', () => {
    const { results } = scan('dvzd-01');
    // A row named "Total" that prints F values is a measure's ("Plant biomass" / "Total"), not an ANOVA's Total row.
    expect(results.filter((result) => result.tableRow?.rowLabel === 'Total').length).toBeGreaterThan(0);
    const shoots = results.filter((result) => result.tableRow?.rowLabel === 'Shoots').slice(0, 3);
    expect(shoots.map(summary)).toEqual(['F(1, 1) = 4.13 ns', 'F(1, 10) = 3.44', 'F(1, 10) = 0.22 ns']);
  });

  it('reads the part of a table under a header printed again with other statistics (dvze-05)', () => {
    const kinds = scan('dvze-05').results.map((result) => result.kind);
    expect(kinds.filter((kind) => kind === 'chi2').length).toBeGreaterThanOrEqual(8);
    expect(kinds.filter((kind) => kind === 't')).toHaveLength(3);
    expect(kinds.filter((kind) => kind === 'z')).toHaveLength(1);
  });

  it('reads a correlation matrix whose rows are "Item 1" … and whose last column is named (dvze-07)', () => {
    const correlations = scan('dvze-07').results.filter((result) => result.kind === 'r');
    expect(correlations).toHaveLength(45);
    // N = 768 from the caption: df 766; "**" gives p < .010 by the note.
    expect(correlations.every((result) => result.df[0]?.value === 766 && result.p?.comparator === '<')).toBe(true);
  });
});

describe('real table shapes: side-by-side blocks named alike, many rows printing one block only (dvzd-13)', () => {
  // One cell per line: "D.f. | F ratio | D.f. | F ratio" for two outcomes; "Functional group (FG) | 2, 28 | 2.81+"
  // prints one pair, for an outcome the copy does not say; "+" marks p < .10.
  it('reads both blocks of the full rows, and the one-block rows without saying which block', () => {
    const { results, tablesNotRead } = scan('dvzd-13');
    expect(results.filter((result) => result.tableRow?.rowLabel === 'Rodent (ROD)').map(summary)).toEqual(['F(1, 4) = 1.58', 'F(1, 4) = 0.82']);
    expect(results.some((result) => result.value?.text === '3.91')).toBe(true);
    // "Functional group (FG) | 2, 28 | 2.81+": the F, its df and its p are the same in either block; the row's
    // label names no block, since the copy does not say which outcome it is.
    expect(results.filter((result) => result.tableRow?.rowLabel === 'Functional group (FG)').map(summary)).toEqual(['F(2, 28) = 2.81']);
    expect(tablesNotRead.map((table) => table.reason)).not.toContain('cells-not-placed');
  });
});

describe('real table shapes: an r block with its own p beside t blocks (divu-10)', () => {
  // Raw HTML table in Markdown: "Criterion 1: t | β ± SD | p", "Criterion 2: t | p", "Criterion 3: r | p".
  it('reads the r column as correlations, not as an effect size of the t tests', () => {
    const correlations = scan('divu-10').results.filter((result) => result.kind === 'r');
    expect(correlations.map((result) => result.value?.text)).toEqual(['0.35', '-0.15', '-0.04', '0.04', '-0.01', '-0.11']);
    expect(correlations[0]!.p?.value.text).toBe('0.021');
  });
});

describe('real table shapes: statistic columns side by side whose p and effect sizes lost their names (dvzf-03)', () => {
  // "F (1, 24) | | | F (2, 48) | | | F (2, 48)a | | |" over rows of nine numbers (F, p, ηp2 per effect), the rows
  // run together on one line and the block titles run onto the names. Copied tab-separated, the three named
  // columns would take the last three numbers (an F, its p and its ηp2) as three F values.
  it('reads no F from the tab-separated copy where the names do not say which number is which', async () => {
    const { rerender } = await import('../../corpus/real/score.js');
    const copied = rerender(passage('dvzf-03'), 'tabs');
    const { results } = scanDocument(plainTextDocument('tabs.txt', 'text', copied));
    expect(results.filter((result) => result.kind === 'F')).toEqual([]);
  });
});

describe('real table shapes: a test not reported is not an error row (dvzi-01)', () => {
  // "New vs. Given | 1.23 | − | −": the row prints df but a dash for F and p (no test reported); it names no
  // error term, so its df are not the denominator of the F tests above it.
  it('takes no denominator df from a row whose F is a dash', () => {
    const { results } = scan('dvzi-01');
    // Each F's df are its own row's cell, whose comma the copy turned into a point ("1.23" for "1, 23"; the pairs
    // keep df2 = 23 × df1), never a df taken from another row.
    const withDf = results.filter((result) => result.kind === 'F' && result.df.length === 2);
    expect(withDf.length).toBeGreaterThan(30);
    for (const result of withDf) expect(result.text, result.text).toContain(`| ${result.df[0]!.text}.${result.df[1]!.text} |`);
  });

  it('still takes the df of an unnamed row whose F cell is empty', () => {
    const text = 'Table 1. ANOVA\n\nSource | df | MS | F | p\nGroup | 2 | 40.2 | 5.10 | .009\nS/A | 57 | 7.88 |  | \n';
    const { results } = scanDocument(plainTextDocument('rows.txt', 'text', text));
    expect(results.map(summary)).toEqual(['F(2, 57) = 5.10 p = .009']);
  });
});

describe('real table shapes: a crushed header with a line of group names under it (dvzd-10 crushed)', () => {
  // The pipe copy of dvzd-10 has a second header row of group names ("Control | SE ± | 7.5 % | SE ± | …"); crushed
  // into single spaces it is a line between the named header and the first row.
  const text = [
    'Table 4.',
    'Characteristics Diet F d.f (between, within groups) P',
    'Control SE ± 7.5 % SE ± 15.0 % SE ±',
    'Change in bird bodyweight (kg) −0.04a 0.02 −0.14b 0.03 −0.07ab 0.03 4.29 2,26 0.02*',
    'Mean feed intake days 11–14 (g/bird/day) 105.13 3.33 104.33 7.19 105.47 5.34 0.01 2,26 0.99',
    'Feed conversion (g food/g egg) 1.68 0.07 1.70 0.12 1.76 0.09 0.18 2,26 0.84',
  ].join('\n');

  it('passes over the group names and reads each F with its df and p', () => {
    const { results } = scanDocument(plainTextDocument('crushed.txt', 'text', text));
    expect(results.map(summary)).toEqual(['F(2, 26) = 4.29 p = 0.02', 'F(2, 26) = 0.01 p = 0.99', 'F(2, 26) = 0.18 p = 0.84']);
  });

  it('does not pass over a line that is a header itself (web-06: "t-test Pearson correlation …" over "MBI Group n Mean SD p (d) 1-β r p …")', () => {
    const { results } = scan('web-06');
    expect(results.map(summary)).toEqual(['r(30) = 0.47 p = 0.007', 'r(14) = 0.17 p = 0.525', 'r(30) = 0.39 p = 0.029', 'r(14) = 0.14 p = 0.602', 'r(30) = -0.44 p = 0.012', 'r(14) = -0.19 p = 0.474']);
  });
});
