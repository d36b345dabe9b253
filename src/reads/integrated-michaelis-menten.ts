/**
 * The integrated Michaelis-Menten equation and its least-squares fit to one progress curve.
 *
 * Irreversible, single substrate, no product inhibition: Km ln(S0/S) + (S0 - S) = Vmax t, solved in
 * closed form by Schnell & Mendoza (1997) J. Theor. Biol. 187, 207-212 as
 * S(t) = Km W((S0/Km) exp((S0 - Vmax t)/Km)) = Km omega(ln(S0/Km) + (S0 - Vmax t)/Km),
 * and fitted to progress curves by Goudar, Sonnad & Duggleby (1999) Biochim. Biophys. Acta 1429,
 * 377-383. The derivatives follow from the implicit equation:
 *   dS/dVmax = -t S/(Km + S),  dS/dKm = ln(S0/S) S/(Km + S).
 * The curve fitted is c(t) = c0 + P(t) with P = S0 - S the product formed and c0 the reading at
 * mixing (an offset the blank does not remove). Parameters are fitted on the log scale for Vmax and
 * Km (both positive) by Levenberg-Marquardt (Marquardt (1963) J. SIAM 11, 431-441).
 */
import { tQuantile } from '../stats/distributions.js';
import { wrightOmega } from './lambert-w.js';

/** Product formed by time t (same concentration unit as S0 and Km; t in the unit of Vmax's time). */
export function productFormed(t: number, vmax: number, km: number, s0: number): number {
  if (t <= 0) return 0;
  const s = km * wrightOmega(Math.log(s0 / km) + (s0 - vmax * t) / km);
  return s0 - s;
}

/** Substrate left at time t. */
export function substrateLeft(t: number, vmax: number, km: number, s0: number): number {
  return s0 - productFormed(t, vmax, km, s0);
}

export interface IntegratedFit {
  vmax: number;
  km: number;
  /** reading at t = 0, in concentration units */
  offset: number;
  /** v0 = Vmax S0 / (Km + S0), the rate at mixing */
  v0: number;
  /** standard errors (delta method on the log-scale covariance) */
  se: { vmax: number; km: number; v0: number };
  /** Wald interval of Km at the requested level, from the log scale (so always positive) */
  kmInterval: [number, number];
  /** residual standard deviation */
  residualSd: number;
  df: number;
  converged: boolean;
  iterations: number;
}

interface Model {
  /** residuals y - f and the Jacobian of f (rows: points; columns: offset, ln Vmax, ln Km) */
  evaluate(theta: number[], residuals: Float64Array, jacobian: Float64Array | null): number;
}

function curveModel(times: readonly number[], values: readonly number[], s0: number): Model {
  const n = times.length;
  return {
    evaluate(theta, residuals, jacobian) {
      const [c0, lnV, lnK] = theta;
      const v = Math.exp(lnV);
      const k = Math.exp(lnK);
      const logRatio = Math.log(s0 / k);
      let sse = 0;
      for (let i = 0; i < n; i++) {
        const t = times[i];
        const s = t <= 0 ? s0 : k * wrightOmega(logRatio + (s0 - v * t) / k);
        const r = values[i] - (c0 + s0 - s);
        residuals[i] = r;
        sse += r * r;
        if (jacobian) {
          const share = s / (k + s);
          jacobian[3 * i] = 1;
          jacobian[3 * i + 1] = v * t * share; // d P / d ln V
          jacobian[3 * i + 2] = -k * Math.log(s0 / s) * share; // d P / d ln Km
        }
      }
      return sse;
    },
  };
}

/** Solves the 3x3 system A x = b (A symmetric positive definite) by Cholesky; null if singular. */
function solve3(a: number[], b: number[]): number[] | null {
  const l = new Array<number>(9).fill(0);
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = a[3 * i + j];
      for (let k = 0; k < j; k++) sum -= l[3 * i + k] * l[3 * j + k];
      if (i === j) {
        if (!(sum > 0)) return null;
        l[3 * i + i] = Math.sqrt(sum);
      } else {
        l[3 * i + j] = sum / l[3 * j + j];
      }
    }
  }
  const y = [0, 0, 0];
  for (let i = 0; i < 3; i++) {
    let sum = b[i];
    for (let k = 0; k < i; k++) sum -= l[3 * i + k] * y[k];
    y[i] = sum / l[3 * i + i];
  }
  const x = [0, 0, 0];
  for (let i = 2; i >= 0; i--) {
    let sum = y[i];
    for (let k = i + 1; k < 3; k++) sum -= l[3 * k + i] * x[k];
    x[i] = sum / l[3 * i + i];
  }
  return x;
}

function inverse3(a: number[]): number[] | null {
  const out = new Array<number>(9);
  for (let c = 0; c < 3; c++) {
    const e = [0, 0, 0];
    e[c] = 1;
    const x = solve3(a, e);
    if (!x) return null;
    for (let r = 0; r < 3; r++) out[3 * r + c] = x[r];
  }
  return out;
}

function normalEquations(jac: Float64Array, res: Float64Array, n: number): { jtj: number[]; jtr: number[] } {
  const jtj = new Array<number>(9).fill(0);
  const jtr = [0, 0, 0];
  for (let i = 0; i < n; i++) {
    for (let p = 0; p < 3; p++) {
      const jp = jac[3 * i + p];
      jtr[p] += jp * res[i];
      for (let q = 0; q <= p; q++) jtj[3 * p + q] += jp * jac[3 * i + q];
    }
  }
  for (let p = 0; p < 3; p++) for (let q = p + 1; q < 3; q++) jtj[3 * p + q] = jtj[3 * q + p];
  return { jtj, jtr };
}

function levenbergMarquardt(model: Model, start: number[], n: number): { theta: number[]; sse: number; converged: boolean; iterations: number } {
  const res = new Float64Array(n);
  const trial = new Float64Array(n);
  const jac = new Float64Array(3 * n);
  let theta = start.slice();
  let sse = model.evaluate(theta, res, jac);
  let lambda = 1e-3;
  let converged = false;
  let iterations = 0;
  for (; iterations < 200; iterations++) {
    const { jtj, jtr } = normalEquations(jac, res, n);
    let improved = false;
    for (let attempt = 0; attempt < 30; attempt++) {
      const damped = jtj.slice();
      for (let p = 0; p < 3; p++) damped[4 * p] += lambda * (jtj[4 * p] > 0 ? jtj[4 * p] : 1);
      const step = solve3(damped, jtr);
      if (!step) {
        lambda *= 10;
        continue;
      }
      const next = theta.map((x, p) => x + step[p]);
      const nextSse = model.evaluate(next, trial, null);
      if (Number.isFinite(nextSse) && nextSse <= sse) {
        const small = step.every((s, p) => Math.abs(s) <= 1e-10 * (1 + Math.abs(next[p])));
        const flat = sse - nextSse <= 1e-14 * sse;
        theta = next;
        sse = model.evaluate(theta, res, jac);
        lambda = Math.max(lambda / 10, 1e-12);
        improved = true;
        if (small || flat) converged = true;
        break;
      }
      lambda *= 10;
    }
    if (!improved) {
      converged = true; // no downhill step at any damping: a minimum to working precision
      break;
    }
    if (converged) break;
  }
  return { theta, sse, converged, iterations };
}

/**
 * Fits c(t) = c0 + P(t; Vmax, Km, S0) to one curve (S0 known). `slopeGuess` (the initial slope, in
 * concentration per time) seeds Vmax; several Km starts (S0/10, S0, 10 S0) are tried and the best
 * kept. Returns null when there are fewer than 5 points or no start gives a finite fit.
 */
export function fitIntegratedCurve(
  times: readonly number[],
  values: readonly number[],
  s0: number,
  slopeGuess: number,
  level = 0.95,
): IntegratedFit | null {
  const n = times.length;
  if (n < 5 || !(s0 > 0)) return null;
  const model = curveModel(times, values, s0);
  const offsetGuess = values[0] - (slopeGuess > 0 ? slopeGuess * times[0] : 0);
  let best: ReturnType<typeof levenbergMarquardt> | null = null;
  for (const factor of [0.1, 1, 10]) {
    const km = s0 * factor;
    const v = Math.max(slopeGuess, 1e-12 * s0) * (km + s0) / s0;
    const fit = levenbergMarquardt(model, [offsetGuess, Math.log(v), Math.log(km)], n);
    if (Number.isFinite(fit.sse) && (best === null || fit.sse < best.sse)) best = fit;
  }
  if (!best) return null;
  const res = new Float64Array(n);
  const jac = new Float64Array(3 * n);
  model.evaluate(best.theta, res, jac);
  const { jtj } = normalEquations(jac, res, n);
  const df = n - 3;
  const s2 = best.sse / df;
  const inv = inverse3(jtj);
  const vmax = Math.exp(best.theta[1]);
  const km = Math.exp(best.theta[2]);
  const v0 = (vmax * s0) / (km + s0);
  let seLnV = Number.NaN;
  let seLnK = Number.NaN;
  let seV0 = Number.NaN;
  if (inv) {
    seLnV = Math.sqrt(Math.max(0, s2 * inv[4]));
    seLnK = Math.sqrt(Math.max(0, s2 * inv[8]));
    // ln v0 = ln V - ln(Km + S0): gradient (1, -Km/(Km + S0)) on (ln V, ln Km)
    const g = -km / (km + s0);
    const varLnV0 = s2 * (inv[4] + 2 * g * inv[5] + g * g * inv[8]);
    seV0 = v0 * Math.sqrt(Math.max(0, varLnV0));
  }
  const tq = tQuantile(0.5 + level / 2, df);
  return {
    vmax,
    km,
    offset: best.theta[0],
    v0,
    se: { vmax: vmax * seLnV, km: km * seLnK, v0: seV0 },
    kmInterval: [km * Math.exp(-tq * seLnK), km * Math.exp(tq * seLnK)],
    residualSd: Math.sqrt(s2),
    df,
    converged: best.converged,
    iterations: best.iterations,
  };
}
