/**
 * The least-squares problem of a profile: one quantity held fixed, the other parameters free.
 *
 * The fit works in theta = ln p. A profiled quantity is either one ln-parameter (theta_j = c) or
 * ln alpha, through the reparametrisation theta_Kiu = ln alpha + theta_Ki (so Kiu = alpha * Ki):
 * holding ln alpha = c leaves Vmax, Km and Ki free. Both are written as
 *   theta_i = z[free(i)] + coefficient_i * c
 * with free(i) = -1 when theta_i is not a free parameter, which covers both cases with one map.
 */
import type { LeastSquaresProblem } from '../../fit/least-squares-problem.js';
import type { ParamName } from '../../models/types.js';

export type ProfiledName = ParamName | 'alpha';

export interface ProfiledQuantity {
  name: ProfiledName;
  /** number of fitted parameters m */
  m: number;
  /** for each full index i, the free index feeding theta_i, or -1 */
  freeIndex: Int32Array;
  /** for each full index i, the coefficient of the fixed value c in theta_i */
  fixedCoefficient: Float64Array;
}

/** The profiled quantity for a parameter name of a model (alpha needs both Ki and Kiu). */
export function profiledQuantity(params: readonly ParamName[], name: ProfiledName): ProfiledQuantity {
  const m = params.length;
  const freeIndex = new Int32Array(m);
  const fixedCoefficient = new Float64Array(m);
  if (name === 'alpha') {
    const ki = params.indexOf('Ki');
    const kiu = params.indexOf('Kiu');
    if (ki < 0 || kiu < 0) throw new RangeError('alpha can only be profiled in a model with both Ki and Kiu');
    let f = 0;
    for (let i = 0; i < m; i++) if (i !== kiu) freeIndex[i] = f++;
    freeIndex[kiu] = freeIndex[ki];
    fixedCoefficient[kiu] = 1;
  } else {
    const j = params.indexOf(name);
    if (j < 0) throw new RangeError(`the model has no parameter ${name}`);
    let f = 0;
    for (let i = 0; i < m; i++) freeIndex[i] = i === j ? -1 : f++;
    fixedCoefficient[j] = 1;
  }
  return { name, m, freeIndex, fixedCoefficient };
}

/** The value of the profiled quantity (on the log scale) at a full theta. */
export function quantityAt(q: ProfiledQuantity, theta: ArrayLike<number>): number {
  const z = freePart(q, theta);
  for (let i = 0; i < q.m; i++) {
    if (q.fixedCoefficient[i] !== 0) return (theta[i] - (q.freeIndex[i] >= 0 ? z[q.freeIndex[i]] : 0)) / q.fixedCoefficient[i];
  }
  return NaN;
}

/** The free vector z of a full theta. */
export function freePart(q: ProfiledQuantity, theta: ArrayLike<number>): Float64Array {
  const z = new Float64Array(q.m - 1);
  for (let i = 0; i < q.m; i++) if (q.freeIndex[i] >= 0 && q.fixedCoefficient[i] === 0) z[q.freeIndex[i]] = theta[i];
  return z;
}

/** The full theta from the free vector and the fixed value. */
export function fullTheta(q: ProfiledQuantity, z: ArrayLike<number>, c: number, out: Float64Array): Float64Array {
  for (let i = 0; i < q.m; i++) out[i] = (q.freeIndex[i] >= 0 ? z[q.freeIndex[i]] : 0) + q.fixedCoefficient[i] * c;
  return out;
}

/**
 * The problem in z at a fixed c, built on the full problem in theta. `fixed.value` is read at
 * every call, so one problem object serves the whole profile.
 */
export function profiledProblem(full: LeastSquaresProblem, q: ProfiledQuantity, fixed: { value: number }): LeastSquaresProblem {
  const { n, m } = full;
  const theta = new Float64Array(m);
  const jFull = new Float64Array(n * m);
  const mFree = m - 1;
  // For each free index f, the full columns feeding it (one, or two for Ki under alpha), in
  // increasing order: J[., f] = (0 + column first) + column second, the sum a zeroed J accumulated.
  const first = new Int32Array(mFree).fill(-1);
  const second = new Int32Array(mFree).fill(-1);
  for (let i = 0; i < m; i++) {
    const f = q.freeIndex[i];
    if (f < 0) continue;
    if (first[f] < 0) first[f] = i;
    else second[f] = i;
  }
  return {
    n,
    m: mFree,
    residuals(z, r) {
      return full.residuals(fullTheta(q, z, fixed.value, theta), r);
    },
    jacobian(z, J) {
      full.jacobian(fullTheta(q, z, fixed.value, theta), jFull);
      for (let f = 0; f < mFree; f++) {
        const a = first[f];
        const b = second[f];
        if (a < 0) for (let k = 0; k < n; k++) J[k * mFree + f] = 0;
        else if (b < 0) for (let k = 0; k < n; k++) J[k * mFree + f] = 0 + jFull[k * m + a];
        else for (let k = 0; k < n; k++) J[k * mFree + f] = 0 + jFull[k * m + a] + jFull[k * m + b];
      }
    },
  };
}

/**
 * dS/dc of the profiled sum of squares S(c) = min over z of |r(theta(z, c))|^2, where the held
 * part of theta moves with c as theta_i = ... + coefficient_i * c: at a constrained optimum theta
 * with residuals r there. By the envelope theorem the free parameters' gradient vanishes at the
 * optimum, so only the explicit dependence on c counts:
 *   dS/dc = 2 sum_k r_k dr_k/dc,   dr_k/dc = sum_i coefficient_i J_ki   (J = dr/dtheta of the full problem).
 * One Jacobian evaluation of the full problem, into `jacobian` (length n * m). A profile passes its
 * quantity's fixedCoefficient; the joint region's rays pass their direction on the held pair.
 */
export function heldSlope(full: LeastSquaresProblem, coefficients: ArrayLike<number>, theta: Float64Array, residuals: ArrayLike<number>, jacobian: Float64Array): number {
  const { n, m } = full;
  full.jacobian(theta, jacobian);
  let sum = 0;
  for (let k = 0; k < n; k++) {
    let drdc = 0;
    for (let i = 0; i < m; i++) if (coefficients[i] !== 0) drdc += coefficients[i] * jacobian[k * m + i];
    sum += residuals[k] * drdc;
  }
  return 2 * sum;
}
