import { z } from 'zod';
import type { CheckModule, FindingDraft } from '../types.js';
import type { DescriptiveSet } from '../../scan/types.js';
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
function integerReason(set: DescriptiveSet, options: Options): string | null {
  if (set.integerScale) return `the document says "${set.integerScale.text}"`;
  if (options.integerScales) return 'the settings declare all measures whole-number ("integerScales": true)';
  const words = [set.measure, ...set.groups.map((group) => group.label ?? '')].join(' ').toLowerCase();
  const named = options.integerMeasures.find((name) => words.includes(name.toLowerCase()));
  return named === undefined ? null : `the settings list "${named}" as a whole-number measure`;
}

/** GRIM and GRIMMER on the group statistics of a test, where the measure is declared integer-valued. */
export const integerDataGranularity: CheckModule<Options> = {
  id: 'integer-data-granularity',
  appliesTo: ['F', 't'],
  optionsSchema,
  messages: {
    mean:
      'The mean M = {mean} (n = {n}) reported with {statistic} cannot come from whole-number scores: with {items} item(s) per person, means of {n} people move in steps of 1/{steps}; the nearest possible means are {nearest} (GRIM; {reason}).{provenance}',
    sd: 'The SD = {sd} (M = {mean}, n = {n}) reported with {statistic} cannot come from whole-number scores with {items} item(s) per person; the nearest possible SDs are {nearest} (GRIMMER; {reason}).{provenance}',
  },
  run(result, context) {
    const set = result.descriptives;
    if (!set) return [];
    // A set shared by several tests is checked once, at its first test.
    if (context.documentIndex.descriptivesSeenBefore(set, context.index)) return [];
    const reason = integerReason(set, context.options);
    if (reason === null) return [];
    const items = context.options.items ?? set.integerScale?.items ?? 1;
    const drafts: FindingDraft[] = [];
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
