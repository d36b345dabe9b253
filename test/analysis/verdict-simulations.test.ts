/**
 * Seeded simulations (invented data; the truth is known): how often is the verdict decisive, and
 * how often is a decisive verdict wrong? bench/verdict-rates.mjs runs the full version (200 per cell).
 */
import { describe, expect, it } from 'vitest';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { GOOD_DESIGN, simulatedTable, TRUE_PARAMS } from '../helpers/sim-table.js';

const N = 20;
const mechanisms = Object.keys(TRUE_PARAMS) as Array<keyof typeof TRUE_PARAMS>;

function isRight(mech: string, v: { outcome: string; mechanism: string | null }): boolean {
  return mech === 'none' ? v.outcome === 'no-inhibition' : v.mechanism === mech;
}

describe('verdict on a good design (5% proportional noise, triplicates)', () => {
  for (const mech of mechanisms) {
    it(`${mech}: never decisively wrong, and decisive in at least 80% (inhibited mechanisms) of ${N} datasets`, () => {
      let decisive = 0;
      let wrong = 0;
      let right = 0;
      for (let k = 0; k < N; k++) {
        const r = analyzeTable(simulatedTable(mech, 5000 + k), { errorModel: 'proportional' });
        if (r.verdict.decisive) decisive++;
        if (r.verdict.decisive && !isRight(mech, r.verdict)) wrong++;
        if (isRight(mech, r.verdict)) right++;
      }
      expect(wrong).toBe(0);
      if (mech === 'none') expect(right).toBeGreaterThanOrEqual(0.9 * N);
      else expect(decisive).toBeGreaterThanOrEqual(0.8 * N);
    });
  }
});

describe('verdict on poor designs', () => {
  const poor = {
    'no [S] above Km': { substrate: [1, 1.5, 2, 3, 4, 5, 7, 9], inhibitor: GOOD_DESIGN.inhibitor },
    'one non-zero [I]': { substrate: GOOD_DESIGN.substrate, inhibitor: [0, 4] },
  };
  for (const [name, design] of Object.entries(poor)) {
    it(`${name}: undecided in most datasets, decisively wrong at most 5%`, () => {
      let undecided = 0;
      let wrong = 0;
      let total = 0;
      for (const mech of ['competitive', 'uncompetitive', 'noncompetitive', 'mixed'] as const) {
        for (let k = 0; k < 8; k++) {
          const r = analyzeTable(simulatedTable(mech, 7000 + k, design), { errorModel: 'proportional' });
          total++;
          if (!r.verdict.decisive) undecided++;
          if (r.verdict.decisive && !isRight(mech, r.verdict)) wrong++;
        }
      }
      expect(undecided / total).toBeGreaterThan(0.5);
      expect(wrong / total).toBeLessThanOrEqual(0.05);
    });
  }
});

describe('residual checks catch a wrong mechanism', () => {
  it('competitive fitted to mixed data is flagged by the runs test in most datasets (measured rate asserted)', () => {
    let flagged = 0;
    for (let k = 0; k < N; k++) {
      const r = analyzeTable(simulatedTable('mixed', 9000 + k), { errorModel: 'proportional' });
      const runs = r.residualChecks?.competitive?.runs;
      if (runs && runs.pTooFew < 0.01) flagged++;
    }
    // bench/verdict-rates.mjs measured 77.5% at 40 datasets; assert well above chance (1%)
    expect(flagged / N).toBeGreaterThanOrEqual(0.5);
  });
  it('the true mechanism is flagged rarely (runs test at 0.01)', () => {
    let flagged = 0;
    for (let k = 0; k < N; k++) {
      const r = analyzeTable(simulatedTable('competitive', 9100 + k), { errorModel: 'proportional' });
      if ((r.residualChecks?.competitive?.runs.pTooFew ?? 1) < 0.01) flagged++;
    }
    expect(flagged).toBeLessThanOrEqual(2);
  });
});

describe('error model check', () => {
  it('--error auto picks proportional on proportional noise and constant on constant noise', () => {
    const prop = analyzeTable(simulatedTable('competitive', 31), { errorModel: 'auto' });
    expect(prop.errorModel).toBe('proportional');
    expect(prop.verdict.reasons[0]).toMatchObject({ code: 'error-model-chosen', chosen: 'proportional' });
    const cons = analyzeTable(simulatedTable('competitive', 32, GOOD_DESIGN, { noise: 'constant', noiseLevel: 2 }), { errorModel: 'auto' });
    expect(cons.errorModel).toBe('constant');
  });
  it('warns when the chosen error model is clearly worse', () => {
    const r = analyzeTable(simulatedTable('competitive', 33, GOOD_DESIGN, { noiseLevel: 0.1 }), { errorModel: 'constant' });
    expect(r.errorModelCheck?.clearlyWorse).toBe(true);
    expect(r.verdict.reasons).toContainEqual({ code: 'caveat', caveat: expect.objectContaining({ code: 'error-model', chosen: 'constant', best: r.errorModelCheck!.best }) });
  });
});

describe('a gross outlier', () => {
  it('is flagged, and the robust refit calls the clean data\'s mechanism', () => {
    const clean = simulatedTable('noncompetitive', 41);
    const cleanCall = analyzeTable(clean, { errorModel: 'proportional' }).verdict.mechanism;
    const dirty = structuredClone(clean);
    const k = dirty.points.findIndex((p) => p.substrate === 100 && p.inhibitor === 0);
    dirty.points[k].rate *= 0.35;
    const r = analyzeTable(dirty, { errorModel: 'proportional', robust: true });
    const suspects = r.residualChecks?.[r.verdict.mechanism!]?.suspects.map((s) => s.index) ?? [];
    expect(suspects).toContain(k);
    expect(r.robust?.downWeighted.map((d) => d.index)).toContain(k);
    expect(r.robust?.verdict.mechanism).toBe(cleanCall);
    expect(r.robust?.downWeighted.find((d) => d.index === k)?.line).toBe(dirty.points[k].line);
  });
});
