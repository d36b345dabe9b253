/**
 * Bootstrap confidence intervals from replicate estimates (Efron, B. (1987) "Better bootstrap
 * confidence intervals", J. Am. Stat. Assoc. 82, 171-185):
 *
 * - percentile: the a/2 and 1 - a/2 quantiles of the replicates;
 * - BCa (bias-corrected and accelerated): the quantiles at
 *     a_j = Phi(z0 + (z0 + z_j) / (1 - acc (z0 + z_j))),  z_j = Phi^-1(a/2), Phi^-1(1 - a/2),
 *   with bias correction z0 = Phi^-1(share of replicates below the estimate, ties counted half) and
 *   acceleration from the jackknife (leave-one-out) estimates theta_(i), with d_i = mean - theta_(i):
 *     acc = sum d_i^3 / (6 (sum d_i^2)^(3/2))    (Efron 1987, eq. 6.6; Efron, B. and Tibshirani,
 *   R. J. (1993) An Introduction to the Bootstrap, Chapman & Hall, eq. 14.15, from memory).
 * Quantiles interpolate linearly between order statistics (Hyndman, R. J. and Fan, Y. (1996)
 * Am. Stat. 50, 361-365, definition 7). Non-finite replicates (failed refits) are left out; the
 * caller reports how many.
 */
import { normalCdf, normalQuantile } from '../../stats/distributions.js';

/** Quantile of sorted values by linear interpolation (Hyndman and Fan definition 7). */
export function sortedQuantile(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * Math.min(1, Math.max(0, p));
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

function finiteSorted(values: ArrayLike<number>): Float64Array {
  const out: number[] = [];
  for (let k = 0; k < values.length; k++) if (Number.isFinite(values[k])) out.push(values[k]);
  return Float64Array.from(out).sort();
}

export function percentileInterval(replicates: ArrayLike<number>, level: number): [number, number] | null {
  const sorted = finiteSorted(replicates);
  if (sorted.length < 2) return null;
  const a = (1 - level) / 2;
  return [sortedQuantile(sorted, a), sortedQuantile(sorted, 1 - a)];
}

/** Jackknife acceleration; 0 when the jackknife values do not vary. */
export function jackknifeAcceleration(jackknife: ArrayLike<number>): number {
  let mean = 0;
  let count = 0;
  for (let k = 0; k < jackknife.length; k++) if (Number.isFinite(jackknife[k])) { mean += jackknife[k]; count++; }
  if (count < 3) return NaN;
  mean /= count;
  let s2 = 0;
  let s3 = 0;
  for (let k = 0; k < jackknife.length; k++) {
    if (!Number.isFinite(jackknife[k])) continue;
    const d = mean - jackknife[k];
    s2 += d * d;
    s3 += d * d * d;
  }
  return s2 > 0 ? s3 / (6 * s2 ** 1.5) : 0;
}

interface BcaDetails {
  interval: [number, number];
  biasCorrection: number;
  acceleration: number;
}

export function bcaInterval(replicates: ArrayLike<number>, estimate: number, jackknife: ArrayLike<number>, level: number): BcaDetails | null {
  const sorted = finiteSorted(replicates);
  const b = sorted.length;
  if (b < 2 || !Number.isFinite(estimate)) return null;
  let below = 0;
  let ties = 0;
  for (const x of sorted) {
    if (x < estimate) below++;
    else if (x === estimate) ties++;
  }
  const share = (below + 0.5 * ties) / b;
  if (share <= 0 || share >= 1) return null;
  const z0 = normalQuantile(share);
  const acc = jackknifeAcceleration(jackknife);
  if (!Number.isFinite(acc)) return null;
  const a = (1 - level) / 2;
  const adjusted = (z: number): number => normalCdf(z0 + (z0 + z) / (1 - acc * (z0 + z)));
  const lo = adjusted(normalQuantile(a));
  const hi = adjusted(normalQuantile(1 - a));
  return { interval: [sortedQuantile(sorted, lo), sortedQuantile(sorted, hi)], biasCorrection: z0, acceleration: acc };
}
