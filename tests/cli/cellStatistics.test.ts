import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { builtCliExists, plumbline, temporaryFolder } from '../batch/cli.js';
import { loadFixture } from '../stats/referenceFixtures.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

/**
 * `plumbline scan` on a manuscript that prints a factorial design's cell statistics and its F tests, run as a
 * user runs it (the built command; `npm test` builds first): the rule cell-statistics-test-mismatch.
 */

interface Finding {
  rule: string;
  severity: string;
  messageId: string;
  message: string;
}
interface ScanJson {
  documents: Array<{ statistics: Array<{ text: string; findings: Finding[] }> }>;
}

interface FixtureCase {
  label: string;
  cells: Array<{ levels: string[]; n: number; meanRounded: number; sdRounded: number }>;
  anova: Record<string, { effects: Array<{ term: number[]; f: number; p: number; df: number }>; dfResidual: number }>;
}

// statsmodels 0.13.5 anova_lm (type III, sum-to-zero coding) on simulated raw data; the manuscript prints only the
// 2-decimal cell statistics (tests/fixtures/stats/gen_factorial_cells.py).
const fixture = loadFixture<{ cases: FixtureCase[] }>('stats/factorial_cells.json');
const design = fixture.cases.find((c) => c.label === '2x3 unbalanced')!;
const typeIII = design.anova['3']!;
const names = ['Shift', 'Task'];
const printedP = (p: number): string => (p < 0.001 ? 'p < .001' : `p = ${p.toFixed(3).slice(1)}`);

function manuscript(fOf: (f: number, term: number[]) => number): string {
  const rows = design.cells.map((cell) => `| ${cell.levels.join(' | ')} | ${cell.n} | ${cell.meanRounded.toFixed(2)} | ${cell.sdRounded.toFixed(2)} |`);
  const sentences = typeIII.effects.map((effect) => {
    const name = effect.term.map((f) => names[f]!).join(' × ');
    const words = effect.term.length === 1 ? `There was a main effect of ${name}` : `The ${name} interaction was significant`;
    return `${words}, F(${effect.df}, ${typeIII.dfResidual}) = ${fOf(effect.f, effect.term).toFixed(2)}, ${printedP(effect.p)}.`;
  });
  return ['Table 1', 'Accuracy by shift and task', '', '| Shift | Task | n | M | SD |', '| --- | --- | --- | --- | --- |', ...rows, '', `Accuracy (Table 1) was analysed with type III sums of squares. ${sentences.join(' ')}`, ''].join('\n');
}

const folder = temporaryFolder('cell-statistics');
const write = (name: string, text: string): string => {
  writeFileSync(join(folder, name), text);
  return name;
};

function scan(file: string): { status: number | null; report: ScanJson } {
  const run = plumbline(['scan', file, '--format', 'json'], folder);
  expect(run.stderr).toBe('');
  return { status: run.status, report: readJsonReport(run.stdout) as unknown as ScanJson };
}

const ruleFindings = (report: ScanJson): Finding[][] => report.documents[0]!.statistics.map((s) => s.findings.filter((f) => f.rule === 'cell-statistics-test-mismatch'));

describe('plumbline scan: F tests against the factorial cell statistics printed with them', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  it('a clean manuscript: every F is type III, and said so for the effects where only type III gives it; exit 0', () => {
    const { status, report } = scan(write('clean.md', manuscript((f) => f)));
    expect(status).toBe(0);
    const findings = ruleFindings(report);
    expect(findings).toHaveLength(3);
    // statsmodels: Shift 6.930 (I), 3.702 (II), 6.715 (III); Task 10.436 (I, II), 8.161 (III); the interaction 6.145 in all three.
    expect(findings.map((list) => list.map((f) => `${f.severity} ${f.messageId}`))).toEqual([['note single-type'], ['note single-type'], []]);
    expect(findings[0]![0]!.message).toContain('under type III sums of squares only');
  });

  it('a slip: the interaction F typed as 9.15 for 6.15 is flagged as a fail, exit 1', () => {
    const { status, report } = scan(write('slip.md', manuscript((f, term) => (term.length === 2 ? f + 3 : f))));
    expect(status).toBe(1);
    const [, , interaction] = ruleFindings(report);
    expect(interaction).toHaveLength(1);
    expect(interaction![0]).toMatchObject({ severity: 'fail', messageId: 'mismatch' });
    expect(interaction![0]!.message).toContain('Shift × Task does not follow from the 2 × 3 cell means and SDs in Table 1 (N = 105)');
    expect(interaction![0]!.message).toContain('types I, II and III give F(2, 99) = 6.');
  });
});

interface PostHocCase {
  label: string;
  means: number[];
  sds: number[];
  ns: number[];
  errorMeanSquare: number;
  errorDf: number;
  pairs: Array<{ first: number; second: number; t: number; pTukey: number }>;
}

// SciPy 1.10.1 scipy.stats.tukey_hsd on simulated raw data, with the groups' means, SDs and ns
// (tests/fixtures/stats/gen_post_hoc.py); the manuscript prints the groups to 2 decimals.
describe('plumbline scan: pairwise comparisons after an ANOVA against its groups (post-hoc-comparison-mismatch)', () => {
  const postHoc = loadFixture<{ cases: PostHocCase[] }>('stats/post_hoc.json').cases.find((c) => c.label === '3 groups, unequal n (Tukey-Kramer)')!;
  const groupsText = postHoc.means.map((mean, g) => `group ${g + 1} (M = ${mean.toFixed(2)}, SD = ${postHoc.sds[g]!.toFixed(2)}, n = ${postHoc.ns[g]})`).join(', ');
  const comparisons = (tOf: (t: number) => number): string =>
    postHoc.pairs
      .map((pair) => `Tukey's HSD: group ${pair.first + 1} (M = ${postHoc.means[pair.first]!.toFixed(2)}) against group ${pair.second + 1} (M = ${postHoc.means[pair.second]!.toFixed(2)}), t(${postHoc.errorDf}) = ${tOf(pair.t).toFixed(2)}, ${printedP(pair.pTukey)}.`)
      .join('\n');
  const document = (tOf: (t: number) => number): string => `Scores of ${groupsText} differed, F(2, ${postHoc.errorDf}) = 6.00, p = .004.\n\n${comparisons(tOf)}\n`;
  const findingsOf = (report: ScanJson): Finding[][] => report.documents[0]!.statistics.slice(1).map((s) => s.findings.filter((f) => f.rule === 'post-hoc-comparison-mismatch'));

  it('clean: every Tukey-Kramer comparison follows from the groups', () => {
    const { report } = scan(write('post-hoc-clean.txt', document((t) => t)));
    expect(findingsOf(report)).toEqual([[], [], []]);
  });

  it('a t typed 20% too large is flagged as a fail, exit 1', () => {
    const { status, report } = scan(write('post-hoc-slip.txt', document((t) => t * 1.2)));
    expect(status).toBe(1);
    const findings = findingsOf(report);
    // Pairs with |t| of 1 or more (below it the rounding of the means hides 20%).
    postHoc.pairs.forEach((pair, index) => {
      if (Math.abs(pair.t) < 1) return;
      expect(findings[index]).toHaveLength(1);
      expect(findings[index]![0]).toMatchObject({ severity: 'fail', messageId: 'mismatch' });
      expect(findings[index]![0]!.message).toContain('a Tukey (Tukey-Kramer) comparison of group');
    });
  });
});
