/**
 * Builds the page of `plumbline web` into ONE self-contained HTML file,
 * dist/web/plumbline.html: the browser code of src/web/page/ bundled by
 * rolldown (with the readers, scanner, checks and report formatters it
 * imports, pdf.js and mammoth) and inlined with its style, so it works
 * offline when opened from disk. `npm run build` runs it after tsc.
 *
 * The Node modules that the bundled code imports for paths the page never
 * takes (files, pdftotext, worker threads) are replaced by
 * src/web/page/shims/unavailable.ts; node:crypto by shims/crypto.ts (the
 * HTML report's policy hashes); the refit's XLSX reader of a path by
 * shims/xlsx.ts (the page reads the chosen XLSX file's bytes with
 * src/refit/xlsxBytes.ts, within the same limits). The rules catalogue is read and validated
 * here, as the command line loads it, and written into the bundle.
 *
 * Policy: default-src 'none'; the one inline script and the one inline style
 * are allowed by their SHA-256 hashes (no 'unsafe-inline', no eval);
 * connect-src 'self' is left from when the page served by `plumbline web`
 * asked its own server to refit an XLSX sheet; every refit now runs in the
 * page, and the server's /api/refit stays only for callers of its own.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadCatalogue } from '../checks/catalogue.js';
import { CAUTION } from '../report/caution.js';
import { toolVersion } from '../version.js';

/** The repository's root, from src/web (tests) or dist/src/web (built). */
export function repositoryRoot(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  const up = here.includes(`${join('dist', 'src', 'web')}`) ? ['..', '..', '..'] : ['..', '..'];
  return resolve(here, ...up);
}

export const PAGE_FILE = join('dist', 'web', 'plumbline.html');
export const POLICY_FILE = join('dist', 'web', 'plumbline.csp');

function sha256Base64(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('base64');
}

/** The page's Content-Security-Policy for its script and style: nothing from outside the page. */
export function pagePolicy(script: string, style: string): string {
  return [
    "default-src 'none'",
    `script-src 'sha256-${sha256Base64(script)}'`,
    `style-src 'sha256-${sha256Base64(style)}'`,
    "connect-src 'self'",
    "img-src 'none'",
    "font-src 'none'",
    "worker-src 'none'",
    "frame-src 'none'",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'none'",
  ].join('; ');
}

/**
 * Script text made safe to sit inside <script>...</script>: "</script" and
 * "<!--" may appear in the bundled libraries' strings or regular
 * expressions, where "<\/" and "<\!--" mean the same to JavaScript.
 */
export function inlineSafe(script: string): string {
  return script.replaceAll('</script', '<\\/script').replaceAll('</SCRIPT', '<\\/SCRIPT').replaceAll('<!--', '<\\!--');
}

function escapeAttribute(text: string): string {
  return text.replaceAll('&', '&amp;').replaceAll('"', '&quot;').replaceAll('<', '&lt;').replaceAll('>', '&gt;');
}

function escapeText(text: string): string {
  return text.replaceAll('&', '&amp;').replaceAll('<', '&lt;').replaceAll('>', '&gt;');
}

const NODE_SHIMMED = /^node:|^(?:fs|fs\/promises|path|url|zlib|crypto|child_process|worker_threads|stream|buffer|util|os)$/;

async function bundleScript(root: string): Promise<string> {
  const { rolldown } = await import('rolldown');
  const shims = join(root, 'src', 'web', 'page', 'shims');
  const catalogue = loadCatalogue(join(root, 'rules'));
  const catalogueModule = join(root, 'src', 'web', 'page', 'catalogue.ts');
  const bundle = await rolldown({
    input: join(root, 'src', 'web', 'page', 'main.ts'),
    platform: 'browser',
    logLevel: 'warn',
    resolve: { extensionAlias: { '.js': ['.ts', '.js'] }, conditionNames: ['browser', 'import', 'default'] },
    transform: { define: { PLUMBLINE_PAGE_VERSION: JSON.stringify(toolVersion()), 'process.env.NODE_ENV': '"production"', 'import.meta.url': '""' } },
    plugins: [
      {
        name: 'plumbline-page',
        resolveId(source, importer) {
          // The refit's XLSX reader of a path needs a file on disk; the page reads XLSX bytes (src/refit/xlsxBytes.ts).
          if (source === './xlsx.js' && importer === join(root, 'src', 'refit', 'data.ts')) return join(shims, 'xlsx.ts');
          // csv-stringify's Node build leans on Buffer; its browser build is the same code without it.
          if (source === 'csv-stringify/sync') return join(root, 'node_modules', 'csv-stringify', 'dist', 'esm', 'sync.js');
          if (NODE_SHIMMED.test(source)) {
            const name = source.replace(/^node:/, '');
            return join(shims, name === 'crypto' ? 'crypto.ts' : 'unavailable.ts');
          }
          return null;
        },
        load(id) {
          if (id === catalogueModule) return `export default ${JSON.stringify(catalogue)};`;
          return null;
        },
      },
    ],
  });
  const { output } = await bundle.generate({ format: 'iife', codeSplitting: false, minify: true, comments: { legal: false } });
  await bundle.close();
  const chunk = output.find((item) => item.type === 'chunk');
  if (chunk === undefined || chunk.type !== 'chunk') throw new Error('rolldown produced no script for the page');
  return inlineSafe(chunk.code);
}

/** Builds the page and writes it (and its policy, for the server's header); returns the file's path. */
export async function buildPage(root = repositoryRoot()): Promise<string> {
  const pageFolder = join(root, 'src', 'web', 'page');
  const script = await bundleScript(root);
  const style = readFileSync(join(pageFolder, 'style.css'), 'utf8');
  const policy = pagePolicy(script, style);
  const template = readFileSync(join(pageFolder, 'index.html'), 'utf8');
  // Each placeholder is replaced once, by a function: the bundle may hold "$&" and other replacement patterns.
  const html = template
    .replace('{{CSP}}', () => escapeAttribute(policy))
    .replace('{{STYLE}}', () => style)
    .replace('{{VERSION}}', () => escapeText(toolVersion()))
    .replaceAll('{{CAUTION}}', () => escapeText(CAUTION))
    .replace('{{SCRIPT}}', () => script);
  const out = join(root, PAGE_FILE);
  mkdirSync(dirname(out), { recursive: true });
  writeFileSync(out, html);
  writeFileSync(join(root, POLICY_FILE), `${policy}\n`);
  return out;
}

if (process.argv[1] !== undefined && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const started = Date.now();
  buildPage().then(
    (out) => process.stdout.write(`page: ${out} (${(readFileSync(out).length / 1e6).toFixed(1)} MB, ${Date.now() - started} ms)\n`),
    (error: unknown) => {
      process.stderr.write(`building the page failed: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
      process.exitCode = 1;
    },
  );
}
