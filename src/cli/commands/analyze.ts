/** `mechanist analyze FILE`: one compound's table, fitted, ranked and summarised. */
import { Command } from 'commander';
import { addSharedOptions } from '../analysis-options.js';
import type { CliIo } from '../io.js';
import { addReadsOptions } from '../reads-options.js';
import type { AnalyzeCliOptions } from './analyze-action.js';

export function analyzeCommand(io: CliIo): Command {
  const cmd = new Command('analyze')
    .description('fit the five mechanisms to one rate table and rank them')
    .argument('[file]', 'CSV or TSV rate table (or give --reads and --plate-map)')
    .option('--reads <files...>', 'kinetic plate reads instead of a rate table: initial rates are found first, as `mechanist rates` does')
    .option('--json', 'print one JSON document instead of the text summary')
    .option('--out <dir>', 'write the results folder: report.html, figures/*.svg, results.json, parameters.csv, summary.txt')
    .option('--compound <name>', 'which compound of a multi-compound file ("all" for each)')
    .option('--km <Km>', 'Km of the substrate with its unit (40uM), for the Ki each mechanism implies when the table has one [S] level (an IC50 curve)');
  addSharedOptions(cmd);
  addReadsOptions(cmd, false);
  // the analysis code (and its statistics library) is loaded only when the command runs, so that
  // `--help` and usage errors start fast (issue 13)
  cmd.action(async (file: string | undefined, o: AnalyzeCliOptions) => (await import('./analyze-action.js')).runAnalyze(io, cmd, file, o));
  return cmd;
}
