/**
 * What every figure of one analysis shares: the model drawn (the verdict's mechanism), the
 * runner-up, the levels of [I] and [S] as series, their colours, and the axis units.
 */
import type { AnalysisResult, ModelResult } from '../analysis/types.js';
import { axisUnits, type AxisUnits } from './axis-units.js';
import { seriesColours } from './palette.js';
import { rateConstants, type RateConstants } from './replot-geometry.js';
import { sig } from '../text/format-number.js';
import { distinctLevels } from '../input/distinct-levels.js';

export interface SeriesLevels {
  values: number[];
  colours: string[];
  /** level index of every fitted point */
  indexOf: Int32Array;
}

export interface FigureContext {
  result: AnalysisResult;
  units: AxisUnits;
  best: ModelResult;
  bestConstants: RateConstants;
  runnerUp: ModelResult | null;
  runnerUpConstants: RateConstants | null;
  inhibitor: SeriesLevels;
  substrate: SeriesLevels;
}

function seriesLevels(values: Float64Array): SeriesLevels {
  const levels = distinctLevels(values);
  const at = new Map(levels.map((v, k) => [v, k]));
  return { values: levels, colours: seriesColours(levels.length), indexOf: Int32Array.from(values, (v) => at.get(v) ?? 0) };
}

/**
 * The model the figures draw: the called model of another family when that family won (tight-binding,
 * partial), else the classic model of the verdict's mechanism if it was fitted, else the AICc best.
 */
export function drawnModel(result: AnalysisResult): ModelResult {
  const family = result.family && result.family.family !== 'classic' ? result.familyModels?.find((m) => m.modelId === result.family.model) : undefined;
  return family ?? classicDrawnModel(result);
}

/** The classic model of the verdict's mechanism (the replots' line geometry is that of the classic laws). */
function classicDrawnModel(result: AnalysisResult): ModelResult {
  return result.models.find((m) => m.mechanism === result.verdict.mechanism) ?? result.models[0];
}

/** The name a figure or table gives a model: its registry id for the other families, else its mechanism. */
export function modelName(m: ModelResult): string {
  return m.modelId ?? m.mechanism;
}

/** v(S, I) of a fitted model from its own rate function ([E]t from the analysis for models that read it). */
export function ownRate(result: AnalysisResult, m: ModelResult, s: number, i: number): number {
  const e = result.enzyme && result.enzyme !== 'fitted' ? result.enzyme.value : undefined;
  return m.fit.model.rate(m.fit.params, s, i, e);
}

/** The next model by AICc after the drawn one, when it converged. */
function runnerUpModel(result: AnalysisResult, best: ModelResult): ModelResult | null {
  return result.models.find((m) => m !== best && m.converged && Number.isFinite(m.aicc)) ?? null;
}

export function figureContext(result: AnalysisResult): FigureContext {
  const best = drawnModel(result);
  const runnerUp = runnerUpModel(result, best);
  return {
    result,
    units: axisUnits(result),
    best,
    bestConstants: rateConstants(best.family && best.family !== 'classic' ? classicDrawnModel(result) : best),
    runnerUp,
    runnerUpConstants: runnerUp ? rateConstants(runnerUp) : null,
    inhibitor: seriesLevels(result.data.i),
    substrate: seriesLevels(result.data.s),
  };
}

/** "60 nM" (or "60" without a unit). */
export function concentrationText(x: number, unit: string | null): string {
  return unit ? `${sig(x, 3)} ${unit}` : sig(x, 3);
}
