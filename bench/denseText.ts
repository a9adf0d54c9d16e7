/**
 * Invented result-dense manuscript text for the benchmarks: every sentence
 * reports a test, and an ANOVA table with an error row follows every tenth
 * paragraph. No study, data or result in it is real. Most results are
 * consistent (p recomputed with plumbline's statistics core, rounded as
 * printed); about one in ten carries a slip.
 */
import { chiSquareUpperTail, fUpperTail, rTwoTailed, tTwoTailed } from '../src/stats/index.js';
import { seededRandom } from './seededRandom.js';

/** Share of results printed with a slip (a p from another test). */
const SLIP_SHARE = 0.1;

/** p as a manuscript prints it: "< .001", or three decimals without the leading zero. */
function printedP(p: number): string {
  if (p < 0.001) return '< .001';
  return `= ${p.toFixed(3).replace(/^0/, '')}`;
}

function between(random: () => number, low: number, high: number): number {
  return low + random() * (high - low);
}

/** The p printed for a result: its own, or (a slip) another one. */
function reportedP(p: number, random: () => number): string {
  return printedP(random() < SLIP_SHARE ? between(random, 0.001, 0.9) : p);
}

/** One sentence with one result, in the styles a results section mixes. */
export function sentence(index: number, random: () => number): string {
  const df2 = 40 + Math.floor(random() * 160);
  switch (index % 6) {
    case 0: {
      // F tests of one design share their error df: eta-squared-labelled-partial looks for them.
      const f = Number(between(random, 1, 12).toFixed(2));
      const eta = (f * 2) / (f * 2 + 120);
      return `The effect of block ${index} on accuracy was reliable, F(2, 120) = ${f.toFixed(2)}, p ${reportedP(fUpperTail(f, 2, 120), random)}, η2 = ${eta.toFixed(2).replace(/^0/, '')}.`;
    }
    case 1: {
      const n = 20 + Math.floor(random() * 30);
      const t = Number(between(random, 0.5, 4).toFixed(2));
      const m1 = between(random, 3, 5);
      return `Ratings were higher after the cue (M = ${(m1 + 0.6).toFixed(2)}, SD = ${between(random, 0.8, 1.4).toFixed(2)}, n = ${n}) than without it (M = ${m1.toFixed(2)}, SD = ${between(random, 0.8, 1.4).toFixed(2)}, n = ${n}), t(${2 * n - 2}) = ${t.toFixed(2)}, p ${reportedP(tTwoTailed(t, 2 * n - 2), random)}.`;
    }
    case 2: {
      const chi = Number(between(random, 0.5, 14).toFixed(2));
      return `Choices differed between the sites, χ²(1, N = ${df2 + 2}) = ${chi.toFixed(2)}, p ${reportedP(chiSquareUpperTail(chi, 1), random)}.`;
    }
    case 3: {
      const r = Number(between(random, 0.05, 0.6).toFixed(2));
      return `Reading time correlated with recall, r(${df2}) = ${r.toFixed(2).replace(/^0/, '')}, p ${reportedP(rTwoTailed(r, df2), random)}.`;
    }
    case 4: {
      const f = Number(between(random, 1, 12).toFixed(2));
      const partial = (f * 1) / (f * 1 + df2);
      return `The interaction was examined, F(1, ${df2}) = ${f.toFixed(2)}, p ${reportedP(fUpperTail(f, 1, df2), random)}, ηp2 = ${partial.toFixed(2).replace(/^0/, '')}.`;
    }
    default: {
      const t = Number(between(random, 0.5, 4).toFixed(2));
      return `Accuracy exceeded chance in condition ${index}, t(${df2}) = ${t.toFixed(2)}, p ${reportedP(tTwoTailed(t, df2), random)}.`;
    }
  }
}

/** An ANOVA table of two effects and their error row: two results, with MS = SS / df and F = MS / MS error. */
export function anovaTable(number: number, random: () => number): string {
  const errorDf = 60 + Math.floor(random() * 100);
  const msError = Number(between(random, 0.5, 3).toFixed(2));
  const rows = ['Condition', 'Order'].map((label) => {
    const ms = Number((msError * between(random, 0.5, 8)).toFixed(2));
    const f = ms / msError;
    return `| ${label} | ${ms.toFixed(2)} | 1 | ${ms.toFixed(2)} | ${f.toFixed(2)} | ${printedP(fUpperTail(Number(f.toFixed(2)), 1, errorDf)).replace('= ', '')} |`;
  });
  return [
    `Table ${number}. Analysis of variance of response times (invented for a benchmark)`,
    '',
    '| Source | SS | df | MS | F | p |',
    '| --- | --- | --- | --- | --- | --- |',
    ...rows,
    `| Error | ${(msError * errorDf).toFixed(2)} | ${errorDf} | ${msError.toFixed(2)} | | |`,
  ].join('\n');
}

/** About `results` results of invented, result-dense text: paragraphs of five sentences, a table after every tenth paragraph. */
export function denseDocument(results: number, seed = 16): string {
  const random = seededRandom(seed);
  const parts = ['Invented text, generated for a benchmark: no study, data or result in it is real.\n\nA total of N = 240 participants took part.\n'];
  let written = 0;
  let paragraph = 0;
  while (written < results) {
    const sentences: string[] = [];
    for (let i = 0; i < 5 && written < results; i++) sentences.push(sentence(written++, random));
    parts.push(sentences.join(' '));
    paragraph += 1;
    if (paragraph % 10 === 0 && written + 2 <= results) {
      parts.push(anovaTable(paragraph / 10, random));
      written += 2;
    }
  }
  return parts.join('\n\n') + '\n';
}

/** Prose between the results of a paragraph, as a results chapter has around its tests. */
const FILLER =
  'Responses were screened before the analyses, and the assumptions of each test were checked against the residuals. ' +
  'The comparisons below follow the order of the preregistered hypotheses, and the exploratory analyses are marked as such in the text. ' +
  'Participants who failed the attention checks were excluded from every analysis reported in this section.';

/**
 * The same text in ASCII, for PDFs written with the standard fonts (which
 * have no Greek): "eta squared", "partial eta squared" and "chi2" for the
 * symbols, with three sentences of prose after each paragraph of results
 * (about 170 characters per result, as a thesis's results chapter).
 */
export function asciiDenseDocument(results: number, seed = 16): string {
  const ascii = denseDocument(results, seed).replaceAll('ηp2', 'partial eta squared').replaceAll('η2', 'eta squared').replaceAll('χ²', 'chi2');
  return ascii
    .split('\n\n')
    .map((part) => (part.startsWith('Table ') || part.startsWith('|') ? part : `${part} ${FILLER}`))
    .join('\n\n');
}

/** Most characters on a line of a page, in the PDFs the benchmarks write and in the text as a PDF gives it back. */
export const LINE_WIDTH = 95;

/** A paragraph broken between words into lines of at most LINE_WIDTH characters, as a typesetter does (a longer word stands alone). */
export function wrapWords(line: string, width = LINE_WIDTH): string[] {
  const pieces: string[] = [];
  let current = '';
  for (const word of line.split(' ')) {
    if (current !== '' && current.length + 1 + word.length > width) {
      pieces.push(current);
      current = word;
    } else current = current === '' ? word : `${current} ${word}`;
  }
  pieces.push(current);
  return pieces;
}

/** The dense text with its paragraphs wrapped into lines, as text taken from a PDF comes (pdftotext -raw). */
export function wrappedDenseDocument(results: number, seed = 16): string {
  return denseDocument(results, seed)
    .split('\n')
    .flatMap((line) => wrapWords(line))
    .join('\n');
}
