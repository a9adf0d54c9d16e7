/**
 * Stands in for the Node modules whose code paths the page never takes
 * (reading files, spawning pdftotext, worker threads, the cache). The
 * modules that import them are bundled for their pure functions; calling one
 * of these says plainly that it is not available in the page.
 */
function unavailable(name: string): () => never {
  return () => {
    throw new Error(`${name} is not available in the page`);
  };
}

export const readFileSync = unavailable('readFileSync');
export const readdirSync = unavailable('readdirSync');
export const statSync = unavailable('statSync');
export const openSync = unavailable('openSync');
export const closeSync = unavailable('closeSync');
export const fstatSync = unavailable('fstatSync');
export const readSync = unavailable('readSync');
export const accessSync = unavailable('accessSync');
export const existsSync = (): boolean => false;
export const constants = { X_OK: 1, R_OK: 4, O_RDONLY: 0, O_NONBLOCK: 2048 };
export const open = unavailable('open');
export const readFile = unavailable('readFile');
export const writeFile = unavailable('writeFile');
export const mkdir = unavailable('mkdir');
export const stat = unavailable('stat');
export const lstat = unavailable('lstat');
export const readlink = unavailable('readlink');
export const realpath = unavailable('realpath');
export const spawn = unavailable('spawn');
export const createInflateRaw = unavailable('createInflateRaw');
export const inflateRawSync = unavailable('inflateRawSync');
export const inflateRaw = unavailable('inflateRaw');
// The zip walker checks Info-ZIP Unicode names with zlib's crc32; the page's XLSX reader walks zips too (src/refit/xlsxBytes.ts).
export { crc32 } from '../../../refit/zipParts.js';
export const createCipheriv = unavailable('createCipheriv');
export const createDecipheriv = unavailable('createDecipheriv');
/** A path that names no file: the modules that find their files from it (the version, the catalogue) then fall back or are given what they need. */
export const fileURLToPath = (): string => '/plumbline-page/module.js';
export const promisify = unavailable('promisify');
export const isUtf8 = (bytes: Uint8Array): boolean => {
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    return true;
  } catch {
    return false;
  }
};
export class Readable {}
export class Transform {}
export const delimiter = ':';
export const sep = '/';
export function join(...parts: string[]): string {
  return parts.join('/');
}
export function dirname(path: string): string {
  const at = path.lastIndexOf('/');
  return at <= 0 ? '.' : path.slice(0, at);
}
export function basename(path: string, suffix?: string): string {
  const name = path.slice(path.lastIndexOf('/') + 1);
  return suffix !== undefined && name.endsWith(suffix) ? name.slice(0, -suffix.length) : name;
}
export function extname(path: string): string {
  const name = basename(path);
  const dot = name.lastIndexOf('.');
  return dot <= 0 ? '' : name.slice(dot);
}
export default {};
