/**
 * `mechanist rates READS... --plate-map MAP [--out FILE]`: initial rates from kinetic plate reads,
 * written as a long rate table that `analyze` and `batch` read as it is.
 */
import { Command } from 'commander';
import type { CliIo } from '../io.js';
import { addReadsOptions } from '../reads-options.js';
import { type RatesCliOptions } from './rates-options.js';


export function ratesCommand(io: CliIo): Command {
  const cmd = new Command('rates')
    .description('initial rates from kinetic plate reads (long: well,time,signal; wide: time then one column per well)')
    .argument('<reads...>', 'kinetic-read files (several files: one plate each, named by the file)')
    .option('--out <file>', 'write the rate table here (default: standard output)')
    .option('--report <dir>', 'also write <dir>/reads.html: one panel per well with its reads, window and line, by compound, [S] and [I]')
    .option('--quiet', 'no notes on stderr');
  addReadsOptions(cmd, true);
  // the reads code is loaded when the command runs, not at start-up
  cmd.action(async (readsPaths: string[], o: RatesCliOptions) => (await import('./rates-action.js')).runRates(io, readsPaths, o));
  return cmd;
}
