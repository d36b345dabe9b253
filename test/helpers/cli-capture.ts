/**
 * Runs the command line in-process with its output captured: the one test helper every CLI-level test
 * uses, so they all see the same io (stderr not a terminal, no interrupt handler).
 */
import { runCli } from '../../src/cli/run-cli.js';
import type { CliIo } from '../../src/cli/io.js';

interface CapturedRun {
  code: number;
  out: string;
  err: string;
}

/** An io whose output is thrown away (for runs whose files, not text, are under test). */
export function silentIo(cwd: string): CliIo {
  return { out: () => {}, err: () => {}, errIsTTY: false, cwd };
}

/** `mechanist ARGS` run in `cwd`, with stdout and stderr collected. */
export async function runCaptured(args: string[], cwd: string = process.cwd()): Promise<CapturedRun> {
  let out = '';
  let err = '';
  const io: CliIo = { out: (t) => void (out += t), err: (t) => void (err += t), errIsTTY: false, cwd };
  const code = await runCli(args, io);
  return { code, out, err };
}
