/**
 * The command line on a PDF whose results stand only in table rows:
 * `node dist/src/cli/main.js scan <pdf> --format json` (built by `npm test`)
 * reports each row as a result with its df and p. The fixture is
 * tests/fixtures/pdf-tables/wrapped-labels.pdf, whose rows are copied from
 * the real passage tests/corpus/real/passages/tab-06.txt (Frontiers in
 * Psychology 2023, Table 3, CC BY 4.0), set with labels that wrap.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { pdftotextMissing } from './helpers.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

const bin = join('dist', 'src', 'cli', 'main.js');
const pdf = fileURLToPath(new URL('../fixtures/pdf-tables/wrapped-labels.pdf', import.meta.url));

interface Statistic {
  kind: string;
  text: string;
  df: number[];
  value: number;
  p: { comparator: string; text: string } | null;
  location: { page: number | null };
}

describe.each(['pdf-parse', 'pdftotext'] as const)('plumbline scan <pdf> --format json with %s', (engine) => {
  it.skipIf(engine === 'pdftotext' && pdftotextMissing)('reports the rows of a table rebuilt from word positions as results', () => {
    const run = spawnSync('node', [bin, 'scan', pdf, '--format', 'json', '--no-cache', '--pdf-engine', engine, '--fail-on', 'never'], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
    expect(run.stderr).not.toMatch(/error/i);
    expect(run.status).toBe(0);
    const report = readJsonReport(run.stdout) as unknown as { documents: { status: string; statistics: Statistic[] }[] };
    const [document] = report.documents;
    expect(document!.status).not.toBe('unreadable');
    const rows = document!.statistics.map((statistic) => ({
      kind: statistic.kind,
      df: statistic.df,
      value: statistic.value,
      p: statistic.p === null ? null : `${statistic.p.comparator} ${statistic.p.text}`,
      page: statistic.location.page,
    }));
    expect(rows).toHaveLength(11);
    expect(rows.slice(0, 3)).toEqual([
      { kind: 'F', df: [2, 180], value: 87.41, p: '< 0.001', page: 1 },
      { kind: 'F', df: [1, 180], value: 71.05, p: '< 0.001', page: 1 },
      { kind: 'F', df: [2, 180], value: 2.21, p: '= 0.11', page: 1 },
    ]);
    expect(rows).toContainEqual({ kind: 'F', df: [1, 59], value: 80.99, p: '< 0.001', page: 1 });
    expect(rows).toContainEqual({ kind: 'F', df: [2, 179], value: 0.83, p: '= 0.44', page: 1 });
    // Each result's text is its row, written with its cells apart, the label joined from its two lines.
    expect(document!.statistics.map((statistic) => statistic.text)).toContain('Digit span backwards (DSB) | 2.76 | 2, 180 | 0.07 | 0.03');
  });
});
