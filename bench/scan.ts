/**
 * Scanner throughput.
 *
 *   npx tsc -p tsconfig.json && node dist/bench/scan.js [megabytes]
 *
 * Generates manuscript-like prose with reported results (some typeset with
 * Unicode minus signs, non-breaking spaces and Greek letters), then prints
 * MB/s for scanText and for a baseline pass of one trivial regular
 * expression over the same text, and their ratio. It then times hostile
 * single-line inputs (brackets, digits and commas; runs of statistic
 * symbols) against the same amount of prose: a ratio near 1 means the
 * scanner stays linear on them.
 */

import { scanText } from '../src/scan/scan.js';
import { seededRandom } from './seededRandom.js';
import { bestTime } from './bestTime.js';

const DEFAULT_MEGABYTES = 10;
const REPETITIONS = 5;

const WORDS = (
  'the participants were asked to rate each item on a scale and responses were averaged across trials ' +
  'we expected that the manipulation would increase accuracy relative to the control condition in both groups ' +
  'analyses were conducted on the remaining sample after exclusions for inattentive responding and missing data ' +
  'this pattern suggests that attention to the cue was modulated by the instructions given before the task'
).split(' ');

function pick<T>(items: readonly T[], random: () => number): T {
  return items[Math.floor(random() * items.length)]!;
}

function fixed(random: () => number, scale: number, decimals: number): string {
  return (random() * scale).toFixed(decimals);
}

/** One reported result, in one of several typographic styles. */
function reportedResult(random: () => number): string {
  const df2 = 20 + Math.floor(random() * 200);
  const p = fixed(random, 0.9, 3).replace(/^0/, '');
  const styles = [
    () => `F(2, ${df2}) = ${fixed(random, 9, 2)}, p = ${p}, ηp2 = .${Math.floor(random() * 90 + 10)}`,
    () => `t(${df2}) = \u2212${fixed(random, 4, 2)}, p\u00a0<\u00a0.05, d = 0.${Math.floor(random() * 90 + 10)}`,
    () => `χ²(1, N = ${df2}) = ${fixed(random, 12, 2)}, p = ${p}`,
    () => `r(${df2}) = .${Math.floor(random() * 90 + 10)}, p = ${p}`,
    () => `F(1, ${df2}) = ${fixed(random, 9, 2)}, p = ${p}, partial η² = .0${Math.floor(random() * 9 + 1)}, 90% CI [.01, .12]`,
    () => `z = ${fixed(random, 3, 2)}, p = ${p}`,
  ];
  return pick(styles, random)();
}

/**
 * Share of sentences that carry a result. At 0.12 there is about one result
 * per thousand characters, a little denser than a typical empirical article
 * (some 40-80 tests in 50-60 thousand characters).
 */
const RESULT_SHARE = 0.12;

/** About `megabytes` MB of prose with a result in about one sentence in eight. */
function generateProse(megabytes: number, seed = 42): string {
  const random = seededRandom(seed);
  const target = megabytes * 1024 * 1024;
  const sentences: string[] = [];
  let length = 0;
  while (length < target) {
    const words: string[] = [];
    const count = 12 + Math.floor(random() * 14);
    for (let index = 0; index < count; index++) words.push(pick(WORDS, random));
    let sentence = words.join(' ');
    sentence = sentence.charAt(0).toUpperCase() + sentence.slice(1);
    if (random() < RESULT_SHARE) sentence += ` (${reportedResult(random)})`;
    sentence += random() < 0.1 ? '.\n\n' : '. ';
    sentences.push(sentence);
    length += sentence.length;
  }
  return sentences.join('').slice(0, target);
}

/** A single line of `megabytes` MB made by repeating `unit`. */
function repeatedLine(unit: string, megabytes: number): string {
  return unit.repeat(Math.ceil((megabytes * 1024 * 1024) / unit.length)).slice(0, megabytes * 1024 * 1024);
}


function countBaseline(text: string): number {
  const pattern = /F\(/g;
  let count = 0;
  while (pattern.exec(text) !== null) count++;
  return count;
}

function megabytesPerSecond(text: string, milliseconds: number): number {
  return text.length / (1024 * 1024) / (milliseconds / 1000);
}

function main(): void {
  const megabytes = Number(process.argv[2] ?? DEFAULT_MEGABYTES);
  const prose = generateProse(megabytes);
  const found = scanText(prose).results.length;

  const scanMs = bestTime(() => scanText(prose), REPETITIONS);
  const baselineMs = bestTime(() => countBaseline(prose), REPETITIONS);
  const scanRate = megabytesPerSecond(prose, scanMs);
  const baselineRate = megabytesPerSecond(prose, baselineMs);
  console.log(`prose: ${megabytes} MB, ${found} results found (one per ${Math.round(prose.length / found)} characters)`);
  console.log(`  scanText          ${scanRate.toFixed(1).padStart(8)} MB/s  (${scanMs.toFixed(1)} ms)`);
  console.log(`  baseline /F\\(/g   ${baselineRate.toFixed(1).padStart(8)} MB/s  (${baselineMs.toFixed(1)} ms)`);
  console.log(`  baseline / scanText time ratio: ${(scanMs / baselineMs).toFixed(2)}x`);

  const hostile: Array<[string, string]> = [
    ['brackets, digits, commas', 'F(((1,2,3,(,('],
    ['digits only', '1234567890'],
    ['statistic symbols', 't(1, F(2, r = z = '],
    ['unclosed df', 'F(1, 44 '],
    ['p-values without statistic', 'p = .05, p < .01; '],
    ['spaces after symbol', 'F                  '],
    ['effect names', 'partial eta d = '],
    ['Unicode dashes and spaces', 'F(\u2212\u2009\u00a0\u2013'],
  ];
  console.log(`hostile single lines of ${megabytes} MB (time relative to the same amount of prose):`);
  for (const [label, unit] of hostile) {
    const line = repeatedLine(unit, megabytes);
    const lineMs = bestTime(() => scanText(line), REPETITIONS);
    console.log(
      `  ${label.padEnd(28)} ${megabytesPerSecond(line, lineMs).toFixed(1).padStart(8)} MB/s  ratio to prose ${(lineMs / scanMs).toFixed(2)}x`,
    );
  }
}

main();
