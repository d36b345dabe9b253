/**
 * Runs the compound jobs of a batch on worker threads (node:worker_threads), one job per worker
 * at a time, and hands back the rows in input order whatever the number of workers. With one job
 * slot, or when the compiled worker script is not there (running from the TypeScript sources,
 * e.g. under the test runner), the jobs run one after another in the calling thread instead.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { analyzeCompound, loadReportWriter, type CompoundSettings, type ReportWriter } from './analyze-compound.js';
import { failedSummary } from './summarize.js';
import type { CompoundJob, CompoundSummary } from './types.js';

/**
 * Heap limit per worker. V8 otherwise lets each worker's heap grow far before collecting, which
 * with report rendering (then on a DOM implementation per worker) pushed a 2-worker run past
 * 500 MB; a cap makes it collect sooner. 384 MB of old space is several times what one compound's
 * report needs (bench/batch-bench.mjs measures the peak).
 */
const WORKER_LIMITS = { maxOldGenerationSizeMb: 384 };

/** The run was stopped through its AbortSignal (Ctrl-C on the command line). */
export class InterruptedError extends Error {
  constructor() {
    super('the run was interrupted');
    this.name = 'InterruptedError';
  }
}

interface PoolOptions {
  /** aborting stops the jobs: workers are terminated and the run rejects with InterruptedError */
  signal?: AbortSignal;
  /** number of worker threads wanted (at most one per job is started) */
  threads: number;
  settings: CompoundSettings;
  /** called once per finished compound, in completion order */
  onRow?: (row: CompoundSummary) => void;
}

interface PoolOutcome {
  /** rows in job order */
  rows: CompoundSummary[];
  /** worker threads that analysed at least one compound (0: all ran in the calling thread) */
  threadsUsed: number;
  /** why a worker thread could not start (its compounds ran in the calling thread), else null */
  workerProblem: string | null;
}

/** The compiled worker script beside this module (dist/batch/worker.js), or null when absent. */
function workerScriptPath(): string | null {
  const path = fileURLToPath(new URL('./worker.js', import.meta.url));
  return existsSync(path) ? path : null;
}

export async function runCompoundJobs(jobs: readonly CompoundJob[], options: PoolOptions): Promise<PoolOutcome> {
  const script = workerScriptPath();
  const threads = Math.min(Math.max(1, Math.floor(options.threads)), jobs.length);
  // loaded here too: the calling thread writes reports when it runs compounds itself
  const writeReport = await loadReportWriter(options.settings);
  if (options.signal?.aborted) throw new InterruptedError();
  if (threads <= 1 || script === null) return { rows: await runInThread(jobs, options, writeReport), threadsUsed: 0, workerProblem: null };
  return runOnWorkers(jobs, options, script, threads, writeReport);
}

/** Gives the event loop a turn, so that a signal handler can run between two compounds. */
const yieldToEvents = () => new Promise<void>((done) => setImmediate(done));

async function runInThread(jobs: readonly CompoundJob[], options: PoolOptions, writeReport: ReportWriter | null): Promise<CompoundSummary[]> {
  const rows: CompoundSummary[] = [];
  for (const job of jobs) {
    if (options.signal) {
      await yieldToEvents();
      if (options.signal.aborted) throw new InterruptedError();
    }
    const row = analyzeCompound(job, options.settings, writeReport);
    options.onRow?.(row);
    rows.push(row);
  }
  return rows;
}

/**
 * Node options for the workers: the parent's, less those that only make sense for a main script
 * (--input-type, --eval, --print and their values), which a worker refuses.
 */
function workerExecArgv(argv: readonly string[] = process.execArgv): string[] {
  const kept: string[] = [];
  for (let k = 0; k < argv.length; k++) {
    const arg = argv[k];
    if (arg === '-e' || arg === '--eval' || arg === '-p' || arg === '--print' || arg === '--input-type') {
      k += 1;
      continue;
    }
    if (arg.startsWith('--input-type=') || arg.startsWith('--eval=') || arg.startsWith('--print=')) continue;
    kept.push(arg);
  }
  return kept;
}

function identityOf(job: CompoundJob) {
  return { position: job.position, compound: job.compound, nameInFile: job.nameInFile, source: job.source };
}

function runOnWorkers(
  jobs: readonly CompoundJob[],
  options: PoolOptions,
  script: string,
  threads: number,
  writeReport: ReportWriter | null,
): Promise<PoolOutcome> {
  return new Promise((resolveAll, rejectAll) => {
    let stopped = false;
    let workersThatAnswered = 0;
    let workerProblem: string | null = null;
    const rows: Array<CompoundSummary | undefined> = new Array(jobs.length);
    const workers = new Set<Worker>();
    let next = 0;
    let finished = 0;

    const record = (index: number, row: CompoundSummary) => {
      if (stopped || rows[index] !== undefined) return;
      rows[index] = row;
      finished += 1;
      options.onRow?.(row);
      if (finished === jobs.length) {
        stopped = true;
        options.signal?.removeEventListener('abort', stop);
        for (const w of workers) void w.terminate();
        workers.clear();
        resolveAll({ rows: rows as CompoundSummary[], threadsUsed: workersThatAnswered, workerProblem });
      }
    };

    // On abort: every worker is terminated (a write in progress ends first), then the run rejects.
    function stop(): void {
      if (stopped) return;
      stopped = true;
      const ending = [...workers].map((w) => w.terminate());
      workers.clear();
      void Promise.allSettled(ending).then(() => rejectAll(new InterruptedError()));
    }
    options.signal?.addEventListener('abort', stop, { once: true });

    const runHere = (index: number) => record(index, analyzeCompound(jobs[index], options.settings, writeReport));
    // With no worker left (none could start), the calling thread does the rest.
    const drainIfAlone = () => {
      if (workers.size > 0) return;
      while (next < jobs.length) runHere(next++);
    };

    // Node refuses to start a worker with some of the parent's options: V8 flags (--maglev,
    // --max-old-space-size; a worker's heap is set by WORKER_LIMITS instead) and process-wide ones
    // (ERR_WORKER_INVALID_EXEC_ARGV). The workers then start without the parent's options.
    let execArgv = workerExecArgv();
    const newWorker = (): Worker => {
      try {
        return new Worker(script, { workerData: options.settings, execArgv, resourceLimits: WORKER_LIMITS });
      } catch (error) {
        if (execArgv.length === 0 || (error as { code?: string }).code !== 'ERR_WORKER_INVALID_EXEC_ARGV') throw error;
        execArgv = [];
        return new Worker(script, { workerData: options.settings, execArgv, resourceLimits: WORKER_LIMITS });
      }
    };

    const start = () => {
      let worker: Worker;
      try {
        worker = newWorker();
      } catch (error) {
        // a worker that cannot start at all: its compounds run as when a worker dies at once
        workerProblem ??= `a worker thread could not be started (${error instanceof Error ? error.message : String(error)})`;
        drainIfAlone();
        return;
      }
      workers.add(worker);
      let current = -1;
      let answered = false;
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
        if (stopped) return;
        if (!answered) workersThatAnswered += 1;
        answered = true;
        record(current, row);
        feed();
      });
      const lost = (why: string, outOfMemory = false) => {
        if (stopped || !workers.has(worker)) return;
        workers.delete(worker);
        if (!answered && !outOfMemory) {
          // The worker could not start (or died on its first compound): that compound, and the
          // rest if no worker is left, run in the calling thread; no new worker is started.
          workerProblem ??= why;
          if (current >= 0) runHere(current);
          drainIfAlone();
          return;
        }
        // A worker that dies later, or runs out of memory, fails its compound; a fresh one takes over.
        if (current >= 0) record(current, failedSummary(identityOf(jobs[current]), `analysis not completed: ${why}`, jobs[current].table));
        if (finished < jobs.length && next < jobs.length) start();
      };
      worker.on('error', (error) =>
        lost(`the worker thread failed (${error.message})`, (error as NodeJS.ErrnoException).code === 'ERR_WORKER_OUT_OF_MEMORY'));
      worker.on('exit', (code) => lost(`the worker thread stopped with code ${code}`));
      feed();
    };

    for (let k = 0; k < threads; k++) start();
  });
}
