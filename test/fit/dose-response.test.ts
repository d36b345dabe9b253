/**
 * Single-[S] dose-response fits (src/fit/dose-response-fit.ts, src/evidence/constants/dose-response.ts)
 * against an independent reference: scipy.optimize.least_squares (method lm, tolerances 1e-15,
 * several starts) on three simulated curves (INVENTED data), test/fixtures/dose-response/runner.py
 * -> reference.json. Same minimum (SSE to 1e-9 relative), same parameters (1e-6 relative, or 1e-6
 * absolute for a bottom near zero) and same standard errors (1e-4 relative).
 * Cheng-Prusoff relations: Cheng, Y. and Prusoff, W. H. (1973) Biochem. Pharmacol. 22, 3099-3108.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fitDoseResponse, doseResponseRate } from '../../src/fit/dose-response-fit.js';
import { chengPrusoffKi, doseResponseEvidence } from '../../src/evidence/constants/dose-response.js';

interface RefFit { x: number[]; sse: number; se: number[] }
interface RefCase { name: string; inhibitor: number[]; rate: number[]; fourPL: RefFit; hyperbolic: RefFit }
const reference = JSON.parse(readFileSync(new URL('../fixtures/dose-response/reference.json', import.meta.url), 'utf8')) as { cases: RefCase[] };

const close = (a: number, b: number, rel: number, abs = 0) => Math.abs(a - b) <= Math.max(abs, rel * Math.abs(b));

describe('dose-response fits agree with scipy (runner.py)', () => {
  for (const c of reference.cases) {
    const i = Float64Array.from(c.inhibitor);
    const v = Float64Array.from(c.rate);
    it(`${c.name}: four-parameter logistic`, () => {
      const fit = fitDoseResponse('four-parameter-logistic', i, v);
      expect(fit.converged).toBe(true);
      expect(close(fit.sse, c.fourPL.sse, 1e-9)).toBe(true);
      c.fourPL.x.forEach((x, j) => expect(close(fit.x[j], x, 1e-6, 1e-6), `param ${j}: ${fit.x[j]} vs ${x}`).toBe(true));
      c.fourPL.se.forEach((se, j) => expect(close(fit.se[j], se, 1e-4), `se ${j}: ${fit.se[j]} vs ${se}`).toBe(true));
    });
    it(`${c.name}: single-site hyperbola`, () => {
      const fit = fitDoseResponse('single-site-hyperbola', i, v);
      expect(close(fit.sse, c.hyperbolic.sse, 1e-9)).toBe(true);
      c.hyperbolic.x.forEach((x, j) => expect(close(fit.x[j], x, 1e-6)).toBe(true));
      c.hyperbolic.se.forEach((se, j) => expect(close(fit.se[j], se, 1e-4)).toBe(true));
    });
  }
});

describe('dose-response evidence', () => {
  const steep = reference.cases.find((c) => c.name === 'steep')!;
  const site = reference.cases.find((c) => c.name === 'site')!;
  const i = Float64Array.from(steep.inhibitor);
  const v = Float64Array.from(steep.rate);

  it('profile interval: brackets the estimate, agrees with Wald within 10% on a well-determined curve', () => {
    const e = doseResponseEvidence(i, v, { substrate: 50, level: 0.95 });
    const four = e.models.find((m) => m.model === 'four-parameter-logistic')!;
    const [lo, hi] = four.ic50.profile;
    expect(lo).not.toBeNull();
    expect(hi).not.toBeNull();
    expect(lo!).toBeLessThan(four.ic50.value);
    expect(hi!).toBeGreaterThan(four.ic50.value);
    // the Wald interval on ln IC50 is symmetric in the log: its ends multiply to IC50^2
    const [wl, wh] = four.ic50.wald;
    expect(close(wl! * wh!, four.ic50.value ** 2, 1e-12)).toBe(true);
    // a well-determined curve: profile and Wald ends within 10% of each other
    expect(close(lo!, wl!, 0.1)).toBe(true);
    expect(close(hi!, wh!, 0.1)).toBe(true);
    expect(four.hill!.profile[0]!).toBeLessThan(four.hill!.value);
    // steep data (Hill 1.6 simulated): the 4PL wins by AICc and the slope caveat is raised
    expect(e.chosen).toBe('four-parameter-logistic');
    expect(e.notes.some((n) => n.startsWith('The Hill slope'))).toBe(true);
    expect(e.notes[0]).toMatch(/^One \[S\] cannot tell the mechanism/);
  });

  it('the fitted curve passes through its midpoint at the IC50', () => {
    const fit = fitDoseResponse('four-parameter-logistic', i, v);
    const [top, bottom, lnC] = fit.x;
    expect(close(doseResponseRate(fit, Math.exp(lnC)), (top + bottom) / 2, 1e-12)).toBe(true);
  });

  it('one-site data (Hill 1, bottom 0 simulated): the hyperbola is preferred by AICc', () => {
    const e = doseResponseEvidence(Float64Array.from(site.inhibitor), Float64Array.from(site.rate), { substrate: 50 });
    expect(e.chosen).toBe('single-site-hyperbola');
  });

  it('Cheng-Prusoff: the published relations, intervals mapped monotonically', () => {
    // IC50 = 300 nM at [S] = 50 uM with Km = 25 uM (invented numbers): competitive Ki = 300 / 3 = 100,
    // uncompetitive Kiu = 300 / 1.5 = 200, noncompetitive Ki = 300
    const k = chengPrusoffKi(300, [240, 390], 50, 25);
    expect(k.competitive.value).toBeCloseTo(100, 12);
    expect(k.competitive.interval).toEqual([80, 130]);
    expect(k.uncompetitive.value).toBeCloseTo(200, 12);
    expect(k.uncompetitive.interval![0]).toBeCloseTo(160, 12);
    expect(k.noncompetitive.value).toBe(300);
    expect(k.mixed.value).toBeNull();
  });
});
