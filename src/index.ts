/**
 * Library entry. The command line (src/cli) is a thin shell over these:
 * read a document, scan and check it, build and format a report; refit a
 * model from raw data.
 */
export { auditText, auditDocument } from './audit.js';
export { buildReport, summarise, unreadableDocument } from './report/build.js';
export { resolveConfig, loadConfigFile, ConfigError, type ResolvedConfig, type UserConfig } from './checks/config.js';
export { loadCatalogue, type RuleEntry } from './checks/catalogue.js';
export { checkResults } from './checks/engine.js';
export { scanText } from './scan/scan.js';
export { scanDocument } from './scan/scanDocument.js';
export type * from './scan/types.js';
export { readDocument, type ReadOptions } from './documents/read.js';
export type { DocumentText, ReadOutcome } from './documents/types.js';
export { auditFile } from './batch/auditFile.js';
export { formatConsole } from './report/console.js';
export { formatJson } from './report/json.js';
export { formatHtml } from './report/html.js';
export { formatCsv, CSV_COLUMNS } from './report/csv.js';
export { reportJsonSchema, csvRowJsonSchema } from './report/jsonSchema.js';
export { formatMarkdown } from './report/markdown.js';
export { reportSchema, type Report } from './report/model.js';
export { documentFromJson, documentRecordSchema, readJsonReport, reportRecordSchema } from './report/jsonLayoutSchema.js';
export { documentRecordOf, JSON_LAYOUT } from './report/jsonLayout.js';
export * as statistics from './stats/index.js';
export * as refit from './refit/index.js';
