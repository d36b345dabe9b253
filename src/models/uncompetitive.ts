/**
 * Uncompetitive inhibition: v = Vmax*S / (Km + S*(1 + I/Kiu))
 * (Segel 1975, ch. 3; Cornish-Bowden 2012, sec. 6.3). The inhibitor binds the enzyme-substrate
 * complex only; Kiu is the dissociation constant of ESI.
 */
import type { MechanismModel } from './types.js';
import { singleConstantGuesses, roughScales } from './starting-values.js';

export const uncompetitive: MechanismModel = {
  mechanism: 'uncompetitive',
  label: 'uncompetitive',
  equation: 'v = Vmax·S / (Km + S·(1 + I/Kiu))',
  params: ['Vmax', 'Km', 'Kiu'],
  contains: [{ model: 'none', rules: [{ kind: 'limit', param: 'Kiu', to: 'infinity' }] }],
  rate(p, s, i) {
    return (p[0] * s) / (p[1] + s * (1 + i / p[2]));
  },
  gradLog(p, s, i, out, o) {
    const d = p[1] + s * (1 + i / p[2]);
    const v = (p[0] * s) / d;
    out[o] = v;
    out[o + 1] = (-v * p[1]) / d;
    out[o + 2] = (v * s * i) / (p[2] * d);
  },
  // one loop per model file, so that each calls its own rate law (inlined; see MechanismModel.rates)
  rates(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) out[k] = uncompetitive.rate(p, s[k], i[k]);
  },
  gradLogs(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) uncompetitive.gradLog(p, s[k], i[k], out, 3 * k);
  },
  starts(data) {
    const r = roughScales(data);
    return singleConstantGuesses(r).map((kiu) => [r.vmax, r.km, kiu]);
  },
};
