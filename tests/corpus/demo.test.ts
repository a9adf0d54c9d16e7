import { existsSync, readdirSync } from 'node:fs';
import { readFileSync } from 'node:fs';
import { basename, extname, join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { auditFile } from '../../src/batch/auditFile.js';
import { resolveConfig } from '../../src/checks/config.js';
import type { DocumentOutput, StatisticOutput } from '../../src/report/model.js';

/**
 * The demo corpus's answer key (corpus-demo/answer-key.json, written by
 * corpus-demo/tools/build_answer_key.py and verified numerically with SciPy by
 * corpus-demo/tools/check_corpus.py and corpus-demo/sources/values.py) lists
 * every planted finding in the text and Markdown manuscripts. The scan must
 * find exactly these, no more and no fewer; and each manuscript that also
 * exists as PDF, DOCX, HTML and JATS XML must give the same findings in every
 * format as in its text version.
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
const textManuscripts = readdirSync(corpus).filter((name) => /\.(txt|md)$/.test(name) && name !== 'README.md');
const builtFromSources = (file: string): boolean => existsSync(join(corpus, 'sources', `${basename(file, extname(file))}.ms`));
const otherFormats = ['.pdf', '.docx', '.html', '.xml'];

function describeEntry(entry: KeyEntry): string {
  return `${entry.file}:${entry.line} ${entry.rule} ${entry.severity}${entry.crossesAlpha ? ' crossesAlpha' : ''}`;
}

/** A finding without its place in the file, to compare formats whose lines differ. */
function placeless(statistic: StatisticOutput): string[] {
  const identity = `${statistic.kind}(${statistic.df.join(', ')}) ${statistic.valueComparator} ${statistic.value}`;
  return statistic.findings.map((f) => `${identity} ${f.rule} ${f.severity}${f.crossesAlpha ? ' crossesAlpha' : ''}`);
}

describe('corpus-demo', async () => {
  const config = resolveConfig({});
  const readOptions = { pdfEngine: 'pdf-parse' as const };
  const audits = new Map<string, DocumentOutput>();
  for (const file of readdirSync(corpus)) {
    if (textManuscripts.includes(file) || otherFormats.includes(extname(file))) {
      audits.set(file, await auditFile(join(corpus, file), config, readOptions));
    }
  }

  it('the scan of the text manuscripts finds exactly the planted findings of the answer key', () => {
    const found = textManuscripts.flatMap((file) =>
      audits.get(file)!.statistics.flatMap((statistic) =>
        statistic.findings.map((finding) =>
          describeEntry({ file, line: statistic.location.line, rule: finding.rule, severity: finding.severity, crossesAlpha: finding.crossesAlpha }),
        ),
      ),
    );
    expect(found.sort()).toEqual(key.findings.map(describeEntry).sort());
  });

  it('every correctly reported result of the hand-written manuscripts is found and left unflagged', () => {
    const flaggedLines = new Set(key.findings.map((entry) => `${entry.file}:${entry.line}`));
    const unflagged = textManuscripts
      .filter((file) => !builtFromSources(file))
      .flatMap((file) => audits.get(file)!.statistics.filter((s) => s.findings.length === 0 && !flaggedLines.has(`${file}:${s.location.line}`)));
    // The three results of the mislabelled-eta-squared paragraph are counted as planted, not correct.
    expect(unflagged.length).toBe(key.correctResults);
  });

  const multiFormat = textManuscripts.filter(builtFromSources);
  it('has manuscripts in every format', () => {
    expect(multiFormat.length).toBeGreaterThanOrEqual(4);
    expect(textManuscripts.length - multiFormat.length).toBeGreaterThanOrEqual(8);
  });

  it.each(multiFormat.flatMap((file) => otherFormats.map((format) => [file, basename(file, '.txt') + format])))(
    '%s and %s give the same findings',
    (textFile, otherFile) => {
      const text = audits.get(textFile)!;
      const other = audits.get(otherFile);
      expect(other?.status, `${otherFile} missing or unreadable: ${other?.error}`).toBe('checked');
      expect(other!.statistics.flatMap(placeless).sort()).toEqual(text.statistics.flatMap(placeless).sort());
      expect(other!.statistics.length).toBe(text.statistics.length);
    },
  );

  it('PDF findings carry page numbers', () => {
    const pdfFindings = [...audits.entries()]
      .filter(([file]) => file.endsWith('.pdf'))
      .flatMap(([, audit]) => audit.statistics.filter((s) => s.findings.length > 0));
    expect(pdfFindings.length).toBeGreaterThan(0);
    expect(pdfFindings.every((s) => s.location.page !== null && s.location.page >= 1)).toBe(true);
  });
});
