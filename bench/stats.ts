// Accuracy and speed report for src/stats against the committed reference fixtures, plus the same
// comparison for jstat (why it is not used). Not a test: it asserts nothing and prints a table.
// Run: npx tsc -p tsconfig.json --outDir /tmp/plumbline-bench && node /tmp/plumbline-bench/bench/stats.js
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import jStat from 'jstat';
import { fUpperTail } from '../src/stats/fDistribution.js';
import { tTwoTailed, tUpperTail } from '../src/stats/tDistribution.js';
import { chiSquareUpperTail } from '../src/stats/chiSquareDistribution.js';
import { zTwoTailed, zUpperTail } from '../src/stats/normalDistribution.js';
import { rTwoTailed } from '../src/stats/correlation.js';
import { noncentralFCdf, noncentralFUpperTail } from '../src/stats/noncentralF.js';
import { studentizedRangeCdf, studentizedRangeUpperTail } from '../src/stats/studentizedRange.js';
import { partialEtaSquaredInterval } from '../src/stats/partialEtaSquaredInterval.js';

type Point = Record<string, number | string>;
const fixtureRoot = join(process.cwd(), 'tests', 'fixtures', 'stats');
const load = (name: string): Point[] => (JSON.parse(readFileSync(join(fixtureRoot, name), 'utf8')) as { points: Point[] }).points;
const num = (value: number | string | undefined): number => (value === 'Infinity' ? Infinity : Number(value));

function report(family: string, points: Point[], compute: (point: Point) => number, reference: (point: Point) => number): void {
  let worst = 0;
  let worstLabel = '';
  const start = performance.now();
  for (const point of points) {
    const expected = reference(point);
    const error = expected === 0 ? Math.abs(compute(point)) : Math.abs(compute(point) - expected) / Math.abs(expected);
    if (!(error <= worst)) {
      worst = error;
      worstLabel = JSON.stringify(Object.fromEntries(Object.entries(point).filter(([key]) => !/scipy|^p|cdf|upper|low|high|lambdaL|lambdaH/i.test(key))));
    }
  }
  const milliseconds = (performance.now() - start) / points.length;
  console.log(`${family.padEnd(44)} n=${String(points.length).padStart(5)}  worst rel err ${worst.toExponential(2)}  ${milliseconds.toFixed(3)} ms/pt  at ${worstLabel}`);
}

const f = load('f_upper_tail.json');
report('fUpperTail vs mpmath', f, (p) => fUpperTail(num(p.f), num(p.df1), num(p.df2)), (p) => num(p.p));
report('SciPy 1.10.1 f.sf vs mpmath', f, (p) => num(p.scipy), (p) => num(p.p));
const jstatF = f.filter((p) => num(p.p) > 1e-12);
report('jstat centralF 1-cdf vs mpmath (p > 1e-12)', jstatF, (p) => 1 - jStat.centralF.cdf(num(p.f), num(p.df1), num(p.df2)), (p) => num(p.p));
const t = load('t_tails.json');
report('tTwoTailed vs mpmath', t, (p) => tTwoTailed(num(p.t), num(p.df)), (p) => num(p.pTwoTailed));
report('tUpperTail vs mpmath', t, (p) => tUpperTail(num(p.t), num(p.df)), (p) => num(p.pOneTailed));
report('rTwoTailed vs mpmath', load('r_two_tailed.json'), (p) => rTwoTailed(num(p.r), num(p.df)), (p) => num(p.p));
report('chiSquareUpperTail vs mpmath', load('chisquare_upper_tail.json'), (p) => chiSquareUpperTail(num(p.x), num(p.df)), (p) => num(p.p));
const z = load('normal_tails.json');
report('zUpperTail vs mpmath', z, (p) => zUpperTail(num(p.z)), (p) => num(p.pUpper));
report('zTwoTailed vs mpmath', z, (p) => zTwoTailed(num(p.z)), (p) => num(p.pTwoTailed));
const ncf = load('noncentral_f.json');
report('noncentralFCdf vs mpmath', ncf, (p) => noncentralFCdf(num(p.f), num(p.df1), num(p.df2), num(p.lambda)), (p) => num(p.cdf));
report('noncentralFUpperTail vs mpmath', ncf, (p) => noncentralFUpperTail(num(p.f), num(p.df1), num(p.df2), num(p.lambda)), (p) => num(p.upper));
const eta = load('partial_eta_squared_interval.json');
report('partialEtaSquaredInterval low vs SciPy inversion', eta, (p) => partialEtaSquaredInterval(num(p.f), num(p.df1), num(p.df2), num(p.level)).low, (p) => num(p.low));
report('partialEtaSquaredInterval high vs SciPy inversion', eta, (p) => partialEtaSquaredInterval(num(p.f), num(p.df1), num(p.df2), num(p.level)).high, (p) => num(p.high));
const range = load('studentized_range.json');
report('studentizedRangeCdf vs reference', range, (p) => studentizedRangeCdf(num(p.q), num(p.k), num(p.df)), (p) => num(p.cdf));
report('studentizedRangeUpperTail vs reference', range, (p) => studentizedRangeUpperTail(num(p.q), num(p.k), num(p.df)), (p) => num(p.upper));
report('SciPy 1.10.1 studentized_range.cdf vs reference', range, (p) => num(p.scipyCdf), (p) => num(p.cdf));
report('SciPy 1.10.1 studentized_range.sf vs reference', range, (p) => num(p.scipyUpper), (p) => num(p.upper));
const finiteRange = range.filter((p) => Number.isFinite(num(p.df)));
report('jstat tukey.cdf vs reference (finite df)', finiteRange, (p) => jStat.tukey.cdf(num(p.q), num(p.k), num(p.df)), (p) => num(p.cdf));
const centralRange = finiteRange.filter((p) => num(p.cdf) > 1e-3 && num(p.cdf) < 0.999);
report('jstat tukey.cdf vs reference (finite df, 1e-3 < cdf < 0.999)', centralRange, (p) => jStat.tukey.cdf(num(p.q), num(p.k), num(p.df)), (p) => num(p.cdf));
