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
import { formatDf, formatF, formatP, formatProportion, formatSS, tableNote, termLabel } from './format.js';
import type { RefitOutput } from './output.js';

/**
 * The recomputed ANOVA table as a Word document: a real Word table in the
 * usual journal style (rules above and below the header and at the bottom,
 * no vertical lines), a caption and a note, ready for a response to reviewers.
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
  if (h === 'Source') return [run(h)];
  return [run(h, { italics: true })];
}

/** A .docx file (bytes) with the recomputed table. */
export async function formatRefitDocx(o: RefitOutput): Promise<Buffer> {
  const head = ['Source', 'SS', 'df', 'MS', 'F', 'p', 'ηp²'];
  const body: string[][] = [
    ...o.terms.map((r) => [termLabel(r.term), formatSS(r.ss), formatDf(r.df), formatSS(r.ms), formatF(r.F), formatP(r.p), formatProportion(r.partialEtaSquared)]),
    ['Residual', formatSS(o.residual.ss), formatDf(o.residual.df), formatSS(o.residual.ms), '', '', ''],
  ];
  const rows = [
    new TableRow({ tableHeader: true, children: head.map((h, i) => cell(headerRuns(h), { left: i === 0, top: true, bottom: true })) }),
    ...body.map(
      (r, ri) => new TableRow({ children: r.map((c, i) => cell([run(c)], { left: i === 0, bottom: ri === body.length - 1 })) }),
    ),
  ];
  const table = new Table({
    rows,
    width: { size: 100, type: WidthType.PERCENTAGE },
    borders: { top: NONE, bottom: NONE, left: NONE, right: NONE, insideHorizontal: NONE, insideVertical: NONE },
  });
  const kind = o.covariates.length > 0 ? 'Analysis of covariance' : 'Analysis of variance';
  const document = new Document({
    creator: 'plumbline refit',
    title: `${kind} of ${o.outcome}`,
    sections: [
      {
        children: [
          new Paragraph({ children: [run('Table 1', { bold: true })], spacing: { after: 120 } }),
          new Paragraph({ children: [run(`${kind} of ${o.outcome}`, { italics: true })], spacing: { after: 120 } }),
          table,
          new Paragraph({ children: [run('Note. ', { italics: true }), run(tableNote(o).replace(/^Note\.\s*/, ''))], spacing: { before: 120 } }),
        ],
      },
    ],
  });
  return Packer.toBuffer(document);
}
