#!/usr/bin/env node
import { runCli } from './program.js';

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

const color = Boolean(process.stdout.isTTY) && !("NO_COLOR" in process.env);

runCli(process.argv.slice(2), {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
  readStdin,
  color,
  interactive: Boolean(process.stderr.isTTY),
}).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(`plumbline: unexpected error: ${(error as Error).stack ?? String(error)}\n`);
    process.exitCode = 70;
  },
);
