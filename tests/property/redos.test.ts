import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { checkSync } from 'recheck';
import { parseAst } from 'rolldown/parseAst';
import { describe, expect, it } from 'vitest';

/**
 * Every regular expression of the scanner, the table reader, the document
 * readers and the data reader is checked for catastrophic backtracking
 * (ReDoS) with recheck. They are collected from the sources: regular
 * expression literals, and `new RegExp(...)` whose arguments are string
 * literals, String.raw or template strings of constants of the same file.
 * A part that is only known at run time (a name escaped with escapeRegExp,
 * a LaTeX command name) is replaced by a plain word: it matches itself
 * literally, which is what the escaping guarantees.
 */

const root = join(import.meta.dirname, '..', '..');
const folders = ['src/scan', 'src/documents', 'src/refit', 'src/stats/reportedNumber.ts', 'src/cli/cellsInput.ts', 'src/audit.ts', 'src/limits.ts'];

function sourceFiles(path: string): string[] {
  const full = join(root, path);
  if (statSync(full).isFile()) return [full];
  return readdirSync(full).flatMap((name) => sourceFiles(join(path, name))).filter((file) => file.endsWith('.ts'));
}

interface Found {
  file: string;
  line: number;
  source: string;
  flags: string;
}

type Node = { type: string; start: number; end: number; [key: string]: unknown };

function collect(file: string): Found[] {
  const code = readFileSync(file, 'utf8');
  const program = parseAst(code, { lang: 'ts', sourceType: 'module' }) as unknown as Node;
  const constants = new Map<string, Node>();
  const found: Found[] = [];
  const lineOf = (offset: number): number => code.slice(0, offset).split('\n').length;
  const visit = (node: unknown, action: (node: Node) => void): void => {
    if (Array.isArray(node)) node.forEach((child) => visit(child, action));
    else if (node !== null && typeof node === 'object' && typeof (node as Node).type === 'string') {
      action(node as Node);
      for (const [key, value] of Object.entries(node)) if (key !== 'parent') visit(value, action);
    }
  };
  visit(program, (node) => {
    if (node.type === 'VariableDeclarator' && (node.id as Node).type === 'Identifier' && node.init) constants.set((node.id as { name: string }).name, node.init as Node);
  });
  /** The string value of a constant expression; unknown parts become the word "name". */
  const evaluate = (node: Node | undefined, depth = 0): string => {
    if (!node || depth > 20) return 'name';
    switch (node.type) {
      case 'Literal':
        if (typeof node.value === 'string') return node.value;
        if ((node as { regex?: { pattern: string } }).regex) return (node as unknown as { regex: { pattern: string } }).regex.pattern;
        return String(node.value);
      case 'TemplateLiteral': {
        const quasis = node.quasis as { value: { cooked: string | null; raw: string } }[];
        const expressions = node.expressions as Node[];
        return quasis.map((quasi, index) => (quasi.value.cooked ?? quasi.value.raw) + (index < expressions.length ? evaluate(expressions[index], depth + 1) : '')).join('');
      }
      case 'TaggedTemplateExpression': {
        const quasi = node.quasi as Node;
        const quasis = quasi.quasis as { value: { raw: string } }[];
        const expressions = quasi.expressions as Node[];
        return quasis.map((part, index) => part.value.raw + (index < expressions.length ? evaluate(expressions[index], depth + 1) : '')).join('');
      }
      case 'BinaryExpression':
        return evaluate(node.left as Node, depth + 1) + evaluate(node.right as Node, depth + 1);
      case 'Identifier': {
        const init = constants.get((node as { name: string }).name);
        return init ? evaluate(init, depth + 1) : 'name';
      }
      case 'MemberExpression': {
        const property = (node.property as { name?: string }).name;
        const object = node.object as Node;
        const target = object.type === 'Identifier' ? constants.get((object as { name: string }).name) : object;
        if (target && (property === 'source' || property === 'flags')) {
          const regex = (target as unknown as { regex?: { pattern: string; flags: string } }).regex;
          if (regex) return property === 'source' ? regex.pattern : regex.flags;
          if (target.type === 'NewExpression') return property === 'source' ? evaluate((target.arguments as Node[])[0], depth + 1) : evaluate((target.arguments as Node[])[1], depth + 1);
        }
        return 'name';
      }
      default:
        return 'name';
    }
  };
  visit(program, (node) => {
    const regex = (node as unknown as { regex?: { pattern: string; flags: string } }).regex;
    if (node.type === 'Literal' && regex) found.push({ file, line: lineOf(node.start), source: regex.pattern, flags: regex.flags });
    if ((node.type === 'NewExpression' || node.type === 'CallExpression') && (node.callee as { name?: string }).name === 'RegExp') {
      const [pattern, flags] = node.arguments as Node[];
      const flagText = flags ? evaluate(flags) : '';
      found.push({ file, line: lineOf(node.start), source: evaluate(pattern), flags: flagText === 'name' ? '' : flagText });
    }
  });
  return found;
}

const patterns = folders.flatMap(sourceFiles).flatMap(collect);

/** A fixed seed for the checker's fuzzing, so a run finds what the last run found (an unseeded run is a lottery). */
const REDOS_SEED = 20261203;

/**
 * The checker's verdict. A check that ran out of time on a loaded machine ("unknown") is run once more with
 * six times the time; a second "unknown" still fails the test (nothing passes by default).
 */
/** Room for both tries of checkPattern. */
const CHECK_TEST_TIMEOUT = 90_000;

function checkPattern(source: string, flags: string): ReturnType<typeof checkSync> {
  // The automaton checker first: where it can decide (most patterns), its verdict has no false positives and
  // does not depend on how loaded the machine is; the hybrid checker's fuzzing, which it falls back to
  // otherwise, measures growth under a time budget and has flagged safe patterns on a busy machine.
  const exact = checkSync(source, flags, { timeout: 10_000, checker: 'automaton' });
  if (exact.status !== 'unknown') return exact;
  const first = checkSync(source, flags, { timeout: 10_000, randomSeed: REDOS_SEED });
  if (first.status !== 'unknown') return first;
  return checkSync(source, flags, { timeout: 60_000, randomSeed: REDOS_SEED });
}

/**
 * Patterns known to be vulnerable in files this hardening may not change.
 * Each must STILL be found vulnerable (so the entry is removed when the
 * pattern is fixed); the test names say so, nothing is skipped silently.
 */
const KNOWN_VULNERABLE: Record<string, string> = {};

describe('regular expressions are safe from catastrophic backtracking', () => {
  it('flags known vulnerable patterns, exponential and polynomial, with the checkers as configured', () => {
    // (Textbook cases, common practice: a group repeating two ways to match the same letter; a run of digits
    // that two quantifiers can share before an anchor that fails.)
    expect(checkPattern('^(a|a)*$', '').status).toBe('vulnerable');
    expect(checkPattern(String.raw`\d[.,]?\d*\s*$`, '').status).toBe('vulnerable');
  }, CHECK_TEST_TIMEOUT);

  it('finds the patterns of every module it should', () => {
    const files = new Set(patterns.map((pattern) => relative(root, pattern.file)));
    for (const file of ['src/scan/normalise.ts', 'src/scan/context.ts', 'src/scan/tables/readTableResults.ts', 'src/documents/html.ts', 'src/documents/latex.ts', 'src/documents/pdf.ts', 'src/refit/data.ts']) {
      expect(files, file).toContain(file);
    }
    expect(patterns.length).toBeGreaterThan(100);
  });

  // Unique patterns only: the same pattern in two places is checked once.
  const unique = [...new Map(patterns.map((pattern) => [`${pattern.flags}/${pattern.source}`, pattern])).values()];
  const known = (pattern: Found): string | undefined => KNOWN_VULNERABLE[relative(root, pattern.file)];
  it.each(Object.entries(KNOWN_VULNERABLE))('%s still has a vulnerable pattern, as recorded (%s)', (file) => {
    const statuses = unique.filter((pattern) => relative(root, pattern.file) === file).map((pattern) => checkPattern(pattern.source, pattern.flags).status);
    expect(statuses).toContain('vulnerable');
  }, CHECK_TEST_TIMEOUT);

  // Patterns of the files above are checked in that test; every other pattern must be safe.
  it.each(unique.filter((pattern) => known(pattern) === undefined).map((pattern) => [`${relative(root, pattern.file)}:${pattern.line}`, pattern] as const))('%s', (_where, pattern) => {
    const diagnostics = checkPattern(pattern.source, pattern.flags);
    if (diagnostics.status === 'vulnerable') {
      expect.fail(
        `/${pattern.source}/${pattern.flags} is vulnerable (${diagnostics.complexity.summary}); attack string: ${JSON.stringify(diagnostics.attack.string.slice(0, 200))} (${diagnostics.attack.pattern})`,
      );
    }
    // "unknown" (the checker gave up within its time budget) is reported, not taken as safe.
    expect(diagnostics.status, `/${pattern.source}/${pattern.flags}: ${diagnostics.status === 'unknown' ? JSON.stringify(diagnostics.error) : ''}`).toBe('safe');
  }, CHECK_TEST_TIMEOUT);
});
