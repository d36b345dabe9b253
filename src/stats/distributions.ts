/**
 * Typed wrappers around the @stdlib distribution functions used by the
 * residual diagnostics and the nested-model tests.
 *
 * Source: stdlib-js, https://github.com/stdlib-js/stdlib (packages
 * @stdlib/stats-base-dists-*). Each wrapper keeps stdlib's parameter order
 * and conventions: invalid parameters give NaN rather than throwing.
 *
 * Naming: `...Cdf` is the lower tail P(X <= x); `...Survival` is the upper
 * tail P(X > x), computed so that small upper tails are not lost to 1 - cdf
 * cancellation where stdlib gives us the means to do so.
 */
import tCdfStdlib from '@stdlib/stats-base-dists-t-cdf';
import tQuantileStdlib from '@stdlib/stats-base-dists-t-quantile';
import fCdfStdlib from '@stdlib/stats-base-dists-f-cdf';
import fQuantileStdlib from '@stdlib/stats-base-dists-f-quantile';
import chisqCdfStdlib from '@stdlib/stats-base-dists-chisquare-cdf';
import normalCdfStdlib from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantileStdlib from '@stdlib/stats-base-dists-normal-quantile';

/** Student t lower-tail probability P(T <= x) with `df` degrees of freedom. */
export function tCdf(x: number, df: number): number {
  return tCdfStdlib(x, df);
}

/** Student t upper-tail probability P(T > x); uses symmetry, tCdf(-x). */
export function tSurvival(x: number, df: number): number {
  return tCdfStdlib(-x, df);
}

/**
 * Quantiles already computed, by their arguments. An analysis asks for the same few quantiles many
 * times (the t quantile of each model's residual df for its intervals, the F quantile of the joint
 * region) and each costs an inverse incomplete beta; the cached value is the same number.
 */
const quantiles = new Map<string, number>();
/** Entries kept at most (a batch of many designs could otherwise grow it without bound). */
const QUANTILES_KEPT = 4096;

function remembered(key: string, compute: () => number): number {
  const known = quantiles.get(key);
  if (known !== undefined) return known;
  const value = compute();
  if (quantiles.size >= QUANTILES_KEPT) quantiles.clear();
  quantiles.set(key, value);
  return value;
}

/** Student t quantile: the x with P(T <= x) = p. */
export function tQuantile(p: number, df: number): number {
  return remembered(`t ${p} ${df}`, () => tQuantileStdlib(p, df));
}

/**
 * F distribution upper-tail probability P(F > x). Uses the identity
 * P(F(d1,d2) > x) = P(F(d2,d1) < 1/x), which keeps precision for small tails.
 */
export function fSurvival(x: number, d1: number, d2: number): number {
  if (Number.isNaN(x) || Number.isNaN(d1) || Number.isNaN(d2)) return NaN;
  if (!(d1 > 0) || !(d2 > 0)) return NaN;
  if (x <= 0) return 1;
  if (x === Infinity) return 0;
  return fCdfStdlib(1 / x, d2, d1);
}

/** F distribution quantile: the x with P(F <= x) = p. */
export function fQuantile(p: number, d1: number, d2: number): number {
  return remembered(`F ${p} ${d1} ${d2}`, () => fQuantileStdlib(p, d1, d2));
}

/** Chi-square upper-tail probability P(X > x) = 1 - P(X <= x). */
export function chisqSurvival(x: number, df: number): number {
  if (Number.isNaN(x) || Number.isNaN(df)) return NaN;
  if (x <= 0) return df >= 0 ? 1 : NaN;
  return 1 - chisqCdfStdlib(x, df);
}

/** Normal lower-tail probability P(X <= x) for mean `mu` (default 0) and SD `sigma` (default 1). */
export function normalCdf(x: number, mu = 0, sigma = 1): number {
  return normalCdfStdlib(x, mu, sigma);
}

/** Normal upper-tail probability P(X > x); uses symmetry so small tails keep precision. */
export function normalSurvival(x: number, mu = 0, sigma = 1): number {
  return normalCdfStdlib(2 * mu - x, mu, sigma);
}

/** Normal quantile: the x with P(X <= x) = p, for mean `mu` (default 0) and SD `sigma` (default 1). */
export function normalQuantile(p: number, mu = 0, sigma = 1): number {
  return normalQuantileStdlib(p, mu, sigma);
}
