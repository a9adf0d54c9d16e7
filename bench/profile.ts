/**
 * Where the time of a result-dense audit goes.
 *
 *   npx tsc -p tsconfig.json && node dist/bench/profile.js [results] [seconds] [audit|scan|check] [lines|wrapped]
 *
 * Audits the invented result-dense text of bench/denseText.ts (1,000 results
 * unless told otherwise) over and over for a few seconds under V8's sampling
 * profiler (node:inspector, the profiler `node --cpu-prof` writes), after a
 * warm-up (or only its scan, or only its checks; with `wrapped`, the text
 * with its paragraphs wrapped into lines as a PDF gives it), and prints the functions with the most self time, each with its
 * share of all samples. Goal (issue 16): no single function above 10%.
 * Garbage collection and the profiler's own idle samples are listed apart,
 * because no function of plumbline's can be made faster to cut them.
 * PLUMBLINE_PROFILE_INCLUSIVE=40 also lists the 40 functions with the most
 * time spent in them and in what they call.
 */
import { Session } from 'node:inspector/promises';
import { relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { auditText } from '../src/audit.js';
import { resolveConfig } from '../src/checks/config.js';
import { checkResults } from '../src/checks/engine.js';
import { plainTextDocument } from '../src/documents/text.js';
import { scanDocument } from '../src/scan/scanDocument.js';
import { denseDocument, wrappedDenseDocument } from './denseText.js';

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  hitCount?: number;
  children?: number[];
}

interface Profile {
  nodes: ProfileNode[];
  samples?: number[];
}

/** Samples outside any JavaScript function: V8's own bookkeeping, not code to speed up. */
const NOT_A_FUNCTION = new Set(['(garbage collector)', '(idle)', '(program)', '(root)']);

function place(url: string, lineNumber: number): string {
  if (url === '') return '';
  const path = url.startsWith('file:') ? relative(process.cwd(), fileURLToPath(url)) : url;
  return `${path}:${lineNumber + 1}`;
}

/** Self samples per function (name and place), largest first. */
function selfTimes(profile: Profile): { name: string; samples: number }[] {
  const byFunction = new Map<string, number>();
  for (const node of profile.nodes) {
    const hits = node.hitCount ?? 0;
    if (hits === 0) continue;
    const { functionName, url, lineNumber } = node.callFrame;
    const name = `${functionName || '(anonymous)'} ${place(url, lineNumber)}`.trim();
    byFunction.set(name, (byFunction.get(name) ?? 0) + hits);
  }
  return [...byFunction].map(([name, samples]) => ({ name, samples })).sort((a, b) => b.samples - a.samples);
}

/** Samples under each function (itself and what it calls, recursion counted once), largest first. */
function inclusiveTimes(profile: Profile): { name: string; samples: number }[] {
  const byId = new Map(profile.nodes.map((node) => [node.id, node]));
  const parentOf = new Map<number, number>();
  for (const node of profile.nodes) for (const child of node.children ?? []) parentOf.set(child, node.id);
  const totals = new Map<string, number>();
  for (const node of profile.nodes) {
    const hits = node.hitCount ?? 0;
    if (hits === 0) continue;
    const seen = new Set<string>();
    for (let id: number | undefined = node.id; id !== undefined; id = parentOf.get(id)) {
      const { functionName, url, lineNumber } = byId.get(id)!.callFrame;
      const name = `${functionName || '(anonymous)'} ${place(url, lineNumber)}`.trim();
      if (seen.has(name)) continue;
      seen.add(name);
      totals.set(name, (totals.get(name) ?? 0) + hits);
    }
  }
  return [...totals].map(([name, samples]) => ({ name, samples })).sort((a, b) => b.samples - a.samples);
}

async function main(): Promise<void> {
  const results = Number(process.argv[2] ?? 1000);
  const seconds = Number(process.argv[3] ?? 4);
  const part = process.argv[4] ?? 'audit';
  const config = resolveConfig({});
  const text = process.argv[5] === 'wrapped' ? wrappedDenseDocument(results) : denseDocument(results);
  const document = plainTextDocument('<dense>', 'text', text);
  const scan = scanDocument(document);
  const work = part === 'scan' ? () => scanDocument(document) : part === 'check' ? () => checkResults(text, scan, config) : () => auditText(text, config);
  for (let i = 0; i < 10; i++) work();

  const session = new Session();
  session.connect();
  await session.post('Profiler.enable');
  await session.post('Profiler.setSamplingInterval', { interval: 500 });
  await session.post('Profiler.start');
  let audits = 0;
  const until = Date.now() + seconds * 1000;
  while (Date.now() < until) {
    work();
    audits += 1;
  }
  const { profile } = (await session.post('Profiler.stop')) as { profile: Profile };
  session.disconnect();

  const times = selfTimes(profile);
  const total = times.reduce((sum, entry) => sum + entry.samples, 0);
  const inFunctions = times.filter((entry) => !NOT_A_FUNCTION.has(entry.name));
  const outside = times.filter((entry) => NOT_A_FUNCTION.has(entry.name));
  console.log(`${audits} runs (${part}) of ${results} results in ${seconds} s (${((seconds * 1000) / audits).toFixed(1)} ms each), ${total} samples`);
  console.log('self time by function, largest first:');
  for (const entry of inFunctions.slice(0, Number(process.env.PLUMBLINE_PROFILE_TOP ?? 15))) {
    console.log(`  ${((100 * entry.samples) / total).toFixed(1).padStart(5)}%  ${entry.name}`);
  }
  console.log(`  outside functions: ${outside.map((entry) => `${entry.name} ${((100 * entry.samples) / total).toFixed(1)}%`).join(', ')}`);
  if (process.env.PLUMBLINE_PROFILE_INCLUSIVE) {
    console.log('time under each function (itself and what it calls):');
    for (const entry of inclusiveTimes(profile).slice(0, Number(process.env.PLUMBLINE_PROFILE_INCLUSIVE))) {
      console.log(`  ${((100 * entry.samples) / total).toFixed(1).padStart(5)}%  ${entry.name}`);
    }
  }
  const largest = inFunctions[0];
  const share = largest === undefined ? 0 : (100 * largest.samples) / total;
  console.log(`largest single function ${share.toFixed(1).padStart(5)}%   goal <= 10%: ${share <= 10 ? 'meets goal' : 'MISSES goal'}`);
}

await main();
