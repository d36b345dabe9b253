/**
 * NIST StRD nonlinear regression check of the Levenberg-Marquardt engine: all 27 problems from both
 * NIST starting values (54 runs), default engine settings.
 *
 * Data, starts and certified values: NIST ITL Statistical Reference Datasets (public domain), copied
 * into test/fixtures/nist-strd/*.json by test/fixtures/nist-strd/generate.mjs.
 * Accuracy measure: log relative error, LRE = -log10(|est - cert| / |cert|), McCullough, B. D. (1998),
 * The American Statistician 52(4), 358-366.
 * Thresholds (set by the project brief): parameters and residual sum of squares LRE >= 6,
 * standard deviations LRE >= 4.
 *
 * Lanczos1: its certified RSS (1.43e-25) is rounding noise of double precision, so the RSS is
 * checked absolutely (< 1e-20), and since every certified SD is sqrt(s^2) times sqrt([(J'J)^-1]_jj),
 * the noise-level s is divided out: sqrt([(J'J)^-1]_jj) is checked against certified SD_j divided by
 * the certified residual standard deviation, to LRE >= 4.
 */
import { describe, expect, test } from 'vitest';
import { unscaledCovariance } from '../../src/fit/qr.js';
import { listNistFixtures, loadNistFixture, logRelativeError } from './models.js';
import { runNist } from './nist-lre.js';

const names = listNistFixtures();

test('fixtures hold all 27 NIST StRD nonlinear problems', () => {
  expect(names).toHaveLength(27);
});

describe.each(names)('NIST StRD %s', (name) => {
  const fixture = loadNistFixture(name);
  test.each([1, 2] as const)('start %i: parameters, RSS and SDs reach the certified values', (start) => {
    const run = runNist(fixture, start);
    expect(run.result.converged, run.result.message).toBe(true);
    for (let j = 0; j < fixture.parameters; j++) {
      expect(run.parameterLre[j], `b${j + 1} = ${run.result.x[j]}`).toBeGreaterThanOrEqual(6);
    }
    if (name === 'Lanczos1') {
      expect(run.result.sse).toBeLessThan(1e-20);
      const { matrix } = unscaledCovariance(run.result.jacobian, fixture.observations, fixture.parameters);
      const s = fixture.certified.residualStandardDeviation;
      for (let j = 0; j < fixture.parameters; j++) {
        const unscaledSd = Math.sqrt(matrix[j * fixture.parameters + j]);
        expect(logRelativeError(unscaledSd, fixture.certified.standardDeviations[j] / s)).toBeGreaterThanOrEqual(4);
      }
    } else {
      expect(run.rssLre, `RSS = ${run.result.sse}`).toBeGreaterThanOrEqual(6);
      for (let j = 0; j < fixture.parameters; j++) {
        expect(run.sdLre[j], `SD(b${j + 1})`).toBeGreaterThanOrEqual(4);
      }
    }
  });
});
