/**
 * One compound of a batch: the same analysis as `mechanist analyze` (analyzeTable with the run's
 * options), its report folder when asked for (writeResultFiles), and its summary row. Runs in a
 * worker thread or in the calling thread; never throws for a bad compound, the row says why.
 */
import { basename, join, relative, sep } from 'node:path';
import { analyzeTable, AnalysisError, type AnalysisOptions } from '../analysis/analyze-table.js';
import { modelFor } from '../models/index.js';
import type { Mechanism } from '../models/types.js';
import type { writeResultFiles } from '../report/write-results.js';
import { failedSummary, summarizeAnalysis, summarizeDoseResponse } from './summarize.js';
import { analyzeSingleSubstrate, isSingleSubstrateTable } from '../analysis/single-substrate.js';
import { doseResponseFiles } from '../report/dose-response-output.js';
import { writeFileAtomic } from '../report/write-atomic.js';
import type { CompoundJob, CompoundSummary } from './types.js';

/** Sub-folder of the output folder that holds one report folder per compound. */
export const COMPOUNDS_FOLDER = 'compounds';

/** Writes one compound's report folder (src/report/write-results.ts). */
export type ReportWriter = typeof writeResultFiles;

/**
 * The report writer, loaded only when reports are wanted: it brings in the figure and page code
 * (and d3), about 0.2 s of a worker's start-up (it was over a second while the figures were drawn
 * on a DOM implementation, docs/decisions/figure-serialisation.md).
 */
export async function loadReportWriter(settings: CompoundSettings): Promise<ReportWriter | null> {
  return settings.reportRoot === null ? null : (await import('../report/write-results.js')).writeResultFiles;
}

/** Report files linked from the summary, in order of preference. */
const REPORT_ENTRY_FILES = ['report.html', 'summary.txt', 'results.json'];

/**
 * Analysis options as plain data that can be posted to a worker thread: models by name, and no
 * callbacks (a per-compound progress callback has no place in a batch, which shows its own).
 */
export type PortableAnalysisOptions = Omit<AnalysisOptions, 'models' | 'onProgress'> & { mechanisms?: Mechanism[] };

export interface CompoundSettings {
  analysis: PortableAnalysisOptions;
  /** output folder of the run when per-compound reports are wanted, else null */
  reportRoot: string | null;
  /** for the reports' reproducibility footer: the command and when the run started */
  command: string;
  startedAt: Date;
}

/**
 * The options of a batch run as plain data. A bootstrap runs in the thread of its compound
 * (workers: 1): the batch is already parallel across compounds, and the bootstrap's result does
 * not depend on its number of threads (src/evidence/bootstrap/bootstrap-threads.ts).
 */
export function toPortableOptions(options: AnalysisOptions): PortableAnalysisOptions {
  const { models, ...rest } = options;
  const plain = Object.fromEntries(Object.entries(rest).filter(([, value]) => typeof value !== 'function')) as PortableAnalysisOptions;
  if (plain.bootstrap) plain.bootstrap = { ...plain.bootstrap, workers: 1 };
  return models ? { ...plain, mechanisms: models.map((m) => m.mechanism) } : plain;
}

export function fromPortableOptions(options: PortableAnalysisOptions): AnalysisOptions {
  const { mechanisms, ...rest } = options;
  return mechanisms ? { ...rest, models: mechanisms.map(modelFor) } : rest;
}

function oneLine(text: string): string {
  return text.replace(/\s*\n\s*/g, ' ').trim();
}

function failureText(error: unknown): string {
  if (error instanceof AnalysisError) return `analysis not completed: ${oneLine(error.message)}`;
  const message = error instanceof Error ? error.message : String(error);
  return `analysis not completed: ${oneLine(message)} (an unexpected internal error; please report it with the input file)`;
}

function reportLink(written: string[], root: string): string | null {
  for (const name of REPORT_ENTRY_FILES) {
    const path = written.find((p) => basename(p) === name);
    if (path) return relative(root, path).split(sep).join('/');
  }
  return null;
}

/**
 * A compound with one [S] level (an IC50 curve): the dose-response fit `analyze` gives it, its
 * results.json and summary.txt when reports are asked for, and its row.
 */
function doseResponseCompound(job: CompoundJob, identity: Parameters<typeof failedSummary>[0], settings: CompoundSettings): CompoundSummary {
  const table = job.table!;
  let result;
  try {
    result = analyzeSingleSubstrate(table, { level: settings.analysis.level ?? 0.95 });
  } catch (error) {
    return failedSummary(identity, failureText(error), table);
  }
  let report: string | null = null;
  if (settings.reportRoot !== null) {
    try {
      const dir = join(settings.reportRoot, COMPOUNDS_FOLDER, job.folder);
      const written = doseResponseFiles(result).map(([name, content]) => {
        const path = join(dir, name);
        writeFileAtomic(path, content);
        return path;
      });
      report = reportLink(written, settings.reportRoot);
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      return failedSummary(identity, `the report could not be written: ${oneLine(message)}`, table);
    }
  }
  return summarizeDoseResponse(result, identity, report);
}

/**
 * Analyses one compound and returns its summary row (a failed row when anything goes wrong).
 * `writeReport` (see loadReportWriter) must be given when `settings.reportRoot` is set.
 */
export function analyzeCompound(job: CompoundJob, settings: CompoundSettings, writeReport: ReportWriter | null = null): CompoundSummary {
  const identity = { position: job.position, compound: job.compound, nameInFile: job.nameInFile, source: job.source };
  if (job.table === null) return failedSummary(identity, job.readError ?? 'the file could not be read');
  if (isSingleSubstrateTable(job.table)) return doseResponseCompound(job, identity, settings);
  let result;
  try {
    // Without reports, only what the summary row needs (the verdict and the named mechanism's
    // constants are the same as in a full analysis; see AnalysisOptions.detail).
    const detail = settings.reportRoot === null ? 'summary' : 'full';
    result = analyzeTable(job.table, { ...fromPortableOptions(settings.analysis), detail });
  } catch (error) {
    return failedSummary(identity, failureText(error), job.table);
  }
  let report: string | null = null;
  if (settings.reportRoot !== null) {
    try {
      if (writeReport === null) throw new Error('no report writer was loaded');
      const written = writeReport(result, join(settings.reportRoot, COMPOUNDS_FOLDER, job.folder), {
        command: settings.command,
        ...(job.inputSha256 !== null ? { inputSha256: job.inputSha256 } : {}),
        seed: settings.analysis.bootstrap?.seed ?? null,
        generatedAt: settings.startedAt,
      });
      report = reportLink(written, settings.reportRoot);
    } catch (error) {
      // paths relative to the output folder, as everywhere in the summary
      const message = (error instanceof Error ? error.message : String(error)).split(settings.reportRoot + sep).join('');
      return failedSummary(identity, `the report could not be written: ${oneLine(message)}`, job.table);
    }
  }
  return summarizeAnalysis(result, identity, report);
}
