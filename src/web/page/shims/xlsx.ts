/**
 * Stands in for src/refit/xlsx.ts in the page: that reader takes a path (a
 * file handle, Node's zlib and read-excel-file's Node build). The page
 * reads an XLSX file's bytes instead (src/refit/xlsxBytes.ts, the same
 * limits and messages), so nothing in the page calls this; if something
 * did, it says so plainly.
 */
export function readXlsxSheet(_path: string, file: string): Promise<never> {
  return Promise.reject(new Error(`${file}: XLSX files are read in the page from their bytes, not from a path`));
}
