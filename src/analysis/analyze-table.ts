/**
 * The analysis of one rate table: fit all mechanisms globally, rank them, estimate parameters with
 * intervals, compare nested models and reach a verdict. The CLI, the report and the batch runner
 * are thin layers over this function.
 */
import { MECHANISMS } from '../models/index.js';
import type { MechanismModel } from '../models/types.js';
import { fitAllMechanisms } from '../fit/fit-all-mechanisms.js';
import { fitDataFromTable, type FitData } from '../fit/fit-data.js';
import type { ErrorModel } from '../fit/error-models.js';
import type { RateTable } from '../input/types.js';
import { aicc, akaikeWeights, bic, deltas } from '../evidence/information-criteria.js';
import { waldEstimates } from '../evidence/wald-estimates.js';
import { nestedComparisons } from '../evidence/nested-comparisons.js';
import { decideVerdict } from '../evidence/verdict.js';
import type { AnalysisResult, ModelResult } from './types.js';

export interface AnalysisOptions {
  /** error model; default 'constant' */
  errorModel?: ErrorModel;
  /** confidence level for intervals; default 0.95 */
  level?: number;
  /** mechanisms to compare; default all five */
  models?: readonly MechanismModel[];
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
  const errorModel = options.errorModel ?? 'constant';
  const level = options.level ?? 0.95;
  if (!(level > 0 && level < 1)) throw new AnalysisError(`confidence level must lie between 0 and 1 (got ${level})`);
  const data = fitDataFromTable(table);
  if (errorModel === 'column' && !data.sd)
    throw new AnalysisError('the column error model needs a positive sd value on every used row; add an sd column or choose another error model');
  if (errorModel !== 'constant' && errorModel !== 'column' && data.v.some((x) => !(x > 0)))
    throw new AnalysisError(`the ${errorModel} error model needs positive rates; use --error constant for data with zero or negative rates`);
  const fits = fitAllMechanisms(data, errorModel, options.models ?? MECHANISMS);
  const models = rankModels(fits, data, level);
  const nested = nestedComparisons(fits);
  const mixed = models.find((m) => m.mechanism === 'mixed');
  const alpha = mixed?.estimates.find((e) => e.name === 'alpha');
  const verdict = decideVerdict({
    models,
    nested,
    alphaInterval: alpha ? alphaBounds(alpha) : null,
  });
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
    data,
    table,
  };
}

function maxOf(xs: Float64Array): number {
  let m = 0;
  for (const x of xs) if (x > m) m = x;
  return m;
}

/** Criteria, weights and estimates for each fit; sorted by AICc, best first. */
export function rankModels(fits: ReturnType<typeof fitAllMechanisms>, data: FitData, level: number): ModelResult[] {
  const maxI = maxOf(data.i);
  const k = fits.map((f) => f.p + 1);
  const a = fits.map((f, j) => (f.converged || Number.isFinite(f.sse) ? aicc(f.logLik, k[j], f.n) : Infinity));
  const b = fits.map((f, j) => bic(f.logLik, k[j], f.n));
  const w = akaikeWeights(a);
  const wb = akaikeWeights(b);
  const d = deltas(a);
  const results = fits.map((fit, j): ModelResult => {
    const est = waldEstimates(fit, maxI, level);
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

function alphaBounds(alpha: { wald: [number, number] | null; detected: boolean; value: number | null }): [number | null, number | null] | null {
  if (!alpha.detected || !alpha.wald) return null;
  return [alpha.wald[0], alpha.wald[1]];
}
