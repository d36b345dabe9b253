/**
 * A small seeded calibration: 200 simulated competitive datasets (invented truth, a design with
 * [S] from 0.25 to 8 Km and [I] up to 4 Ki, duplicates, constant noise), each fitted by the
 * competitive model; the 95% profile-t interval of every parameter should cover the truth in about
 * 95% of datasets (Bates & Watts 1988, ch. 6). With 200 datasets the binomial SD of the coverage is
 * 1.5 points, so 90-99% is a loose but failing-capable band. The full table is docs/calibration.md.
 */
import { describe, expect, it } from 'vitest';
import { competitive } from '../../src/models/competitive.js';
import { fitMechanism } from '../../src/fit/fit-mechanism.js';
import { fitDataFromArrays } from '../../src/fit/fit-data.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import { profileAllOfFit } from '../../src/evidence/intervals/profile-likelihood.js';

const TRUTH = { Vmax: 10, Km: 20, Ki: 5 };

describe('profile-t coverage on simulated competitive data', () => {
  it('covers the true Vmax, Km and Ki in 90-99% of 200 datasets', () => {
    const covered = { Vmax: 0, Km: 0, Ki: 0 };
    const datasets = 200;
    for (let d = 0; d < datasets; d++) {
      const points = simulateRates({
        mechanism: 'competitive',
        params: TRUTH,
        substrate: [5, 10, 20, 40, 80, 160],
        inhibitor: [0, 2.5, 5, 10, 20],
        replicates: 2,
        noise: 'constant',
        noiseLevel: 0.3,
        seed: 1000 + d,
      });
      const data = fitDataFromArrays(points.map((p) => p.substrate), points.map((p) => p.inhibitor), points.map((p) => p.rate));
      const fit = fitMechanism(competitive, data, 'constant');
      for (const p of profileAllOfFit(fit, data, { level: 0.95 })) {
        const truth = TRUTH[p.name as keyof typeof TRUTH];
        const [lo, hi] = p.interval;
        if ((lo === null || lo <= truth) && (hi === null || truth <= hi)) covered[p.name as keyof typeof covered]++;
      }
    }
    for (const name of Object.keys(covered) as (keyof typeof covered)[]) {
      const share = covered[name] / datasets;
      expect(share, name).toBeGreaterThanOrEqual(0.9);
      expect(share, name).toBeLessThanOrEqual(0.99);
    }
  });
});
