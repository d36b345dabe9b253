/**
 * How far a profile may walk: the range of each quantity that the data can speak to. An interval end
 * that is not reached inside this range is reported as open, never as a number found at the edge.
 *
 * - Ki, Kiu: up to the detection bound (detection-bound.ts, 100 x the highest [I]); beyond it the
 *   factor (1 + I/K) changes the rate by under 1%, so larger values are not distinguished. Down to
 *   1/1000 of the lowest non-zero [I].
 * - Km: 1/1000 of the lowest [S] to 1000 x the highest [S]; Vmax: 1/1000 to 1000 x the largest rate.
 * - alpha: walks until the constrained fit pushes Kiu (alpha rising) or Ki (alpha falling) past the
 *   detection bound, i.e. until one arm of the mechanism is no longer detected; the box of
 *   Kiu/Ki ratios allowed by the Ki and Kiu ranges is the outer limit.
 * The factor 1000 is this project's choice (common practice, no single source): wide enough to hold
 * any interval the data define, narrow enough to keep the search short.
 */
import type { FitData } from '../../fit/fit-data.js';
import { detectionBound } from './detection-bound.js';
import type { ProfiledName } from './profiled-problem.js';

const SUPPORT_FACTOR = 1000;

/**
 * Residual activity below this is not told apart from full inhibition (0.1% of the uninhibited
 * rate, under any assay's resolution; this project's choice): a beta profile that reaches it is
 * open at the low end, i.e. consistent with beta = 0.
 */
export const BETA_FLOOR = 1e-3;

export interface ProfileSupport {
  /** limits of the profiled quantity on the log scale */
  low: number;
  high: number;
  /** ln of the detection bound for Ki and Kiu */
  lnDetectionBound: number;
}

function extremes(xs: Float64Array): { minPositive: number; max: number } {
  let minPositive = Infinity;
  let max = 0;
  for (const x of xs) {
    if (x > 0 && x < minPositive) minPositive = x;
    if (x > max) max = x;
  }
  return { minPositive: Number.isFinite(minPositive) ? minPositive : 1, max: max || 1 };
}

export function profileSupport(data: FitData, name: ProfiledName): ProfileSupport {
  const s = extremes(data.s);
  const i = extremes(data.i);
  let vmax = 0;
  for (const x of data.v) vmax = Math.max(vmax, Math.abs(x));
  vmax = vmax || 1;
  const lnBound = Math.log(detectionBound(i.max));
  const lnLowK = Math.log(i.minPositive / SUPPORT_FACTOR);
  const lnF = Math.log(SUPPORT_FACTOR);
  switch (name) {
    case 'Ki':
    case 'Kiu':
      return { low: lnLowK, high: lnBound, lnDetectionBound: lnBound };
    case 'Km':
      return { low: Math.log(s.minPositive) - lnF, high: Math.log(s.max) + lnF, lnDetectionBound: lnBound };
    case 'Vmax':
      return { low: Math.log(vmax) - lnF, high: Math.log(vmax) + lnF, lnDetectionBound: lnBound };
    case 'alpha':
      return { low: lnLowK - lnBound, high: lnBound - lnLowK, lnDetectionBound: lnBound };
    case 'beta':
      // residual activity: from BETA_FLOOR (indistinguishable from full inhibition, the boundary
      // beta = 0) up to SUPPORT_FACTOR (an activator at the far end)
      return { low: Math.log(BETA_FLOOR), high: lnF, lnDetectionBound: lnBound };
    case 'Et':
      // total enzyme, on the inhibitor scale it is titrated against
      return { low: lnLowK, high: lnBound, lnDetectionBound: lnBound };
  }
}
