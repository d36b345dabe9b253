/**
 * summary.csv and summary.json of a batch run. Both hold only results, never timings or dates,
 * so that the same inputs and options give byte-identical files whatever the number of workers.
 */
import { TOOL_NAME, TOOL_VERSION } from '../version.js';
import type { Json } from '../report/results-json.js';
import { summaryColumns } from './summary-columns.js';
import type { CompoundSummary } from './types.js';
import { csvCell } from '../report/csv-cell.js';

/** What the run was asked to do, as written into summary.json. */
export interface BatchSettings {
  errorModel: string;
  level: number;
  reports: boolean;
  /** every analysis option of the run (plain data) */
  analysis: { [key: string]: Json };
}


export function summaryCsv(rows: readonly CompoundSummary[], level: number): string {
  const columns = summaryColumns(level);
  const lines = [columns.map((c) => c.name).join(',')];
  for (const row of rows) lines.push(columns.map((c) => csvCell(c.value(row))).join(','));
  return lines.join('\n') + '\n';
}

export function summaryCounts(rows: readonly CompoundSummary[]): { compounds: number; analysed: number; failed: number } {
  const failed = rows.filter((r) => r.status === 'failed').length;
  return { compounds: rows.length, analysed: rows.length - failed, failed };
}

export function summaryJson(rows: readonly CompoundSummary[], settings: BatchSettings): string {
  const doc = {
    tool: { name: TOOL_NAME, version: TOOL_VERSION },
    settings,
    counts: summaryCounts(rows),
    compounds: rows,
  };
  return JSON.stringify(doc, null, 2) + '\n';
}
