import { loadCatalogue, type RuleEntry } from './catalogue.js';
import { ConfigError, describeIssues, readUserConfigFile, userConfigSchema } from './userConfig.js';

export { ConfigError, readUserConfigFile, userConfigSchema, type UserConfig } from './userConfig.js';
import { checkModules } from './rules/index.js';
import type { CheckModule, Severity } from './types.js';

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

/** Reads and resolves a settings file. */
export function loadConfigFile(path: string): ResolvedConfig {
  return resolveConfig(readUserConfigFile(path), path);
}
