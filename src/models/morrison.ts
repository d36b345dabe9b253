/**
 * The Morrison quadratic (Morrison, J. F. (1969) Biochim. Biophys. Acta 185, 269-286): the share of
 * total enzyme E that is free of inhibitor when total inhibitor I binds with apparent dissociation
 * constant K, without assuming free [I] = total [I]. The free enzyme Ef solves
 *   Ef^2 + (I + K - E) Ef - E K = 0,
 * whose discriminant (I + K - E)^2 + 4 E K equals (E + I + K)^2 - 4 E I.
 *
 * Both fractions are computed without cancellation: the textbook
 *   1 - ((E + I + K) - sqrt((E + I + K)^2 - 4 E I)) / (2 E)
 * loses every digit when E << I + K (and divides 0 by 0 at E = 0). Here, with R the square root
 * and c = I + K - E,
 *   bound fraction  [EI]/E = 2 I / (E + I + K + R)                     (no subtraction at all)
 *   activity        Ef/E   = 2 K / (c + R)        when c >= 0
 *                          = (R - c) / (2 E)      when c < 0 (then -c > 0: a sum of positives)
 * As E -> 0 the activity tends to K / (K + I), the rapid-equilibrium factor 1 / (1 + I/K).
 */
export interface MorrisonFractions {
  /** Ef / E: the fraction of enzyme free of inhibitor (the fractional activity v / v0) */
  activity: number;
  /** [EI] / E = 1 - activity, computed on its own */
  bound: number;
  /** sqrt((I + K - E)^2 + 4 E K) */
  root: number;
}

export function morrisonFractions(E: number, I: number, K: number): MorrisonFractions {
  const c = I + K - E;
  const t = 4 * E * K;
  // scaled when c^2 would overflow (a constant switched off at 1e300 in an embedding)
  const root = Math.abs(c) > 1e150 ? Math.abs(c) * Math.sqrt(1 + t / c / c) : Math.sqrt(c * c + t);
  const activity = c >= 0 ? (2 * K) / (c + root) : (root - c) / (2 * E);
  const bound = (2 * I) / (E + I + K + root);
  return { activity, bound, root };
}

/**
 * Derivatives of the activity a = Ef/E: da/dK = bound / root (from implicit differentiation of
 * the quadratic: dEf/dK = (E - Ef)/root), and E da/dE = (Ef + K)/root - a.
 */
export function activityDerivatives(E: number, K: number, f: MorrisonFractions): { dK: number; eDE: number } {
  return { dK: f.bound / f.root, eDE: (f.activity * E + K) / f.root - f.activity };
}
