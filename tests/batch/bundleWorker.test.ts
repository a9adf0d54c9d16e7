import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { bundleIsFresh, workerModuleOf } from '../../src/batch/run.js';

// The bundled worker (npm run build writes it, src/batch/bundleWorker.ts) must audit exactly as the plain
// compiled modules do: these tests bundle the built worker into a folder of their own at the depth of
// dist/src/bundled (so the rules catalogue is found as from there), outside dist/src (whose files make the
// cache's build fingerprint, which other tests running meanwhile must not see change), and audit the demo
// files through both.

const bundleRoot = resolve('dist', `bundled-test-${process.pid}`);
const bundleFolder = join(bundleRoot, 'bundled');

afterAll(() => rmSync(bundleRoot, { recursive: true, force: true }));

/** The entries the worker module's default export gives for `files`, one JSON line each, in a process of its own. */
function auditThrough(module: string, files: string[], pdfEngine: string): string {
  const script = `
    const loaded = await import(${JSON.stringify(module)});
    for (const path of ${JSON.stringify(files)}) {
      const entry = await loaded.default({ path, userConfig: {}, configSource: 'defaults', readOptions: { pdfEngine: ${JSON.stringify(pdfEngine)} } });
      process.stdout.write(JSON.stringify(entry) + '\\n');
    }`;
  const run = spawnSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8', timeout: 120_000, maxBuffer: 1 << 28 });
  if (run.status !== 0) throw new Error(run.stderr);
  return run.stdout;
}

describe('bundled worker', () => {
  it('audits the demo documents of every format exactly as the plain modules do', { timeout: 180_000 }, () => {
    const bundled = spawnSync(process.execPath, [join('dist', 'src', 'batch', 'bundleWorker.js'), bundleFolder], { encoding: 'utf8', timeout: 120_000 });
    expect(bundled.status, bundled.stderr).toBe(0);
    expect(bundled.stderr).toBe('');
    const files = [
      'lantern-reading-fluency.txt',
      'lichen-trail-signage.md',
      'lantern-reading-fluency.html',
      'lantern-reading-fluency.xml',
      'lantern-reading-fluency.docx',
      'gravel-path-wayfinding.pdf',
      'orchard-noise-vigilance.pdf',
    ].map((name) => resolve('corpus-demo', name));
    for (const engine of ['pdftotext', 'pdf-parse']) {
      const plain = auditThrough(pathToFileURL(resolve('dist', 'src', 'batch', 'worker.js')).href, files, engine);
      const fromBundle = auditThrough(pathToFileURL(join(bundleFolder, 'worker.js')).href, files, engine);
      expect(fromBundle).toBe(plain);
      // Something was audited: every file checked, with findings among them (the demo papers carry slips).
      const entries = plain.trim().split('\n').map((line) => JSON.parse(line) as { body: string });
      expect(entries).toHaveLength(files.length);
      expect(entries.every((entry) => entry.body.includes('"status":"checked"'))).toBe(true);
      expect(entries.some((entry) => entry.body.includes('"rule":"p-value-mismatch"'))).toBe(true);
    }
  });
});

describe('which worker module the batch loads', () => {
  it('takes the bundle only when it was written after the compiled worker', () => {
    expect(bundleIsFresh(2000, 1000)).toBe(true);
    expect(bundleIsFresh(1000, 1000)).toBe(true);
    expect(bundleIsFresh(999, 1000)).toBe(false);
  });

  it('finds the bundle beside batch/ and falls back to worker.js when it is stale or missing', () => {
    const root = mkdtempSync(join(tmpdir(), 'plumbline-worker-module-'));
    try {
      mkdirSync(join(root, 'batch'));
      const compiled = join(root, 'batch', 'worker.js');
      writeFileSync(compiled, 'export default () => null;\n');
      const runUrl = pathToFileURL(join(root, 'batch', 'run.js')).href;
      expect(workerModuleOf(runUrl)).toBe(pathToFileURL(compiled).href);
      mkdirSync(join(root, 'bundled'));
      const bundle = join(root, 'bundled', 'worker.js');
      writeFileSync(bundle, 'export default () => null;\n');
      utimesSync(compiled, new Date(1_000_000), new Date(1_000_000));
      utimesSync(bundle, new Date(2_000_000), new Date(2_000_000));
      expect(workerModuleOf(runUrl)).toBe(pathToFileURL(bundle).href);
      // tsc run again after the bundle was written: the compiled code is newer, the bundle stale.
      utimesSync(compiled, new Date(3_000_000), new Date(3_000_000));
      expect(workerModuleOf(runUrl)).toBe(pathToFileURL(compiled).href);
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
