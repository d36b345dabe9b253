/**
 * The reference design of the recovery checks (BRIEF section 7, common practice for mechanism
 * studies): 8 substrate levels spaced geometrically from 0.2 to 10 x Km, inhibitor at 0, 0.5, 1,
 * 2 and 4 x the inhibition constant, triplicates, 5% proportional noise. One definition shared by
 * bench/recovery.mjs, test/fit/recovery.test.ts and test/fit/identities.test.ts, so that the
 * benchmark and the tests simulate the same experiment. Invented truth, for simulations only.
 */
import type { Mechanism, ParamName } from '../models/types.js';
import type { RatePoint } from '../input/types.js';
import { simulateRates } from './simulate-rates.js';

export const REFERENCE_KM = 2;
/** @public used by bench/recovery.mjs, which imports the compiled module */
export const REFERENCE_K = 1;
/** @public used by bench/recovery.mjs, which imports the compiled module */
export const REFERENCE_SUBSTRATE: readonly number[] = Array.from({ length: 8 }, (_, k) => 0.2 * REFERENCE_KM * 50 ** (k / 7));
export const REFERENCE_INHIBITOR: readonly number[] = [0, 0.5, 1, 2, 4].map((x) => x * REFERENCE_K);

/** True parameters per mechanism: Vmax 100, Km 2, inhibition constants 1 (mixed: Kiu = 4 Ki). */
export const REFERENCE_TRUTH: Readonly<Record<Mechanism, Partial<Record<ParamName, number>>>> = {
  none: { Vmax: 100, Km: REFERENCE_KM },
  competitive: { Vmax: 100, Km: REFERENCE_KM, Ki: REFERENCE_K },
  uncompetitive: { Vmax: 100, Km: REFERENCE_KM, Kiu: REFERENCE_K },
  noncompetitive: { Vmax: 100, Km: REFERENCE_KM, Ki: REFERENCE_K },
  mixed: { Vmax: 100, Km: REFERENCE_KM, Ki: REFERENCE_K, Kiu: 4 * REFERENCE_K },
};

/** One simulated dataset of the reference design (proportional noise at `noiseLevel`, default 5%). */
export function simulateReferenceDesign(mechanism: Mechanism, seed: number, noiseLevel = 0.05): RatePoint[] {
  return simulateRates({
    mechanism,
    params: REFERENCE_TRUTH[mechanism],
    substrate: [...REFERENCE_SUBSTRATE],
    inhibitor: [...REFERENCE_INHIBITOR],
    replicates: 3,
    noise: 'proportional',
    noiseLevel,
    seed,
  });
}
