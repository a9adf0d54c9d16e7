import { deflateSync } from 'node:zlib';

/**
 * Builders of hostile inputs, made in the test run (nothing large is committed).
 */

/** A one-page PDF whose content stream draws `runs` text runs of one character each (compressed). */
export function pdfWithTextRuns(runs: number, pages = 1): Buffer {
  const parts: string[] = [];
  for (let index = 0; index < runs; index++) {
    parts.push(`BT /F1 2 Tf ${(index % 300) * 2} ${Math.floor(index / 300) % 400 * 2} Td (${String.fromCharCode(97 + (index % 26))}) Tj ET\n`);
  }
  const content = deflateSync(Buffer.from(parts.join(''), 'latin1'));
  const objects: Buffer[] = [];
  const kids = Array.from({ length: pages }, (_, page) => `${5 + page} 0 R`).join(' ');
  objects.push(Buffer.from('<< /Type /Catalog /Pages 2 0 R >>'));
  objects.push(Buffer.from(`<< /Type /Pages /Kids [${kids}] /Count ${pages} >>`));
  objects.push(Buffer.from('<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>'));
  objects.push(Buffer.concat([Buffer.from(`<< /Length ${content.length} /Filter /FlateDecode >>\nstream\n`), content, Buffer.from('\nendstream')]));
  for (let page = 0; page < pages; page++) {
    objects.push(Buffer.from('<< /Type /Page /Parent 2 0 R /MediaBox [0 0 612 792] /Resources << /Font << /F1 3 0 R >> >> /Contents 4 0 R >>'));
  }
  const chunks: Buffer[] = [Buffer.from('%PDF-1.4\n%\xE2\xE3\xCF\xD3\n', 'latin1')];
  let length = chunks[0]!.length;
  const offsets: number[] = [];
  objects.forEach((body, index) => {
    offsets.push(length);
    const object = Buffer.concat([Buffer.from(`${index + 1} 0 obj\n`), body, Buffer.from('\nendobj\n')]);
    chunks.push(object);
    length += object.length;
  });
  const xref = [`xref\n0 ${objects.length + 1}\n`, '0000000000 65535 f \n', ...offsets.map((offset) => `${String(offset).padStart(10, '0')} 00000 n \n`)].join('');
  chunks.push(Buffer.from(`${xref}trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${length}\n%%EOF\n`));
  return Buffer.concat(chunks);
}
