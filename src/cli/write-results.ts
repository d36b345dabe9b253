/** Writes the result files of one analysis into a folder (`--out`). */
import { join } from 'node:path';
import type { AnalysisResult } from '../analysis/types.js';
import { analysisJson } from '../report/results-json.js';
import { parametersCsv } from '../report/parameters-csv.js';
import { textSummary } from '../report/text-summary.js';
import { writeFileAtomic } from '../report/write-atomic.js';

/** Writes results.json, parameters.csv and summary.txt; returns the paths written. */
export function writeResultFiles(result: AnalysisResult, dir: string): string[] {
  const files: Array<[string, string]> = [
    ['results.json', JSON.stringify(analysisJson(result), null, 2) + '\n'],
    ['parameters.csv', parametersCsv(result)],
    ['summary.txt', textSummary(result)],
  ];
  return files.map(([name, content]) => {
    const path = join(dir, name);
    writeFileAtomic(path, content);
    return path;
  });
}
