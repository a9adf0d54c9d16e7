import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { csvRowJsonSchema, reportJsonSchema } from '../report/jsonSchema.js';

/**
 * Writes the JSON Schemas generated from the code: the JSON report's (from the zod model) to the first path
 * given, one CSV row's (from the CSV columns) to the second.
 */
const targets: [string, Record<string, unknown>][] = [
  [process.argv[2] ?? 'schema/report.schema.json', reportJsonSchema()],
  [process.argv[3] ?? 'schema/report-csv.schema.json', csvRowJsonSchema()],
];
for (const [target, schema] of targets) {
  mkdirSync(dirname(target), { recursive: true });
  writeFileSync(target, `${JSON.stringify(schema, null, 2)}\n`);
  process.stdout.write(`wrote ${target}\n`);
}
