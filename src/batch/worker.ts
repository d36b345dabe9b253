/**
 * Worker-thread entry of a batch run (compiled to dist/batch/worker.js): receives one compound
 * job at a time, analyses it (and writes its report), and posts back its summary row.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { analyzeCompound, loadReportWriter, type CompoundSettings } from './analyze-compound.js';
import type { CompoundJob } from './types.js';

const settings = workerData as CompoundSettings;
const port = parentPort;
if (port === null) throw new Error('src/batch/worker.ts runs only as a worker thread');
const writeReport = await loadReportWriter(settings);

port.on('message', (job: CompoundJob) => {
  port.postMessage(analyzeCompound(job, settings, writeReport));
});
