import { createHash } from 'node:crypto';
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { DocumentOutput } from '../report/model.js';

/**
 * A content-addressed cache of document audits. The key covers everything
 * the audit depends on: the file's bytes, the settings (rules, severities,
 * options, alpha), the reading options (PDF engine) and plumbline's version.
 * A cached audit is reused whatever the file is called now.
 */
export class AuditCache {
  constructor(private readonly directory: string) {}

  static key(content: Buffer, settingsFingerprint: string): string {
    return createHash('sha256').update(settingsFingerprint).update('\0').update(content).digest('hex');
  }

  private pathOf(key: string): string {
    return join(this.directory, key.slice(0, 2), `${key}.json`);
  }

  async get(key: string, path: string): Promise<DocumentOutput | null> {
    try {
      const cached = JSON.parse(await readFile(this.pathOf(key), 'utf8')) as DocumentOutput;
      return { ...cached, path };
    } catch {
      return null; // absent or damaged: audit again
    }
  }

  async set(key: string, document: DocumentOutput): Promise<void> {
    const target = this.pathOf(key);
    await mkdir(join(this.directory, key.slice(0, 2)), { recursive: true });
    // Write then rename, so a concurrent reader never sees half a file.
    const temporary = `${target}.${process.pid}.tmp`;
    await writeFile(temporary, JSON.stringify(document));
    await rename(temporary, target);
  }
}

/** JSON with object keys sorted at every level, so equal settings always give equal text. */
function stableJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/** A stable text of everything besides the file content that changes an audit. */
export function settingsFingerprint(parts: Record<string, unknown>): string {
  return stableJson(parts);
}
