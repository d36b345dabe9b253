#!/usr/bin/env node
/**
 * A golden set for "did this change move any result?": 120 analyses (40 tables x automatic error
 * model, constant error model and summary detail), each written as the results JSON
 * (analysisJson) plus the text summary, from a given build. Tables: seeded simulations (INVENTED
 * data) of six truths on three designs under two noise models, a planted outlier in every fourth,
 * and the demo and example files. Compare two sets with scripts/golden-compare.mjs.
 *
 *   node scripts/golden-set.mjs DIST_FOLDER OUT_FOLDER
 *   e.g. git worktree add /tmp/before HEAD~3 && (cd /tmp/before && npm ci && npx tsc)
 *        node scripts/golden-set.mjs /tmp/before/dist /tmp/golden-before
 *        node scripts/golden-set.mjs dist /tmp/golden-after
 *        node scripts/golden-compare.mjs /tmp/golden-before /tmp/golden-after
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const [distArg, out] = process.argv.slice(2);
if (!distArg || !out) {
  console.error('usage: node scripts/golden-set.mjs DIST_FOLDER OUT_FOLDER');
  process.exit(2);
}
const lib = await import(pathToFileURL(join(resolve(distArg), 'index.js')).href);
mkdirSync(out, { recursive: true });

const designs = {
  good: { substrate: Array.from({ length: 8 }, (_, k) => 0.4 * 50 ** (k / 7)), inhibitor: [0, 0.5, 1, 2, 4], replicates: 3 },
  sparse: { substrate: [0.5, 2, 8], inhibitor: [0, 1, 4], replicates: 2 },
  mid: { substrate: [0.25, 0.5, 1, 2, 4, 8], inhibitor: [0, 0.3, 1, 3], replicates: 2 },
};
const truths = {
  none: ['none', { Vmax: 100, Km: 2 }],
  competitive: ['competitive', { Vmax: 100, Km: 2, Ki: 1 }],
  uncompetitive: ['uncompetitive', { Vmax: 100, Km: 2, Kiu: 1 }],
  noncompetitive: ['noncompetitive', { Vmax: 100, Km: 2, Ki: 1 }],
  mixed: ['mixed', { Vmax: 100, Km: 2, Ki: 1, Kiu: 4 }],
  mixedweak: ['mixed', { Vmax: 100, Km: 2, Ki: 0.5, Kiu: 50 }],
};
const cases = [];
let seed = 500;
for (const [designName, design] of Object.entries(designs)) {
  for (const [truthName, [mechanism, params]] of Object.entries(truths)) {
    for (const noise of ['proportional', 'constant']) {
      const points = lib.simulateRates({ mechanism, params, ...design, noise, noiseLevel: noise === 'constant' ? 3 : 0.05, seed: seed++ });
      if (seed % 4 === 0) points[3] = { ...points[3], rate: points[3].rate * 1.6 };
      cases.push({ name: `${designName}-${truthName}-${noise}`, table: lib.tableFromPoints(points, { source: '<simulated>' }) });
    }
  }
}
for (const file of ['data/demo/hlx-amidase-kt0417.csv', 'examples/long.csv', 'examples/matrix.csv', 'examples/long.tsv']) {
  const tables = await lib.readRateFile(join(root, file));
  cases.push({ name: file.replace(/\W/g, '_'), table: tables[0] });
}
const settings = { auto: {}, constant: { errorModel: 'constant' }, summary: { detail: 'summary' } };
for (const { name, table } of cases) {
  for (const [label, options] of Object.entries(settings)) {
    let record;
    try {
      const result = lib.analyzeTable(table, options);
      record = { json: lib.analysisJson(result), text: lib.textSummary(result) };
    } catch (error) {
      record = { error: String(error) };
    }
    writeFileSync(join(out, `${name}.${label}.json`), JSON.stringify(record, null, 1));
  }
}
console.log(`${cases.length * Object.keys(settings).length} analyses written to ${out}`);
