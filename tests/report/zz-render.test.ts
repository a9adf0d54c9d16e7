import { writeFileSync } from 'node:fs';
import { it } from 'vitest';
import { formatMarkdown } from '../../src/report/markdown.js';
import { formatCsv } from '../../src/report/csv.js';
import { demoReport, hostileReport } from '../fixtures/report/reports.js';
it('render', () => {
  writeFileSync('/tmp/pl/demo.md', formatMarkdown(demoReport()));
  writeFileSync('/tmp/pl/hostile.md', formatMarkdown(hostileReport()));
  writeFileSync('/tmp/pl/hostile.csv', formatCsv(hostileReport()));
});
