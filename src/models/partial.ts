/**
 * Partial (hyperbolic) inhibition: the enzyme-substrate-inhibitor complex still turns over, at
 * beta·kcat, so the rate levels off at a residual activity at saturating inhibitor instead of
 * falling to zero (Segel, I. H. (1975) Enzyme Kinetics, Wiley, ch. 4). Free [I] = total [I].
 *   partial mixed           v = Vmax·S·(1 + beta·I/Kiu) / (Km·(1 + I/Ki) + S·(1 + I/Kiu))     (Kiu = alpha·Ki)
 *   partial noncompetitive  v = Vmax·S/(Km + S) · (1 + beta·I/Ki)/(1 + I/Ki)                  (Kiu = Ki)
 *   partial competitive     v = Vmax·S·(1 + I/Kiu) / (Km·(1 + I/Ki) + S·(1 + I/Kiu))          (beta = 1, alpha > 1:
 *                           only the apparent Km changes, Km·(1 + I/Ki)/(1 + I/Kiu))
 * beta -> 0 gives the full (classic) mixed and noncompetitive models, and Kiu -> infinity the
 * classic competitive one: limits at the edge of the parameter space, so the tests of partial
 * against full inhibition are boundary tests (Self & Liang 1987).
 */
import type { MechanismModel, ParamSpec } from './types.js';
import { inhibitionConstantGuesses, roughScales, singleConstantGuesses } from './starting-values.js';

const VM_KM: ParamSpec[] = [
  { name: 'Vmax', dimension: 'rate' },
  { name: 'Km', dimension: 'substrate' },
];

export const partialMixed: MechanismModel = {
  mechanism: 'mixed',
  family: 'partial',
  label: 'partial mixed',
  equation: 'v = Vmax·S·(1 + beta·I/Kiu) / (Km·(1 + I/Ki) + S·(1 + I/Kiu))',
  params: ['Vmax', 'Km', 'Ki', 'Kiu', 'beta'],
  specs: [...VM_KM, { name: 'Ki', dimension: 'inhibitor' }, { name: 'Kiu', dimension: 'inhibitor' }, { name: 'beta', dimension: 'dimensionless' }],
  contains: [
    { model: 'mixed', rules: [{ kind: 'limit', param: 'beta', to: 'zero' }] },
    { model: 'partial noncompetitive', rules: [{ kind: 'equal', param: 'Kiu', sameAs: 'Ki' }] },
    { model: 'partial competitive', rules: [{ kind: 'fixed', param: 'beta', value: 1 }] },
  ],
  capabilities: {
    residualActivity: (p, s) => (p[4] * (p[1] + s)) / ((p[1] * p[3]) / p[2] + s),
  },
  rate(p, s, i) {
    return (p[0] * s * (1 + (p[4] * i) / p[3])) / (p[1] * (1 + i / p[2]) + s * (1 + i / p[3]));
  },
  gradLog(p, s, i, out, o) {
    const free = p[1] * (1 + i / p[2]);
    const d = free + s * (1 + i / p[3]);
    const bi = (p[4] * i) / p[3];
    const v = (p[0] * s * (1 + bi)) / d;
    out[o] = v;
    out[o + 1] = (-v * free) / d;
    out[o + 2] = (v * p[1] * i) / (p[2] * d);
    out[o + 3] = (-p[0] * s * bi) / d + (v * s * i) / (p[3] * d);
    out[o + 4] = (p[0] * s * bi) / d;
  },
  starts(data) {
    const r = roughScales(data);
    const [low, mid, high] = inhibitionConstantGuesses(r);
    return [
      [r.vmax, r.km, mid, mid, 0.3],
      [r.vmax, r.km, low, high, 0.3],
      [r.vmax, r.km, high, low, 0.3],
    ];
  },
};

export const partialNoncompetitive: MechanismModel = {
  mechanism: 'noncompetitive',
  family: 'partial',
  label: 'partial noncompetitive',
  equation: 'v = Vmax·S/(Km + S) · (1 + beta·I/Ki)/(1 + I/Ki)',
  params: ['Vmax', 'Km', 'Ki', 'beta'],
  specs: [...VM_KM, { name: 'Ki', dimension: 'inhibitor' }, { name: 'beta', dimension: 'dimensionless' }],
  contains: [{ model: 'noncompetitive', rules: [{ kind: 'limit', param: 'beta', to: 'zero' }] }],
  capabilities: { residualActivity: (p) => p[3] },
  rate(p, s, i) {
    return ((p[0] * s) / (p[1] + s)) * ((p[2] + p[3] * i) / (p[2] + i));
  },
  gradLog(p, s, i, out, o) {
    const v0 = (p[0] * s) / (p[1] + s);
    const ki = p[2];
    const g = (ki + p[3] * i) / (ki + i);
    const v = v0 * g;
    out[o] = v;
    out[o + 1] = (-v * p[1]) / (p[1] + s);
    out[o + 2] = (v0 * ki * i * (1 - p[3])) / ((ki + i) * (ki + i));
    out[o + 3] = (v0 * p[3] * i) / (ki + i);
  },
  starts(data) {
    const r = roughScales(data);
    return singleConstantGuesses(r).map((ki) => [r.vmax, r.km, ki, 0.3]);
  },
};

export const partialCompetitive: MechanismModel = {
  mechanism: 'competitive',
  family: 'partial',
  label: 'partial competitive',
  equation: 'v = Vmax·S·(1 + I/Kiu) / (Km·(1 + I/Ki) + S·(1 + I/Kiu))',
  params: ['Vmax', 'Km', 'Ki', 'Kiu'],
  specs: [...VM_KM, { name: 'Ki', dimension: 'inhibitor' }, { name: 'Kiu', dimension: 'inhibitor' }],
  contains: [{ model: 'competitive', rules: [{ kind: 'limit', param: 'Kiu', to: 'infinity' }] }],
  capabilities: { residualActivity: (p, s) => (p[1] + s) / ((p[1] * p[3]) / p[2] + s) },
  rate(p, s, i) {
    const n = 1 + i / p[3];
    return (p[0] * s * n) / (p[1] * (1 + i / p[2]) + s * n);
  },
  gradLog(p, s, i, out, o) {
    const n = 1 + i / p[3];
    const free = p[1] * (1 + i / p[2]);
    const d = free + s * n;
    const v = (p[0] * s * n) / d;
    out[o] = v;
    out[o + 1] = (-v * free) / d;
    out[o + 2] = (v * p[1] * i) / (p[2] * d);
    // d v / d ln Kiu = -(I/Kiu) · Vmax·S·free / d^2
    out[o + 3] = (-(i / p[3]) * p[0] * s * free) / (d * d);
  },
  starts(data) {
    const r = roughScales(data);
    const [low, mid, high] = inhibitionConstantGuesses(r);
    return [
      [r.vmax, r.km, low, mid],
      [r.vmax, r.km, mid, high],
    ];
  },
};

/** The partial family, simplest first. */
export const PARTIAL_MODELS: readonly MechanismModel[] = [partialCompetitive, partialNoncompetitive, partialMixed];
