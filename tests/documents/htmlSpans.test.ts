import { describe, expect, it } from 'vitest';
import { htmlToDocument } from '../../src/documents/html.js';

// Common practice: a results table's upper header spans each block's columns (colspan) and the row-label
// header spans both header rows (rowspan). Invented example.
describe('an HTML table with spanning cells', () => {
  it('lays each spanning cell over its columns and rows, so every cell stands in its column', () => {
    const html =
      '<table><thead><tr><th rowspan="2">Measure</th><th colspan="2">Session 1</th><th colspan="2">Session 2</th></tr>' +
      '<tr><th>F(1, 40)</th><th>p</th><th>F(1, 38)</th><th>p</th></tr></thead>' +
      '<tbody><tr><td>Recall</td><td>5.21</td><td>.028</td><td>0.44</td><td>.511</td></tr></tbody></table>';
    const document = htmlToDocument(html, 'spans.html', 'html');
    expect(document.tables[0]!.rows).toEqual([
      ['Measure', 'Session 1', '', 'Session 2', ''],
      ['', 'F(1, 40)', 'p', 'F(1, 38)', 'p'],
      ['Recall', '5.21', '.028', '0.44', '.511'],
    ]);
  });

  it('takes a span larger than any table as 50 columns, not as millions of cells', () => {
    const html = '<table><tr><td colspan="99999999">Wide</td></tr><tr><td>a</td><td>1</td></tr></table>';
    expect(htmlToDocument(html, 'wide.html', 'html').tables[0]!.rows[0]).toHaveLength(50);
  });
});
