/**
 * No inhibition in the tested range: v = Vmax*S / (Km + S)
 * (Michaelis, L. and Menten, M. L. (1913) Biochem. Z. 49, 333-369). Nested in every other model.
 */
import type { MechanismModel } from './types.js';
import { roughScales } from './starting-values.js';

export const noInhibition: MechanismModel = {
  mechanism: 'none',
  label: 'no inhibition',
  equation: 'v = Vmax·S / (Km + S)',
  params: ['Vmax', 'Km'],
  rate(p, s) {
    return (p[0] * s) / (p[1] + s);
  },
  gradLog(p, s, _i, out, o) {
    const d = p[1] + s;
    const v = (p[0] * s) / d;
    out[o] = v;
    out[o + 1] = (-v * p[1]) / d;
  },
  // one loop per model file, so that each calls its own rate law (inlined; see MechanismModel.rates)
  rates(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) out[k] = noInhibition.rate(p, s[k], i[k]);
  },
  gradLogs(p, data, out) {
    const { s, i } = data;
    for (let k = 0; k < s.length; k++) noInhibition.gradLog(p, s[k], i[k], out, 2 * k);
  },
  starts(data) {
    const r = roughScales(data);
    return [[r.vmax, r.km]];
  },
};
