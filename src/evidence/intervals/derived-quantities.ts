/**
 * Quantities derived from a model's parameters, with intervals:
 * - pKi, pKiu: -log10 of the constant in mol/L (needs the [I] unit; skipped with a note when unknown);
 * - IC50 at a chosen [S] (Cheng-Prusoff closed forms, cheng-prusoff.ts);
 * - apparent Vmax and Km at each tested [I] (apparent-constants.ts).
 *
 * Wald intervals by the delta method: Var g = grad' Cov(theta) grad with the gradient in
 * theta = ln p by central differences (step 1e-5), and g +/- t * SE. pK values are linear in
 * theta, so their Wald interval is the log-scale interval of the constant, mapped. Profile
 * intervals are given where the quantity is a monotone function of one parameter (pKi, pKiu: the
 * profile ends of Ki, Kiu mapped, which is exact because profile intervals do not depend on the
 * parametrisation). Bootstrap intervals: the quantity evaluated on every replicate parameter vector.
 */
import type { ConcentrationUnit } from '../../input/types.js';
import type { MechanismModel, ParamName } from '../../models/types.js';
import { unitShift } from '../../input/units.js';
import { ic50AtSubstrate } from '../constants/cheng-prusoff.js';
import { apparentKm, apparentVmax } from '../constants/apparent-constants.js';

export type DerivedName = 'pKi' | 'pKiu' | 'IC50' | 'Vmax_app' | 'Km_app';

export interface DerivedQuantity {
  name: DerivedName;
  /** the [I] of an apparent constant */
  inhibitor?: number;
  /** the [S] of an IC50 */
  substrate?: number;
  /** unit of the value (null when dimensionless or unknown) */
  unit: string | null;
  /** null when not determined (see note) */
  value: number | null;
  se: number | null;
  wald: [number, number] | null;
  /** profile interval where the quantity is a monotone map of one parameter; null end = open */
  profile?: [number | null, number | null];
  bootstrapPercentile?: [number, number];
  bootstrapBca?: [number, number];
  note?: string;
}

/** How to compute one derived quantity from natural-scale parameters. */
export interface DerivedDefinition {
  name: DerivedName;
  inhibitor?: number;
  substrate?: number;
  unit: string | null;
  evaluate(p: ArrayLike<number>): number;
  /** when the quantity is a decreasing map of one parameter (pK values) */
  ofParameter?: { name: ParamName; map: (x: number) => number };
  /** parameters that must be detected for the value to mean anything */
  needs: ParamName[];
}

export interface DerivedUnits {
  substrate: ConcentrationUnit | null;
  inhibitor: ConcentrationUnit | null;
  rate: string | null;
}

/** -log10 of a concentration given in `unit`, in mol/L. */
function pConcentration(x: number, unit: ConcentrationUnit): number {
  return -(Math.log10(x) + unitShift(unit, 'M'));
}

/** The derived quantities of a model, and notes on the ones skipped. */
export function derivedDefinitions(
  model: MechanismModel,
  inhibitorLevels: readonly number[],
  units: DerivedUnits,
  atSubstrate?: number,
): { definitions: DerivedDefinition[]; skipped: string[] } {
  const names = model.params;
  const definitions: DerivedDefinition[] = [];
  const skipped: string[] = [];
  for (const k of ['Ki', 'Kiu'] as const) {
    if (!names.includes(k)) continue;
    const unit = units.inhibitor;
    const pName = k === 'Ki' ? 'pKi' : 'pKiu';
    if (unit === null) {
      skipped.push(`${pName} needs the [I] unit (mol/L scale), which the table does not give`);
      continue;
    }
    const j = names.indexOf(k);
    const map = (x: number) => pConcentration(x, unit);
    definitions.push({ name: pName, unit: null, evaluate: (p) => map(p[j]), ofParameter: { name: k, map }, needs: [k] });
  }
  if (model.mechanism !== 'none') {
    if (atSubstrate !== undefined) {
      const needs = names.filter((n) => n === 'Ki' || n === 'Kiu');
      definitions.push({
        name: 'IC50',
        substrate: atSubstrate,
        unit: units.inhibitor,
        evaluate: (p) => ic50AtSubstrate(model.mechanism, names, p, atSubstrate),
        needs: model.mechanism === 'mixed' ? [] : needs,
      });
    }
    for (const level of inhibitorLevels) {
      if (!(level > 0)) continue;
      definitions.push({ name: 'Vmax_app', inhibitor: level, unit: units.rate, evaluate: (p) => apparentVmax(model.mechanism, names, p, level), needs: [] });
      definitions.push({ name: 'Km_app', inhibitor: level, unit: units.substrate, evaluate: (p) => apparentKm(model.mechanism, names, p, level), needs: [] });
    }
  }
  return { definitions, skipped };
}

/** Gradient of g(exp(theta)) with respect to theta, by central differences. */
export function logScaleGradient(evaluate: (p: ArrayLike<number>) => number, theta: ArrayLike<number>, step = 1e-5): Float64Array {
  const m = theta.length;
  const p = new Float64Array(m);
  const grad = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    for (let q = 0; q < m; q++) p[q] = Math.exp(theta[q] + (q === j ? step : 0));
    const up = evaluate(p);
    for (let q = 0; q < m; q++) p[q] = Math.exp(theta[q] - (q === j ? step : 0));
    const down = evaluate(p);
    grad[j] = (up - down) / (2 * step);
  }
  return grad;
}

/**
 * Delta-method SE of g from the covariance of theta (m x m, NaN for undetected parameters).
 * Terms of a parameter with NaN covariance count only if g depends on it noticeably (relative
 * gradient above 1e-8); otherwise that parameter is treated as not entering g.
 */
export function deltaMethodSe(grad: Float64Array, covariance: Float64Array, value: number): number {
  const m = grad.length;
  const enters = Array.from(grad, (g) => Math.abs(g) > 1e-8 * Math.max(Math.abs(value), 1e-300));
  let v = 0;
  for (let a = 0; a < m; a++) {
    if (!enters[a]) continue;
    for (let b = 0; b < m; b++) {
      if (!enters[b]) continue;
      v += grad[a] * covariance[a * m + b] * grad[b];
    }
  }
  return Math.sqrt(v);
}
