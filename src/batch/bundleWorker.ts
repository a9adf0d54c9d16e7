/**
 * Writes the worker thread's code as a few bundled files (dist/src/bundled/),
 * run by `npm run build` after the TypeScript compiler:
 *
 *   node dist/src/batch/bundleWorker.js [output folder]
 *
 * Why: a worker that imports dist/src/batch/worker.js loads some 600
 * modules one by one (zod's, the @stdlib special functions' and plumbline's
 * own), about 0.2 to 0.4 s before it can take a document; the same code in
 * one file loads in a fraction of that (npm run bench -- workers). The
 * bundler is rolldown (a development dependency); the readers of PDF and
 * DOCX files stay separate chunks, loaded only when such a file comes, and
 * pdf-parse and mammoth are left to Node to load from node_modules.
 *
 * The folder sits at the same depth as dist/src/checks, so the rules
 * catalogue and package.json are found from it as from the modules it
 * bundles. run.ts takes the bundle only when it is newer than the compiled
 * worker.js (workerModuleOf): a later `tsc` alone leaves it stale, and the
 * plain modules are used.
 */
import { rmSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Packages loaded from node_modules as they are, not bundled: large, and needed only for PDF and DOCX files. */
const LEFT_TO_NODE = ['pdf-parse', 'mammoth'];

export async function bundleWorker(outputFolder: string): Promise<void> {
  const here = dirname(fileURLToPath(import.meta.url));
  const { build } = await import('rolldown');
  rmSync(outputFolder, { recursive: true, force: true });
  await build({
    input: { worker: join(here, 'worker.js') },
    platform: 'node',
    external: (id) => LEFT_TO_NODE.some((name) => id === name || id.startsWith(`${name}/`)),
    logLevel: 'warn',
    output: { dir: outputFolder, format: 'esm', entryFileNames: '[name].js', chunkFileNames: '[name]-[hash].js' },
  });
}

const isMain = process.argv[1] !== undefined && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  const here = dirname(fileURLToPath(import.meta.url));
  const output = process.argv[2] ?? join(here, '..', 'bundled');
  try {
    await bundleWorker(output);
    process.stdout.write(`wrote the bundled worker to ${output}\n`);
  } catch (error) {
    // Without the bundler (an install without development dependencies) the plain modules serve: slower to start, same audits.
    process.stderr.write(`the worker was not bundled (${error instanceof Error ? error.message : String(error)}); workers load dist/src/batch/worker.js\n`);
  }
}
