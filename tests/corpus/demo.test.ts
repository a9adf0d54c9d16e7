import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { auditText } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';

/**
 * The demo corpus's answer key (corpus-demo/answer-key.json, written by
 * corpus-demo/tools/build_answer_key.py and verified numerically by
 * corpus-demo/tools/check_corpus.py with SciPy) lists every planted finding.
 * The scan must find exactly these: no more, no fewer.
 */
interface KeyEntry {
  file: string;
  line: number;
  rule: string;
  severity: string;
  crossesAlpha: boolean;
}

const corpus = 'corpus-demo';
const key = JSON.parse(readFileSync(join(corpus, 'answer-key.json'), 'utf8')) as { findings: KeyEntry[]; correctResults: number };
const manuscripts = readdirSync(corpus).filter((name) => /\.(txt|md)$/.test(name) && name !== 'README.md');

function describeEntry(entry: KeyEntry): string {
  return `${entry.file}:${entry.line} ${entry.rule} ${entry.severity}${entry.crossesAlpha ? ' crossesAlpha' : ''}`;
}

describe('corpus-demo', () => {
  const config = resolveConfig({});
  const audits = manuscripts.map((file) => ({ file, audit: auditText(readFileSync(join(corpus, file), 'utf8'), config, file) }));

  it('the scan finds exactly the planted findings of the answer key', () => {
    const found = audits.flatMap(({ file, audit }) =>
      audit.statistics.flatMap((statistic) =>
        statistic.findings.map((finding) =>
          describeEntry({ file, line: statistic.location.line, rule: finding.rule, severity: finding.severity, crossesAlpha: finding.crossesAlpha }),
        ),
      ),
    );
    expect(found.sort()).toEqual(key.findings.map(describeEntry).sort());
  });

  it('every correctly reported result is found and left unflagged', () => {
    const flaggedLines = new Set(key.findings.map((entry) => `${entry.file}:${entry.line}`));
    const unflagged = audits.flatMap(({ file, audit }) =>
      audit.statistics.filter((s) => s.findings.length === 0 && !flaggedLines.has(`${file}:${s.location.line}`)),
    );
    // The three results of the mislabelled-eta-squared paragraph are counted as planted, not correct.
    expect(unflagged.length).toBe(key.correctResults);
  });

  it('has at least eight manuscripts in text and Markdown', () => {
    expect(manuscripts.length).toBeGreaterThanOrEqual(8);
    expect(manuscripts.some((m) => m.endsWith('.md')) && manuscripts.some((m) => m.endsWith('.txt'))).toBe(true);
  });
});
