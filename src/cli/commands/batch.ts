/**
 * `mechanist batch INPUT... --out DIR`: every compound of the inputs analysed as `analyze` would,
 * summed up in DIR/summary.csv, DIR/summary.json and DIR/index.html (and, with --reports, each
 * compound's report folder under DIR/compounds/). Exit code 1 when any compound failed.
 */
import { Command } from 'commander';
import { availableParallelism } from 'node:os';
import { relative } from 'node:path';
import { progressBar, type ProgressBar } from '../progress-bar.js';
import { addSharedOptions, analysisOptionsFrom, atSubstrateOption, parseOptionsFrom, type SharedCliOptions } from '../analysis-options.js';
import { EXIT_ANALYSIS_FAILED, EXIT_OK } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { integerOption } from '../parse-option-values.js';

interface BatchCliOptions extends SharedCliOptions {
  out: string;
  reports?: boolean;
  jobs?: string;
  quiet?: boolean;
}

/** Exit code chosen by a command that finished without throwing (set in place). */
export interface BatchOutcome {
  exitCode: number;
}

export function batchCommand(io: CliIo, outcome: BatchOutcome): Command {
  const cmd = new Command('batch')
    .description('analyse many compounds (files, folders, multi-compound files) and write one summary table')
    .argument('<inputs...>', 'rate-table files, folders of them (.csv, .tsv, .txt), or files with a compound column')
    .requiredOption('--out <dir>', 'output folder: summary.csv, summary.json, index.html (and compounds/ with --reports)')
    .option('--reports', "also write each compound's full report under <dir>/compounds/<compound>/")
    .option('--jobs <n>', `worker threads (default: the number of cores, here ${availableParallelism()})`)
    .option('--quiet', 'no progress bar and no notes on stderr');
  addSharedOptions(cmd);
  cmd.action(async (inputs: string[], o: BatchCliOptions) => {
    const parse = parseOptionsFrom(o);
    const analysis = analysisOptionsFrom(o);
    const jobs = o.jobs === undefined ? availableParallelism() : integerOption('--jobs', o.jobs, 1);
    // the shared bar draws on stderr when it is a terminal; --quiet (and a non-terminal io) turn it off
    const bar: ProgressBar | null = io.errIsTTY && !o.quiet ? progressBar('batch') : null;
    // the batch and analysis code is loaded when the command runs, not at start-up (issue 13)
    const { runBatch } = await import('../../batch/run-batch.js');
    const result = await runBatch(inputs, {
      out: o.out,
      reports: Boolean(o.reports),
      jobs,
      parse,
      analysis,
      cwd: io.cwd,
      ...(o.atSubstrate !== undefined ? { atSubstrate: atSubstrateOption(o)! } : {}),
      onCompound: (_row, done, total) => bar?.update(done, total),
    });
    bar?.finish();
    if (!o.quiet) for (const note of result.notes) io.err(`mechanist: note: ${note}\n`);
    if (!o.quiet && result.workerProblem !== null)
      io.err(`mechanist: note: worker threads could not be used (${result.workerProblem}); compounds ran in the main thread\n`);
    for (const row of result.rows) if (row.error !== null) io.err(`mechanist: ${row.compound}: ${row.error}\n`);
    const { compounds, analysed, failed } = result.counts;
    const where = result.written.map((p) => relative(io.cwd, p) || p).join(', ');
    io.out(`${analysed} of ${compounds} compounds analysed${failed > 0 ? `, ${failed} failed` : ''}; wrote ${where}\n`);
    outcome.exitCode = failed > 0 ? EXIT_ANALYSIS_FAILED : EXIT_OK;
  });
  return cmd;
}
