import { z } from 'zod';
import { documentFromRecord, JSON_LAYOUT, summaryFromRecord } from './jsonLayout.js';
import { documentSchema, pDiscrepancySchema, reportSchema, rowImpliesSchema, type DocumentOutput, type Report } from './model.js';
import { VERDICTS } from './verdict.js';

/**
 * The zod schemas of the JSON report's layout (layout 2, written by
 * jsonLayout.ts; the published JSON Schema, schema/report.schema.json, is
 * generated from them by jsonSchema.ts), and the readers of files that
 * check a record against them before reading it into the model.
 */

const comparatorSchema = z.enum(['=', '<', '>', '<=', '>=']);
const severitySchema = z.enum(['fail', 'warn', 'note']);
/** The verdict words are the CSV report's (verdict.ts): the worst severity, or why there is none. */
const verdictSchema = z.enum(VERDICTS);
const spanSchema = z.tuple([z.number().int(), z.number().int()]);
const intervalSchema = z.tuple([z.number(), z.number()]);

export const whereSchema = z.object({
  page: z.number().int().optional().describe('1-based page; left out for formats without pages.'),
  line: z.number().int().describe('1-based line of the first character.'),
  column: z.number().int().describe('1-based column of the first character.'),
  span: spanSchema.describe('Offsets of the first character and just after the last one in the document\'s text (UTF-16 code units, as JavaScript counts).'),
});

const resultWhereSchema = whereSchema.extend({
  in: z.enum(['text', 'table']).describe('"text" for a result read from running text, "table" for one read from a row of a table.'),
  context: spanSchema.describe('Offsets of the text shown around the result (up to about 160 characters each side, cut at word boundaries): its text is in the document\'s `passages`; the part before `span` is the text before the result, the part after it the text after.'),
  alsoAt: z.array(whereSchema).optional().describe('Other places the same result is printed (a table row restated in the text with the same numbers): one result, several places.'),
});

const printedSchema = z.object({
  text: z.string().describe('The result as printed.'),
  test: z.enum(['F', 't', 'chi2', 'r', 'z']).describe('The test statistic, as plumbline tests it.'),
  symbol: z
    .enum(['H', 'rs'])
    .optional()
    .describe('The symbol written, when it is not the test\'s own: "H" for a Kruskal-Wallis result, tested as chi-square; "rs" for Spearman\'s rank correlation, whose p is accepted under the t approximation and under the exact or AS 89 distribution.'),
  df: z.array(z.number()),
  dfFrom: z
    .enum(['sample-size', 'study-sample-size', 'contingency-table', 'levene-two-groups', 'text-beside-table'])
    .optional()
    .describe(
      'Set when the df were not printed but worked out: "sample-size" from the sample size written with the result ("r = .30, p = .004, n = 90": df = 88); "study-sample-size" from the one sample size the document states for the whole study ("N = 214": df = 212 for a correlation), which may not be the sample of this test, so findings about the result are at most warnings; "contingency-table" from the dimensions of a table stated with a chi-square ("a 2 × 3 table": df = 2), findings at most warnings too; "levene-two-groups" for Levene\'s F beside an independent-samples t test in a table row: df = 1 and the pooled t test\'s df (two groups, N − 2); "text-beside-table" for a table value whose df the table, its caption and its notes do not give but a line just above or below the table states ("df = 2, 57"), findings at most warnings.',
    ),
  statistic: z.number().nullable().describe('The printed value of the statistic; null when it could not be read as a number.'),
  comparator: comparatorSchema.default('=').describe('How the statistic was printed ("F < 1"); "=" when left out.'),
  p: z
    .object({
      comparator: comparatorSchema.default('=').describe('"=" when left out.'),
      value: z.number(),
      text: z.string().describe('The p as printed, without its comparator (".021").'),
      fromMarks: z
        .string()
        .optional()
        .describe('Set when no p was printed: the significance marks after the value ("***"), and the p above is the bound the table\'s note gives for them ("*** p < .001").'),
    })
    .optional()
    .describe('The printed p; left out when none was printed.'),
  notSignificant: z.literal(true).optional().describe('Set when the result is described as not significant (the "ns" of a table); left out otherwise.'),
  effects: z
    .array(
      z.object({
        kind: z.string(),
        comparator: comparatorSchema.default('=').describe('"=" when left out.'),
        value: z.number(),
        text: z.string(),
        interval: z
          .object({ level: z.number().nullable(), low: z.number(), high: z.number() })
          .optional()
          .describe('The printed confidence interval; level null when the text does not say it.'),
      }),
    )
    .default([])
    .describe('Printed effect sizes; left out when there are none.'),
});

const recomputedSchema = z.object({
  tails: z.enum(['upper', 'two']),
  p: z.number().optional().describe('p at the printed statistic and df (left out when the statistic was printed as a bound).'),
  pInterval: intervalSchema.optional().describe('Smallest and largest p over the values that round to the printed statistic and df.'),
  partialEtaSquared: z.number().optional().describe('Partial eta squared implied by an F and its df.'),
  partialEtaSquaredInterval: intervalSchema.optional().describe('Its range over the values that round to the printed F and df.'),
  notEvaluable: z.string().optional().describe('Why the result could not be recomputed; left out when it could.'),
});

export const findingRecordSchema = z.object({
  rule: z.string().describe('Id of the rule in the catalogue (plumbline rules).'),
  severity: severitySchema,
  message: z.string(),
  messageId: z.string().describe('Which of the rule\'s messages this is (stable across versions; the message\'s words may change).'),
  changesConclusion: z.literal(true).optional().describe('Set when the discrepancy puts the p on the other side of the alpha in force; left out otherwise.'),
  slip: z.string().optional().describe('A simple slip that reproduces the printed numbers, when one was found.'),
  pDiscrepancy: pDiscrepancySchema,
  rowImplies: rowImpliesSchema,
});

export const resultRecordSchema = z.object({
  where: resultWhereSchema,
  printed: printedSchema,
  recomputed: recomputedSchema,
  verdict: verdictSchema.describe('The worst severity among the findings; "no flag" for a result checked without findings, "not checked" for one that could not be recomputed and has none.'),
  why: z.array(findingRecordSchema).describe('The findings about the result, the reasons for the verdict.'),
});

const tableNotReadRecordSchema = z
  .object({
    where: whereSchema,
    caption: z.string().nullable(),
    reason: z.enum(['no-statistic-column', 'columns-not-recognised', 'layout-not-recognised', 'no-df', 'read-without-df', 'cells-not-placed', 'z-without-p']),
    rowsWithStatistic: z.number().int().describe('Rows of the table that print a statistic (or, for a table of p-values only, a p).'),
    rowsRead: z.number().int().describe('Of those, rows read as results.'),
    message: z.string(),
  })
  .describe('A table that looks like a results table (its header names a test statistic or p) whose results were not all read.');

const passageSchema = z.object({
  at: z.number().int().describe('Offset of the passage\'s first character in the document\'s text.'),
  text: z.string(),
});

export const documentRecordSchema = z.object({
  path: z.string().describe('The document, named relative to the folder the audit was run from.'),
  layout: z.literal(JSON_LAYOUT).describe('The layout of this record (2). Records without the field are layout 1, the layout before this one.'),
  status: z.enum(['checked', 'unreadable']),
  error: z.string().optional().describe('Why an unreadable document could not be read.'),
  format: z.string().optional().describe('The document\'s format (txt, pdf, docx, ...).'),
  alpha: z.number().optional().describe('Alpha used for this document (declared in it, or the default).'),
  noResults: z
    .object({
      reason: z.enum(['empty', 'none-found']).describe('"empty": the document holds no text (only white space, markup or, in a PDF, images); "none-found": it has text but no reported result.'),
      message: z.string(),
    })
    .optional()
    .describe('Set on a document that was read and holds no result, so a report says so rather than showing it as clean.'),
  results: z.array(resultRecordSchema).describe('Each result read, in the order of the text: where, printed, recomputed, verdict, why.'),
  findings: z.array(findingRecordSchema).describe('Findings about the document as a whole.'),
  tablesNotRead: z.array(tableNotReadRecordSchema).describe('Results tables plumbline could not read in full: an audit must not look cleaner than it is.'),
  passages: z
    .array(passageSchema)
    .describe('The document\'s text around its results, in order and without overlap, each stretch written once: the text a result\'s `where.context` span points into.'),
});

export const summaryRecordSchema = z.object({
  documents: z.number().int(),
  checked: z.number().int(),
  unreadable: z.number().int(),
  results: z.number().int(),
  resultsInText: z.number().int().describe('Results read from running text.'),
  resultsInTables: z.number().int().describe('Results read from rows of tables.'),
  tablesNotRead: z.number().int().describe('Results tables that could not be read in full (listed per document).'),
  flaggedResults: z.number().int().describe('Results with at least one finding.'),
  findings: z.object({ fail: z.number().int(), warn: z.number().int(), note: z.number().int() }),
  changesConclusion: z.number().int().describe('Findings whose discrepancy changes the conclusion at the alpha in force.'),
});

export const reportRecordSchema = z.object({
  layout: z.literal(JSON_LAYOUT).describe('The layout of this report (2). Reports without the field are layout 1, the layout before this one.'),
  tool: z.object({ name: z.literal('plumbline'), version: z.string() }),
  caution: z.string(),
  documents: z.array(documentRecordSchema).describe('One record per document; in a JSON Lines report each line is one of these.'),
  summary: summaryRecordSchema,
});

export type ResultRecord = z.input<typeof resultRecordSchema>;
export type DocumentRecord = z.input<typeof documentRecordSchema>;
export type FindingRecord = z.input<typeof findingRecordSchema>;
export type Where = z.input<typeof whereSchema>;
export type SummaryRecord = z.output<typeof summaryRecordSchema>;

export type TableNotReadRecord = z.input<typeof tableNotReadRecordSchema>;

// ---------------------------------------------------------------- reading files

/** What a parsed JSON value holds as a document record. */
export type DocumentReading = { ok: true; document: DocumentOutput } | { ok: false; reason: string };

/**
 * A document record, parsed JSON of either layout, checked and read into the
 * model: layout 2 (this module) or layout 1 (no `layout` field; the model's
 * own shape, model.ts). The reason says what is wrong, for the caller's
 * message naming the file and line.
 */
export function documentFromJson(value: unknown): DocumentReading {
  const layout = typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as { layout?: unknown }).layout : undefined;
  if (layout === undefined) {
    const checked = documentSchema.safeParse(value);
    return checked.success ? { ok: true, document: checked.data } : { ok: false, reason: 'not a plumbline document record' };
  }
  if (layout !== JSON_LAYOUT) return { ok: false, reason: `a document record of layout ${JSON.stringify(layout)}, which this plumbline does not read (it reads layouts 1 and ${JSON_LAYOUT})` };
  const checked = documentRecordSchema.safeParse(value);
  if (!checked.success) return { ok: false, reason: 'not a plumbline document record' };
  const document = documentFromRecord(checked.data);
  return document === null ? { ok: false, reason: 'a plumbline document record whose context spans are not in its passages' } : { ok: true, document };
}

/**
 * A whole JSON report (scan --format json), of either layout, read into the
 * model. Throws an Error saying what is wrong when the text is not one.
 */
export function readJsonReport(text: string): Report {
  const value = JSON.parse(text) as unknown;
  const layout = typeof value === 'object' && value !== null ? (value as { layout?: unknown }).layout : undefined;
  if (layout === undefined) {
    return reportSchema.parse(value);
  }
  const record = reportRecordSchema.parse(value);
  const documents = record.documents.map((document, index) => {
    const read = documentFromRecord(document);
    if (read === null) throw new Error(`document ${index + 1} (${document.path}): its context spans are not in its passages`);
    return read;
  });
  return { tool: record.tool, caution: record.caution, documents, summary: summaryFromRecord(record.summary) };
}
