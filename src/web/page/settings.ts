/**
 * The page's settings: alpha, the default tails, rules on and off and the
 * whole-number measures for GRIM. Kept in this browser's local storage
 * only; turned into the same settings object a settings file holds, which
 * resolveConfig checks as it checks a file.
 */
import type { UserConfig } from '../../checks/userConfig.js';

export const SETTINGS_KEY = 'plumbline.page.settings';

export interface PageSettings {
  alpha: number;
  /** 'one': a halved t, z or r p is taken as one-tailed unless the text says otherwise (halved-p's oneTailedByDefault). */
  tails: 'two' | 'one';
  /** Rule ids switched off. */
  rulesOff: string[];
  /** GRIM and GRIMMER on every measure. */
  integerScales: boolean;
  /** Measures named as whole-number scores. */
  integerMeasures: string[];
}

export const defaultSettings: PageSettings = { alpha: 0.05, tails: 'two', rulesOff: [], integerScales: false, integerMeasures: [] };

/** Reads the stored settings; anything missing or malformed takes its default. */
export function loadSettings(storage: Pick<Storage, 'getItem'> | null): PageSettings {
  let raw: unknown = null;
  try {
    raw = JSON.parse(storage?.getItem(SETTINGS_KEY) ?? 'null');
  } catch {
    raw = null;
  }
  if (typeof raw !== 'object' || raw === null) return { ...defaultSettings };
  const stored = raw as Partial<Record<keyof PageSettings, unknown>>;
  const alpha = typeof stored.alpha === 'number' && stored.alpha > 0 && stored.alpha < 1 ? stored.alpha : defaultSettings.alpha;
  const strings = (value: unknown): string[] => (Array.isArray(value) ? value.filter((item): item is string => typeof item === 'string') : []);
  return {
    alpha,
    tails: stored.tails === 'one' ? 'one' : 'two',
    rulesOff: strings(stored.rulesOff),
    integerScales: stored.integerScales === true,
    integerMeasures: strings(stored.integerMeasures).filter((name) => name.trim().length >= 2),
  };
}

export function saveSettings(storage: Pick<Storage, 'setItem'> | null, settings: PageSettings): void {
  try {
    storage?.setItem(SETTINGS_KEY, JSON.stringify(settings));
  } catch {
    // storage full or refused (a private window): the settings still apply to this visit
  }
}

/** The settings as a settings file would hold them. */
export function userConfigOf(settings: PageSettings, knownRules: readonly string[]): UserConfig {
  const rules: NonNullable<UserConfig['rules']> = {};
  for (const id of settings.rulesOff) if (knownRules.includes(id)) rules[id] = 'off';
  if (!settings.rulesOff.includes('halved-p') && settings.tails === 'one') rules['halved-p'] = { options: { oneTailedByDefault: true } };
  if (!settings.rulesOff.includes('integer-data-granularity') && (settings.integerScales || settings.integerMeasures.length > 0)) {
    rules['integer-data-granularity'] = { options: { integerScales: settings.integerScales, integerMeasures: settings.integerMeasures.map((name) => name.trim()) } };
  }
  return { alpha: settings.alpha, rules };
}

/** "errors, knowledge score" -> ["errors", "knowledge score"]. */
export function measuresFromText(text: string): string[] {
  return text
    .split(/[,;\n]/)
    .map((name) => name.trim())
    .filter((name) => name.length >= 2);
}
