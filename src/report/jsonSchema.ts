import { z } from 'zod';
import { documentRecordSchema, reportRecordSchema } from './jsonLayoutSchema.js';
import { CSV_COLUMNS } from './csv.js';

/** The document record under its own name in the schema's $defs (registered once: ids are global in zod). */
const document = documentRecordSchema.meta({ id: 'document' });

/**
 * The JSON Schema of the JSON report (layout 2), generated from the zod layout (never edited by hand). Fields
 * with a default may be left out of a file ("=" comparators, an empty list of effects), so the schema is the
 * one of the input side. A JSON Lines report's line is `$defs.document`.
 */
export function reportJsonSchema(): Record<string, unknown> {
  const schema = z.toJSONSchema(reportRecordSchema.extend({ documents: z.array(document).describe(reportRecordSchema.shape.documents.description ?? '') }), {
    target: 'draft-2020-12',
    io: 'input',
  });
  return {
    ...schema,
    title: 'plumbline audit report (layout 2)',
    description:
      'The JSON report of plumbline scan --format json and merge --format json. Each line of a JSON Lines report (--format jsonl, --jsonl) is one document record, $defs.document. Results are grouped as a reviewer reads them: where, printed, recomputed, verdict, why; the text around them is written once per document, in passages.',
  };
}

/**
 * The JSON Schema of one row of the CSV report, read as an object keyed by
 * the header's column names, the numeric columns as numbers, the others as
 * text, and empty cells as null. Generated from CSV_COLUMNS; the column
 * order is `x-columns`, the groups a reviewer reads them in `x-groups`.
 */
export function csvRowJsonSchema(): Record<string, unknown> {
  const properties: Record<string, unknown> = {};
  for (const column of CSV_COLUMNS) {
    const values = 'values' in column ? (column.values as readonly string[]) : undefined;
    properties[column.name] = column.numeric
      ? { type: ['number', 'null'], description: `${column.description} Empty (null) when it does not apply.` }
      : values
        ? { type: ['string', 'null'], enum: [...values.filter((v) => v !== ''), null], description: column.description }
        : { type: ['string', 'null'], description: column.description };
  }
  const groups: Record<string, string[]> = {};
  for (const column of CSV_COLUMNS) (groups[column.group] ??= []).push(column.name);
  return {
    $schema: 'https://json-schema.org/draft/2020-12/schema',
    title: 'plumbline audit report, one CSV row',
    description:
      'One row of the CSV report (plumbline scan --format csv), read with its header row: the numeric columns (type number) as numbers, the other columns as text (a df of "210" is the text "210"), empty cells as null. Text cells that a spreadsheet would run as a formula start with a single quote; control characters are written as visible escapes.',
    type: 'object',
    properties,
    required: CSV_COLUMNS.map((column) => column.name),
    additionalProperties: false,
    'x-columns': CSV_COLUMNS.map((column) => column.name),
    'x-groups': groups,
  };
}
