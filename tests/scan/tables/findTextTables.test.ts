import { describe, expect, it } from 'vitest';
import { findTextTables, readTableResults } from '../../../src/scan/tables/index.js';

// Invented tables in the layouts that plain text, Markdown and text copied from PDF leave.

describe('findTextTables: pipe tables', () => {
  it('reads a Markdown table with its title and note', () => {
    const text = [
      'Recall improved with sleep.',
      '',
      'Table 2. Analysis of variance for recall',
      '',
      '| Source | SS | df | MS | F | p | ηp2 |',
      '|---|---:|---:|---:|---:|---:|---:|',
      '| Condition | 12.40 | 2 | 6.20 | 4.21 | .018 | .13 |',
      '| Error | 83.95 | 57 | 1.47 | | | |',
      '',
      'Note. df = 2, 57 for the effect.',
      '',
      'Discussion follows.',
    ].join('\n');
    const [table, ...rest] = findTextTables(text);
    expect(rest).toEqual([]);
    expect(table!.caption).toBe('Table 2. Analysis of variance for recall');
    expect(table!.notes).toEqual(['Note. df = 2, 57 for the effect.']);
    expect(table!.rows).toEqual([
      ['Source', 'SS', 'df', 'MS', 'F', 'p', 'ηp2'],
      ['Condition', '12.40', '2', '6.20', '4.21', '.018', '.13'],
      ['Error', '83.95', '57', '1.47', '', '', ''],
    ]);
    expect(text.slice(table!.start, table!.end)).toMatch(/^Table 2\. Analysis[\s\S]*for the effect\.$/);
  });

  it('reads the " | " rows that document readers write, keeping empty cells', () => {
    const text = 'Table 1. Test\nSource | SS | df | MS | F | p\nGroup | 4.00 | 1 | 4.00 | 2.00 | .16\nError | 100.00 | 50 | 2.00 |  | \n';
    const [table] = findTextTables(text);
    expect(table!.rows[2]).toEqual(['Error', '100.00', '50', '2.00', '', '']);
  });
});

describe('findTextTables: whitespace-aligned columns', () => {
  it('places cells under their headers by position, so missing cells stay empty', () => {
    const text = [
      'Table 3',
      'Analysis of Variance for Reaction Time',
      'Source            SS     df      MS       F      p',
      'Cue            24.60      1   24.60    6.15   .016',
      'Error         228.00     57    4.00',
      'Total         252.60     58',
      'Note. Times in hundreds of milliseconds.',
    ].join('\n');
    const [table] = findTextTables(text);
    expect(table!.caption).toBe('Table 3 Analysis of Variance for Reaction Time');
    expect(table!.rows).toEqual([
      ['Source', 'SS', 'df', 'MS', 'F', 'p'],
      ['Cue', '24.60', '1', '24.60', '6.15', '.016'],
      ['Error', '228.00', '57', '4.00', '', ''],
      ['Total', '252.60', '58', '', '', ''],
    ]);
    expect(table!.notes).toEqual(['Note. Times in hundreds of milliseconds.']);
  });

  it('places a value that sits under a later column there, not in the first free one', () => {
    const text = ['Source        df       F       p', 'Group          1    5.10    .027', 'Age                  0.40    .530'].join('\n');
    const [table] = findTextTables(text);
    expect(table!.rows[2]).toEqual(['Age', '', '0.40', '.530']);
  });

  it('reads tab-separated rows', () => {
    const text = 'Source\tdf\tF\tp\nDose\t2\t3.90\t.025\nResidual\t60\t\t\n';
    const [table] = findTextTables(text);
    expect(table!.rows).toEqual([
      ['Source', 'df', 'F', 'p'],
      ['Dose', '2', '3.90', '.025'],
      ['Residual', '60', '', ''],
    ]);
  });
});

describe('findTextTables: crushed columns from PDF text', () => {
  const text = [
    'Table 1. Mixed analysis of variance of fluency',
    'Source SS df MS F p ηp',
    '2',
    'Between subjects',
    'Group 871.82 1 871.82 4.83 .031 .06',
    'Error (between) 12815.50 71 180.50',
    'Within subjects',
    'Session 566.27 2 283.14 12.64 < .001 .15',
    'Session × Group 152.77 2 76.38 3.41 .036 .05',
    'Error (within) 3180.80 142 22.40',
    'Note. Sphericity held, so no correction was applied.',
    'Discussion',
    'Reading aloud seems to help.',
  ].join('\n');

  it('joins the superscript line to its header, keeps "< .001" whole and section rows as rows', () => {
    const [table, ...rest] = findTextTables(text);
    expect(rest).toEqual([]);
    expect(table!.rows[0]).toEqual(['Source', 'SS', 'df', 'MS', 'F', 'p', 'ηp2']);
    expect(table!.rows.slice(1)).toEqual([
      ['Between subjects', '', '', '', '', '', ''],
      ['Group', '871.82', '1', '871.82', '4.83', '.031', '.06'],
      ['Error (between)', '12815.50', '71', '180.50'],
      ['Within subjects', '', '', '', '', '', ''],
      ['Session', '566.27', '2', '283.14', '12.64', '< .001', '.15'],
      ['Session × Group', '152.77', '2', '76.38', '3.41', '.036', '.05'],
      ['Error (within)', '3180.80', '142', '22.40'],
    ]);
    // Single-spaced columns do not show where a short row's cells stand: the rows are kept as written.
    expect(table!.layout).toBe('crushed');
    expect(table!.notes).toEqual(['Note. Sphericity held, so no correction was applied.']);
    expect(text.slice(table!.end - 12, table!.end)).toBe('was applied.');
  });

  it('groups multi-word headers, and the table reader keeps numbers in labels', () => {
    const crushed = ['Source of variation Sum of squares df Mean square F ratio p', 'Block 2 12.40 2 6.20 4.21 .018', 'Within groups 83.95 57 1.47'].join('\n');
    const [table] = findTextTables(crushed);
    expect(table!.rows).toEqual([
      ['Source of variation', 'Sum of squares', 'df', 'Mean square', 'F ratio', 'p'],
      ['Block', '2', '12.40', '2', '6.20', '4.21', '.018'],
      ['Within groups', '83.95', '57', '1.47'],
    ]);
    const [result] = readTableResults(crushed, [table!]);
    expect(result!.tableRow!.rowLabel).toBe('Block 2');
    expect(result!.df.map((df) => df.text)).toEqual(['2', '57']);
    expect(result!.value?.text).toBe('4.21');
  });

  it('joins wrapped note lines', () => {
    const crushed = ['Source df F p', 'Group 1 4.00 .049', 'Note. All tests used the error term of the', 'full model.', 'Results were robust.'].join('\n');
    expect(findTextTables(crushed)[0]!.notes).toEqual(['Note. All tests used the error term of the full model.']);
  });
});

describe('findTextTables: not tables', () => {
  it.each([
    'We tested 96 visitors.  Each walked the trail twice.  Scores ranged from 2 to 14.',
    'The sample of 2019 included 45 56\nparticipants in total.',
    'Scores were compared (see Table 2).\nThe effect was large, F(2, 57) = 4.21, p = .018.',
    'Recall was higher after sleep, t(58) = 2.10, p = .040, and\nlower after waking, F(1, 170) = 5.2, p = .024.',
  ])('%s', (text) => {
    expect(findTextTables(text)).toEqual([]);
  });

  it('handles hostile input: a line of pipes, unbalanced brackets, a long line of numbers', () => {
    const hostile = ['|'.repeat(5000), '('.repeat(5000), '1 '.repeat(20000), 'Source df F p', '( 1 2 3'].join('\n');
    expect(() => findTextTables(hostile)).not.toThrow();
  });
});

describe('HTML tables left as markup in text', () => {
  it('lays spanning cells out as empty cells and points each cell at its text', () => {
    const text = '<table><tr><th rowspan="2">Measure</th><th colspan="2">Pre</th></tr><tr><th>t</th><th>p</th></tr>\n<tr><td>Recall</td><td> 2.10 </td><td>.041</td></tr></table>';
    const [table] = findTextTables(text);
    expect(table!.rows).toEqual([['Measure', 'Pre', ''], ['', 't', 'p'], ['Recall', '2.10', '.041']]);
    expect(table!.headerRows).toBe(2);
    const cell = table!.cells![2]![1]!;
    expect(text.slice(cell.start, cell.end)).toBe('2.10');
  });

  it('reads a table cut off before its end tag up to its last complete row', () => {
    const text = 'Table 1. Cut.\n\n<table>\n<tr><th>Measure</th><th>t</th><th>p</th></tr>\n<tr><td>A</td><td>2.10</td><td>.041</td></tr>\n<tr><td>B</td><td>1.';
    const [table] = findTextTables(text);
    expect(table!.rows).toEqual([['Measure', 't', 'p'], ['A', '2.10', '.041']]);
  });

  it('leaves markup nested past the element limits alone instead of failing', () => {
    const text = `<table><tr><td>${'<div>'.repeat(5000)}x${'</div>'.repeat(5000)}</td></tr><tr><td>1</td></tr></table>`;
    expect(() => findTextTables(text)).not.toThrow();
  });
});

describe('table titles numbered in Roman numerals', () => {
  // Common practice in engineering journals: "TABLE III" over a caption in capitals.
  it('takes "TABLE III" as a title, one cell per line too', () => {
    const text = ['TABLE III', 'ANOVA RESULTS FOR ACCURACY', '', 'Source', 'df', 'F', 'p', 'Group', '2', '5.21', '.008', 'Error', '57'].join('\n');
    const [table] = findTextTables(text);
    expect(table!.caption).toContain('TABLE III');
    expect(table!.rows[1]).toEqual(['Group', '2', '5.21', '.008']);
  });

  it('does not take a word after "Table" for a numeral', () => {
    expect(findTextTables('Table Vitamins by group\n\nSource | df | F | p\nGroup | 2 | 5.21 | .008\n')[0]!.caption).toBeNull();
  });
});

describe('pipe rows run together on one line', () => {
  // Common practice of web copies that lose a table's row breaks (invented numbers).
  const header = '| Measure | F | p | ηp2 |';
  const runOn = '| Minimum gap | 12.4 | 0.002 | 0.34 | Lane changes | 2.3 | 0.141 | 0.09 | Braking time | 23.6 | <0.001 | 0.49 | Steering reversals | 17.8 | <0.001 | 0.42 | Mirror glances | 5.2 | 0.031 | 0.18 | Speed variance | 0.3 | 0.595 | 0.01 |';

  it('cuts the line before each label under a header of as many cells', () => {
    const [table] = findTextTables(`${header}\n${runOn}\n`);
    expect(table!.rows.map((row) => row[0])).toEqual(['Measure', 'Minimum gap', 'Lane changes', 'Braking time', 'Steering reversals', 'Mirror glances', 'Speed variance']);
  });

  it('leaves the line alone under a header of another width', () => {
    const tables = findTextTables(`| Measure | F | p |\n${runOn}\n`);
    expect(tables.every((table) => table.rows.length < 3)).toBe(true);
  });
});
