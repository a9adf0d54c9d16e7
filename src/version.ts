import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
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

let cachedBuild: string | null = null;

/**
 * Identifies the code that produced an audit: the version plus the size and
 * modification time of every module of this build. Part of the cache key, so
 * a rebuilt plumbline (a developer's change, or a reinstall) never reuses
 * audits made by other code, even under the same version number.
 */
export function buildFingerprint(): string {
  if (cachedBuild) return cachedBuild;
  const sourceRoot = dirname(fileURLToPath(import.meta.url));
  const parts: string[] = [toolVersion()];
  const walk = (folder: string): void => {
    for (const entry of readdirSync(folder, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : 1))) {
      const path = join(folder, entry.name);
      if (entry.isDirectory()) walk(path);
      else if (/\.(?:js|ts)$/.test(entry.name)) {
        const info = statSync(path);
        parts.push(`${path.slice(sourceRoot.length)}:${info.size}:${info.mtimeMs}`);
      }
    }
  };
  walk(sourceRoot);
  for (const rules of [join(sourceRoot, '..', 'rules'), join(sourceRoot, '..', '..', 'rules')]) {
    try {
      for (const name of readdirSync(rules).sort()) {
        const info = statSync(join(rules, name));
        parts.push(`rules/${name}:${info.size}:${info.mtimeMs}`);
      }
      break;
    } catch {
      // not this layout
    }
  }
  return (cachedBuild = createHash('sha256').update(parts.join('\n')).digest('hex'));
}
