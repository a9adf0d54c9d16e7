import { z } from 'zod';
import type { CheckModule, FindingDraft } from '../types.js';
import { describeStatistic } from '../describe.js';

const optionsSchema = z.object({}).strict();

/** Most characters between two F tests of one ANCOVA whose error df are compared. */
const SAME_ANALYSIS_REACH = 600;

/**
 * The error df of an F of an analysis of covariance against the sample the
 * paragraph prints: with k groups of N in all and c covariates, the error
 * df are N - k - c, at most N - k - 1; a covariate's F shares them with the
 * groups' F.
 */
export const ancovaDfMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'ancova-df-mismatch',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    tooMany:
      '{statistic} is an F of an analysis of covariance, but its error df ({df2}) exceed what {k} groups of N = {n} allow with {covariates}: N - k - c = {expected}.{why} The group statistics are taken to be the sample analysed (an assumption, so this is at most a warning).',
    unequalError:
      '{statistic}, a covariate\'s F, is on error df {df2}, but the groups\' F of the same analysis, {other}, is on {otherDf2}: a covariate and the groups of one ANCOVA are tested against the same error term.',
  },
  run(result, context) {
    const link = result.ancova;
    if (!link || result.df.length !== 2) return [];
    const df2 = result.df[1]!.value;
    const drafts: FindingDraft[] = [];
    const c = link.covariates?.count ?? 1;
    const expected = link.totalN - link.groups - c;
    // Only the groups' F (df1 = k - 1) ties the printed groups to the test; a covariate's F is compared with it below.
    if (link.role === 'groups' && df2 > expected) {
      drafts.push({
        messageId: 'tooMany',
        severityAtMost: 'warn',
        data: {
          statistic: describeStatistic(result),
          df2,
          k: link.groups,
          n: link.totalN,
          covariates: link.covariates === null ? 'at least one covariate' : `${c} covariate${c === 1 ? '' : 's'} ("${link.covariates.text}")`,
          expected,
          why: df2 === link.totalN - link.groups ? ` ${df2} = N - k are the df of the ANOVA without the covariate${c === 1 ? '' : 's'}.` : '',
        },
      });
    }
    if (link.role === 'covariate') {
      // The groups' F of the same analysis: the nearest before it in the paragraph with the ANCOVA link.
      for (let i = context.index - 1; i >= 0; i--) {
        const other = context.results[i]!;
        if (result.start - other.end > SAME_ANALYSIS_REACH) break;
        if (other.ancova?.role !== 'groups' || other.ancova.totalN !== link.totalN) continue;
        const otherDf2 = other.df[1]!.value;
        if (otherDf2 !== df2) {
          drafts.push({ messageId: 'unequalError', severityAtMost: 'warn', data: { statistic: describeStatistic(result), df2, other: describeStatistic(other), otherDf2 } });
        }
        break;
      }
    }
    return drafts;
  },
};
