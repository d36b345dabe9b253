/**
 * Householder QR factorisation with column pivoting and the damped triangular solve used by the
 * Levenberg-Marquardt engine, written on plain Float64Arrays.
 *
 * Method: Moré, J. J. (1978), "The Levenberg-Marquardt algorithm: implementation and theory",
 * Lecture Notes in Mathematics 630, 105-116, sections 3-4; the routines follow the design of the
 * MINPACK subroutines qrfac (QR with column pivoting), qrsolv (solution of the damped system by
 * Givens rotations) and covar (covariance from R), Moré, Garbow and Hillstrom (1980), MINPACK-1,
 * Argonne National Laboratory report ANL-80-74.
 *
 * Storage: every matrix here is COLUMN-major with leading dimension `rows`
 * (element (i, j) at a[j * rows + i]), because Householder reflections work on columns.
 */

const EPSILON = Number.EPSILON;
/** Below this sum of squares the plain norm may have lost digits to underflow. */
const SMALL_SUM = 1e-280;

/**
 * Euclidean norm of v[offset .. offset + length - 1]. A plain sum of squares, redone with scaling
 * by the largest entry only when that sum overflowed or underflowed (the concern MINPACK enorm
 * addresses, here handled by a second pass instead of three running sums).
 */
export function euclideanNorm(v: Float64Array, offset: number, length: number): number {
  let sum = 0;
  const end = offset + length;
  for (let i = offset; i < end; i++) sum += v[i] * v[i];
  if (sum < Infinity && sum > SMALL_SUM) return Math.sqrt(sum);
  if (sum !== sum) return NaN;
  let largest = 0;
  for (let i = offset; i < end; i++) {
    const a = Math.abs(v[i]);
    if (a > largest) largest = a;
  }
  if (largest === 0 || largest === Infinity) return largest;
  let scaled = 0;
  for (let i = offset; i < end; i++) {
    const t = v[i] / largest;
    scaled += t * t;
  }
  return largest * Math.sqrt(scaled);
}

/**
 * Householder QR factorisation with column pivoting, in place: A P = Q R (MINPACK qrfac with
 * pivot = true). On return the upper triangle of `a` above the diagonal holds R without its
 * diagonal, `rdiag` the diagonal of R, and the lower trapezoid (diagonal included) the Householder
 * vectors v_j (Q = H_1 ... H_m with H_j = I - v_j v_j' / v_j[j]). `pivot[j]` is the original column
 * index of column j of A P; `columnNorms` receives the norms of the columns of the original A.
 *
 * @param a column-major rows x cols matrix, rows >= cols, overwritten
 * @param work length >= cols
 */
export function householderQrPivoted(
  a: Float64Array,
  rows: number,
  cols: number,
  pivot: Int32Array,
  rdiag: Float64Array,
  columnNorms: Float64Array,
  work: Float64Array,
): void {
  for (let j = 0; j < cols; j++) {
    const norm = euclideanNorm(a, j * rows, rows);
    columnNorms[j] = norm;
    rdiag[j] = norm;
    work[j] = norm;
    pivot[j] = j;
  }
  const steps = Math.min(rows, cols);
  for (let j = 0; j < steps; j++) {
    // Bring the column of largest remaining norm into the pivot position.
    let kmax = j;
    for (let k = j + 1; k < cols; k++) if (rdiag[k] > rdiag[kmax]) kmax = k;
    if (kmax !== j) {
      const cj = j * rows;
      const ck = kmax * rows;
      for (let i = 0; i < rows; i++) {
        const t = a[cj + i];
        a[cj + i] = a[ck + i];
        a[ck + i] = t;
      }
      rdiag[kmax] = rdiag[j];
      work[kmax] = work[j];
      const p = pivot[j];
      pivot[j] = pivot[kmax];
      pivot[kmax] = p;
    }
    // Householder reflection that zeroes column j below the diagonal.
    const cj = j * rows;
    let ajnorm = euclideanNorm(a, cj + j, rows - j);
    if (ajnorm !== 0) {
      if (a[cj + j] < 0) ajnorm = -ajnorm;
      const inverse = 1 / ajnorm;
      for (let i = cj + j; i < cj + rows; i++) a[i] *= inverse;
      a[cj + j] += 1;
      const vjj = a[cj + j];
      // Apply it to the remaining columns and downdate their norms.
      for (let k = j + 1; k < cols; k++) {
        const ck = k * rows;
        let sum = 0;
        for (let i = j; i < rows; i++) sum += a[cj + i] * a[ck + i];
        const t = sum / vjj;
        for (let i = j; i < rows; i++) a[ck + i] -= t * a[cj + i];
        if (rdiag[k] !== 0) {
          const ratio = a[ck + j] / rdiag[k];
          rdiag[k] *= Math.sqrt(Math.max(0, 1 - ratio * ratio));
          const rel = rdiag[k] / work[k];
          if (0.05 * rel * rel <= EPSILON) {
            rdiag[k] = euclideanNorm(a, ck + j + 1, rows - j - 1);
            work[k] = rdiag[k];
          }
        }
      }
    }
    rdiag[j] = -ajnorm;
  }
}

/**
 * Applies Q' (from householderQrPivoted, before its diagonal is overwritten) to b in place.
 * Only the first `cols` entries of the result are used by the engine (Q'b restricted to range R).
 */
export function applyQTranspose(a: Float64Array, rows: number, cols: number, b: Float64Array): void {
  for (let j = 0; j < cols; j++) {
    const cj = j * rows;
    const vjj = a[cj + j];
    if (vjj === 0) continue;
    let sum = 0;
    for (let i = j; i < rows; i++) sum += a[cj + i] * b[i];
    const t = -sum / vjj;
    for (let i = j; i < rows; i++) b[i] += t * a[cj + i];
  }
}

/**
 * Solves the damped least-squares system  min || [A; D] x - [b; 0] ||  given the pivoted QR of A
 * (MINPACK qrsolv). Input: the full upper triangle of r (the m x m leading block of `r`, leading
 * dimension `ld`) holds R, `pivot` the permutation P, `diag` the diagonal of D, `qtb` the first m
 * entries of Q'b. Givens rotations reduce [R; P'DP] to the upper triangle S; S's diagonal goes to
 * `sdiag` and its strict upper part to the strict LOWER triangle of r (transposed), where the
 * Newton correction in the LM parameter search reads it. R's upper triangle and diagonal are kept.
 * A singular S is handled by a least-squares solution with the singular part set to zero.
 *
 * @param x output, length m
 * @param work length >= m
 */
export function solveDampedTriangular(
  r: Float64Array,
  ld: number,
  m: number,
  pivot: Int32Array,
  diag: Float64Array,
  qtb: Float64Array,
  x: Float64Array,
  sdiag: Float64Array,
  work: Float64Array,
): void {
  // Copy R' into the lower triangle, save R's diagonal in x, and Q'b in work.
  for (let j = 0; j < m; j++) {
    for (let i = j; i < m; i++) r[j * ld + i] = r[i * ld + j];
    x[j] = r[j * ld + j];
    work[j] = qtb[j];
  }
  // Eliminate the diagonal matrix D row by row with Givens rotations.
  for (let j = 0; j < m; j++) {
    const dj = diag[pivot[j]];
    if (dj !== 0) {
      for (let k = j; k < m; k++) sdiag[k] = 0;
      sdiag[j] = dj;
      let qtbpj = 0;
      for (let k = j; k < m; k++) {
        if (sdiag[k] === 0) continue;
        const rkk = r[k * ld + k];
        let cos: number;
        let sin: number;
        if (Math.abs(rkk) < Math.abs(sdiag[k])) {
          const cotan = rkk / sdiag[k];
          sin = 0.5 / Math.sqrt(0.25 + 0.25 * cotan * cotan);
          cos = sin * cotan;
        } else {
          const tan = sdiag[k] / rkk;
          cos = 0.5 / Math.sqrt(0.25 + 0.25 * tan * tan);
          sin = cos * tan;
        }
        r[k * ld + k] = cos * rkk + sin * sdiag[k];
        const t = cos * work[k] + sin * qtbpj;
        qtbpj = -sin * work[k] + cos * qtbpj;
        work[k] = t;
        const ck = k * ld;
        for (let i = k + 1; i < m; i++) {
          const rik = r[ck + i];
          const u = cos * rik + sin * sdiag[i];
          sdiag[i] = -sin * rik + cos * sdiag[i];
          r[ck + i] = u;
        }
      }
    }
    sdiag[j] = r[j * ld + j];
    r[j * ld + j] = x[j];
  }
  // Back substitution with S; a zero diagonal entry ends the nonsingular part.
  let nsing = m;
  for (let j = 0; j < m; j++) {
    if (sdiag[j] === 0 && nsing === m) nsing = j;
    if (nsing < m) work[j] = 0;
  }
  for (let j = nsing - 1; j >= 0; j--) {
    let sum = 0;
    const cj = j * ld;
    for (let i = j + 1; i < nsing; i++) sum += r[cj + i] * work[i];
    work[j] = (work[j] - sum) / sdiag[j];
  }
  for (let j = 0; j < m; j++) x[pivot[j]] = work[j];
}

interface UnscaledCovariance {
  /** (J'J)^-1, m x m row-major, in the original parameter order; NaN rows/columns for dropped parameters */
  matrix: Float64Array;
  /** numerical rank of J used */
  rank: number;
}

/**
 * (J'J)^-1 from a pivoted QR of J: with J P = Q R, (J'J)^-1 = P R^-1 R^-T P' (the route of MINPACK
 * covar; the normal equations are never formed). Columns whose |R_kk| <= tolerance * |R_11| are
 * treated as rank deficient; their variances and covariances are reported as NaN (not zero), so a
 * caller cannot mistake an unidentified parameter for a precise one.
 *
 * @param jacobian row-major n x m (the LeastSquaresResult layout)
 * @param tolerance relative rank tolerance; default max(n, m) * machine epsilon (common practice, no single source)
 */
export function unscaledCovariance(
  jacobian: ArrayLike<number>,
  n: number,
  m: number,
  tolerance = Math.max(n, m) * EPSILON,
): UnscaledCovariance {
  if (n < m) throw new RangeError(`unscaledCovariance: ${n} residuals cannot determine ${m} parameters`);
  const a = new Float64Array(n * m);
  for (let i = 0; i < n; i++) for (let j = 0; j < m; j++) a[j * n + i] = jacobian[i * m + j];
  const pivot = new Int32Array(m);
  const rdiag = new Float64Array(m);
  const norms = new Float64Array(m);
  householderQrPivoted(a, n, m, pivot, rdiag, norms, new Float64Array(m));
  let rank = 0;
  const threshold = tolerance * Math.abs(rdiag[0]);
  while (rank < m && Math.abs(rdiag[rank]) > threshold) rank++;
  // Rinv: upper triangular inverse of the leading rank x rank block of R (column-major, ld = m).
  const rinv = new Float64Array(m * m);
  for (let k = 0; k < rank; k++) {
    rinv[k * m + k] = 1 / rdiag[k];
    for (let j = k + 1; j < rank; j++) {
      // row k of Rinv, column j: -(sum_{i=k}^{j-1} Rinv[k,i] R[i,j]) / R[j,j]
      let sum = 0;
      for (let i = k; i < j; i++) sum += rinv[i * m + k] * a[j * n + i];
      rinv[j * m + k] = -sum / rdiag[j];
    }
  }
  const matrix = new Float64Array(m * m).fill(NaN);
  for (let p = 0; p < rank; p++) {
    for (let q = p; q < rank; q++) {
      // (Rinv Rinv')[p, q] = sum_{k >= max(p,q)} Rinv[p,k] Rinv[q,k]
      let sum = 0;
      for (let k = q; k < rank; k++) sum += rinv[k * m + p] * rinv[k * m + q];
      const ip = pivot[p];
      const iq = pivot[q];
      matrix[ip * m + iq] = sum;
      matrix[iq * m + ip] = sum;
    }
  }
  return { matrix, rank };
}
