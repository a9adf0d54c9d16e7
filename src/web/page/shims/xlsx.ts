/**
 * Stands in for src/refit/xlsx.ts in the page: the XLSX reader takes a file
 * on disk (a file handle, Node's zlib and read-excel-file's Node build), so
 * the page refits CSV, TSV and TXT data itself and sends an XLSX sheet to
 * the server of `plumbline web` (src/web/page/refit.ts). Nothing in the
 * page calls this; if something did, it says so plainly.
 */
export function readXlsxSheet(_path: string, file: string): Promise<never> {
  return Promise.reject(new Error(`${file}: XLSX sheets are not read in the page; save the sheet as CSV, or use plumbline web or plumbline refit`));
}
