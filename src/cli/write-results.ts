/** Writes the result files of one analysis into a folder (`--out`). */
import { readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import type { AnalysisResult } from '../analysis/types.js';
import { analysisJson } from '../report/results-json.js';
import { parametersCsv } from '../report/parameters-csv.js';
import { textSummary } from '../report/text-summary.js';
import { writeFileAtomic } from '../report/write-atomic.js';
import { renderFigures } from '../figures/render-figures.js';
import { reportHtml } from '../report/html/report-page.js';
import type { ReportProvenance } from '../report/html/provenance.js';

export const FIGURES_FOLDER = 'figures';

/**
 * Writes results.json, parameters.csv, summary.txt, report.html and figures/*.svg; returns the
 * paths written. `provenance` (input hash, options, seed, date) goes into the report's footer.
 * SVG files in figures/ that this analysis no longer draws are removed, so the folder always
 * matches the report.
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
  const written = files.map(([name, content]) => {
    const path = join(dir, name);
    writeFileAtomic(path, content);
    return path;
  });
  removeStaleFigures(join(dir, FIGURES_FOLDER), new Set(figures.map((f) => f.file)));
  return written;
}

function removeStaleFigures(folder: string, keep: ReadonlySet<string>): void {
  for (const name of readdirSync(folder)) {
    if (name.endsWith('.svg') && !keep.has(name)) rmSync(join(folder, name));
  }
}
