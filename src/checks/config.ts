import { readFileSync } from 'node:fs';
import { z } from 'zod';
import { loadCatalogue, severitySchema, type RuleEntry } from './catalogue.js';
import { checkModules } from './rules/index.js';
import type { CheckModule, Severity } from './types.js';

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

export interface ActiveRule {
  entry: RuleEntry;
  module: CheckModule<any>;
  severity: Severity;
  options: unknown;
}

export interface ResolvedConfig {
  /** Used when the document declares no alpha. */
  defaultAlpha: number;
  rules: ActiveRule[];
  /** Every catalogue entry, active or not (for listing). */
  catalogue: RuleEntry[];
}

export class ConfigError extends Error {}

function describeIssues(source: string, issues: readonly z.core.$ZodIssue[]): string {
  return issues.map((issue) => `${source}: ${issue.path.length ? issue.path.join('.') : '(top level)'}: ${issue.message}`).join('\n');
}

/** Applies a user config to the catalogue; every problem names the source and the field. */
export function resolveConfig(userConfig: unknown = {}, source = 'config', catalogue: RuleEntry[] = loadCatalogue()): ResolvedConfig {
  const parsed = userConfigSchema.safeParse(userConfig);
  if (!parsed.success) throw new ConfigError(describeIssues(source, parsed.error.issues));
  const settings = parsed.data.rules ?? {};
  const known = new Set(catalogue.map((entry) => entry.id));
  const unknown = Object.keys(settings).filter((id) => !known.has(id));
  if (unknown.length > 0) {
    throw new ConfigError(`${source}: rules: unknown rule id(s) ${unknown.join(', ')}; known ids: ${[...known].join(', ')}`);
  }
  const rules: ActiveRule[] = [];
  for (const entry of catalogue) {
    const module = checkModules[entry.id];
    if (!module) throw new ConfigError(`rules/${entry.id}.json has no check module in src/checks/rules/`);
    const setting = settings[entry.id];
    if (setting === 'off') continue;
    const detail = typeof setting === 'object' ? setting : {};
    if (detail.enabled === false) continue;
    const severity = typeof setting === 'string' ? setting : (detail.severity ?? entry.defaultSeverity);
    const options = module.optionsSchema.safeParse({ ...entry.options, ...(detail.options ?? {}) });
    if (!options.success) {
      throw new ConfigError(describeIssues(`${source}: rules.${entry.id}.options`, options.error.issues));
    }
    rules.push({ entry, module, severity, options: options.data });
  }
  return { defaultAlpha: parsed.data.alpha ?? 0.05, rules, catalogue };
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

/** Reads and resolves a settings file. */
export function loadConfigFile(path: string): ResolvedConfig {
  return resolveConfig(readUserConfigFile(path), path);
}
