/**
 * What is known before the run, and the points of the prior range the criteria are averaged over.
 *
 * A range [low, high] is represented by its two ends and its geometric centre (a value known
 * exactly by itself). Where both Km and the inhibition constant are ranges, the points are the
 * four corners and the centre. A mixed inhibitor is represented at alpha = Kiu/Ki =
 * MIXED_ALPHAS (one leaning uncompetitive, one leaning competitive; this tool's choice).
 * An IC50 measured at [S] is turned into the constants of each mechanism by the Cheng-Prusoff
 * relations (Cheng, Y. and Prusoff, W. H. (1973) Biochem. Pharmacol. 22, 3099-3108):
 * competitive Ki = IC50/(1 + S/Km), uncompetitive Kiu = IC50/(1 + Km/S), noncompetitive Ki = IC50,
 * mixed Ki = IC50 (Km + S/alpha)/(Km + S), Kiu = alpha Ki.
 */
import type { Mechanism } from '../models/types.js';
import type { PriorPoint } from './design-types.js';

export type Range = readonly [number, number];

export interface PlanPrior {
  /** Km range (substrate units); [x, x] for a single value */
  km: Range;
  /** the inhibition constant range (inhibitor units): Ki, or Kiu for an uncompetitive inhibitor */
  ki?: Range;
  /** an IC50 range measured at [S] = atSubstrate (used when ki is not given) */
  ic50?: { range: Range; atSubstrate: number };
  /** expected Vmax (rate units); matters only for constant noise */
  vmax: number;
}

export const MIXED_ALPHAS: readonly number[] = [0.25, 4];

export function geometricCentre(r: Range): number {
  return Math.sqrt(r[0] * r[1]);
}

function rangePoints(r: Range): number[] {
  return r[0] === r[1] ? [r[0]] : [r[0], geometricCentre(r), r[1]];
}

/** (Km, K) pairs: the corners and the centre of the box (or fewer when a side is a single value). */
function boxPoints(km: Range, k: Range): Array<[number, number]> {
  const kms = rangePoints(km);
  const ks = rangePoints(k);
  if (kms.length === 1 || ks.length === 1) return kms.flatMap((a) => ks.map((b): [number, number] => [a, b]));
  return [
    [km[0], k[0]],
    [km[0], k[1]],
    [km[1], k[0]],
    [km[1], k[1]],
    [geometricCentre(km), geometricCentre(k)],
  ];
}

/** The prior points of one mechanism. */
export function priorPoints(mechanism: Mechanism, prior: PlanPrior): PriorPoint[] {
  if (mechanism === 'none') return rangePoints(prior.km).map((Km) => ({ mechanism, Vmax: prior.vmax, Km }));
  const alphas = mechanism === 'mixed' ? MIXED_ALPHAS : [1];
  return boxPoints(prior.km, inhibitionRange(prior)).flatMap(([Km, K]) => alphas.map((alpha) => truthAt(mechanism, Km, K, alpha, prior)));
}

/** The range of the one constant given: Ki, else the IC50. */
export function inhibitionRange(prior: PlanPrior): Range {
  const k = prior.ki ?? prior.ic50?.range;
  if (!k) throw new Error('the plan needs a range for Ki or for the IC50');
  return k;
}

/**
 * The constants of a mechanism at Km and K (K is Ki, or the IC50 when the prior gives one; see the
 * header for the relations) and, for mixed, alpha.
 */
export function truthAt(mechanism: Mechanism, Km: number, K: number, alpha: number, prior: PlanPrior): PriorPoint {
  const Vmax = prior.vmax;
  const ic50 = prior.ki ? null : (prior.ic50 ?? null);
  const S = ic50?.atSubstrate ?? 0;
  switch (mechanism) {
    case 'none':
      return { mechanism, Vmax, Km };
    case 'competitive':
      return { mechanism, Vmax, Km, Ki: ic50 ? K / (1 + S / Km) : K };
    case 'uncompetitive':
      return { mechanism, Vmax, Km, Kiu: ic50 ? K / (1 + Km / S) : K };
    case 'noncompetitive':
      return { mechanism, Vmax, Km, Ki: K };
    case 'mixed': {
      const Ki = ic50 ? (K * (Km + S / alpha)) / (Km + S) : K;
      return { mechanism, Vmax, Km, Ki, Kiu: alpha * Ki };
    }
  }
}

/**
 * The IC50 the common grid is centred on: the given IC50 (geometric centre of its range), else
 * the centre of the Ki range (the noncompetitive relation IC50 = Ki; an assumption, stated).
 */
export function typicalIc50(prior: PlanPrior): number {
  if (prior.ic50) return geometricCentre(prior.ic50.range);
  if (prior.ki) return geometricCentre(prior.ki);
  throw new Error('the plan needs a range for Ki or for the IC50');
}

/** The largest inhibition constant any prior point holds (for the reach of the [I] levels). */
export function inhibitionConstantSpan(prior: PlanPrior, mechanisms: readonly Mechanism[]): Range {
  const ks = mechanisms.flatMap((m) => priorPoints(m, prior)).flatMap((p) => [p.Ki, p.Kiu].filter((x): x is number => x !== undefined));
  if (ks.length === 0) {
    const c = typicalIc50(prior);
    return [c, c];
  }
  return [Math.min(...ks), Math.max(...ks)];
}
