import {
  AlignmentType,
  BorderStyle,
  Document,
  Packer,
  Paragraph,
  Table,
  TableCell,
  TableRow,
  TextRun,
  WidthType,
  type IBorderOptions,
} from 'docx';
import { showsAnovaComparison, MEANS_COMPARISON_HEAD, meansComparisonCells, meansExplanationLines, meansSummaryLines, comparisonCells, explanationLines, extraTables, factorsLine, fitLine, reportNotes, summaryLine, formatDf, formatF, formatP, formatProportion, formatSS, ITALIC_SYMBOLS, leveneLine, tableNote, termLabel } from './format.js';
import type { RefitOutput } from './output.js';
import { visibleStrings } from '../report/visible.js';

/**
 * The recomputed ANOVA table as a Word document: a real Word table in the
 * usual journal style (rules above and below the header and at the bottom,
 * no vertical lines), a caption and a note, ready for a response to reviewers;
 * then the tables printed beside it (format.ts, extraTables) and, when a
 * reported table was given, the comparison with it and the slips that
 * reproduce it.
 */

const FONT = 'Times New Roman';
const SIZE = 22; // half-points: 11 pt
const NONE: IBorderOptions = { style: BorderStyle.NONE, size: 0, color: 'FFFFFF' };
const RULE: IBorderOptions = { style: BorderStyle.SINGLE, size: 8, color: '000000' };

function run(text: string, options: { italics?: boolean; bold?: boolean; subScript?: boolean; superScript?: boolean } = {}): TextRun {
  return new TextRun({ text, font: FONT, size: SIZE, ...options });
}

function cell(children: TextRun[], options: { left: boolean; top?: boolean; bottom?: boolean }): TableCell {
  return new TableCell({
    children: [new Paragraph({ children, alignment: options.left ? AlignmentType.LEFT : AlignmentType.RIGHT })],
    borders: { top: options.top ? RULE : NONE, bottom: options.bottom ? RULE : NONE, left: NONE, right: NONE },
    margins: { left: 80, right: 80, top: 30, bottom: 30 },
  });
}

function headerRuns(h: string): TextRun[] {
  if (h === 'ηp²') return [run('η', { italics: true }), run('p', { italics: true, subScript: true }), run('2', { superScript: true })];
  if (ITALIC_SYMBOLS.has(h)) return [run(h, { italics: true })];
  return [run(h)];
}

/** A result line with its statistic symbols (F, p, R) in italics. */
function symbolRuns(text: string): TextRun[] {
  const runs: TextRun[] = [];
  let last = 0;
  for (const m of text.matchAll(/\b[FpR](?=[( ²])/g)) {
    if (m.index > last) runs.push(run(text.slice(last, m.index)));
    runs.push(run(m[0], { italics: true }));
    last = m.index + m[0].length;
  }
  if (last < text.length) runs.push(run(text.slice(last)));
  return runs;
}

/** A journal-style table: rules above and below the header and under the last row. */
function journalTable(head: string[], body: string[][], numbersFrom: number): Table {
  const rows = [
    new TableRow({ tableHeader: true, children: head.map((h, i) => cell(headerRuns(h), { left: i < numbersFrom, top: true, bottom: true })) }),
    ...body.map((r, ri) => new TableRow({ children: r.map((c, i) => cell([run(c)], { left: i < numbersFrom, bottom: ri === body.length - 1 })) })),
  ];
  return new Table({
    rows,
    width: { size: 100, type: WidthType.PERCENTAGE },
    borders: { top: NONE, bottom: NONE, left: NONE, right: NONE, insideHorizontal: NONE, insideVertical: NONE },
  });
}

/** A .docx file (bytes) with the recomputed table. */
export async function formatRefitDocx(output: RefitOutput): Promise<Buffer> {
  // Controls from the files and the manuscript are shown as escapes, as in the other formats; a C0 control is
  // not even allowed in a Word document's XML, where it would leave a file Word refuses to open.
  const o = visibleStrings(output);
  const head = ['Source', 'SS', 'df', 'MS', 'F', 'p', 'ηp²'];
  const body: string[][] = [
    ...o.terms.map((r) => [termLabel(r.term, o), formatSS(r.ss), formatDf(r.df), formatSS(r.ms), formatF(r.F), formatP(r.p), formatProportion(r.partialEtaSquared)]),
    ['Residual', formatSS(o.residual.ss), formatDf(o.residual.df), formatSS(o.residual.ms), '', '', ''],
  ];
  const table = journalTable(head, body, 1);
  const extra = extraTables(o).flatMap((t, i) => [
    new Paragraph({ children: [run(`Table ${i + 2}`, { bold: true })], spacing: { before: 360, after: 120 } }),
    new Paragraph({ children: [run(t.title, { italics: true })], spacing: { after: 120 } }),
    journalTable(t.head, t.rows, t.numbersFrom),
    new Paragraph({ children: [run('Note. ', { italics: true }), run(`${t.note.replace(/^Note\.\s*/, '')} ${t.analysis}`)], spacing: { before: 120 } }),
  ]);
  const levene = leveneLine(o);
  const compared: Array<Paragraph | Table> = [];
  if (o.comparison && showsAnovaComparison(o)) {
    const c = o.comparison;
    compared.push(
      new Paragraph({ children: [run(`Compared with ${c.reportedFile}`, { bold: true })], spacing: { before: 360, after: 120 } }),
      new Paragraph({ children: [run(`Read from: ${c.sources.join(', ')}.`)], spacing: { after: 120 } }),
      journalTable(['Term', 'Printed as', 'Quantity', 'Reported', 'Recomputed', 'Difference', 'Verdict'], comparisonCells(o, false).map((r) => r.cells), 3),
      new Paragraph({ children: [run(summaryLine(o))], spacing: { before: 120 } }),
    );
    const explanations = explanationLines(o);
    if (explanations.length > 0) {
      compared.push(new Paragraph({ children: [run('What reproduces the reported numbers', { bold: true })], spacing: { before: 240, after: 120 } }));
      for (const e of explanations) compared.push(new Paragraph({ children: [run(e)], spacing: { after: 60 } }));
    }
    if (o.impliedN) compared.push(new Paragraph({ children: [run(o.impliedN.note)], spacing: { before: 120 } }));
  }
  if (o.meansComparison) {
    compared.push(new Paragraph({ children: [run('Reported means, comparisons and contrasts against the refit', { bold: true })], spacing: { before: 360, after: 120 } }));
    const rows = meansComparisonCells(o);
    if (rows.length > 0) compared.push(journalTable(MEANS_COMPARISON_HEAD, rows.map((r) => r.cells), 3));
    for (const l of meansSummaryLines(o)) compared.push(new Paragraph({ children: [run(l)], spacing: { before: 120 } }));
    const why = meansExplanationLines(o);
    if (why.length > 0) {
      compared.push(new Paragraph({ children: [run('What reproduces the reported means and comparisons', { bold: true })], spacing: { before: 240, after: 120 } }));
      for (const e of why) compared.push(new Paragraph({ children: [run(e)], spacing: { after: 60 } }));
    }
  }
  const kind = o.covariates.length > 0 ? 'Analysis of covariance' : 'Analysis of variance';
  const document = new Document({
    creator: 'plumbline refit',
    title: `${kind} of ${termLabel(o.outcome, o)}`,
    sections: [
      {
        children: [
          new Paragraph({ children: [run('Table 1', { bold: true })], spacing: { after: 120 } }),
          new Paragraph({ children: [run(`${kind} of ${termLabel(o.outcome, o)}`, { italics: true })], spacing: { after: 120 } }),
          table,
          new Paragraph({ children: [run('Note. ', { italics: true }), run(tableNote(o).replace(/^Note\.\s*/, '')), run(' '), ...symbolRuns(`${fitLine(o)}.`)], spacing: { before: 120 } }),
          ...extra,
          ...(levene ? [new Paragraph({ children: symbolRuns(levene), spacing: { before: 240 } })] : []),
          ...[...(factorsLine(o) ? [`Levels: ${factorsLine(o)}`] : []), ...reportNotes(o)].map((n, i) => new Paragraph({ children: symbolRuns(n), spacing: { before: i === 0 ? 240 : 60 } })),
          ...compared,
        ],
      },
    ],
  });
  return Packer.toBuffer(document);
}
