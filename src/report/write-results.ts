/** Writes the result files of one analysis into a folder (`--out`). */
import { join } from 'node:path';
import type { AnalysisResult } from '../analysis/types.js';
import { analysisJson } from './results-json.js';
import { parametersCsv } from './parameters-csv.js';
import { textSummary } from './text-summary.js';
import { writeFolderAtomic } from './write-atomic.js';
import { renderFigures } from '../figures/render-figures.js';
import { reportHtml } from './html/report-page.js';
import type { ReportProvenance } from './html/provenance.js';

const FIGURES_FOLDER = 'figures';

/**
 * Writes results.json, parameters.csv, summary.txt, report.html and figures/*.svg; returns the
 * paths written. `provenance` (input hash, options, seed, date) goes into the report's footer.
 * The folder is built under a temporary name and renamed into place (writeFolderAtomic): it
 * appears complete or not at all, and replaces an older report folder whole, so figures/ always
 * matches the report. Throws OutputError when the folder cannot be written.
 */
export function writeResultFiles(result: AnalysisResult, dir: string, provenance: ReportProvenance = {}): string[] {
  const figures = renderFigures(result);
  const files: Array<[string, string]> = [
    ['results.json', JSON.stringify(analysisJson(result), null, 2) + '\n'],
    ['parameters.csv', parametersCsv(result)],
    ['summary.txt', textSummary(result)],
    ['report.html', reportHtml({ result, figures, provenance })],
    ...figures.map((f): [string, string] => [join(FIGURES_FOLDER, f.file), f.svg + '\n']),
  ];
  writeFolderAtomic(dir, files);
  return files.map(([name]) => join(dir, name));
}
