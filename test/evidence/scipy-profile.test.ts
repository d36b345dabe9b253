/**
 * Profile-t intervals against a brute-force reference: test/fixtures/scipy-profile/runner.py
 * (scipy.optimize.least_squares re-optimised on a grid, crossings refined by brentq; simulated
 * data written into reference.json by the runner). Ends must agree to 1e-4 relative. An end the
 * reference does not bracket within its grid, or one beyond the data's support, must be open here.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { modelFor } from '../../src/models/index.js';
import type { Mechanism } from '../../src/models/types.js';
import { fitMechanism } from '../../src/fit/fit-mechanism.js';
import { fitDataFromArrays } from '../../src/fit/fit-data.js';
import { profileAllOfFit } from '../../src/evidence/intervals/profile-likelihood.js';
import { profileSupport } from '../../src/evidence/intervals/profile-support.js';

interface Reference {
  levels: number[];
  cases: {
    name: string;
    s: number[];
    i: number[];
    v: number[];
    sd: number[] | null;
    fits: Record<string, { sse: number; params: Record<string, { estimate: number } & Record<string, [number | null, number | null]>> }>;
  }[];
}

const reference = JSON.parse(readFileSync(new URL('../fixtures/scipy-profile/reference.json', import.meta.url), 'utf8')) as Reference;

describe('profile-t intervals match the scipy brute-force reference', () => {
  for (const c of reference.cases) {
    const data = fitDataFromArrays(c.s, c.i, c.v, c.sd ?? undefined);
    for (const [mechanism, ref] of Object.entries(c.fits)) {
      it(`${c.name}, ${mechanism} model`, () => {
        const fit = fitMechanism(modelFor(mechanism as Mechanism), data, c.sd ? 'column' : 'constant');
        expect(Math.abs(fit.sse - ref.sse) / ref.sse).toBeLessThan(1e-8);
        for (const level of reference.levels) {
          const profiles = profileAllOfFit(fit, data, { level });
          for (const [name, entry] of Object.entries(ref.params)) {
            const mine = profiles.find((p) => p.name === name);
            expect(mine, name).toBeDefined();
            const support = profileSupport(data, name as never);
            const refEnds = entry[String(level)];
            refEnds.forEach((end, side) => {
              const got = mine!.interval[side];
              const beyond = end !== null && (Math.log(end) > support.high || Math.log(end) < support.low || reachesUndetectedArm(name, side, end, fit.params, support.lnDetectionBound));
              if (end === null || beyond) {
                expect(got, `${name} ${level} side ${side}: open`).toBeNull();
              } else {
                expect(got, `${name} ${level} side ${side}`).not.toBeNull();
                expect(Math.abs(got! - end) / end, `${name} ${level} side ${side}`).toBeLessThan(1e-4);
              }
            });
          }
        }
      });
    }
  }
});

/** An alpha end whose constrained Ki or Kiu would pass the detection bound (Kiu = alpha Ki with the other held near its estimate). */
function reachesUndetectedArm(name: string, side: number, end: number, params: Float64Array, lnBound: number): boolean {
  if (name !== 'alpha') return false;
  const ki = params[2];
  const kiu = params[3];
  return side === 0 ? Math.log(kiu / end) > lnBound : Math.log(ki * end) > lnBound;
}
