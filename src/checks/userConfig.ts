import { readFileSync } from 'node:fs';
import { z } from 'zod';
import { severitySchema } from './catalogue.js';

/**
 * The user's settings file (plumbline.config.json by convention):
 * {
 *   "alpha": 0.05,
 *   "rules": {
 *     "halved-p": "off",
 *     "cohens-d-mismatch": "note",
 *     "halved-p": { "severity": "fail", "options": { "statementDistance": 500 } }
 *   }
 * }
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

export const userConfigSchema = z
  .object({
    $schema: z.string().optional(),
    alpha: z.number().gt(0).lt(1).optional(),
    rules: z.record(z.string(), ruleSettingSchema).optional(),
  })
  .strict();

export type UserConfig = z.infer<typeof userConfigSchema>;

export class ConfigError extends Error {}

export function describeIssues(source: string, issues: readonly z.core.$ZodIssue[]): string {
  return issues.map((issue) => `${source}: ${issue.path.length ? issue.path.join('.') : '(top level)'}: ${issue.message}`).join('\n');
}

/** Reads a settings file and validates it; a missing or malformed file is a ConfigError naming it. */
export function readUserConfigFile(path: string): UserConfig {
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(path, 'utf8'));
  } catch (error) {
    const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'file not found' : `not valid JSON (${(error as Error).message})`;
    throw new ConfigError(`${path}: ${reason}`);
  }
  const parsed = userConfigSchema.safeParse(raw);
  if (!parsed.success) throw new ConfigError(describeIssues(path, parsed.error.issues));
  return parsed.data;
}

