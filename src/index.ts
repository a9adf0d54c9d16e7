/** Library entry: scan text, check it, build and format reports. */
export { auditText, buildReport, summarise, unreadableDocument } from './audit.js';
export { resolveConfig, loadConfigFile, ConfigError, type ResolvedConfig, type UserConfig } from './checks/config.js';
export { loadCatalogue, type RuleEntry } from './checks/catalogue.js';
export { checkResults } from './checks/engine.js';
export { scanText } from './scan/scan.js';
export type * from './scan/types.js';
export { readDocument } from './documents/read.js';
export { formatConsole } from './report/console.js';
export { formatJson } from './report/json.js';
export { reportSchema, type Report } from './report/model.js';
