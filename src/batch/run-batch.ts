/**
 * A batch run: many input files (or folders, or multi-compound files) in, one analysis per
 * compound, one summary out (summary.csv, summary.json, index.html at the top of the output
 * folder), and per-compound report folders under compounds/ when asked for. The compounds run in
 * parallel on worker threads; the rows come back in input order, so the outputs do not depend on
 * the number of workers.
 *
 * Output safety (README, "Output folder safety"): the output folder is checked before any file is
 * read (checkOutputFolder); the run holds the folder's lock (run-lock.ts) so a second run into it
 * refuses instead of mixing; every report folder appears complete or not at all
 * (writeFolderAtomic) and the three summary files are renamed into place together; temporary
 * entries of killed runs are cleared at the start, this run's own on an interrupt (`signal`).
 */
import { availableParallelism } from 'node:os';
import { existsSync, mkdirSync, readdirSync, rmSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { AnalysisOptions } from '../analysis/analyze-table.js';
import type { ParseOptions } from '../input/options.js';
import { InputError } from '../input/types.js';
import type { Json } from '../report/results-json.js';
import { removeStaleTemporaries, writeFileAtomic, writeFilesAtomic } from '../report/write-atomic.js';
import { checkOutputFolder, isReportEntry, REPORT_ENTRIES } from '../report/output-folder.js';
import { takeRunLock, type RunLock } from './run-lock.js';
import { COMPOUNDS_FOLDER } from './analyze-compound.js';
import { InterruptedError } from './worker-pool.js';
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
const SUMMARY_CSV = 'summary.csv';
const SUMMARY_JSON = 'summary.json';
const INDEX_PAGE = 'index.html';

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
  /** called after each input file is read (done, total), before any compound is analysed */
  onRead?: (done: number, total: number) => void;
  /** called once the compounds are known, before any is analysed */
  onPlan?: (total: number) => void;
  /** how the run is named in each report's reproducibility footer; default "mechanist batch" */
  command?: string;
  /** aborting stops the run: workers end, this run's temporary files go, the lock is released, and runBatch rejects with InterruptedError */
  signal?: AbortSignal;
  /**
   * the [S] of the IC50 with its unit (`analysis.atSubstrate` is a bare number in the tables'
   * unit); converted to the run's [S] unit once the tables are read
   */
  atSubstrate?: Concentration;
  /**
   * tables made by the caller (a rate table from plate reads), written into `out` under these
   * names once the run holds the folder's lock, and analysed with the inputs
   */
  generatedInputs?: ReadonlyArray<{ name: string; text: string }>;
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
    errorModel: options.analysis?.errorModel ?? 'auto',
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
  const out = options.out ? resolve(cwd, options.out) : null;
  // the output folder is checked before any input is read, let alone analysed
  const check = out !== null ? checkOutputFolder(out, options.out) : null;
  const { files, notes } = collectInputFiles(inputs, cwd);
  const generated = options.generatedInputs ?? [];
  if (generated.length > 0 && out === null) throw new InputError('tables made from plate reads need an output folder to be written to', '');
  if (files.length === 0 && generated.length === 0) {
    const what = inputs.length === 0 ? 'no inputs given' : `no rate-table files found in ${inputs.join(', ')}`;
    throw new InputError(`${what}; give files (.csv, .tsv, .txt) or folders holding them`, inputs[0] ?? '');
  }
  let lock: RunLock | null = null;
  if (out !== null) {
    if (check?.created) mkdirSync(out);
    lock = takeRunLock(out, options.out ?? out, options.command ?? 'mechanist batch');
    if (lock.note !== null) notes.push(lock.note);
    const cleared = [...removeStaleTemporaries(out), ...removeStaleTemporaries(join(out, COMPOUNDS_FOLDER))];
    if (cleared.length > 0) notes.push(`removed ${cleared.length} temporary ${cleared.length === 1 ? 'entry' : 'entries'} left by an interrupted run`);
    // written only now, under the lock: a second run into the same folder cannot overwrite them
    for (const g of generated) {
      const path = join(out, g.name);
      writeFileAtomic(path, g.text);
      files.push({ given: join(options.out ?? out, g.name), path });
    }
  }
  try {
    return await runLocked(files, notes, out, startedAt, options);
  } catch (error) {
    if (out !== null && error instanceof InterruptedError) {
      removeStaleTemporaries(out, true);
      removeStaleTemporaries(join(out, COMPOUNDS_FOLDER), true);
      removeIfEmpty(join(out, COMPOUNDS_FOLDER));
    }
    lock?.release();
    lock = null;
    // a folder this run created and left empty goes too
    if (out !== null && check?.created) removeIfEmpty(out);
    throw error;
  } finally {
    lock?.release();
  }
}

/** The run proper, once the output folder is checked and locked: plan, analyse, write. */
async function runLocked(
  files: ReturnType<typeof collectInputFiles>['files'],
  notes: string[],
  out: string | null,
  startedAt: Date,
  options: BatchOptions,
): Promise<BatchResult> {
  const jobs = await planCompounds(files, options.parse ?? {}, options.onRead);
  const harmonised = harmoniseUnits(jobs);
  notes.push(...harmonised.notes);
  options.onPlan?.(jobs.length);
  const analysisOptions = { ...(options.analysis ?? {}) };
  if (options.atSubstrate !== undefined) {
    const sUnit = harmonised.units.substrate;
    if (options.atSubstrate.unit !== null && sUnit === null)
      throw new InputError(`the inputs give no [S] unit to convert the IC50 [S] (${options.atSubstrate.value} ${options.atSubstrate.unit}) to; give --substrate-unit, or a plain number`, '');
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
    ...(options.signal ? { signal: options.signal } : {}),
  });
  const written: string[] = [];
  if (out !== null) {
    const files: Array<[string, string]> = [
      [join(out, SUMMARY_CSV), summaryCsv(rows, settings.level)],
      [join(out, SUMMARY_JSON), summaryJson(rows, settings)],
      [join(out, INDEX_PAGE), indexPage(rows, { settings, finishedAt: new Date() })],
    ];
    writeFilesAtomic(files);
    written.push(...files.map(([path]) => path));
    notes.push(...tidyReportFolders(out, jobs.map((job, k) => (rows[k].report !== null ? job.folder : null)), Boolean(options.reports)));
  }
  return { rows, counts: summaryCounts(rows), notes, written, threadsUsed, workerProblem, settings };
}

function removeIfEmpty(folder: string): void {
  try {
    if (readdirSync(folder).length === 0) rmSync(folder, { recursive: true });
  } catch {
    // absent already, or not ours to remove
  }
}

/** True for a folder that holds a report's files only (so it can be removed without loss). */
function isReportFolder(path: string): boolean {
  try {
    if (!statSync(path).isDirectory()) return false;
    const names = readdirSync(path);
    return names.some((name) => REPORT_ENTRIES.has(name)) && names.every(isReportEntry);
  } catch {
    return false;
  }
}

/**
 * Keeps compounds/ in step with the summary: with reports, report folders this run did not write
 * (compounds of an earlier run, or a compound that failed this time) are removed, so every report
 * there belongs to this summary; without reports, earlier reports are left alone, with a note.
 */
function tidyReportFolders(out: string, writtenFolders: ReadonlyArray<string | null>, reports: boolean): string[] {
  const root = join(out, COMPOUNDS_FOLDER);
  if (!existsSync(root)) return [];
  removeIfEmpty(root); // no report could be written: no empty folder either
  if (!existsSync(root)) return [];
  const current = new Set(writtenFolders.filter((f): f is string => f !== null));
  const older = readdirSync(root).filter((name) => !current.has(name) && isReportFolder(join(root, name)));
  if (older.length === 0) return [];
  if (!reports) return [`${COMPOUNDS_FOLDER}/ holds ${older.length} report ${older.length === 1 ? 'folder' : 'folders'} of an earlier run; this summary does not link them`];
  for (const name of older) rmSync(join(root, name), { recursive: true, force: true });
  return [`removed ${older.length} report ${older.length === 1 ? 'folder' : 'folders'} of an earlier run from ${COMPOUNDS_FOLDER}/ (not part of this run)`];
}
