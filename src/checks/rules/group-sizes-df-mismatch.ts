import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeStatistic } from '../describe.js';
import { dfInterval } from '../recompute.js';
import { describeGroups, saysWelch } from './group-statistics-test-mismatch.js';
import { groupSizeProvenance, groupSizeSeverityCap } from '../groupSizes.js';

const optionsSchema = z
  .object({
    welchWordDistance: z.number().int().min(0).max(2000).default(300),
  })
  .strict();

/** The error df of an independent t or one-way ANOVA against the group sizes reported with it. */
export const groupSizesDfMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'group-sizes-df-mismatch',
  appliesTo: ['F', 't'],
  optionsSchema,
  messages: {
    student: '{statistic} has error df = {df}, but the {k} groups reported with it ({groups}) total N = {total}, which gives df = {expected} ({rule}).{provenance}',
    welch: '{statistic} has error df = {df}, but for the {k} groups reported with it ({groups}) Welch-corrected df lie between {low} and {high}.{provenance}',
  },
  run(result, context) {
    const set = result.descriptives;
    if (!set) return [];
    const sizes = set.groups.map((group) => group.n);
    if (sizes.some((n) => n === null || n < 2)) return [];
    const ns = sizes as number[];
    const k = ns.length;
    const total = ns.reduce((a, b) => a + b, 0);
    const errorDf = result.kind === 'F' ? result.df[1] : result.df[0];
    if (!errorDf || (result.kind === 'F' && result.df[0]!.value !== k - 1) || (result.kind === 't' && k !== 2)) return [];
    const student = total - k;
    const welchLow = result.kind === 't' ? Math.min(...ns) - 1 : 1;
    const df = dfInterval(errorDf);
    const inStudent = df.low <= student && student <= df.high;
    const inWelch = df.low <= student && df.high >= welchLow;
    const welch = saysWelch(result, context.text, context.options.welchWordDistance);
    if (inStudent || (welch && inWelch)) return [];
    const common = { statistic: describeStatistic(result), df: errorDf.text, k, groups: describeGroups(set), provenance: groupSizeProvenance(set.groups) };
    // Sizes from a per-group statement rather than printed with the groups are a guess: the severity says so.
    const cap = groupSizeSeverityCap(set.groups);
    const capped = cap ? { severityAtMost: cap } : {};
    if (welch) return [{ messageId: 'welch', data: { ...common, low: welchLow, high: student }, ...capped }];
    return [
      {
        messageId: 'student',
        data: { ...common, total, expected: student, rule: result.kind === 't' ? 'n1 + n2 - 2' : `N - ${k} for a one-way ANOVA` },
        ...capped,
      },
    ];
  },
};
