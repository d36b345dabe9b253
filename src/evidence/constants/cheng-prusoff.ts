/**
 * IC50 at a substrate concentration S, in closed form for each mechanism (Cheng, Y. and Prusoff,
 * W. H. (1973) Biochem. Pharmacol. 22, 3099-3108): the [I] that halves the uninhibited rate at S.
 *   competitive     IC50 = Ki (1 + S/Km)
 *   uncompetitive   IC50 = Kiu (1 + Km/S)
 *   noncompetitive  IC50 = Ki
 *   mixed           IC50 = (Km + S) / (Km/Ki + S/Kiu)
 * For no inhibition there is no IC50 (Infinity).
 */
import type { Mechanism, ParamName } from '../../models/types.js';

/** IC50 at substrate S from natural-scale parameters given in `names` order. */
export function ic50AtSubstrate(mechanism: Mechanism, names: readonly ParamName[], p: ArrayLike<number>, s: number): number {
  const get = (name: ParamName): number => p[names.indexOf(name)];
  switch (mechanism) {
    case 'none':
      return Infinity;
    case 'competitive':
      return get('Ki') * (1 + s / get('Km'));
    case 'uncompetitive':
      return get('Kiu') * (1 + get('Km') / s);
    case 'noncompetitive':
      return get('Ki');
    case 'mixed': {
      const km = get('Km');
      return (km + s) / (km / get('Ki') + s / get('Kiu'));
    }
  }
}
