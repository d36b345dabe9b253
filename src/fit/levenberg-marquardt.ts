/**
 * Levenberg-Marquardt least squares with a scaled trust region, after
 * Moré, J. J. (1978), "The Levenberg-Marquardt algorithm: implementation and theory",
 * Lecture Notes in Mathematics 630, 105-116, in the design of the MINPACK subroutine lmder
 * (Moré, Garbow and Hillstrom 1980, MINPACK-1, Argonne report ANL-80-74):
 *
 * - scaling: D = diag(column norms of J), each entry updated as the maximum seen so far (lmder mode 1);
 * - each step solves min ||J p + r|| subject to ||D p|| <= delta through the LM parameter found by
 *   Moré's iteration (MINPACK lmpar, {@link findLmParameter});
 * - steps come from a Householder QR factorisation of J with column pivoting (qrfac) and a Givens
 *   elimination of the damping rows (qrsolv); the normal equations are never formed;
 * - the trust radius follows the ratio of actual to predicted reduction of the sum of squares.
 *
 * Extension beyond lmder: a trial point where the residuals are not finite (or where the problem
 * reports it outside its domain) counts as a step that increased the sum of squares, so the trust
 * region shrinks and the iteration continues from the last good point.
 */

import type {
  LeastSquaresOptions,
  LeastSquaresProblem,
  LeastSquaresResult,
  LeastSquaresStatus,
} from './least-squares-problem.js';
import { applyQTranspose, euclideanNorm, householderQrPivoted, solveDampedTriangular } from './qr.js';

const EPSILON = Number.EPSILON;
const DWARF = Number.MIN_VALUE;

/** The `jacobian` of a result asked for without it (skipFinalJacobian): nothing to copy. */
const NO_JACOBIAN = new Float64Array(0);

const DEFAULT_LEAST_SQUARES_OPTIONS = {
  ftol: 1e-15,
  xtol: 1e-15,
  gtol: 1e-15,
  factor: 100,
} as const;

/** Work arrays sized once per call (nothing is allocated inside the iteration). */
interface Workspace {
  /** column-major copy of J, then its QR factors (n x m) */
  qr: Float64Array;
  pivot: Int32Array;
  rdiag: Float64Array;
  columnNorms: Float64Array;
  scale: Float64Array;
  qtf: Float64Array;
  step: Float64Array;
  trial: Float64Array;
  trialResiduals: Float64Array;
  rowJacobian: Float64Array;
  sdiag: Float64Array;
  wa1: Float64Array;
  wa2: Float64Array;
  wa3: Float64Array;
  wan: Float64Array;
}

function makeWorkspace(n: number, m: number): Workspace {
  return {
    qr: new Float64Array(n * m),
    pivot: new Int32Array(m),
    rdiag: new Float64Array(m),
    columnNorms: new Float64Array(m),
    scale: new Float64Array(m),
    qtf: new Float64Array(m),
    step: new Float64Array(m),
    trial: new Float64Array(m),
    trialResiduals: new Float64Array(n),
    rowJacobian: new Float64Array(n * m),
    sdiag: new Float64Array(m),
    wa1: new Float64Array(m),
    wa2: new Float64Array(m),
    wa3: new Float64Array(m),
    wan: new Float64Array(n),
  };
}

/**
 * One idle workspace per problem size, reused by the next call of that size: a profile or a joint
 * region runs hundreds of small solves, and allocating fifteen arrays for each was about a tenth
 * of an analysis (docs/decisions/analysis-cost.md). A call takes the workspace out while it runs
 * (a nested call of the same size gets a fresh one) and zeroes it, so every call starts from the
 * same state as with fresh arrays.
 */
const idleWorkspaces = new Map<number, Workspace>();

function takeWorkspace(n: number, m: number): Workspace {
  const key = n * 64 + m;
  const w = idleWorkspaces.get(key);
  if (!w) return makeWorkspace(n, m);
  idleWorkspaces.delete(key);
  for (const a of [w.qr, w.pivot, w.rdiag, w.columnNorms, w.scale, w.qtf, w.step, w.trial, w.trialResiduals, w.rowJacobian, w.sdiag, w.wa1, w.wa2, w.wa3, w.wan]) a.fill(0);
  return w;
}

/** Larger problems (a big single-compound file) are rare and allocate afresh: nothing big is kept. */
const LARGEST_KEPT_WORKSPACE = 65536;

function releaseWorkspace(n: number, m: number, w: Workspace): void {
  if (m < 64 && n * m <= LARGEST_KEPT_WORKSPACE) idleWorkspaces.set(n * 64 + m, w);
}

/** Euclidean norm of r at x, or Infinity when x is outside the domain or r is not finite. */
function residualNorm(problem: LeastSquaresProblem, x: Float64Array, r: Float64Array): number {
  if (problem.residuals(x, r) === false) return Infinity;
  const norm = euclideanNorm(r, 0, r.length);
  return Number.isFinite(norm) ? norm : Infinity;
}

function scaledNorm(scale: Float64Array, v: Float64Array, out: Float64Array): number {
  for (let j = 0; j < v.length; j++) out[j] = scale[j] * v[j];
  return euclideanNorm(out, 0, v.length);
}

/**
 * Moré's iteration for the Levenberg-Marquardt parameter (MINPACK lmpar; Moré 1978, section 5).
 * Given the pivoted QR of J (R in the upper triangle of `r`, leading dimension `ld`), the scaling D,
 * Q'r in `qtb` and the radius delta, finds par >= 0 such that the solution p of
 * (J'J + par D'D) p = -J'r  satisfies | ||D p|| - delta | <= 0.1 delta, or par = 0 when the
 * Gauss-Newton step already lies inside the region. Writes the solution x of
 * min ||[J; sqrt(par) D] x - [r; 0]|| to `x`, which is the NEGATED step -p (as lmpar does), and
 * returns par.
 * At most 10 iterations, as in lmpar.
 */
function findLmParameter(
  r: Float64Array,
  ld: number,
  m: number,
  pivot: Int32Array,
  diag: Float64Array,
  qtb: Float64Array,
  delta: number,
  parIn: number,
  x: Float64Array,
  sdiag: Float64Array,
  wa1: Float64Array,
  wa2: Float64Array,
  wa3: Float64Array,
): number {
  let par = parIn;
  // Gauss-Newton direction; least-squares solution if J is rank deficient.
  let nsing = m;
  for (let j = 0; j < m; j++) {
    wa1[j] = qtb[j];
    if (r[j * ld + j] === 0 && nsing === m) nsing = j;
    if (nsing < m) wa1[j] = 0;
  }
  for (let j = nsing - 1; j >= 0; j--) {
    wa1[j] /= r[j * ld + j];
    const t = wa1[j];
    const cj = j * ld;
    for (let i = 0; i < j; i++) wa1[i] -= r[cj + i] * t;
  }
  for (let j = 0; j < m; j++) x[pivot[j]] = wa1[j];

  let iter = 0;
  let dxnorm = scaledNorm(diag, x, wa2);
  let fp = dxnorm - delta;
  if (fp <= 0.1 * delta) return 0;

  // Lower bound parl for the zero of phi(par) = ||D x(par)|| - delta (zero if J is rank deficient).
  let parl = 0;
  if (nsing >= m) {
    for (let j = 0; j < m; j++) {
      const l = pivot[j];
      wa1[j] = diag[l] * (wa2[l] / dxnorm);
    }
    for (let j = 0; j < m; j++) {
      let sum = 0;
      const cj = j * ld;
      for (let i = 0; i < j; i++) sum += r[cj + i] * wa1[i];
      wa1[j] = (wa1[j] - sum) / r[cj + j];
    }
    const t = euclideanNorm(wa1, 0, m);
    parl = fp / delta / t / t;
  }
  // Upper bound paru.
  for (let j = 0; j < m; j++) {
    let sum = 0;
    const cj = j * ld;
    for (let i = 0; i <= j; i++) sum += r[cj + i] * qtb[i];
    wa1[j] = sum / diag[pivot[j]];
  }
  const gnorm = euclideanNorm(wa1, 0, m);
  let paru = gnorm / delta;
  if (paru === 0) paru = DWARF / Math.min(delta, 0.1);

  par = Math.max(par, parl);
  par = Math.min(par, paru);
  if (par === 0) par = gnorm / dxnorm;

  for (;;) {
    iter++;
    if (par === 0) par = Math.max(DWARF, 0.001 * paru);
    const sqrtPar = Math.sqrt(par);
    for (let j = 0; j < m; j++) wa1[j] = sqrtPar * diag[j];
    solveDampedTriangular(r, ld, m, pivot, wa1, qtb, x, sdiag, wa2);
    dxnorm = scaledNorm(diag, x, wa2);
    const previousFp = fp;
    fp = dxnorm - delta;
    // Accept par when phi is small, or when par has reached the lower bound zero with phi
    // still negative and decreasing, or after 10 iterations (lmpar's rules).
    if (Math.abs(fp) <= 0.1 * delta || (parl === 0 && fp <= previousFp && previousFp < 0) || iter === 10) break;
    // Newton correction.
    for (let j = 0; j < m; j++) {
      const l = pivot[j];
      wa3[j] = diag[l] * (wa2[l] / dxnorm);
    }
    for (let j = 0; j < m; j++) {
      wa3[j] /= sdiag[j];
      const t = wa3[j];
      const cj = j * ld;
      for (let i = j + 1; i < m; i++) wa3[i] -= r[cj + i] * t;
    }
    const t = euclideanNorm(wa3, 0, m);
    const parc = fp / delta / t / t;
    if (fp > 0) parl = Math.max(parl, par);
    if (fp < 0) paru = Math.min(paru, par);
    par = Math.max(parl, par + parc);
  }
  return par;
}

const MESSAGES: Record<LeastSquaresStatus, string> = {
  'converged-ftol':
    'Converged: both the actual and the predicted relative reduction of the sum of squares fell below ftol.',
  'converged-xtol': 'Converged: the trust region shrank below xtol relative to the size of the scaled parameters.',
  'converged-gtol':
    'Converged: the residual vector is orthogonal to every Jacobian column to within gtol (a stationary point).',
  'converged-zero-residual': 'Converged: every residual is exactly zero.',
  'max-evaluations': 'Stopped: the limit on residual evaluations was reached before any convergence test passed.',
  'tolerance-too-small':
    'Stopped at machine precision: no further reduction of the sum of squares or the step is possible, so the tolerances asked for are finer than double precision allows.',
  failed: 'Failed: the residuals or the Jacobian are not finite at the starting point.',
};

/**
 * Minimises sum r_k(x)^2 from x0 (see the module comment for the method).
 *
 * Status: the `converged-*` statuses and `tolerance-too-small` (the MINPACK info 6-8 cases, where
 * the tests were stricter than double precision and the point cannot be improved) count as
 * converged; `max-evaluations` and `failed` do not. When ftol and xtol pass together the status is
 * `converged-ftol` and the message says both passed.
 *
 * `iterations` counts Jacobian evaluations (outer iterations of lmder); `evaluations` counts
 * residual evaluations, the quantity limited by maxEvaluations. The returned Jacobian is evaluated
 * at the returned x (one extra Jacobian evaluation when the last step moved x; not counted), or
 * empty with skipFinalJacobian.
 */
export function levenbergMarquardt(
  problem: LeastSquaresProblem,
  x0: ArrayLike<number>,
  options: LeastSquaresOptions = {},
): LeastSquaresResult {
  const { n, m } = problem;
  if (!Number.isInteger(m) || m < 1) throw new RangeError(`levenbergMarquardt: m = ${m}: need at least one parameter`);
  if (!Number.isInteger(n) || n < m) throw new RangeError(`levenbergMarquardt: n = ${n} residuals cannot determine m = ${m} parameters`);
  if (x0.length !== m) throw new RangeError(`levenbergMarquardt: starting point has ${x0.length} entries, expected m = ${m}`);
  const ftol = options.ftol ?? DEFAULT_LEAST_SQUARES_OPTIONS.ftol;
  const xtol = options.xtol ?? DEFAULT_LEAST_SQUARES_OPTIONS.xtol;
  const gtol = options.gtol ?? DEFAULT_LEAST_SQUARES_OPTIONS.gtol;
  const factor = options.factor ?? DEFAULT_LEAST_SQUARES_OPTIONS.factor;
  const maxEvaluations = options.maxEvaluations ?? 200 * (m + 1);
  if (!(ftol >= 0 && xtol >= 0 && gtol >= 0 && factor > 0 && maxEvaluations >= 1)) {
    throw new RangeError('levenbergMarquardt: tolerances must be >= 0, factor > 0 and maxEvaluations >= 1');
  }

  const w = takeWorkspace(n, m);
  const x = Float64Array.from(x0);
  const residuals = new Float64Array(n);
  let evaluations = 1;
  let iterations = 0;
  let fnorm = residualNorm(problem, x, residuals);

  const finish = (status: LeastSquaresStatus, message: string, jacobianCurrent: boolean): LeastSquaresResult => {
    let jacobian = NO_JACOBIAN;
    if (!options.skipFinalJacobian) {
      if (!jacobianCurrent && fnorm < Infinity) problem.jacobian(x, w.rowJacobian);
      jacobian = w.rowJacobian.slice();
    }
    releaseWorkspace(n, m, w);
    const converged = status !== 'max-evaluations' && status !== 'failed';
    return {
      x,
      sse: fnorm * fnorm,
      residuals,
      jacobian,
      converged,
      status,
      message,
      iterations,
      evaluations,
    };
  };

  if (fnorm === Infinity) return finish('failed', 'Failed: the residuals are not finite at the starting point.', true);

  const { qr, pivot, rdiag, columnNorms, scale, qtf, step, trial, trialResiduals, sdiag, wa1, wa2, wa3, wan } = w;
  let par = 0;
  let delta = 0;
  let xnorm = 0;
  let firstIteration = true;

  for (;;) {
    if (fnorm === 0) return finish('converged-zero-residual', MESSAGES['converged-zero-residual'], false);

    // Jacobian and its pivoted QR factorisation (qrfac).
    problem.jacobian(x, w.rowJacobian);
    iterations++;
    const J = w.rowJacobian;
    for (let i = 0; i < n; i++) {
      const row = i * m;
      for (let j = 0; j < m; j++) {
        const v = J[row + j];
        if (!Number.isFinite(v)) {
          return finish('failed', `Failed: the Jacobian entry (${i}, ${j}) is not finite at the current point.`, true);
        }
        qr[j * n + i] = v;
      }
    }
    householderQrPivoted(qr, n, m, pivot, rdiag, columnNorms, wa1);

    if (firstIteration) {
      for (let j = 0; j < m; j++) scale[j] = columnNorms[j] === 0 ? 1 : columnNorms[j];
      xnorm = scaledNorm(scale, x, wa3);
      delta = factor * xnorm;
      if (delta === 0) delta = factor;
    }

    // Q' r, keeping the first m entries; then put R's diagonal in place of the Householder pivots.
    wan.set(residuals);
    applyQTranspose(qr, n, m, wan);
    for (let j = 0; j < m; j++) {
      qr[j * n + j] = rdiag[j];
      qtf[j] = wan[j];
    }

    // Scaled gradient norm: largest cosine between r and a column of J.
    let gnorm = 0;
    for (let j = 0; j < m; j++) {
      const l = pivot[j];
      if (columnNorms[l] === 0) continue;
      let sum = 0;
      const cj = j * n;
      for (let i = 0; i <= j; i++) sum += qr[cj + i] * (qtf[i] / fnorm);
      gnorm = Math.max(gnorm, Math.abs(sum / columnNorms[l]));
    }
    if (gnorm <= gtol) return finish('converged-gtol', MESSAGES['converged-gtol'], true);

    for (let j = 0; j < m; j++) scale[j] = Math.max(scale[j], columnNorms[j]);

    // Inner loop: shrink the trust region until a step reduces the sum of squares.
    let ratio = 0;
    do {
      par = findLmParameter(qr, n, m, pivot, scale, qtf, delta, par, step, sdiag, wa1, wa2, wa3);
      for (let j = 0; j < m; j++) {
        step[j] = -step[j];
        trial[j] = x[j] + step[j];
      }
      const pnorm = scaledNorm(scale, step, wa3);
      if (firstIteration) delta = Math.min(delta, pnorm);

      const fnorm1 = residualNorm(problem, trial, trialResiduals);
      evaluations++;

      let actred = -1;
      if (0.1 * fnorm1 < fnorm) {
        const q = fnorm1 / fnorm;
        actred = 1 - q * q;
      }
      // Predicted reduction and directional derivative from R P' step.
      for (let j = 0; j < m; j++) wa3[j] = 0;
      for (let j = 0; j < m; j++) {
        const t = step[pivot[j]];
        const cj = j * n;
        for (let i = 0; i <= j; i++) wa3[i] += qr[cj + i] * t;
      }
      const temp1 = euclideanNorm(wa3, 0, m) / fnorm;
      const temp2 = (Math.sqrt(par) * pnorm) / fnorm;
      const prered = temp1 * temp1 + (temp2 * temp2) / 0.5;
      const dirder = -(temp1 * temp1 + temp2 * temp2);
      ratio = prered !== 0 ? actred / prered : 0;

      // Update the trust radius.
      if (ratio <= 0.25) {
        let t = actred >= 0 ? 0.5 : (0.5 * dirder) / (dirder + 0.5 * actred);
        if (0.1 * fnorm1 >= fnorm || t < 0.1) t = 0.1;
        delta = t * Math.min(delta, pnorm / 0.1);
        par /= t;
      } else if (par === 0 || ratio >= 0.75) {
        delta = pnorm / 0.5;
        par *= 0.5;
      }

      let moved = false;
      if (ratio >= 1e-4) {
        x.set(trial);
        residuals.set(trialResiduals);
        xnorm = scaledNorm(scale, x, wa3);
        fnorm = fnorm1;
        moved = true;
        firstIteration = false;
      }

      // Convergence tests (lmder info 1-3).
      const ftolPassed = Math.abs(actred) <= ftol && prered <= ftol && 0.5 * ratio <= 1;
      const xtolPassed = delta <= xtol * xnorm;
      if (ftolPassed && xtolPassed) {
        return finish(
          'converged-ftol',
          'Converged: the relative reduction of the sum of squares fell below ftol and the trust region below xtol.',
          !moved,
        );
      }
      if (ftolPassed) return finish('converged-ftol', MESSAGES['converged-ftol'], !moved);
      if (xtolPassed) return finish('converged-xtol', MESSAGES['converged-xtol'], !moved);
      if (fnorm === 0) return finish('converged-zero-residual', MESSAGES['converged-zero-residual'], !moved);
      // Limits and tests at machine precision (lmder info 5-8).
      if (evaluations >= maxEvaluations) {
        return finish(
          'max-evaluations',
          `Stopped: the limit of ${maxEvaluations} residual evaluations was reached before any convergence test passed.`,
          !moved,
        );
      }
      if (
        (Math.abs(actred) <= EPSILON && prered <= EPSILON && 0.5 * ratio <= 1) ||
        delta <= EPSILON * xnorm ||
        gnorm <= EPSILON
      ) {
        return finish('tolerance-too-small', MESSAGES['tolerance-too-small'], !moved);
      }
      if (moved) break;
    } while (ratio < 1e-4);
  }
}
