/**
 * A batch run: many input files (or folders, or multi-compound files) in, one analysis per
 * compound, one summary out (summary.csv, summary.json, index.html at the top of the output
 * folder), and per-compound report folders under compounds/ when asked for. The compounds run in
 * parallel on worker threads; the rows come back in input order, so the outputs do not depend on
 * the number of workers. Every file is written under a temporary name and then renamed
 * (writeFileAtomic), so an interrupted run leaves no half-written file.
 */
import { availableParallelism } from 'node:os';
import { join, resolve } from 'node:path';
import type { AnalysisOptions } from '../analysis/analyze-table.js';
import type { ParseOptions } from '../input/options.js';
import { InputError } from '../input/types.js';
import type { Json } from '../report/results-json.js';
import { writeFileAtomic } from '../report/write-atomic.js';
import { collectInputFiles } from './collect-inputs.js';
import { planCompounds } from './plan-compounds.js';
import { toPortableOptions, type PortableAnalysisOptions } from './analyze-compound.js';
import { runCompoundJobs } from './worker-pool.js';
import { summaryCounts, summaryCsv, summaryJson, type BatchSettings } from './summary-files.js';
import { indexPage } from './index-page.js';
import { harmoniseUnits } from './harmonise-units.js';
import { concentrationIn, type Concentration } from '../input/units.js';
import type { CompoundSummary } from './types.js';

/** Names of the files written at the top of the output folder. */
export const SUMMARY_CSV = 'summary.csv';
export const SUMMARY_JSON = 'summary.json';
export const INDEX_PAGE = 'index.html';

export interface BatchOptions {
  /** output folder; nothing is written when it is not given */
  out?: string;
  /** write each compound's report folder under <out>/compounds/ (needs `out`) */
  reports?: boolean;
  /** worker threads; default os.availableParallelism(); 1 runs in the calling thread */
  jobs?: number;
  /** how to read the tables (as for readRateFile) */
  parse?: ParseOptions;
  /** how to analyse each compound (as for analyzeTable) */
  analysis?: AnalysisOptions;
  /** folder relative input and output paths are taken from; default process.cwd() */
  cwd?: string;
  /** called after each compound, in completion order */
  onCompound?: (row: CompoundSummary, done: number, total: number) => void;
  /** called once the compounds are known, before any is analysed */
  onPlan?: (total: number) => void;
  /** how the run is named in each report's reproducibility footer; default "mechanist batch" */
  command?: string;
  /**
   * the [S] of the IC50 with its unit (`analysis.atSubstrate` is a bare number in the tables'
   * unit); converted to the run's [S] unit once the tables are read
   */
  atSubstrate?: Concentration;
}

export interface BatchResult {
  /** one row per compound, in input order */
  rows: CompoundSummary[];
  counts: { compounds: number; analysed: number; failed: number };
  /** notes about the inputs (repeated files, folders without table files) */
  notes: string[];
  /** absolute paths of summary.csv, summary.json and index.html (empty without `out`) */
  written: string[];
  /** worker threads that analysed compounds (0 when every compound ran in the calling thread) */
  threadsUsed: number;
  /** why worker threads could not be used, when some compounds fell back to the calling thread */
  workerProblem: string | null;
  settings: BatchSettings;
}

function batchSettings(options: BatchOptions, portable: PortableAnalysisOptions): BatchSettings {
  const analysis = JSON.parse(JSON.stringify(portable)) as { [key: string]: Json };
  return {
    errorModel: options.analysis?.errorModel ?? 'constant',
    level: options.analysis?.level ?? 0.95,
    reports: Boolean(options.reports),
    analysis,
  };
}

/**
 * Runs the batch. Throws InputError when the inputs hold no file at all or `reports` is asked for
 * without `out`; a file that cannot be read, or a compound that cannot be analysed, becomes a row
 * with `status: 'failed'` and the reason in `error`, and the others go on.
 */
export async function runBatch(inputs: readonly string[], options: BatchOptions = {}): Promise<BatchResult> {
  const cwd = options.cwd ?? process.cwd();
  const startedAt = new Date();
  if (options.reports && !options.out) throw new InputError('per-compound reports need an output folder', '');
  const { files, notes } = collectInputFiles(inputs, cwd);
  if (files.length === 0) {
    const what = inputs.length === 0 ? 'no inputs given' : `no rate-table files found in ${inputs.join(', ')}`;
    throw new InputError(`${what}; give files (.csv, .tsv, .txt) or folders holding them`, inputs[0] ?? '');
  }
  const jobs = await planCompounds(files, options.parse ?? {});
  const harmonised = harmoniseUnits(jobs);
  notes.push(...harmonised.notes);
  options.onPlan?.(jobs.length);
  const out = options.out ? resolve(cwd, options.out) : null;
  const analysisOptions = { ...(options.analysis ?? {}) };
  if (options.atSubstrate !== undefined) {
    const sUnit = harmonised.units.substrate;
    if (options.atSubstrate.unit !== null && sUnit === null)
      throw new InputError(`the inputs give no [S] unit to convert the IC50 [S] (${options.atSubstrate.value} ${options.atSubstrate.unit}) to; give --substrate-unit, or a plain number`, inputs[0] ?? '');
    analysisOptions.atSubstrate = sUnit === null ? options.atSubstrate.value : concentrationIn(options.atSubstrate, sUnit);
  }
  const portable = toPortableOptions(analysisOptions);
  const settings = batchSettings({ ...options, analysis: analysisOptions }, portable);
  let done = 0;
  const { rows, threadsUsed, workerProblem } = await runCompoundJobs(jobs, {
    threads: options.jobs ?? availableParallelism(),
    settings: {
      analysis: portable,
      reportRoot: options.reports ? out : null,
      command: options.command ?? 'mechanist batch',
      startedAt,
    },
    onRow: (row) => options.onCompound?.(row, ++done, jobs.length),
  });
  const written: string[] = [];
  if (out !== null) {
    const files: Array<[string, string]> = [
      [SUMMARY_CSV, summaryCsv(rows, settings.level)],
      [SUMMARY_JSON, summaryJson(rows, settings)],
      [INDEX_PAGE, indexPage(rows, { settings, finishedAt: new Date() })],
    ];
    for (const [name, content] of files) {
      const path = join(out, name);
      writeFileAtomic(path, content);
      written.push(path);
    }
  }
  return { rows, counts: summaryCounts(rows), notes, written, threadsUsed, workerProblem, settings };
}
