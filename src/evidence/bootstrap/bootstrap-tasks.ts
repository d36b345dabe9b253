/**
 * The unit of work of the bootstrap: one task is either a wild-bootstrap resample (index < resamples)
 * or a leave-one-out jackknife set (index >= resamples, for the BCa acceleration). Each task refits
 * every model and writes one row: per model its natural-scale parameters followed by its AICc.
 *
 * Everything here is plain data in, plain numbers out, so the same code runs in the calling thread
 * and in worker threads (bootstrap-worker.ts). A task's random numbers come from its own seed,
 * derived from (seed, index) by resampleSeed, never from a shared stream: the result of a task does
 * not depend on which thread ran it or in what order.
 *
 * Wild bootstrap (Wu, C. F. J. (1986) Ann. Stat. 14, 1261-1295; Liu, R. Y. (1988) Ann. Stat. 16,
 * 1696-1708): v*_k = f_k + r~_k * e_k with f_k the fitted rate of the generating model,
 * r~_k = r_k / sqrt(1 - h_kk) its residual scaled by the leverage (so the resampled spread matches
 * the error spread rather than the smaller residual spread), and e_k independent with mean 0 and
 * variance 1: Rademacher (+1 or -1, each with probability 1/2; recommended by Davidson, R. and
 * Flachaire, E. (2008) J. Econometrics 146, 162-169, from memory) or Mammen's two-point
 * distribution (Mammen, E. (1993) Ann. Stat. 21, 255-285), which also matches the third moment.
 * Each point keeps its own residual, so a spread that changes with the rate (heteroscedastic
 * errors) is carried into the resamples without a model for it.
 */
import { modelFor } from '../../models/index.js';
import type { Mechanism } from '../../models/types.js';
import { refitFromStarts, type Refit } from './bootstrap-refit.js';
import type { ErrorModel } from '../../fit/error-models.js';
import { maxInhibitor, type FitData } from '../../fit/fit-data.js';
import { aicc } from '../selection/information-criteria.js';
import { seededRandom } from '../../simulate/random.js';

export type WildWeights = 'rademacher' | 'mammen';

/** Everything a thread needs to run tasks (structured-clone friendly). */
export interface BootstrapPlan {
  s: Float64Array;
  i: Float64Array;
  v: Float64Array;
  sd?: Float64Array;
  errorModel: ErrorModel;
  /** models refitted in each task, in this order */
  mechanisms: Mechanism[];
  /** the original natural-scale solution of each model (warm start of every refit) */
  solutions: Float64Array[];
  /** fitted rates of the generating model */
  fitted: Float64Array;
  /** leverage-scaled residuals of the generating model */
  scaledResiduals: Float64Array;
  weights: WildWeights;
  seed: number;
  resamples: number;
  /** jackknife sets after the resamples (0 to skip) */
  jackknife: number;
}

/** Width of one task row: per model p parameters then AICc. */
export function rowWidth(plan: Pick<BootstrapPlan, 'mechanisms'>): number {
  return plan.mechanisms.reduce((sum, m) => sum + modelFor(m).params.length + 1, 0);
}

/** A 32-bit seed for task `index` of a run seeded with `seed` (an integer hash of the pair). */
export function resampleSeed(seed: number, index: number): number {
  let h = (Math.floor(seed) ^ 0x5bd1e995) >>> 0;
  h = Math.imul(h ^ (h >>> 15), 0x2c1b3c6d) >>> 0;
  h = (h + Math.imul(index + 1, 0x9e3779b9)) >>> 0;
  h = Math.imul(h ^ (h >>> 12), 0x297a2d39) >>> 0;
  h = Math.imul(h ^ (h >>> 15), 0x85ebca6b) >>> 0;
  return (h ^ (h >>> 16)) >>> 0;
}

const MAMMEN_LOW = -(Math.sqrt(5) - 1) / 2;
const MAMMEN_HIGH = (Math.sqrt(5) + 1) / 2;
const MAMMEN_P_LOW = (Math.sqrt(5) + 1) / (2 * Math.sqrt(5));

/** The resampled rates of task `index` (index < resamples). */
export function wildResample(plan: BootstrapPlan, index: number, out: Float64Array): Float64Array {
  const rng = seededRandom(resampleSeed(plan.seed, index));
  for (let k = 0; k < out.length; k++) {
    const u = rng.uniform();
    const e = plan.weights === 'rademacher' ? (u < 0.5 ? -1 : 1) : u < MAMMEN_P_LOW ? MAMMEN_LOW : MAMMEN_HIGH;
    out[k] = plan.fitted[k] + plan.scaledResiduals[k] * e;
  }
  return out;
}

/** A constant far above the tested [I] range, to start an arm switched off (as fit-all-mechanisms does). */
function farConstant(data: FitData): number {
  return 100 * (maxInhibitor(data) || 1);
}

/**
 * Refits every model of the plan to `data` (bootstrap-refit.ts), each from the original solution,
 * and mixed also from the refitted nested models (so mixed is never left worse than a model nested in it).
 */
function refitModels(plan: BootstrapPlan, data: FitData): Refit[] {
  const done = new Map<Mechanism, Refit>();
  const far = farConstant(data);
  return plan.mechanisms.map((mechanism, j) => {
    const model = modelFor(mechanism);
    const starts: number[][] = [Array.from(plan.solutions[j])];
    if (mechanism === 'mixed') {
      const c = done.get('competitive');
      const u = done.get('uncompetitive');
      const nc = done.get('noncompetitive');
      if (c) starts.push([c.params[0], c.params[1], c.params[2], far]);
      if (u) starts.push([u.params[0], u.params[1], far, u.params[2]]);
      if (nc) starts.push([nc.params[0], nc.params[1], nc.params[2], nc.params[2]]);
    }
    const fit = refitFromStarts(model, data, plan.errorModel, starts);
    done.set(mechanism, fit);
    return fit;
  });
}

function taskData(plan: BootstrapPlan, index: number): FitData {
  if (index < plan.resamples) {
    const v = wildResample(plan, index, new Float64Array(plan.v.length));
    return plan.sd ? { s: plan.s, i: plan.i, v, sd: plan.sd } : { s: plan.s, i: plan.i, v };
  }
  const left = index - plan.resamples;
  const keep = (xs: Float64Array) => xs.filter((_, k) => k !== left);
  const data: FitData = { s: keep(plan.s), i: keep(plan.i), v: keep(plan.v) };
  if (plan.sd) data.sd = keep(plan.sd);
  return data;
}

/** Runs task `index` and writes its row into `out` at `offset`. */
export function runTask(plan: BootstrapPlan, index: number, out: Float64Array, offset: number): void {
  const data = taskData(plan, index);
  const fits = refitModels(plan, data);
  let o = offset;
  for (const fit of fits) {
    const ok = Number.isFinite(fit.sse);
    for (let j = 0; j < fit.p; j++) out[o++] = ok ? fit.params[j] : NaN;
    out[o++] = ok ? aicc(fit.logLik, fit.p + 1, fit.n) : NaN;
  }
}

/** Runs tasks [from, to) into rows of `out` (row r at r * rowWidth). */
export function runTasks(plan: BootstrapPlan, from: number, to: number, out: Float64Array, onTaskDone?: () => void): void {
  const width = rowWidth(plan);
  for (let index = from; index < to; index++) {
    runTask(plan, index, out, index * width);
    onTaskDone?.();
  }
}
