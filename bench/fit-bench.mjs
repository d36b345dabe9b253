#!/usr/bin/env node
/**
 * Speed of the core global fit: all five mechanisms fitted to one 8 [S] x 5 [I] x 3 replicate
 * dataset (120 rates; good design of BRIEF sec. 7, 5% proportional noise, seeded simulations of
 * each mechanism: invented data), by fitAllMechanisms alone and by analyzeTable (everything the
 * analysis does in the current tree), with the constant and the proportional error model; and the
 * same datasets fitted by the committed scipy runner (test/fixtures/scipy-fit/runner.py --bench),
 * timed inside python with time.perf_counter after a warm-up.
 *
 *   npx tsc -p tsconfig.json && node bench/fit-bench.mjs
 *
 * Targets: all five models in under 5 ms; a whole analyzeTable in under 20 ms (issue 13); at least
 * 10 times faster than scipy per dataset at equal accuracy (our SSE for every model no more than
 * 1e-7 relative above scipy's thorough result).
 * Times are medians over datasets of per-dataset medians; wall time and CPU time
 * (process.cpuUsage) are both shown, since CPU time is less disturbed by other work on the machine.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync, rmSync } from 'node:fs';
import { tmpdir, cpus, loadavg } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { fitAllMechanisms } from '../dist/fit/fit-all-mechanisms.js';
import { fitDataFromArrays } from '../dist/fit/fit-data.js';
import { analyzeTable } from '../dist/analysis/analyze-table.js';
import { simulateRates } from '../dist/simulate/simulate-rates.js';
import { tableFromPoints } from '../dist/simulate/table-from-points.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const TARGET_MS = 5;
/** a full analysis (issue 13): five fits, profiles, joint region, diagnostics, verdict */
const ANALYZE_TARGET_MS = 20;
const TARGET_SPEED_UP = 10;
const SSE_TOLERANCE = 1e-7;
const RUNS = Number(process.env.FIT_BENCH_RUNS ?? 41);
const WARM_UP = 30;
const PYTHON_RUNS = Number(process.env.FIT_BENCH_PYTHON_RUNS ?? 7);

const KM = 2;
const SUBSTRATE = Array.from({ length: 8 }, (_, k) => 0.2 * KM * 50 ** (k / 7));
const INHIBITOR = [0, 0.5, 1, 2, 4];
const TRUTH = {
  none: { Vmax: 100, Km: KM },
  competitive: { Vmax: 100, Km: KM, Ki: 1 },
  uncompetitive: { Vmax: 100, Km: KM, Kiu: 1 },
  noncompetitive: { Vmax: 100, Km: KM, Ki: 1 },
  mixed: { Vmax: 100, Km: KM, Ki: 1, Kiu: 4 },
};
const ERROR_MODELS = ['constant', 'proportional'];

const datasets = Object.entries(TRUTH).map(([mechanism, params], k) => {
  const points = simulateRates({ mechanism, params, substrate: SUBSTRATE, inhibitor: INHIBITOR, replicates: 3, noise: 'proportional', noiseLevel: 0.05, seed: 7000 + k });
  return { name: `${mechanism}-truth`, points };
});

function rateTable(points) {
  return tableFromPoints(points, { source: '<simulated>' });
}
const fitData = (points) => fitDataFromArrays(points.map((p) => p.substrate), points.map((p) => p.inhibitor), points.map((p) => p.rate));

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : 0.5 * (s[mid - 1] + s[mid]);
};

/** Median wall and CPU milliseconds of fn over `runs` calls. */
function timeIt(fn, runs) {
  const wall = [];
  const cpu = [];
  for (let k = 0; k < runs; k++) {
    const c0 = process.cpuUsage();
    const w0 = performance.now();
    fn();
    wall.push(performance.now() - w0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return { wall: median(wall), cpu: median(cpu) };
}

// ---- ours --------------------------------------------------------------------------------------
const ours = {};
for (const errorModel of ERROR_MODELS) {
  for (let k = 0; k < WARM_UP; k++) for (const d of datasets) fitAllMechanisms(fitData(d.points), errorModel);
  for (let k = 0; k < 3; k++) for (const d of datasets) analyzeTable(rateTable(d.points), { errorModel });
  const fitTimes = datasets.map((d) => {
    const data = fitData(d.points);
    return timeIt(() => fitAllMechanisms(data, errorModel), RUNS);
  });
  const analyzeTimes = datasets.map((d) => {
    const table = rateTable(d.points);
    return timeIt(() => analyzeTable(table, { errorModel }), Math.max(5, Math.floor(RUNS / 4)));
  });
  const sse = datasets.map((d) => Object.fromEntries(fitAllMechanisms(fitData(d.points), errorModel).map((f) => [f.mechanism, f.sse])));
  ours[errorModel] = {
    fitWall: median(fitTimes.map((t) => t.wall)),
    fitCpu: median(fitTimes.map((t) => t.cpu)),
    analyzeWall: median(analyzeTimes.map((t) => t.wall)),
    analyzeCpu: median(analyzeTimes.map((t) => t.cpu)),
    perDataset: fitTimes,
    sse,
  };
}

// ---- scipy ---------------------------------------------------------------------------------------
let scipy = null;
let scipyError = null;
const dir = mkdtempSync(join(tmpdir(), 'mechanist-fit-bench-'));
try {
  const file = join(dir, 'datasets.json');
  writeFileSync(file, JSON.stringify({ datasets: datasets.map((d) => ({ name: d.name, s: d.points.map((p) => p.substrate), i: d.points.map((p) => p.inhibitor), v: d.points.map((p) => p.rate) })) }));
  const runner = join(root, 'test', 'fixtures', 'scipy-fit', 'runner.py');
  const out = execFileSync('python3', [runner, '--bench', file, String(PYTHON_RUNS)], { encoding: 'utf8', maxBuffer: 1 << 26 });
  scipy = JSON.parse(out);
} catch (err) {
  scipyError = String(err.message ?? err).split('\n')[0];
} finally {
  rmSync(dir, { recursive: true, force: true });
}

// ---- report ----------------------------------------------------------------------------------------
const f2 = (x) => (x >= 100 ? x.toFixed(0) : x >= 10 ? x.toFixed(1) : x.toFixed(2));
console.log(`fit-bench: ${datasets.length} datasets (one per true mechanism), 120 rates each (8 [S] x 5 [I] x 3), 5% proportional noise`);
console.log(`machine: ${cpus().length} cores (${cpus()[0]?.model ?? 'unknown'}), load average ${loadavg().map((x) => x.toFixed(1)).join(' ')}, node ${process.version}`);
console.log(`ours: median over datasets of the median of ${RUNS} runs after ${WARM_UP} warm-up rounds (analyzeTable: ${Math.max(5, Math.floor(RUNS / 4))} runs)`);
if (scipy) console.log(`scipy ${scipy.scipy} / numpy ${scipy.numpy}: thorough = 1 timed run per dataset; lean = median of ${PYTHON_RUNS} runs; after a warm-up`);
else console.log(`scipy runner not run: ${scipyError}`);
console.log('');
console.log('| error model | fitAllMechanisms wall / CPU (ms) | analyzeTable wall / CPU (ms) | scipy lean wall / CPU (ms) | scipy thorough wall / CPU (ms) | speed-up vs lean (CPU) | speed-up vs thorough (CPU) |');
console.log('|---|---:|---:|---:|---:|---:|---:|');
const summaries = [];
for (const errorModel of ERROR_MODELS) {
  const o = ours[errorModel];
  let lean = null;
  let thorough = null;
  let accuracy = null;
  if (scipy) {
    const rows = scipy.rows.filter((r) => r.errorModel === errorModel);
    lean = { wall: median(rows.map((r) => r.leanWallMs)), cpu: median(rows.map((r) => r.leanCpuMs)) };
    thorough = { wall: median(rows.map((r) => r.thoroughWallMs)), cpu: median(rows.map((r) => r.thoroughCpuMs)) };
    // equal accuracy: our SSE against scipy's thorough SSE, and scipy lean against scipy thorough
    let oursWorst = -Infinity;
    let leanWorst = -Infinity;
    rows.forEach((r, k) => {
      for (const [mech, ref] of Object.entries(r.sse)) {
        oursWorst = Math.max(oursWorst, (o.sse[k][mech] - ref) / ref);
        leanWorst = Math.max(leanWorst, (r.leanSse[mech] - ref) / ref);
      }
    });
    accuracy = { oursWorst, leanWorst };
  }
  const cell = (t) => (t ? `${f2(t.wall)} / ${f2(t.cpu)}` : 'n/a');
  const ratio = (t) => (t ? `${(t.cpu / o.fitCpu).toFixed(0)}x` : 'n/a');
  console.log(`| ${errorModel} | ${f2(o.fitWall)} / ${f2(o.fitCpu)} | ${f2(o.analyzeWall)} / ${f2(o.analyzeCpu)} | ${cell(lean)} | ${cell(thorough)} | ${ratio(lean)} | ${ratio(thorough)} |`);
  summaries.push(`summary: fitAllMechanisms (${errorModel}) median ${f2(o.fitWall)} ms wall, ${f2(o.fitCpu)} ms CPU (target < ${TARGET_MS} ms: ${o.fitCpu < TARGET_MS ? 'met' : 'MISSED'})`);
  summaries.push(`summary: analyzeTable (${errorModel}) median ${f2(o.analyzeWall)} ms wall, ${f2(o.analyzeCpu)} ms CPU (target < ${ANALYZE_TARGET_MS} ms: ${o.analyzeCpu < ANALYZE_TARGET_MS ? 'met' : 'MISSED'})`);
  if (lean) {
    const leanOk = accuracy.leanWorst <= SSE_TOLERANCE;
    summaries.push(`summary: scipy (${errorModel}) lean ${f2(lean.cpu)} ms CPU, thorough ${f2(thorough.cpu)} ms CPU; speed-up ${(lean.cpu / o.fitCpu).toFixed(0)}x vs lean${leanOk ? '' : ' (lean NOT at equal accuracy)'}, ${(thorough.cpu / o.fitCpu).toFixed(0)}x vs thorough (target >= ${TARGET_SPEED_UP}x)`);
    summaries.push(`summary: accuracy (${errorModel}) worst relative SSE excess over scipy thorough: ours ${accuracy.oursWorst.toExponential(1)}, scipy lean ${accuracy.leanWorst.toExponential(1)} (tolerance ${SSE_TOLERANCE})`);
  }
}
console.log('');
console.log('per dataset, fitAllMechanisms CPU ms (constant / proportional):');
datasets.forEach((d, k) => console.log(`  ${d.name}: ${f2(ours.constant.perDataset[k].cpu)} / ${f2(ours.proportional.perDataset[k].cpu)}`));
console.log('');
for (const s of summaries) console.log(s);
