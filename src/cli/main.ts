#!/usr/bin/env node
/** Entry point of the `mechanist` command. */
import { runCli } from './run-cli.js';
import { processIo } from './io.js';

runCli(process.argv.slice(2), processIo()).then(
  (code) => {
    process.exitCode = code;
  },
  () => {
    process.exitCode = 1;
  },
);
