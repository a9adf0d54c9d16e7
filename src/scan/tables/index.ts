/** Table reading: finds tables in text without markup and turns the rows of test tables into reported results. */
export { findTextTables } from './findTextTables.js';
export { readTableResults, readTables, type RowCompletion, type UnreadTable, type UnreadReason } from './readTableResults.js';
export { findUnrecognisedTables } from './unfound.js';
