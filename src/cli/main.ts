#!/usr/bin/env node
/** Entry point of the `mechanist` command. */
import { runCli } from './run-cli.js';
import { processIo } from './io.js';

// A reader that closes the pipe early (`mechanist analyze ... | head`) is not an error.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
}

runCli(process.argv.slice(2), processIo()).then(
  (code) => {
    process.exitCode = code;
  },
  () => {
    process.exitCode = 1;
  },
);
