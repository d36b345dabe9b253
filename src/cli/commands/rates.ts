/**
 * `mechanist rates READS... --plate-map MAP [--out FILE]`: initial rates from kinetic plate reads,
 * written as a long rate table that `analyze` and `batch` read as it is.
 */
import { Command } from 'commander';
import { join, resolve } from 'node:path';
import { readsReportHtml } from '../../report/html/reads-page.js';

/** The page that --report writes. */
export const READS_PAGE = 'reads.html';
import { writeFileAtomic } from '../../report/write-atomic.js';
import type { CliIo } from '../io.js';
import { addReadsOptions, readsSummaryLine, runReads, type ReadsCliOptions } from '../reads-input.js';

interface RatesCliOptions extends ReadsCliOptions {
  out?: string;
  report?: string;
  quiet?: boolean;
}

export function ratesCommand(io: CliIo): Command {
  const cmd = new Command('rates')
    .description('initial rates from kinetic plate reads (long: well,time,signal; wide: time then one column per well)')
    .argument('<reads...>', 'kinetic-read files (several files: one plate each, named by the file)')
    .option('--out <file>', 'write the rate table here (default: standard output)')
    .option('--report <dir>', 'also write <dir>/reads.html: one panel per well with its reads, window and line, by compound, [S] and [I]')
    .option('--quiet', 'no notes on stderr');
  addReadsOptions(cmd, true);
  cmd.action(async (readsPaths: string[], o: RatesCliOptions) => {
    const run = await runReads(readsPaths, o, io.cwd);
    if (o.out) {
      writeFileAtomic(resolve(io.cwd, o.out), run.text);
    } else {
      io.out(run.text);
    }
    if (o.report) {
      const page = join(resolve(io.cwd, o.report), READS_PAGE);
      writeFileAtomic(page, readsReportHtml(run.result, { date: new Date().toISOString().slice(0, 10) }));
    }
    if (!o.quiet) {
      for (const note of run.notes) io.err(`mechanist: note: ${note}\n`);
      io.err(`mechanist: ${readsSummaryLine(run.result)}${o.out ? `; wrote ${o.out}` : ''}${o.report ? `; page ${join(o.report, READS_PAGE)}` : ''}\n`);
    }
  });
  return cmd;
}
