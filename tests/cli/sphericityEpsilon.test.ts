/**
 * The built command line (`node dist/src/cli/main.js scan <file> --format
 * json`) on a manuscript printing sphericity epsilons beside repeated-measures
 * F tests. Reference p values: SciPy 1.10.1 scipy.stats.f.sf (F = 4.50 on
 * (2, 58): .0152; on (1.44, 41.76), the df times epsilon = .72: .0271).
 */
import { describe, expect, it } from 'vitest';
import { scanTextJson } from './scanDocumentJson.js';

describe('plumbline scan: printed sphericity epsilons against the df and p beside them', () => {
  it('passes a consistent corrected test and flags a mismatched epsilon, an uncorrected p and a corrected p with whole df', () => {
    const text = [
      'Accuracy changed over the four sessions, F(1.44, 41.76) = 4.50, p = .027, Greenhouse-Geisser ε = .72.',
      '',
      'In the second block accuracy changed again, F(1.44, 41.76) = 4.50, p = .027, ε = .81.',
      '',
      'In the third block accuracy changed again, F(1.44, 41.76) = 4.50, p = .015, ε = .72.',
      '',
      'In the fourth block accuracy changed again, F(2, 58) = 4.50, p = .027, ε = .72.',
    ].join('\n');
    const document = scanTextJson(text);
    expect(document.statistics).toHaveLength(4);
    const flags = document.statistics.map((s) => s.findings.filter((f) => f.rule === 'epsilon-df-mismatch').map((f) => `${f.severity}: ${f.message}`));
    expect(flags[0]).toEqual([]);
    expect(flags[1]).toHaveLength(1);
    expect(flags[1]![0]).toMatch(/^warn: The printed epsilon = \.81 does not turn whole-number df into the df of F\(1\.44, 41\.76\) = 4\.50/);
    expect(flags[2]).toHaveLength(1);
    expect(flags[2]![0]).toMatch(/^warn: p = \.015 fits the uncorrected df of F\(1\.44, 41\.76\) = 4\.50 \(F\(2, 58\), p = /);
    expect(flags[3]).toHaveLength(1);
    expect(flags[3]![0]).toMatch(/^note: p = \.027 is the p of F\(2, 58\) = 4\.50 with both df times the printed epsilon = \.72 \(F\(1\.44, 41\.76\)/);
    // The corrected p beside whole df is not also a p-value mismatch.
    expect(document.statistics[3]!.findings.filter((f) => f.rule === 'p-value-mismatch')).toEqual([]);
  });
});
