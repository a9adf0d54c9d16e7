/**
 * The built command line (`node dist/src/cli/main.js scan <file> --format
 * json`) on a manuscript printing an MSE with one-way F tests and the group
 * statistics. Reference: SciPy 1.10.1 scipy.stats.f_oneway on raw data with
 * exactly these means and SDs (three groups of 21): F(2, 60) = 0.2867; MSE
 * (pooled variance, numpy) = 640.47.
 */
import { describe, expect, it } from 'vitest';
import { scanTextJson } from './scanDocumentJson.js';

const groups = '(M = 182.4, SD = 24.6, n = 21), (M = 179.8, SD = 26.1, n = 21) and (M = 176.5, SD = 25.2, n = 21)';

describe('plumbline scan: an MSE printed with a one-way F against the group statistics', () => {
  it('passes the right MSE and flags an MSE the SDs cannot give', () => {
    const text = [
      `Speed was similar in the three groups ${groups}, F(2, 60) = 0.29, MSE = 640.47, p = .752.`,
      '',
      `In the replication speed was again similar ${groups}, F(2, 60) = 0.29, MSE = 25.31, p = .752.`,
    ].join('\n');
    const document = scanTextJson(text);
    expect(document.statistics).toHaveLength(2);
    const flags = document.statistics.map((s) => s.findings.filter((f) => f.rule === 'mse-mismatch'));
    expect(flags[0]).toEqual([]);
    expect(flags[1]).toHaveLength(1);
    expect(flags[1]![0]).toMatchObject({ severity: 'fail' });
    expect(flags[1]![0]!.message).toContain('The MSE printed with F(2, 60) = 0.29 (MSE = 25.31) does not follow from the group SDs and sizes');
  });
});
