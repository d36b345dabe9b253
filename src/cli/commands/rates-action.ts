/** The work of `mechanist rates` (loaded when the command runs; options in rates.ts and rates-options.ts). */
import { join, resolve } from 'node:path';
import { readsReportHtml } from '../../report/html/reads-page.js';
import { writeFileAtomic } from '../../report/write-atomic.js';
import type { CliIo } from '../io.js';
import { readsSummaryLine, runReads } from '../reads-input.js';
import { READS_PAGE, type RatesCliOptions } from './rates-options.js';

export async function runRates(io: CliIo, readsPaths: string[], o: RatesCliOptions): Promise<void> {
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
}
