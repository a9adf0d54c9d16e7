import { z } from 'zod';
import type { CheckModule, FindingDraft } from '../types.js';
import type { DescriptiveSet, FactorialCellSet, IntegerScaleStatement, ReportedNumber } from '../../scan/types.js';
import { describeStatistic } from '../describe.js';
import { grimmerTest, grimTest } from '../../stats/grim.js';
import { groupSizeProvenance, groupSizeSeverityCap } from '../groupSizes.js';

const optionsSchema = z
  .object({
    /** Treat every measure with reported group means as whole-number data. */
    integerScales: z.boolean().default(false),
    /** Names of whole-number measures, matched (case-insensitively) against the words naming a measure. */
    integerMeasures: z.array(z.string().min(2)).default([]),
    /** Items averaged per person; overrides what the document says. */
    items: z.number().int().min(1).max(1000).optional(),
    /** Check SDs too (GRIMMER), not only means (GRIM). */
    checkSds: z.boolean().default(true),
  })
  .strict();

type Options = z.infer<typeof optionsSchema>;

/** Why the measure is taken as whole-number data, or null when nothing says so. */
function integerReason(set: { integerScale: IntegerScaleStatement | null; measure: string }, labels: readonly string[], options: Options): string | null {
  if (set.integerScale) return `the document says "${set.integerScale.text}"`;
  if (options.integerScales) return 'the settings declare all measures whole-number ("integerScales": true)';
  const words = [set.measure, ...labels].join(' ').toLowerCase();
  const named = options.integerMeasures.find((name) => words.includes(name.toLowerCase()));
  return named === undefined ? null : `the settings list "${named}" as a whole-number measure`;
}

/** GRIM and GRIMMER on the group statistics of a test, where the measure is declared integer-valued. */
export const integerDataGranularity: CheckModule<Options> = {
  id: 'integer-data-granularity',
  appliesTo: ['F', 't'],
  optionsSchema,
  messages: {
    'printed-mean':
      'The mean M = {mean} (n = {n}) of {group} printed {where} cannot come from whole-number scores: with {items} item(s) per person, means of {n} people move in steps of 1/{steps}; the nearest possible means are {nearest} (GRIM; {reason}). (Listed at this result, the first after the values{linked}.)',
    'printed-sd':
      'The SD = {sd} (M = {mean}, n = {n}) of {group} printed {where} cannot come from whole-number scores with {items} item(s) per person; the nearest possible SDs are {nearest} (GRIMMER; {reason}). (Listed at this result, the first after the values{linked}.)',
    mean:
      'The mean M = {mean} (n = {n}) reported with {statistic} cannot come from whole-number scores: with {items} item(s) per person, means of {n} people move in steps of 1/{steps}; the nearest possible means are {nearest} (GRIM; {reason}).{provenance}',
    sd: 'The SD = {sd} (M = {mean}, n = {n}) reported with {statistic} cannot come from whole-number scores with {items} item(s) per person; the nearest possible SDs are {nearest} (GRIMMER; {reason}).{provenance}',
  },
  run(result, context) {
    const drafts = [...hostedDrafts(context.hostedSets?.descriptives ?? [], context.hostedSets?.cells ?? [], context.options)];
    const set = result.descriptives;
    if (!set) return drafts;
    // A set shared by several tests is checked once, at its first test.
    if (context.documentIndex.descriptivesSeenBefore(set, context.index)) return drafts;
    const reason = integerReason(set, set.groups.map((group) => group.label ?? ''), context.options);
    if (reason === null) return drafts;
    const items = context.options.items ?? set.integerScale?.items ?? 1;
    for (const group of set.groups) {
      if (group.n === null) continue;
      const common = { statistic: describeStatistic(result), mean: group.mean.text, n: group.n, items, reason, provenance: groupSizeProvenance([group]) };
      // An n from a per-group statement rather than printed with the group is a guess: the severity says so.
      const cap = groupSizeSeverityCap([group]);
      const capped = cap ? { severityAtMost: cap } : {};
      const grim = grimTest(group.mean, group.n, items);
      if (grim.informative && !grim.possible) {
        drafts.push({ messageId: 'mean', data: { ...common, steps: group.n * items, nearest: grim.nearest.join(' and ') }, ...capped });
        continue;
      }
      if (!context.options.checkSds || group.sd === null) continue;
      const grimmer = grimmerTest(group.mean, group.sd, group.n, items);
      if (grimmer.informative && !grimmer.possible) {
        drafts.push({ messageId: 'sd', data: { ...common, sd: group.sd.text, nearest: grimmer.nearest.join(' and ') }, ...capped });
      }
    }
    return drafts;
  },
};

interface PrintedGroup {
  label: string;
  mean: ReportedNumber;
  sd: ReportedNumber | null;
  n: number;
}

/** GRIM and GRIMMER on one set's groups (or cells), printed where `where` says. */
function granularityDrafts(groups: readonly PrintedGroup[], where: string, linked: string, reason: string, items: number, options: Options): FindingDraft[] {
  const drafts: FindingDraft[] = [];
  for (const group of groups) {
    const common = { group: group.label, where, linked, mean: group.mean.text, n: group.n, items, reason };
    const grim = grimTest(group.mean, group.n, items);
    if (grim.informative && !grim.possible) {
      drafts.push({ messageId: 'printed-mean', data: { ...common, steps: group.n * items, nearest: grim.nearest.join(' and ') } });
      continue;
    }
    if (!options.checkSds || group.sd === null) continue;
    const grimmer = grimmerTest(group.mean, group.sd, group.n, items);
    if (grimmer.informative && !grimmer.possible) drafts.push({ messageId: 'printed-sd', data: { ...common, sd: group.sd.text, nearest: grimmer.nearest.join(' and ') } });
  }
  return drafts;
}

/** Where a set is printed, for a message. */
function placeOf(set: { tableIndex: number | null }, tableNumber: string | null): string {
  return set.tableIndex === null ? 'in the text' : tableNumber !== null ? `in Table ${tableNumber}` : 'in a table';
}

/**
 * GRIM and GRIMMER on the sets this result hosts (CheckContext.hostedSets): group statistics linked to no test,
 * and factorial cell sets, where the measure is declared whole-number. Sizes must be printed with the values
 * (a group's own n, a table's n column or its note's n per cell): sizes from elsewhere are no ground for GRIM here.
 */
function hostedDrafts(descriptives: readonly DescriptiveSet[], cells: readonly FactorialCellSet[], options: Options): FindingDraft[] {
  const drafts: FindingDraft[] = [];
  for (const set of descriptives) {
    const labels = set.groups.map((group) => group.label ?? '');
    const reason = integerReason(set, labels, options);
    if (reason === null) continue;
    const groups = set.groups
      .filter((group) => group.n !== null && (group.nSource === 'group' || group.nSource === 'paragraph'))
      .map((group, index) => ({ label: group.label ?? `group ${index + 1}`, mean: group.mean, sd: group.sd, n: group.n! }));
    const tableNumber = /\bTable\s+([A-Z]?\d{1,3}[A-Za-z]?)/.exec(set.measure)?.[1] ?? null;
    drafts.push(...granularityDrafts(groups, placeOf(set, tableNumber), ', which no test is linked to', reason, options.items ?? set.integerScale?.items ?? 1, options));
  }
  for (const set of cells) {
    const reason = integerReason(set, set.levels.flat(), options);
    if (reason === null || set.nSource === null) continue;
    const groups = set.cells.map((cell) => ({ label: `the ${cell.levels.join(' / ')} cell`, mean: cell.mean, sd: cell.sd, n: cell.n! }));
    drafts.push(...granularityDrafts(groups, placeOf(set, set.tableNumber), ' or the first test of the design', reason, options.items ?? set.integerScale?.items ?? 1, options));
  }
  return drafts;
}
