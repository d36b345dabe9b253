#!/usr/bin/env node
/**
 * Speed of the least-squares engine on a problem of the size the project fits all the time:
 * 120 rates (8 substrate x 5 inhibitor concentrations x 3 replicates), 4 log-scale parameters of
 * the mixed inhibition model v = V S / (Km (1 + I/Ki) + S (1 + I/Ku)), analytic Jacobian.
 * The data are INVENTED for this benchmark (true V = 100, Km = 2, Ki = 1, Ku = 4, 3 % normal
 * multiplicative noise from a seeded generator).
 *
 * Also times one QR factorisation of the 120 x 4 Jacobian (plus the solve for the Gauss-Newton
 * step) with the engine's hand-written pivoted Householder QR (src/fit/qr.ts) against ml-matrix's
 * QrDecomposition, and the whole fit with ml-levenberg-marquardt (analytic Jacobian) for scale.
 *
 *   node bench/nist-engine-speed.mjs
 *
 * Speed targets live here, not in timed tests (project rule). Target: one 120 x 4 fit well under 1 ms.
 */
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Matrix, QrDecomposition } from 'ml-matrix';
import { levenbergMarquardt as mlLevenbergMarquardt } from 'ml-levenberg-marquardt';
import { loadCompiledNistHelpers } from '../scripts/nist-compile.mjs';

const { out } = await loadCompiledNistHelpers();
const { levenbergMarquardt } = await import(pathToFileURL(join(out, 'src', 'fit', 'levenberg-marquardt.js')).href);
const { householderQrPivoted, applyQTranspose } = await import(pathToFileURL(join(out, 'src', 'fit', 'qr.js')).href);

/** Seeded uniform generator (mulberry32, a common-practice 32-bit mixer) and Box-Muller normals. */
function seededNormal(seed) {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

const normal = seededNormal(20240607);
const S = [];
const I = [];
const y = [];
const truth = { V: 100, Km: 2, Ki: 1, Ku: 4 };
for (const inh of [0, 0.5, 1, 2, 4]) {
  for (const sub of [0.25, 0.5, 1, 2, 4, 8, 16, 32]) {
    for (let rep = 0; rep < 3; rep++) {
      const v = (truth.V * sub) / (truth.Km * (1 + inh / truth.Ki) + sub * (1 + inh / truth.Ku));
      S.push(sub);
      I.push(inh);
      y.push(v * (1 + 0.03 * normal()));
    }
  }
}
const n = y.length;

/** Mixed-inhibition rate at row i with V, Km, Ki, Ku already on the natural scale. */
function rateAt(V, Km, Ki, Ku, i) {
  const a = Km * (1 + I[i] / Ki);
  const d = a + S[i] * (1 + I[i] / Ku);
  return (V * S[i]) / d;
}

const problem = {
  n,
  m: 4,
  residuals(theta, r) {
    const V = Math.exp(theta[0]), Km = Math.exp(theta[1]), Ki = Math.exp(theta[2]), Ku = Math.exp(theta[3]);
    for (let i = 0; i < n; i++) r[i] = rateAt(V, Km, Ki, Ku, i) - y[i];
  },
  jacobian(theta, J) {
    const V = Math.exp(theta[0]), Km = Math.exp(theta[1]), Ki = Math.exp(theta[2]), Ku = Math.exp(theta[3]);
    for (let i = 0; i < n; i++) {
      const a = Km * (1 + I[i] / Ki);
      const d = a + S[i] * (1 + I[i] / Ku);
      const v = (V * S[i]) / d;
      J[4 * i] = v;
      J[4 * i + 1] = (-v * a) / d;
      J[4 * i + 2] = (v * Km * I[i]) / Ki / d;
      J[4 * i + 3] = (v * S[i] * I[i]) / Ku / d;
    }
  },
};
const start = [Math.log(60), Math.log(5), Math.log(3), Math.log(1.5)];

function timePerCall(fn, reps) {
  for (let k = 0; k < Math.min(reps, 200); k++) fn();
  const batches = [];
  for (let b = 0; b < 7; b++) {
    const t0 = process.hrtime.bigint();
    for (let k = 0; k < reps; k++) fn();
    batches.push(Number(process.hrtime.bigint() - t0) / 1e6 / reps);
  }
  batches.sort((u, v) => u - v);
  return batches[3];
}

const fit = levenbergMarquardt(problem, start);
const msPerFit = timePerCall(() => levenbergMarquardt(problem, start), 500);
// The model's own share: the same number of residual and Jacobian evaluations (+1 Jacobian at the end).
const thetaHat = Float64Array.from(fit.x);
const rScratch = new Float64Array(n);
const jScratch = new Float64Array(n * 4);
const msModel = timePerCall(() => {
  for (let k = 0; k < fit.evaluations; k++) problem.residuals(thetaHat, rScratch);
  for (let k = 0; k <= fit.iterations; k++) problem.jacobian(thetaHat, jScratch);
}, 500);

// One factorisation + Gauss-Newton solve of the 120 x 4 Jacobian at the start.
const Jrow = new Float64Array(n * 4);
problem.jacobian(Float64Array.from(start), Jrow);
const r0 = new Float64Array(n);
problem.residuals(Float64Array.from(start), r0);
const colMajor = new Float64Array(n * 4);
const pivot = new Int32Array(4);
const rdiag = new Float64Array(4);
const norms = new Float64Array(4);
const work = new Float64Array(4);
const qtb = new Float64Array(n);
const step = new Float64Array(4);
const ownQr = () => {
  for (let i = 0; i < n; i++) for (let j = 0; j < 4; j++) colMajor[j * n + i] = Jrow[i * 4 + j];
  householderQrPivoted(colMajor, n, 4, pivot, rdiag, norms, work);
  qtb.set(r0);
  applyQTranspose(colMajor, n, 4, qtb);
  for (let j = 3; j >= 0; j--) {
    let sum = qtb[j];
    for (let k = j + 1; k < 4; k++) sum -= colMajor[k * n + j] * step[k];
    step[j] = sum / rdiag[j];
  }
};
const rows = Array.from({ length: n }, (_, i) => Array.from(Jrow.subarray(4 * i, 4 * i + 4)));
const mlQr = () => {
  const qr = new QrDecomposition(new Matrix(rows));
  qr.solve(Matrix.columnVector(Array.from(r0)));
};
const msOwnQr = timePerCall(ownQr, 20000);
const msMlQr = timePerCall(mlQr, 2000);

// ml-levenberg-marquardt on the same fit (it is parameterised by the model, not the residuals).
const index = Array.from({ length: n }, (_, i) => i);
const mlOptions = {
  initialValues: start,
  maxIterations: 1000,
  errorTolerance: 0,
  jacobianFunction: (theta) => {
    const J = new Float64Array(4 * n);
    problem.jacobian(Float64Array.from(theta), J);
    return (i) => Array.from(J.subarray(4 * i, 4 * i + 4));
  },
};
const mlModel = (theta) => {
  const V = Math.exp(theta[0]), Km = Math.exp(theta[1]), Ki = Math.exp(theta[2]), Ku = Math.exp(theta[3]);
  return (i) => rateAt(V, Km, Ki, Ku, i);
};
const mlFit = mlLevenbergMarquardt({ x: index, y }, mlModel, mlOptions);
const msMlFit = timePerCall(() => mlLevenbergMarquardt({ x: index, y }, mlModel, mlOptions), 5);

console.log(`problem: ${n} x 4 mixed inhibition, log parameters (invented data)`);
console.log(`engine: ${fit.status}, SSE ${fit.sse.toPrecision(10)}, ${fit.iterations} Jacobians, ${fit.evaluations} residual evaluations`);
console.log(`engine: ${(msPerFit * 1000).toFixed(1)} us per fit (median of 7 batches of 500)`);
console.log(`of which the model's residuals and Jacobians: ${(msModel * 1000).toFixed(1)} us`);
console.log(`one QR + Gauss-Newton solve, hand-written pivoted Householder: ${(msOwnQr * 1000).toFixed(2)} us`);
console.log(`one QR + solve, ml-matrix QrDecomposition (incl. Matrix construction): ${(msMlQr * 1000).toFixed(2)} us`);
console.log(`ml-levenberg-marquardt (analytic Jacobian, maxIterations 1000, errorTolerance 0): SSE ${mlFit.parameterError.toPrecision(10)}, ${mlFit.iterations} iterations, ${msMlFit.toFixed(2)} ms per fit`);
