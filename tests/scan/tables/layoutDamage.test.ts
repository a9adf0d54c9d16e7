/**
 * An ANOVA table as copies damage its layout (common practice: what PDF text
 * extraction and publishers' page viewers do to a table), in single spaces,
 * aligned columns and tabs, with and without a "Table 4" title: a row label
 * on a line of its own above its values, a header wrapped over two lines,
 * labels wrapped, rows numbered, a whole table run onto one line with the
 * prose around it. Every copy must give the same three F tests with the
 * error row's df, and nothing else.
 *
 * The numbers are invented and consistent (SciPy 1.10.1, scipy.stats.f.sf,
 * computed when the test was written): F(2, 57) = 4.21 gives p = .020,
 * F(1, 57) = 2.11 gives .152, F(2, 57) = 3.33 gives .043.
 */
import { describe, expect, it } from 'vitest';
import { plainTextDocument } from '../../../src/documents/text.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';
import { WITHIN_SUBJECTS_HEADER, WITHIN_SUBJECTS_ROWS, WITHIN_SUBJECTS_TESTS } from './programOutput.js';

type Rendering = 'crushed' | 'aligned' | 'tabs';
const RENDERINGS: Rendering[] = ['crushed', 'aligned', 'tabs'];
const HEADER = ['Source', 'SS', 'df', 'MS', 'F', 'p'];
const ROWS = [
  ['Group', '12.40', '2', '6.20', '4.21', '.020'],
  ['Time', '3.10', '1', '3.10', '2.11', '.152'],
  ['Group × Time', '9.80', '2', '4.90', '3.33', '.043'],
  ['Error', '83.90', '57', '1.47', '', ''],
];
const EXPECTED = ['F(2, 57) = 4.21 p = .020', 'F(1, 57) = 2.11 p = .152', 'F(2, 57) = 3.33 p = .043'];

function line(cells: string[], rendering: Rendering): string {
  if (rendering === 'crushed') return cells.filter((cell) => cell !== '').join(' ');
  return cells.join(rendering === 'tabs' ? '\t' : '    ').trimEnd();
}

const COPIES: Record<string, (rendering: Rendering) => string> = {
  'row labels on a line of their own above the values': (r) => [line(HEADER, r), ...ROWS.flatMap((row) => [row[0]!, line(['', ...row.slice(1)], r).trim()])].join('\n'),
  'a header wrapped over two lines': (r) => [line(['Source', 'Sum of', 'df', 'Mean', 'F', 'p'], r), line(['', 'squares', '', 'square', '', ''], r), ...ROWS.map((row) => line(row, r))].join('\n'),
  'a label wrapped after its values': (r) => [line(HEADER, r), ...ROWS.flatMap((row) => (row[0] === 'Group' ? [line(['Training group', ...row.slice(1)], r), 'condition'] : [line(row, r)]))].join('\n'),
  'a label wrapped before its values': (r) => [line(HEADER, r), ...ROWS.flatMap((row) => (row[0] === 'Group' ? ['Training group', line(['condition', ...row.slice(1)], r)] : [line(row, r)]))].join('\n'),
  'numbered rows': (r) => [line(HEADER, r), ...ROWS.map((row, index) => line([`${index + 1}. ${row[0]}`, ...row.slice(1)], r))].join('\n'),
  'blank lines between rows': (r) => [line(HEADER, r), ...ROWS.map((row) => line(row, r))].join('\n\n'),
  'rules of dashes above and below the rows': (r) => [line(HEADER, r), '-'.repeat(40), ...ROWS.map((row) => line(row, r)), '-'.repeat(40)].join('\n'),
};

function testsRead(text: string): string[] {
  return scanDocument(plainTextDocument('table.txt', 'text', text)).results.map(
    (result) => `${result.kind}(${result.df.map((df) => df.text).join(', ')}) = ${result.value?.text}${result.p ? ` p ${result.p.comparator} ${result.p.value.text}` : ''}`,
  );
}

describe('an ANOVA table whose layout a copy damaged', () => {
  for (const [name, copy] of Object.entries(COPIES)) {
    for (const titled of [true, false]) {
      it.each(RENDERINGS)(`${name}, ${titled ? 'titled' : 'untitled'}, %s`, (rendering) => {
        const lead = titled ? 'Table 4. Two-way ANOVA of recall scores' : 'The ANOVA is shown below.';
        expect(testsRead(`${lead}\n${copy(rendering)}\n\nThe next section.\n`)).toEqual(EXPECTED);
      });
    }
  }

  it.each(['crushed', 'aligned'] as const)('a whole table on one line with the prose around it, as a page viewer gives a page, %s', (rendering) => {
    const table = [line(HEADER, rendering), ...ROWS.map((row) => line(row, rendering))].join(' ');
    const page = `Page 25 The participants improved as expected. Table 4. Two-way ANOVA of recall scores ${table} The interaction shows that the groups differed, which we discuss next.\n`;
    expect(testsRead(page)).toEqual(EXPECTED);
  });

  it.each(RENDERINGS)('rows named by bands of a variable (">50", "≤30"), %s', (rendering) => {
    // t(58) = 2.25 gives p = .028, 0.59 gives .557, 1.10 gives .276 (SciPy 1.10.1 scipy.stats.t.sf, two-tailed).
    const rows = [['Age group', 't', 'df', 'p'], ['≤30', '2.25', '58', '.028'], ['31–50', '0.59', '58', '.557'], ['>50', '1.10', '58', '.276']];
    const text = `Table 5. Differences by age group\n${rows.map((row) => line(row, rendering)).join('\n')}\n\nNext.\n`;
    expect(testsRead(text)).toEqual(['t(58) = 2.25 p = .028', 't(58) = 0.59 p = .557', 't(58) = 1.10 p = .276']);
  });

  it('reads no table from prose that names F, p and df beside numbers', () => {
    const text = 'For every model we report the F p df values of 12 groups and 3 conditions measured in 2019 and 2020 across 4 sites and 2 waves.\n';
    expect(testsRead(text)).toEqual([]);
  });
});

describe('a correlation matrix named by its variables, a dash on its diagonal', () => {
  // Common practice: "—" on the diagonal, the lower triangle filled, stars defined in the note; df = N − 2 from the title's N.
  const variables = ['Anxiety', 'Depression', 'Stress', 'Sleep quality'];
  const lower = [[], ['.45**'], ['.38**', '.52**'], ['−.21*', '−.30**', '−.12']];
  const rows = [['', ...variables], ...variables.map((name, index) => [name, ...lower[index]!, '—', ...new Array<string>(3 - index).fill('')])];
  it.each(RENDERINGS)('%s', (rendering) => {
    const body = rendering === 'aligned' ? padded(rows) : rows.map((row) => line(row, rendering)).join('\n');
    const text = `Table 2. Correlations among the study variables (N = 120)\n${body}\nNote. *p < .05. **p < .01.\n\nNext.\n`;
    const read = scanDocument(plainTextDocument('matrix.txt', 'text', text)).results.map((result) => `r(${result.df.map((df) => df.text).join(', ')}) = ${result.value?.text}`);
    expect(read).toEqual(['r(118) = .45', 'r(118) = .38', 'r(118) = .52', 'r(118) = -.21', 'r(118) = -.30', 'r(118) = -.12']);
  });
});

/** Rows as pipes (the first row the header), padded columns, or another rendering of `line`. */
function renderAs(rows: string[][], rendering: Rendering | 'pipe'): string {
  if (rendering === 'pipe') return [`| ${rows[0]!.join(' | ')} |`, `|${rows[0]!.map(() => '---').join('|')}|`, ...rows.slice(1).map((row) => `| ${row.join(' | ')} |`)].join('\n');
  return rendering === 'aligned' ? padded(rows) : rows.map((row) => line(row, rendering)).join('\n');
}

/** Columns padded to their widest cell and three spaces, as a PDF's layout copy sets them. */
function padded(rows: string[][]): string {
  const widths = rows[0]!.map((_, column) => Math.max(...rows.map((row) => (row[column] ?? '').length)) + 3);
  return rows.map((row) => row.map((cell, column) => cell.padEnd(widths[column]!)).join('').trimEnd()).join('\n');
}

describe('two outcomes side by side, each row stating its df in its label', () => {
  // Common practice: "Group (df = 2, 57)" as the row label, an outcome's name over each block of F, p and ηp².
  const rows = [
    ['', 'Anxiety', '', '', 'Depression', '', ''],
    ['Effect', 'F', 'p', 'ηp2', 'F', 'p', 'ηp2'],
    ['Group (df = 2, 57)', '4.21', '.020', '.13', '1.05', '.357', '.04'],
    ['Time (df = 1, 57)', '6.80', '.012', '.11', '0.40', '.530', '.01'],
  ];
  it.each([...RENDERINGS, 'pipe' as const])('%s', (rendering) => {
    const body = renderAs(rows, rendering);
    // F(2, 57) = 4.21 gives p = .020, 1.05 gives .357; F(1, 57) = 6.80 gives .012, 0.40 gives .530 (SciPy 1.10.1 scipy.stats.f.sf).
    expect(testsRead(`Table 3. ANOVA results for both outcomes\n${body}\n\nNext.\n`)).toEqual([
      'F(2, 57) = 4.21 p = .020',
      'F(2, 57) = 1.05 p = .357',
      'F(1, 57) = 6.80 p = .012',
      'F(1, 57) = 0.40 p = .530',
    ]);
  });
});

describe("a program's within-subjects table in padded columns", () => {
  it('pairs each correction row of the effect with the same correction row of its error term', () => {
    const text = `Table 4. Tests of Within-Subjects Effects\n${padded([WITHIN_SUBJECTS_HEADER, ...WITHIN_SUBJECTS_ROWS])}\n\nNext.\n`;
    const ps = ['.004', '.008', '.007', '.020'];
    expect(testsRead(text)).toEqual(WITHIN_SUBJECTS_TESTS.map((test, index) => `${test} p = ${ps[index]}`));
  });
});

describe('a results table no reader recognises, without a "Table" title', () => {
  it('is listed as not read when a header line names a test statistic and p over rows of numbers', () => {
    // Rows whose values ran together in an order no header explains: nothing is read, and the report says so.
    const text = [
      'The results were as follows.',
      '',
      'Outcome F p',
      'Anxiety 12.3/4.1 14.8/4.5 2.25; 0.028; 0.13',
      'Stress 20.1/6.0 21.0/5.8 0.59; 0.557; 0.02',
      'Sleep 7.1/1.2 6.8/1.1 1.10; 0.276; 0.04',
      '',
      'The next section.',
    ].join('\n');
    const scan = scanDocument(plainTextDocument('untitled.txt', 'text', text));
    expect(scan.results).toEqual([]);
    expect(scan.tablesNotRead.map((table) => [table.reason, text.slice(table.start, table.end).split('\n')[0]])).toEqual([['layout-not-recognised', 'Outcome F p']]);
  });

  it('is not listed for prose that names F and p, nor for rows of numbers under no such header', () => {
    const prose = 'We report F and p for each test.\nGroup sizes were 12.5 13.5 and 14.5 in 2019.\nAges were 20.1 21.3 and 22.8.\nScores were 1.5 2.5 and 3.5.\n';
    expect(scanDocument(plainTextDocument('prose.txt', 'text', prose)).tablesNotRead).toEqual([]);
    const numbers = 'Values by site\nSite A 12.3 4.1 14.8\nSite B 20.1 6.0 21.0\nSite C 7.1 1.2 6.8\n';
    expect(scanDocument(plainTextDocument('numbers.txt', 'text', numbers)).tablesNotRead).toEqual([]);
  });
});

describe('ANOVA tables in the languages of the real corpus, with decimal commas or points', () => {
  // Column names as Spanish, Portuguese, French, German, Dutch and Italian papers and programs print them (common
  // practice, from memory; "FV GL SQ QM Fc Pr>Fc" is a Brazilian statistics program's layout).
  const languages: Record<string, { title: string; header: string[]; effects: [string, string]; error: string }> = {
    es: { title: 'Tabla 2. Análisis de varianza', header: ['Fuente de variación', 'SC', 'gl', 'CM', 'F', 'Sig.'], effects: ['Grupo', 'Tiempo'], error: 'Error' },
    pt: { title: 'Tabela 2. Análise de variância', header: ['Fonte de variação', 'SQ', 'GL', 'QM', 'F', 'p-valor'], effects: ['Tratamento', 'Bloco'], error: 'Resíduo' },
    'pt (program)': { title: 'Tabela 2. ANOVA', header: ['FV', 'GL', 'SQ', 'QM', 'Fc', 'Pr>Fc'], effects: ['Tratamento', 'Bloco'], error: 'Erro' },
    fr: { title: 'Tableau 2. Analyse de variance', header: ['Source', 'SC', 'ddl', 'CM', 'F', 'p'], effects: ['Groupe', 'Temps'], error: 'Résidus' },
    de: { title: 'Tabelle 2. Varianzanalyse', header: ['Effekt', 'FG', 'F', 'p', 'η2'], effects: ['Gruppe', 'Zeit'], error: 'Fehler' },
    nl: { title: 'Tabel 2. Variantieanalyse', header: ['Bron', 'SS', 'df', 'MS', 'F', 'p'], effects: ['Groep', 'Tijd'], error: 'Fout' },
    it: { title: 'Tabella 2. Analisi della varianza', header: ['Fonte', 'SS', 'gdl', 'MS', 'F', 'p'], effects: ['Gruppo', 'Tempo'], error: 'Errore' },
  };
  const role = (name: string): string =>
    /^(SC|SQ|SS)$/.test(name) ? 'ss' : /^(gl|GL|ddl|df|FG|gdl)$/.test(name) ? 'df' : /^(CM|QM|MS)$/.test(name) ? 'ms' : /^(F|Fc)$/.test(name) ? 'F' : /^(Sig\.|p|p-valor|Pr>Fc)$/.test(name) ? 'p' : /η/.test(name) ? 'eta' : 'label';
  const cases = Object.entries(languages).flatMap(([language, spec]) => (['pipe', 'crushed', 'aligned'] as const).flatMap((rendering) => (['comma', 'point'] as const).map((decimal) => ({ language, spec, rendering, decimal }))));
  it.each(cases)('$language, $rendering, decimal $decimal', ({ spec, rendering, decimal }) => {
    const values = (label: string, ss: string, df: string, ms: string, f: string, p: string, eta: string): string[] =>
      spec.header.map((name) => ({ label, ss, df, ms, F: f, p, eta })[role(name)]!).map((cell, index) => (index === 0 || decimal === 'point' ? cell : cell.replace('.', ',')));
    const rows = [
      spec.header,
      values(spec.effects[0], '12.40', '2', '6.20', '4.21', '0.020', '0.13'),
      values(spec.effects[1], '3.10', '1', '3.10', '2.11', '0.152', '0.04'),
      values(spec.error, '83.90', '57', '1.47', '', '', ''),
    ];
    const body = renderAs(rows, rendering);
    // F(2, 57) = 4.21 gives p = .020; F(1, 57) = 2.11 gives .152 (SciPy 1.10.1 scipy.stats.f.sf).
    const read = scanDocument(plainTextDocument('table.txt', 'text', `${spec.title}\n${body}\n\nNext.\n`)).results.map((result) => `F(${result.df.map((df) => df.value).join(', ')}) = ${result.value?.value}`);
    expect(read).toEqual(['F(2, 57) = 4.21', 'F(1, 57) = 2.11']);
  });
});

describe('a chi-square on each variable\'s row above the counts of its categories', () => {
  it.each(['crushed', 'aligned'] as const)('reads every chi-square and no count, %s', (rendering) => {
    // Common practice: "Variable | groups' n (%) | χ2 | p", the test on the variable's row, its categories' counts below.
    // χ2(2) = 5.34 gives p = .069, χ2(3) = 5.83 gives .120, χ2(1) = 2.49 gives .115 (SciPy 1.10.1 scipy.stats.chi2.sf);
    // the table prints no df. Four categories under one variable are more than lines read as a table's sections.
    const rows = [
      ['Variables', 'Likely (N = 73)', 'Not likely (N = 54)', 'χ2', 'P'],
      ['Age', '', '', '5.34', '0.069'],
      ['≤50', '22 (30.1%)', '20 (37.1%)', '', ''],
      ['51-70', '34 (46.6%)', '28 (51.9%)', '', ''],
      ['>70', '17 (23.3%)', '6 (11.1%)', '', ''],
      ['Education', '', '', '5.83', '0.120'],
      ['Uneducated', '18 (24.7%)', '12 (22.2%)', '', ''],
      ['Primary school', '40 (54.8%)', '34 (63.0%)', '', ''],
      ['High school', '13 (17.8%)', '7 (13.0%)', '', ''],
      ['University', '2 (2.7%)', '1 (1.9%)', '', ''],
      ['Gender', '', '', '2.49', '0.115'],
      ['Male', '41 (56.2%)', '23 (42.6%)', '', ''],
      ['Female', '32 (43.8%)', '31 (57.4%)', '', ''],
    ];
    const body = rendering === 'aligned' ? padded(rows) : rows.map((row) => line(row, 'crushed')).join('\n');
    const read = scanDocument(plainTextDocument('chi.txt', 'text', `Table 1. Sample characteristics\n${body}\n\nNext.\n`)).results.map((result) => `${result.kind}(${result.df.map((df) => df.value).join(', ')}) = ${result.value?.text}`);
    expect(read).toEqual(['chi2() = 5.34', 'chi2() = 5.83', 'chi2() = 2.49']);
  });
});

describe('a header whose names a PDF layout copy stacked over two or three lines', () => {
  it('joins the words above each name ("Type III / Sum of / Squares", "Partial Eta / Squared") and reads the effect sizes', () => {
    // F(2, 56) = 5.109 gives p = .009 and F(1, 56) = 2.567 gives .115 (SciPy 1.10.1 scipy.stats.f.sf).
    const text = [
      'Table 3. Tests of Between-Subjects Effects',
      '',
      '                  Type III',
      '                  Sum of                Mean                        Partial Eta',
      'Source            Squares      df       Square     F       Sig.     Squared',
      'Group             40.200       2        20.100     5.109   .009     .154',
      'Age               10.100       1        10.100     2.567   .115     .044',
      'Error             220.300      56       3.934',
      '',
      'Next paragraph.',
    ].join('\n');
    const scan = scanDocument(plainTextDocument('stacked.txt', 'text', text));
    expect(scan.results.map((result) => [result.value?.text, result.df.map((df) => df.text), result.effects.map((effect) => [effect.kind, effect.value.text])])).toEqual([
      ['5.109', ['2', '56'], [['partial-eta-squared', '.154']]],
      ['2.567', ['1', '56'], [['partial-eta-squared', '.044']]],
    ]);
    expect(scan.results[0]!.tableRow?.caption).toBe('Table 3. Tests of Between-Subjects Effects');
  });

  it('takes no sentence above a header for its names', () => {
    const text = ['The results are shown below.', 'Source            SS        df     MS       F       p', 'Group             40.20     2      20.10    5.11    .009', 'Error             220.30    56     3.93', ''].join('\n');
    const scan = scanDocument(plainTextDocument('sentence.txt', 'text', text));
    expect(scan.results.map((result) => result.value?.text)).toEqual(['5.11']);
    expect(scan.results[0]!.tableRow?.caption).toBeNull();
  });
});

describe('a numbered correlation matrix with each p in brackets after its correlation', () => {
  // Common practice: "r (p)" cells, the note saying the p-values stand in parentheses. With df 58, r = .45 gives
  // p = .0003, .38 gives .0027, .52 gives .00002 (SciPy 1.10.1 scipy.stats.t.sf of r√(df/(1 − r²)), two-sided).
  const rows = [
    ['Variable', '1', '2', '3'],
    ['1. Anxiety', '—', '', ''],
    ['2. Depression', '.45 (<.001)', '—', ''],
    ['3. Stress', '.38 (.003)', '.52 (<.001)', '—'],
  ];
  it.each(['pipe', 'tabs'] as const)('reads each correlation with its own p, %s', (rendering) => {
    const body = rendering === 'pipe' ? renderAs(rows, 'pipe') : rows.map((row) => line(row, 'tabs')).join('\n');
    const text = `Table 2. Correlations among the study variables (N = 60)\n${body}\nNote. p-values in parentheses.\n\nNext.\n`;
    const read = scanDocument(plainTextDocument('matrix.txt', 'text', text)).results.map((result) => `r(${result.df.map((df) => df.text).join(', ')}) = ${result.value?.text}, p ${result.p?.comparator} ${result.p?.value.text}`);
    expect(read).toEqual(['r(58) = .45, p < .001', 'r(58) = .38, p = .003', 'r(58) = .52, p < .001']);
  });

  it('reads none of them when nothing says the brackets hold p-values', () => {
    const text = `Table 2. Correlations among the study variables (N = 60)\n${renderAs(rows, 'pipe')}\n\nNext.\n`;
    expect(scanDocument(plainTextDocument('matrix.txt', 'text', text)).results).toEqual([]);
  });
});

describe('a crushed table of correlations named by short column names, not a matrix', () => {
  // Common practice: outcomes as rows, two scales as columns ("Gait Variables MMSE ACE-R"), daggers defined in the note.
  const rows = [
    'Gait Variables MMSE ACE-R',
    'Gait speed 0.449 †† 0.430 ††',
    'Stride length 0.446 †† 0.422 ††',
    'Cadence 0.199 0.191',
    'Stance phase −0.156 −0.143',
  ];
  it('reads every correlation under its column, with the p its marks give', () => {
    const text = `Table 3. Spearman's correlations between gait and cognition\n${rows.join('\n')}\n†p < 0.05; †† p < 0.01.\n\nNext.\n`;
    const read = scanDocument(plainTextDocument('rectangle.txt', 'text', text)).results.map((result) => `${result.value?.text}${result.p ? ` p ${result.p.comparator} ${result.p.value.text}` : ''}`);
    expect(read).toEqual(['0.449 p < 0.01', '0.430 p < 0.01', '0.446 p < 0.01', '0.422 p < 0.01', '0.199', '0.191', '-0.156', '-0.143']);
  });

  it('reads none when the rows hold different numbers of values (which value is under which name cannot be told)', () => {
    const ragged = [...rows.slice(0, 3), 'Cadence 0.199', 'Stance phase −0.156 −0.143 0.120'];
    const text = `Table 3. Spearman's correlations between gait and cognition\n${ragged.join('\n')}\n\nNext.\n`;
    expect(scanDocument(plainTextDocument('ragged.txt', 'text', text)).results).toEqual([]);
  });
});

describe("a program's partial correlations crushed into single spaces", () => {
  it('reads each correlation with the p and the df printed under it (stars standing apart)', () => {
    // Common practice: "Correlation", "Significance (2-tailed)" and "df" rows per variable. r(52) = −.448 gives
    // p = .0007 and −.143 gives .30 (SciPy 1.10.1 scipy.stats.t.sf of r√(df/(1 − r²)), two-sided).
    const text = [
      'Table 3. Partial correlations (controlling for age) between sleep and heart rate variability',
      'Control Variables: Age Sleep Latency Daytime Dysfunction',
      'Stress VLF Correlation −0.143 −0.448',
      'Significance (2-tailed) 0.303 0.001 *',
      'df 52 52',
      'Stress HF Correlation −0.334 −0.166',
      'Significance (2-tailed) 0.013 * 0.231',
      'df 52 52',
      '',
      'Next.',
    ].join('\n');
    const read = scanDocument(plainTextDocument('partial.txt', 'text', text)).results.map((result) => `r(${result.df.map((df) => df.text).join(', ')}) = ${result.value?.text}, p = ${result.p?.value.text}`);
    expect(read).toEqual(['r(52) = -0.143, p = 0.303', 'r(52) = -0.448, p = 0.001', 'r(52) = -0.334, p = 0.013', 'r(52) = -0.166, p = 0.231']);
  });
});
