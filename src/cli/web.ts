import { spawn } from 'node:child_process';
import { join } from 'node:path';
import type { Command } from 'commander';
import { UsageError, type CliIo } from './common.js';

/**
 * `plumbline web`: the page for authors and reviewers, served on 127.0.0.1
 * (a free port, or --port) and opened in the default browser unless
 * --no-open. The audit runs in the page; the server only serves it and
 * answers its refit requests (src/web/server.ts). It runs until stopped
 * (Ctrl+C).
 */
export function registerWebCommand(program: Command, io: CliIo): void {
  program
    .command('web')
    .description('open a local page: paste text or drop manuscripts and see every flag in place (nothing leaves this computer); also refit from raw data')
    .option('--port <port>', 'port on 127.0.0.1 (default: a free one)')
    .option('--no-open', 'do not open the browser; only print the address')
    .action(async (options: { port?: string; open: boolean }) => {
      const port = parsePort(options.port);
      const { repositoryRoot, PAGE_FILE, POLICY_FILE } = await import('../web/buildPage.js');
      const { readBuiltPage, startWebServer, PageNotBuiltError } = await import('../web/server.js');
      const root = repositoryRoot();
      let server;
      try {
        const { html, policy } = readBuiltPage(join(root, PAGE_FILE), join(root, POLICY_FILE));
        server = await startWebServer({ port, html, policy });
      } catch (error) {
        if (error instanceof PageNotBuiltError) throw new UsageError(error.message);
        if ((error as NodeJS.ErrnoException).code === 'EADDRINUSE') throw new UsageError(`port ${port} is in use on 127.0.0.1; choose another with --port, or leave --port out for a free one`);
        if ((error as NodeJS.ErrnoException).code === 'EACCES') throw new UsageError(`port ${port} may not be used by this user; choose one above 1023 with --port, or leave --port out`);
        throw error;
      }
      io.stdout(`plumbline web: ${server.url}\nThe page checks manuscripts in your browser; nothing is sent anywhere. Stop with Ctrl+C.\n`);
      if (options.open) openBrowser(server.url, io);
    });
}

function parsePort(text: string | undefined): number {
  if (text === undefined) return 0;
  const port = /^\d{1,5}$/.test(text.trim()) ? Number(text) : NaN;
  if (!(port >= 1 && port <= 65535)) throw new UsageError(`--port must be a whole number from 1 to 65535, got "${text}"`);
  return port;
}

/** Opens the address with the system's opener; when there is none (a server, a container) the printed address is enough. */
function openBrowser(url: string, io: CliIo): void {
  const [command, args] =
    process.platform === 'darwin' ? ['open', [url]] : process.platform === 'win32' ? ['cmd', ['/c', 'start', '""', url]] : ['xdg-open', [url]];
  const explain = (reason: string): void => io.stdout(`Could not open a browser (${reason}); open ${url} yourself.\n`);
  try {
    const child = spawn(command, args as string[], { stdio: 'ignore', detached: true });
    child.on('error', (error: NodeJS.ErrnoException) => explain(error.code === 'ENOENT' ? `${command} is not installed` : error.message));
    child.on('exit', (code) => {
      if (code !== 0 && code !== null) explain(`${command} exited with code ${code}`);
    });
    child.unref();
  } catch (error) {
    explain(error instanceof Error ? error.message : String(error));
  }
}
