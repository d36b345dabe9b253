/** The information matrix against an independent numpy computation, and the matrix helpers. */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { competitive, mixed } from '../../src/models/index.js';
import {
  expectedLogStandardErrors,
  fisherInformation,
  inverseSymmetric,
  logDeterminant,
  logDsCriterion,
  subMatrix,
} from '../../src/plan/fisher-information.js';

// produced by test/fixtures/plan-fisher/runner.py (numpy, complex-step derivatives of the rate laws)
const ref = JSON.parse(readFileSync(join(__dirname, '..', 'fixtures', 'plan-fisher', 'reference.json'), 'utf8'));
const MODELS = { competitive, mixed } as const;

describe('Fisher information of a simple design', () => {
  for (const c of ref.matrices) {
    it(`${c.name}: every element agrees with the numpy runner to 1e-9 relative`, () => {
      const model = MODELS[c.model as keyof typeof MODELS];
      const m = model.params.length;
      const info = fisherInformation(model, c.params, ref.design, { model: c.noise, level: c.level });
      const scale = Math.max(...info.map(Math.abs));
      for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) expect(Math.abs(info[a * m + b] - c.information[a][b]) / scale).toBeLessThan(1e-9);
      expect(logDeterminant(info, m)).toBeCloseTo(c.logDet, 8);
      expectedLogStandardErrors(info, m).forEach((se, k) => expect(Math.abs(se / c.logSe[k] - 1)).toBeLessThan(1e-8));
    });
  }
  it('replicates and the noise level scale the information exactly', () => {
    const design = ref.design.map((p: { substrate: number; inhibitor: number }) => ({ ...p, replicates: 1 }));
    const a = fisherInformation(mixed, [10, 8, 0.7, 3], design, { model: 'constant', level: 0.3 });
    const b = fisherInformation(mixed, [10, 8, 0.7, 3], design.map((p: object) => ({ ...p, replicates: 3 })), { model: 'constant', level: 0.6 });
    a.forEach((x, k) => expect(b[k]).toBeCloseTo((x * 3) / 4, 10));
  });
});

describe('matrix helpers', () => {
  const m = 3;
  const a = Float64Array.from([4, 1, 0.5, 1, 3, 0.2, 0.5, 0.2, 2]);
  it('inverse times matrix is the identity', () => {
    const inv = inverseSymmetric(a, m)!;
    for (let r = 0; r < m; r++)
      for (let c = 0; c < m; c++) {
        let s = 0;
        for (let k = 0; k < m; k++) s += a[r * m + k] * inv[k * m + c];
        expect(s).toBeCloseTo(r === c ? 1 : 0, 12);
      }
  });
  it('ln Ds = -ln det of the interest block of the inverse (Atkinson, Donev & Tobias 2007, sec. 10.3)', () => {
    const inv = inverseSymmetric(a, m)!;
    expect(logDsCriterion(a, m, [2])).toBeCloseTo(-Math.log(inv[8]), 12);
    expect(logDsCriterion(a, m, [1, 2])).toBeCloseTo(-logDeterminant(subMatrix(inv, m, [1, 2]), 2), 12);
    expect(logDsCriterion(a, m, [0, 1, 2])).toBeCloseTo(logDeterminant(a, m), 12);
  });
  it('a singular matrix gives -Infinity and no inverse', () => {
    const s = Float64Array.from([1, 2, 2, 4]);
    expect(logDeterminant(s, 2)).toBe(-Infinity);
    expect(inverseSymmetric(s, 2)).toBeNull();
  });
});
