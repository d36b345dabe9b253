/**
 * Apparent Vmax and Km at a fixed inhibitor concentration: the Michaelis-Menten constants of the
 * curve v(S) at that [I]. Writing each mechanism as mixed with the missing arm at infinity
 * (Segel, I. H. (1975) Enzyme Kinetics, Wiley, ch. 3):
 *   Vmax_app = Vmax / (1 + I/Kiu),   Km_app = Km (1 + I/Ki) / (1 + I/Kiu)
 * competitive: Kiu = infinity; uncompetitive: Ki = infinity; noncompetitive: Kiu = Ki.
 */
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import type { Mechanism, ParamName } from '../../models/types.js';

/** The (Ki, Kiu) pair of a mechanism in the mixed form (Infinity for an absent arm). */
export function inhibitionArms(mechanism: Mechanism, names: readonly ParamName[], p: ArrayLike<number>): { ki: number; kiu: number } {
  const get = (name: ParamName): number => p[names.indexOf(name)];
  switch (mechanism) {
    case 'none':
      return { ki: Infinity, kiu: Infinity };
    case 'competitive':
      return { ki: get('Ki'), kiu: Infinity };
    case 'uncompetitive':
      return { ki: Infinity, kiu: get('Kiu') };
    case 'noncompetitive':
      return { ki: get('Ki'), kiu: get('Ki') };
    case 'mixed':
      return { ki: get('Ki'), kiu: get('Kiu') };
  }
}

export function apparentVmax(mechanism: Mechanism, names: readonly ParamName[], p: ArrayLike<number>, inhibitor: number): number {
  const { kiu } = inhibitionArms(mechanism, names, p);
  return p[names.indexOf('Vmax')] / (1 + inhibitor / kiu);
}

export function apparentKm(mechanism: Mechanism, names: readonly ParamName[], p: ArrayLike<number>, inhibitor: number): number {
  const { ki, kiu } = inhibitionArms(mechanism, names, p);
  return (p[names.indexOf('Km')] * (1 + inhibitor / ki)) / (1 + inhibitor / kiu);
}

/** Apparent (Vmax, Km) at inhibitor level I implied by a global fit. */
export function apparentConstants(fit: Pick<MechanismFit, 'mechanism' | 'model' | 'params'>, inhibitor: number): { Vmax: number; Km: number } {
  const names = fit.model.params;
  return {
    Vmax: apparentVmax(fit.mechanism, names, fit.params, inhibitor),
    Km: apparentKm(fit.mechanism, names, fit.params, inhibitor),
  };
}
