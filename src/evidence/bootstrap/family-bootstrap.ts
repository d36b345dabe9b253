/**
 * Bootstrap intervals for the called model of another family (tight-binding, partial): the same wild
 * bootstrap as src/evidence/bootstrap/bootstrap.ts (Wu 1986; Liu 1988: v*_k = f_k + e_k r_k / sqrt(1 - h_kk),
 * Rademacher or Mammen multipliers, task k seeded by resampleSeed(seed, k)), generated from and
 * refitted with that model alone (warm-started from its solution, src/evidence/bootstrap/bootstrap-refit.ts),
 * in the calling thread. Percentile intervals (Efron 1987) for every parameter, beta and Et included,
 * and alpha where the model has Ki and Kiu; BCa from n leave-one-out refits.
 *
 * Why apart from the main bootstrap: that one refits the five classic models in worker threads from
 * plain data keyed by mechanism; a family model is one more refit per resample and needs the
 * per-point enzyme covariate, so it runs here.
 */
import type { FitData } from '../../fit/fit-data.js';
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import { hatValues } from '../../fit/hat-values.js';
import { seededRandom } from '../../simulate/random.js';
import { resampleSeed, type WildWeights } from './bootstrap-tasks.js';
import { refitFromStarts } from './bootstrap-refit.js';
import { bcaInterval, percentileInterval } from './bootstrap-intervals.js';

interface FamilyBootstrapIntervals {
  percentile: [number, number] | null;
  bca: [number, number] | null;
}

const MAMMEN_LOW = -(Math.sqrt(5) - 1) / 2;
const MAMMEN_HIGH = (Math.sqrt(5) + 1) / 2;
const MAMMEN_P_LOW = (Math.sqrt(5) + 1) / (2 * Math.sqrt(5));

/** Intervals by parameter name (and 'alpha'), from `resamples` wild resamples of `fit`. */
export function familyBootstrap(
  fit: MechanismFit,
  data: FitData,
  options: { resamples: number; seed: number; weights?: WildWeights; level: number },
): Record<string, FamilyBootstrapIntervals> {
  const { leverage } = hatValues(fit.jacobian, fit.n, fit.p);
  const scaled = fit.residuals.map((r, k) => r / Math.sqrt(Math.max(1e-12, 1 - leverage[k])));
  const names = fit.model.params;
  const ki = names.indexOf('Ki');
  const kiu = names.indexOf('Kiu');
  const quantities: Array<[string, (p: ArrayLike<number>) => number]> = names.map((n, j) => [n, (p) => p[j]]);
  if (ki >= 0 && kiu >= 0) quantities.push(['alpha', (p) => p[kiu] / p[ki]]);
  const reps = quantities.map(() => new Float64Array(options.resamples));
  const v = new Float64Array(fit.n);
  for (let b = 0; b < options.resamples; b++) {
    const rng = seededRandom(resampleSeed(options.seed, b));
    for (let k = 0; k < fit.n; k++) {
      const u = rng.uniform();
      const e = (options.weights ?? 'rademacher') === 'rademacher' ? (u < 0.5 ? -1 : 1) : u < MAMMEN_P_LOW ? MAMMEN_LOW : MAMMEN_HIGH;
      v[k] = fit.fitted[k] + scaled[k] * e;
    }
    const r = refitFromStarts(fit.model, { ...data, v: Float64Array.from(v) }, fit.errorModel, [fit.params]);
    quantities.forEach(([, q], j) => (reps[j][b] = Number.isFinite(r.sse) ? q(r.params) : NaN));
  }
  const jack = quantities.map(() => new Float64Array(fit.n));
  for (let left = 0; left < fit.n; left++) {
    const keep = (xs: Float64Array) => xs.filter((_, k) => k !== left);
    const sub: FitData = { s: keep(data.s), i: keep(data.i), v: keep(data.v), ...(data.sd ? { sd: keep(data.sd) } : {}), ...(data.e ? { e: keep(data.e) } : {}) };
    const r = refitFromStarts(fit.model, sub, fit.errorModel, [fit.params]);
    quantities.forEach(([, q], j) => (jack[j][left] = Number.isFinite(r.sse) ? q(r.params) : NaN));
  }
  const out: Record<string, FamilyBootstrapIntervals> = {};
  quantities.forEach(([name, q], j) => {
    const finite = reps[j].filter(Number.isFinite);
    const estimate = q(fit.params);
    out[name] = {
      percentile: finite.length ? percentileInterval(finite, options.level) : null,
      bca: finite.length ? (bcaInterval(finite, estimate, jack[j].filter(Number.isFinite), options.level)?.interval ?? null) : null,
    };
  });
  return out;
}
