import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { READ_WITHOUT_WAITING } from '../documents/regularFile.js';
import { summaryOfTallies, tallyOf, type DocumentTally } from '../report/build.js';
import type { DocumentOutput, Summary } from '../report/model.js';
import { forEachJsonLinesRecord, JsonLinesError, type JsonLinesReadOptions } from './jsonLines.js';

/**
 * The records of several JSON Lines files merged as `merge` reports them:
 * the last record of each path (in the order the files are named, then by
 * line) in the order of the paths. Built in two passes so memory does not
 * grow with the documents: the first reads every record once and keeps only
 * where the last one of each path is (file, byte offset, length) and its
 * counts for the summary; the second reads each kept record back from its
 * place, one at a time, in the order of the paths.
 */

/** Where a path's last record is, and what it adds to the summary. */
interface RecordPlace {
  file: number;
  line: number;
  offset: number;
  bytes: number;
  tally: DocumentTally;
}

export interface MergeIndex {
  files: readonly string[];
  /** The paths in report order, each with its last record's place. */
  places: readonly [string, RecordPlace][];
  summary: Summary;
}

/** Reports a file's cut-off last line (which is left out): `onCutOff(file, line)`. */
export type OnCutOff = (file: string, line: number) => void;

/** The first pass: every record read and checked once (jsonLines.ts), only its place and counts kept. */
export async function indexRecords(files: readonly string[], options: JsonLinesReadOptions, onCutOff: OnCutOff): Promise<MergeIndex> {
  const byPath = new Map<string, RecordPlace>();
  for (let file = 0; file < files.length; file++) {
    const { cutOff } = await forEachJsonLinesRecord(
      files[file]!,
      ({ document, line, offset, bytes }) => {
        byPath.set(document.path, { file, line, offset, bytes, tally: tallyOf(document) }); // a later record of a path replaces it
      },
      options,
    );
    if (cutOff) onCutOff(files[file]!, cutOff.line);
  }
  const places = [...byPath].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return { files, places, summary: summaryOfTallies(places.map(([, place]) => place.tally)) };
}

/**
 * The second pass: each path's last record read back from its file, checked
 * again (the file may have changed since the first pass; a record that is
 * no longer there is an error naming the file and line), one at a time.
 */
export function* mergedDocuments<Read extends { path: string } = DocumentOutput>(index: MergeIndex, parseRecord: (text: string) => Read | null): Generator<Read> {
  const descriptors = new Map<number, number>();
  const descriptorOf = (file: number): number => {
    let descriptor = descriptors.get(file);
    if (descriptor === undefined) {
      descriptor = openSync(index.files[file]!, READ_WITHOUT_WAITING);
      descriptors.set(file, descriptor);
      // Read as a regular file in the first pass; a FIFO put in its place since would block.
      if (!fstatSync(descriptor).isFile()) throw changed(index.files[file]!, 'it is no longer a regular file');
    }
    return descriptor;
  };
  try {
    for (const [path, place] of index.places) {
      const bytes = Buffer.alloc(place.bytes);
      const read = readSync(descriptorOf(place.file), bytes, 0, place.bytes, place.offset);
      const document = read === place.bytes ? parseRecord(bytes.toString('utf8')) : null;
      if (document === null || document.path !== path) throw changed(index.files[place.file]!, `line ${place.line} is not the record it was`);
      yield document;
    }
  } finally {
    for (const descriptor of descriptors.values()) closeSync(descriptor);
  }
}

function changed(file: string, what: string): JsonLinesError {
  return new JsonLinesError(`${file}: the file changed while it was merged (${what}); merge it again once nothing writes to it`);
}
