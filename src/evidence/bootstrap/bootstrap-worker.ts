/**
 * Worker-thread entry of the bootstrap (loaded from the compiled dist/ tree only). Takes task
 * indices from the shared counter until none are left, writes each row into the shared output and
 * counts it as done. See bootstrap-threads.ts for the protocol.
 */
import { workerData } from 'node:worker_threads';
import type { MessagePort } from 'node:worker_threads';
import { rowWidth, runTask, type BootstrapPlan } from './bootstrap-tasks.js';

interface WorkerInput {
  plan: BootstrapPlan;
  total: number;
  output: SharedArrayBuffer;
  /** [next task, tasks done, failure flag] */
  counters: SharedArrayBuffer;
  errors: MessagePort;
}

const input = workerData as WorkerInput;
const counters = new Int32Array(input.counters);
const out = new Float64Array(input.output);
const width = rowWidth(input.plan);
try {
  for (;;) {
    const index = Atomics.add(counters, 0, 1);
    if (index >= input.total) break;
    runTask(input.plan, index, out, index * width);
    Atomics.add(counters, 1, 1);
    Atomics.notify(counters, 1);
  }
} catch (error) {
  input.errors.postMessage(error instanceof Error ? error.message : String(error));
  Atomics.store(counters, 2, 1);
  Atomics.notify(counters, 1);
}
input.errors.close();
