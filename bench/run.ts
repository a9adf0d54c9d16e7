/**
 * Runs every benchmark, each in its own Node process so one cannot warm up or
 * slow down another:
 *
 *   npm run bench            # all
 *   npm run bench -- scan    # only those whose name contains "scan"
 *
 * Each benchmark prints its measurements beside a baseline measured in the
 * same process, as a ratio.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const benchmarks = ['scan', 'dense', 'profile', 'workers', 'stats', 'documents', 'corpus', 'refit', 'stream', 'hostile', 'inputs', 'reports', 'web'];
const wanted = process.argv.slice(2);

let failures = 0;
for (const name of benchmarks) {
  if (wanted.length > 0 && !wanted.some((w) => name.includes(w))) continue;
  const file = join(here, `${name}.js`);
  if (!existsSync(file)) {
    console.log(`\n== ${name}: not built (${file} missing)`);
    failures += 1;
    continue;
  }
  console.log(`\n== ${name}`);
  const result = spawnSync(process.execPath, ['--expose-gc', file], { stdio: 'inherit' });
  if (result.status !== 0) {
    console.log(`== ${name} exited with ${result.status}`);
    failures += 1;
  }
}
process.exitCode = failures > 0 ? 1 : 0;
