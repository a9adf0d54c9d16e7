/** Table reading: finds tables in text without markup and turns the rows of test tables into reported results. */
export { findTextTables } from './findTextTables.js';
export { readTableResults } from './readTableResults.js';
