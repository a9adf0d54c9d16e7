/**
 * `plumbline web` as a program, without a browser: it serves the built page
 * on 127.0.0.1 with the page's own Content-Security-Policy as a header,
 * answers nothing else, refuses requests addressed to another host and
 * refit requests without the page's token, and says clearly what is wrong
 * with a bad --port. The page itself is tested in Chromium in
 * tests/browser/web-page.test.ts.
 */
import { createServer } from 'node:net';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { request } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { builtCliExists, plumbline } from '../batch/cli.js';
import { startWeb, type RunningWeb } from './startWeb.js';

function get(url: string, headers: Record<string, string> = {}, method = 'GET', body?: string): Promise<{ status: number; headers: Record<string, string | string[] | undefined>; body: string }> {
  return new Promise((resolve, reject) => {
    const sent = request(url, { method, headers }, (response) => {
      // (Bytes joined before decoding: a chunk may end inside a character of several bytes.)
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => resolve({ status: response.statusCode ?? 0, headers: response.headers, body: Buffer.concat(chunks).toString('utf8') }));
    });
    sent.on('error', reject);
    sent.end(body);
  });
}

describe('plumbline web (the server)', () => {
  let web: RunningWeb;

  beforeAll(async () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
    web = await startWeb();
  }, 30_000);

  afterAll(async () => {
    await web?.stop();
  });

  it('prints an address on 127.0.0.1 and serves the built page there, with its policy as a header too', async () => {
    expect(web.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/$/);
    expect(web.stdout()).toContain('nothing is sent anywhere');
    const page = await get(web.url);
    expect(page.status).toBe(200);
    expect(page.headers['content-type']).toBe('text/html; charset=utf-8');
    const policy = readFileSync(join(process.cwd(), 'dist', 'web', 'plumbline.csp'), 'utf8').trim();
    expect(page.headers['content-security-policy']).toBe(`${policy}; frame-ancestors 'none'`);
    expect(policy).toMatch(/^default-src 'none'; script-src 'sha256-[A-Za-z0-9+/=]+'; style-src 'sha256-[A-Za-z0-9+/=]+'; connect-src 'self'/);
    // The file on disk and the page served are the same page: only the token differs.
    const built = readFileSync(join(process.cwd(), 'dist', 'web', 'plumbline.html'), 'utf8');
    expect(page.body.replace(/<meta name="plumbline-token" content="[^"]+">/, '<meta name="plumbline-token" content="">')).toBe(built);
    expect(page.body).toMatch(/<meta name="plumbline-token" content="[A-Za-z0-9_-]{32}">/);
    // Only the one script and the one style, inline: the bundle's own "</script" strings are written "<\/script", so one element ends.
    expect(built.match(/<\/script>/gi)).toHaveLength(1);
    expect(built.slice(0, built.indexOf('<script>')).match(/<style>/g)).toHaveLength(1);
    expect(built).not.toMatch(/<script[^>]+src=|<link[^>]+href=|@import|url\(http/);
  });

  it('answers only at 127.0.0.1 and localhost: another host name (DNS rebinding) is refused', async () => {
    const port = new URL(web.url).port;
    expect((await get(web.url, { Host: `localhost:${port}` })).status).toBe(200);
    expect((await get(web.url, { Host: `attacker.example:${port}` })).status).toBe(421);
    expect((await get(`${web.url}other`)).status).toBe(404);
  });

  it('runs a refit only for the page that carries its token', async () => {
    const api = `${web.url}api/refit`;
    const body = JSON.stringify({ name: 'a.csv', data: Buffer.from('y,g\n1,a\n2,b\n').toString('base64'), model: 'y ~ g' });
    const without = await get(api, { 'Content-Type': 'application/json' }, 'POST', body);
    expect(without.status).toBe(403);
    const wrong = await get(api, { 'Content-Type': 'application/json', 'X-Plumbline-Token': 'guess' }, 'POST', body);
    expect(wrong.status).toBe(403);
    expect((await get(api)).status).toBe(405);
  });
});

describe('plumbline web without --no-open', () => {
  it('where no browser opener is installed, prints the address and goes on serving', async () => {
    const { spawn } = await import('node:child_process');
    const { mkdtempSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    // A PATH with no xdg-open (nor anything else) on it.
    const empty = mkdtempSync(join(tmpdir(), 'plumbline-no-opener-'));
    const child = spawn(process.execPath, [join(process.cwd(), 'dist', 'src', 'cli', 'main.js'), 'web'], { env: { ...process.env, PATH: empty }, stdio: ['ignore', 'pipe', 'pipe'] });
    try {
      let out = '';
      child.stdout.on('data', (chunk: Buffer) => (out += chunk.toString('utf8')));
      await new Promise<void>((resolve, reject) => {
        const timer = setTimeout(() => reject(new Error(`no message in 15 s: ${out}`)), 15_000);
        child.stdout.on('data', () => {
          if (out.includes('Could not open a browser')) {
            clearTimeout(timer);
            resolve();
          }
        });
      });
      if (process.platform === 'linux') expect(out).toContain('Could not open a browser (xdg-open is not installed)');
      const url = /plumbline web: (\S+)/.exec(out)![1]!;
      expect(out).toContain(`open ${url} yourself`);
      expect(child.exitCode).toBeNull();
      expect((await get(url)).status).toBe(200);
    } finally {
      child.kill('SIGTERM');
    }
  }, 30_000);
});

describe('plumbline web: bad options', () => {
  it('refuses a --port that is not a port, with exit code 2', () => {
    const run = plumbline(['web', '--no-open', '--port', '70000'], process.cwd());
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('--port must be a whole number from 1 to 65535, got "70000"');
  });

  it('says which port is taken, with exit code 2', async () => {
    const holder = createServer();
    await new Promise<void>((resolve) => holder.listen(0, '127.0.0.1', resolve));
    const port = (holder.address() as { port: number }).port;
    try {
      const run = plumbline(['web', '--no-open', '--port', String(port)], process.cwd());
      expect(run.status).toBe(2);
      expect(run.stderr).toContain(`port ${port} is in use on 127.0.0.1`);
    } finally {
      holder.close();
    }
  });
});
