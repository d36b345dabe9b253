#!/usr/bin/env node
/**
 * Batch throughput: `runBatch` (src/batch/run-batch.ts, from the compiled dist/) on simulated
 * compounds (INVENTED data: the project's seeded simulator; 8 [S] x 5 [I] x 2 replicates, 5%
 * proportional noise, the five mechanisms in turn with parameters and seeds varied per compound),
 * written as 10 files of 100 compounds each (a `compound` column), read from a folder.
 *
 *   npx tsc -p tsconfig.json && node bench/batch-bench.mjs      (also run by `npm run bench`)
 *   BATCH_BENCH_COMPOUNDS=1000 BATCH_BENCH_REPORTS=100 BATCH_BENCH_REPORTS_ALL=yes BATCH_BENCH_JOBS=2 BATCH_BENCH_SCIPY=300
 *
 * Stages, each in its own child process so its peak memory is its own (process.resourceUsage()
 * .maxRSS covers the worker threads, which live in the same process; rss is also sampled):
 *   1. no reports: all compounds, --jobs N, summary files only; again with Wald intervals only
 *      (analysis option profile: false, the CLI's --no-profile)
 *   2. reports: the first BATCH_BENCH_REPORTS compounds, --jobs N, a report folder per compound;
 *      again on all compounds (unless BATCH_BENCH_REPORTS_ALL=no). A run of 100 is dominated by
 *      start-up: each worker loads the code and runs its first few dozen compounds before V8 has
 *      optimised it, about 2 s of the 100-compound run on this machine. A screen of hundreds to a
 *      thousand compounds is the case the with-reports target is for, so the target is checked on
 *      the run over all compounds; the 100-compound rate is printed too.
 *   3. where the time goes, in one thread: reading and planning, analyzeTable per compound,
 *      fitAllMechanisms per compound (the fits alone), summarising, writing one report folder
 *   4. scipy: the same compounds' five fits by bench/scipy-batch-runner.py (one process)
 * Targets (issue 13): >= 150 compounds/s without reports and >= 30/s with reports on 2 cores; peak
 * memory under 500 MB. The per-compound analysis is the cost that dominates (stage 3).
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { performance } from 'node:perf_hooks';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..');
const dist = (path) => pathToFileURL(join(root, 'dist', path)).href;

const COMPOUNDS = Number(process.env.BATCH_BENCH_COMPOUNDS ?? 1000);
const WITH_REPORTS = Number(process.env.BATCH_BENCH_REPORTS ?? 100);
const REPORTS_ALL = (process.env.BATCH_BENCH_REPORTS_ALL ?? 'yes') !== 'no';
const JOBS = Number(process.env.BATCH_BENCH_JOBS ?? 2);
const SCIPY = Number(process.env.BATCH_BENCH_SCIPY ?? 300);
const PER_FILE = 100;
const TARGETS = { noReports: 150, reports: 30, peakMB: 500 };

const SUBSTRATE = [1, 2, 4, 8, 16, 32, 64, 128];
const INHIBITOR = [0, 0.5, 1, 2, 4];
const MECHANISMS = ['none', 'competitive', 'uncompetitive', 'noncompetitive', 'mixed'];

/** Parameters of compound k (varied, seeded by k): Km 5-20, Vmax 50-150, constants 0.5-4. */
function truthOf(k) {
  const u = (j) => ((k * 7919 + j * 104729) % 1000) / 1000;
  const mechanism = MECHANISMS[k % MECHANISMS.length];
  const params = { Vmax: 50 + 100 * u(1), Km: 5 + 15 * u(2) };
  if (mechanism === 'competitive' || mechanism === 'noncompetitive') params.Ki = 0.5 + 3.5 * u(3);
  if (mechanism === 'uncompetitive') params.Kiu = 0.5 + 3.5 * u(4);
  if (mechanism === 'mixed') {
    params.Ki = 0.5 + 2 * u(3);
    params.Kiu = params.Ki * (2 + 4 * u(4));
  }
  return { mechanism, params, seed: 1000 + k };
}

async function writeInputs(dir) {
  const { simulateRates } = await import(dist('simulate/simulate-rates.js'));
  const folder = join(dir, 'plates');
  const reportsFolder = join(dir, 'plates-reports');
  mkdirSync(folder);
  mkdirSync(reportsFolder);
  const datasets = [];
  let lines = [];
  const header = 'compound,substrate (uM),inhibitor (uM),rate,replicate';
  for (let k = 0; k < COMPOUNDS; k++) {
    const t = truthOf(k);
    const points = simulateRates({ ...t, substrate: SUBSTRATE, inhibitor: INHIBITOR, replicates: 2, noise: 'proportional', noiseLevel: 0.05 });
    const name = `BENCH-${String(k + 1).padStart(4, '0')}`;
    for (const p of points) lines.push(`${name},${p.substrate},${p.inhibitor},${p.rate},${p.replicate}`);
    datasets.push({ name, s: points.map((p) => p.substrate), i: points.map((p) => p.inhibitor), v: points.map((p) => p.rate) });
    if ((k + 1) % PER_FILE === 0 || k === COMPOUNDS - 1) {
      const file = `screen-${String(Math.floor(k / PER_FILE) + 1).padStart(2, '0')}.csv`;
      writeFileSync(join(folder, file), [header, ...lines].join('\n') + '\n');
      lines = [];
    }
  }
  // the reports stage: the first WITH_REPORTS compounds in one file
  const first = [header];
  for (const ds of datasets.slice(0, WITH_REPORTS)) ds.s.forEach((s, j) => first.push(`${ds.name},${s},${ds.i[j]},${ds.v[j]},${(j % 2) + 1}`));
  writeFileSync(join(reportsFolder, 'screen-reports.csv'), first.join('\n') + '\n');
  writeFileSync(join(dir, 'datasets.json'), JSON.stringify({ note: 'simulated (invented) data, bench/batch-bench.mjs', datasets }));
  return { folder, reportsFolder };
}

/** Child-process stage: one runBatch, timed, with its peak memory. */
async function stageBatch(input, out, reports, analysis) {
  const { runBatch } = await import(dist('index.js'));
  let sampledPeak = process.memoryUsage().rss;
  const timer = setInterval(() => (sampledPeak = Math.max(sampledPeak, process.memoryUsage().rss)), 20);
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  const result = await runBatch([input], { out, reports, jobs: JOBS, analysis });
  const seconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  clearInterval(timer);
  sampledPeak = Math.max(sampledPeak, process.memoryUsage().rss);
  const outcomes = {};
  for (const r of result.rows) outcomes[r.outcome ?? 'failed'] = (outcomes[r.outcome ?? 'failed'] ?? 0) + 1;
  return {
    compounds: result.rows.length,
    failed: result.counts.failed,
    threadsUsed: result.threadsUsed,
    seconds,
    cpuSeconds: (cpu.user + cpu.system) / 1e6,
    compoundsPerSecond: result.rows.length / seconds,
    peakRssMB: process.resourceUsage().maxRSS / 1024,
    sampledPeakRssMB: sampledPeak / 2 ** 20,
    outcomes,
    errors: [...new Set(result.rows.filter((r) => r.error).map((r) => r.error))].slice(0, 3),
  };
}

/** Child-process stage: where one compound's time goes, in this thread. */
async function stageProfile(input, out) {
  const lib = await import(dist('index.js'));
  const { collectInputFiles } = await import(dist('batch/collect-inputs.js'));
  const { planCompounds } = await import(dist('batch/plan-compounds.js'));
  const { writeResultFiles } = await import(dist('report/write-results.js'));
  const t0 = performance.now();
  const jobs = await planCompounds(collectInputFiles([input], process.cwd()).files);
  const planMs = performance.now() - t0;
  const tables = jobs.map((j) => j.table).slice(0, 100);
  const time = (fn) => {
    for (const t of tables.slice(0, 20)) fn(t); // warm-up
    const start = performance.now();
    for (const t of tables) fn(t);
    return (performance.now() - start) / tables.length;
  };
  const fitsMs = time((t) => lib.fitAllMechanisms(lib.fitDataFromTable(t), 'constant', lib.MECHANISMS));
  const results = [];
  let analysisFailures = 0;
  const analyzeMs = time((t) => {
    try {
      results.push(lib.analyzeTable(t, {}));
    } catch {
      analysisFailures += 1; // counted (the batch gives such a compound a failed row)
    }
  });
  const sample = results.slice(-tables.length);
  const waldMs = time((t) => {
    try {
      lib.analyzeTable(t, { profile: false });
    } catch {
      // counted above
    }
  });
  let start = performance.now();
  for (const r of sample) lib.summarizeAnalysis(r);
  const summarizeMs = (performance.now() - start) / sample.length;
  const some = sample.slice(0, 50);
  start = performance.now();
  some.forEach((r, k) => writeResultFiles(r, join(out, `r${k}`)));
  const reportMs = (performance.now() - start) / some.length;
  return { compounds: jobs.length, analysisFailures, planMsPerCompound: planMs / jobs.length, analyzeMs, waldMs, fitsMs, summarizeMs, reportMs, timedOn: tables.length };
}

function runStage(args) {
  const r = spawnSync(process.execPath, [fileURLToPath(import.meta.url), ...args], { encoding: 'utf8', maxBuffer: 1 << 26 });
  if (r.status !== 0) throw new Error(`stage ${args[1]} failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split('\n').pop());
}

const fmt = (x, d = 1) => (Number.isFinite(x) ? x.toFixed(d) : String(x));

async function main() {
  const dir = mkdtempSync(join(tmpdir(), 'mechanist-batch-bench-'));
  try {
    const { folder, reportsFolder } = await writeInputs(dir);
    console.log(`batch bench: ${COMPOUNDS} simulated compounds (8 [S] x 5 [I] x 2), --jobs ${JOBS}, ${availableParallelism()} cores, load ${loadavg().map((x) => x.toFixed(1)).join(' ')}`);
    const plain = runStage(['--stage', 'batch', folder, join(dir, 'out-plain'), 'no', '{}']);
    const reports = runStage(['--stage', 'batch', reportsFolder, join(dir, 'out-reports'), 'yes', '{}']);
    rmSync(join(dir, 'out-reports'), { recursive: true, force: true });
    const reportsAll = REPORTS_ALL ? runStage(['--stage', 'batch', folder, join(dir, 'out-reports-all'), 'yes', '{}']) : null;
    rmSync(join(dir, 'out-reports-all'), { recursive: true, force: true });
    // the same compounds with Wald intervals only (profile: false, as `--no-profile`): the batch
    // machinery with a lighter analysis
    const wald = runStage(['--stage', 'batch', folder, join(dir, 'out-wald'), 'no', '{"profile":false}']);
    const profile = runStage(['--stage', 'profile', folder, join(dir, 'out-profile')]);
    const py = spawnSync('python3', [join(here, 'scipy-batch-runner.py'), join(dir, 'datasets.json'), String(SCIPY)], { encoding: 'utf8' });
    const scipy = py.status === 0 ? JSON.parse(py.stdout.trim().split('\n').pop()) : null;

    console.log(`no reports:   ${plain.compounds} compounds in ${fmt(plain.seconds, 2)} s = ${fmt(plain.compoundsPerSecond)} /s on ${plain.threadsUsed} workers (CPU ${fmt(plain.cpuSeconds, 1)} s), peak rss ${fmt(plain.peakRssMB, 0)} MB (sampled ${fmt(plain.sampledPeakRssMB, 0)}), ${plain.failed} failed`);
    console.log(`              outcomes ${JSON.stringify(plain.outcomes)}`);
    for (const e of plain.errors) console.log(`              failed: ${e}`);
    console.log(`Wald only:    ${wald.compounds} compounds in ${fmt(wald.seconds, 2)} s = ${fmt(wald.compoundsPerSecond)} /s on ${wald.threadsUsed} workers (CPU ${fmt(wald.cpuSeconds, 1)} s), peak rss ${fmt(wald.peakRssMB, 0)} MB, ${wald.failed} failed`);
    console.log(`with reports: ${reports.compounds} compounds in ${fmt(reports.seconds, 2)} s = ${fmt(reports.compoundsPerSecond)} /s on ${reports.threadsUsed} workers (CPU ${fmt(reports.cpuSeconds, 1)} s), peak rss ${fmt(reports.peakRssMB, 0)} MB, ${reports.failed} failed`);
    if (reportsAll) console.log(`with reports: ${reportsAll.compounds} compounds in ${fmt(reportsAll.seconds, 2)} s = ${fmt(reportsAll.compoundsPerSecond)} /s on ${reportsAll.threadsUsed} workers (CPU ${fmt(reportsAll.cpuSeconds, 1)} s), peak rss ${fmt(reportsAll.peakRssMB, 0)} MB, ${reportsAll.failed} failed`);
    console.log(`one thread, per compound (mean over ${profile.timedOn}): analyzeTable ${fmt(profile.analyzeMs, 2)} ms (${fmt(profile.waldMs, 2)} ms without profiles), of which the five fits ${fmt(profile.fitsMs, 2)} ms; summary row ${fmt(profile.summarizeMs, 3)} ms; report folder ${fmt(profile.reportMs, 2)} ms; reading + planning ${fmt(profile.planMsPerCompound, 3)} ms${profile.analysisFailures ? `; ${profile.analysisFailures} analyzeTable calls threw` : ''}`);
    if (scipy) {
      const oneThread = 1000 / profile.fitsMs;
      console.log(`scipy ${scipy.scipy} (one process, five fits per compound, constant error): lean ${fmt(scipy.lean.compoundsPerSecond)} /s over ${scipy.lean.compounds}, thorough ${fmt(scipy.thorough.compoundsPerSecond)} /s over ${scipy.thorough.compounds}`);
      console.log(`ratios: fits alone, one thread vs scipy lean ${fmt(oneThread / scipy.lean.compoundsPerSecond)}x; whole batch (${plain.threadsUsed} workers, full analysis) vs scipy lean fits ${fmt(plain.compoundsPerSecond / scipy.lean.compoundsPerSecond)}x`);
    } else {
      console.log(`scipy runner did not run: ${py.stderr || py.error}`);
    }
    const peak = Math.max(plain.peakRssMB, reports.peakRssMB, reportsAll?.peakRssMB ?? 0);
    const withReports = reportsAll ?? reports;
    const ok = (x, target) => (x >= target ? 'met' : 'NOT met');
    console.log(`summary: batch ${fmt(plain.compoundsPerSecond)} compounds/s without reports (target ${TARGETS.noReports}: ${ok(plain.compoundsPerSecond, TARGETS.noReports)}), ${fmt(withReports.compoundsPerSecond)}/s with reports on ${withReports.compounds} (target ${TARGETS.reports}: ${ok(withReports.compoundsPerSecond, TARGETS.reports)})${reportsAll ? ` and ${fmt(reports.compoundsPerSecond)}/s on ${reports.compounds}` : ''}, peak ${fmt(peak, 0)} MB (target < ${TARGETS.peakMB}: ${peak < TARGETS.peakMB ? 'met' : 'NOT met'})${scipy ? `, ${fmt(plain.compoundsPerSecond / scipy.lean.compoundsPerSecond)}x scipy lean` : ''}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const stage = process.argv.indexOf('--stage');
if (stage >= 0) {
  const [kind, input, out, reports, analysis] = process.argv.slice(stage + 1);
  const result = kind === 'batch' ? await stageBatch(input, out, reports === 'yes', JSON.parse(analysis)) : await stageProfile(input, out);
  console.log(JSON.stringify(result));
} else {
  await main();
}
