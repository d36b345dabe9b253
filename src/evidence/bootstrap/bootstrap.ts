/**
 * The bootstrap of one analysis: B wild-bootstrap resamples of the rates, every model refitted to
 * each (bootstrap-tasks.ts), plus n leave-one-out refits for the BCa acceleration.
 *
 * The resamples are built from the encompassing model of the set (the one with most parameters,
 * mixed when all five are fitted): every other model is nested in it, so its fitted values and
 * residuals describe the data whichever mechanism holds, and resampling from it does not build the
 * answer of the mechanism choice into the resamples. From the same resamples come the replicate
 * estimates of every model and how often each model ranks first by AICc (the selection frequency).
 */
import type { Mechanism } from '../../models/types.js';
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import type { FitData } from '../../fit/fit-data.js';
import { hatValues } from '../../fit/hat-values.js';
import { bcaInterval, percentileInterval } from './bootstrap-intervals.js';
import { rowWidth, type BootstrapPlan, type WildWeights } from './bootstrap-tasks.js';
import { runBootstrapTasks } from './bootstrap-threads.js';

interface BootstrapOptions {
  resamples: number;
  seed: number;
  /** threads in all (1 = the calling thread only); default 1 */
  workers?: number;
  /** wild-bootstrap multipliers; default 'rademacher' */
  weights?: WildWeights;
  /** leave-one-out refits for the BCa acceleration; default true */
  jackknife?: boolean;
  onProgress?: (done: number, total: number) => void;
}

export interface BootstrapRun {
  resamples: number;
  seed: number;
  weights: WildWeights;
  /** the model whose fitted values and residuals generated the resamples */
  generatingModel: Mechanism;
  mechanisms: Mechanism[];
  /** per model, per parameter: the value in each resample (NaN where the refit failed) */
  replicates: Map<Mechanism, Float64Array[]>;
  /** per model, per parameter: the leave-one-out estimates (empty without jackknife) */
  jackknife: Map<Mechanism, Float64Array[]>;
  /** per model: share of resamples in which it ranked first by AICc */
  selection: Record<string, number>;
  /** per model: resamples whose refit failed */
  failures: Record<string, number>;
}

/** The model that generates the resamples: the one with most parameters (the lower SSE on a tie). */
function generatingFit(fits: readonly MechanismFit[]): MechanismFit {
  let best = fits[0];
  for (const f of fits) if (f.p > best.p || (f.p === best.p && f.sse < best.sse)) best = f;
  return best;
}

/** Residuals scaled by 1 / sqrt(1 - h_kk) (leverage of the weighted Jacobian). */
function leverageScaledResiduals(fit: MechanismFit): Float64Array {
  const { leverage } = hatValues(fit.jacobian, fit.n, fit.p);
  return fit.residuals.map((r, k) => r / Math.sqrt(Math.max(1e-12, 1 - leverage[k])));
}

export function bootstrapPlan(fits: readonly MechanismFit[], data: FitData, options: BootstrapOptions): BootstrapPlan {
  if (!(Number.isInteger(options.resamples) && options.resamples >= 1)) throw new RangeError('bootstrap: resamples must be a positive integer');
  const generator = generatingFit(fits);
  const plan: BootstrapPlan = {
    s: data.s,
    i: data.i,
    v: data.v,
    errorModel: generator.errorModel,
    mechanisms: fits.map((f) => f.mechanism),
    solutions: fits.map((f) => Float64Array.from(f.params)),
    fitted: Float64Array.from(generator.fitted),
    scaledResiduals: leverageScaledResiduals(generator),
    weights: options.weights ?? 'rademacher',
    seed: options.seed,
    resamples: options.resamples,
    jackknife: options.jackknife === false ? 0 : data.v.length,
  };
  if (data.sd) plan.sd = data.sd;
  return plan;
}

export function runBootstrap(fits: readonly MechanismFit[], data: FitData, options: BootstrapOptions): BootstrapRun {
  const plan = bootstrapPlan(fits, data, options);
  const total = plan.resamples + plan.jackknife;
  const rows = runBootstrapTasks(plan, total, Math.max(1, Math.floor(options.workers ?? 1)), options.onProgress);
  return collectRows(plan, rows, generatingFit(fits).mechanism);
}

function collectRows(plan: BootstrapPlan, rows: Float64Array, generatingModel: Mechanism): BootstrapRun {
  const width = rowWidth(plan);
  const B = plan.resamples;
  const replicates = new Map<Mechanism, Float64Array[]>();
  const jackknife = new Map<Mechanism, Float64Array[]>();
  const failures: Record<string, number> = {};
  const wins: Record<string, number> = {};
  let offset = 0;
  const aiccOffsets: number[] = [];
  plan.mechanisms.forEach((mechanism, j) => {
    const p = plan.solutions[j].length;
    const reps = Array.from({ length: p }, (_, q) => Float64Array.from({ length: B }, (_, b) => rows[b * width + offset + q]));
    const jack = Array.from({ length: p }, (_, q) =>
      Float64Array.from({ length: plan.jackknife }, (_, k) => rows[(B + k) * width + offset + q]),
    );
    replicates.set(mechanism, reps);
    jackknife.set(mechanism, jack);
    failures[mechanism] = reps[0].filter((x) => !Number.isFinite(x)).length;
    wins[mechanism] = 0;
    aiccOffsets.push(offset + p);
    offset += p + 1;
  });
  for (let b = 0; b < B; b++) {
    let best = -1;
    let bestValue = Infinity;
    aiccOffsets.forEach((o, j) => {
      const value = rows[b * width + o];
      if (value < bestValue) {
        bestValue = value;
        best = j;
      }
    });
    if (best >= 0) wins[plan.mechanisms[best]]++;
  }
  const selection: Record<string, number> = {};
  for (const m of plan.mechanisms) selection[m] = wins[m] / B;
  return { resamples: B, seed: plan.seed, weights: plan.weights, generatingModel, mechanisms: plan.mechanisms, replicates, jackknife, selection, failures };
}

interface BootstrapIntervals {
  percentile: [number, number] | null;
  bca: [number, number] | null;
}

/**
 * Percentile and BCa intervals of any function of one model's parameters (a parameter itself, alpha,
 * or a derived quantity), from the replicate parameter vectors of the run.
 */
export function bootstrapIntervalsOf(
  run: BootstrapRun,
  mechanism: Mechanism,
  quantity: (params: Float64Array) => number,
  estimate: number,
  level: number,
): BootstrapIntervals {
  const reps = run.replicates.get(mechanism);
  const jack = run.jackknife.get(mechanism);
  if (!reps || !jack) return { percentile: null, bca: null };
  const values = applyToRows(reps, quantity);
  const jackValues = applyToRows(jack, quantity);
  return {
    percentile: percentileInterval(values, level),
    bca: jackValues.length > 0 ? (bcaInterval(values, estimate, jackValues, level)?.interval ?? null) : null,
  };
}

function applyToRows(columns: Float64Array[], quantity: (params: Float64Array) => number): Float64Array {
  const count = columns[0]?.length ?? 0;
  const p = new Float64Array(columns.length);
  const out = new Float64Array(count);
  for (let b = 0; b < count; b++) {
    for (let q = 0; q < columns.length; q++) p[q] = columns[q][b];
    out[b] = quantity(p);
  }
  return out;
}
