/**
 * A correlation matrix through the built command line, on a real corpus
 * passage (tests/corpus/real/passages/divl-08.txt; source and licence in
 * tests/corpus/real/labels/divl-08.json): 36 correlations in a lower
 * triangle, N = 60 and the stars' legend in the note. The recomputed p of
 * each r (df = 58) is held against the bound its stars give.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { scanDocumentJson, scanTextJson } from './scanDocumentJson.js';

const root = join(__dirname, '..', '..');
const passage = join(root, 'tests', 'corpus', 'real', 'passages', 'divl-08.txt');

const scanJson = scanDocumentJson;

describe('a correlation matrix from the command line', () => {
  it('cuts a lower triangle whose cells ran together, diagonal printed and decimals varying, into k − 1 correlations and the diagonal per row', () => {
    // A journal's table page as text (tests/corpus/real/passages/dwhd-01.txt, CC BY): "(3) Depression0.670.641" is
    // 0.67, 0.64 and the diagonal 1, not 0.670 and .641; "-0.2" and "0.8" print fewer decimals than the others.
    const document = scanDocumentJson(join(root, 'tests', 'corpus', 'real', 'passages', 'dwhd-01.txt'));
    const values = document.statistics.filter((statistic) => statistic.kind === 'r').map((statistic) => statistic.value);
    expect(values).toHaveLength(36);
    expect(values.slice(0, 6)).toEqual([0.72, 0.67, 0.64, -0.36, -0.32, -0.39]);
    expect(values).toContain(-0.2);
    expect(values).not.toContain(0.721);
    expect(values).not.toContain(0.641);
  });

  it('reports every correlation with df N - 2 and the p bound of its stars, and flags none of the printed ones', () => {
    const document = scanJson(passage);
    const correlations = document.statistics.filter((statistic) => statistic.inTable && statistic.kind === 'r');
    expect(correlations).toHaveLength(36);
    expect(correlations.every((statistic) => statistic.df[0] === 58 && statistic.dfFrom === 'sample-size')).toBe(true);
    const starred = correlations.filter((statistic) => statistic.p?.fromMarks !== undefined);
    expect(starred.map((statistic) => statistic.p!.fromMarks)).toContain('***');
    expect(starred.find((statistic) => statistic.text === '0.47 ***')!.p).toMatchObject({ comparator: '<', value: 0.001, fromMarks: '***' });
    expect(correlations.flatMap((statistic) => statistic.findings).filter((finding) => finding.rule === 'p-value-mismatch')).toEqual([]);
  });

  it('flags a star that the r and its df cannot give', () => {
    // The first correlation (Age with GAD, r = −0.14, df = 58: p ≈ .29) given three stars.
    const directory = mkdtempSync(join(tmpdir(), 'plumbline-matrix-'));
    const changed = join(directory, 'matrix.txt');
    writeFileSync(changed, readFileSync(passage, 'utf8').replace('2. Age 20.9 2.55 \u22120.14', '2. Age 20.9 2.55 \u22120.14 ***'));
    const findings = scanJson(changed)
      .statistics.flatMap((statistic) => statistic.findings)
      .filter((finding) => finding.rule === 'p-value-mismatch');
    expect(findings).toHaveLength(1);
    expect(findings[0]!.message).toContain('r = -0.14 (n = 60, so df = 58) gives p = 0.286');
    expect(findings[0]!.message).toContain('the mark "***" (p < 0.001 by the table\'s note)');
  });
});

describe('a correlation matrix whose cells ran together, from the command line', () => {
  // tests/corpus/real/passages/dvyb-09.txt (source and licence in its label): 15 numbered variables, a lower
  // triangle cut from runs such as "-.23-.27-.26-.34", no N in the note.
  it('reports all 105 correlations, each at its place in the text', () => {
    const gluedPassage = join(root, 'tests', 'corpus', 'real', 'passages', 'dvyb-09.txt');
    const text = readFileSync(gluedPassage, 'utf8');
    const correlations = scanJson(gluedPassage).statistics.filter((statistic) => statistic.inTable && statistic.kind === 'r');
    expect(correlations).toHaveLength(105);
    expect(correlations[0]!.text).toBe('.61');
    expect(text.includes('relations.61')).toBe(true);
    expect(correlations.flatMap((statistic) => statistic.findings).filter((finding) => finding.severity === 'fail')).toEqual([]);
  });
});

describe('correlations as statistics software prints them, from the command line', () => {
  // tests/corpus/real/passages/dvzb-04.txt (source and licence in its label): per variable a "Pearson
  // Correlation", a "Sig. (2-tailed)" and an "n" row, crushed into single spaces.
  const softwarePassage = join(root, 'tests', 'corpus', 'real', 'passages', 'dvzb-04.txt');

  it('reads each correlation with df N - 2 and its printed p, and flags none of them', () => {
    const correlations = scanJson(softwarePassage).statistics.filter((statistic) => statistic.inTable && statistic.kind === 'r');
    expect(correlations).toHaveLength(20);
    expect(correlations.every((statistic) => statistic.df[0] === 26 && statistic.p !== null)).toBe(true);
    expect(correlations.flatMap((statistic) => statistic.findings).filter((finding) => finding.rule === 'p-value-mismatch')).toEqual([]);
  });

  it('flags a Sig. that the r and its N cannot give', () => {
    // r = 0.461 with N = 28 (df = 26) gives p = 0.0136 (SciPy 1.10.1: 2 * scipy.stats.t.sf(r * sqrt(26 / (1 - r²)), 26), computed when the
    // test was written); its Sig. changed from 0.014 to 0.140 in the DMFT block.
    const directory = mkdtempSync(join(tmpdir(), 'plumbline-software-r-'));
    const changed = join(directory, 'correlations.txt');
    writeFileSync(changed, readFileSync(softwarePassage, 'utf8').replace('Sig. (2-tailed) 0.927 - 0.076 0.855 0.014', 'Sig. (2-tailed) 0.927 - 0.076 0.855 0.140'));
    const flagged = scanJson(changed).statistics.filter((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'));
    expect(flagged.map((statistic) => [statistic.value, statistic.p?.value])).toEqual([[0.461, 0.14]]);
  });
});

describe('correlation matrices in other common layouts, from the command line', () => {
  // Common practice (no single source): APA-style matrices number the variables in the rows and the columns,
  // print the diagonal as a dash or 1.00, and may leave out the first variables' columns.
  const variables = ['Anxiety', 'Depression', 'Stress', 'Sleep quality'];
  const lower = [[], ['.45**'], ['.38**', '.52**'], ['−.21*', '−.30**', '−.12']];
  const expected = [0.45, 0.38, 0.52, -0.21, -0.3, -0.12];
  const read = (text: string) =>
    scanTextJson(`Table 2. Intercorrelations of the study variables\n\n${text}\n\nNote. *p < .05. **p < .01.\n\nNext.\n`).statistics.filter((statistic) => statistic.kind === 'r');

  it('takes a diagonal of 1.000 for the diagonal, never for correlations', () => {
    const rows = variables.map((name, index) => `| ${index + 1}. ${name} | ${[...lower[index]!, '1.000', '', '', ''].slice(0, 4).join(' | ')} |`);
    const correlations = read(['| Variable | 1 | 2 | 3 | 4 |', '|---|---|---|---|---|', ...rows].join('\n'));
    expect(correlations.map((statistic) => statistic.value)).toEqual(expected);
  });

  it('reads rows whose number stands in a cell of its own, with tabs, padded, and one cell per line', () => {
    const cells = variables.map((name, index) => [String(index + 1), name, ...lower[index]!, '—', ...new Array<string>(3 - index).fill('')]);
    const header = ['', 'Variable', '1', '2', '3', '4'];
    const widths = header.map((_, column) => Math.max(...[header, ...cells].map((row) => (row[column] ?? '').length)) + 3);
    const copies = {
      tabs: [header, ...cells].map((row) => row.join('\t')).join('\n'),
      padded: [header, ...cells].map((row) => row.map((cell, column) => cell.padEnd(widths[column]!)).join('').trimEnd()).join('\n'),
      'one cell per line': [...header, ...cells.flat()].map((cell) => (cell === '' ? ' ' : cell)).join('\n\n'),
    };
    for (const [copy, text] of Object.entries(copies)) expect(read(text).map((statistic) => statistic.value), copy).toEqual(expected);
  });

  it('reads a matrix whose columns start at a later variable (demographics against the measures 3 and 4)', () => {
    const text = [
      'Variable\t3\t4',
      '1. Age\t.12\t−.08',
      '2. Income\t.25**\t.31**',
      '3. Stress\t—\t.52**',
      '4. Sleep quality\t\t—',
    ].join('\n');
    expect(read(text).map((statistic) => statistic.value)).toEqual([0.12, -0.08, 0.25, 0.31, 0.52]);
  });

  it('reads a crushed matrix numbered in its header ("Factors 1 2 3 4") whose labels carry their number at the end ("Policy (1)")', () => {
    // The layout of a journal's table page as text (tests/corpus/real/passages/dwod-01.txt, CC BY); the numbers are made up.
    const text = [
      'Table 3. Pearson correlation coefficients between the factors.',
      '',
      'Factors 1 2 3 4',
      'School policy (1) 1',
      'Community links (2) .214** 1',
      'Health lessons (3) .362** .027 1',
      'Sport and play (4) .405** .061 .133* 1',
      '',
      '*p < 0.05; **p < 0.01.',
    ].join('\n');
    const correlations = scanTextJson(`${text}\n`).statistics.filter((statistic) => statistic.kind === 'r');
    expect(correlations.map((statistic) => [statistic.value, statistic.p?.comparator, statistic.p?.value])).toEqual([
      [0.214, '<', 0.01],
      [0.362, '<', 0.01],
      [0.027, undefined, undefined],
      [0.405, '<', 0.01],
      [0.061, undefined, undefined],
      [0.133, '<', 0.05],
    ]);
  });

  it('reads an upper triangle whose rows are labelled by their number alone, its columns numbered and then lettered', () => {
    // The layout of a journal's table page as text (tests/corpus/real/passages/dwoh-01.txt, CC BY): each row starts
    // with its diagonal 1 after runs of spaces; the numbers are made up. (This layout once stopped the whole document
    // with an internal error.)
    const text = ['Table 4 Spearman correlation coefficients between variables', '', '  1 2 3 a b', '1 1 0.247* 0.303* 0.116* 0.052', '2   1 0.423* 0.098 0.131*', '3    1 0.201* − 0.015', '', '*p < 0.05'].join('\n');
    const document = scanTextJson(`${text}\n`);
    expect(document.statistics.filter((statistic) => statistic.kind === 'r').map((statistic) => statistic.value)).toEqual([0.247, 0.303, 0.116, 0.052, 0.423, 0.098, 0.131, 0.201, -0.015]);
    const numbersOnly = ['Table 4 Spearman correlation coefficients between variables', '', '  1 2 3 4', '1 1 0.247* 0.303* 0.306*', '2   1 0.423* 0.316*', '3    1 0.409*', '4     1', '', '*p < 0.05'].join('\n');
    expect(scanTextJson(`${numbersOnly}\n`).statistics.map((statistic) => statistic.value)).toEqual([0.247, 0.303, 0.306, 0.423, 0.316, 0.409]);
  });

  it('gives the r of a table with r and p columns df N − 2 from a note that ends its sentence right after N ("Note. N = 120."), whatever the layout', () => {
    // Common practice: a note states the sample of a correlation table; the numbers are made up.
    // (r(118) = −.21 gives p = .021: SciPy 1.10.1 scipy.stats.pearsonr's t form, 2 * scipy.stats.t.sf, computed when the
    // test was written.) Without the note's N the r would be checked against the study's N, as a warning at most.
    const rows = [['Variable', 'r', 'p'], ['Age', '-.21', '.021'], ['Income', '.33', '<.001']];
    const layouts: Record<string, string> = {
      pipe: ['| Variable | r | p |', '|---|---|---|', '| Age | -.21 | .021 |', '| Income | .33 | <.001 |'].join('\n'),
      'one cell per line': rows.map((row) => row.join('\n\n')).join('\n\n'),
    };
    for (const [layout, table] of Object.entries(layouts)) {
      const document = scanTextJson(`Table 2. Correlations of the measures with age\n\n${table}\n\nNote. N = 120.\n`);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.dfFrom]), layout).toEqual([
        ['r', -0.21, [118], 'sample-size'],
        ['r', 0.33, [118], 'sample-size'],
      ]);
    }
  });
  // Layout of tune passage divn-07: side-by-side blocks of correlations under a title that says so, whose variables
  // include "Test" (a known column name elsewhere), with empty cells as empty lines or spaces.
  it('reads side-by-side blocks of correlations whose variables include a known column name ("Test"), one cell per line and on consecutive lines (real corpus divn-07)', () => {
    const rows = [
      ['Single scales', 'Component scales', '', '', '', ''],
      ['STAI', 'TAI', 'WA', 'Trait', 'Test', 'Writing', '', ''],
      ['STAI', '–', '0.50', '−0.26', 'Trait', '–', '0.57', '−0.16'],
      ['TAI', '–', '−0.41', 'Test', '–', '−0.25', '', ''],
      ['WA', '–', 'Writing', '–', '', '', '', ''],
    ];
    for (const [layout, body] of [
      ['consecutive lines', rows.map((row) => row.join('\n')).join('\n')],
      ['one cell per line', rows.map((row) => row.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n')).join('\n\n')],
    ] as const) {
      const document = scanTextJson(`Table 4.\nCorrelations between the anxiety scales.\n${body}\nNote. Correlations in the test sample (N = 280).\n`);
      // (Each r with df N − 2 from the note's sample size.)
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df]), layout).toEqual([
        ['r', 0.5, [278]],
        ['r', -0.26, [278]],
        ['r', 0.57, [278]],
        ['r', -0.16, [278]],
        ['r', -0.41, [278]],
        ['r', -0.25, [278]],
      ]);
    }
  });

  it('reads a crushed matrix whose cells carry a caret standing apart ("0.17 ^"), a mark for p < .10, without taking a p from it', () => {
    // The mark of tests/corpus/real/passages/divt-02.txt (CC BY), crushed; the numbers are made up (r(118) = .17 gives
    // p = .063, .45 gives p < .001, -.20 gives p = .029: SciPy 1.10.1 2 * scipy.stats.t.sf of r*sqrt(118/(1-r^2)),
    // computed when the test was written).
    const text = [
      'Table 2. Correlations among the measures (N = 120)',
      'Variable 1 2 3 4',
      '1. Anxiety -',
      '2. Stress 0.17 ^ -',
      '3. Sleep 0.45 ** 0.30 ** -',
      '4. Mood -0.20 * 0.16 ^ 0.41 ** -',
      'Note. * p < .05; ** p < .01; ^ p < .10.',
    ].join('\n');
    const statistics = scanTextJson(`${text}\n\nThe next section.\n`).statistics;
    expect(statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df])).toEqual([
      ['r', 0.17, [118]],
      ['r', 0.45, [118]],
      ['r', 0.3, [118]],
      ['r', -0.2, [118]],
      ['r', 0.16, [118]],
      ['r', 0.41, [118]],
    ]);
    expect(statistics.flatMap((statistic) => statistic.findings.filter((finding) => finding.severity === 'fail'))).toEqual([]);
  });
});
