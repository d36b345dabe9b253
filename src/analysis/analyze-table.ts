/**
 * The analysis of one rate table: fit all mechanisms globally, rank them, estimate parameters with
 * intervals, compare nested models, check residuals, error model and design, and reach a verdict.
 * The CLI, the report and the batch runner are thin layers over this function.
 */
import { MECHANISMS } from '../models/index.js';
import type { Mechanism, MechanismModel } from '../models/types.js';
import { fitAllMechanisms } from '../fit/fit-all-mechanisms.js';
import type { MechanismFit } from '../fit/fit-mechanism.js';
import { fitDataFromTable, maxInhibitor, maxSubstrate, type FitData } from '../fit/fit-data.js';
import type { ErrorModel } from '../fit/error-models.js';
import type { RateTable } from '../input/types.js';
import { LARGEST_MAGNITUDE, MINIMUM_ANALYSIS_POINTS, SMALLEST_MAGNITUDE, outsideFittableRange } from '../input/table-checks.js';
import { aicc, akaikeWeights, bic, deltas } from '../evidence/selection/information-criteria.js';
import { waldEstimates, type DataSpan, type ParameterEstimate } from '../evidence/intervals/wald-estimates.js';
import { nestedComparisons, type NestedComparison } from '../evidence/selection/nested-comparisons.js';
import { addIntervals, type BootstrapRequest } from './stage-intervals.js';
import { decideVerdict, type Caveat, type ExactFitEvidence, type Verdict } from '../evidence/verdict/verdict.js';
import { candidateErrorModels, checkErrorModel } from '../evidence/diagnostics/error-model-check.js';
import { robustRefit } from '../evidence/diagnostics/robust-refit.js';
import { caveatsFor, errorModelCaveat, runDiagnostics } from './stage-diagnostics.js';
import { largeResidualPoints } from '../evidence/diagnostics/standing-out.js';
import { inhibitorReach } from '../evidence/checks/detection-limit.js';
import type { VerdictReason } from '../evidence/verdict/verdict-findings.js';
import { noActivityFinding } from '../evidence/checks/activity-check.js';
import { exactFits } from '../evidence/checks/exact-fit.js';
import { activationCaveat, saturatingInhibitorCaveat, substrateInhibitionCaveat } from '../evidence/checks/rate-pattern-checks.js';
import { plausibilityCaveats } from '../evidence/checks/plausibility-check.js';
import { alphaExclusions, type AlphaExclusions } from '../evidence/selection/alpha-exclusion.js';
import type { AnalysisResult, ModelResult, RobustSummary } from './types.js';
import { runFamilies, type FamilyRequest } from './stage-families.js';
import { familyCallFor } from './family-call.js';

export interface AnalysisOptions {
  /** error model, or 'auto' (the default) to choose by likelihood among those the rates allow */
  errorModel?: ErrorModel | 'auto';
  /** with 'auto': choose only among these (of those the rates allow); default all of them */
  autoAmong?: readonly ErrorModel[];
  /** confidence level for intervals; default 0.95 */
  level?: number;
  /** mechanisms to compare; default all five */
  models?: readonly MechanismModel[];
  /** add a bounded-influence (bisquare) refit and say whether the call depends on a few points */
  robust?: boolean;
  /** profile-likelihood intervals, curves and the joint (Ki, Kiu) region; default true */
  profile?: boolean;
  /**
   * 'full' (default): profiles for every model and the joint (Ki, Kiu) region for the figures;
   * 'summary': profiles only of Km, the inhibition constants and alpha, and only for the models the
   * verdict can name, residual checks only for the winner, no joint region (what a batch summary
   * needs; the verdict and the constants of the named mechanism are the same as with 'full')
   */
  detail?: 'full' | 'summary';
  /** wild bootstrap: resamples, seed and threads in all (see src/analysis/stage-intervals.ts) */
  bootstrap?: BootstrapRequest;
  /** [S] at which to report the IC50 (Cheng-Prusoff) */
  atSubstrate?: number;
  /** progress of long stages (the bootstrap): tasks done of total */
  onProgress?: (done: number, total: number) => void;
  /** [E]t for the tight-binding family (a concentration, or 'fit'); an `enzyme` column is read without it */
  enzyme?: FamilyRequest['enzyme'];
  /** also fit the partial (hyperbolic) family */
  partial?: boolean;
}

/** Thrown when the analysis cannot be completed (CLI exit code 1). */
export class AnalysisError extends Error {
  readonly exitCode = 1;
  constructor(message: string) {
    super(message);
    this.name = 'AnalysisError';
  }
}

export function analyzeTable(table: RateTable, options: AnalysisOptions = {}): AnalysisResult {
  const level = options.level ?? 0.95;
  if (!(level > 0 && level < 1)) throw new AnalysisError(`confidence level must lie between 0 and 1 (got ${level})`);
  const data = fitDataFromTable(table);
  if (data.v.length < MINIMUM_ANALYSIS_POINTS)
    throw new AnalysisError(
      `only ${data.v.length} usable points; ranking all five models by AICc needs at least ${MINIMUM_ANALYSIS_POINTS} (the mixed model has 4 constants plus the error variance); add rates`,
    );
  checkMagnitudes(table);
  const inactive = noActivityFinding(data);
  if (inactive) throw new AnalysisError(inactive.message);
  const mechanisms = options.models ?? MECHANISMS;
  const requested = options.errorModel ?? 'auto';
  checkErrorModelApplies(requested, data);

  const choice = chooseErrorModel(requested, data, mechanisms, options.autoAmong);
  const errorModel = choice.errorModel;
  const fits = choice.fits;
  const { models, bootstrap } = addIntervals(rankModels(fits, data, level), data, table.units, {
    level,
    profile: options.profile,
    detail: options.detail,
    bootstrap: options.bootstrap,
    atSubstrate: options.atSubstrate,
    onProgress: options.onProgress,
  });
  const nested = nestedComparisons(fits);
  const exclusions = once(() => exclusionsOf(models, data));
  const exact = exactFits(fits, data.v);
  const evidence: VerdictEvidence = { exclusions, exactFits: exact, alphaEstimate: mixedAlpha(models) };

  // Verdict in two passes: a preliminary call names the model whose diagnostics matter.
  const preliminary = verdictFrom(models, nested, [], evidence);
  const winner = models.find((m) => m.mechanism === preliminary.mechanism) ?? models[0];
  const diagnostics = runDiagnostics(models, data, errorModel, winner, options.detail === 'summary');
  // The robust refit runs on request, and by itself whenever a point stands out (a studentised
  // residual beyond the suspect cut-off), so that one bad well cannot flip the call unnoticed.
  // Without noise the residual checks describe rounding only: only the design caveats are given.
  const noiseFree = exact.length > 0;
  const robustRuns = Boolean(options.robust) || (!noiseFree && largeResidualPoints(diagnostics.residuals[winner.mechanism]).length > 0);
  const caveats: Caveat[] = caveatsFor(winner, diagnostics, data, { noiseFree, robustRefitRuns: robustRuns });
  caveats.push(...patternCaveats(models, winner, data, table));

  const emCheck = winner.fit.df > 0 ? checkErrorModel(winner.fit, data) : null;
  // Under 'auto' the error model was already chosen by likelihood; the check is kept for the record.
  if (emCheck?.clearlyWorse && !choice.automatic) {
    const alternative = fitAllMechanisms(data, emCheck.best, mechanisms);
    const altModels = rankModels(alternative, data, level);
    const altCall = verdictFrom(altModels, nestedComparisons(alternative), []).mechanism;
    const caveat = errorModelCaveat(emCheck, altCall !== preliminary.mechanism ? altCall : null);
    if (caveat) caveats.push(caveat);
  }

  const robust = robustRuns ? robustSummary(data, errorModel, models, level, table, preliminary) : undefined;
  if (robust) {
    const caveat = robustCaveat(robust, preliminary, Boolean(options.robust));
    if (caveat) caveats.push(caveat);
  }

  // The classic verdict, once, from all the evidence gathered above.
  const classicVerdict = verdictFrom(models, nested, caveats, {
    ...evidence,
    ...(choice.reason ? { leadingReasons: [choice.reason] } : {}),
    ...(noiseFree ? {} : { inhibitorReach: () => inhibitorReach(models, data) }),
  });

  // Families (tight-binding, partial): src/analysis/stage-families.ts, src/evidence/selection/family-comparison.ts.
  // Without --enzyme, an enzyme column or --partial, `verdict` is the classic verdict object itself.
  // A tight-binding call rests on the same exclusion tests, run on the tight-binding mixed fit.
  const familyExclusions = new WeakMap<readonly ModelResult[], () => AlphaExclusions | null>();
  const familyVerdict = (m: readonly ModelResult[], n: readonly NestedComparison[], c: readonly Caveat[], d: FitData) => {
    if (!familyExclusions.has(m)) familyExclusions.set(m, once(() => exclusionsOf(m, d)));
    return verdictFrom(m, n, c, { exclusions: familyExclusions.get(m)! });
  };
  const families = runFamilies(table, data, errorModel, fits, level, { enzyme: options.enzyme, partial: options.partial, bootstrap: options.bootstrap }, { rank: rankModels, verdict: familyVerdict }, options.profile !== false);
  const { family, verdict } = familyCallFor(classicVerdict, models, families, data, table);

  return {
    input: {
      source: table.source,
      ...(table.compound !== undefined ? { compound: table.compound } : {}),
      rowsRead: table.rowsRead,
      rowsUsed: table.points.length,
      excluded: table.excluded,
      layout: table.layout,
      separator: table.separator,
      decimalMark: table.decimalMark,
      units: table.units,
      warnings: table.warnings,
    },
    errorModel,
    level,
    models,
    nested,
    verdict,
    family,
    enzyme: families?.enzyme ?? null,
    ...(families ? { familyModels: families.models, familyResidualChecks: families.checks } : {}),
    data,
    table,
    seriesFits: diagnostics.seriesFits,
    seriesDisagreements: diagnostics.seriesDisagreements,
    residualChecks: diagnostics.residuals,
    errorModelCheck: emCheck,
    errorModelChoice: { automatic: choice.automatic, scores: choice.scores },
    ...(robust ? { robust } : {}),
    ...(bootstrap ? { bootstrap } : {}),
  };
}

function checkErrorModelApplies(requested: ErrorModel | 'auto', data: FitData): void {
  if (requested === 'column' && !data.sd)
    throw new AnalysisError('the column error model needs a positive sd value on every used row; add an sd column or choose another error model');
  if ((requested === 'proportional' || requested === 'sqrt') && data.v.some((x) => !(x > 0)))
    throw new AnalysisError(`the ${requested} error model needs positive rates; use --error constant for data with zero or negative rates`);
}

interface ErrorModelChoice {
  errorModel: ErrorModel;
  fits: MechanismFit[];
  automatic: boolean;
  /** for 'auto': the reason that leads the verdict (which error model, by how much); null for a requested one */
  reason: VerdictReason | null;
  scores: Array<{ errorModel: ErrorModel; bestAicc: number }>;
}

/**
 * A given error model is used as is; 'auto' fits every mechanism under each usable error model
 * and keeps the one whose best mechanism has the lowest AICc (likelihoods are comparable across
 * error models, src/fit/error-models.ts).
 */
function chooseErrorModel(requested: ErrorModel | 'auto', data: FitData, mechanisms: readonly MechanismModel[], among?: readonly ErrorModel[]): ErrorModelChoice {
  if (requested !== 'auto') {
    const fits = fitAllMechanisms(data, requested, mechanisms);
    return { errorModel: requested, fits, automatic: false, reason: null, scores: [{ errorModel: requested, bestAicc: bestAiccOf(fits) }] };
  }
  const usable = candidateErrorModels(data).usable.filter((em) => !among || among.includes(em));
  if (usable.length === 0) throw new AnalysisError(`none of the error models ${among!.join(', ')} can be used on these rates`);
  const tried = usable.map((em) => ({ errorModel: em, fits: fitAllMechanisms(data, em, mechanisms) }));
  const scores = tried.map((t) => ({ errorModel: t.errorModel, bestAicc: bestAiccOf(t.fits) }));
  const order = [...scores].sort((a, b) => a.bestAicc - b.bestAicc);
  const chosen = tried.find((t) => t.errorModel === order[0].errorModel)!;
  const margin = order.length > 1 ? order[1].bestAicc - order[0].bestAicc : Infinity;
  const reason: VerdictReason = {
    code: 'error-model-chosen',
    chosen: order[0].errorModel,
    runnerUp: order.length > 1 ? order[1].errorModel : null,
    aiccMargin: order.length > 1 ? margin : null,
  };
  return { errorModel: chosen.errorModel, fits: chosen.fits, automatic: true, reason, scores };
}

function bestAiccOf(fits: readonly MechanismFit[]): number {
  return Math.min(...fits.map((f) => aicc(f.logLik, f.p + 1, f.n)));
}


/** Criteria, weights and estimates for each fit; sorted by AICc, best first. */
export function rankModels(fits: readonly MechanismFit[], data: FitData, level: number): ModelResult[] {
  const maxI = maxInhibitor(data);
  const span = dataSpan(data);
  const k = fits.map((f) => f.p + 1);
  const a = fits.map((f, j) => (Number.isFinite(f.sse) ? aicc(f.logLik, k[j], f.n) : Infinity));
  const b = fits.map((f, j) => bic(f.logLik, k[j], f.n));
  const w = akaikeWeights(a);
  const wb = akaikeWeights(b);
  const d = deltas(a);
  const results = fits.map((fit, j): ModelResult => {
    const est = waldEstimates(fit, maxI, level, span);
    return {
      mechanism: fit.mechanism,
      label: fit.model.label,
      equation: fit.model.equation,
      converged: fit.converged,
      message: fit.message,
      n: fit.n,
      p: fit.p,
      k: k[j],
      df: fit.df,
      sse: fit.sse,
      logLik: fit.logLik,
      aicc: a[j],
      bic: b[j],
      deltaAicc: d[j],
      weight: w[j],
      bicWeight: wb[j],
      estimates: est.estimates,
      residualVariance: est.residualVariance,
      fit,
    };
  });
  return results.sort((x, y) => x.aicc - y.aicc);
}

function dataSpan(data: FitData): DataSpan {
  let minInhibitor = Infinity;
  let maxRate = -Infinity;
  let maxSubstrate = -Infinity;
  for (let k = 0; k < data.v.length; k++) {
    if (data.i[k] > 0) minInhibitor = Math.min(minInhibitor, data.i[k]);
    maxRate = Math.max(maxRate, data.v[k]);
    maxSubstrate = Math.max(maxSubstrate, data.s[k]);
  }
  return { ...(Number.isFinite(minInhibitor) ? { minInhibitor } : {}), maxRate, maxSubstrate };
}

/** The alpha interval the verdict reads: profile where computed, else Wald. */
function alphaInterval(models: readonly ModelResult[]): [number | null, number | null] | null {
  const mixed = models.find((m) => m.mechanism === 'mixed');
  const alpha: ParameterEstimate | undefined = mixed?.estimates.find((e) => e.name === 'alpha');
  if (!alpha || !alpha.detected) return null;
  if (alpha.profile) return alpha.profile;
  return alpha.wald ? [alpha.wald[0], alpha.wald[1]] : null;
}

/**
 * The magnitudes the fit handles reliably (src/input/table-checks.ts): the reader refuses values
 * outside them with file, line and column; a table built in memory is checked here.
 */
function checkMagnitudes(table: RateTable): void {
  for (const p of table.points) {
    for (const [what, value] of [['substrate', p.substrate], ['inhibitor', p.inhibitor], ['rate', p.rate], ['sd', p.sd]] as const) {
      if (value !== undefined && outsideFittableRange(value))
        throw new AnalysisError(`line ${p.line}: ${what} ${value} is outside the range that can be fitted reliably (non-zero magnitudes from ${SMALLEST_MAGNITUDE} to ${LARGEST_MAGNITUDE}); rescale the column (a change of unit changes no result)`);
    }
  }
}

/** What the verdict reads besides the ranking, the nested tests and the caveats. */
interface VerdictEvidence {
  exclusions?: AlphaExclusions | null | (() => AlphaExclusions | null);
  exactFits?: ExactFitEvidence[];
  alphaEstimate?: number | null;
  leadingReasons?: VerdictReason[];
  inhibitorReach?: () => VerdictReason;
}

function verdictFrom(
  models: readonly ModelResult[],
  nested: readonly NestedComparison[],
  caveats: readonly Caveat[],
  evidence: VerdictEvidence = {},
): Verdict {
  return decideVerdict({ models, nested, alphaInterval: alphaInterval(models), caveats, ...evidence });
}

/** The point estimate of alpha of the mixed fit, when both arms are detected. */
function mixedAlpha(models: readonly ModelResult[]): number | null {
  const alpha = models.find((m) => m.mechanism === 'mixed')?.estimates.find((e) => e.name === 'alpha');
  return alpha && alpha.detected && alpha.value !== null ? alpha.value : null;
}

/** Patterns the five models cannot describe, implausible units, and pasted rows. */
function patternCaveats(models: readonly ModelResult[], winner: ModelResult, data: FitData, table: RateTable): Caveat[] {
  const out: Caveat[] = [];
  const none = models.find((m) => m.mechanism === 'none');
  for (const c of [substrateInhibitionCaveat(data, winner.fit), activationCaveat(data, none?.fit), saturatingInhibitorCaveat(data)]) if (c) out.push(c);
  const constants = winner.estimates
    .filter((e) => e.detected && e.value !== null && (e.name === 'Km' || e.name === 'Ki' || e.name === 'Kiu'))
    .map((e) => ({ name: e.name, value: e.value as number, axis: e.name === 'Km' ? ('substrate' as const) : ('inhibitor' as const) }));
  out.push(...plausibilityCaveats({ units: table.units, maxSubstrate: maxSubstrate(data), maxInhibitor: maxInhibitor(data), constants }));
  for (const w of table.warnings.filter((x) => x.code === 'repeated-block'))
    out.push({
      code: 'repeated-block',
      blocking: true,
      leading: true,
      // the input layer words its warning; the advice and headline go with it
      text: {
        message: w.message,
        suggestion: 'remove rows pasted twice (or mark them in an exclude column) and analyse again',
        headline: 'The table repeats a block of rows exactly: no firm call until the copy is removed or confirmed.',
      },
    });
  return out;
}

/**
 * The caveat of the robust refit: blocking when the call changes; when the call stays, a note only
 * if points were down-weighted or the refit ran by itself (a point stands out).
 */
function robustCaveat(robust: RobustSummary, lsVerdict: Verdict, requested: boolean): Caveat | null {
  const change = robust.downWeighted.length === 0 ? 'none-down-weighted' : robust.changesVerdict ? 'changes' : 'stays';
  if (change === 'none-down-weighted' && requested) return null;
  return {
    code: 'robust',
    change,
    downWeighted: robust.downWeighted.map((d) => ({ line: d.line, rate: d.rate })),
    robustCall: robust.verdict.mechanism,
    ...(robust.verdict.lean ? { robustLean: robust.verdict.lean } : {}),
    leastSquaresCall: lsVerdict.mechanism,
    blocking: change === 'changes',
    ...(change === 'changes' ? { leading: true } : {}),
  };
}

/** f, evaluated on the first call only. */
function once<T>(f: () => T): () => T {
  let done = false;
  let value: T;
  return () => {
    if (!done) {
      value = f();
      done = true;
    }
    return value;
  };
}

/** The one-sided alpha tests of the mixed fit that a firm three-parameter call rests on. */
function exclusionsOf(models: readonly ModelResult[], data: FitData): AlphaExclusions | null {
  const mixed = models.find((m) => m.mechanism === 'mixed');
  if (!mixed || !mixed.converged || !(mixed.fit.df > 0) || !Number.isFinite(mixed.sse)) return null;
  return alphaExclusions(mixed.fit, data);
}

function robustSummary(
  data: FitData,
  errorModel: ErrorModel,
  models: readonly ModelResult[],
  level: number,
  table: RateTable,
  lsVerdict: Verdict,
): RobustSummary {
  const mixed = models.find((m) => m.mechanism === 'mixed') ?? models[0];
  const rr = robustRefit(data, errorModel, mixed.fit);
  const ranked = rankModels(rr.fits, rr.data, level);
  const verdict = verdictFrom(ranked, nestedComparisons(rr.fits), []);
  const sameCall = (a: Verdict, b: Verdict): boolean => a.mechanism === b.mechanism && (a.lean ?? '') === (b.lean ?? '');
  return {
    downWeighted: rr.downWeighted.map((d) => ({
      index: d.index,
      line: table.points[d.index]?.line ?? -1,
      substrate: data.s[d.index],
      inhibitor: data.i[d.index],
      rate: data.v[d.index],
      weight: d.weight,
    })),
    ranking: ranked.map((m) => ({ mechanism: m.mechanism as Mechanism, aicc: m.aicc, weight: m.weight })),
    verdict,
    changesVerdict: !sameCall(verdict, lsVerdict),
  };
}
