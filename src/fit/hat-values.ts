/**
 * Leverages (hat values) h_ii = diag(J (J'J)^-1 J') of a weighted Jacobian J (n x p, row-major,
 * rows sqrt(w_i) d model_i / d theta), the linear approximation used for nonlinear least squares
 * (Cook, R. D. and Weisberg, S. (1982) Residuals and Influence in Regression, Chapman and Hall,
 * ch. 2; Bates, D. M. and Watts, D. G. (1988) Nonlinear Regression Analysis and Its Applications,
 * Wiley, ch. 3 on assessing the fit).
 *
 * Computed without forming J'J: the Householder QR with column pivoting of src/fit/qr.ts
 * (householderQrPivoted, the one the fitting engine uses) gives J P = Q R, and h_ii = sum_{k<r}
 * Q_ik^2, the squared length of row i of the first r columns of Q.
 * Rank r is the number of leading pivots with |R_kk| > max(n, p) * eps * |R_00| (the rule of
 * unscaledCovariance in src/fit/qr.ts). When J is rank deficient
 * (for example a Ki column that vanishes because Ki ran off to a very large value) the result is
 * the leverage of the projection onto the column space, i.e. with a pseudo-inverse in place of
 * (J'J)^-1, and `rank` < p tells the caller so. sum_i h_ii = rank.
 */
import { householderQrPivoted } from './qr.js';

interface HatValuesResult {
  /** h_ii for each row, in [0, 1] */
  leverage: Float64Array;
  /** numerical rank of J */
  rank: number;
}

export function hatValues(jacobian: ArrayLike<number>, rows: number, columns: number): HatValuesResult {
  if (!Number.isInteger(rows) || !Number.isInteger(columns) || rows < 0 || columns < 0) {
    throw new RangeError(`hatValues: rows and columns must be non-negative integers (got ${rows}, ${columns})`);
  }
  if (jacobian.length !== rows * columns) {
    throw new RangeError(`hatValues: Jacobian has ${jacobian.length} entries, expected ${rows} x ${columns}`);
  }
  for (let i = 0; i < jacobian.length; i++) {
    if (!Number.isFinite(jacobian[i])) {
      throw new RangeError(
        `hatValues: Jacobian entry at row ${Math.floor(i / columns)}, column ${i % columns} is not finite (${jacobian[i]})`,
      );
    }
  }
  // Column-major copy for the QR; a short Jacobian (rows < columns) gets zero rows appended,
  // which leaves the column space seen from the original rows, and so their leverages, unchanged.
  const n = rows;
  const p = columns;
  const m = Math.max(n, p);
  const a = new Float64Array(m * p);
  for (let i = 0; i < n; i++) for (let j = 0; j < p; j++) a[j * m + i] = jacobian[i * p + j];
  const rdiag = new Float64Array(p);
  householderQrPivoted(a, m, p, new Int32Array(p), rdiag, new Float64Array(p), new Float64Array(p));
  let rank = 0;
  const threshold = m * Number.EPSILON * Math.abs(rdiag[0] ?? 0);
  while (rank < p && Math.abs(rdiag[rank]) > threshold) rank++;

  const leverage = new Float64Array(n);
  const column = new Float64Array(m);
  for (let k = 0; k < rank; k++) {
    columnOfQ(a, m, k, column);
    for (let i = 0; i < n; i++) leverage[i] += column[i] * column[i];
  }
  for (let i = 0; i < n; i++) leverage[i] = Math.min(1, leverage[i]);
  return { leverage, rank };
}

/**
 * Column k of Q = H_0 H_1 ... H_{p-1} from the reflectors householderQrPivoted leaves in the lower
 * trapezoid of `a` (H_j = I - v_j v_j' / v_j[j], column-major, leading dimension `rows`). H_j acts
 * on rows j and below only, so H_j e_k = e_k for j > k, and Q e_k = H_0 ... H_k e_k.
 * (The counterpart of applyQTranspose in src/fit/qr.ts.)
 */
function columnOfQ(a: Float64Array, rows: number, k: number, out: Float64Array): void {
  out.fill(0);
  out[k] = 1;
  for (let j = k; j >= 0; j--) {
    const cj = j * rows;
    const vjj = a[cj + j];
    if (vjj === 0) continue;
    let sum = 0;
    for (let i = j; i < rows; i++) sum += a[cj + i] * out[i];
    const t = -sum / vjj;
    for (let i = j; i < rows; i++) out[i] += t * a[cj + i];
  }
}
