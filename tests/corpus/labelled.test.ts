/**
 * Scores the scanner against the hand-labelled corpus in tests/corpus/labelled/
 * (see tests/corpus/README.md for how the excerpts and labels are made).
 */
import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import { auditText } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import type { ReportedResult, ScanOutput } from '../../src/scan/types.js';
import { loadLabelledCorpus, type Excerpt, type Kind, type LabelledResult } from './labels.js';

const corpus = loadLabelledCorpus();

function lineOf(text: string, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < text.length; i++) if (text[i] === '\n') line++;
  return line;
}

const close = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-9;

function dfEqual(found: ReportedResult, label: LabelledResult): boolean {
  if (found.df.length !== label.df.length) return false;
  return found.df.every((d, i) => close(d.value, label.df[i]!));
}

function matches(found: ReportedResult, foundLine: number, label: LabelledResult): boolean {
  return (
    foundLine === label.line &&
    found.kind === label.kind &&
    found.value !== null &&
    close(found.value.value, label.value) &&
    dfEqual(found, label)
  );
}

function pCorrect(found: ReportedResult, label: LabelledResult): boolean {
  if (found.notSignificant !== label.notSignificant) return false;
  if (label.p === null) return found.p === null;
  if (found.p === null) return false;
  return found.p.comparator === label.p.comparator && close(found.p.value.value, label.p.value);
}

function effectsCorrect(found: ReportedResult, label: LabelledResult): boolean {
  if (found.effects.length !== label.effects.length) return false;
  const left = [...found.effects];
  for (const want of label.effects) {
    const i = left.findIndex((e) => e.kind === want.kind && close(e.value.value, want.value));
    if (i < 0) return false;
    left.splice(i, 1);
  }
  return true;
}

interface Problem {
  file: string;
  line: number;
  text: string;
}

interface FieldProblem extends Problem {
  expected: Pick<LabelledResult, 'p' | 'notSignificant' | 'effects'>;
  found: {
    p: { comparator: string; value: number } | null;
    notSignificant: boolean;
    effects: { kind: string; value: number }[];
  };
}

interface FileScore {
  file: string;
  labelled: number;
  found: number;
  truePositives: number;
  misses: Problem[];
  falseAlarms: Problem[];
  fieldErrors: FieldProblem[];
}

function describeLabel(l: LabelledResult): string {
  const df = l.df.length ? `(${l.df.join(', ')})` : '';
  return `${l.kind}${df} ${l.valueComparator} ${l.value}`;
}

async function scoreExcerpt(ex: Excerpt): Promise<FileScore> {
  const out: ScanOutput = await scanText(ex.text);
  const used = new Set<number>();
  const score: FileScore = {
    file: ex.file,
    labelled: ex.labels.results.length,
    found: out.results.length,
    truePositives: 0,
    misses: [],
    falseAlarms: [],
    fieldErrors: [],
  };
  for (const found of out.results) {
    const line = lineOf(ex.text, found.start);
    const idx = ex.labels.results.findIndex((l, i) => !used.has(i) && matches(found, line, l));
    if (idx < 0) {
      score.falseAlarms.push({ file: ex.file, line, text: found.text });
      continue;
    }
    used.add(idx);
    score.truePositives++;
    const label = ex.labels.results[idx]!;
    if (!pCorrect(found, label) || !effectsCorrect(found, label)) {
      score.fieldErrors.push({
        file: ex.file,
        line,
        text: found.text,
        expected: { p: label.p, notSignificant: label.notSignificant, effects: label.effects },
        found: {
          p: found.p ? { comparator: found.p.comparator, value: found.p.value.value } : null,
          notSignificant: found.notSignificant,
          effects: found.effects.map((e) => ({ kind: e.kind, value: e.value.value })),
        },
      });
    }
  }
  ex.labels.results.forEach((l, i) => {
    if (used.has(i)) return;
    score.misses.push({
      file: ex.file,
      line: l.line,
      text: `${describeLabel(l)} | ${ex.lines[l.line - 1]?.trim() ?? ''}`,
    });
  });
  return score;
}

const SYMBOLS: Record<Kind, RegExp> = {
  F: /F/,
  t: /t/,
  chi2: /χ|X2|chi|H\(/i, // H: Kruskal-Wallis, tested as chi-square
  r: /r/,
  z: /z/i,
};

describe('labelled corpus: the labels themselves', () => {
  it('holds at least 20 excerpts, 320 results and 80 look-alikes', () => {
    const results = corpus.reduce((n, ex) => n + ex.labels.results.length, 0);
    const lookalikes = corpus.reduce((n, ex) => n + ex.labels.lookalikes.length, 0);
    expect(corpus.length).toBeGreaterThanOrEqual(20);
    expect(results).toBeGreaterThanOrEqual(320);
    expect(lookalikes).toBeGreaterThanOrEqual(80);
  });

  it('puts every label on an existing line that holds its symbol or text', () => {
    const bad: string[] = [];
    for (const ex of corpus) {
      for (const r of ex.labels.results) {
        const line = ex.lines[r.line - 1];
        if (line === undefined || !SYMBOLS[r.kind].test(line)) {
          bad.push(`${ex.file}:${r.line} ${describeLabel(r)}`);
        }
      }
      for (const l of ex.labels.lookalikes) {
        const line = ex.lines[l.line - 1];
        if (line === undefined || !line.includes(l.text)) bad.push(`${ex.file}:${l.line} "${l.text}"`);
      }
    }
    expect(bad).toEqual([]);
  });
});

describe('labelled corpus: scanner recall, precision and field accuracy', () => {
  it('finds the labelled results and nothing else, and reads p and effect sizes', async () => {
    const scores = await Promise.all(corpus.map(scoreExcerpt));
    const labelled = scores.reduce((n, s) => n + s.labelled, 0);
    const tp = scores.reduce((n, s) => n + s.truePositives, 0);
    const found = scores.reduce((n, s) => n + s.found, 0);
    const fieldErrors = scores.flatMap((s) => s.fieldErrors);
    const recall = labelled ? tp / labelled : 0;
    const precision = found ? tp / found : 0;
    const fieldAccuracy = tp ? (tp - fieldErrors.length) / tp : 0;
    const summary = {
      recall: Number(recall.toFixed(4)),
      precision: Number(precision.toFixed(4)),
      fieldAccuracy: Number(fieldAccuracy.toFixed(4)),
      misses: scores.flatMap((s) => s.misses).map((m) => `${m.file}:${m.line} ${m.text}`),
      falseAlarms: scores.flatMap((s) => s.falseAlarms).map((m) => `${m.file}:${m.line} ${m.text}`),
      fieldErrors: fieldErrors.map(
        (f) =>
          `${f.file}:${f.line} ${f.text.replace(/\s+/g, ' ')} | expected ${JSON.stringify(f.expected)}` +
          ` | found ${JSON.stringify(f.found)}`,
      ),
    };
    const passes = recall >= 0.99 && precision >= 0.99 && fieldAccuracy >= 0.98;
    // On failure the whole summary is printed, with every miss, false alarm and misread field.
    expect(passes ? 'pass' : summary).toEqual('pass');
  });
});

describe('labelled corpus: verdicts', () => {
  const config = resolveConfig({});
  const verdicts = corpus.flatMap((ex) => {
    const audit = auditText(ex.text, config, ex.file);
    const used = new Set<number>();
    return audit.statistics.flatMap((statistic) => {
      const line = statistic.location.line;
      const idx = ex.labels.results.findIndex(
        (l, i) =>
          !used.has(i) &&
          l.line === line &&
          l.kind === statistic.kind &&
          statistic.value !== null &&
          close(statistic.value, l.value) &&
          l.df.length === statistic.df.length &&
          l.df.every((d, j) => close(d, statistic.df[j]!)),
      );
      if (idx < 0) return [];
      used.add(idx);
      const label = ex.labels.results[idx]!;
      return [{ where: `${ex.file}:${line} ${statistic.text.replace(/\s+/g, ' ')}`, label, findings: statistic.findings }];
    });
  });

  it('gives no fail to a correctly reported result (rounding edge cases included)', () => {
    const wronglyFailed = verdicts
      .filter((v) => v.label.consistent && v.findings.some((f) => f.severity === 'fail'))
      .map((v) => `${v.where}: ${v.findings.map((f) => f.message).join(' | ')}`);
    expect(wronglyFailed).toEqual([]);
  });

  it('flags at least 95% of the inconsistent results', () => {
    const inconsistent = verdicts.filter((v) => !v.label.consistent);
    const unflagged = inconsistent.filter((v) => v.findings.length === 0).map((v) => v.where);
    expect(inconsistent.length).toBeGreaterThan(30);
    expect({ flagged: inconsistent.length - unflagged.length, of: inconsistent.length, unflagged }).toEqual({
      flagged: expect.toSatisfy((n: number) => n >= 0.95 * inconsistent.length),
      of: inconsistent.length,
      unflagged: expect.any(Array),
    });
  });
});

describe('labelled corpus: per-file report (informational only)', () => {
  it('prints per-file counts', async () => {
    const rows: string[] = [];
    for (const ex of corpus) {
      const consistent = ex.labels.results.filter((r) => r.consistent).length;
      let scanned = '';
      try {
        const s = await scoreExcerpt(ex);
        scanned =
          ` found ${s.found}, hits ${s.truePositives}, misses ${s.misses.length},` +
          ` false alarms ${s.falseAlarms.length}, field errors ${s.fieldErrors.length}`;
      } catch (err) {
        scanned = ` scan failed: ${String(err)}`;
      }
      rows.push(
        `${ex.file.padEnd(36)} results ${String(ex.labels.results.length).padStart(3)}` +
          ` (consistent ${consistent}), look-alikes ${ex.labels.lookalikes.length};${scanned}`,
      );
    }
    console.log(rows.join('\n'));
    expect(rows.length).toBe(corpus.length);
  });
});
