import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { refitOutputSchema, type RefitOutput } from '../../src/refit/output.js';
import { builtCliExists, plumbline, temporaryFolder, type Run } from '../batch/cli.js';

/**
 * refit reads a CSV file as a CSV user expects, run through the built
 * command: each awkward file (mixed line endings, columns named like
 * members of Object.prototype, numbers in padded or unusual but decimal
 * spellings) gives exactly the table of the same data written plainly, and
 * cells that JavaScript would read as numbers but a CSV user would not
 * ("0b101", "0x1F", "Infinity") are text, refused in a numeric column with
 * the file, row and column.
 */

const folder = temporaryFolder('refit-csv');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function file(name: string, content: string): string {
  writeFileSync(join(folder, name), content);
  return name;
}

function refit(args: readonly string[]): Run {
  return plumbline(['refit', ...args], folder);
}

/** The JSON output of a refit that must succeed, without the data file's name (the only thing that may differ). */
function table(args: readonly string[]): Omit<RefitOutput, 'data'> {
  const run = refit([...args, '--format', 'json']);
  expect(run.stderr).toBe('');
  expect(run.status).toBe(0);
  const { data: _name, ...rest } = refitOutputSchema.parse(JSON.parse(run.stdout));
  return rest;
}

/** A small two-factor design with a covariate: 24 rows, each cell of group x dose three times. */
const rows = Array.from({ length: 24 }, (_, index) => ({
  score: ((index * 37) % 23) / 2 + (index % 3) * 1.5,
  group: ['x', 'y', 'z'][index % 3]!,
  dose: String((Math.floor(index / 3) % 2) + 1),
  age: 20 + ((index * 7) % 13),
}));
// The factor comes last, where a stray CR from a line ending would stick to it.
const plainLines = ['score,dose,age,group', ...rows.map((r) => `${r.score},${r.dose},${r.age},${r.group}`)];

/** The lines with one cell replaced (line 0 is the header). */
function withCell(lines: readonly string[], line: number, column: number, text: string): string[] {
  const copy = lines.slice();
  const cells = copy[line]!.split(',');
  cells[column] = text;
  copy[line] = cells.join(',');
  return copy;
}

describe.skipIf(!builtCliExists())('line endings', () => {
  const plain = file('plain.csv', `${plainLines.join('\n')}\n`);
  const model = ['--model', 'score ~ group * dose + age', '--factor', 'dose'];

  it('CRLF, LF and lone CR mixed in one file give the table of the plain file, with two levels per factor, not "x" and "x\\r"', () => {
    const endings = ['\r\n', '\n', '\r'];
    // The first line ends with CRLF (as a spreadsheet writes), the rest cycle through all three; the last line has none.
    const mixed = file('mixed.csv', plainLines.map((line, index) => line + (index === plainLines.length - 1 ? '' : endings[index % 3]!)).join(''));
    const expected = table([plain, ...model]);
    expect(expected.factors.map(({ name, levels }) => ({ name, levels }))).toEqual([
      { name: 'group', levels: ['x', 'y', 'z'] },
      { name: 'dose', levels: ['1', '2'] },
    ]);
    expect(table([mixed, ...model])).toEqual(expected);
  });

  it('a file that starts with LF lines and goes on with CRLF lines gives the same table', () => {
    const lfFirst = file('lf-first.csv', plainLines.map((line, index) => line + (index < 12 ? '\n' : '\r\n')).join(''));
    expect(table([lfFirst, ...model])).toEqual(table([plain, ...model]));
  });
});

describe.skipIf(!builtCliExists())('columns named like members of Object.prototype', () => {
  // Each column of the plain file under a name that a plain object already "has".
  const names = { score: 'valueOf', group: 'toString', dose: '__proto__', age: 'hasOwnProperty' } as const;
  const header = [names.score, names.group, names.dose, names.age, 'constructor'].join(',');
  // An extra factor "constructor"; the levels are named like members too, in the code-point order of x, y, z (and of a, b).
  const levels = ['__proto__', 'constructor', 'toString'];
  const body = rows.map((r, index) => `${r.score},${levels[['x', 'y', 'z'].indexOf(r.group)]},${r.dose},${index === 5 ? 99 : r.age},${Math.floor(index / 6) % 2 === 0 ? 'hasOwnProperty' : 'valueOf'}`);
  const named = file('named.csv', `${[header, ...body].join('\n')}\n`);
  const plainBody = rows.map((r, index) => `${r.score},${r.group},${r.dose},${index === 5 ? 99 : r.age},${Math.floor(index / 6) % 2 === 0 ? 'a' : 'b'}`);
  const plainNamed = file('plain-named.csv', `${['score,group,dose,age,extra', ...plainBody].join('\n')}\n`);

  it('are ordinary columns: the same table as the plain file, term for term, with --factor and --missing', () => {
    const ours = table([named, '--model', 'valueOf ~ toString * __proto__ + hasOwnProperty + constructor', '--factor', '__proto__', '--missing', 'hasOwnProperty=99']);
    const plain = table([plainNamed, '--model', 'score ~ group * dose + age + extra', '--factor', 'dose', '--missing', 'age=99']);
    expect(ours.n).toBe(23);
    expect(ours.n).toBe(plain.n);
    expect(ours.terms.map((t) => t.term)).toEqual(['toString', '__proto__', 'hasOwnProperty', 'constructor', 'toString:__proto__']);
    // "hasOwnProperty" is a covariate because its cells are numbers, not because an object has a member of that name.
    expect(ours.covariates).toEqual(['hasOwnProperty']);
    expect(ours.factors.map(({ name, levels }) => ({ name, levels }))).toEqual([
      { name: 'toString', levels: ['__proto__', 'constructor', 'toString'] },
      { name: '__proto__', levels: ['1', '2'] },
      { name: 'constructor', levels: ['hasOwnProperty', 'valueOf'] },
    ]);
    // The same data in the same order: the same numbers, to the last bit.
    const numbers = (output: typeof ours) => output.terms.map(({ term: _term, ...values }) => values);
    expect(numbers(ours)).toEqual(numbers(plain));
    expect(ours.residual).toEqual(plain.residual);
  });

  it('declared in an analysis description (factors, labels, missing, rename) are read, never taken from Object.prototype', () => {
    const spec = join(folder, 'named.analysis.json');
    // Written as JSON text: "__proto__" is then an own key, as in a file a user wrote.
    writeFileSync(
      spec,
      '{"model": "valueOf ~ toString * __proto__ + hasOwnProperty + constructor", "factors": {"__proto__": {"levels": [1, 2], "labels": {"1": "low", "2": "high"}}, "constructor": {}},' +
        ' "missing": {"hasOwnProperty": 99}, "rename": {}}',
    );
    const ours = table([named, '--spec', spec]);
    expect(ours.n).toBe(23);
    expect(ours.factors.map((f) => f.name)).toEqual(['toString', '__proto__', 'constructor']);
    expect(ours.missing).toEqual([{ column: 'hasOwnProperty', codes: '99' }]);
  });

  it('an undeclared column named "toString" whose cells are numbers is a covariate, not a factor', () => {
    const numeric = file('numeric-names.csv', `${['score,toString,valueOf', ...rows.map((r) => `${r.score},${r.age},${r.group}`)].join('\n')}\n`);
    const ours = table([numeric, '--model', 'score ~ toString + valueOf']);
    expect(ours.covariates).toEqual(['toString']);
    expect(ours.factors.map(({ name, levels }) => ({ name, levels }))).toEqual([{ name: 'valueOf', levels: ['x', 'y', 'z'] }]);
  });
});

describe.skipIf(!builtCliExists())('numbers', () => {
  it.each(['0b101', '0o17', '0x1F', 'Infinity', '-Infinity', '1e999', 'NaN', '1_000'])('"%s" is not a number: refused in the outcome with file, row and column', (cell) => {
    const lines = withCell(plainLines, 4, 0, cell);
    const name = file('special-number.csv', `${lines.join('\n')}\n`);
    const run = refit([name, '--model', 'score ~ group']);
    expect(run.status).toBe(2);
    expect(run.stderr).toBe(
      `plumbline: special-number.csv, row 5, column 'score': "${cell}" is not a number, but the column is numeric (it is the outcome). Fix the cell, declare the code missing with --missing "score=${cell}".\n`,
    );
  });

  it('empty and blank cells are missing, never zero: the rows are dropped and counted', () => {
    const lines = withCell(withCell(withCell(plainLines, 2, 0, ''), 3, 0, '   '), 6, 2, '\t');
    const ours = table([file('blanks.csv', `${lines.join('\n')}\n`), '--model', 'score ~ group + age']);
    expect(ours).toMatchObject({ n: 21, droppedRows: 3, rowsInFile: 24 });
    const withoutThem = plainLines.filter((_, index) => index !== 2 && index !== 3 && index !== 6);
    expect(table([file('without.csv', `${withoutThem.join('\n')}\n`), '--model', 'score ~ group + age']).terms).toEqual(ours.terms);
  });

  it('decimal spellings (sign, exponent, leading or trailing point, white space around) give the table of the plain file', () => {
    const spell = (value: number, index: number): string => {
      const text = String(value);
      switch (index % 5) {
        case 0:
          return `+${text}`;
        case 1:
          return ` ${text} `;
        case 2:
          return `${value * 10}e-1`;
        case 3:
          return Number.isInteger(value) ? `${text}.` : text.replace(/^0\./, '.');
        default:
          return `"${text}"`;
      }
    };
    const spelled = file('spelled.csv', `${['score,dose,age,group', ...rows.map((r, index) => `${spell(r.score, index)},${r.dose},${spell(r.age, index + 1)},${r.group}`)].join('\n')}\n`);
    const plain = file('plain-numbers.csv', `${plainLines.join('\n')}\n`);
    expect(table([spelled, '--model', 'score ~ group + age']).terms).toEqual(table([plain, '--model', 'score ~ group + age']).terms);
  });

  it('a missing-value code written in hexadecimal is a text code, not the number it spells in JavaScript', () => {
    const lines = withCell(plainLines, 1, 2, '16');
    const name = file('hex-code.csv', `${lines.join('\n')}\n`);
    // "0x10" would be 16 to Number(); as a CSV user reads it, it matches no cell here, so no row is dropped.
    expect(table([name, '--model', 'score ~ group + age', '--missing', 'age=0x10'])).toMatchObject({ droppedRows: 0 });
    expect(table([name, '--model', 'score ~ group + age', '--missing', 'age=16'])).toMatchObject({ droppedRows: 1 });
  });
});

describe.skipIf(!builtCliExists())('--max-columns', () => {
  it('200000, which no fit can use, is refused with the allowed range instead of crashing', () => {
    const run = refit([file('small.csv', `${plainLines.join('\n')}\n`), '--model', 'score ~ group', '--max-columns', '200000']);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/^plumbline: --max-columns must be a whole number from 2 to 4,000, got "200000" \(a wider fit needs hours and gigabytes of memory/);
  });

  it('a model wider than any fit names the factor and does not suggest raising the limit past what can be fitted', () => {
    const ids = file('ids.csv', `${['id,score', ...Array.from({ length: 10_000 }, (_, index) => `p${index % 5000},${(index * 7919) % 101}`)].join('\n')}\n`);
    const run = refit([ids, '--model', 'score ~ id']);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain("The model has 5000 design columns, more than maxColumns = 1000. Factor 'id' has 5000 levels");
    expect(run.stderr).toContain('fit a smaller model: refit fits at most 4,000 columns');
    expect(run.stderr).not.toContain('--max-columns 5000');
  });
});
