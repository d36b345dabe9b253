/** Batch runs: many compounds analysed in parallel and summed up in one table. */
export { runBatch, SUMMARY_CSV, SUMMARY_JSON, INDEX_PAGE, type BatchOptions, type BatchResult } from './run-batch.js';
export { summarizeAnalysis, failedSummary, constantSummary, type RowIdentity } from './summarize.js';
export { summaryCsv, summaryJson, type BatchSettings } from './summary-files.js';
export { summaryColumns, type SummaryColumn } from './summary-columns.js';
export { indexPage } from './index-page.js';
export { collectInputFiles, TABLE_FILE_ENDINGS, type InputFile } from './collect-inputs.js';
export { uniqueCompoundIds } from './plan-compounds.js';
export type * from './types.js';
export { InterruptedError } from './worker-pool.js';
export { takeRunLock, RUN_LOCK_FILE, type RunLock } from './run-lock.js';
