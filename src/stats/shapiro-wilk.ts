/**
 * Shapiro-Wilk W test of normality, computed by Royston's algorithm AS R94:
 * Royston, P. (1995) "Remark AS R94: A remark on Algorithm AS 181: The W-test for normality",
 * Applied Statistics 44, 547-551. Valid for 3 <= n <= 5000.
 *
 * Steps (all from AS R94):
 * 1. m_i = Phi^-1((i - 3/8) / (n + 1/4)), i = 1..n, on the sorted sample.
 * 2. Coefficients: with u = 1/sqrt(n), the two extreme coefficients come from polynomials in u
 *    (constants C1, C2 below); the rest are m_i scaled so that sum a_i^2 = 1; a is antisymmetric.
 *    For n = 3 the coefficient is exactly sqrt(1/2).
 * 3. W = (sum a_i x_(i))^2 / sum (x_i - mean)^2, computed as 1 - (1 - W) to keep digits near 1.
 * 4. p-value: n = 3 exact, p = (6/pi)(asin(sqrt(W)) - asin(sqrt(3/4)));
 *    4 <= n <= 11: log(1 - W) transformed by -log(gamma - log(1 - W)), gamma = -2.273 + 0.459 n,
 *    then normal with mean and log-sd polynomial in n (C3, C4);
 *    n >= 12: log(1 - W) normal with mean and log-sd polynomial in log n (C5, C6).
 *    The p-value is the upper normal tail.
 */
import { normalQuantile, normalSurvival } from './distributions.js';

const C1 = [0, 0.221157, -0.147981, -2.07119, 4.434685, -2.706056];
const C2 = [0, 0.042981, -0.293762, -1.752461, 5.682633, -3.582633];
const C3 = [0.544, -0.39978, 0.025054, -6.714e-4];
const C4 = [1.3822, -0.77857, 0.062767, -0.0020322];
const C5 = [-1.5861, -0.31082, -0.083751, 0.0038915];
const C6 = [-0.4803, -0.082676, 0.0030302];
const G = [-2.273, 0.459];

export interface ShapiroWilkResult {
  n: number;
  /** the W statistic, in (0, 1] */
  W: number;
  /** upper-tail p-value (small W means evidence against normality) */
  p: number;
}

/** c[0] + c[1] x + c[2] x^2 + ... */
function polynomial(c: readonly number[], x: number): number {
  let value = 0;
  for (let k = c.length - 1; k >= 0; k--) value = value * x + c[k];
  return value;
}

/**
 * The n antisymmetric Shapiro-Wilk coefficients for the sorted sample (ascending), with
 * sum a_i = 0 and sum a_i^2 = 1 (AS R94).
 */
export function shapiroWilkCoefficients(n: number): Float64Array {
  if (!Number.isInteger(n) || n < 3 || n > 5000) {
    throw new RangeError(`shapiroWilkCoefficients: n must be an integer from 3 to 5000 (got ${n})`);
  }
  const half = Math.floor(n / 2);
  const a = new Float64Array(n);
  if (n === 3) {
    a[0] = -Math.SQRT1_2;
    a[2] = Math.SQRT1_2;
    return a;
  }
  // m[i] for the upper half (positive values), i = 0 is the largest
  const m = new Float64Array(half);
  let sumM2 = 0;
  for (let i = 0; i < half; i++) {
    m[i] = -normalQuantile((i + 1 - 0.375) / (n + 0.25));
    sumM2 += m[i] * m[i];
  }
  sumM2 *= 2;
  const rootSumM2 = Math.sqrt(sumM2);
  const u = 1 / Math.sqrt(n);
  const upper = new Float64Array(half);
  upper[0] = polynomial(C1, u) + m[0] / rootSumM2;
  let first: number;
  let scale: number;
  if (n > 5) {
    upper[1] = polynomial(C2, u) + m[1] / rootSumM2;
    scale = Math.sqrt((sumM2 - 2 * m[0] ** 2 - 2 * m[1] ** 2) / (1 - 2 * upper[0] ** 2 - 2 * upper[1] ** 2));
    first = 2;
  } else {
    scale = Math.sqrt((sumM2 - 2 * m[0] ** 2) / (1 - 2 * upper[0] ** 2));
    first = 1;
  }
  for (let i = first; i < half; i++) upper[i] = m[i] / scale;
  for (let i = 0; i < half; i++) {
    a[n - 1 - i] = upper[i];
    a[i] = -upper[i];
  }
  return a;
}

/** Shapiro-Wilk W and its p-value (AS R94). Throws for n outside 3..5000, non-finite values or zero range. */
export function shapiroWilk(sample: ArrayLike<number>): ShapiroWilkResult {
  const n = sample.length;
  if (n < 3 || n > 5000) {
    throw new RangeError(`shapiroWilk: sample size must be from 3 to 5000 (got ${n})`);
  }
  const x = Float64Array.from(sample);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(x[i])) throw new RangeError(`shapiroWilk: value at index ${i} is not finite (${x[i]})`);
  }
  x.sort();
  const range = x[n - 1] - x[0];
  if (!(range > 0)) throw new RangeError('shapiroWilk: all values are equal (zero range)');
  const a = shapiroWilkCoefficients(n);

  // squared correlation between the scaled sorted data and the coefficients (sum a = 0, sum a^2 = 1)
  let mean = 0;
  for (let i = 0; i < n; i++) mean += x[i] / range;
  mean /= n;
  let ssx = 0;
  let sax = 0;
  let ssa = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] / range - mean;
    ssx += dx * dx;
    sax += a[i] * dx;
    ssa += a[i] * a[i];
  }
  const root = Math.sqrt(ssa * ssx);
  const oneMinusW = ((root - sax) * (root + sax)) / (ssa * ssx);
  const W = 1 - oneMinusW;
  return { n, W, p: shapiroWilkPValue(W, oneMinusW, n) };
}

function shapiroWilkPValue(W: number, oneMinusW: number, n: number): number {
  if (n === 3) {
    const p = (6 / Math.PI) * (Math.asin(Math.sqrt(W)) - Math.asin(Math.sqrt(0.75)));
    return Math.min(1, Math.max(0, p));
  }
  let y = Math.log(oneMinusW);
  let mean: number;
  let sd: number;
  if (n <= 11) {
    const gamma = polynomial(G, n);
    if (y >= gamma) return 0; // W so small that the transform is undefined: p is effectively zero
    y = -Math.log(gamma - y);
    mean = polynomial(C3, n);
    sd = Math.exp(polynomial(C4, n));
  } else {
    const logN = Math.log(n);
    mean = polynomial(C5, logN);
    sd = Math.exp(polynomial(C6, logN));
  }
  return normalSurvival(y, mean, sd);
}
