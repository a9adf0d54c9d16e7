/** Writes invented manuscripts as PDFs for the benchmarks (pdf-lib, standard Helvetica: ASCII text only). */
import { writeFileSync } from 'node:fs';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { LINE_WIDTH, wrapWords } from './denseText.js';

/**
 * The lines of a page: each line cut every LINE_WIDTH characters, or (`wrap: 'words'`) broken between
 * words as a typesetter does, so that no number or bracket is split across two lines.
 */
function pageLines(line: string, wrap: 'characters' | 'words'): string[] {
  if (wrap === 'characters') {
    const pieces: string[] = [];
    for (let start = 0; start < Math.max(1, line.length); start += LINE_WIDTH) pieces.push(line.slice(start, start + LINE_WIDTH));
    return pieces;
  }
  return wrapWords(line);
}

export async function writePdf(path: string, lines: string[], wrap: 'characters' | 'words' = 'characters'): Promise<void> {
  const pdf = await PDFDocument.create();
  const font = await pdf.embedFont(StandardFonts.Helvetica);
  let page = pdf.addPage([595, 842]);
  let y = 800;
  for (const line of lines) {
    // Wrapped at about 95 characters, as a narrow column would.
    for (const piece of pageLines(line, wrap)) {
      if (y < 50) {
        page = pdf.addPage([595, 842]);
        y = 800;
      }
      page.drawText(piece, { x: 40, y, size: 9, font });
      y -= 13;
    }
  }
  writeFileSync(path, await pdf.save());
}
