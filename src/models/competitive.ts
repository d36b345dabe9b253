/**
 * Competitive inhibition: v = Vmax*S / (Km*(1 + I/Ki) + S)
 * (Segel 1975, ch. 3; Cornish-Bowden 2012, sec. 6.2). The inhibitor binds free enzyme only.
 */
import type { MechanismModel } from './types.js';
import { singleConstantGuesses, roughScales } from './starting-values.js';

export const competitive: MechanismModel = {
  mechanism: 'competitive',
  label: 'competitive',
  equation: 'v = Vmax·S / (Km·(1 + I/Ki) + S)',
  params: ['Vmax', 'Km', 'Ki'],
  contains: [{ model: 'none', rules: [{ kind: 'limit', param: 'Ki', to: 'infinity' }] }],
  rate(p, s, i) {
    return (p[0] * s) / (p[1] * (1 + i / p[2]) + s);
  },
  gradLog(p, s, i, out, o) {
    const free = p[1] * (1 + i / p[2]);
    const d = free + s;
    const v = (p[0] * s) / d;
    out[o] = v;
    out[o + 1] = (-v * free) / d;
    out[o + 2] = (v * p[1] * i) / (p[2] * d);
  },
  // one loop per model file, so that each calls its own rate law (inlined; see MechanismModel.rates)
  rates(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) out[k] = competitive.rate(p, s[k], i[k]);
  },
  gradLogs(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) competitive.gradLog(p, s[k], i[k], out, 3 * k);
  },
  starts(data) {
    const r = roughScales(data);
    return singleConstantGuesses(r).map((ki) => [r.vmax, r.km, ki]);
  },
};
