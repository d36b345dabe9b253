/**
 * `mechanist rates READS... --plate-map MAP [--out FILE]`: initial rates from kinetic plate reads,
 * written as a long rate table that `analyze` and `batch` read as it is.
 */
import { Command } from 'commander';
import { resolve } from 'node:path';
import { writeFileAtomic } from '../../report/write-atomic.js';
import type { CliIo } from '../io.js';
import { addReadsOptions, readsSummaryLine, runReads, type ReadsCliOptions } from '../reads-input.js';

interface RatesCliOptions extends ReadsCliOptions {
  out?: string;
  quiet?: boolean;
}

export function ratesCommand(io: CliIo): Command {
  const cmd = new Command('rates')
    .description('initial rates from kinetic plate reads (long: well,time,signal; wide: time then one column per well)')
    .argument('<reads...>', 'kinetic-read files (several files: one plate each, named by the file)')
    .option('--out <file>', 'write the rate table here (default: standard output)')
    .option('--quiet', 'no notes on stderr');
  addReadsOptions(cmd, true);
  cmd.action(async (readsPaths: string[], o: RatesCliOptions) => {
    const run = await runReads(readsPaths, o, io.cwd);
    if (o.out) {
      writeFileAtomic(resolve(io.cwd, o.out), run.text);
    } else {
      io.out(run.text);
    }
    if (!o.quiet) {
      for (const note of run.notes) io.err(`mechanist: note: ${note}\n`);
      io.err(`mechanist: ${readsSummaryLine(run.result)}${o.out ? `; wrote ${o.out}` : ''}\n`);
    }
  });
  return cmd;
}
