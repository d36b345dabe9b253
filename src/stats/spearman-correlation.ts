/**
 * Spearman's rank correlation rho (Spearman, C. (1904) Am. J. Psychol. 15, 72-101): the Pearson
 * correlation of the mid-ranks (average-ranks.ts), which handles ties.
 * Two-sided p-value from the t approximation t = rho sqrt((n - 2) / (1 - rho^2)) on n - 2
 * degrees of freedom (e.g. Zar, J. H. (1972) J. Am. Stat. Assoc. 67, 578-580; the same
 * approximation scipy.stats.spearmanr uses by default).
 * With fewer than 3 pairs, or when either variable is constant, rho and p are NaN.
 */
import { averageRanks } from './average-ranks.js';
import { tSurvival } from './distributions.js';

export interface SpearmanResult {
  n: number;
  rho: number;
  /** two-sided p-value for rho = 0 */
  p: number;
}

export function spearmanCorrelation(x: ArrayLike<number>, y: ArrayLike<number>): SpearmanResult {
  const n = x.length;
  if (y.length !== n) {
    throw new RangeError(`spearmanCorrelation: x has ${n} values but y has ${y.length}`);
  }
  if (n < 3) return { n, rho: NaN, p: NaN };
  const rx = averageRanks(x);
  const ry = averageRanks(y);
  const mean = (n + 1) / 2; // mean of mid-ranks is always (n + 1) / 2
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = rx[i] - mean;
    const dy = ry[i] - mean;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  if (sxx === 0 || syy === 0) return { n, rho: NaN, p: NaN };
  const rho = Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
  const df = n - 2;
  if (Math.abs(rho) === 1) return { n, rho, p: 0 };
  const t = rho * Math.sqrt(df / ((1 - rho) * (1 + rho)));
  return { n, rho, p: Math.min(1, 2 * tSurvival(Math.abs(t), df)) };
}
