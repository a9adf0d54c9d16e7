import { closeSync, fstatSync, openSync, readFileSync } from 'node:fs';
import { notRegularFileMessage, READ_WITHOUT_WAITING, specialFileKind } from '../documents/regularFile.js';
import { z } from 'zod';
import { severitySchema } from './catalogue.js';
import { limitNames, type Limits } from '../limits.js';

/**
 * The user's settings file (plumbline.config.json by convention):
 * {
 *   "alpha": 0.05,
 *   "rules": {
 *     "halved-p": "off",
 *     "cohens-d-mismatch": "note",
 *     "halved-p": { "severity": "fail", "options": { "statementDistance": 500 } }
 *   },
 *   "limits": { "maxDocumentMb": 500, "maxUnzippedMb": 300 }
 * }
 * "limits" changes the limits of src/limits.ts (document size, DOCX
 * uncompressed size, nesting depth, PDF pages...); unnamed limits keep their defaults.
 */
const ruleSettingSchema = z.union([
  z.literal('off'),
  severitySchema,
  z
    .object({
      enabled: z.boolean().optional(),
      severity: severitySchema.optional(),
      options: z.record(z.string(), z.unknown()).optional(),
    })
    .strict(),
]);

const limitsSchema = z
  .object(Object.fromEntries(limitNames.map((name) => [name, z.number().positive().finite().optional()])) as Record<keyof Limits, z.ZodOptional<z.ZodNumber>>)
  .strict();

export const userConfigSchema = z
  .object({
    $schema: z.string().optional(),
    alpha: z.number().gt(0).lt(1).optional(),
    rules: z.record(z.string(), ruleSettingSchema).optional(),
    limits: limitsSchema.optional(),
  })
  .strict();

export type UserConfig = z.infer<typeof userConfigSchema>;

import { ConfigError } from './errors.js';

export { ConfigError };

export function describeIssues(source: string, issues: readonly z.core.$ZodIssue[]): string {
  return issues.map((issue) => `${source}: ${issue.path.length ? issue.path.join('.') : '(top level)'}: ${issue.message}`).join('\n');
}

const MAX_SETTINGS_BYTES = 1_000_000;

/** Reads a settings file and validates it; a missing or malformed file is a ConfigError naming it. */
export function readUserConfigFile(path: string): UserConfig {
  let raw: unknown;
  try {
    // Opened without waiting and checked on what was opened: a FIFO or a device put in its place after an
    // earlier check is refused here, never read. A settings file is a few hundred bytes; a huge one is a
    // mistake (or hostile), and is not read whole.
    const descriptor = openSync(path, READ_WITHOUT_WAITING);
    try {
      const opened = fstatSync(descriptor);
      const kind = specialFileKind(opened);
      if (kind !== null) throw new ConfigError(`${path}: ${notRegularFileMessage(kind, null)}`);
      if (opened.size > MAX_SETTINGS_BYTES) throw new ConfigError(`${path}: ${opened.size} bytes is too large for a settings file (at most ${MAX_SETTINGS_BYTES} bytes)`);
      raw = JSON.parse(readFileSync(descriptor, 'utf8'));
    } finally {
      closeSync(descriptor);
    }
  } catch (error) {
    if (error instanceof ConfigError) throw error;
    const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'file not found' : `not valid JSON (${(error as Error).message})`;
    throw new ConfigError(`${path}: ${reason}`);
  }
  const parsed = userConfigSchema.safeParse(raw);
  if (!parsed.success) throw new ConfigError(describeIssues(path, parsed.error.issues));
  return parsed.data;
}

