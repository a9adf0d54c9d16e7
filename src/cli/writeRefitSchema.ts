import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { refitJsonSchema } from '../refit/output.js';

/** Writes the refit JSON output's JSON Schema (generated from the zod model) to the given path. */
const target = process.argv[2] ?? 'schema/refit.schema.json';
mkdirSync(dirname(target), { recursive: true });
writeFileSync(target, `${JSON.stringify(refitJsonSchema(), null, 2)}\n`);
process.stdout.write(`wrote ${target}\n`);
