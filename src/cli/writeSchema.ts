import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { reportJsonSchema } from '../report/jsonSchema.js';

/** Writes the JSON report's JSON Schema (generated from the zod model) to the given path. */
const target = process.argv[2] ?? 'schema/report.schema.json';
mkdirSync(dirname(target), { recursive: true });
writeFileSync(target, `${JSON.stringify(reportJsonSchema(), null, 2)}\n`);
process.stdout.write(`wrote ${target}\n`);
