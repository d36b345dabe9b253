/**
 * Outside checks of the Lambert W / Wright omega implementation and the integrated
 * Michaelis-Menten closed form (src/reads/lambert-w.ts, src/reads/integrated-michaelis-menten.ts).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { lambertW, wrightOmega, BRANCH_POINT } from '../../src/reads/lambert-w.js';
import { productFormed } from '../../src/reads/integrated-michaelis-menten.js';

// produced by test/fixtures/lambertw/runner.py (scipy.special.lambertw / wrightomega)
const reference = JSON.parse(readFileSync(new URL('../fixtures/lambertw/reference.json', import.meta.url), 'utf8')) as {
  lambert_w: { z: number[]; w: number[] };
  wright_omega: { x: number[]; omega: number[] };
  curves: { vmax: number; km: number; s0: number; times: number[]; product: number[] }[];
};

function relativeError(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), Number.MIN_VALUE);
}

describe('Lambert W, published values', () => {
  it('W(1) is the omega constant 0.5671432904097838 (OEIS A030178)', () => {
    expect(Math.abs(lambertW(1) - 0.5671432904097838)).toBeLessThanOrEqual(2.3e-16);
    expect(Math.abs(wrightOmega(0) - 0.5671432904097838)).toBeLessThanOrEqual(2.3e-16);
  });
  it('W(e) = 1 and W(-1/e) = -1 (definition: W(z) e^W(z) = z)', () => {
    expect(lambertW(Math.E)).toBeCloseTo(1, 15);
    expect(lambertW(BRANCH_POINT)).toBe(-1);
    expect(lambertW(0)).toBe(0);
  });
  it('W(-ln2/2) = -ln 2 (since -ln2 e^(-ln2) = -ln2/2)', () => {
    expect(relativeError(lambertW(-Math.LN2 / 2), -Math.LN2)).toBeLessThan(1e-14);
  });
  it('no value below the branch point', () => {
    expect(lambertW(-0.4)).toBeNaN();
  });
});

describe('Lambert W and Wright omega against scipy (test/fixtures/lambertw/runner.py)', () => {
  it('W(z) on the principal branch to 1e-13 relative (near the branch point to 1e-7: W has a square-root singularity there)', () => {
    reference.lambert_w.z.forEach((z, k) => {
      const expected = reference.lambert_w.w[k];
      const tolerance = z < -0.367 ? 1e-7 : 1e-13;
      expect(relativeError(lambertW(z), expected), `W(${z})`).toBeLessThan(tolerance);
    });
  });
  it('omega(x) = W(exp(x)) to 1e-14 relative, including x where exp(x) overflows', () => {
    reference.wright_omega.x.forEach((x, k) => {
      expect(relativeError(wrightOmega(x), reference.wright_omega.omega[k]), `omega(${x})`).toBeLessThan(1e-14);
    });
  });
  it('omega satisfies w + ln w = x', () => {
    for (const x of [-50, -5, -1, 0, 0.3, 1, 2.5, 4, 20, 800, 1e5]) {
      const w = wrightOmega(x);
      expect(Math.abs(w + Math.log(w) - x)).toBeLessThan(1e-13 * Math.max(1, Math.abs(x)));
    }
  });
  it('the integrated Michaelis-Menten product P(t) matches scipy to 1e-10 of S0', () => {
    for (const c of reference.curves) {
      c.times.forEach((t, k) => {
        expect(Math.abs(productFormed(t, c.vmax, c.km, c.s0) - c.product[k]), `V=${c.vmax} Km=${c.km} S0=${c.s0} t=${t}`).toBeLessThan(1e-10 * c.s0);
      });
    }
  });
});
