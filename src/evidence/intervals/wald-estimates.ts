/**
 * Parameter estimates with standard errors and Wald intervals.
 *
 * The fit is done in theta = ln p. Cov(theta) = s^2 (J'WJ)^-1 with s^2 = SSE_w / (n - p)
 * (Bates, D. M. and Watts, D. G. (1988) Nonlinear Regression Analysis and Its Applications, sec. 2.3),
 * computed from a pivoted QR of the weighted Jacobian (src/fit/qr.ts). By the delta method
 * SE(p) = p * SE(theta), which equals the SE of a fit in the natural parametrisation. The Wald
 * interval is formed where the fit is done, on the log scale: p * exp(+-t(1 - a/2, n - p) * SE(theta)),
 * so an interval of a positive constant stays positive (it is asymmetric on the natural scale).
 * Profile intervals remain the ones to report; they do not depend on the parametrisation.
 *
 * A constant is "not determined" when the fit runs along a ridge to values the data cannot
 * support: an inhibition constant below the lowest non-zero [I] / DETECTION_FACTOR (inhibition
 * would be complete at every tested [I], so only the product with another constant is seen), or
 * Vmax or Km beyond RIDGE_FACTOR times the highest rate or [S]. Such a constant is reported with
 * no SE and no Wald interval, and a note, never as a precise number.
 *
 * alpha = Kiu / Ki: ln alpha = theta_Kiu - theta_Ki, Var = V_uu + V_ii - 2 V_ui, SE(alpha) = alpha * SE(ln alpha).
 */
import { unscaledCovariance } from '../../fit/qr.js';
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import { tQuantile } from '../../stats/distributions.js';
import { DETECTION_FACTOR, detectionBound } from './detection-bound.js';
import { rounded } from '../../text/format-number.js';

/** Vmax or Km beyond this multiple of the highest rate or [S] is not determined (chosen here). */
const RIDGE_FACTOR = 1000;

/** What the data span, for the "not determined" checks; omitted fields skip the check. */
export interface DataSpan {
  /** lowest non-zero [I] */
  minInhibitor?: number;
  maxRate?: number;
  maxSubstrate?: number;
}

/**
 * The Wald interval value +/- t * se, formed on the log scale for a positive quantity
 * (value * exp(+-t * se / value)) and on the natural scale otherwise.
 */
export function waldInterval(value: number, se: number, t: number, positive: boolean): [number, number] {
  if (positive && value > 0) {
    const f = Math.exp((t * se) / value);
    return [value / f, value * f];
  }
  return [value - t * se, value + t * se];
}

export type EstimateName = 'Vmax' | 'Km' | 'Ki' | 'Kiu' | 'alpha' | 'beta' | 'Et';

export interface ParameterEstimate {
  name: EstimateName;
  /** natural-scale estimate; null when the arm is not detected */
  value: number | null;
  se: number | null;
  /** Wald interval at the requested level; null when not available */
  wald: [number, number] | null;
  /** false when the constant ran past the detection bound (see detection-bound.ts) */
  detected: boolean;
  /** for an undetected constant: the bound it exceeds (or, for alpha, the side it runs off to) */
  exceeds?: number;
  /** for a constant that runs to zero along a ridge: the bound it falls below */
  below?: number;
  /** plain-words note, e.g. "Kiu > 400: the enzyme-substrate complex arm is not detected" */
  note?: string;
  /**
   * profile-likelihood (profile-t) interval at the analysis level; an end is null when it is open
   * (not reached within the data's support); filled by the intervals stage
   */
  profile?: [number | null, number | null];
  /** bootstrap percentile and BCa intervals at the analysis level, when a bootstrap was run */
  bootstrapPercentile?: [number, number];
  bootstrapBca?: [number, number];
}

interface EstimateSet {
  estimates: ParameterEstimate[];
  /** residual variance s^2 = SSE_w / (n - p) */
  residualVariance: number;
  /** covariance of ln(params) for the detected parameters (NaN elsewhere), p x p row-major */
  logCovariance: Float64Array;
  level: number;
}

const ARM_NAMES: Record<string, string> = {
  Ki: 'free-enzyme (competitive) arm',
  Kiu: 'enzyme-substrate complex (uncompetitive) arm',
};

/** Wald estimates for every parameter of a fit, plus alpha for mixed. */
export function waldEstimates(fit: MechanismFit, maxInhibitor: number, level = 0.95, span: DataSpan = {}): EstimateSet {
  const names = fit.model.params;
  const m = names.length;
  const bound = detectionBound(maxInhibitor);
  const lowBound = span.minInhibitor !== undefined && span.minInhibitor > 0 ? span.minInhibitor / DETECTION_FACTOR : 0;
  const isArm = (name: string) => name === 'Ki' || name === 'Kiu';
  const tooLow = names.map((name, j) => isArm(name) && fit.params[j] < lowBound);
  const ridge = names.map((name, j) =>
    (name === 'Vmax' && span.maxRate !== undefined && span.maxRate > 0 && fit.params[j] > RIDGE_FACTOR * span.maxRate) ||
    (name === 'Km' && span.maxSubstrate !== undefined && fit.params[j] > RIDGE_FACTOR * span.maxSubstrate));
  const detected = names.map((name, j) => !(isArm(name) && (fit.params[j] > bound || tooLow[j])));
  const keep = names.map((_, j) => j).filter((j) => detected[j]);
  const s2 = fit.df > 0 ? fit.sse / fit.df : NaN;

  // Covariance of the detected parameters only: an undetected arm has a vanishing Jacobian column.
  const q = keep.length;
  const jSub = new Float64Array(fit.n * q);
  for (let k = 0; k < fit.n; k++) for (let c = 0; c < q; c++) jSub[k * q + c] = fit.jacobian[k * m + keep[c]];
  const unscaled = q > 0 && fit.n >= q ? unscaledCovariance(jSub, fit.n, q).matrix : new Float64Array(0);
  const cov = new Float64Array(m * m).fill(NaN);
  for (let a = 0; a < q; a++) for (let b = 0; b < q; b++) cov[keep[a] * m + keep[b]] = s2 * unscaled[a * q + b];

  const t = fit.df > 0 ? tQuantile(0.5 + level / 2, fit.df) : NaN;
  const estimates: ParameterEstimate[] = names.map((name, j) => {
    if (tooLow[j])
      return withoutInterval(name, null, false, {
        below: lowBound,
        note: `${name} < ${rounded(lowBound, 3)}: not determined (the fit runs to zero along a ridge, where the data see only its ratio to another constant)`,
      });
    if (ridge[j])
      return withoutInterval(name, fit.params[j], true, {
        note: `${name} is not determined: the fit runs along a ridge to ${rounded(fit.params[j], 3)}, over ${RIDGE_FACTOR} x the highest ${name === 'Vmax' ? 'rate' : '[S]'} measured`,
      });
    if (!detected[j])
      return withoutInterval(name, null, false, {
        exceeds: bound,
        note: `${name} > ${rounded(bound, 3)}: the ${ARM_NAMES[name]} is not detected in the tested inhibitor range`,
      });
    const value = fit.params[j];
    const seTheta = Math.sqrt(cov[j * m + j]);
    return finiteEstimate(name, value, value * seTheta, t);
  });

  if (fit.mechanism === 'mixed') estimates.push(alphaEstimate(fit, cov, detected, t));
  return { estimates, residualVariance: s2, logCovariance: cov, level };
}

/** An estimate reported without SE or interval, with the note that says why. */
function withoutInterval(name: EstimateName, value: number | null, detected: boolean, extra: Pick<ParameterEstimate, 'below' | 'exceeds' | 'note'>): ParameterEstimate {
  return { name, value, se: null, wald: null, detected, ...extra };
}

function finiteEstimate(name: EstimateName, value: number, se: number, t: number): ParameterEstimate {
  const ok = Number.isFinite(se) && Number.isFinite(t);
  return {
    name,
    value,
    se: ok ? se : null,
    wald: ok ? waldInterval(value, se, t, true) : null,
    detected: true,
    ...(ok ? {} : { note: `${name} is not identified by these data (singular information matrix)` }),
  };
}

function alphaEstimate(fit: MechanismFit, cov: Float64Array, detected: boolean[], t: number): ParameterEstimate {
  const m = fit.p;
  const ki = 2;
  const kiu = 3;
  if (!detected[ki] || !detected[kiu]) {
    const towards = !detected[kiu] ? 'above' : 'below';
    return {
      name: 'alpha',
      value: null,
      se: null,
      wald: null,
      detected: false,
      note: !detected[ki] && !detected[kiu]
        ? 'alpha is undefined: neither inhibition arm is detected'
        : `alpha runs off ${towards} the tested range because ${!detected[kiu] ? 'Kiu' : 'Ki'} is not detected`,
    };
  }
  const alpha = fit.params[kiu] / fit.params[ki];
  const varLog = cov[kiu * m + kiu] + cov[ki * m + ki] - 2 * cov[kiu * m + ki];
  return finiteEstimate('alpha', alpha, alpha * Math.sqrt(varLog), t);
}

