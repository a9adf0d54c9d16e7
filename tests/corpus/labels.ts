/**
 * The labelled corpus (tests/corpus/labelled/): each excerpt with its labels.
 * Shared by the text test (labelled.test.ts) and the other-formats test
 * (labelled-formats.test.ts).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const LABELLED_DIRECTORY = join(dirname(fileURLToPath(import.meta.url)), 'labelled');

export type Kind = 'F' | 't' | 'chi2' | 'r' | 'z';
export type Cmp = '=' | '<' | '>' | '<=' | '>=';

export interface LabelledResult {
  line: number;
  kind: Kind;
  df: number[];
  value: number;
  valueComparator: Cmp;
  p: { comparator: Cmp; value: number } | null;
  notSignificant: boolean;
  effects: { kind: string; value: number }[];
  consistent: boolean;
}

export interface Labels {
  description: string;
  results: LabelledResult[];
  lookalikes: { line: number; text: string }[];
}

export interface Excerpt {
  /** File name with extension ("apa_social_priming.txt"). */
  file: string;
  /** File name without extension, as the other formats are named. */
  name: string;
  text: string;
  lines: string[];
  labels: Labels;
}

export function loadLabelledCorpus(): Excerpt[] {
  return readdirSync(LABELLED_DIRECTORY)
    .filter((n) => /\.(txt|md)$/.test(n))
    .sort()
    .map((file) => {
      const name = file.replace(/\.(txt|md)$/, '');
      const text = readFileSync(join(LABELLED_DIRECTORY, file), 'utf8');
      const labels = JSON.parse(readFileSync(join(LABELLED_DIRECTORY, `${name}.labels.json`), 'utf8')) as Labels;
      return { file, name, text, lines: text.split('\n'), labels };
    });
}
