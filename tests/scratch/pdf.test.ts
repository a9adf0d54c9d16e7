import { writeFileSync } from 'node:fs';
import { it } from 'vitest';
import { pdfWithTextRuns } from '../adversarial/build.js';
import { readDocument } from '../../src/documents/read.js';
it('x', async () => {
for (const n of [10000, 100000, 1000000]) {
  let t = Date.now();
  const pdf = pdfWithTextRuns(n);
  writeFileSync('/tmp/runs.pdf', pdf);
  console.log('built', n, pdf.length, Date.now() - t);
  for (const engine of ['pdf-parse', 'pdftotext'] as const) {
    t = Date.now();
    const out = await readDocument('/tmp/runs.pdf', { pdfEngine: engine });
    console.log(engine, out.ok, out.ok ? out.document.text.length : out.error, Date.now() - t, process.memoryUsage().rss/1e6);
  }
}
}, 300000);
