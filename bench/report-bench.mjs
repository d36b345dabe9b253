#!/usr/bin/env node
/**
 * Speed of the whole report for one compound: a 120-point dataset (8 [S] x 5 [I] x 3 replicates,
 * seeded simulation of mixed inhibition with 5% proportional noise: invented data) analysed with
 * the default stages (five global fits, Wald and profile intervals, joint region, per-series fits,
 * diagnostics), then every figure rendered (src/figures, on its own element tree) and the HTML page
 * assembled. Files are not written (disk time is not the report's). Figures alone and the page
 * alone are timed too, to show where the time goes.
 *
 *   npx tsc -p tsconfig.json && node bench/report-bench.mjs
 *
 * Target: the whole report under 1 s after warm-up (median of the timed runs).
 *
 * Figure rendering choice (measured on this 2-core machine): d3 + jsdom with XMLSerializer took
 * about 450 ms for the 15 figures; serialising with jsdom's HTML serialiser and writing the data
 * markers as text brought it to about 150 ms of CPU time, the axes as text to about 20 ms. The
 * figures are now built on an element tree of their own that writes the same bytes
 * (src/figures/svg-document.ts, docs/decisions/figure-serialisation.md): a few ms.
 */
import { performance } from 'node:perf_hooks';
import { cpus, loadavg } from 'node:os';
import { analyzeTable } from '../dist/analysis/analyze-table.js';
import { simulateRates } from '../dist/simulate/simulate-rates.js';
import { tableFromPoints } from '../dist/simulate/table-from-points.js';
import { renderFigures } from '../dist/figures/render-figures.js';
import { reportHtml } from '../dist/report/html/report-page.js';

const TARGET_MS = 1000;
const WARM_UP = 3;
const RUNS = 15;

const points = simulateRates({
  mechanism: 'mixed',
  params: { Vmax: 100, Km: 10, Ki: 2, Kiu: 10 },
  substrate: [2, 4, 7, 10, 15, 25, 50, 100],
  inhibitor: [0, 1, 2, 4, 8],
  replicates: 3,
  noise: 'proportional',
  noiseLevel: 0.05,
  seed: 20240611,
});
const table = tableFromPoints(points, { source: 'bench-mixed-120.csv', units: { substrate: 'uM', inhibitor: 'uM', rate: 'nM/s' } });

function median(xs) {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

const whole = [];
const wholeCpu = [];
const analysis = [];
const figures = [];
const page = [];
let nFigures = 0;
let bytes = 0;
for (let run = 0; run < WARM_UP + RUNS; run++) {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const result = analyzeTable(table, { errorModel: 'proportional' });
  const t1 = performance.now();
  const figs = renderFigures(result);
  const t2 = performance.now();
  const html = reportHtml({ result, figures: figs, provenance: { generatedAt: new Date(0) } });
  const t3 = performance.now();
  const cpu = process.cpuUsage(c0);
  if (run < WARM_UP) continue;
  whole.push(t3 - t0);
  wholeCpu.push((cpu.user + cpu.system) / 1000);
  analysis.push(t1 - t0);
  figures.push(t2 - t1);
  page.push(t3 - t2);
  nFigures = figs.length;
  bytes = html.length;
}

const ms = (x) => `${x.toFixed(1)} ms`;
console.log(`machine: ${cpus().length} cores (${cpus()[0]?.model ?? 'unknown'}), load ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
console.log(`dataset: ${points.length} rates; ${nFigures} figures; report.html ${(bytes / 1024).toFixed(0)} KiB`);
console.log(`median of ${RUNS} runs after ${WARM_UP} warm-up runs:`);
console.log(`  analysis (fits, intervals, diagnostics)  ${ms(median(analysis))}`);
console.log(`  figures (${nFigures})                        ${ms(median(figures))}`);
console.log(`  HTML page                                ${ms(median(page))}`);
console.log(`  whole report                             ${ms(median(whole))}  (min ${ms(Math.min(...whole))}, max ${ms(Math.max(...whole))})`);
console.log(`  whole report, CPU time                   ${ms(median(wholeCpu))}  (less disturbed by other work on the machine)`);
const ok = median(whole) < TARGET_MS;
console.log(`summary: report for 120 points: median ${ms(median(whole))} (figures ${ms(median(figures))}), target < ${TARGET_MS} ms: ${ok ? 'met' : 'NOT met'}`);
