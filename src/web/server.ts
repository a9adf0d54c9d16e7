/**
 * The local server of `plumbline web`: serves the one page (built into
 * dist/web/plumbline.html by src/web/buildPage.ts) on 127.0.0.1 only, with
 * its Content-Security-Policy as a header too, and answers the page's refit
 * requests by running the refit command in this process.
 *
 * Only the page itself may ask for a refit: each run writes a fresh random
 * token into the page it serves, and a request must carry it in a header
 * (a custom header, which another site's page cannot send without a CORS
 * preflight this server never grants). Requests naming another host are
 * refused, so a DNS name pointed at 127.0.0.1 reaches nothing.
 */
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../cli/program.js';

export interface WebServer {
  url: string;
  port: number;
  close(): Promise<void>;
}

export class PageNotBuiltError extends Error {}

/** The built page and its policy; a clear error when the build has not made them. */
export function readBuiltPage(pagePath: string, policyPath: string): { html: string; policy: string } {
  try {
    return { html: readFileSync(pagePath, 'utf8'), policy: readFileSync(policyPath, 'utf8').trim() };
  } catch (error) {
    throw new PageNotBuiltError(`the page has not been built (${pagePath}: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}); run npm run build`);
  }
}

const TOKEN_META = '<meta name="plumbline-token" content="">';
/** Largest refit request: the data file as base64 and the pasted table (a 100 MB CSV is about 133 MB of base64). */
const MAX_REQUEST_BYTES = 150 * 1024 * 1024;
const DATA_EXTENSIONS = /\.(?:csv|tsv|txt|xlsx)$/i;

interface RefitRequest {
  name: string;
  data: string;
  model: string;
  type?: string;
  factors?: string;
  missing?: string;
  reported?: string;
}

function isRefitRequest(value: unknown): value is RefitRequest {
  if (typeof value !== 'object' || value === null) return false;
  const request = value as Record<string, unknown>;
  const optionalString = (key: string): boolean => request[key] === undefined || typeof request[key] === 'string';
  return typeof request.name === 'string' && typeof request.data === 'string' && typeof request.model === 'string' && ['type', 'factors', 'missing', 'reported'].every(optionalString);
}

/** A data file's name kept to letters, digits, dots, hyphens and underscores, with its extension. */
function safeFileName(name: string): string | null {
  const base = name.slice(Math.max(name.lastIndexOf('/'), name.lastIndexOf('\\')) + 1).replace(/[^\w.-]/g, '_');
  return DATA_EXTENSIONS.test(base) && !base.startsWith('.') ? base : null;
}

function splitList(text: string | undefined): string[] {
  return (text ?? '')
    .split(/[;,\n]/)
    .map((item) => item.trim())
    .filter((item) => item !== '');
}

/** Runs `plumbline refit` on the request's data in a folder of its own; the folder is removed afterwards. */
export async function runRefitRequest(request: RefitRequest): Promise<{ exitCode: number; output: string; errors: string } | { error: string }> {
  const name = safeFileName(request.name);
  if (name === null) return { error: `${request.name}: the data must be a CSV, TSV, TXT or XLSX file` };
  if (request.model.trim() === '') return { error: 'the model is empty: write it as outcome ~ terms, e.g. mood ~ route * pace + loneliness' };
  const type = request.type ?? '3';
  if (!['1', '2', '3'].includes(type)) return { error: `the sums-of-squares type must be 1, 2 or 3, not "${type}"` };
  const folder = await mkdtemp(join(tmpdir(), 'plumbline-web-'));
  try {
    const dataPath = join(folder, name);
    await writeFile(dataPath, Buffer.from(request.data, 'base64'));
    const args = ['refit', dataPath, '--model', request.model, '--type', type, '--format', 'text'];
    for (const factor of splitList(request.factors)) args.push('--factor', factor);
    for (const rule of (request.missing ?? '').split(/[;\n]/).map((item) => item.trim()).filter(Boolean)) args.push('--missing', rule);
    if ((request.reported ?? '').trim() !== '') {
      const reportedPath = join(folder, 'reported-table.md');
      await writeFile(reportedPath, request.reported!);
      args.push('--reported', reportedPath);
    }
    let output = '';
    let errors = '';
    const exitCode = await runCli(args, {
      stdout: (text) => {
        output += text;
      },
      stderr: (text) => {
        errors += text;
      },
      readStdin: async () => '',
      color: false,
      interactive: false,
    });
    // The user chose a file, not a temporary folder: names are shown as they chose them.
    const shown = (text: string): string => text.replaceAll(`${folder}/`, '');
    return { exitCode, output: shown(output), errors: shown(errors) };
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}

function send(response: ServerResponse, status: number, type: string, body: string, headers: Record<string, string> = {}): void {
  response.writeHead(status, {
    'Content-Type': type,
    'Content-Length': String(Buffer.byteLength(body)),
    'Cache-Control': 'no-store',
    'X-Content-Type-Options': 'nosniff',
    'Referrer-Policy': 'no-referrer',
    ...headers,
  });
  response.end(body);
}

function readBody(request: IncomingMessage, limit: number): Promise<string | null> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    request.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > limit) {
        resolve(null);
        request.destroy();
        return;
      }
      chunks.push(chunk);
    });
    request.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    request.on('error', reject);
  });
}

/** Starts the server on 127.0.0.1 (port 0: a free one). */
export async function startWebServer(options: { port: number; html: string; policy: string }): Promise<WebServer> {
  const token = randomBytes(24).toString('base64url');
  if (!options.html.includes(TOKEN_META)) throw new PageNotBuiltError('the built page has no place for its token; rebuild it with npm run build');
  const page = options.html.replace(TOKEN_META, () => `<meta name="plumbline-token" content="${token}">`);
  // In a header the policy may also forbid framing (frame-ancestors is ignored in a meta tag).
  const policy = `${options.policy}; frame-ancestors 'none'`;
  let port = options.port;
  const allowedHosts = (): Set<string> => new Set([`127.0.0.1:${port}`, `localhost:${port}`]);

  const server: Server = createServer((request, response) => {
    void (async () => {
      if (!allowedHosts().has(request.headers.host ?? '')) {
        send(response, 421, 'text/plain; charset=utf-8', 'plumbline web answers only at 127.0.0.1\n');
        return;
      }
      const path = (request.url ?? '/').split('?')[0];
      if (request.method === 'GET' && (path === '/' || path === '/index.html')) {
        send(response, 200, 'text/html; charset=utf-8', page, { 'Content-Security-Policy': policy, 'X-Frame-Options': 'DENY', 'Cross-Origin-Opener-Policy': 'same-origin' });
        return;
      }
      if (path === '/api/refit') {
        if (request.method !== 'POST') {
          send(response, 405, 'text/plain; charset=utf-8', 'POST only\n', { Allow: 'POST' });
          return;
        }
        if (request.headers['x-plumbline-token'] !== token) {
          send(response, 403, 'application/json', JSON.stringify({ error: 'this request did not come from the page plumbline web served' }));
          return;
        }
        const body = await readBody(request, MAX_REQUEST_BYTES);
        if (body === null) {
          send(response, 413, 'application/json', JSON.stringify({ error: `the data file is too large for the page (at most about ${Math.floor(MAX_REQUEST_BYTES / 1.34 / 1e6)} MB); use plumbline refit on the command line` }));
          return;
        }
        let parsed: unknown;
        try {
          parsed = JSON.parse(body);
        } catch {
          parsed = null;
        }
        if (!isRefitRequest(parsed)) {
          send(response, 400, 'application/json', JSON.stringify({ error: 'the request is not a refit request (name, data, model)' }));
          return;
        }
        const answer = await runRefitRequest(parsed);
        send(response, 200, 'application/json', JSON.stringify(answer));
        return;
      }
      send(response, 404, 'text/plain; charset=utf-8', 'not found\n');
    })().catch((error: unknown) => {
      if (!response.headersSent) send(response, 500, 'application/json', JSON.stringify({ error: `plumbline failed: ${error instanceof Error ? error.message : String(error)}` }));
      else response.destroy();
    });
  });

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  const address = server.address();
  port = typeof address === 'object' && address !== null ? address.port : options.port;
  return {
    url: `http://127.0.0.1:${port}/`,
    port,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
