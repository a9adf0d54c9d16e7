import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let cached: string | null = null;

/** The version in package.json, found from both src/ (tests) and dist/src/ (built). */
export function toolVersion(): string {
  if (cached) return cached;
  const here = dirname(fileURLToPath(import.meta.url));
  for (const candidate of [join(here, '..', 'package.json'), join(here, '..', '..', 'package.json')]) {
    try {
      const parsed = JSON.parse(readFileSync(candidate, 'utf8')) as { name?: string; version?: string };
      if (parsed.name === 'plumbline' && parsed.version) return (cached = parsed.version);
    } catch {
      // try the next place
    }
  }
  return (cached = '0.0.0');
}
