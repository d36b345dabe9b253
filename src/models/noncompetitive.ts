/**
 * Pure noncompetitive inhibition: v = Vmax*S / ((Km + S)*(1 + I/Ki))
 * (Segel 1975, ch. 3; Cornish-Bowden 2012, sec. 6.4). Mixed inhibition with Ki = Kiu (alpha = 1).
 */
import type { MechanismModel } from './types.js';
import { singleConstantGuesses, roughScales } from './starting-values.js';

export const noncompetitive: MechanismModel = {
  mechanism: 'noncompetitive',
  label: 'noncompetitive',
  equation: 'v = Vmax·S / ((Km + S)·(1 + I/Ki))',
  params: ['Vmax', 'Km', 'Ki'],
  contains: [{ model: 'none', rules: [{ kind: 'limit', param: 'Ki', to: 'infinity' }] }],
  rate(p, s, i) {
    return (p[0] * s) / ((p[1] + s) * (1 + i / p[2]));
  },
  gradLog(p, s, i, out, o) {
    const ratio = i / p[2];
    const v = (p[0] * s) / ((p[1] + s) * (1 + ratio));
    out[o] = v;
    out[o + 1] = (-v * p[1]) / (p[1] + s);
    out[o + 2] = (v * ratio) / (1 + ratio);
  },
  // one loop per model file, so that each calls its own rate law (inlined; see MechanismModel.rates)
  rates(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) out[k] = noncompetitive.rate(p, s[k], i[k]);
  },
  gradLogs(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) noncompetitive.gradLog(p, s[k], i[k], out, 3 * k);
  },
  starts(data) {
    const r = roughScales(data);
    return singleConstantGuesses(r).map((ki) => [r.vmax, r.km, ki]);
  },
};
