/**
 * Null distribution of the number of runs R in a random arrangement of n1 items of one kind and
 * n2 of another, all C(n1 + n2, n1) arrangements equally likely.
 *
 * Exact probabilities (Wald, A. and Wolfowitz, J. (1940) Ann. Math. Stat. 11, 147-162; tabulated by
 * Swed, F. S. and Eisenhart, C. (1943) Ann. Math. Stat. 14, 66-87), for k >= 1:
 *   P(R = 2k)     = 2 C(n1-1, k-1) C(n2-1, k-1) / C(n1+n2, n1)
 *   P(R = 2k + 1) = [C(n1-1, k-1) C(n2-1, k) + C(n1-1, k) C(n2-1, k-1)] / C(n1+n2, n1)
 * Moments (same sources):
 *   E[R]   = 1 + 2 n1 n2 / N
 *   Var[R] = 2 n1 n2 (2 n1 n2 - N) / (N^2 (N - 1)),   N = n1 + n2.
 * Degenerate cases: if one count is zero, R = 1 with certainty (R = 0 when both are zero).
 * Binomial coefficients are formed in log space, so the exact pmf is usable well beyond the
 * sizes where the tests choose it.
 */

/** log C(n, k) by a plain product of ratios; -Infinity when k < 0 or k > n. */
function logBinomial(n: number, k: number): number {
  if (k < 0 || k > n) return -Infinity;
  const kk = Math.min(k, n - k);
  let s = 0;
  for (let i = 1; i <= kk; i++) s += Math.log((n - kk + i) / i);
  return s;
}

/**
 * Exact probability mass function of the number of runs: element r of the result is P(R = r),
 * for r = 0 .. n1 + n2.
 */
export function runsDistribution(n1: number, n2: number): Float64Array {
  checkCounts(n1, n2);
  const total = n1 + n2;
  const pmf = new Float64Array(total + 1);
  if (total === 0) {
    pmf[0] = 1;
    return pmf;
  }
  if (n1 === 0 || n2 === 0) {
    pmf[1] = 1;
    return pmf;
  }
  const logAll = logBinomial(total, n1);
  for (let r = 2; r <= total; r++) {
    let p: number;
    if (r % 2 === 0) {
      const k = r / 2;
      p = 2 * Math.exp(logBinomial(n1 - 1, k - 1) + logBinomial(n2 - 1, k - 1) - logAll);
    } else {
      const k = (r - 1) / 2;
      p = Math.exp(logBinomial(n1 - 1, k - 1) + logBinomial(n2 - 1, k) - logAll)
        + Math.exp(logBinomial(n1 - 1, k) + logBinomial(n2 - 1, k - 1) - logAll);
    }
    pmf[r] = p;
  }
  return pmf;
}

interface RunsMoments {
  mean: number;
  variance: number;
}

/** Mean and variance of the number of runs under random arrangement (formulas above). */
export function runsMoments(n1: number, n2: number): RunsMoments {
  checkCounts(n1, n2);
  const total = n1 + n2;
  if (total === 0) return { mean: 0, variance: 0 };
  if (n1 === 0 || n2 === 0) return { mean: 1, variance: 0 };
  const product = 2 * n1 * n2;
  return {
    mean: 1 + product / total,
    variance: (product * (product - total)) / (total * total * (total - 1)),
  };
}

function checkCounts(n1: number, n2: number): void {
  if (!Number.isInteger(n1) || !Number.isInteger(n2) || n1 < 0 || n2 < 0) {
    throw new RangeError(`runs distribution: counts must be non-negative integers (got ${n1}, ${n2})`);
  }
}
