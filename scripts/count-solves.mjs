#!/usr/bin/env node
/**
 * How many constrained least-squares solves an analysis runs, and where: a deterministic measure of
 * the analysis cost (docs/decisions/analysis-cost.md), unlike wall time on a shared machine.
 * Copies the given build to a temporary folder, wraps levenbergMarquardt there with a counter
 * keyed by the calling stage (the first frame from evidence/, the fits or the robust refit), runs
 * analyzeTable on the five fit-bench datasets (bench/fit-bench.mjs: 8 [S] x 5 [I] x 3, 5%
 * proportional noise, seeded simulations: invented data) and prints calls, iterations (Jacobian
 * evaluations) and residual evaluations per analysis.
 *
 *   node scripts/count-solves.mjs [DIST_FOLDER] [auto|constant|proportional] [full|summary]
 */
import { cpSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const [distArg = join(root, 'dist'), errorModel = 'auto', detail = 'full'] = process.argv.slice(2);
const work = mkdtempSync(join(tmpdir(), 'mechanist-count-'));
try {
  cpSync(resolve(distArg), join(work, 'dist'), { recursive: true });
  symlinkSync(join(root, 'node_modules'), join(work, 'node_modules'));
  writeFileSync(join(work, 'package.json'), '{"type":"module"}');
  const engine = join(work, 'dist', 'fit', 'levenberg-marquardt.js');
  const source = readFileSync(engine, 'utf8');
  const head = 'export function levenbergMarquardt(problem, x0, options = {}) {';
  if (!source.includes(head)) throw new Error(`${engine}: the engine's signature changed; update this script`);
  const wrapped = source.replace(head, `export function levenbergMarquardt(problem, x0, options = {}) {
    const frames = new Error().stack.split('\\n').slice(2).map((line) => line.trim());
    const frame = frames.find((line) => /evidence\\/|robust|fit-all|series|error-model/.test(line)) ?? frames[0];
    const key = frame.replace(/\\(?file:.*\\/dist\\//, '(').replace(/:\\d+\\)?$/, ')');
    const result = countedLevenbergMarquardt(problem, x0, options);
    const seen = globalThis.solveCounts.get(key) ?? { calls: 0, iterations: 0, evaluations: 0 };
    seen.calls++;
    seen.iterations += result.iterations;
    seen.evaluations += result.evaluations;
    globalThis.solveCounts.set(key, seen);
    return result;
}
function countedLevenbergMarquardt(problem, x0, options = {}) {`);
  writeFileSync(engine, wrapped);
  globalThis.solveCounts = new Map();
  const lib = await import(pathToFileURL(join(work, 'dist', 'index.js')).href);
  const KM = 2;
  const substrate = Array.from({ length: 8 }, (_, k) => 0.2 * KM * 50 ** (k / 7));
  const truths = {
    none: { Vmax: 100, Km: KM },
    competitive: { Vmax: 100, Km: KM, Ki: 1 },
    uncompetitive: { Vmax: 100, Km: KM, Kiu: 1 },
    noncompetitive: { Vmax: 100, Km: KM, Ki: 1 },
    mixed: { Vmax: 100, Km: KM, Ki: 1, Kiu: 4 },
  };
  const tables = Object.entries(truths).map(([mechanism, params], k) =>
    lib.tableFromPoints(lib.simulateRates({ mechanism, params, substrate, inhibitor: [0, 0.5, 1, 2, 4], replicates: 3, noise: 'proportional', noiseLevel: 0.05, seed: 7000 + k }), { source: '<simulated>' }),
  );
  const options = { ...(errorModel === 'auto' ? {} : { errorModel }), detail };
  for (const table of tables) lib.analyzeTable(table, options);
  const per = (x) => (x / tables.length).toFixed(1).padStart(8);
  const total = { calls: 0, iterations: 0, evaluations: 0 };
  console.log(`solves per analysis (${errorModel} error model, ${detail} detail, five fit-bench datasets)`);
  console.log('   calls iterations evaluations  stage');
  for (const [key, c] of [...globalThis.solveCounts].sort((a, b) => b[1].iterations - a[1].iterations)) {
    console.log(`${per(c.calls)} ${per(c.iterations)} ${per(c.evaluations)}  ${key}`);
    for (const k of Object.keys(total)) total[k] += c[k];
  }
  console.log(`${per(total.calls)} ${per(total.iterations)} ${per(total.evaluations)}  all`);
} finally {
  rmSync(work, { recursive: true, force: true });
}
