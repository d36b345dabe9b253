#!/usr/bin/env node
/**
 * Recovery of the tight-binding and partial families (issue 10 targets), on seeded simulations
 * (invented data, src/simulate/simulate-model.ts), analysed by analyzeTable with the proportional
 * error model:
 *  - tight binding: each of the four mechanisms, [E]t = 1, 2 and 5 x Ki (Ki = Kiu = 1 nM; mixed
 *    Kiu = 5 nM), [E]t given; [S] 2-100 uM (Km 10 uM), [I] 0 and 0.5, 1, 2, 4, 8 x max([E]t, Ki);
 *    triplicates; 4% proportional noise;
 *  - partial: partial noncompetitive (Ki 50 nM) and partial mixed (Ki 50, Kiu 200 nM) with
 *    beta = 0.2, 0.35 and 0.5; [I] 0 and 0.5-16 x Ki; --partial;
 *  - classic controls: the four classic mechanisms (Ki = Kiu = 1 nM; mixed Kiu 5 nM) analysed with
 *    --partial, and with [E]t = Ki/100 given: how often is a classic inhibitor called partial or
 *    tight-binding (target <= 2%);
 *  - speed: analysis time of a 120-point table (8 [S] x 5 [I] x 3) classic-only and with the
 *    tight-binding family ([E]t given), median over the tight-binding cases.
 * Targets: right family and mechanism >= 85%; true Ki (Kiu for uncompetitive) inside the 95%
 * profile interval of the true model >= 90%; decisive and wrong < 2%.
 *
 *   npx tsc -p tsconfig.json && node bench/tightbinding-partial-bench.mjs [datasets per cell, default 10]
 */
import { performance } from 'node:perf_hooks';
import { analyzeTable } from '../dist/analysis/analyze-table.js';
import { simulateModelRates } from '../dist/simulate/simulate-model.js';
import { tableFromPoints } from '../dist/simulate/table-from-points.js';
import { lookupModel } from '../dist/models/registry.js';
import { profileAllOfFit } from '../dist/evidence/intervals/profile-likelihood.js';

const N = Number(process.argv[2] ?? 10);
const S = [2, 4, 7, 10, 15, 25, 50, 100];
const SIM = { replicates: 3, noise: 'proportional', noiseLevel: 0.04 };
const OPTIONS = { errorModel: 'proportional', detail: 'summary' };
const TB_PARAMS = { competitive: { Ki: 1 }, uncompetitive: { Kiu: 1 }, noncompetitive: { Ki: 1 }, mixed: { Ki: 1, Kiu: 5 } };

const cases = [];
let seed = 910_000;
for (const mech of Object.keys(TB_PARAMS))
  for (const ratio of [1, 2, 5])
    for (let k = 0; k < N; k++) {
      const E = ratio;
      const top = Math.max(E, 1);
      cases.push({
        kind: 'tight-binding', family: 'tight-binding', mechanism: mech, label: `tb ${mech} E=${ratio}xKi`,
        model: `tight-binding ${mech}`, params: { Vmax: 100, Km: 10, ...TB_PARAMS[mech] }, enzyme: E,
        inhibitor: [0, 0.5, 1, 2, 4, 8].map((x) => x * top), options: { enzyme: { value: E, unit: 'nM' } }, seed: seed++,
      });
    }
for (const [model, mech, extra] of [['partial noncompetitive', 'noncompetitive', {}], ['partial mixed', 'mixed', { Kiu: 200 }]])
  for (const beta of [0.2, 0.35, 0.5])
    for (let k = 0; k < N; k++)
      cases.push({
        kind: 'partial', family: 'partial', mechanism: mech, label: `${model} beta=${beta}`, model,
        params: { Vmax: 100, Km: 10, Ki: 50, beta, ...extra }, inhibitor: [0, 25, 50, 100, 200, 400, 800], options: { partial: true }, seed: seed++,
      });
for (const mech of Object.keys(TB_PARAMS))
  for (let k = 0; k < 3 * N; k++) {
    const base = { mechanism: mech, model: mech, params: { Vmax: 100, Km: 10, ...TB_PARAMS[mech] }, inhibitor: [0, 0.5, 1, 2, 4, 8], seed: seed++ };
    cases.push({ ...base, kind: 'control-partial', family: 'classic', label: `classic ${mech} --partial`, options: { partial: true } });
    cases.push({ ...base, kind: 'control-enzyme', family: 'classic', label: `classic ${mech} [E]=Ki/100`, options: { enzyme: { value: 0.01, unit: 'nM' } } });
  }

const tally = {};
const times = { classic: [], tight: [] };
const started = performance.now();
for (const c of cases) {
  const model = lookupModel(c.model);
  const points = simulateModelRates({ model, params: c.params, substrate: S, inhibitor: c.inhibitor, enzyme: c.enzyme, ...SIM, seed: c.seed });
  const table = tableFromPoints(points, { source: '<simulated>', units: { substrate: 'uM', inhibitor: 'nM' } });
  const t0 = performance.now();
  const r = analyzeTable(table, { ...OPTIONS, ...c.options });
  const t1 = performance.now();
  if (c.kind === 'tight-binding' && c.inhibitor.length === 6) {
    times.tight.push(t1 - t0);
  }
  const called = r.family.family;
  const right = called === c.family && r.verdict.mechanism === c.mechanism;
  const t = (tally[c.label] ??= { kind: c.kind, n: 0, right: 0, decisiveWrong: 0, covered: 0, coverN: 0, other: 0 });
  t.n++;
  if (right) t.right++;
  if (!right && r.verdict.decisive) t.decisiveWrong++;
  if (c.kind.startsWith('control') && called !== 'classic') t.other++;
  if (c.kind === 'tight-binding' || c.kind === 'partial') {
    const fit = r.familyModels.find((m) => m.modelId === c.model)?.fit;
    const name = c.mechanism === 'uncompetitive' ? 'Kiu' : 'Ki';
    if (fit) {
      const data = c.enzyme !== undefined ? { ...r.data, e: new Float64Array(r.data.v.length).fill(c.enzyme) } : r.data;
      const iv = profileAllOfFit(fit, data, { level: 0.95 }).find((p) => p.name === name).interval;
      const truth = c.params[name];
      t.coverN++;
      if ((iv[0] === null || iv[0] <= truth) && (iv[1] === null || truth <= iv[1])) t.covered++;
    }
  }
}
// classic-only timing on the same 120-point tight-binding tables (5 [I] levels x 8 [S] x 3)
for (const c of cases.filter((x) => x.kind === 'tight-binding').slice(0, 4 * N)) {
  const model = lookupModel(c.model);
  const points = simulateModelRates({ model, params: c.params, substrate: S, inhibitor: c.inhibitor.slice(0, 5), enzyme: c.enzyme, ...SIM, seed: c.seed });
  const table = tableFromPoints(points, { source: '<simulated>', units: { substrate: 'uM', inhibitor: 'nM' } });
  let t0 = performance.now();
  analyzeTable(table, OPTIONS);
  times.classic.push(performance.now() - t0);
  t0 = performance.now();
  analyzeTable(table, { ...OPTIONS, ...c.options });
  times.tight.push(performance.now() - t0);
}

const pct = (a, b) => (b ? ((100 * a) / b).toFixed(1) + '%' : '-');
console.log('| cell | n | right family and mechanism | decisive and wrong | true K in 95% profile | called non-classic |');
console.log('|---|---:|---:|---:|---:|---:|');
const sums = {};
for (const [label, t] of Object.entries(tally)) {
  console.log(`| ${label} | ${t.n} | ${pct(t.right, t.n)} | ${pct(t.decisiveWrong, t.n)} | ${t.coverN ? pct(t.covered, t.coverN) : '-'} | ${t.kind.startsWith('control') ? pct(t.other, t.n) : '-'} |`);
  const s = (sums[t.kind] ??= { n: 0, right: 0, decisiveWrong: 0, covered: 0, coverN: 0, other: 0 });
  for (const k of Object.keys(s)) s[k] += t[k];
}
const median = (xs) => { const a = [...xs].sort((x, y) => x - y); return a.length ? a[Math.floor(a.length / 2)] : NaN; };
for (const kind of ['tight-binding', 'partial']) {
  const s = sums[kind];
  console.log(`summary: ${kind} recovery: right family+mechanism ${pct(s.right, s.n)} (target >= 85%), K in 95% profile ${pct(s.covered, s.coverN)} (>= 90%), decisive and wrong ${pct(s.decisiveWrong, s.n)} (< 2%), n = ${s.n}`);
}
for (const kind of ['control-partial', 'control-enzyme']) {
  const s = sums[kind];
  console.log(`summary: classic data, ${kind === 'control-partial' ? '--partial' : '[E]t = Ki/100'}: called ${kind === 'control-partial' ? 'partial' : 'tight-binding'} ${pct(s.other, s.n)} (target <= 2%), n = ${s.n}`);
}
console.log(`summary: analyze of a 120-point table (detail summary): classic only ${median(times.classic).toFixed(1)} ms, with the tight-binding family ${median(times.tight).toFixed(1)} ms (median; target < 100 ms)`);
console.log(`(total ${((performance.now() - started) / 1000).toFixed(1)} s)`);
