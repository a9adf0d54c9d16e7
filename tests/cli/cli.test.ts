import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli, type CliIo } from '../../src/cli/program.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

async function run(argv: string[], stdin = ''): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: CliIo = {
    stdout: (text) => (out += text),
    stderr: (text) => (err += text),
    readStdin: async () => stdin,
    color: false,
  };
  const code = await runCli(argv, io);
  return { code, out, err };
}

// F(2, 57) = 4.21 -> p = .0197 (SciPy 1.10.1 scipy.stats.f.sf); partial eta squared = 8.42/65.42 = .129.
const consistent = 'Dose affected recall, F(2, 57) = 4.21, p = .020, ηp2 = .13.';
const inconsistent = 'Dose affected recall, F(2, 57) = 4.21, p = .002, ηp2 = .13.';

describe('plumbline check', () => {
  it('gives every result its verdict and exits 0 when nothing fails', async () => {
    const { code, out } = await run(['check', consistent]);
    expect(code).toBe(0);
    expect(out).toMatch(/ok\s+F\(2, 57\) = 4\.21/);
  });

  it('exits 1 and explains a failing result', async () => {
    const { code, out } = await run(['check', inconsistent]);
    expect(code).toBe(1);
    expect(out).toContain('p-value-mismatch');
    expect(out).toContain('F(2, 57) = 4.21 gives p = 0.0197');
  });

  it('reads standard input with "-"', async () => {
    const { code, out } = await run(['check', '-'], inconsistent);
    expect(code).toBe(1);
    expect(out).toContain('<stdin>');
  });

  it('--fail-on never keeps exit code 0', async () => {
    expect((await run(['check', inconsistent, '--fail-on', 'never'])).code).toBe(0);
  });

  it('writes JSON that satisfies the published schema', async () => {
    const { out } = await run(['check', inconsistent, '--format', 'json']);
    const report = readJsonReport(out);
    const statistic = report.documents[0]!.statistics[0]!;
    expect(statistic).toMatchObject({ kind: 'F', df: [2, 57], value: 4.21, p: { comparator: '=', value: 0.002 } });
    expect(statistic.location).toMatchObject({ page: null, line: 1 });
    expect(statistic.recomputed.p).toBeCloseTo(0.0197098, 6);
    expect(statistic.findings.map((f) => f.rule)).toEqual(['p-value-mismatch']);
  });

  it('exits 2 on a usage error', async () => {
    const { code, err } = await run(['check', consistent, '--format', 'xml']);
    expect(code).toBe(2);
    expect(err).toMatch(/xml/);
  });

  it('exits 2 and names the field of a bad settings file', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-cli-'));
    const config = join(dir, 'settings.json');
    writeFileSync(config, JSON.stringify({ rules: { 'halved-p': 'loud' } }));
    const { code, err } = await run(['check', consistent, '--config', config]);
    expect(code).toBe(2);
    expect(err).toContain(`${config}: rules.halved-p`);
  });
});

describe('plumbline scan', () => {
  it('audits every text document in a folder, and an unreadable one does not stop the others', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-scan-'));
    writeFileSync(join(dir, 'a.txt'), `Intro.\n${inconsistent}\n`);
    writeFileSync(join(dir, 'b.md'), `# Results\n\n${consistent}\n`);
    writeFileSync(join(dir, 'c.txt'), Buffer.from([0x46, 0x00, 0x01]));
    const { code, out } = await run(['scan', dir, '--format', 'json']);
    const report = readJsonReport(out);
    // Named relative to where the command runs, whatever form the argument took.
    expect(report.documents.map((d) => [relative(dir, d.path), d.status])).toEqual([
      ['a.txt', 'checked'],
      ['b.md', 'checked'],
      ['c.txt', 'unreadable'],
    ]);
    expect(report.documents[0]!.statistics[0]!.location.line).toBe(2);
    expect(report.documents[2]!.error).toMatch(/binary content/);
    expect(code).toBe(2);
  });

  it('reports a missing path', async () => {
    const { code, out } = await run(['scan', join(tmpdir(), 'no-such-folder-for-plumbline')]);
    expect(code).toBe(2);
    expect(out).toContain('no such file or folder');
  });
});

describe('plumbline rules', () => {
  it('lists the catalogue', async () => {
    const { code, out } = await run(['rules']);
    expect(code).toBe(0);
    expect(out).toMatch(/^p-value-mismatch\s+fail\s+/m);
  });
});

describe('the built command (bin entry)', () => {
  const bin = join('dist', 'src', 'cli', 'main.js');
  // `npm test` builds first; running vitest alone needs `npm run build`.
  it('answers --version and --help through node and through npx', () => {
    expect(existsSync(bin), `${bin} missing: run npm run build`).toBe(true);
    const version = execFileSync('node', [bin, '--version'], { encoding: 'utf8' }).trim();
    expect(version).toMatch(/^\d+\.\d+\.\d+$/);
    const help = spawnSync('npx', ['--no-install', 'plumbline', '--help'], { encoding: 'utf8' });
    expect(help.status).toBe(0);
    expect(help.stdout).toContain('Usage: plumbline');
    expect(help.stdout).toContain('not proof of error or misconduct');
  });

  it('prints plain output when NO_COLOR is set or output is not a terminal', () => {
    const result = spawnSync('node', [bin, 'check', inconsistent], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
    expect(result.status).toBe(1);
    expect(result.stdout).not.toMatch(/\u001b\[/);
  });
});

describe('the library entry', () => {
  it('audits text and formats a report without the command line', async () => {
    const library = await import('../../src/index.js');
    const config = library.resolveConfig({});
    const report = library.buildReport([library.auditText(inconsistent, config, 'pasted')]);
    expect(report.summary.findings.fail).toBe(1);
    expect(library.formatMarkdown(report)).toContain('p-value-mismatch');
    expect(library.statistics.fUpperTail(4.21, 2, 57)).toBeCloseTo(0.0197098, 6); // SciPy 1.10.1 scipy.stats.f.sf
  });
});
