import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/simulate/random.js';
import { simulateRates, trueRate, ratesToCsv } from '../../src/simulate/simulate-rates.js';

describe('seeded random source', () => {
  it('is reproducible for a seed and differs between seeds', () => {
    const a = seededRandom(42);
    const b = seededRandom(42);
    const c = seededRandom(43);
    const xa = Array.from({ length: 5 }, () => a.uniform());
    expect(Array.from({ length: 5 }, () => b.uniform())).toEqual(xa);
    expect(Array.from({ length: 5 }, () => c.uniform())).not.toEqual(xa);
  });
  it('gives uniform and normal moments within sampling error (n = 200000)', () => {
    const r = seededRandom(7);
    const n = 200_000;
    let su = 0, su2 = 0, sn = 0, sn2 = 0, sn4 = 0;
    for (let k = 0; k < n; k++) {
      const u = r.uniform();
      su += u; su2 += u * u;
      const z = r.normal();
      sn += z; sn2 += z * z; sn4 += z ** 4;
    }
    expect(su / n).toBeCloseTo(0.5, 2);
    expect(su2 / n - (su / n) ** 2).toBeCloseTo(1 / 12, 2);
    expect(Math.abs(sn / n)).toBeLessThan(0.01);
    expect(sn2 / n).toBeCloseTo(1, 1);
    expect(sn4 / n).toBeGreaterThan(2.9); // normal kurtosis 3
    expect(sn4 / n).toBeLessThan(3.1);
  });
});

describe('simulateRates', () => {
  const design = {
    mechanism: 'competitive' as const,
    params: { Vmax: 10, Km: 2, Ki: 1 },
    substrate: [0.5, 1, 2, 4, 8],
    inhibitor: [0, 1, 3],
    replicates: 2,
    noise: 'proportional' as const,
    noiseLevel: 0,
    seed: 1,
  };
  it('without noise reproduces the rate law exactly', () => {
    const pts = simulateRates(design);
    expect(pts).toHaveLength(30);
    for (const p of pts) expect(p.rate).toBeCloseTo((10 * p.substrate) / (2 * (1 + p.inhibitor / 1) + p.substrate), 12);
  });
  it('with 5% proportional noise has a CV near 5%', () => {
    const pts = simulateRates({ ...design, replicates: 400, noiseLevel: 0.05, seed: 3 });
    let acc = 0;
    for (const p of pts) acc += ((p.rate - trueRate('competitive', design.params, p.substrate, p.inhibitor)) / trueRate('competitive', design.params, p.substrate, p.inhibitor)) ** 2;
    expect(Math.sqrt(acc / pts.length)).toBeGreaterThan(0.048);
    expect(Math.sqrt(acc / pts.length)).toBeLessThan(0.052);
  });
  it('rejects a missing parameter', () => {
    expect(() => trueRate('mixed', { Vmax: 1, Km: 1, Ki: 1 }, 1, 1)).toThrow(/Kiu/);
  });
  it('writes a long-layout CSV', () => {
    const csv = ratesToCsv(simulateRates({ ...design, replicates: 1 }), { substrate: 'uM', inhibitor: 'nM' });
    expect(csv.split('\n')[0]).toBe('substrate (uM),inhibitor (nM),rate,replicate');
    expect(csv.trim().split('\n')).toHaveLength(16);
  });
});
