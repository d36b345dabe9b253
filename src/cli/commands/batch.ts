/**
 * `mechanist batch INPUT... --out DIR`: every compound of the inputs analysed as `analyze` would,
 * summed up in DIR/summary.csv, DIR/summary.json and DIR/index.html (and, with --reports, each
 * compound's report folder under DIR/compounds/). Exit code 1 when any compound failed.
 */
import { Command } from 'commander';
import { availableParallelism } from 'node:os';
import { relative } from 'node:path';
import { cliProgressBar, type ProgressBar } from '../progress-bar.js';
import { addSharedOptions, analysisOptionsFrom, atSubstrateOption, parseOptionsFrom, type SharedCliOptions } from '../analysis-options.js';
import { EXIT_ANALYSIS_FAILED, EXIT_OK, UsageError } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { integerOption } from '../parse-option-values.js';
import { addReadsOptions, type ReadsCliOptions } from '../reads-options.js';

/** The rate table made from --reads goes into the output folder under this name. */
const READS_RATE_TABLE = 'rates-from-reads.csv';

interface BatchCliOptions extends SharedCliOptions, ReadsCliOptions {
  reads?: string[];
  out: string;
  reports?: boolean;
  jobs?: string;
  quiet?: boolean;
}

/** Exit code chosen by a command that finished without throwing (set in place). */
interface BatchOutcome {
  exitCode: number;
}

export function batchCommand(io: CliIo, outcome: BatchOutcome): Command {
  const cmd = new Command('batch')
    .description('analyse many compounds (files, folders, multi-compound files) and write one summary table')
    .argument('[inputs...]', 'rate-table files, folders of them (.csv, .tsv, .txt), or files with a compound column')
    .option('--reads <files...>', `kinetic plate reads: their rates are written to <dir>/${READS_RATE_TABLE} and analysed with the inputs`)
    .requiredOption('--out <dir>', 'output folder: summary.csv, summary.json, index.html (and compounds/ with --reports)')
    .option('--reports', "also write each compound's full report under <dir>/compounds/<compound>/")
    .option('--jobs <n>', `worker threads (default: the number of cores, here ${availableParallelism()})`)
    .option('--quiet', 'no progress bar and no notes on stderr');
  addSharedOptions(cmd);
  addReadsOptions(cmd, false);
  cmd.action(async (given: string[], o: BatchCliOptions) => {
    const inputs = [...given];
    const generatedInputs: Array<{ name: string; text: string }> = [];
    if (o.reads !== undefined) {
      // the reads code is loaded only when reads are given; the table is written by runBatch, under its lock
      const { readsSummaryLine, runReads } = await import('../reads-input.js');
      const run = await runReads(o.reads, o, io.cwd);
      if (!o.quiet) for (const note of run.notes) io.err(`mechanist: note: ${note}\n`);
      if (!o.quiet) io.err(`mechanist: ${readsSummaryLine(run.result)}\n`);
      generatedInputs.push({ name: READS_RATE_TABLE, text: run.text });
    } else if (o.plateMap !== undefined) {
      throw new UsageError('option --plate-map: only used with --reads');
    }
    if (inputs.length === 0 && generatedInputs.length === 0) throw new UsageError('batch needs at least one input, or --reads READS --plate-map MAP');
    const parse = parseOptionsFrom(o);
    const analysis = analysisOptionsFrom(o);
    const jobs = o.jobs === undefined ? availableParallelism() : integerOption('--jobs', o.jobs, 1);
    // the shared bar draws on stderr when it is a terminal; --quiet (and a non-terminal io) turn it off
    const bar: ProgressBar | null = io.errIsTTY && !o.quiet ? cliProgressBar(io, 'batch') : null;
    // reading big inputs takes seconds too: a bar of its own, files read of files given, moving
    // on within a file as its rows are read
    let filesRead = 0;
    let inputCount = Math.max(1, inputs.length + generatedInputs.length);
    const readBar: ProgressBar | null = io.errIsTTY && !o.quiet ? cliProgressBar(io, 'reading', (done, total) => `(${Math.floor(done)}/${total} files)`) : null;
    // Ctrl-C: the workers stop, this run's temporary files and its lock are removed (exit 130)
    const interrupt = new AbortController();
    let signalName: NodeJS.Signals | null = null;
    const stopListening = io.onInterrupt?.((signal) => {
      signalName = signal;
      interrupt.abort();
    });
    // the batch and analysis code is loaded when the command runs, not at start-up (issue 13)
    const [{ runBatch }, { InterruptedError }] = await Promise.all([import('../../batch/run-batch.js'), import('../../batch/worker-pool.js')]);
    const result = await runBatch(inputs, {
      signal: interrupt.signal,
      ...(generatedInputs.length > 0 ? { generatedInputs } : {}),
      out: o.out,
      reports: Boolean(o.reports),
      jobs,
      parse: readBar ? { ...parse, onReadProgress: (done: number, total: number) => readBar.update(filesRead + (done < total ? done / total : 0), inputCount) } : parse,
      analysis,
      cwd: io.cwd,
      onRead: (done, total) => {
        filesRead = done;
        inputCount = total;
        readBar?.update(done, total);
      },
      onPlan: () => readBar?.finish(),
      ...(o.atSubstrate !== undefined ? { atSubstrate: atSubstrateOption(o)! } : {}),
      onCompound: (_row, done, total) => bar?.update(done, total),
    }).catch((error: unknown) => {
      if (error instanceof InterruptedError && signalName !== null) Object.assign(error, { signal: signalName });
      throw error;
    }).finally(() => {
      stopListening?.();
      readBar?.finish();
      bar?.finish();
    });
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
