/**
 * What a single-[S] dose-response curve can say: the IC50 (and Hill slope) with intervals, which
 * of the two curve models the data prefer, and, given Km, the Ki each mechanism would imply at the
 * assay [S] by the Cheng-Prusoff relations (Cheng, Y. and Prusoff, W. H. (1973) Biochem.
 * Pharmacol. 22, 3099-3108):
 *   competitive     Ki  = IC50 / (1 + S/Km)
 *   uncompetitive   Kiu = IC50 / (1 + Km/S)
 *   noncompetitive  Ki  = IC50
 *   mixed           not determined: IC50 = (Km + S) / (Km/Ki + S/Kiu) has two unknowns
 * One [S] cannot tell these apart: every mechanism fits the same curve. The relations assume full
 * inhibition at saturating [I] and a Hill slope of 1; a fitted slope whose interval excludes 1, or
 * a bottom well above zero, is reported as a caveat.
 *
 * Intervals: profile t (Bates, D. M. and Watts, D. G. (1988) Nonlinear Regression Analysis and Its
 * Applications, Wiley, ch. 6; the same rule as src/evidence/intervals/profile-likelihood.ts: |tau| <= t(1 -
 * a/2, n - p)), and Wald (estimate +/- t SE on the fitted scale, so exp(ln IC50 +/- t SE) for the
 * IC50). An end not reached within the data's reach (ln IC50 within 35 of ln max [I]) is open (null).
 * Model choice: AICc (Hurvich, C. M. and Tsai, C.-L. (1989) Biometrika 76, 297-307) with the
 * constant-error Gaussian likelihood, sigma counted as a parameter.
 */
import {
  DOSE_RESPONSE_LABELS,
  DOSE_RESPONSE_PARAMS,
  doseResponseProblem,
  fitDoseResponse,
  type DoseResponseFit,
  type DoseResponseModel,
} from '../../fit/dose-response-fit.js';
import type { LeastSquaresProblem } from '../../fit/least-squares-problem.js';
import { levenbergMarquardt } from '../../fit/levenberg-marquardt.js';
import { tQuantile } from '../../stats/distributions.js';
import { aicc } from '../selection/information-criteria.js';
import { findRoot } from '../intervals/find-root.js';

export type Interval = [number | null, number | null];

export interface DoseResponseModelResult {
  model: DoseResponseModel;
  label: string;
  converged: boolean;
  n: number;
  p: number;
  sse: number;
  aicc: number;
  /** natural-scale values: top, bottom (4PL), IC50, hill (4PL) */
  params: Record<string, number>;
  ic50: { value: number; profile: Interval; wald: Interval };
  /** null for the hyperbola (slope fixed at 1) */
  hill: { value: number; profile: Interval; wald: Interval } | null;
}

export type ChengPrusoffMechanism = 'competitive' | 'uncompetitive' | 'noncompetitive' | 'mixed';

export interface ImpliedKi {
  /** the constant the relation gives: Ki (competitive, noncompetitive) or Kiu (uncompetitive) */
  constant: 'Ki' | 'Kiu' | null;
  value: number | null;
  /** the IC50 interval mapped through the relation (Km taken as known) */
  interval: Interval | null;
  relation: string;
}

export interface DoseResponseEvidence {
  /** the model the data prefer by AICc, whose IC50 is reported */
  chosen: DoseResponseModel;
  models: DoseResponseModelResult[];
  level: number;
  /** the assay [S] (the one substrate level of the table) */
  substrate: number;
  km: number | null;
  kiByMechanism: Record<ChengPrusoffMechanism, ImpliedKi> | null;
  /** plain sentences: what one [S] can and cannot say, and the caveats of the relations */
  notes: string[];
}

interface DoseResponseOptions {
  level?: number;
  /** the substrate concentration of the assay, in the unit Km is given in */
  substrate: number;
  /** Km of the substrate (same unit as `substrate`), for the Cheng-Prusoff Ki */
  km?: number;
}

/** The problem in the other parameters with parameter `j` held at `fixed.value`. */
function heldProblem(full: LeastSquaresProblem, j: number, fixed: { value: number }): LeastSquaresProblem {
  const m = full.m;
  const x = new Float64Array(m);
  const jFull = new Float64Array(full.n * m);
  const fill = (z: ArrayLike<number>) => {
    for (let a = 0, f = 0; a < m; a++) x[a] = a === j ? fixed.value : z[f++];
    return x;
  };
  return {
    n: full.n,
    m: m - 1,
    residuals: (z, r) => full.residuals(fill(z), r),
    jacobian: (z, J) => {
      full.jacobian(fill(z), jFull);
      for (let k = 0; k < full.n; k++) for (let a = 0, f = 0; a < m; a++) if (a !== j) J[k * (m - 1) + f++] = jFull[k * m + a];
    },
  };
}

/** Profile-t interval of fitted parameter j (on the fitted scale), within [low, high]. */
function profileInterval(fit: DoseResponseFit, full: LeastSquaresProblem, j: number, level: number, low: number, high: number): Interval {
  const s2 = fit.sse / fit.df;
  const cutoff = tQuantile(1 - (1 - level) / 2, fit.df);
  const fixed = { value: fit.x[j] };
  const problem = heldProblem(full, j, fixed);
  const others = (x: Float64Array) => Float64Array.from(Array.from(x).filter((_, a) => a !== j));
  const tauAt = (c: number, warm: Float64Array) => {
    fixed.value = c;
    const r = levenbergMarquardt(problem, warm, { skipFinalJacobian: true });
    return { tau: Math.sqrt(Math.max(0, r.sse - fit.sse) / s2), z: r.x as Float64Array, ok: Number.isFinite(r.sse) };
  };
  const end = (direction: 1 | -1): number | null => {
    const se = fit.se[j];
    let step = Number.isFinite(se) && se > 0 ? Math.min(0.9 * cutoff * se, 1) : 0.1;
    let previous: { c: number; tau: number; z: Float64Array } = { c: fit.x[j], tau: 0, z: others(fit.x) };
    for (let k = 0; k < 80; k++) {
      const c = Math.min(high, Math.max(low, previous.c + direction * step));
      const point = tauAt(c, previous.z);
      if (!point.ok) return null;
      if (point.tau >= cutoff) {
        let warm = point.z;
        const g = (x: number) => {
          const p = tauAt(x, warm);
          warm = p.z;
          return p.tau - cutoff;
        };
        return findRoot(g, previous.c, c, previous.tau - cutoff, point.tau - cutoff, 1e-9 * Math.max(1, Math.abs(c))).x;
      }
      if (c === low || c === high) return null;
      if (point.tau - previous.tau < cutoff / 8) step *= 2;
      previous = { c, tau: point.tau, z: point.z };
    }
    return null;
  };
  return [end(-1), end(1)];
}

function summarise(fit: DoseResponseFit, inhibitor: Float64Array, rate: Float64Array, level: number): DoseResponseModelResult {
  const names = DOSE_RESPONSE_PARAMS[fit.model];
  const full = doseResponseProblem(fit.model, inhibitor, rate);
  const t = tQuantile(1 - (1 - level) / 2, fit.df);
  const jC = names.indexOf('lnIC50');
  const lnMax = Math.log(Math.max(...inhibitor.filter((i) => i > 0)));
  const wald = (j: number, map: (x: number) => number): Interval => {
    const se = fit.se[j];
    return Number.isFinite(se) ? [map(fit.x[j] - t * se), map(fit.x[j] + t * se)] : [null, null];
  };
  const lnProfile = profileInterval(fit, full, jC, level, lnMax - 35, lnMax + 35);
  const ic50 = {
    value: Math.exp(fit.x[jC]),
    profile: lnProfile.map((e) => (e === null ? null : Math.exp(e))) as Interval,
    wald: wald(jC, Math.exp),
  };
  const jH = names.indexOf('hill');
  const hill = jH < 0 ? null : { value: fit.x[jH], profile: profileInterval(fit, full, jH, level, -50, 50), wald: wald(jH, (x) => x) };
  const params: Record<string, number> = {};
  names.forEach((name, j) => {
    if (name === 'lnIC50') params.IC50 = Math.exp(fit.x[j]);
    else params[name] = fit.x[j];
  });
  return {
    model: fit.model,
    label: DOSE_RESPONSE_LABELS[fit.model],
    converged: fit.converged,
    n: fit.n,
    p: fit.p,
    sse: fit.sse,
    aicc: aicc(-fit.n / 2 * (Math.log((2 * Math.PI * fit.sse) / fit.n) + 1), fit.p + 1, fit.n),
    params,
    ic50,
    hill,
  };
}

/** The Ki each mechanism implies at [S] = s for IC50 (Cheng-Prusoff), with the interval mapped. */
export function chengPrusoffKi(ic50: number, interval: Interval, s: number, km: number): Record<ChengPrusoffMechanism, ImpliedKi> {
  const through = (f: (x: number) => number, constant: 'Ki' | 'Kiu', relation: string): ImpliedKi => ({
    constant,
    value: f(ic50),
    interval: [interval[0] === null ? null : f(interval[0]), interval[1] === null ? null : f(interval[1])],
    relation,
  });
  return {
    competitive: through((x) => x / (1 + s / km), 'Ki', 'Ki = IC50 / (1 + [S]/Km)'),
    uncompetitive: through((x) => x / (1 + km / s), 'Kiu', 'Kiu = IC50 / (1 + Km/[S])'),
    noncompetitive: through((x) => x, 'Ki', 'Ki = IC50'),
    mixed: { constant: null, value: null, interval: null, relation: 'IC50 = (Km + [S]) / (Km/Ki + [S]/Kiu): two unknowns, not determined by one IC50' },
  };
}

/** Fits both curve models to (inhibitor, rate) at one [S] and says what they support. */
export function doseResponseEvidence(inhibitor: Float64Array, rate: Float64Array, options: DoseResponseOptions): DoseResponseEvidence {
  const level = options.level ?? 0.95;
  const fits = (['four-parameter-logistic', 'single-site-hyperbola'] as const).map((model) => fitDoseResponse(model, inhibitor, rate));
  const usable = fits.filter((f) => Number.isFinite(f.sse) && f.df > 1);
  const models = usable.map((f) => summarise(f, inhibitor, rate, level)).sort((a, b) => a.aicc - b.aicc);
  if (models.length === 0) throw new RangeError('no dose-response model could be fitted to these rates');
  const chosen = models[0];
  const notes = [
    'One [S] cannot tell the mechanism: competitive, uncompetitive, noncompetitive and mixed inhibition all give a curve of this shape. Measure rates over several [S] (a grid of [S] and [I]) to decide it.',
  ];
  const hill = models.find((m) => m.hill !== null)?.hill;
  const ic50Interval: Interval = chosen.ic50.profile[0] !== null || chosen.ic50.profile[1] !== null ? chosen.ic50.profile : chosen.ic50.wald;
  let kiByMechanism: Record<ChengPrusoffMechanism, ImpliedKi> | null = null;
  if (options.km !== undefined) {
    kiByMechanism = chengPrusoffKi(chosen.ic50.value, ic50Interval, options.substrate, options.km);
    notes.push('The Cheng-Prusoff Ki values assume full inhibition at high [I], a Hill slope of 1 and Km known exactly (its own uncertainty is not carried into the intervals).');
  } else {
    notes.push('Give --km (with the assay [S], read from the table) for the Ki each mechanism would imply.');
  }
  if (hill) {
    const [lo, hi] = hill.profile;
    if ((lo !== null && lo > 1) || (hi !== null && hi < 1))
      notes.push(`The Hill slope (${hill.value.toPrecision(3)}) differs from 1 at this level: the curve is steeper or shallower than one-site binding (aggregation, several sites, or tight binding can do this), and the Cheng-Prusoff relations do not strictly apply.`);
  }
  const four = models.find((m) => m.model === 'four-parameter-logistic');
  if (four && chosen === four && four.params.bottom > 0.2 * four.params.top)
    notes.push(`The fitted bottom (${four.params.bottom.toPrecision(3)}) is above 20% of the top: inhibition looks partial, so the IC50 is the midpoint between top and bottom, not the [I] that halves the rate.`);
  return { chosen: chosen.model, models, level, substrate: options.substrate, km: options.km ?? null, kiByMechanism, notes };
}
