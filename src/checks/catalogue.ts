import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';

export const severitySchema = z.enum(['fail', 'warn', 'note']);

/** One entry of the declarative rules catalogue (rules/<id>.json). */
export const ruleEntrySchema = z
  .object({
    id: z.string().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'ids are lower-case words joined by hyphens'),
    title: z.string().min(10),
    defaultSeverity: severitySchema,
    appliesTo: z.array(z.enum(['F', 't', 'chi2', 'r', 'z'])).min(1),
    options: z.record(z.string(), z.unknown()),
    rationale: z.string().min(40),
    sources: z.array(z.string().min(10)).min(1),
  })
  .strict();

export type RuleEntry = z.infer<typeof ruleEntrySchema>;

/** The folder holding the catalogue, found relative to this module in both src/ and dist/src/. */
export function defaultRulesDirectory(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  const candidates = [join(here, '..', '..', 'rules'), join(here, '..', '..', '..', 'rules')];
  for (const candidate of candidates) {
    try {
      if (readdirSync(candidate).some((name) => name.endsWith('.json'))) return candidate;
    } catch {
      // not this one
    }
  }
  throw new Error(`rules catalogue not found (looked in ${candidates.join(', ')})`);
}

import { CatalogueError } from './errors.js';

export { CatalogueError };

/** Reads and validates every rules/<id>.json; the file name must equal the id. */
export function loadCatalogue(directory = defaultRulesDirectory()): RuleEntry[] {
  const files = readdirSync(directory)
    .filter((name) => name.endsWith('.json'))
    .sort();
  return files.map((file) => {
    const path = join(directory, file);
    let raw: unknown;
    try {
      raw = JSON.parse(readFileSync(path, 'utf8'));
    } catch (error) {
      throw new CatalogueError(`${path}: not valid JSON (${(error as Error).message})`);
    }
    const parsed = ruleEntrySchema.safeParse(raw);
    if (!parsed.success) {
      const problems = parsed.error.issues.map((issue) => `${issue.path.join('.') || '(top)'}: ${issue.message}`);
      throw new CatalogueError(`${path}: invalid rule entry: ${problems.join('; ')}`);
    }
    if (`${parsed.data.id}.json` !== file) {
      throw new CatalogueError(`${path}: id "${parsed.data.id}" does not match the file name`);
    }
    return parsed.data;
  });
}
