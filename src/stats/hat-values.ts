/**
 * Leverages (hat values) h_ii = diag(J (J'J)^-1 J') of a weighted Jacobian J (n x p, row-major,
 * rows sqrt(w_i) d model_i / d theta), the linear approximation used for nonlinear least squares
 * (Cook, R. D. and Weisberg, S. (1982) Residuals and Influence in Regression, Chapman and Hall,
 * ch. 2; Bates, D. M. and Watts, D. G. (1988) Nonlinear Regression Analysis and Its Applications,
 * Wiley, ch. 3 on assessing the fit).
 *
 * Computed without forming J'J: a Householder QR with column pivoting (Golub, G. H. and
 * Van Loan, C. F. (2013) Matrix Computations, 4th ed., Johns Hopkins, sec. 5.4.2, section number from memory) gives an
 * orthonormal basis Q (n x r) of the column space, and h_ii = sum_k Q_ik^2.
 * Rank r is the number of pivots with |R_kk| > max(n, p) * eps * |R_00|. When J is rank deficient
 * (for example a Ki column that vanishes because Ki ran off to a very large value) the result is
 * the leverage of the projection onto the column space, i.e. with a pseudo-inverse in place of
 * (J'J)^-1, and `rank` < p tells the caller so. sum_i h_ii = rank.
 */

export interface HatValuesResult {
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
  const a = Float64Array.from(jacobian);
  for (let i = 0; i < a.length; i++) {
    if (!Number.isFinite(a[i])) {
      throw new RangeError(
        `hatValues: Jacobian entry at row ${Math.floor(i / columns)}, column ${i % columns} is not finite (${a[i]})`,
      );
    }
  }
  const n = rows;
  const p = columns;
  const at = (i: number, j: number) => i * p + j;
  const steps = Math.min(n, p);
  const reflectors: Float64Array[] = [];
  let firstPivot = 0;
  let rank = 0;

  for (let k = 0; k < steps; k++) {
    // pivot: the remaining column with the largest norm below row k
    let best = -1;
    let bestNorm = -1;
    for (let j = k; j < p; j++) {
      let s = 0;
      for (let i = k; i < n; i++) s += a[at(i, j)] ** 2;
      if (s > bestNorm) { bestNorm = s; best = j; }
    }
    const norm = Math.sqrt(bestNorm);
    if (k === 0) firstPivot = norm;
    const tolerance = Math.max(n, p) * Number.EPSILON * firstPivot;
    if (!(norm > tolerance)) break;
    if (best !== k) {
      for (let i = 0; i < n; i++) {
        const t = a[at(i, k)];
        a[at(i, k)] = a[at(i, best)];
        a[at(i, best)] = t;
      }
    }
    // Householder vector v (unit length) with (I - 2 v v') x = alpha e1
    const x0 = a[at(k, k)];
    const alpha = x0 >= 0 ? -norm : norm;
    const v = new Float64Array(n - k);
    v[0] = x0 - alpha;
    for (let i = k + 1; i < n; i++) v[i - k] = a[at(i, k)];
    let vNorm = 0;
    for (let i = 0; i < v.length; i++) vNorm += v[i] * v[i];
    vNorm = Math.sqrt(vNorm);
    for (let i = 0; i < v.length; i++) v[i] /= vNorm;
    for (let j = k; j < p; j++) {
      let dot = 0;
      for (let i = k; i < n; i++) dot += v[i - k] * a[at(i, j)];
      for (let i = k; i < n; i++) a[at(i, j)] -= 2 * v[i - k] * dot;
    }
    reflectors.push(v);
    rank++;
  }

  // Q = H_0 H_1 ... H_{r-1} [e_0 ... e_{r-1}], built by applying the reflectors in reverse order
  const q = new Float64Array(n * rank);
  for (let k = 0; k < rank; k++) q[k * rank + k] = 1;
  for (let k = rank - 1; k >= 0; k--) {
    const v = reflectors[k];
    for (let j = 0; j < rank; j++) {
      let dot = 0;
      for (let i = k; i < n; i++) dot += v[i - k] * q[i * rank + j];
      for (let i = k; i < n; i++) q[i * rank + j] -= 2 * v[i - k] * dot;
    }
  }
  const leverage = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < rank; j++) s += q[i * rank + j] ** 2;
    leverage[i] = Math.min(1, s);
  }
  return { leverage, rank };
}
