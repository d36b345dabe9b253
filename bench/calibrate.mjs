#!/usr/bin/env node
/**
 * `npm run calibrate`: coverage of the true parameter values by 95% Wald, profile-t and bootstrap
 * intervals on seeded simulated data (invented truth), written to docs/calibration.md.
 *
 * Cells: each of the five mechanisms x two designs x two noise models.
 *   good design: [S] = 0.2, 0.4, 0.8, 1.5, 3, 6, 10 x Km; [I] = 0, 0.5, 1, 2, 4 x Ki (x Kiu for
 *                uncompetitive); duplicates (70 points) - the design the brief recommends (sec. 7);
 *   poor design: [S] = 0.1, 0.2, 0.35, 0.5, 0.75, 1 x Km (no saturation); [I] = 0, 0.25, 0.5 x Ki;
 *                single wells (18 points);
 *   noise: constant SD = 3% of Vmax (fitted with the constant error model), or 5% CV
 *          (proportional, fitted by IRLS with the proportional model).
 * Truth: Vmax 10, Km 20, Ki 5, Kiu 15 (mixed; alpha 3); Ki 5 (competitive, noncompetitive); Kiu 5
 * (uncompetitive). Each dataset is fitted with its true mechanism.
 *
 * Per cell: DATASETS datasets (default 500) for Wald and profile intervals; the first BOOT_DATASETS
 * (default 40) also get a wild bootstrap of the true model alone (BOOT_RESAMPLES resamples, default
 * 200, resamples from the true model's fit, jackknife for BCa). Two extra rows run the bootstrap as
 * the analysis does (resamples from the mixed fit, all five models refitted). A missing Wald
 * interval (constant not detected) counts as not covering; an open profile end counts as infinite.
 *
 * Cells run in child processes, two at a time (CALIBRATE_PROCESSES to change).
 *   npx tsc -p tsconfig.json && node bench/calibrate.mjs [datasets] [bootDatasets] [bootResamples]
 */
import { fork } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { availableParallelism, loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';

const here = dirname(fileURLToPath(import.meta.url));
const numberArgs = process.argv[2] === '--cell' ? process.argv.slice(4) : process.argv.slice(2);
const [DATASETS, BOOT_DATASETS, BOOT_RESAMPLES] = [500, 40, 200].map((d, k) => Number(numberArgs[k] ?? d));

const TRUTH = {
  none: { Vmax: 10, Km: 20 },
  competitive: { Vmax: 10, Km: 20, Ki: 5 },
  uncompetitive: { Vmax: 10, Km: 20, Kiu: 5 },
  noncompetitive: { Vmax: 10, Km: 20, Ki: 5 },
  mixed: { Vmax: 10, Km: 20, Ki: 5, Kiu: 15 },
};
const DESIGNS = {
  good: { s: [0.2, 0.4, 0.8, 1.5, 3, 6, 10], i: [0, 0.5, 1, 2, 4], replicates: 2 },
  poor: { s: [0.1, 0.2, 0.35, 0.5, 0.75, 1], i: [0, 0.25, 0.5], replicates: 1 },
};
const NOISE = { constant: 0.3, proportional: 0.05 };

function cells() {
  const out = [];
  for (const mechanism of Object.keys(TRUTH))
    for (const design of Object.keys(DESIGNS)) for (const noise of Object.keys(NOISE)) out.push({ mechanism, design, noise, scheme: 'true-model' });
  out.push({ mechanism: 'competitive', design: 'good', noise: 'proportional', scheme: 'analysis' });
  out.push({ mechanism: 'mixed', design: 'good', noise: 'proportional', scheme: 'analysis' });
  return out;
}

async function runCell(cell) {
  const { MECHANISMS, modelFor } = await import('../dist/models/index.js');
  const { fitMechanism } = await import('../dist/fit/fit-mechanism.js');
  const { fitAllMechanisms } = await import('../dist/fit/fit-all-mechanisms.js');
  const { fitDataFromArrays } = await import('../dist/fit/fit-data.js');
  const { simulateRates } = await import('../dist/simulate/simulate-rates.js');
  const { profileAllOfFit } = await import('../dist/evidence/intervals/profile-likelihood.js');
  const { waldEstimates } = await import('../dist/evidence/intervals/wald-estimates.js');
  const { runBootstrap, bootstrapIntervalsOf } = await import('../dist/evidence/bootstrap/bootstrap.js');

  const truth = TRUTH[cell.mechanism];
  const inhibitionScale = truth.Ki ?? truth.Kiu ?? 5;
  const design = DESIGNS[cell.design];
  const model = modelFor(cell.mechanism);
  const names = [...model.params, ...(cell.mechanism === 'mixed' ? ['alpha'] : [])];
  const trueValue = (name) => (name === 'alpha' ? truth.Kiu / truth.Ki : truth[name]);
  const tally = {};
  for (const name of names) tally[name] = { wald: 0, waldMissing: 0, profile: 0, profileOpen: 0, percentile: 0, bca: 0, bootN: 0 };
  const covers = (iv, x) => iv && (iv[0] === null || iv[0] <= x) && (iv[1] === null || x <= iv[1]);
  const datasets = cell.scheme === 'analysis' ? Math.min(BOOT_DATASETS, 40) : DATASETS;
  let n = 0;
  for (let d = 0; d < datasets; d++) {
    const seed = 7919 * (d + 1) + ['none', 'competitive', 'uncompetitive', 'noncompetitive', 'mixed'].indexOf(cell.mechanism) * 131 + (cell.design === 'good' ? 0 : 17) + (cell.noise === 'constant' ? 0 : 5);
    const points = simulateRates({
      mechanism: cell.mechanism,
      params: truth,
      substrate: design.s.map((x) => x * truth.Km),
      inhibitor: design.i.map((x) => x * inhibitionScale),
      replicates: design.replicates,
      noise: cell.noise,
      noiseLevel: NOISE[cell.noise],
      seed,
    });
    const data = fitDataFromArrays(points.map((p) => p.substrate), points.map((p) => p.inhibitor), points.map((p) => p.rate));
    let fit;
    let fitsForBoot;
    if (cell.scheme === 'analysis') {
      fitsForBoot = fitAllMechanisms(data, cell.noise, MECHANISMS);
      fit = fitsForBoot.find((f) => f.mechanism === cell.mechanism);
    } else {
      fit = fitMechanism(model, data, cell.noise);
      fitsForBoot = [fit];
    }
    n++;
    let maxI = 0;
    for (const x of data.i) maxI = Math.max(maxI, x);
    const wald = waldEstimates(fit, maxI, 0.95).estimates;
    const profiles = profileAllOfFit(fit, data, { level: 0.95 });
    const boot = d < BOOT_DATASETS ? runBootstrap(fitsForBoot, data, { resamples: BOOT_RESAMPLES, seed: d + 1 }) : null;
    for (const name of names) {
      const t = tally[name];
      const x = trueValue(name);
      const w = wald.find((e) => e.name === name);
      if (!w?.wald) t.waldMissing++;
      else if (covers(w.wald, x)) t.wald++;
      const p = profiles.find((e) => e.name === name);
      if (p && covers(p.interval, x)) t.profile++;
      if (p && (p.interval[0] === null || p.interval[1] === null)) t.profileOpen++;
      if (boot) {
        const j = model.params.indexOf(name);
        const q = name === 'alpha' ? (v) => v[3] / v[2] : (v) => v[j];
        const estimate = name === 'alpha' ? fit.params[3] / fit.params[2] : fit.params[j];
        const b = bootstrapIntervalsOf(boot, cell.mechanism, q, estimate, 0.95);
        t.bootN++;
        if (covers(b.percentile, x)) t.percentile++;
        if (covers(b.bca, x)) t.bca++;
      }
    }
  }
  return { cell, n, tally };
}

if (process.argv[2] === '--cell') {
  const cell = JSON.parse(process.argv[3]);
  const result = await runCell(cell);
  process.send(result);
  process.exit(0);
}

const started = performance.now();
const all = cells();
const results = new Array(all.length);
const processes = Number(process.env.CALIBRATE_PROCESSES ?? Math.min(2, availableParallelism()));
let next = 0;
async function worker() {
  while (next < all.length) {
    const k = next++;
    const t0 = performance.now();
    results[k] = await new Promise((resolve, reject) => {
      const child = fork(fileURLToPath(import.meta.url), ['--cell', JSON.stringify(all[k]), String(DATASETS), String(BOOT_DATASETS), String(BOOT_RESAMPLES)]);
      child.on('message', resolve);
      child.on('exit', (code) => (code === 0 ? null : reject(new Error(`cell ${JSON.stringify(all[k])} exited with ${code}`))));
    });
    const c = all[k];
    process.stderr.write(`  ${c.mechanism} ${c.design} ${c.noise} ${c.scheme}: ${((performance.now() - t0) / 1000).toFixed(1)} s\n`);
  }
}
await Promise.all(Array.from({ length: processes }, worker));
const minutes = (performance.now() - started) / 60000;

const pct = (k, n) => (n > 0 ? `${((100 * k) / n).toFixed(1)}` : '–');
const lines = [];
lines.push('# Calibration of the 95% intervals');
lines.push('');
lines.push('Generated by `npm run calibrate` (bench/calibrate.mjs); do not edit by hand. Simulated data (invented truth):');
lines.push('see the header of bench/calibrate.mjs for the designs, noise and truth. Coverage = share of datasets whose');
lines.push('95% interval contains the true value (target about 95%; with 500 datasets the binomial SD is about 1 point,');
lines.push(`with ${BOOT_DATASETS} about 2.8 points).`);
lines.push('');
lines.push(`Run: ${new Date().toISOString().slice(0, 10)}, node ${process.version}, ${processes} processes, ${minutes.toFixed(1)} min, load average ${loadavg()[0].toFixed(1)}.`);
lines.push(`Wald and profile: ${DATASETS} datasets per cell. Bootstrap: the first ${BOOT_DATASETS} datasets of each cell, ${BOOT_RESAMPLES} wild (Rademacher) resamples each,`);
lines.push('from the true model\'s fit and refitting that model only ("true-model" rows), or as the analysis runs it, from the');
lines.push('mixed fit with all five models refitted ("analysis" rows, 40 datasets).');
lines.push('');
lines.push('"Wald n/a" = datasets where the constant was not detected (no Wald interval; counted as not covering).');
lines.push('"open" = datasets where a profile end was open (counted as reaching infinity).');
lines.push('');
lines.push('| mechanism | design | noise | bootstrap from | parameter | Wald % | Wald n/a % | profile % | open % | boot percentile % | boot BCa % |');
lines.push('|---|---|---|---|---|---|---|---|---|---|---|');
for (const r of results) {
  for (const [name, t] of Object.entries(r.tally)) {
    lines.push(
      `| ${r.cell.mechanism} | ${r.cell.design} | ${r.cell.noise} | ${r.cell.scheme === 'analysis' ? 'mixed fit (analysis)' : 'true model'} | ${name} | ${r.cell.scheme === 'analysis' ? '' : pct(t.wald, r.n)} | ${r.cell.scheme === 'analysis' ? '' : pct(t.waldMissing, r.n)} | ${r.cell.scheme === 'analysis' ? '' : pct(t.profile, r.n)} | ${r.cell.scheme === 'analysis' ? '' : pct(t.profileOpen, r.n)} | ${pct(t.percentile, t.bootN)} | ${pct(t.bca, t.bootN)} |`,
    );
  }
}
lines.push('');
const out = join(here, '..', 'docs', 'calibration.md');
writeFileSync(out, lines.join('\n'));
console.log(lines.join('\n'));
console.log(`\nwritten to docs/calibration.md in ${minutes.toFixed(1)} min`);
