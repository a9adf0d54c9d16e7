/**
 * Refit benchmark: plumbline's whole fit against statsmodels' whole process
 * on the same 1,000,000-row CSV, in the same run.
 *
 * - Writes a seeded CSV (subject id, outcome, one covariate, a three-level
 *   and a two-level factor; about 48 MB) to a temporary folder.
 * - plumbline: a child process `node dist/src/refit/benchEntry.js` (start-up,
 *   streaming read, fit, type III table); its wall time from spawn to exit
 *   and its peak resident memory (resourceUsage().maxRSS) are measured.
 * - statsmodels: Debian's /usr/bin/python3 running read_csv, ols with
 *   C(., Sum) coding and anova_lm(typ=3), wall time from spawn to exit.
 *   OPENBLAS_CORETYPE and OPENBLAS_L2_SIZE are removed from its environment
 *   only (they slow a current numpy).
 * Prints the time ratio (goal <= 0.25) and peak memory / file size (goal <= 3),
 * and the largest relative difference between the two type III tables.
 *
 * Run: npm run build && node dist/bench/refit.js [rows]
 */
import { spawnSync } from 'node:child_process';
import { createWriteStream, existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const PYTHON = '/usr/bin/python3';

async function writeCsv(path: string, rows: number): Promise<void> {
  const out = createWriteStream(path);
  let seed = 12345;
  const rand = (): number => {
    // xorshift32
    seed ^= seed << 13;
    seed ^= seed >>> 17;
    seed ^= seed << 5;
    return (seed >>> 0) / 4294967296;
  };
  const normal = (): number => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const groups = ['control', 'low_dose', 'high_dose'];
  const sexes = ['female', 'male'];
  let buf = 'subject,outcome,baseline,treatment,sex\n';
  for (let i = 0; i < rows; i++) {
    const g = Math.floor(rand() * 3);
    const s = rand() < 0.45 ? 0 : 1;
    const baseline = 50 + 10 * normal();
    const y = 100 + 2 * g + 1.5 * s + (g === 2 && s === 1 ? 1 : 0) + 0.4 * baseline + 5 * normal();
    buf += `S${String(i).padStart(7, '0')},${y.toFixed(8)},${baseline.toFixed(6)},${groups[g]},${sexes[s]}\n`;
    if (buf.length > 1 << 20) {
      if (!out.write(buf)) await new Promise<void>((r) => out.once('drain', () => r()));
      buf = '';
    }
  }
  out.write(buf);
  await new Promise<void>((resolve, reject) => out.end((err?: Error | null) => (err ? reject(err) : resolve())));
}

const PY = `
import sys, time, json
import pandas as pd
import statsmodels
import statsmodels.api as sm
import statsmodels.formula.api as smf
d = pd.read_csv(sys.argv[1])
fit = smf.ols("outcome ~ C(treatment, Sum)*C(sex, Sum) + baseline", data=d).fit()
t = sm.stats.anova_lm(fit, typ=3)
names = {"C(treatment, Sum)": "treatment", "C(sex, Sum)": "sex", "C(treatment, Sum):C(sex, Sum)": "treatment:sex", "baseline": "baseline"}
print(json.dumps({"version": statsmodels.__version__, "terms": {names[k]: {"ss": float(t.loc[k, "sum_sq"]), "F": float(t.loc[k, "F"])} for k in names}}))
`;

function statsmodelsAvailable(): boolean {
  if (!existsSync(PYTHON)) return false;
  const r = spawnSync(PYTHON, ['-c', 'import statsmodels, pandas'], { stdio: 'ignore' });
  return r.status === 0;
}

async function main(): Promise<void> {
  const rows = Number(process.argv[2] ?? 1_000_000);
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-refit-bench-'));
  const csv = join(dir, 'data.csv');
  try {
    await writeCsv(csv, rows);
    const size = statSync(csv).size;
    console.log(`refit bench: ${rows} rows, ${(size / 1e6).toFixed(1)} MB CSV`);

    const entry = join(dirname(fileURLToPath(import.meta.url)), '..', 'src', 'refit', 'benchEntry.js');
    const spec = JSON.stringify({ model: 'outcome ~ treatment*sex + baseline', type: 3, coding: 'sum' });
    const t0 = performance.now();
    const ours = spawnSync(process.execPath, [entry, csv, spec], { encoding: 'utf8', maxBuffer: 1 << 24 });
    const oursMs = performance.now() - t0;
    if (ours.status !== 0) throw new Error(`plumbline failed: ${ours.stderr}`);
    const result = JSON.parse(ours.stdout) as {
      fitMs: number;
      maxRssBytes: number;
      table: { terms: Array<{ term: string; ss: number; F: number }> };
    };
    console.log(`plumbline (child process): ${oursMs.toFixed(0)} ms wall (fit ${result.fitMs.toFixed(0)} ms), peak RSS ${(result.maxRssBytes / 1e6).toFixed(1)} MB = ${(result.maxRssBytes / size).toFixed(2)} x file size (goal <= 3)`);

    if (!statsmodelsAvailable()) {
      console.log(`statsmodels: ${PYTHON} with statsmodels and pandas not found (apt-get install python3-statsmodels); time ratio skipped`);
      return;
    }
    const env = { ...process.env };
    delete env.OPENBLAS_CORETYPE;
    delete env.OPENBLAS_L2_SIZE;
    const t1 = performance.now();
    const theirs = spawnSync(PYTHON, ['-c', PY, csv], { encoding: 'utf8', env, maxBuffer: 1 << 24 });
    const theirsMs = performance.now() - t1;
    if (theirs.status !== 0) throw new Error(`statsmodels failed: ${theirs.stderr}`);
    const ref = JSON.parse(theirs.stdout) as { version: string; terms: Record<string, { ss: number; F: number }> };
    console.log(`statsmodels ${ref.version} (read_csv, ols, anova_lm typ=3): ${theirsMs.toFixed(0)} ms wall`);
    console.log(`time ratio plumbline / statsmodels: ${(oursMs / theirsMs).toFixed(3)} (goal <= 0.25)`);
    let worst = 0;
    for (const t of result.table.terms) {
      const r = ref.terms[t.term];
      if (!r) continue;
      worst = Math.max(worst, Math.abs(t.ss - r.ss) / Math.abs(r.ss), Math.abs(t.F - r.F) / Math.abs(r.F));
    }
    console.log(`largest relative difference of type III SS and F: ${worst.toExponential(2)}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : String(err));
  process.exitCode = 1;
});
