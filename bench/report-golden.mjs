#!/usr/bin/env node
/**
 * A golden set of report output, to show that a change leaves the figures and pages byte for byte
 * as they were (docs/decisions/analysis-cost.md): 20 analyses of simulated, invented data (the
 * project's seeded simulator; five designs from sparse 3 x 3 to dense 10 x 5 and an IC50-shift
 * design, all five mechanisms, constant and proportional error, planted outliers, and the options
 * robust, summary detail, no profiles, level 0.9, --partial, a fitted [E]t, an at-[S] IC50), with
 * every figure SVG and the HTML page of each, and the reads page of a simulated plate.
 *
 *   node bench/report-golden.mjs OUT [DIST]     (DIST: a compiled dist/ folder, default this one)
 *   then: diff -r OUT-before OUT-after
 *
 * Not a timed bench (its name does not end in -bench, so `npm run bench` does not run it).
 */
import { writeFileSync, mkdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const out = process.argv[2];
if (!out) {
  console.error('usage: node bench/report-golden.mjs OUT [DIST]');
  process.exit(2);
}
const distFolder = resolve(process.argv[3] ?? join(dirname(fileURLToPath(import.meta.url)), '..', 'dist'));
const dist = (path) => pathToFileURL(join(distFolder, path)).href;
const lib = await import(dist('index.js'));
const { renderFigures } = await import(dist('figures/render-figures.js'));
const { reportHtml } = await import(dist('report/html/report-page.js'));
mkdirSync(out, { recursive: true });
const geo = (a, b, n) => Array.from({ length: n }, (_, k) => a * (b / a) ** (k / (n - 1)));
const designs = {
  dense: { S: geo(0.3, 60, 10), I: [0, 0.3, 1, 3, 10], reps: 3 },
  good: { S: geo(0.4, 20, 8), I: [0, 0.5, 1, 2, 4], reps: 2 },
  sparse: { S: [0.5, 2, 8], I: [0, 1, 4], reps: 2 },
  ic50: { S: [1, 10], I: [0, 0.1, 0.3, 1, 3, 10, 30, 100], reps: 2 },
  single: { S: geo(0.2, 40, 7), I: [0, 2], reps: 3 },
};
const truths = {
  none: { Vmax: 100, Km: 2 }, competitive: { Vmax: 100, Km: 2, Ki: 1 }, uncompetitive: { Vmax: 100, Km: 2, Kiu: 1 },
  noncompetitive: { Vmax: 100, Km: 2, Ki: 1 }, mixed: { Vmax: 100, Km: 2, Ki: 1, Kiu: 4 },
};
const cases = [];
let seed = 900;
const pick = [
  ['dense', 'mixed', 'proportional', {}], ['dense', 'competitive', 'constant', {}], ['good', 'none', 'constant', {}],
  ['good', 'uncompetitive', 'proportional', { robust: true }], ['good', 'noncompetitive', 'constant', { errorModel: 'constant' }],
  ['sparse', 'competitive', 'proportional', {}], ['sparse', 'mixed', 'constant', {}], ['sparse', 'none', 'proportional', {}],
  ['ic50', 'competitive', 'proportional', {}], ['ic50', 'uncompetitive', 'constant', {}], ['single', 'noncompetitive', 'proportional', {}],
  ['good', 'mixed', 'proportional', { detail: 'summary' }], ['dense', 'uncompetitive', 'proportional', { partial: true }],
  ['good', 'competitive', 'constant', { enzyme: 'fit' }], ['dense', 'noncompetitive', 'proportional', { profile: false }],
  ['good', 'mixed', 'constant', { level: 0.9 }], ['sparse', 'uncompetitive', 'constant', { robust: true }],
  ['dense', 'none', 'constant', {}], ['ic50', 'mixed', 'proportional', {}], ['good', 'competitive', 'proportional', { atSubstrate: 5 }],
];
for (const [dn, tn, noise, opts] of pick) {
  const d = designs[dn];
  const points = lib.simulateRates({ mechanism: tn, params: truths[tn], substrate: d.S, inhibitor: d.I, replicates: d.reps, noise, noiseLevel: noise === 'constant' ? 2.5 : 0.06, seed: seed++ });
  if (seed % 3 === 0) points[4] = { ...points[4], rate: points[4].rate * 1.7 };
  const units = seed % 2 ? { substrate: 'uM', inhibitor: 'nM', rate: 'nM/s' } : undefined;
  cases.push({ name: `${cases.length}-${dn}-${tn}-${noise}`, table: lib.tableFromPoints(points, { source: `sim-${seed}.csv <&>`, units }), opts });
}
let n = 0;
for (const c of cases) {
  let r;
  try { r = lib.analyzeTable(c.table, c.opts); } catch (e) { writeFileSync(`${out}/${c.name}.error`, String(e)); continue; }
  const figs = renderFigures(r);
  mkdirSync(`${out}/${c.name}`, { recursive: true });
  for (const f of figs) writeFileSync(`${out}/${c.name}/${f.file}`, f.svg);
  writeFileSync(`${out}/${c.name}/report.html`, reportHtml({ result: r, figures: figs, provenance: { generatedAt: new Date(0) } }));
  n += figs.length;
}
// a plate (reads page with progress panels)
const plate = lib.simulatePlate({ mechanism: 'competitive', params: { Vmax: 50, Km: 5, Ki: 2 }, substrate: [1, 3, 10, 30], inhibitor: [0, 2, 6], replicates: 2, times: Array.from({ length: 20 }, (_, k) => k * 30), signalPerUnit: 10, noiseSd: 0.5, seed: 77, drift: 0.01 });
const reads = [lib.parseKineticReads(plate.readsCsv, 'reads.csv')];
const map = lib.parsePlateMap(plate.mapCsv, 'map.csv');
try {
  const rates = lib.ratesFromReads(reads, map, {});
  writeFileSync(`${out}/reads.html`, lib.readsReportHtml(rates, { date: '2000-01-01' }));
} catch (e) { writeFileSync(`${out}/reads.error`, String(e.stack)); }
console.log(`${cases.length} analyses, ${n} figures, from ${distFolder}, written to ${out}`);
