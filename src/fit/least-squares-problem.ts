/**
 * The contract between a fitting problem and the least-squares engine, in the manner of
 * scipy.optimize.least_squares: residuals r(x) of length n, their Jacobian J (n x m, row-major,
 * J[k * m + j] = d r_k / d x_j), and an honest result object.
 */

export interface LeastSquaresProblem {
  /** number of residuals */
  readonly n: number;
  /** number of parameters */
  readonly m: number;
  /** Fills r (length n) with residuals at x. Returns false if x is outside the domain (non-finite). */
  residuals(x: Float64Array, r: Float64Array): boolean | void;
  /** Fills J (length n * m, row-major) with d r / d x at x. */
  jacobian(x: Float64Array, J: Float64Array): void;
}

export interface LeastSquaresOptions {
  /** relative reduction in the sum of squares below which to stop (MINPACK ftol); default 1e-15 */
  ftol?: number;
  /** relative step size below which to stop (MINPACK xtol); default 1e-15 */
  xtol?: number;
  /** cosine of the angle between residuals and Jacobian columns below which to stop (gtol); default 1e-15 */
  gtol?: number;
  /** maximum number of residual evaluations; default 200 * (m + 1) */
  maxEvaluations?: number;
  /** initial step bound factor (MINPACK factor); default 100 */
  factor?: number;
  /**
   * when true, the result's `jacobian` is empty (length 0) and no extra evaluation is made at x:
   * for callers that do not use it (screening starts, profile and region refits); default false
   */
  skipFinalJacobian?: boolean;
}

export type LeastSquaresStatus =
  | 'converged-ftol'
  | 'converged-xtol'
  | 'converged-gtol'
  | 'converged-zero-residual'
  | 'max-evaluations'
  | 'tolerance-too-small'
  | 'failed';

export interface LeastSquaresResult {
  x: Float64Array;
  /** sum of squared residuals at x */
  sse: number;
  residuals: Float64Array;
  /** Jacobian at x, row-major n x m */
  jacobian: Float64Array;
  /** true when a convergence test (not a limit) ended the iteration */
  converged: boolean;
  status: LeastSquaresStatus;
  /** one plain sentence explaining why the iteration ended */
  message: string;
  iterations: number;
  evaluations: number;
}
