import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import type { ReportedResult } from '../../src/scan/types.js';
import { DEMO_MANUSCRIPTS, demo, pdftotextMissing, PDFTOTEXT_SKIP_REASON, readOk } from './helpers.js';

if (pdftotextMissing) console.warn(`[tests/documents/demo-formats] ${PDFTOTEXT_SKIP_REASON}`);

/** What must agree between formats: kind, statistic, df and p as written. */
function resultKeys(text: string): string[] {
  return scanText(text).results.map(resultKey);
}

function resultKey(result: ReportedResult): string {
  const df = result.df.map((value) => value.text).join(', ');
  const p = result.p ? `${result.p.comparator} ${result.p.value.text}` : 'none';
  return `${result.kind}(${df}) = ${result.value?.text ?? '?'}, p ${p}`;
}

const sourceText = (name: string): string => readFileSync(demo(`${name}.txt`), 'utf8');

interface Planted {
  document: string;
  text: string;
}
const planted = JSON.parse(readFileSync(demo('sources/planted.json'), 'utf8')) as Planted[];

describe.each(DEMO_MANUSCRIPTS)('demo manuscript %s', (name) => {
  const expected = resultKeys(sourceText(name));

  it('has several results and its planted mistakes in the plain-text source', () => {
    expect(expected.length).toBeGreaterThanOrEqual(7);
    const mine = planted.filter((entry) => entry.document === name);
    expect(mine.length).toBeGreaterThanOrEqual(2);
    for (const entry of mine) expect(sourceText(name)).toContain(entry.text);
  });

  it.each(['html', 'xml', 'docx'])('gives the same scanned results as its .txt source in .%s', async (extension) => {
    const document = await readOk(demo(`${name}.${extension}`));
    expect(resultKeys(document.text)).toEqual(expected);
  });

  it('gives the same scanned results as its .txt source in .pdf (pdf-parse)', async () => {
    const document = await readOk(demo(`${name}.pdf`), { pdfEngine: 'pdf-parse' });
    expect(resultKeys(document.text)).toEqual(expected);
  });

  it.skipIf(pdftotextMissing)('gives the same scanned results with both PDF engines (pdftotext against pdf-parse)', async () => {
    const [fromParse, fromPoppler] = await Promise.all([
      readOk(demo(`${name}.pdf`), { pdfEngine: 'pdf-parse' }),
      readOk(demo(`${name}.pdf`), { pdfEngine: 'pdftotext' }),
    ]);
    expect(resultKeys(fromPoppler.text)).toEqual(resultKeys(fromParse.text));
    expect(resultKeys(fromPoppler.text)).toEqual(expected);
  });

  it('locates each result in a PDF on a page', async () => {
    const document = await readOk(demo(`${name}.pdf`), { pdfEngine: 'pdf-parse' });
    for (const result of scanText(document.text).results) expect(document.pageOf(result.start)).toBeGreaterThanOrEqual(1);
  });
});
