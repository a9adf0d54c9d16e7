/**
 * The text of a CSV/TSV file (what the web page has of the file a user
 * chose) is read exactly as the file is: the same table, the same refit,
 * the same error messages. The comparison is with plumbline's own file
 * reader, so each case runs both on the same bytes.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadTable } from '../../src/refit/explain.js';
import { fitModel, RefitError } from '../../src/refit/index.js';
import { refitErrorMessage } from '../../src/refit/run.js';

const folder = mkdtempSync(join(tmpdir(), 'plumbline-text-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const demoCsv = join(process.cwd(), 'corpus-demo', 'refit', 'harbour-walks.csv');

/** Writes `text` as a file and returns both sources. */
function bothSources(name: string, text: string): { path: string; text: { name: string; text: string } } {
  const path = join(folder, name);
  writeFileSync(path, text, 'utf8');
  return { path, text: { name, text } };
}

async function messageOf(promise: Promise<unknown>): Promise<string> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof RefitError) return refitErrorMessage(error);
    throw error;
  }
  throw new Error('expected a RefitError');
}

describe('data given as the text of a CSV/TSV file', () => {
  it('the demo data: the same ANOVA table as the file (harbour-walks.csv)', async () => {
    const text = readFileSync(demoCsv, 'utf8');
    const spec = { model: 'mood ~ route * pace + loneliness', missing: { mood: '99', loneliness: '6-8' } };
    const fromFile = (await fitModel(demoCsv, spec)).anova();
    const fromText = (await fitModel({ name: 'harbour-walks.csv', text }, spec)).anova();
    expect(fromText).toEqual(fromFile);
    expect(fromText.n).toBeGreaterThan(0);
  });

  it('mixed line endings, a lone CR at the end, a byte-order mark and semicolons with decimal commas read as the file reads them', async () => {
    const cases: Array<[string, string]> = [
      ['mixed.csv', 'score,group\r\n1,a\n2,b\r3,a\r\n4,b\n5,a\r6,b\r'],
      ['bom.csv', '\uFEFFscore,group\n1,a\n2,b\n3,a\n4,b\n5,a\n7,b\n'],
      ['comma.csv', 'score;group\n1,5;a\n2,25;b\n3;a\n4,75;b\n5;a\n6,5;b\n'],
      ['tabs.tsv', 'score\tgroup\n1\ta\n2\tb\n3\ta\n4\tb\n5\ta\n6\tb'],
    ];
    for (const [name, content] of cases) {
      const { path, text } = bothSources(name, content);
      const spec = { model: 'score ~ group' };
      expect((await fitModel(text, spec)).anova(), name).toEqual((await fitModel(path, spec)).anova());
      const fromText = await loadTable(text);
      const fromFile = await loadTable(path);
      expect({ ...fromText, rows: [...fromText.rows] }, name).toEqual({ ...fromFile, name: fromText.name, rows: [...fromFile.rows] });
    }
  });

  it('bad data gives the same message, naming the file, the row and the column', async () => {
    const cases: Array<[string, string, string]> = [
      ['ragged.csv', 'score,group\n1,a\n2,b,extra\n3,a\n', 'score ~ group'],
      ['empty.csv', '\n\n', 'score ~ group'],
      ['header-only.csv', 'score,group\n', 'score ~ group'],
      ['unknown.csv', 'score,group\n1,a\n2,b\n', 'score ~ grup'],
      ['words.csv', 'score,group\n1,a\nlots,b\n3,a\n4,b\n', 'score ~ group'],
    ];
    for (const [name, content, model] of cases) {
      const { path, text } = bothSources(name, content);
      const fromFile = await messageOf(fitModel(path, { model }));
      expect(fromFile, name).toContain(name);
      expect(await messageOf(fitModel(text, { model })), name).toBe(fromFile);
    }
  });
});
