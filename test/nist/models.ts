/**
 * The 27 NIST StRD nonlinear regression models with analytic derivatives, and a builder turning a
 * fixture (test/fixtures/nist-strd/<Name>.json, generated from the NIST .dat files) into a
 * LeastSquaresProblem. Model formulas: the "Model:" lines of each NIST file (copied into the
 * fixture's `model` field); derivatives worked out by hand and checked against central differences
 * in test/nist/models.test.ts.
 *
 * Residuals are r_i = f(b, x_i) - y_i, so the Jacobian is df/db. Nelson's model is stated for
 * log(y), so its residuals are f(b, x_i) - log(y_i).
 */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { LeastSquaresProblem } from '../../src/fit/least-squares-problem.js';

/** One observation's predictor: a number, or [x1, x2] for Nelson. */
export type Predictor = number | number[];

export interface NistFixture {
  name: string;
  source: string;
  difficulty: string;
  model: string[];
  parameters: number;
  observations: number;
  starts: [number[], number[]];
  certified: {
    values: number[];
    standardDeviations: number[];
    residualSumOfSquares: number;
    residualStandardDeviation: number;
    degreesOfFreedom: number;
  };
  data: { y: number[]; x: Predictor[] };
}

/** Model value at b for one observation; when `grad` is given it also receives df/db. */
type ModelFunction = (b: Float64Array, x: Predictor, grad: Float64Array | null) => number;

const num = (x: Predictor): number => x as number;

function exponentialRise(b: Float64Array, xp: Predictor, g: Float64Array | null): number {
  const x = num(xp);
  const e = Math.exp(-b[1] * x);
  if (g) {
    g[0] = 1 - e;
    g[1] = b[0] * x * e;
  }
  return b[0] * (1 - e);
}

function chwirut(b: Float64Array, xp: Predictor, g: Float64Array | null): number {
  const x = num(xp);
  const e = Math.exp(-b[0] * x);
  const u = b[1] + b[2] * x;
  if (g) {
    g[0] = (-x * e) / u;
    g[1] = -e / (u * u);
    g[2] = (-x * e) / (u * u);
  }
  return e / u;
}

function gauss(b: Float64Array, xp: Predictor, g: Float64Array | null): number {
  const x = num(xp);
  const e = Math.exp(-b[1] * x);
  const d1 = x - b[3];
  const d2 = x - b[6];
  const g1 = Math.exp(-(d1 * d1) / (b[4] * b[4]));
  const g2 = Math.exp(-(d2 * d2) / (b[7] * b[7]));
  if (g) {
    g[0] = e;
    g[1] = -b[0] * x * e;
    g[2] = g1;
    g[3] = (b[2] * g1 * 2 * d1) / (b[4] * b[4]);
    g[4] = (b[2] * g1 * 2 * d1 * d1) / (b[4] * b[4] * b[4]);
    g[5] = g2;
    g[6] = (b[5] * g2 * 2 * d2) / (b[7] * b[7]);
    g[7] = (b[5] * g2 * 2 * d2 * d2) / (b[7] * b[7] * b[7]);
  }
  return b[0] * e + b[2] * g1 + b[5] * g2;
}

/** (b1 + b2 x + b3 x^2 + b4 x^3) / (1 + b5 x + b6 x^2 + b7 x^3) */
function cubicOverCubic(b: Float64Array, xp: Predictor, g: Float64Array | null): number {
  const x = num(xp);
  const x2 = x * x;
  const x3 = x2 * x;
  const top = b[0] + b[1] * x + b[2] * x2 + b[3] * x3;
  const bottom = 1 + b[4] * x + b[5] * x2 + b[6] * x3;
  const f = top / bottom;
  if (g) {
    g[0] = 1 / bottom;
    g[1] = x / bottom;
    g[2] = x2 / bottom;
    g[3] = x3 / bottom;
    g[4] = (-f * x) / bottom;
    g[5] = (-f * x2) / bottom;
    g[6] = (-f * x3) / bottom;
  }
  return f;
}

function lanczos(b: Float64Array, xp: Predictor, g: Float64Array | null): number {
  const x = num(xp);
  const e1 = Math.exp(-b[1] * x);
  const e2 = Math.exp(-b[3] * x);
  const e3 = Math.exp(-b[5] * x);
  if (g) {
    g[0] = e1;
    g[1] = -b[0] * x * e1;
    g[2] = e2;
    g[3] = -b[2] * x * e2;
    g[4] = e3;
    g[5] = -b[4] * x * e3;
  }
  return b[0] * e1 + b[2] * e2 + b[4] * e3;
}

const MODELS: Record<string, ModelFunction> = {
  Bennett5(b, xp, g) {
    const x = num(xp);
    const u = b[1] + x;
    const p = Math.pow(u, -1 / b[2]);
    if (g) {
      g[0] = p;
      g[1] = (-b[0] * p) / (b[2] * u);
      g[2] = (b[0] * p * Math.log(u)) / (b[2] * b[2]);
    }
    return b[0] * p;
  },
  BoxBOD: exponentialRise,
  Chwirut1: chwirut,
  Chwirut2: chwirut,
  DanWood(b, xp, g) {
    const x = num(xp);
    const p = Math.pow(x, b[1]);
    if (g) {
      g[0] = p;
      g[1] = b[0] * p * Math.log(x);
    }
    return b[0] * p;
  },
  ENSO(b, xp, g) {
    const x = num(xp);
    const a0 = (2 * Math.PI * x) / 12;
    const a1 = (2 * Math.PI * x) / b[3];
    const a2 = (2 * Math.PI * x) / b[6];
    const c0 = Math.cos(a0), s0 = Math.sin(a0);
    const c1 = Math.cos(a1), s1 = Math.sin(a1);
    const c2 = Math.cos(a2), s2 = Math.sin(a2);
    if (g) {
      g[0] = 1;
      g[1] = c0;
      g[2] = s0;
      g[3] = (-b[4] * s1 + b[5] * c1) * (-a1 / b[3]);
      g[4] = c1;
      g[5] = s1;
      g[6] = (-b[7] * s2 + b[8] * c2) * (-a2 / b[6]);
      g[7] = c2;
      g[8] = s2;
    }
    return b[0] + b[1] * c0 + b[2] * s0 + b[4] * c1 + b[5] * s1 + b[7] * c2 + b[8] * s2;
  },
  Eckerle4(b, xp, g) {
    const x = num(xp);
    const z = (x - b[2]) / b[1];
    const e = Math.exp(-0.5 * z * z);
    const f = (b[0] / b[1]) * e;
    if (g) {
      g[0] = e / b[1];
      g[1] = -f / b[1] + (f * z * z) / b[1];
      g[2] = (f * z) / b[1];
    }
    return f;
  },
  Gauss1: gauss,
  Gauss2: gauss,
  Gauss3: gauss,
  Hahn1: cubicOverCubic,
  Kirby2(b, xp, g) {
    const x = num(xp);
    const x2 = x * x;
    const top = b[0] + b[1] * x + b[2] * x2;
    const bottom = 1 + b[3] * x + b[4] * x2;
    const f = top / bottom;
    if (g) {
      g[0] = 1 / bottom;
      g[1] = x / bottom;
      g[2] = x2 / bottom;
      g[3] = (-f * x) / bottom;
      g[4] = (-f * x2) / bottom;
    }
    return f;
  },
  Lanczos1: lanczos,
  Lanczos2: lanczos,
  Lanczos3: lanczos,
  MGH09(b, xp, g) {
    const x = num(xp);
    const top = x * x + x * b[1];
    const bottom = x * x + x * b[2] + b[3];
    const f = (b[0] * top) / bottom;
    if (g) {
      g[0] = top / bottom;
      g[1] = (b[0] * x) / bottom;
      g[2] = (-f * x) / bottom;
      g[3] = -f / bottom;
    }
    return f;
  },
  MGH10(b, xp, g) {
    const x = num(xp);
    const u = x + b[2];
    const e = Math.exp(b[1] / u);
    if (g) {
      g[0] = e;
      g[1] = (b[0] * e) / u;
      g[2] = (-b[0] * e * b[1]) / (u * u);
    }
    return b[0] * e;
  },
  MGH17(b, xp, g) {
    const x = num(xp);
    const e1 = Math.exp(-x * b[3]);
    const e2 = Math.exp(-x * b[4]);
    if (g) {
      g[0] = 1;
      g[1] = e1;
      g[2] = e2;
      g[3] = -b[1] * x * e1;
      g[4] = -b[2] * x * e2;
    }
    return b[0] + b[1] * e1 + b[2] * e2;
  },
  Misra1a: exponentialRise,
  Misra1b(b, xp, g) {
    const x = num(xp);
    const u = 1 + (b[1] * x) / 2;
    if (g) {
      g[0] = 1 - 1 / (u * u);
      g[1] = (b[0] * x) / (u * u * u);
    }
    return b[0] * (1 - 1 / (u * u));
  },
  Misra1c(b, xp, g) {
    const x = num(xp);
    const u = 1 + 2 * b[1] * x;
    const s = Math.sqrt(u);
    if (g) {
      g[0] = 1 - 1 / s;
      g[1] = (b[0] * x) / (u * s);
    }
    return b[0] * (1 - 1 / s);
  },
  Misra1d(b, xp, g) {
    const x = num(xp);
    const u = 1 + b[1] * x;
    if (g) {
      g[0] = (b[1] * x) / u;
      g[1] = (b[0] * x) / (u * u);
    }
    return (b[0] * b[1] * x) / u;
  },
  Nelson(b, xp, g) {
    const [x1, x2] = xp as number[];
    const e = Math.exp(-b[2] * x2);
    if (g) {
      g[0] = 1;
      g[1] = -x1 * e;
      g[2] = b[1] * x1 * x2 * e;
    }
    return b[0] - b[1] * x1 * e;
  },
  Rat42(b, xp, g) {
    const x = num(xp);
    const E = Math.exp(b[1] - b[2] * x);
    const u = 1 + E;
    if (g) {
      g[0] = 1 / u;
      g[1] = (-b[0] * E) / (u * u);
      g[2] = (b[0] * x * E) / (u * u);
    }
    return b[0] / u;
  },
  Rat43(b, xp, g) {
    const x = num(xp);
    const E = Math.exp(b[1] - b[2] * x);
    const u = 1 + E;
    const p = Math.pow(u, -1 / b[3]);
    if (g) {
      g[0] = p;
      g[1] = (-b[0] * p * E) / (b[3] * u);
      g[2] = (b[0] * p * x * E) / (b[3] * u);
      g[3] = (b[0] * p * Math.log(u)) / (b[3] * b[3]);
    }
    return b[0] * p;
  },
  Roszman1(b, xp, g) {
    const x = num(xp);
    const d = x - b[3];
    const v = b[2] / d;
    if (g) {
      const k = 1 / (Math.PI * (1 + v * v));
      g[0] = 1;
      g[1] = -x;
      g[2] = -k / d;
      g[3] = (-k * b[2]) / (d * d);
    }
    return b[0] - b[1] * x - Math.atan(v) / Math.PI;
  },
  Thurber: cubicOverCubic,
};

export const NIST_MODEL_NAMES = Object.keys(MODELS);

const fixtureDir = join(dirname(fileURLToPath(import.meta.url)), '..', 'fixtures', 'nist-strd');

export function loadNistFixture(name: string): NistFixture {
  return JSON.parse(readFileSync(join(fixtureDir, `${name}.json`), 'utf8')) as NistFixture;
}

export function listNistFixtures(): string[] {
  return JSON.parse(readFileSync(join(fixtureDir, 'index.json'), 'utf8')) as string[];
}

/** Model value at b for observation i of the fixture (for finite-difference checks). */
export function modelValue(fixture: NistFixture, b: Float64Array, i: number, grad: Float64Array | null = null): number {
  const f = MODELS[fixture.name];
  if (!f) throw new Error(`no model for NIST problem ${fixture.name}`);
  return f(b, fixture.data.x[i], grad);
}

/** Least-squares problem r_i = f(b, x_i) - y_i (Nelson: - log y_i) with the analytic Jacobian. */
export function nistProblem(fixture: NistFixture): LeastSquaresProblem {
  const f = MODELS[fixture.name];
  if (!f) throw new Error(`no model for NIST problem ${fixture.name}`);
  const n = fixture.observations;
  const m = fixture.parameters;
  const xs = fixture.data.x;
  const targets = Float64Array.from(fixture.data.y, (y) => (fixture.name === 'Nelson' ? Math.log(y) : y));
  const grad = new Float64Array(m);
  return {
    n,
    m,
    residuals(b, r) {
      for (let i = 0; i < n; i++) r[i] = f(b, xs[i], null) - targets[i];
    },
    jacobian(b, J) {
      for (let i = 0; i < n; i++) {
        f(b, xs[i], grad);
        for (let j = 0; j < m; j++) J[i * m + j] = grad[j];
      }
    },
  };
}

/** Log relative error (McCullough 1998): -log10(|est - cert| / |cert|), capped at 11, the number of certified digits. */
export function logRelativeError(estimate: number, certified: number): number {
  if (!Number.isFinite(estimate)) return 0;
  const err = Math.abs(estimate - certified);
  if (err === 0) return 11;
  const lre = -Math.log10(err / Math.abs(certified));
  return Math.max(0, Math.min(11, lre));
}
