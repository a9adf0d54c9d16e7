/**
 * Scores the whole audit (reader + scanner + checks) on the labelled excerpts of
 * tests/corpus/labelled/ written as PDF, DOCX, HTML and JATS by
 * tests/corpus/formats/build.mjs (see tests/corpus/formats/README.md).
 *
 * Lines differ between formats, so a found result matches a label of its
 * excerpt by kind, value (within 1e-9) and df only, as a multiset: each label
 * is used once. Among labels with the same key, one whose p and effect sizes
 * also agree is taken first.
 */
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { auditFile } from '../../src/batch/auditFile.js';
import { resolveConfig } from '../../src/checks/config.js';
import { findPdftotext, type PdfEngine } from '../../src/documents/pdf.js';
import type { DocumentOutput, StatisticOutput } from '../../src/report/model.js';
import { loadLabelledCorpus, type Excerpt, type LabelledResult } from './labels.js';

const HERE = dirname(fileURLToPath(import.meta.url));
const FORMATS = join(HERE, 'formats');

const excerpts: Excerpt[] = loadLabelledCorpus();

interface FormatCase {
  id: string;
  directory: string;
  extension: string;
  pdfEngine?: PdfEngine;
  minRecall: number;
}

const CASES: FormatCase[] = [
  { id: 'pdf (pdf-parse)', directory: 'pdf', extension: '.pdf', pdfEngine: 'pdf-parse', minRecall: 0.98 },
  { id: 'pdf (pdftotext)', directory: 'pdf', extension: '.pdf', pdfEngine: 'pdftotext', minRecall: 0.98 },
  { id: 'docx', directory: 'docx', extension: '.docx', minRecall: 0.99 },
  { id: 'html', directory: 'html', extension: '.html', minRecall: 0.99 },
  { id: 'jats', directory: 'jats', extension: '.xml', minRecall: 0.99 },
];
const MIN_PRECISION = 0.99;
const MIN_FIELD_ACCURACY = 0.98;

const close = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-9;

function sameKey(found: StatisticOutput, label: LabelledResult): boolean {
  return (
    found.kind === label.kind &&
    found.value !== null &&
    close(found.value, label.value) &&
    found.df.length === label.df.length &&
    found.df.every((d, i) => close(d, label.df[i]!))
  );
}

function pCorrect(found: StatisticOutput, label: LabelledResult): boolean {
  if (found.notSignificant !== label.notSignificant) return false;
  if (label.p === null) return found.p === null;
  if (found.p === null) return false;
  return found.p.comparator === label.p.comparator && close(found.p.value, label.p.value);
}

function effectsCorrect(found: StatisticOutput, label: LabelledResult): boolean {
  if (found.effects.length !== label.effects.length) return false;
  const left = [...found.effects];
  for (const want of label.effects) {
    const i = left.findIndex((e) => e.kind === want.kind && close(e.value, want.value));
    if (i < 0) return false;
    left.splice(i, 1);
  }
  return true;
}

function describeLabel(l: LabelledResult): string {
  const df = l.df.length ? `(${l.df.join(', ')})` : '';
  const p = l.notSignificant ? 'n.s.' : l.p ? `p ${l.p.comparator} ${l.p.value}` : 'no p';
  const effects = l.effects.map((e) => `${e.kind} ${e.value}`).join(', ');
  return `${l.kind}${df} ${l.valueComparator} ${l.value}, ${p}${effects ? `, ${effects}` : ''}`;
}

const clip = (text: string): string => (text.length > 160 ? `${text.slice(0, 157)}...` : text);

function describeFound(s: StatisticOutput): string {
  const p = s.notSignificant ? 'n.s.' : s.p ? `p ${s.p.comparator} ${s.p.value}` : 'no p';
  const effects = s.effects.map((e) => `${e.kind} ${e.value}`).join(', ');
  return `"${s.text.replace(/\s+/g, ' ')}" (line ${s.location.line}; read as ${p}${effects ? `, ${effects}` : ''})`;
}

interface FormatScore {
  labelled: number;
  found: number;
  hits: number;
  fieldErrors: string[];
  misses: string[];
  falseAlarms: string[];
  unreadable: string[];
  wronglyFailed: string[];
  perFile: string[];
}

function scoreDocument(where: string, excerpt: Excerpt, doc: DocumentOutput, score: FormatScore): void {
  const used = new Set<number>();
  let hits = 0;
  let misses = 0;
  let falseAlarms = 0;
  for (const found of doc.statistics) {
    const candidates = excerpt.labels.results.map((l, i) => i).filter((i) => !used.has(i) && sameKey(found, excerpt.labels.results[i]!));
    const exact = candidates.find((i) => pCorrect(found, excerpt.labels.results[i]!) && effectsCorrect(found, excerpt.labels.results[i]!));
    const idx = exact ?? candidates[0];
    if (idx === undefined) {
      falseAlarms++;
      score.falseAlarms.push(`${where}: ${describeFound(found)}`);
      continue;
    }
    used.add(idx);
    hits++;
    const label = excerpt.labels.results[idx]!;
    if (exact === undefined) {
      score.fieldErrors.push(`${where}: ${describeFound(found)}, labelled ${describeLabel(label)} (labelled line ${label.line})`);
    }
    const fails = found.findings.filter((f) => f.severity === 'fail');
    if (label.consistent && fails.length > 0) {
      score.wronglyFailed.push(`${where}: ${describeFound(found)}: ${fails.map((f) => f.message).join(' | ')}`);
    }
  }
  excerpt.labels.results.forEach((l, i) => {
    if (used.has(i)) return;
    misses++;
    score.misses.push(`${where}: ${describeLabel(l)} | labelled line ${l.line}: ${clip(excerpt.lines[l.line - 1]?.trim() ?? '')}`);
  });
  score.labelled += excerpt.labels.results.length;
  score.found += doc.statistics.length;
  score.hits += hits;
  score.perFile.push(
    `${excerpt.name.padEnd(28)} labelled ${String(excerpt.labels.results.length).padStart(3)}, found ${String(doc.statistics.length).padStart(3)},` +
      ` hits ${String(hits).padStart(3)}, misses ${misses}, false alarms ${falseAlarms}`,
  );
}

async function scoreFormat(c: FormatCase): Promise<FormatScore> {
  const config = resolveConfig({});
  const score: FormatScore = { labelled: 0, found: 0, hits: 0, fieldErrors: [], misses: [], falseAlarms: [], unreadable: [], wronglyFailed: [], perFile: [] };
  const docs = await Promise.all(
    excerpts.map(async (excerpt) => {
      const path = join(FORMATS, c.directory, `${excerpt.name}${c.extension}`);
      return { excerpt, path, doc: await auditFile(path, config, c.pdfEngine ? { pdfEngine: c.pdfEngine } : {}) };
    }),
  );
  for (const { excerpt, path, doc } of docs) {
    const where = `${c.id} ${c.directory}/${excerpt.name}${c.extension}`;
    if (doc.status !== 'checked') {
      // An unreadable file loses all its results: counted as misses, and named.
      score.unreadable.push(`${where}: ${doc.error ?? 'unreadable'} (${path})`);
    }
    scoreDocument(where, excerpt, doc, score);
  }
  return score;
}

const round = (x: number): number => Number(x.toFixed(4));

const envSet = (value: string | undefined): boolean => value !== undefined && value !== '' && value !== '0' && value.toLowerCase() !== 'false';

/** In CI (or when asked) a missing pdftotext fails the test instead of skipping it. */
function pdftotextRequired(): boolean {
  return envSet(process.env.CI) || envSet(process.env.PLUMBLINE_REQUIRE_PDFTOTEXT);
}

describe('labelled corpus in other formats: recall, precision, field accuracy and verdicts', () => {
  it('has every format of every excerpt', () => {
    const missing: string[] = [];
    for (const c of CASES) {
      const present = new Set(readdirSync(join(FORMATS, c.directory)));
      for (const ex of excerpts) if (!present.has(`${ex.name}${c.extension}`)) missing.push(`${c.directory}/${ex.name}${c.extension}`);
    }
    expect(missing).toEqual([]);
  });

  for (const c of CASES) {
    it(`${c.id}: recall >= ${c.minRecall}, precision >= ${MIN_PRECISION}, no fail on a consistent result`, async (ctx) => {
      if (c.pdfEngine === 'pdftotext' && findPdftotext() === null) {
        const reason = 'pdftotext (poppler-utils) is not installed';
        if (pdftotextRequired()) throw new Error(`${reason}, and CI or PLUMBLINE_REQUIRE_PDFTOTEXT requires it`);
        console.warn(`SKIPPED ${c.id}: ${reason}; install poppler-utils to run it`);
        ctx.skip();
        return;
      }
      const s = await scoreFormat(c);
      const recall = s.labelled ? s.hits / s.labelled : 0;
      const precision = s.found ? s.hits / s.found : 0;
      const fieldAccuracy = s.hits ? (s.hits - s.fieldErrors.length) / s.hits : 0;
      const summary = {
        format: c.id,
        labelled: s.labelled,
        found: s.found,
        hits: s.hits,
        recall: round(recall),
        precision: round(precision),
        fieldAccuracy: round(fieldAccuracy),
        unreadable: s.unreadable,
        misses: s.misses,
        falseAlarms: s.falseAlarms,
        fieldErrors: s.fieldErrors,
        wronglyFailed: s.wronglyFailed,
      };
      console.log(
        `${c.id}: labelled ${s.labelled}, found ${s.found}, hits ${s.hits}; recall ${summary.recall},` +
          ` precision ${summary.precision}, field accuracy ${summary.fieldAccuracy};` +
          ` misses ${s.misses.length}, false alarms ${s.falseAlarms.length}, field errors ${s.fieldErrors.length},` +
          ` fails on consistent results ${s.wronglyFailed.length}\n  ${s.perFile.join('\n  ')}` +
          (s.fieldErrors.length ? `\n  field errors:\n    ${s.fieldErrors.join('\n    ')}` : ''),
      );
      const passes =
        s.unreadable.length === 0 &&
        recall >= c.minRecall &&
        precision >= MIN_PRECISION &&
        fieldAccuracy >= MIN_FIELD_ACCURACY &&
        s.wronglyFailed.length === 0;
      // On failure the whole summary is printed: every miss, false alarm, misread field and wrong fail.
      expect(passes ? 'pass' : summary).toEqual('pass');
    });
  }
});
