/**
 * Mixed inhibition: v = Vmax*S / (Km*(1 + I/Ki) + S*(1 + I/Kiu)), alpha = Kiu/Ki
 * (Segel 1975, ch. 3; Cornish-Bowden 2012, sec. 6.5). Contains competitive (Kiu -> infinity),
 * uncompetitive (Ki -> infinity) and noncompetitive (Ki = Kiu) as limits.
 */
import type { MechanismModel } from './types.js';
import { inhibitionConstantGuesses, roughScales } from './starting-values.js';

export const mixed: MechanismModel = {
  mechanism: 'mixed',
  label: 'mixed',
  equation: 'v = Vmax·S / (Km·(1 + I/Ki) + S·(1 + I/Kiu))',
  params: ['Vmax', 'Km', 'Ki', 'Kiu'],
  contains: [
    { model: 'none', rules: [{ kind: 'limit', param: 'Ki', to: 'infinity' }, { kind: 'limit', param: 'Kiu', to: 'infinity' }] },
    { model: 'competitive', rules: [{ kind: 'limit', param: 'Kiu', to: 'infinity' }] },
    { model: 'uncompetitive', rules: [{ kind: 'limit', param: 'Ki', to: 'infinity' }] },
    { model: 'noncompetitive', rules: [{ kind: 'equal', param: 'Kiu', sameAs: 'Ki' }] },
  ],
  rate(p, s, i) {
    return (p[0] * s) / (p[1] * (1 + i / p[2]) + s * (1 + i / p[3]));
  },
  gradLog(p, s, i, out, o) {
    const free = p[1] * (1 + i / p[2]);
    const d = free + s * (1 + i / p[3]);
    const v = (p[0] * s) / d;
    out[o] = v;
    out[o + 1] = (-v * free) / d;
    out[o + 2] = (v * p[1] * i) / (p[2] * d);
    out[o + 3] = (v * s * i) / (p[3] * d);
  },
  // one loop per model file, so that each calls its own rate law (inlined; see MechanismModel.rates)
  rates(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) out[k] = mixed.rate(p, s[k], i[k]);
  },
  gradLogs(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) mixed.gradLog(p, s[k], i[k], out, 4 * k);
  },
  starts(data) {
    // three corners of the log grid (both arms alike, each arm dominant); the warm starts from the
    // nested models (src/fit/fit-all-mechanisms.ts) cover the limits
    const r = roughScales(data);
    const [low, mid, high] = inhibitionConstantGuesses(r);
    return [
      [r.vmax, r.km, mid, mid],
      [r.vmax, r.km, low, high],
      [r.vmax, r.km, high, low],
    ];
  },
};
