import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { reportJsonSchema } from '../../src/report/jsonSchema.js';

describe('published JSON Schema', () => {
  it('schema/report.schema.json is the one generated from the zod model (run `npm run schema` after changing it)', () => {
    const committed = JSON.parse(readFileSync('schema/report.schema.json', 'utf8'));
    expect(committed).toEqual(JSON.parse(JSON.stringify(reportJsonSchema())));
  });
});
