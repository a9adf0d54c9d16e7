import { describe, expect, it } from 'vitest';
import { builtCliExists, plumbline, reportOf } from '../batch/cli.js';

/**
 * How large a p discrepancy is, in the built command: in the message and as
 * the finding's pDiscrepancy field in JSON (schema/report.schema.json).
 */

// F(2, 57) = 4.21 -> p = 0.0197, 0.0196 to 0.0198 over the rounding of F; t(40) = 2.50 -> p = 0.0166,
// 0.0164 to 0.0168; F(1, 30) = 6.20 -> p = 0.01854, 0.01850 to 0.01859 (scipy.stats.f.sf and 2 * t.sf, SciPy 1.10.1).
// So ".018" is one unit off, ".011" a factor of 1.5 (.0164 / .011) and ".001" a factor of 18.5 (.0185 / .001).
const TEXT =
  'Dose affected recall, F(2, 57) = 4.21, p = .018. Groups differed, t(40) = 2.50, p = .011. ' +
  'Sleep mattered, F(1, 30) = 6.20, p = .001. Age did not, F(2, 57) = 4.21, p = .020.';

describe('p discrepancy size in the built command', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  it('JSON: each p-value-mismatch finding has its size and factor; a result without a finding has none', () => {
    const run = plumbline(['check', TEXT, '--format', 'json'], process.cwd());
    expect(run.status).toBe(1);
    const statistics = reportOf(run).documents[0]!.statistics; // reportOf validates against the schema
    const sizes = statistics.map((s) => s.findings.find((f) => f.rule === 'p-value-mismatch')?.pDiscrepancy?.size ?? null);
    expect(sizes).toEqual(['last-digit', 'moderate', 'order-of-magnitude', null]);
    const factor = statistics[2]!.findings.find((f) => f.rule === 'p-value-mismatch')!.pDiscrepancy!.factor!;
    expect(factor).toBeGreaterThan(18);
    expect(factor).toBeLessThan(19);
  });

  it('the console says how large each is', () => {
    const run = plumbline(['check', TEXT], process.cwd());
    expect(run.stdout).toContain('The printed p is off only in its last digit, by one.');
    expect(run.stdout).toContain('The printed p is off by a factor of 1.5.');
    expect(run.stdout).toContain('The printed p is off by an order of magnitude or more (a factor of 18).');
  });
});
