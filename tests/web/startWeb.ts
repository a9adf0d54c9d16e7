import { spawn, type ChildProcess } from 'node:child_process';
import { bin } from '../batch/cli.js';

export interface RunningWeb {
  child: ChildProcess;
  url: string;
  stdout: () => string;
  stop: () => Promise<void>;
}

/** Starts the built `plumbline web --no-open ...` and waits for the address it prints. */
export function startWeb(args: readonly string[] = [], cwd = process.cwd()): Promise<RunningWeb> {
  const child = spawn('node', [bin, 'web', '--no-open', ...args], { cwd, env: { ...process.env, NO_COLOR: '1' }, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  let err = '';
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`plumbline web printed no address in 15 s: ${out}${err}`)), 15_000);
    child.stdout!.on('data', (chunk: Buffer) => {
      out += chunk.toString('utf8');
      const found = /plumbline web: (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
      if (found) {
        clearTimeout(timer);
        resolve({
          child,
          url: found[1]!,
          stdout: () => out,
          stop: () =>
            new Promise<void>((done) => {
              if (child.exitCode !== null) return done();
              child.once('exit', () => done());
              child.kill('SIGTERM');
            }),
        });
      }
    });
    child.stderr!.on('data', (chunk: Buffer) => {
      err += chunk.toString('utf8');
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`plumbline web ended (exit code ${code}) before printing its address: ${out}${err}`));
    });
  });
}
