/**
 * The optional batch methods of a model (MechanismModel.rates, gradLogs) must give exactly the
 * numbers of `rate` and `gradLog` point by point: the fit uses them in its inner loop, and an
 * analysis must not change by a bit when they are used (docs/decisions/analysis-cost.md).
 */
import { describe, expect, it } from 'vitest';
import { MECHANISMS } from '../../src/models/index.js';
import { weightedProblem, parameterLogScales } from '../../src/fit/fit-mechanism.js';
import { fitDataFromArrays } from '../../src/fit/fit-data.js';
import type { MechanismModel } from '../../src/models/types.js';

// invented design: 7 [S] x 4 [I], with zero [I] and extreme ratios
const s: number[] = [];
const i: number[] = [];
for (const sv of [0.01, 0.3, 2, 15, 40, 900, 1e5]) for (const iv of [0, 0.05, 3, 2e4]) {
  s.push(sv);
  i.push(iv);
}
const v = s.map((x, k) => 10 + k);
const data = fitDataFromArrays(s, i, v);
const trials = [
  [12.5, 3.2, 2.1, 9.7],
  [1e-3, 1e4, 1e-6, 1e8],
  [7e5, 0.02, 3e9, 0.4],
];

/** The point-by-point loop the batch methods replace. */
function pointByPoint(model: MechanismModel, p: Float64Array): { f: Float64Array; g: Float64Array } {
  const m = model.params.length;
  const f = new Float64Array(s.length);
  const g = new Float64Array(s.length * m);
  for (let k = 0; k < s.length; k++) {
    f[k] = model.rate(p, data.s[k], data.i[k]);
    model.gradLog(p, data.s[k], data.i[k], g, k * m);
  }
  return { f, g };
}

describe('batch rate and gradient loops of the classic models', () => {
  for (const model of MECHANISMS) {
    it(`${model.label}: rates and gradLogs equal rate and gradLog bit for bit`, () => {
      expect(model.rates).toBeTypeOf('function');
      expect(model.gradLogs).toBeTypeOf('function');
      for (const t of trials) {
        const p = Float64Array.from(t.slice(0, model.params.length));
        const want = pointByPoint(model, p);
        const f = new Float64Array(s.length);
        const g = new Float64Array(s.length * model.params.length);
        model.rates!(p, data, f);
        model.gradLogs!(p, data, g);
        expect(Array.from(f)).toEqual(Array.from(want.f));
        expect(Array.from(g)).toEqual(Array.from(want.g));
      }
    });
  }

  it('the weighted problem gives the same residuals and Jacobian with and without them', () => {
    for (const model of MECHANISMS) {
      const m = model.params.length;
      const plain: MechanismModel = { ...model, rates: undefined, gradLogs: undefined };
      const sqrtW = Float64Array.from(s, (_, k) => 0.5 + k / 10);
      const scales = parameterLogScales(model, data);
      const a = weightedProblem(model, data, sqrtW, scales);
      const b = weightedProblem(plain, data, sqrtW, scales);
      for (const t of trials) {
        const x = Float64Array.from(t.slice(0, m), Math.log);
        const ra = new Float64Array(s.length);
        const rb = new Float64Array(s.length);
        expect(a.residuals(x, ra)).toBe(b.residuals(x, rb));
        expect(Array.from(ra)).toEqual(Array.from(rb));
        const ja = new Float64Array(s.length * m);
        const jb = new Float64Array(s.length * m);
        a.jacobian(x, ja);
        b.jacobian(x, jb);
        expect(Array.from(ja)).toEqual(Array.from(jb));
      }
    }
  });
});
