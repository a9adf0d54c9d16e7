import { z } from 'zod';
import { reportSchema } from './model.js';

/** The JSON Schema of the JSON report, generated from the zod model (never edited by hand). */
export function reportJsonSchema(): Record<string, unknown> {
  return {
    ...z.toJSONSchema(reportSchema, { target: 'draft-2020-12' }),
    title: 'plumbline audit report',
  };
}
