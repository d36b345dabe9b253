// Reads-stage benchmark: a simulated 384-well plate with 60 reads per well (360 sample wells of a
// competitive inhibitor, 8 [S] x 5 [I] x 9, and 24 blank wells; invented enzyme), from the reads
// and plate-map text to the rate table text: parse both files, blank correction, window choice,
// flags, depletion correction, CSV. Target: under 1 s per plate (issue 12). Also timed: the same
// with the integrated Michaelis-Menten fit of every well (--rate-from integrated).
// Run: npx tsc -p tsconfig.json && node bench/rates-bench.mjs
import { performance } from 'node:perf_hooks';
import { availableParallelism, loadavg } from 'node:os';
import { parseKineticReads, parsePlateMap, ratesFromReads, rateTableText, parseConversionFactor } from '../dist/reads/index.js';
import { simulatePlate } from '../dist/simulate/simulate-plate.js';

const TARGET_MS = 1000;
const RUNS = 11;
const plate = simulatePlate({
  mechanism: 'competitive',
  params: { Vmax: 0.01, Km: 20, Ki: 1 },
  substrate: [4, 8, 12, 20, 30, 50, 100, 160],
  inhibitor: [0, 0.5, 1, 2, 4],
  replicates: 9,
  blanksPerSubstrate: 3,
  times: Array.from({ length: 60 }, (_, k) => 10 * k),
  signalPerUnit: 0.00622,
  baseline: 0.3,
  drift: 2e-6,
  noiseSd: 0.0003,
  seed: 7,
});
const conversion = parseConversionFactor('6.22/mM');

function once(rateFrom) {
  const reads = parseKineticReads(plate.readsCsv, { source: 'bench-reads.csv' });
  const map = parsePlateMap(plate.mapCsv, 'bench-map.csv');
  const result = ratesFromReads([reads], map, { conversion, rateFrom });
  return { result, text: rateTableText(result) };
}

function time(rateFrom) {
  once(rateFrom); // warm-up
  const wall = [];
  const cpu = [];
  let last;
  for (let k = 0; k < RUNS; k++) {
    const start = performance.now();
    const c0 = process.cpuUsage();
    last = once(rateFrom);
    const c = process.cpuUsage(c0);
    wall.push(performance.now() - start);
    cpu.push((c.user + c.system) / 1000);
  }
  wall.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  return { wall: wall[RUNS >> 1], cpu: cpu[RUNS >> 1], min: wall[0], max: wall[RUNS - 1], last };
}

const wells = plate.wells.length;
const reads = 60;
console.log(`rates-bench: ${wells} wells x ${reads} reads (${(plate.readsCsv.length / 1e6).toFixed(2)} MB of reads), median of ${RUNS} runs after a warm-up; load average ${loadavg()[0].toFixed(1)} on ${availableParallelism()} cores`);
for (const rateFrom of ['window', 'integrated']) {
  const t = time(rateFrom);
  const flagged = t.last.result.wells.filter((w) => w.excludeReason !== null).length;
  const integrated = t.last.result.wells.filter((w) => w.method === 'integrated').length;
  console.log(`${rateFrom}: median ${t.wall.toFixed(1)} ms wall (min ${t.min.toFixed(1)}, max ${t.max.toFixed(1)}), ${t.cpu.toFixed(1)} ms CPU; ${t.last.result.wells.length} rates, ${flagged} flagged${rateFrom === 'integrated' ? `, ${integrated} from the integrated fit` : ''}`);
  console.log(`summary: rates from a 384-well plate x 60 reads (${rateFrom === 'window' ? 'straight window' : 'integrated fit'}) | ${t.wall.toFixed(0)} ms wall, ${t.cpu.toFixed(0)} ms CPU | target < ${TARGET_MS} ms: ${t.wall < TARGET_MS ? 'met' : 'NOT met'}`);
}
