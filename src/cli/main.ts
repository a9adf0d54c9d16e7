#!/usr/bin/env node
import { EXIT_INTERNAL_FAULT, internalFaultMessage, runCli } from './program.js';

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

// An error thrown where nothing awaits it (a callback of a reader, say) cannot be tied to a document:
// it ends the run as a fault in plumbline, with the same request to report it.
const fault = (error: unknown): void => {
  process.stderr.write(internalFaultMessage(error));
  process.exit(EXIT_INTERNAL_FAULT);
};
process.on('uncaughtException', fault);
process.on('unhandledRejection', fault);

// A reader that stops reading ("plumbline scan . | head") closes the pipe: that ends the run quietly, as it
// ends other command-line programs, and is no fault in plumbline. (Exit code 141, 128 + SIGPIPE, as a shell reports it.)
const EXIT_BROKEN_PIPE = 141;
process.stdout.on('error', (error: NodeJS.ErrnoException) => {
  if (error.code === 'EPIPE') process.exit(EXIT_BROKEN_PIPE);
  fault(error);
});

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
  fault,
);
