/** The demo analysis (data/demo/, invented data), run as the demo command runs it. */
import { readRateFile } from '../../src/input/index.js';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import type { AnalysisResult } from '../../src/analysis/types.js';
import { demoDataPath } from '../../src/cli/package-paths.js';
import { DEMO_SOURCE_NAME } from '../../src/cli/commands/demo.js';

export async function demoAnalysis(): Promise<AnalysisResult> {
  const [table] = await readRateFile(demoDataPath(), {});
  return analyzeTable({ ...table, source: DEMO_SOURCE_NAME }, { errorModel: 'proportional' });
}
