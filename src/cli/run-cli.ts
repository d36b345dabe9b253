/**
 * The command line: a thin layer over the library. Every failure ends in one plain line on stderr
 * and a documented exit code (src/cli/exit-codes.ts); no stack trace reaches the user.
 */
import { Command, CommanderError } from 'commander';
import { InputError } from '../input/types.js';
import { TOOL_VERSION } from '../version.js';
import {
  EXIT_ANALYSIS_FAILED, EXIT_BAD_INPUT, EXIT_CODE_HELP, EXIT_INTERRUPTED, EXIT_OK, EXIT_TERMINATED, EXIT_WRITE_FAILED, UsageError,
} from './exit-codes.js';
import { OutputError } from '../report/output-error.js';
import type { CliIo } from './io.js';
import { analyzeCommand } from './commands/analyze.js';
import { simulateCommand } from './commands/simulate.js';
import { demoCommand } from './commands/demo.js';
import { batchCommand } from './commands/batch.js';
import { ratesCommand } from './commands/rates.js';
import { planCommand } from './commands/plan.js';

/** Exit code chosen by a command that finished without throwing (batch uses it). */
interface CommandOutcome {
  exitCode: number;
}

/**
 * Where commander writes, with its usage errors in the one style of every other error:
 * `mechanist: what is wrong` on one line (commander's own "error: " prefix and its separate
 * "(Did you mean ...?)" line folded in).
 */
function output(io: CliIo) {
  return {
    writeOut: (s: string) => io.out(s),
    writeErr: (s: string) => io.err(s),
    outputError: (s: string) => io.err(`mechanist: ${usageLine(s)}\n`),
  };
}

function usageLine(commanderText: string): string {
  const text = oneLine(commanderText.replace(/^error:\s*/i, ''));
  return text.replace(/\(Did you mean/g, '(did you mean');
}

function buildProgram(io: CliIo, outcome: CommandOutcome): Command {
  const program = new Command('mechanist')
    .description('Global fits of reversible enzyme-inhibition mechanisms, ranked, with honest intervals.')
    .version(TOOL_VERSION)
    .addHelpText('after', `\n${EXIT_CODE_HELP}\n\nResearch use only: results support, and do not replace, expert judgement.`)
    .showHelpAfterError(false)
    .configureOutput(output(io));
  for (const cmd of [analyzeCommand(io), simulateCommand(io), demoCommand(io), batchCommand(io, outcome), ratesCommand(io), planCommand(io)]) {
    cmd.configureOutput(output(io));
    cmd.exitOverride();
    program.addCommand(cmd);
  }
  program.exitOverride();
  return program;
}

/** Runs the CLI with the given arguments (without "node" and the script); resolves to the exit code. */
export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const outcome: CommandOutcome = { exitCode: EXIT_OK };
  const program = buildProgram(io, outcome);
  try {
    if (argv.length === 0) {
      program.outputHelp();
      return EXIT_BAD_INPUT;
    }
    await program.parseAsync(argv, { from: 'user' });
    return outcome.exitCode;
  } catch (e) {
    return reportFailure(e, io);
  }
}

function oneLine(s: string): string {
  return s.replace(/\s*\n\s*/g, ' ').trim();
}

/** A batch stopped by Ctrl-C or SIGTERM (src/batch/worker-pool.ts), known by name so that the batch code is not loaded at start-up. */
function isInterrupted(e: unknown): e is Error & { signal?: string } {
  return e instanceof Error && e.name === 'InterruptedError';
}

/**
 * An AnalysisError (src/analysis/analyze-table.ts), told by its name and exit code rather than by
 * instanceof, so that the CLI does not load the analysis code at start-up just to recognise it.
 */
function isAnalysisError(e: unknown): e is Error {
  return e instanceof Error && e.name === 'AnalysisError' && (e as { exitCode?: unknown }).exitCode === EXIT_ANALYSIS_FAILED;
}

function reportFailure(e: unknown, io: CliIo): number {
  if (e instanceof CommanderError) {
    // help and version end in a CommanderError with exit code 0; commander already printed usage errors
    if (e.exitCode === 0 || e.code === 'commander.helpDisplayed' || e.code === 'commander.version') return EXIT_OK;
    return EXIT_BAD_INPUT;
  }
  if (e instanceof InputError || e instanceof UsageError) {
    io.err(`mechanist: ${oneLine(e.message)}\n`);
    return EXIT_BAD_INPUT;
  }
  if (e instanceof OutputError) {
    io.err(`mechanist: ${oneLine(e.message)}\n`);
    return e.stage === 'check' ? EXIT_BAD_INPUT : EXIT_WRITE_FAILED;
  }
  if (isInterrupted(e)) {
    const signal = e.signal;
    io.err(`mechanist: interrupted${signal ? ` (${signal})` : ''}; the summary was not written and temporary files were removed\n`);
    return signal === 'SIGTERM' ? EXIT_TERMINATED : EXIT_INTERRUPTED;
  }
  if (isAnalysisError(e)) {
    io.err(`mechanist: analysis not completed: ${oneLine(e.message)}\n`);
    return EXIT_ANALYSIS_FAILED;
  }
  const code = (e as NodeJS.ErrnoException)?.code;
  if (code === 'ENOENT' || code === 'EACCES' || code === 'EISDIR') {
    const path = (e as NodeJS.ErrnoException).path ?? '';
    const what = code === 'ENOENT' ? 'no such file or folder' : code === 'EACCES' ? 'permission denied' : 'is a folder, not a file';
    io.err(`mechanist: ${path}: ${what}\n`);
    return EXIT_BAD_INPUT;
  }
  const message = e instanceof Error ? e.message : String(e);
  io.err(`mechanist: analysis not completed: ${oneLine(message)} (an unexpected internal error; please report it with the input file)\n`);
  return EXIT_ANALYSIS_FAILED;
}
