/**
 * Runs the compound jobs of a batch on worker threads (node:worker_threads), one job per worker
 * at a time, and hands back the rows in input order whatever the number of workers. With one job
 * slot, or when the compiled worker script is not there (running from the TypeScript sources,
 * e.g. under the test runner), the jobs run one after another in the calling thread instead.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { analyzeCompound, type CompoundSettings } from './analyze-compound.js';
import { failedSummary } from './summarize.js';
import type { CompoundJob, CompoundSummary } from './types.js';

export interface PoolOptions {
  /** number of worker threads wanted (at most one per job is started) */
  threads: number;
  settings: CompoundSettings;
  /** called once per finished compound, in completion order */
  onRow?: (row: CompoundSummary) => void;
}

export interface PoolOutcome {
  /** rows in job order */
  rows: CompoundSummary[];
  /** worker threads used (0: all jobs ran in the calling thread) */
  threadsUsed: number;
}

/** The compiled worker script beside this module (dist/batch/worker.js), or null when absent. */
export function workerScriptPath(): string | null {
  const path = fileURLToPath(new URL('./worker.js', import.meta.url));
  return existsSync(path) ? path : null;
}

export async function runCompoundJobs(jobs: readonly CompoundJob[], options: PoolOptions): Promise<PoolOutcome> {
  const script = workerScriptPath();
  const threads = Math.min(Math.max(1, Math.floor(options.threads)), jobs.length);
  if (threads <= 1 || script === null) return { rows: runInThread(jobs, options), threadsUsed: 0 };
  return { rows: await runOnWorkers(jobs, options, script, threads), threadsUsed: threads };
}

function runInThread(jobs: readonly CompoundJob[], options: PoolOptions): CompoundSummary[] {
  return jobs.map((job) => {
    const row = analyzeCompound(job, options.settings);
    options.onRow?.(row);
    return row;
  });
}

function identityOf(job: CompoundJob) {
  return { position: job.position, compound: job.compound, nameInFile: job.nameInFile, source: job.source };
}

function runOnWorkers(jobs: readonly CompoundJob[], options: PoolOptions, script: string, threads: number): Promise<CompoundSummary[]> {
  return new Promise((resolveAll) => {
    const rows: Array<CompoundSummary | undefined> = new Array(jobs.length);
    const workers = new Set<Worker>();
    let next = 0;
    let finished = 0;

    const record = (index: number, row: CompoundSummary) => {
      if (rows[index] !== undefined) return;
      rows[index] = row;
      finished += 1;
      options.onRow?.(row);
      if (finished === jobs.length) {
        for (const w of workers) void w.terminate();
        workers.clear();
        resolveAll(rows as CompoundSummary[]);
      }
    };

    const start = () => {
      const worker = new Worker(script, { workerData: options.settings });
      workers.add(worker);
      let current = -1;
      const feed = () => {
        if (next >= jobs.length) {
          current = -1;
          workers.delete(worker);
          void worker.terminate();
          return;
        }
        current = next++;
        worker.postMessage(jobs[current]);
      };
      worker.on('message', (row: CompoundSummary) => {
        record(current, row);
        feed();
      });
      // A worker that dies (e.g. out of memory) fails its compound; a fresh worker takes over.
      const replace = (why: string) => {
        if (!workers.has(worker)) return;
        workers.delete(worker);
        if (current >= 0) record(current, failedSummary(identityOf(jobs[current]), `analysis not completed: ${why}`, jobs[current].table));
        if (finished < jobs.length && next < jobs.length) start();
      };
      worker.on('error', (error) => replace(`the worker thread failed (${error.message})`));
      worker.on('exit', (code) => replace(`the worker thread stopped with code ${code}`));
      feed();
    };

    for (let k = 0; k < threads; k++) start();
  });
}
