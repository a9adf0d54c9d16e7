import { z } from 'zod';
import { reportSchema } from './model.js';
import { CSV_COLUMNS } from './csv.js';

/** The JSON Schema of the JSON report, generated from the zod model (never edited by hand). */
export function reportJsonSchema(): Record<string, unknown> {
  return {
    ...z.toJSONSchema(reportSchema, { target: 'draft-2020-12' }),
    title: 'plumbline audit report',
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
