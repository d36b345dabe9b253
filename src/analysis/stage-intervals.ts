/**
 * The intervals stage of an analysis: after the models are fitted and ranked, add
 * - profile-likelihood intervals to every estimate (estimates[].profile) and the curves (profiles);
 * - the joint (Ki, Kiu) region of the mixed model;
 * - derived quantities (pKi, pKiu, IC50 at a chosen [S], apparent Vmax and Km at each [I]) with
 *   Wald, profile (where natural) and bootstrap intervals;
 * - with a bootstrap: percentile and BCa intervals, and how often each mechanism ranks first.
 * The ranked models are not changed: the stage returns new model records, completed, with the
 * bootstrap summary.
 */
import { MECHANISMS } from '../models/index.js';
import { maxInhibitor, type FitData } from '../fit/fit-data.js';
import { valueWithUnit } from '../text/format-number.js';
import type { MechanismFit } from '../fit/fit-mechanism.js';
import { profileAllOfFit, type ParameterProfile } from '../evidence/intervals/profile-likelihood.js';
import { jointRegionKiKiu } from '../evidence/intervals/joint-region.js';
import { runBootstrap, bootstrapIntervalsOf, type BootstrapRun } from '../evidence/bootstrap/bootstrap.js';
import type { WildWeights } from '../evidence/bootstrap/bootstrap-tasks.js';
import {
  deltaMethodSe,
  derivedDefinitions,
  logScaleGradient,
  type DerivedDefinition,
  type DerivedQuantity,
  type DerivedUnits,
} from '../evidence/intervals/derived-quantities.js';
import { waldEstimates, waldInterval } from '../evidence/intervals/wald-estimates.js';
import { detectionBound } from '../evidence/intervals/detection-bound.js';
import { tQuantile } from '../stats/distributions.js';
import type { BootstrapSummary, ModelResult } from './types.js';
import { distinctLevels } from '../input/distinct-levels.js';

/**
 * The parameters whose profile curves the report draws (src/figures/uncertainty-figures.ts): their
 * curves get a point beyond each closed end, so the drawn curve crosses the cutoff.
 */
export const DRAWN_PROFILES = ['Ki', 'Kiu'] as const;

/**
 * The profiles a summary reads (detail 'summary', of the models the verdict can name): the
 * inhibition constants, whose intervals a batch summary row gives and whose lower ends the
 * detection caveat uses; alpha, whose interval the verdict reads; Km, whose interval sets the prior
 * of a follow-up plan (src/plan/follow-up.ts). Vmax is read as a value only: no profile.
 */
export const SUMMARY_PROFILES = ['Km', 'Ki', 'Kiu', 'alpha'] as const;

export interface BootstrapRequest {
  resamples: number;
  seed: number;
  /** threads in all; default 1 */
  workers?: number;
  weights?: WildWeights;
}

interface IntervalOptions {
  level: number;
  /** profile-likelihood intervals and curves; default true */
  profile?: boolean;
  /**
   * 'full' (default): profiles of every parameter of every model, the DRAWN_PROFILES curves
   * completed for the figures (a point beyond each closed end) and the joint (Ki, Kiu) region of
   * mixed. 'summary': profiles only of the models the verdict can name (the best-ranked model, the
   * best three-parameter model, mixed, whose alpha interval the verdict reads, and no inhibition),
   * and of those only SUMMARY_PROFILES; the others keep their Wald intervals; no region. Batch
   * runs without reports use 'summary', so their summary rows equal those of a full analysis.
   */
  detail?: 'full' | 'summary';
  bootstrap?: BootstrapRequest;
  /** [S] at which to give the IC50 */
  atSubstrate?: number;
  onProgress?: (done: number, total: number) => void;
}

/** What the intervals stage returns: the models with their intervals (new records), and the bootstrap. */
interface IntervalStage {
  models: ModelResult[];
  bootstrap?: BootstrapSummary;
}

/**
 * The ranked models completed with intervals, as new records (the input models and their
 * estimates are left as they were), and the bootstrap summary when one was run.
 */
export function addIntervals(ranked: readonly ModelResult[], data: FitData, units: DerivedUnits, options: IntervalOptions): IntervalStage {
  // the records this stage completes: copies of the models and of their estimates
  const models: ModelResult[] = ranked.map((m) => ({ ...m, estimates: m.estimates.map((e) => ({ ...e })) }));
  const level = options.level;
  const usable = (fit: MechanismFit) => Number.isFinite(fit.sse) && fit.df > 0;
  const profiles = new Map<ModelResult, ParameterProfile[]>();
  if (options.profile !== false) {
    const bestThree = models.find((m) => m.p === 3 && m.mechanism !== 'mixed');
    const leading = (m: ModelResult) => m === models[0] || m === bestThree || m.mechanism === 'mixed' || m.mechanism === 'none';
    const summary = options.detail === 'summary';
    for (const model of models) {
      if (!usable(model.fit)) continue;
      if (summary && !leading(model)) continue;
      const found = profileAllOfFit(model.fit, data, summary ? { level, only: SUMMARY_PROFILES } : { level, beyondEnds: DRAWN_PROFILES });
      profiles.set(model, found);
      model.profiles = found.map((p) => p.curve);
      for (const e of model.estimates) {
        const p = found.find((x) => x.name === e.name);
        if (!p) continue;
        e.profile = p.interval;
        // A Wald interval rests on the curvature at the estimate; where the profile shows the
        // likelihood flat to one side (an open end), that curvature says nothing: withhold it.
        if (e.wald && (p.interval[0] === null || p.interval[1] === null)) {
          e.wald = null;
          e.note = `${e.note ? e.note + '; ' : ''}Wald interval withheld: the profile interval is open, so the data do not bound ${e.name} on that side`;
        }
      }
      if (model.mechanism === 'mixed' && !summary) {
        const region = jointRegionKiKiu(model.fit, data, { level });
        if (region) model.jointRegion = region;
      }
    }
  }

  let run: BootstrapRun | undefined;
  if (options.bootstrap) {
    const order = (m: ModelResult) => MECHANISMS.findIndex((x) => x.mechanism === m.mechanism);
    const fits = models.filter((m) => usable(m.fit)).sort((a, b) => order(a) - order(b)).map((m) => m.fit);
    run = runBootstrap(fits, data, {
      resamples: options.bootstrap.resamples,
      seed: options.bootstrap.seed,
      workers: options.bootstrap.workers,
      weights: options.bootstrap.weights,
      onProgress: options.onProgress,
    });
    for (const model of models) addBootstrapToEstimates(model, run, level);
  }

  const levels = distinctLevels(data.i);
  const maxI = maxInhibitor(data);
  for (const model of models) {
    if (!usable(model.fit)) continue;
    const { definitions, skipped } = derivedDefinitions(model.fit.model, levels, units, options.atSubstrate);
    const waldBasis: WaldBasis = {
      logCovariance: waldEstimates(model.fit, maxI, level).logCovariance,
      t: tQuantile(1 - (1 - level) / 2, model.fit.df),
    };
    const derived = definitions.map((d) => derivedQuantity(model, d, profiles.get(model), run, level, maxI, waldBasis, units.inhibitor));
    model.derived = [
      ...derived,
      ...skipped.map((note): DerivedQuantity => ({ name: note.startsWith('pKiu') ? 'pKiu' : 'pKi', unit: null, value: null, se: null, wald: null, note })),
    ];
  }

  if (!run) return { models };
  return {
    models,
    bootstrap: {
      resamples: run.resamples,
      seed: run.seed,
      scheme: `wild (${run.weights}), leverage-scaled residuals of ${run.generatingModel}`,
      weights: run.weights,
      generatingModel: run.generatingModel,
      selection: run.selection,
      failures: run.failures,
    },
  };
}

function addBootstrapToEstimates(model: ModelResult, run: BootstrapRun, level: number): void {
  const names = model.fit.model.params;
  for (const e of model.estimates) {
    if (!e.detected || e.value === null) continue;
    const value = e.value;
    const quantity =
      e.name === 'alpha'
        ? (p: Float64Array) => p[names.indexOf('Kiu')] / p[names.indexOf('Ki')]
        : ((j: number) => (p: Float64Array) => p[j])(names.indexOf(e.name));
    const b = bootstrapIntervalsOf(run, model.mechanism, quantity, value, level);
    if (b.percentile) e.bootstrapPercentile = b.percentile;
    if (b.bca) e.bootstrapBca = b.bca;
  }
}

/** What every Wald interval of one model's derived quantities shares. */
interface WaldBasis {
  /** covariance of theta = ln p */
  logCovariance: Float64Array;
  /** two-sided t quantile at the interval level, with the fit's residual df */
  t: number;
}

function derivedQuantity(
  model: ModelResult,
  d: DerivedDefinition,
  profiles: ParameterProfile[] | undefined,
  run: BootstrapRun | undefined,
  level: number,
  maxI: number,
  wald: WaldBasis,
  inhibitorUnit: string | null,
): DerivedQuantity {
  const fit = model.fit;
  const base: DerivedQuantity = {
    name: d.name,
    ...(d.inhibitor !== undefined ? { inhibitor: d.inhibitor } : {}),
    ...(d.substrate !== undefined ? { substrate: d.substrate } : {}),
    unit: d.unit,
    value: null,
    se: null,
    wald: null,
  };
  const profile = d.ofParameter ? profiles?.find((p) => p.name === d.ofParameter!.name) : undefined;
  if (profile && d.ofParameter) {
    // a decreasing map: the upper end of the constant gives the lower end of pK
    const [lo, hi] = profile.interval;
    base.profile = [hi === null ? null : d.ofParameter.map(hi), lo === null ? null : d.ofParameter.map(lo)];
  }
  const undetected = d.needs.filter((name) => model.estimates.find((e) => e.name === name)?.detected === false);
  if (undetected.length) {
    base.note = `${undetected.join(' and ')} not detected in the tested [I] range, so ${d.name} is not determined`;
    return base;
  }
  const value = d.evaluate(fit.params);
  if (d.name === 'IC50' && !(value <= detectionBound(maxI))) {
    base.note = `the IC50 lies beyond ${valueWithUnit(String(detectionBound(maxI)), inhibitorUnit)} (100 x the highest [I]): not reached in the tested range`;
    return base;
  }
  base.value = value;
  const se = deltaMethodSe(logScaleGradient(d.evaluate, fit.theta), wald.logCovariance, value);
  if (Number.isFinite(se)) {
    base.se = se;
    // pK values are logarithms already (any sign); the other derived quantities are positive
    base.wald = waldInterval(value, se, wald.t, !d.ofParameter);
  }
  if (run) {
    const b = bootstrapIntervalsOf(run, model.mechanism, (p) => d.evaluate(p), value, level);
    if (b.percentile) base.bootstrapPercentile = b.percentile;
    if (b.bca) base.bootstrapBca = b.bca;
  }
  return base;
}
