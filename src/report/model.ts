import { z } from 'zod';

/**
 * The audit's output model. These zod schemas are the single source of the
 * JSON report's shape: the TypeScript types are inferred from them and the
 * published JSON Schema (schema/report.schema.json) is generated from them.
 */

const comparatorSchema = z.enum(['=', '<', '>', '<=', '>=']);
const severitySchema = z.enum(['fail', 'warn', 'note']);

/** How far a printed p is from one that would agree (on a finding of p-value-mismatch). */
export const pDiscrepancySchema = z
  .object({
    size: z
      .enum(['last-digit', 'moderate', 'order-of-magnitude'])
      .describe(
        '"last-digit": the printed p is within one unit of its last printed digit of a p that would agree (a p truncated instead of rounded, rounded the wrong way, a digit off by one); "order-of-magnitude": the printed p and the nearest recomputed p are a factor of 10 or more apart; "moderate": between the two.',
      ),
    factor: z.number().nullable().describe('How many times larger the larger of the printed p and the nearest recomputed p is (at least 1); null when the recomputed p is 0.'),
    truncated: z.boolean().describe('True when the printed p is the recomputed p truncated at its last printed digit instead of rounded.'),
  })
  .optional()
  .describe('Set on a finding about a printed p that does not follow from the statistic and df (p-value-mismatch): how large the discrepancy is.');

/** The F and p a table row's own numbers imply (on a finding of table-arithmetic). */
export const rowImpliesSchema = z
  .object({
    from: z.string().describe('What the F is made of: "SS / df over SS / df of \'Error\'" (each mean square from the row\'s own SS and df), or "MS" where a row prints no SS.'),
    statistic: z.number().describe('F at the printed cells.'),
    statisticLow: z.number().describe('Smallest F over the values that round to the printed cells.'),
    statisticHigh: z.number(),
    p: z.number().nullable().describe('p at that F and the result\'s df; null when the df are not known.'),
    pLow: z.number().nullable().describe('Smallest p over the same values (at statisticHigh).'),
    pHigh: z.number().nullable(),
  })
  .optional()
  .describe('Set on a finding about a row of an ANOVA table that does not add up (table-arithmetic): the F and p the row\'s own numbers imply over its error row, beside the printed F and its p.');

export const findingSchema = z.object({
  rule: z.string().describe('Id of the rule in the catalogue (plumbline rules).'),
  severity: severitySchema,
  crossesAlpha: z.boolean().describe('True when the discrepancy changes the conclusion at the alpha in force.'),
  message: z.string(),
  messageId: z.string(),
  slip: z.string().optional().describe('A simple slip that reproduces the printed numbers, when one was found.'),
  pDiscrepancy: pDiscrepancySchema,
  rowImplies: rowImpliesSchema,
});

export const locationSchema = z.object({
  page: z.number().int().nullable().describe('1-based page; null for formats without pages.'),
  line: z.number().int().describe('1-based line of the first character.'),
  column: z.number().int().describe('1-based column of the first character.'),
  start: z.number().int().describe('Offset of the first character in the document text.'),
  end: z.number().int().describe('Offset just after the last character.'),
});

export const statisticSchema = z.object({
  kind: z.enum(['F', 't', 'chi2', 'r', 'z']),
  symbol: z
    .enum(['H', 'rs'])
    .optional()
    .describe('The symbol written, when it is not the kind\'s own: "H" for a Kruskal-Wallis result, tested as chi-square; "rs" for Spearman\'s rank correlation, whose p is accepted under the t approximation and under the exact or AS 89 distribution.'),
  text: z.string(),
  location: locationSchema,
  surroundings: z
    .object({ before: z.string(), after: z.string() })
    .describe('Up to about 160 characters of the document before and after the result, for showing it in context.'),
  df: z.array(z.number()),
  dfFrom: z
    .enum(['sample-size', 'study-sample-size', 'contingency-table', 'levene-two-groups', 'text-beside-table'])
    .optional()
    .describe(
      'Set when the df were not printed but worked out: "sample-size" from the sample size written with the result ("r = .30, p = .004, n = 90": df = 88); "study-sample-size" from the one sample size the document states for the whole study ("N = 214": df = 212 for a correlation), which may not be the sample of this test, so findings about the result are at most warnings; "contingency-table" from the dimensions of a table stated with a chi-square ("a 2 × 3 table": df = 2), findings at most warnings too; "levene-two-groups" for Levene\'s F beside an independent-samples t test in a table row: df = 1 and the pooled t test\'s df (two groups, N − 2); "text-beside-table" for a table value whose df the table, its caption and its notes do not give but a line just above or below the table states ("df = 2, 57"), findings at most warnings.',
    ),
  value: z.number().nullable(),
  valueComparator: comparatorSchema,
  p: z
    .object({
      comparator: comparatorSchema,
      value: z.number(),
      text: z.string(),
      fromMarks: z
        .string()
        .optional()
        .describe('Set when no p was printed: the significance marks after the value ("***"), and the p above is the bound the table\'s note gives for them ("*** p < .001").'),
    })
    .nullable(),
  notSignificant: z.boolean(),
  effects: z.array(
    z.object({
      kind: z.string(),
      comparator: comparatorSchema,
      value: z.number(),
      text: z.string(),
      interval: z.object({ level: z.number().nullable(), low: z.number(), high: z.number() }).nullable(),
    }),
  ),
  inTable: z.boolean().default(false).describe('True when the result was read from a row of a table, false when from running text.'),
  alsoAt: z
    .array(locationSchema)
    .optional()
    .describe('Other places the same result is printed (a table row restated in the text with the same numbers): one result, several places.'),
  recomputed: z.object({
    evaluable: z.boolean(),
    reason: z.string().nullable(),
    tails: z.enum(['upper', 'two']),
    p: z.number().nullable().describe('p at the printed statistic and df.'),
    pLow: z.number().nullable().describe('Smallest p over the values that round to the printed statistic and df.'),
    pHigh: z.number().nullable(),
    partialEtaSquared: z.number().nullable(),
    partialEtaSquaredLow: z.number().nullable(),
    partialEtaSquaredHigh: z.number().nullable(),
  }),
  findings: z.array(findingSchema),
});

export const tableNotReadSchema = z
  .object({
    location: locationSchema,
    caption: z.string().nullable(),
    reason: z.enum(['no-statistic-column', 'columns-not-recognised', 'layout-not-recognised', 'no-df', 'read-without-df', 'cells-not-placed', 'z-without-p']),
    rowsWithStatistic: z.number().int().describe('Rows of the table that print a statistic (or, for a table of p-values only, a p).'),
    rowsRead: z.number().int().describe('Of those, rows read as results.'),
    message: z.string(),
  })
  .describe('A table that looks like a results table (its header names a test statistic or p) whose results were not all read.');

export const noResultsSchema = z
  .object({
    reason: z.enum(['empty', 'none-found']).describe('"empty": the document holds no text (only white space, markup or, in a PDF, images); "none-found": it has text but no reported result.'),
    message: z.string(),
  })
  .describe('Set on a document that was read and holds no result, so a report says so rather than showing it as clean.');

export const documentSchema = z.object({
  path: z.string(),
  status: z.enum(['checked', 'unreadable']),
  error: z.string().optional(),
  format: z.string().optional(),
  alpha: z.number().optional().describe('Alpha used for this document (declared in it, or the default).'),
  statistics: z.array(statisticSchema),
  findings: z.array(findingSchema).describe('Findings about the document as a whole.'),
  tablesNotRead: z.array(tableNotReadSchema).default([]).describe('Results tables plumbline could not read in full: an audit must not look cleaner than it is.'),
  noResults: noResultsSchema.optional(),
});

export const summarySchema = z.object({
  documents: z.number().int(),
  checked: z.number().int(),
  unreadable: z.number().int(),
  statistics: z.number().int(),
  resultsInText: z.number().int().default(0).describe('Results read from running text.'),
  resultsInTables: z.number().int().default(0).describe('Results read from rows of tables.'),
  tablesNotRead: z.number().int().default(0).describe('Results tables that could not be read in full (listed per document).'),
  flaggedStatistics: z.number().int(),
  findings: z.object({ fail: z.number().int(), warn: z.number().int(), note: z.number().int() }),
  crossesAlpha: z.number().int(),
});

export const reportSchema = z.object({
  tool: z.object({ name: z.literal('plumbline'), version: z.string() }),
  caution: z.string(),
  documents: z.array(documentSchema),
  summary: summarySchema,
});

export type FindingOutput = z.infer<typeof findingSchema>;
export type StatisticOutput = z.infer<typeof statisticSchema>;
export type DocumentOutput = z.infer<typeof documentSchema>;
export type Summary = z.infer<typeof summarySchema>;
export type TableNotReadOutput = z.infer<typeof tableNotReadSchema>;
export type NoResultsOutput = z.infer<typeof noResultsSchema>;
export type Report = z.infer<typeof reportSchema>;

/**
 * A report whose documents are read as they are written (a merge of JSON Lines files too large to hold):
 * the summary is known first, and `documents` gives the documents in order each time it is called.
 */
export interface StreamedReport {
  caution: string;
  summary: Report['summary'];
  documents: () => Iterable<DocumentOutput>;
}

export { CAUTION } from './caution.js';
