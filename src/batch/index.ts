/** Batch runs: many compounds analysed in parallel and summed up in one table. */
export { runBatch, type BatchOptions, type BatchResult } from './run-batch.js';
export { summarizeAnalysis, failedSummary } from './summarize.js';
export { summaryCsv, summaryJson, type BatchSettings } from './summary-files.js';
export { summaryColumns } from './summary-columns.js';
export { indexPage } from './index-page.js';
export type * from './types.js';
export { InterruptedError } from './worker-pool.js';
export { RUN_LOCK_FILE } from './run-lock.js';
