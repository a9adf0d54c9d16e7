import mammoth from 'mammoth';
import { spawnSync } from 'node:child_process';
import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bin, builtCliExists, plumbline, temporaryFolder } from '../batch/cli.js';
import { htmlDataStrings } from '../report/htmlData.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

/**
 * No control character from a document or a file name reaches a report a
 * person reads (src/report/visible.ts): the built command is run on a text
 * file whose name and content carry the escape sequences a terminal obeys,
 * and every text format is searched for them; so are refit's reports of
 * a data file and a reported table whose name and label carry them.
 */

const ESC = '\u001b';
const BEL = '\u0007';
const RLO = '\u202e';
const CURSOR_UP = `${ESC}[2A`;
const CLEAR_SCREEN = `${ESC}[2J`;
const WINDOW_TITLE = `${ESC}]0;pwned${BEL}`;
const HYPERLINK = `${ESC}]8;;http://example.invalid/${ESC}\\click${ESC}]8;;${ESC}\\`;

/** The characters no text report may hold: C0 controls other than tab and line feed, DEL, C1 controls, bidi overrides and isolates. */
const FORBIDDEN = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/;

/** Where the first forbidden character is, with a little context, for a readable failure. */
function firstForbidden(output: string): string | null {
  const at = output.search(FORBIDDEN);
  return at === -1 ? null : JSON.stringify(output.slice(Math.max(0, at - 30), at + 30));
}

// A name that clears the screen, sets the window title and turns "txt.exe" round; it still ends in .txt.
const hostileName = `paper${CLEAR_SCREEN}${WINDOW_TITLE}${RLO}exe.txt`;
// A result whose printed text holds cursor moves and a screen clear, and a table whose caption sets the
// window title, forges a hyperlink and reverses its line (its F has no df, so it is listed as not read).
const hostileText = [
  'Results',
  '',
  `Dose affected recall, F(2, 57) = 4.21,${CURSOR_UP}${CLEAR_SCREEN} p = .002, ${RLO}ηp2 = .13.`,
  '',
  'Table 1',
  `ANOVA results ${WINDOW_TITLE}${HYPERLINK} for recall ${RLO}by dose${CLEAR_SCREEN}.`,
  '| Source | F | p |',
  '| Dose | 4.21 | .002 |',
  '| Age | 1.10 | .300 |',
  '| Sex | 2.50 | .120 |',
  '',
].join('\n');
// An unreadable document (text named .pdf) with a hostile name, and a named file that does not exist.
const unreadableName = `broken${ESC}[31m${RLO}fdp.pdf`;
const missingName = `missing${CLEAR_SCREEN}.txt`;

let folder = '';
beforeAll(() => {
  folder = temporaryFolder('controls');
  writeFileSync(join(folder, hostileName), hostileText);
  writeFileSync(join(folder, unreadableName), 'not a PDF at all\n');
});
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function scan(format: string): { status: number | null; stdout: string; stderr: string } {
  return plumbline(['scan', '.', missingName, '--all', '--no-cache', '-q', '--format', format], folder);
}

describe('control characters from documents and file names, in the built command', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  it('the document really carries them: the JSON report keeps the text as it is', () => {
    const run = scan('json');
    expect(run.status).toBe(2); // unreadable documents
    const report = readJsonReport(run.stdout);
    const paths = report.documents.map((document) => document.path);
    expect(paths).toEqual(expect.arrayContaining([hostileName, unreadableName, missingName]));
    const audited = report.documents.find((document) => document.path === hostileName)!;
    expect(audited.statistics[0]!.text).toContain(CLEAR_SCREEN);
    expect(audited.tablesNotRead[0]!.message).toContain(HYPERLINK);
  });

  for (const format of ['text', 'md', 'csv']) {
    it(`${format}: no control character and no bidi override reaches the report, and each is shown as its escape`, () => {
      const run = scan(format);
      expect(run.status).toBe(2);
      expect(firstForbidden(run.stdout)).toBeNull();
      expect(firstForbidden(run.stderr)).toBeNull();
      // Visible, not dropped: the file name, the result's text and the caption with their escapes.
      expect(run.stdout).toContain('paper\\x1b[2J\\x1b]0;pwned\\x07\\u202eexe.txt');
      expect(run.stdout).toContain('4.21,\\x1b[2A\\x1b[2J p = .002');
      expect(run.stdout).toContain('broken\\x1b[31m\\u202efdp.pdf');
      expect(run.stdout).toContain('missing\\x1b[2J.txt');
      // In Markdown text the escapes' backslashes (and the brackets) are escaped in turn, so a viewer shows them as above.
      if (format === 'md') expect(run.stdout).toContain('\\\\x1b\\]8;;http://example.invalid/\\\\x1b\\\\click');
      else expect(run.stdout).toContain('\\x1b]8;;http://example.invalid/\\x1b\\click');
    });
  }

  it('html: markup was escaped already; bidi overrides and the other controls are now shown as escapes too', () => {
    const run = scan('html');
    expect(run.status).toBe(2);
    expect(firstForbidden(run.stdout.replace(/\r/g, ''))).toBeNull();
    // The documents are data the page's script sets as text: their strings hold the escapes.
    const strings = htmlDataStrings(run.stdout);
    expect(strings).toContain('paper\\x1b[2J\\x1b]0;pwned\\x07\\u202eexe.txt');
    expect(strings.some((text) => text.includes('\\u202eηp2 = .13'))).toBe(true);
  });

  it('check: a pasted paragraph on standard input is printed with its controls made visible', () => {
    const run = spawnSync('node', [bin, 'check', '-'], {
      cwd: folder,
      input: `Dose affected recall, F(2, 57) = 4.21,${CLEAR_SCREEN}${WINDOW_TITLE} p = .002, ${RLO}ηp2 = .13.`,
      encoding: 'utf8',
      env: { ...process.env, NO_COLOR: '1' },
      timeout: 60_000,
    });
    expect(run.status).toBe(1); // the p does not follow from F
    expect(firstForbidden(run.stdout)).toBeNull();
    expect(run.stdout).toContain('4.21,\\x1b[2J\\x1b]0;pwned\\x07 p = .002');
  });

  it('a usage error naming a file prints its controls as escapes on standard error', () => {
    const run = plumbline(['scan', '.', '--output', `nowhere${CLEAR_SCREEN}/report.txt`], folder);
    expect(run.status).toBe(2);
    expect(firstForbidden(run.stderr)).toBeNull();
    expect(run.stderr).toContain('nowhere\\x1b[2J');
  });
});

describe('control characters in refit\'s reports, in the built command', () => {
  // A data file and a reported table whose row label (a manuscript's words) clears the screen and reverses its line.
  const refitName = `refit${CLEAR_SCREEN}${RLO}.csv`;
  const reportedLabel = `Group${CLEAR_SCREEN}${WINDOW_TITLE}${RLO}`;
  beforeAll(() => {
    const rows = Array.from({ length: 30 }, (_, index) => `${((index * 37) % 23) / 2},${['a', 'b', 'c'][index % 3]}`);
    writeFileSync(join(folder, refitName), `score,group\n${rows.join('\n')}\n`);
    writeFileSync(join(folder, 'reported.csv'), `Source,df,F,p\n${reportedLabel},2,0.27,.763\nResidual,27,,\n`);
  });

  for (const format of ['text', 'md', 'html']) {
    it(`refit --format ${format}: the file name and the reported label are shown as escapes`, () => {
      const run = plumbline(['refit', refitName, '--model', 'score ~ group', '--reported', 'reported.csv', '--format', format], folder);
      expect(run.status, run.stderr).toBe(1); // the reported df match, but the label names no model term
      expect(firstForbidden(run.stdout.replace(/\r/g, ''))).toBeNull();
      expect(firstForbidden(run.stderr)).toBeNull();
      if (format !== 'html') expect(run.stdout).toContain('refit\\x1b[2J\\u202e.csv'); // the HTML page names the outcome, not the file
      expect(run.stdout).toContain('Group\\x1b[2J\\x1b]0;pwned\\x07\\u202e');
    });
  }

  it('refit --format docx: the reported label is shown as escapes in the Word document, which stays readable', async () => {
    const output = join(folder, 'refit.docx');
    const run = plumbline(['refit', refitName, '--model', 'score ~ group', '--reported', 'reported.csv', '--format', 'docx', '--output', output], folder);
    expect(run.status, run.stderr).toBe(1);
    const { value } = await mammoth.extractRawText({ path: output });
    expect(firstForbidden(value.replace(/[\r\n\t]/g, ' '))).toBeNull();
    expect(value).toContain('Group\\x1b[2J\\x1b]0;pwned\\x07\\u202e');
  });

  it('refit --format json keeps the label as it is', () => {
    const run = plumbline(['refit', refitName, '--model', 'score ~ group', '--reported', 'reported.csv', '--format', 'json'], folder);
    expect(run.stdout).toContain(JSON.stringify(reportedLabel).slice(1, -1));
  });
});
