import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadCatalogue } from '../../src/checks/catalogue.js';
import { ConfigError, loadConfigFile, resolveConfig } from '../../src/checks/config.js';
import { checkModules } from '../../src/checks/rules/index.js';

describe('rules catalogue', () => {
  const catalogue = loadCatalogue();

  it('has an entry, a module and a test file for every rule, with the same id', () => {
    const catalogueIds = catalogue.map((entry) => entry.id).sort();
    expect(Object.keys(checkModules).sort()).toEqual(catalogueIds);
    for (const id of catalogueIds) {
      expect(existsSync(join('src', 'checks', 'rules', `${id}.ts`)), `src/checks/rules/${id}.ts`).toBe(true);
      expect(existsSync(join('tests', 'checks', 'rules', `${id}.test.ts`)), `tests/checks/rules/${id}.test.ts`).toBe(true);
    }
  });

  it('every entry has at least one source and matching kinds and default options', () => {
    for (const entry of catalogue) {
      expect(entry.sources.length, entry.id).toBeGreaterThan(0);
      const module = checkModules[entry.id]!;
      expect([...module.appliesTo].sort(), entry.id).toEqual([...entry.appliesTo].sort());
      // The catalogue's defaults must satisfy the module's own options schema.
      expect(module.optionsSchema.safeParse(entry.options).success, entry.id).toBe(true);
    }
  });
});

describe('settings file', () => {
  it('switches a rule off and changes a severity', () => {
    const config = resolveConfig({ rules: { 'halved-p': 'off', 'cohens-d-mismatch': 'note' } });
    expect(config.rules.find((r) => r.entry.id === 'halved-p')).toBeUndefined();
    expect(config.rules.find((r) => r.entry.id === 'cohens-d-mismatch')?.severity).toBe('note');
  });

  it('names an unknown rule', () => {
    expect(() => resolveConfig({ rules: { 'no-such-rule': 'off' } }, 'my.json')).toThrow(/my\.json: rules: unknown rule id\(s\) no-such-rule/);
  });

  it('names a bad option field', () => {
    expect(() => resolveConfig({ rules: { 'halved-p': { options: { statementDistance: 'far' } } } }, 'my.json')).toThrow(
      /my\.json: rules\.halved-p\.options: statementDistance/,
    );
    expect(() => resolveConfig({ rules: { 'halved-p': { options: { typo: 1 } } } }, 'my.json')).toThrow(ConfigError);
  });

  it('names a bad top-level field and a bad alpha', () => {
    expect(() => resolveConfig({ alfa: 0.05 })).toThrow(/alfa/);
    expect(() => resolveConfig({ alpha: 5 })).toThrow(/alpha/);
  });

  it('reports a file that is not JSON', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-config-'));
    const path = join(dir, 'broken.json');
    writeFileSync(path, '{ "rules": ');
    expect(() => loadConfigFile(path)).toThrow(new RegExp(`${path.replace(/[/\\.]/g, '\\$&')}: not valid JSON`));
    expect(() => loadConfigFile(join(dir, 'missing.json'))).toThrow(/missing\.json: file not found/);
  });
});
