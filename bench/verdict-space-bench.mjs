#!/usr/bin/env node
/**
 * Verdict benchmark over the designs screening runs (issue 15): how often a firm ("decisive") call
 * is made, and how often a firm call names the wrong mechanism, per design, [I] placement, noise
 * level and true mechanism. Simulated data only (src/simulate): the truth is known.
 *
 * Design space (invented truth: Vmax 100, Km 10; the [I] levels are set from a guess Kguess = 2):
 *  - designs: "sparse" 6 [S] x 4 [I], one well each ([S] 0.2-8 x Km, [I] 0, 1/3, 1, 3 x Kguess);
 *             "generous" 8 [S] x 5 [I] in triplicate ([S] 0.2-10 x Km, [I] 0, 0.5, 1, 2, 4 x Kguess)
 *  - [I] placement: "placed" (true K = Kguess x 10^u, u uniform in +-0.3) or "misplaced"
 *    (u uniform in +-1.5: three decades, so the tested range often misses Ki)
 *  - noise: proportional 2%, 5%, 10%
 *  - truth: none, competitive, uncompetitive, noncompetitive, mixed with alpha 0.2, 0.5, 2, 5, 10
 * A firm call is wrong when it names another mechanism than the truth (mixed truths: anything but
 * mixed; a "mixed, leaning ..." call of mixed data is right). The analysis runs with the CLI's
 * defaults (the error model chosen by likelihood), detail 'summary' (the same verdict as 'full').
 *
 *   node bench/verdict-space-bench.mjs [datasets-per-cell=40] [--write] [--features FILE] [--error MODEL] [--compare FILE]
 * --write writes docs/verdict-design-space.md; --features writes one JSON line per dataset;
 * --compare FILE adds the firm shares of an earlier run's --features file (the same seeds) beside
 * the pooled table, for a before/after comparison.
 */
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { readFileSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { fileURLToPath } from 'node:url';

const KM = 10;
const KGUESS = 2;
const DESIGNS = {
  sparse: { substrate: [0.2, 0.4, 1, 2, 4, 8].map((x) => x * KM), inhibitor: [0, 1 / 3, 1, 3].map((x) => x * KGUESS), replicates: 1 },
  generous: { substrate: [0.2, 0.4, 0.7, 1, 1.5, 2.5, 5, 10].map((x) => x * KM), inhibitor: [0, 0.5, 1, 2, 4].map((x) => x * KGUESS), replicates: 3 },
};
const PLACEMENTS = { placed: 0.3, misplaced: 1.5 };
const NOISES = [0.02, 0.05, 0.1];
const TRUTHS = [
  { name: 'none', mechanism: 'none' },
  { name: 'competitive', mechanism: 'competitive' },
  { name: 'uncompetitive', mechanism: 'uncompetitive' },
  { name: 'noncompetitive', mechanism: 'noncompetitive' },
  ...[0.2, 0.5, 2, 5, 10].map((alpha) => ({ name: `mixed a=${alpha}`, mechanism: 'mixed', alpha })),
];

function tasks(perCell) {
  const out = [];
  let seed = 1;
  for (const design of Object.keys(DESIGNS))
    for (const placement of Object.keys(PLACEMENTS))
      for (const noise of NOISES)
        for (const truth of TRUTHS)
          for (let k = 0; k < perCell; k++) out.push({ design, placement, noise, truth, seed: seed++ });
  return out;
}

async function runTask(t, lib) {
  const { analyzeTable, simulateRates, tableFromPoints, seededRandom } = lib;
  const rng = seededRandom(t.seed * 7919 + 3);
  const u = (2 * rng.uniform() - 1) * PLACEMENTS[t.placement];
  const K = KGUESS * 10 ** u;
  const m = t.truth.mechanism;
  const params = { Vmax: 100, Km: KM };
  if (m === 'competitive') params.Ki = K;
  if (m === 'uncompetitive') params.Kiu = K;
  if (m === 'noncompetitive') params.Ki = K;
  if (m === 'mixed') { params.Ki = K; params.Kiu = K * t.truth.alpha; }
  const d = DESIGNS[t.design];
  const points = simulateRates({ mechanism: m, params, substrate: d.substrate, inhibitor: d.inhibitor, replicates: d.replicates, noise: 'proportional', noiseLevel: t.noise, seed: t.seed });
  const r = analyzeTable(tableFromPoints(points, { source: 'simulated' }), { detail: 'summary', ...(workerData.errorModel ? { errorModel: workerData.errorModel } : {}) });
  const v = r.verdict;
  const mixed = r.models.find((x) => x.mechanism === 'mixed');
  const est = (name) => mixed?.estimates.find((e) => e.name === name);
  const pick = (e) => (e ? { value: e.value, detected: e.detected, profile: e.profile ?? null, wald: e.wald } : null);
  return {
    design: t.design, placement: t.placement, noise: t.noise, truth: t.truth.name, mechanism: m, K,
    outcome: v.outcome, called: v.mechanism, lean: v.lean ?? null, decisive: v.decisive, family: v.family ?? null,
    headline: lib.wordVerdict(v).headline, errorModel: r.errorModel, blockers: (v.caveats ?? []).filter((c) => c.blocking).map((c) => c.code),
    mixedAlpha: pick(est('alpha')), mixedKi: pick(est('Ki')), mixedKiu: pick(est('Kiu')),
    aicc: Object.fromEntries(r.models.map((x) => [x.mechanism, x.aicc])),
    nested: r.nested.map((c) => [c.simpler, c.fuller, c.p]),
    ...(workerData.features && mixed && lib.profileTausAt ? { taus: ((bounds) => Object.fromEntries(lib.profileTausAt(mixed.fit, r.data, 'alpha', bounds).taus.map((t, k) => [bounds[k], t])))([0.05, 0.1, 0.2, 0.5, 1 / 1.5, 1.5, 2, 5, 10, 20]), df: mixed.fit.df } : {}),
  };
}

function rightCall(row) {
  if (row.mechanism === 'none') return row.outcome === 'no-inhibition';
  return row.called === row.mechanism;
}

async function loadLib() {
  const root = new URL('../dist/', import.meta.url);
  const [a, s, t, r, pl, w] = await Promise.all([
    import(new URL('analysis/analyze-table.js', root)),
    import(new URL('simulate/simulate-rates.js', root)),
    import(new URL('simulate/table-from-points.js', root)),
    import(new URL('simulate/random.js', root)),
    import(new URL('evidence/intervals/profile-likelihood.js', root)),
    import(new URL('wording/verdict-words.js', root)),
  ]);
  return { analyzeTable: a.analyzeTable, simulateRates: s.simulateRates, tableFromPoints: t.tableFromPoints, seededRandom: r.seededRandom, profileTausAt: pl.profileTausAt, wordVerdict: w.wordVerdict };
}

if (!isMainThread) {
  const lib = await loadLib();
  const rows = [];
  for (const t of workerData.tasks) rows.push(await runTask(t, lib));
  parentPort.postMessage(rows);
} else {
  const args = process.argv.slice(2);
  const perCell = Number(args.find((a) => /^\d+$/.test(a)) ?? 40);
  const featuresAt = args.indexOf('--features');
  const errorAt = args.indexOf('--error');
  const errorModel = errorAt >= 0 ? args[errorAt + 1] : undefined;
  const all = tasks(perCell);
  const workers = Math.max(1, Math.min(cpus().length, 4));
  const started = Date.now();
  const parts = await Promise.all(
    Array.from({ length: workers }, (_, w) =>
      new Promise((resolve, reject) => {
        const worker = new Worker(fileURLToPath(import.meta.url), { workerData: { errorModel, features: featuresAt >= 0, tasks: all.filter((_, k) => k % workers === w) } });
        worker.once('message', resolve);
        worker.once('error', reject);
      })),
  );
  const rows = parts.flat();
  const seconds = (Date.now() - started) / 1000;
  if (featuresAt >= 0) writeFileSync(args[featuresAt + 1], rows.map((r) => JSON.stringify(r)).join('\n') + '\n');

  const pct = (x, n) => (n ? ((100 * x) / n).toFixed(1) + '%' : '-');
  const tally = (subset) => {
    const n = subset.length;
    const firm = subset.filter((r) => r.decisive);
    const wrong = firm.filter((r) => !rightCall(r)).length;
    return { n, firmRight: firm.length - wrong, wrong, right: subset.filter(rightCall).length };
  };
  const out = ['# Verdict over the design space', ''];
  out.push(`Generated by \`node bench/verdict-space-bench.mjs ${perCell}\`: ${rows.length} simulated compounds, ${perCell} per cell, ${seconds.toFixed(0)} s on ${workers} worker threads. Design space and grading in the script's header. "firm, right": a decisive call naming the true mechanism; "firm, wrong": a decisive call naming another; "right call": the named mechanism (or no inhibition) is the truth, firm or not. With ${perCell} compounds a cell, one wrong call is ${(100 / perCell).toFixed(1)}%.`);
  out.push('');
  const overall = tally(rows);
  out.push(`summary: verdict design space, ${rows.length} compounds: firm and wrong ${pct(overall.wrong, overall.n)} overall; firm and right ${pct(overall.firmRight, overall.n)}`);
  for (const design of Object.keys(DESIGNS)) {
    const t = tally(rows.filter((r) => r.design === design));
    out.push(`summary: ${design}: firm and wrong ${pct(t.wrong, t.n)}, firm and right ${pct(t.firmRight, t.n)} (n ${t.n})`);
  }
  // Cells as the issue defines them: design x noise x truth (placements pooled); the finer table
  // below splits each cell by [I] placement.
  let worst = { share: -1 };
  let over = 0;
  let cells = 0;
  out.push('', '## Cells: design, noise, truth (placements pooled)', '', '| design | noise | truth | n | firm, right | firm, wrong | right call |', '|---|---|---|---:|---:|---:|---:|');
  for (const design of Object.keys(DESIGNS))
    for (const noise of NOISES)
      for (const truth of TRUTHS) {
        const t = tally(rows.filter((r) => r.design === design && r.noise === noise && r.truth === truth.name));
        cells++;
        if (t.wrong / t.n > 0.02) over++;
        if (t.wrong / t.n > worst.share) worst = { share: t.wrong / t.n, label: `${design}, ${noise * 100}%, ${truth.name}` };
        out.push(`| ${design} | ${noise * 100}% | ${truth.name} | ${t.n} | ${pct(t.firmRight, t.n)} | ${pct(t.wrong, t.n)} | ${pct(t.right, t.n)} |`);
      }
  out.push('', `summary: worst cell (design x noise x truth): firm and wrong ${pct(worst.share, 1)} (${worst.label}); cells above 2%: ${over} of ${cells}`);
  let worstSplit = { share: -1 };
  out.push('', '## The same cells split by [I] placement', '', '| design | [I] placement | noise | truth | n | firm, right | firm, wrong | right call |', '|---|---|---|---|---:|---:|---:|---:|');
  for (const design of Object.keys(DESIGNS))
    for (const placement of Object.keys(PLACEMENTS))
      for (const noise of NOISES)
        for (const truth of TRUTHS) {
          const t = tally(rows.filter((r) => r.design === design && r.placement === placement && r.noise === noise && r.truth === truth.name));
          if (t.wrong / t.n > worstSplit.share) worstSplit = { share: t.wrong / t.n, label: `${design}, ${placement}, ${noise * 100}%, ${truth.name}` };
          out.push(`| ${design} | ${placement} | ${noise * 100}% | ${truth.name} | ${t.n} | ${pct(t.firmRight, t.n)} | ${pct(t.wrong, t.n)} | ${pct(t.right, t.n)} |`);
        }
  out.push('', `summary: worst split cell: firm and wrong ${pct(worstSplit.share, 1)} (${worstSplit.label})`);
  const compareAt = args.indexOf('--compare');
  const before = compareAt >= 0 ? readFileSync(args[compareAt + 1], 'utf8').trim().split('\n').map((l) => JSON.parse(l)) : null;
  const pooledHeader = before
    ? ['| design | truth | n | firm, right | firm, wrong | before: firm, right | before: firm, wrong |', '|---|---|---:|---:|---:|---:|---:|']
    : ['| design | truth | n | firm, right | firm, wrong |', '|---|---|---:|---:|---:|'];
  out.push('', '## Pooled over placement and noise', '', ...pooledHeader);
  for (const design of Object.keys(DESIGNS))
    for (const truth of TRUTHS) {
      const t = tally(rows.filter((r) => r.design === design && r.truth === truth.name));
      const row = `| ${design} | ${truth.name} | ${t.n} | ${pct(t.firmRight, t.n)} | ${pct(t.wrong, t.n)} |`;
      if (!before) out.push(row);
      else {
        const b = tally(before.filter((r) => r.design === design && r.truth === truth.name));
        out.push(`${row} ${pct(b.firmRight, b.n)} | ${pct(b.wrong, b.n)} |`);
      }
    }
  if (before) {
    out.push('', '## Before and after, per design', '', '| design | firm, right | firm, wrong | before: firm, right | before: firm, wrong |', '|---|---:|---:|---:|---:|');
    for (const design of [...Object.keys(DESIGNS), 'all']) {
      const pick = (list) => list.filter((r) => design === 'all' || r.design === design);
      const t = tally(pick(rows));
      const b = tally(pick(before));
      out.push(`| ${design} | ${pct(t.firmRight, t.n)} | ${pct(t.wrong, t.n)} | ${pct(b.firmRight, b.n)} | ${pct(b.wrong, b.n)} |`);
    }
    out.push('', `"before": the same ${before.length} compounds (same seeds) analysed by the tool as it was before issue 15 (commit 58d3093, default error model constant), from \`--compare\`.`);
  }
  const text = out.join('\n') + '\n';
  console.log(text);
  if (args.includes('--write')) writeFileSync(new URL('../docs/verdict-design-space.md', import.meta.url), text);
}
