/**
 * External check of the global fit on published data: the 12 puromycin-treated rows of Treloar (1974),
 * as tabulated in Bates, D. M. and Watts, D. G. (1988) Nonlinear Regression Analysis and Its
 * Applications, Wiley, Appendix A1.3 (R `datasets::Puromycin`), fitted by the no-inhibition model
 * v = Vmax*S/(Km + S) with constant error. Data: test/fixtures/puromycin/treated.csv.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { noInhibition } from '../../src/models/no-inhibition.js';
import { fitMechanism } from '../../src/fit/fit-mechanism.js';
import { fitDataFromArrays } from '../../src/fit/fit-data.js';
import { waldEstimates } from '../../src/evidence/intervals/wald-estimates.js';
import { agreesToDigits } from './significant-digits.js';

const FIXTURES = new URL('../fixtures/puromycin/', import.meta.url);

/** Reference values, copied from the reference notes given to the project (outside the repository; table "Reference results"). */
const PUBLISHED = {
  /** R 4.2.2 `nls`; agrees with scipy 1.17 least_squares (lm) to 9 digits */
  Vm: 212.68366360,
  K: 0.064121158,
  /** scipy 1.17 s^2 (J'J)^-1; Bates & Watts (1988) give 6.947 and 0.008281 */
  seVm: 6.947155,
  seK: 0.00828095,
  /** scipy 1.17, 4 digits as published */
  correlation: 0.7651,
  /** R 4.2.2 */
  rss: 1195.448814,
};

/** Bates & Watts (1988), as quoted in the same table: SEs to 4 significant digits. */
const BATES_WATTS_SE = { seVm: 6.947, seK: 0.008281 };

/** More digits of the correlation: test/fixtures/puromycin/runner.py (scipy least_squares, 'lm'). */
const scipyReference = JSON.parse(readFileSync(new URL('scipy-reference.json', FIXTURES), 'utf8')) as {
  Vm: number;
  K: number;
  seVm: number;
  seK: number;
  correlation: number;
  rss: number;
};

function readTreated(): { conc: number[]; rate: number[] } {
  const lines = readFileSync(new URL('treated.csv', FIXTURES), 'utf8').trim().split('\n').slice(1);
  const conc: number[] = [];
  const rate: number[] = [];
  for (const line of lines) {
    const [c, v] = line.split(',').map(Number);
    conc.push(c);
    rate.push(v);
  }
  return { conc, rate };
}

function fitPuromycin() {
  const { conc, rate } = readTreated();
  const data = fitDataFromArrays(conc, new Array(conc.length).fill(0), rate);
  const fit = fitMechanism(noInhibition, data, 'constant');
  const wald = waldEstimates(fit, 0);
  return { fit, wald };
}

describe('Puromycin (treated), Michaelis-Menten fit with constant error', () => {
  const { fit, wald } = fitPuromycin();
  const [vm, km] = wald.estimates;
  const cov = wald.logCovariance;
  const correlation = cov[1] / Math.sqrt(cov[0] * cov[3]);

  it('reads the 12 published rows and converges', () => {
    expect(fit.n).toBe(12);
    expect(fit.converged).toBe(true);
  });

  it('matches Vm, K and the RSS to 6 significant digits (R 4.2.2 nls)', () => {
    expect(agreesToDigits(fit.params[0], PUBLISHED.Vm, 6)).toBe(true);
    expect(agreesToDigits(fit.params[1], PUBLISHED.K, 6)).toBe(true);
    expect(agreesToDigits(fit.sse, PUBLISHED.rss, 6)).toBe(true);
    // the RSS is flat at the minimum, so it agrees much further (10 digits given by R)
    expect(agreesToDigits(fit.sse, PUBLISHED.rss, 9)).toBe(true);
  });

  it('matches the standard errors to 6 significant digits (scipy 1.17) and Bates & Watts to 4', () => {
    expect(agreesToDigits(vm.se!, PUBLISHED.seVm, 6)).toBe(true);
    expect(agreesToDigits(km.se!, PUBLISHED.seK, 6)).toBe(true);
    expect(agreesToDigits(vm.se!, BATES_WATTS_SE.seVm, 4)).toBe(true);
    expect(agreesToDigits(km.se!, BATES_WATTS_SE.seK, 4)).toBe(true);
  });

  it('matches the correlation: 4 digits as published, 6 against the scipy runner', () => {
    expect(agreesToDigits(correlation, PUBLISHED.correlation, 4)).toBe(true);
    expect(agreesToDigits(correlation, scipyReference.correlation, 6)).toBe(true);
  });

  it('correlation of ln-parameters equals the natural-scale correlation exactly', () => {
    // J_theta = J_p diag(p), so Cov(theta) = diag(1/p) Cov(p) diag(1/p) and the correlations agree
    // exactly (not only to first order). Checked against the natural-scale Jacobian directly.
    const { conc } = readTreated();
    const [V, K] = fit.params;
    let a = 0, b = 0, c = 0; // J'J of the natural-scale Jacobian (dv/dV, dv/dK)
    for (const s of conc) {
      const dV = s / (K + s);
      const dK = (-V * s) / (K + s) ** 2;
      a += dV * dV;
      b += dV * dK;
      c += dK * dK;
    }
    // inverse of [[a, b], [b, c]] is proportional to [[c, -b], [-b, a]]
    const natural = -b / Math.sqrt(a * c);
    expect(Math.abs(correlation - natural)).toBeLessThan(1e-12);
  });

  it('agrees with the committed scipy runner output', () => {
    expect(agreesToDigits(fit.params[0], scipyReference.Vm, 6)).toBe(true);
    expect(agreesToDigits(fit.params[1], scipyReference.K, 6)).toBe(true);
    expect(agreesToDigits(fit.sse, scipyReference.rss, 10)).toBe(true);
  });
});
