/**
 * profileTausAt (the exclusion tests' statistic) agrees with the profile intervals: at an end of the
 * profile-t interval, |tau| equals the t quantile of the level by definition (Bates & Watts 1988,
 * sec. 6.1), whichever way the end was reached. Invented data (simulated, seeded).
 */
import { describe, expect, it } from 'vitest';
import { profileAllOfFit, profileTausAt } from '../../src/evidence/intervals/profile-likelihood.js';
import { fitAllMechanisms } from '../../src/fit/fit-all-mechanisms.js';
import { fitDataFromTable } from '../../src/fit/fit-data.js';
import { simulateReferenceDesign } from '../../src/simulate/reference-design.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { tQuantile } from '../../src/stats/distributions.js';

describe('profile t statistic at given values', () => {
  for (const seed of [3, 11]) {
    it(`equals the t quantile at the ends of the 95% alpha interval (seed ${seed})`, () => {
      const data = fitDataFromTable(tableFromPoints(simulateReferenceDesign('mixed', seed)));
      const mixed = fitAllMechanisms(data, 'proportional').find((f) => f.mechanism === 'mixed')!;
      const alpha = profileAllOfFit(mixed, data, { level: 0.95 }).find((p) => p.name === 'alpha')!;
      const [lo, hi] = alpha.interval;
      expect(lo).not.toBeNull();
      expect(hi).not.toBeNull();
      const { taus, df } = profileTausAt(mixed, data, 'alpha', [hi!, lo!]);
      const t = tQuantile(0.975, df);
      expect(taus[0]).toBeCloseTo(t, 5);
      expect(taus[1]).toBeCloseTo(-t, 5);
    });
  }
});
