/**
 * The rules catalogue in the page. The build (src/web/buildPage.ts) loads
 * this module as rules/*.json, read and validated as the command line
 * loads them; the empty list below is only what the type checker sees.
 */
import type { RuleEntry } from '../../checks/catalogue.js';

const entries: RuleEntry[] = [];
export default entries;
