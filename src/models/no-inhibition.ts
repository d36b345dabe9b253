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
  starts(data) {
    const r = roughScales(data);
    return [[r.vmax, r.km]];
  },
};
