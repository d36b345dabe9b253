// Measures how often the verdict is decisive, and how often a decisive verdict is wrong, on seeded
// simulations of each mechanism, for a good design and two poor ones (issue 5). Run after build:
//   node bench/verdict-rates.mjs [datasets-per-cell]
// Simulated data only (src/simulate); the truth is known, so "wrong" is measurable.
import { analyzeTable } from '../dist/analysis/analyze-table.js';
import { simulateRates } from '../dist/simulate/simulate-rates.js';

const perCell = Number(process.argv[2] ?? 200);
const truth = { Vmax: 100, Km: 10, Ki: 2, Kiu: 2 };
const paramsFor = {
  none: { Vmax: 100, Km: 10 },
  competitive: { ...truth },
  uncompetitive: { ...truth },
  noncompetitive: { ...truth },
  mixed: { Vmax: 100, Km: 10, Ki: 2, Kiu: 10 },
};
const designs = {
  good: { substrate: [2, 4, 7, 10, 15, 25, 50, 100], inhibitor: [0, 1, 2, 4, 8] },
  'no [S] above Km': { substrate: [1, 1.5, 2, 3, 4, 5, 7, 9], inhibitor: [0, 1, 2, 4, 8] },
  'one non-zero [I]': { substrate: [2, 4, 7, 10, 15, 25, 50, 100], inhibitor: [0, 4] },
};

function table(points) {
  return { source: 'sim', points, rowsRead: points.length, excluded: [], warnings: [], layout: 'long', separator: ',', decimalMark: '.', units: { substrate: null, inhibitor: null, rate: null }, hasSd: false };
}

function correct(v, mech) {
  if (mech === 'none') return v.outcome === 'no-inhibition';
  return v.mechanism === mech;
}

const rows = [];
for (const [designName, design] of Object.entries(designs)) {
  for (const mech of Object.keys(paramsFor)) {
    let decisive = 0, wrongDecisive = 0, right = 0, undecided = 0, runsFlag = 0;
    for (let k = 0; k < perCell; k++) {
      const pts = simulateRates({ mechanism: mech, params: paramsFor[mech], ...design, replicates: 3, noise: 'proportional', noiseLevel: 0.05, seed: 1000 * k + 17 });
      const r = analyzeTable(table(pts), { errorModel: 'proportional' });
      const v = r.verdict;
      if (v.decisive) { decisive++; if (!correct(v, mech)) wrongDecisive++; }
      if (correct(v, mech)) right++;
      if (v.outcome === 'undecided') undecided++;
      if (mech === 'mixed' && r.residualChecks?.competitive && r.residualChecks.competitive.runs.pTooFew < 0.01) runsFlag++;
    }
    rows.push({ design: designName, truth: mech, decisive: decisive / perCell, wrongDecisive: wrongDecisive / perCell, called: right / perCell, undecided: undecided / perCell, ...(mech === 'mixed' ? { competitiveRunsFlag: runsFlag / perCell } : {}) });
  }
}
const pct = (x) => (100 * x).toFixed(1) + '%';
console.log(`| design | truth | decisive | decisive and wrong | right call | undecided |`);
console.log(`|---|---|---|---|---|---|`);
for (const r of rows) console.log(`| ${r.design} | ${r.truth} | ${pct(r.decisive)} | ${pct(r.wrongDecisive)} | ${pct(r.called)} | ${pct(r.undecided)} |`);
const m = rows.filter((r) => r.competitiveRunsFlag !== undefined);
for (const r of m) console.log(`runs test flags competitive fitted to mixed data (${r.design}): ${pct(r.competitiveRunsFlag)}`);
console.log(`(${perCell} datasets per cell, 5% proportional noise, triplicates, proportional error model)`);
