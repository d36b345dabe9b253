/**
 * Runs the bootstrap tasks in the calling thread, optionally helped by worker threads
 * (node:worker_threads). Synchronous for the caller: the calling thread takes tasks itself and,
 * when none are left, waits (Atomics.wait) for the workers' last ones.
 *
 * Protocol: a shared Int32 array [next task, tasks done, failure flag]. Every thread claims the
 * next index with Atomics.add, runs it, writes the row into a shared Float64 array at that index
 * and counts it as done. Rows are placed by task index, and each task seeds its own random numbers
 * from (seed, index), so the output is the same for any number of threads.
 *
 * Workers load the compiled JavaScript beside this file (dist/evidence/bootstrap/bootstrap-worker.js). When
 * that file is not there (running from the TypeScript sources, as the tests do), everything runs
 * in the calling thread.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { MessageChannel, Worker, receiveMessageOnPort } from 'node:worker_threads';
import { rowWidth, runTask, type BootstrapPlan } from './bootstrap-tasks.js';

/** Longest wait without any task finishing before the run is declared stuck (ms). */
const STALL_LIMIT_MS = 300_000;

function workerScript(): URL | null {
  if (!import.meta.url.endsWith('.js')) return null;
  const url = new URL('./bootstrap-worker.js', import.meta.url);
  return existsSync(fileURLToPath(url)) ? url : null;
}

/**
 * Runs tasks 0 .. total-1 of the plan on `threads` threads in all (the caller's plus threads - 1
 * workers) and returns the rows, task by task. `onProgress(done, total)` is called from the
 * calling thread.
 */
export function runBootstrapTasks(plan: BootstrapPlan, total: number, threads: number, onProgress?: (done: number, total: number) => void): Float64Array {
  const width = rowWidth(plan);
  const script = threads > 1 ? workerScript() : null;
  const extra = script ? Math.min(threads - 1, Math.max(0, total - 1)) : 0;
  const output = new SharedArrayBuffer(Float64Array.BYTES_PER_ELEMENT * width * total);
  const out = new Float64Array(output);
  const counters = new Int32Array(new SharedArrayBuffer(3 * Int32Array.BYTES_PER_ELEMENT));
  const channels: MessageChannel[] = [];
  const workers: Worker[] = [];
  for (let w = 0; w < extra; w++) {
    const channel = new MessageChannel();
    channels.push(channel);
    workers.push(
      new Worker(script!, {
        workerData: { plan, total, output, counters: counters.buffer, errors: channel.port2 },
        transferList: [channel.port2],
      }),
    );
  }
  try {
    for (;;) {
      if (Atomics.load(counters, 2) !== 0) break;
      const index = Atomics.add(counters, 0, 1);
      if (index >= total) break;
      runTask(plan, index, out, index * width);
      const done = Atomics.add(counters, 1, 1) + 1;
      onProgress?.(done, total);
    }
    let lastDone = Atomics.load(counters, 1);
    let lastChange = Date.now();
    while (lastDone < total && Atomics.load(counters, 2) === 0) {
      Atomics.wait(counters, 1, lastDone, 200);
      const done = Atomics.load(counters, 1);
      if (done !== lastDone) {
        lastDone = done;
        lastChange = Date.now();
        onProgress?.(done, total);
      } else if (Date.now() - lastChange > STALL_LIMIT_MS) {
        throw new Error('bootstrap: worker threads stopped making progress');
      }
    }
    if (Atomics.load(counters, 2) !== 0) {
      const messages = channels.map((c) => receiveMessageOnPort(c.port1)?.message).filter((m) => m !== undefined);
      throw new Error(`bootstrap worker failed: ${messages.join('; ') || 'unknown error'}`);
    }
  } finally {
    for (const worker of workers) void worker.terminate();
    for (const channel of channels) channel.port1.close();
  }
  return Float64Array.from(out);
}
