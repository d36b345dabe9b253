#!/usr/bin/env node
/**
 * Speed of the intervals stage (invented data: a simulated mixed-inhibition grid of 120 points,
 * 8 [S] x 5 [I] x 3 replicates).
 * - profile-t intervals of every parameter (and alpha) of all five fitted models: median of 15 runs
 *   after 3 warm-up runs. Target: under 100 ms.
 * - wild bootstrap, 1000 resamples, all five models refitted per resample (no jackknife; then with
 *   the 120 jackknife refits BCa needs), on 1 and 2 threads; the rows must be identical.
 *   Target: under 3 s on one thread. Constant and proportional error models. CPU time of all
 *   threads is printed beside the wall time: CPU/wall near the thread count means the threads ran
 *   side by side (on a machine shared with other work the wall time alone says little).
 *
 *   npx tsc -p tsconfig.json && node bench/intervals-bench.mjs [resamples, default 1000]
 */
import { performance } from 'node:perf_hooks';
import { availableParallelism, loadavg } from 'node:os';
import { fitAllMechanisms } from '../dist/fit/fit-all-mechanisms.js';
import { fitDataFromArrays } from '../dist/fit/fit-data.js';
import { simulateRates } from '../dist/simulate/simulate-rates.js';
import { profileAllOfFit } from '../dist/evidence/intervals/profile-likelihood.js';
import { runBootstrap } from '../dist/evidence/bootstrap/bootstrap.js';

const RESAMPLES = Number(process.argv[2] ?? 1000);

function dataset(noise) {
  const points = simulateRates({
    mechanism: 'mixed',
    params: { Vmax: 10, Km: 20, Ki: 4, Kiu: 16 },
    substrate: [4, 7, 12, 20, 35, 60, 100, 160],
    inhibitor: [0, 2, 4, 8, 16],
    replicates: 3,
    noise,
    noiseLevel: noise === 'constant' ? 0.2 : 0.05,
    seed: 42,
  });
  return fitDataFromArrays(points.map((p) => p.substrate), points.map((p) => p.inhibitor), points.map((p) => p.rate));
}

function median(xs) {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

console.log(`intervals benchmark: node ${process.version}, ${availableParallelism()} cores, load average ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
for (const noise of ['constant', 'proportional']) {
  const data = dataset(noise);
  const fits = fitAllMechanisms(data, noise);
  const times = [];
  let ends = 0;
  for (let k = 0; k < 18; k++) {
    const t0 = performance.now();
    const all = fits.map((f) => profileAllOfFit(f, data, { level: 0.95 }));
    if (k >= 3) times.push(performance.now() - t0);
    ends = all.flat().length * 2;
  }
  console.log(`summary: profile intervals, 5 models (${ends} ends), ${noise} error, n = ${data.v.length}: median ${median(times).toFixed(1)} ms (target < 100 ms)`);

  let reference = null;
  for (const jackknife of [false, true]) {
    for (const threads of [1, 2]) {
      const t0 = performance.now();
      const cpu0 = process.cpuUsage();
      const run = runBootstrap(fits, data, { resamples: RESAMPLES, seed: 7, workers: threads, jackknife });
      const ms = performance.now() - t0;
      const cpu = process.cpuUsage(cpu0);
      const cpuSeconds = (cpu.user + cpu.system) / 1e6;
      const rows = [...run.replicates.values()].flatMap((cols) => cols.flatMap((c) => Array.from(c)));
      if (!jackknife && threads === 1) reference = rows;
      const same = !jackknife ? rows.every((x, k) => Object.is(x, reference[k])) : true;
      console.log(
        `summary: bootstrap ${RESAMPLES} resamples${jackknife ? ` + ${data.v.length} jackknife` : ''}, 5 models, ${noise} error, ${threads} thread(s): ${(ms / 1000).toFixed(2)} s wall, ${cpuSeconds.toFixed(2)} s CPU (all threads; CPU/wall ${(cpuSeconds / (ms / 1000)).toFixed(2)})` +
          (jackknife ? '' : `, rows identical to 1 thread: ${same ? 'yes' : 'NO'}`) +
          `; mixed ranked first in ${(100 * run.selection.mixed).toFixed(1)}%`,
      );
    }
  }
}
