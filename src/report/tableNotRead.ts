import type { TableNotReadOutput } from './model.js';

/**
 * The tag a report puts before a table that was not read in full: a table whose statistics were read as
 * printed but without df is read, only not checked in full, and says so rather than "not read".
 */
export function tableNotReadTag(table: Pick<TableNotReadOutput, 'reason'>): string {
  return table.reason === 'read-without-df' ? 'table read without df' : 'table not read';
}
