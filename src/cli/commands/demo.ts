/**
 * `mechanist demo`: analyses the shipped demo table (an invented scenario: compound KT-0417
 * against the fictional amidase HLX-1; see data/demo/README.md) and writes the results under
 * reports/demo/ (report.html, figures/, results.json, parameters.csv, summary.txt).
 */
import { Command } from 'commander';
import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import type { CliIo } from '../io.js';
import { demoDataPath } from '../package-paths.js';

export const DEMO_SOURCE_NAME = 'data/demo/hlx-amidase-kt0417.csv';

export function demoCommand(io: CliIo): Command {
  const cmd = new Command('demo')
    .description('analyse the shipped demo dataset and write the results to reports/demo/')
    .option('--out <dir>', 'output folder', 'reports/demo');
  return cmd.action(async (o: { out: string }) => {
      // loaded when the command runs, not at start-up (issue 13)
      const [{ readRateFile }, { analyzeTable }, { textSummary }, { sha256Hex }, { prepareReportFolders }] = await Promise.all([
        import('../../input/index.js'),
        import('../../analysis/analyze-table.js'),
        import('../../report/text-summary.js'),
        import('../../input/file-hash.js'),
        import('./analyze-action.js'),
      ]);
      const dir = resolve(io.cwd, o.out);
      // the default folder may be created with its parents; a folder the user names needs its parent
      prepareReportFolders(dir, o.out, [dir], cmd.getOptionValueSource('out') === 'default');
      const [table] = await readRateFile(demoDataPath(), {});
      const result = analyzeTable({ ...table, source: DEMO_SOURCE_NAME }, { errorModel: 'proportional' });
      // loaded here, not at start-up: the figure code (d3 and the report page) need not load for the rest
      const { writeResultFiles } = await import('../../report/write-results.js');
      writeResultFiles(result, dir, {
        command: 'mechanist demo',
        inputSha256: sha256Hex(await readFile(demoDataPath())),
        options: { '--error': 'proportional (fixed for the demo)' },
        // no date: the committed reports/demo/ stays byte-identical when the README's demo is rerun
        generatedAt: null,
      });
      io.out(textSummary(result));
      io.out(`\nResults written to ${o.out}/\n`);
    });
}
