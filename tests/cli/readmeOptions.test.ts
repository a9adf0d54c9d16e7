import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import MarkdownIt from 'markdown-it';
import type Token from 'markdown-it/lib/token.mjs';
import { describe, expect, it } from 'vitest';
import { builtCliExists, plumbline } from '../batch/cli.js';

/**
 * The README's option lists against each command's own --help, in the built
 * command, both ways: an option the README promises must exist, and an
 * option a command takes must be in the README (or listed below, with the
 * reason it is left out). The README lists options in three places, read
 * with markdown-it:
 * - a table under a paragraph "Options of `scan` and `merge`..." gives its
 *   first column's options to each command named in the paragraph;
 * - the commands table gives the options in a command's first cell
 *   ("`plumbline rules [--format json]`") to that command;
 * - the section "Refit: ..." gives every option written in it (its example
 *   and its "Other options") to `refit`.
 */

const OPTION = /--[a-z][a-z-]*/g;

/** Options a command's help shows that the README leaves out on purpose, with the reason. */
const NOT_IN_README: Record<string, string> = {
  '--help': "commander's own help, on every command; the README says how to use each command instead",
  '--version': "commander's own, on the program only (plumbline --version)",
};

const readme = readFileSync(join(process.cwd(), 'README.md'), 'utf8');
const tokens = new MarkdownIt().parse(readme, {});

function optionsIn(text: string): string[] {
  return text.match(OPTION) ?? [];
}

function add(map: Map<string, Set<string>>, command: string, options: readonly string[]): void {
  const set = map.get(command) ?? new Set<string>();
  for (const option of options) set.add(option);
  map.set(command, set);
}

/** The rows of the table that opens at `open`: each row's cells as their inline Markdown source. */
function tableRows(open: number): string[][] {
  const rows: string[][] = [];
  for (let index = open; index < tokens.length && tokens[index]!.type !== 'table_close'; index += 1) {
    const token = tokens[index]!;
    if (token.type === 'tr_open') rows.push([]);
    else if (token.type === 'inline') rows[rows.length - 1]!.push(token.content);
  }
  return rows;
}

/** The inline text of the paragraph that ends just before token `index`, or null. */
function paragraphBefore(index: number): string | null {
  const close = tokens[index - 1];
  const inline = tokens[index - 2];
  return close?.type === 'paragraph_close' && inline?.type === 'inline' ? inline.content : null;
}

/** The command → options the README lists (see the comment at the top). */
function readmeOptions(): Map<string, Set<string>> {
  const byCommand = new Map<string, Set<string>>();
  tokens.forEach((token, index) => {
    if (token.type !== 'table_open') return;
    const [header, ...body] = tableRows(index);
    const lead = paragraphBefore(index);
    const optionsOf = lead === null ? null : /^Options of (.+?)(?: for [^`]*)?:$/.exec(lead);
    if (optionsOf) {
      const commands = [...optionsOf[1]!.matchAll(/`([a-z]+)`/g)].map((match) => match[1]!);
      for (const row of body) for (const command of commands) add(byCommand, command, optionsIn(row[0]!));
    } else if (header?.[0] === 'command') {
      for (const row of body) {
        const command = /^`plumbline ([a-z]+)/.exec(row[0]!)?.[1];
        if (command) add(byCommand, command, optionsIn(row[0]!));
      }
    }
  });
  add(byCommand, 'refit', sectionText(/^Refit:/).flatMap(optionsIn));
  return byCommand;
}

/** The inline text and code of the level-2 section whose title matches. */
function sectionText(title: RegExp): string[] {
  const texts: string[] = [];
  let inside = false;
  tokens.forEach((token: Token, index) => {
    if (token.type === 'heading_open' && (token.tag === 'h1' || token.tag === 'h2')) inside = title.test(tokens[index + 1]!.content);
    else if (inside && (token.type === 'inline' || token.type === 'fence')) texts.push(token.content);
  });
  return texts;
}

/** Options in a --help output: the lines of its "Options:" block that start with an option. */
function helpOptions(help: string): string[] {
  const block = help.split(/^Options:$/m)[1]?.split(/^\S.*:$/m)[0] ?? '';
  return [...block.matchAll(/^ {2}(?:-[A-Za-z], )?(--[a-z][a-z-]*)/gm)].map((match) => match[1]!);
}

function helpOf(args: string[]): string {
  const run = plumbline([...args, '--help'], process.cwd());
  expect(run.status, run.stderr).toBe(0);
  return run.stdout;
}

describe('the README and the commands\' --help agree on the options', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  const listed = readmeOptions();
  const commands = (() => {
    const help = plumbline(['--help'], process.cwd()).stdout;
    const block = help.split(/^Commands:$/m)[1] ?? '';
    return [...block.matchAll(/^ {2}([a-z]+) /gm)].map((match) => match[1]!).filter((name) => name !== 'help');
  })();

  it('reads the lists it compares: every command, and options from each kind of list', () => {
    expect(commands).toEqual(['check', 'scan', 'merge', 'rules', 'refit', 'cells', 'web']);
    expect([...listed.keys()].sort()).toEqual([...commands].sort());
    expect(listed.get('check')).toContain('--fail-on'); // the table of check, scan and merge
    expect(listed.get('scan')).toContain('--pdf-engine'); // the table of scan alone
    expect(listed.get('merge')).toContain('--all'); // the table of scan and merge
    expect(listed.get('rules')).toContain('--format'); // the commands table
    expect(listed.get('refit')).toContain('--max-columns'); // the Refit section
    expect(listed.get('cells')).toContain('--cell-n'); // the table of cells alone
    expect(listed.get('web')).toContain('--no-open'); // the commands table
  });

  it('parses a --help: its options, not the words of their descriptions', () => {
    const options = helpOptions(helpOf(['scan']));
    expect(options).toContain('--no-cache');
    expect(options).toContain('--help');
    expect(options).not.toContain('--jsonl file'); // a wrapped description never reads as an option
    expect(new Set(options).size).toBe(options.length);
  });

  for (const command of ['check', 'scan', 'merge', 'rules', 'refit', 'cells', 'web']) {
    it(`${command}: every option the README lists exists, and every option it takes is in the README`, () => {
      const taken = new Set(helpOptions(helpOf([command])));
      const promised = listed.get(command) ?? new Set<string>();
      const missingFromCommand = [...promised].filter((option) => !taken.has(option));
      const missingFromReadme = [...taken].filter((option) => !promised.has(option) && !(option in NOT_IN_README));
      expect(missingFromCommand, `the README lists these for ${command}, which does not take them`).toEqual([]);
      expect(missingFromReadme, `${command} takes these, which the README does not list`).toEqual([]);
    });
  }

  it('every option written anywhere in the README is an option of some command', () => {
    const taken = new Set(commands.flatMap((command) => helpOptions(helpOf([command]))));
    const unknown = [...new Set(optionsIn(readme))].filter((option) => !taken.has(option));
    expect(unknown).toEqual([]);
  });

  it('the program-level options are commander\'s own, and listed above as left out', () => {
    expect(helpOptions(helpOf([])).filter((option) => !(option in NOT_IN_README))).toEqual([]);
  });
});
