/**
 * The JSON document of one analysis (`mechanist analyze --json`, `results.json` in a report folder).
 * The shape is documented in README.md ("JSON output"). Non-finite numbers become null.
 */
import type { AnalysisResult, ModelResult } from '../analysis/types.js';
import type { ParameterEstimate } from '../evidence/wald-estimates.js';
import type { DerivedQuantity } from '../evidence/derived-quantities.js';
import { TOOL_NAME, TOOL_VERSION } from '../version.js';
import { diagnosticsJson } from './diagnostics-json.js';

export type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

/** "ci95" for level 0.95, "ci99" for 0.99, "ci90" for 0.9 (key named for the level). */
export function levelKey(prefix: string, level: number): string {
  const pct = Math.round(level * 1000) / 10;
  return `${prefix}${String(pct).replace('.', '_')}`;
}

function num(x: number | null | undefined): number | null {
  return x === null || x === undefined || !Number.isFinite(x) ? null : x;
}

function pair(x: [number, number] | null | undefined): [number | null, number | null] | null {
  return x ? [num(x[0]), num(x[1])] : null;
}

export function estimateJson(e: ParameterEstimate, level: number): { [key: string]: Json } {
  const out: { [key: string]: Json } = {
    value: num(e.value),
    se: num(e.se),
    [levelKey('ci', level)]: pair(e.wald),
    detected: e.detected,
  };
  if (e.exceeds !== undefined) out.exceeds = num(e.exceeds);
  if (e.note) out.note = e.note;
  addIntervalFields(out, e, level);
  return out;
}

/** Profile (null for an open end) and bootstrap intervals, keyed by level (intervals stage). */
function addIntervalFields(
  out: { [key: string]: Json },
  e: Pick<ParameterEstimate, 'profile' | 'bootstrapPercentile' | 'bootstrapBca'>,
  level: number,
): void {
  if (e.profile) out[levelKey('profile', level)] = [num(e.profile[0]), num(e.profile[1])];
  if (e.bootstrapPercentile) out[levelKey('bootPercentile', level)] = pair(e.bootstrapPercentile);
  if (e.bootstrapBca) out[levelKey('bootBca', level)] = pair(e.bootstrapBca);
}

function derivedJson(d: DerivedQuantity, level: number): { [key: string]: Json } {
  const out: { [key: string]: Json } = {
    name: d.name,
    ...(d.inhibitor !== undefined ? { inhibitor: d.inhibitor } : {}),
    ...(d.substrate !== undefined ? { substrate: d.substrate } : {}),
    unit: d.unit,
    value: num(d.value),
    se: num(d.se),
    [levelKey('ci', level)]: pair(d.wald),
  };
  addIntervalFields(out, d, level);
  if (d.note) out.note = d.note;
  return out;
}

export function modelJson(m: ModelResult, level: number): { [key: string]: Json } {
  const params: { [key: string]: Json } = {};
  for (const e of m.estimates) params[e.name] = estimateJson(e, level);
  return {
    mechanism: m.mechanism,
    equation: m.equation,
    converged: m.converged,
    message: m.message,
    n: m.n,
    nParams: m.p,
    df: m.df,
    sse: num(m.sse),
    logLik: num(m.logLik),
    aicc: num(m.aicc),
    bic: num(m.bic),
    deltaAicc: num(m.deltaAicc),
    weight: num(m.weight),
    bicWeight: num(m.bicWeight),
    residualSd: num(Math.sqrt(m.residualVariance)),
    params,
    ...(m.derived ? { derived: m.derived.map((d) => derivedJson(d, level)) } : {}),
    ...(m.profiles ? { profiles: m.profiles.map((c) => ({ parameter: c.parameter, cutoff: num(c.cutoff), values: c.values.map(num), tau: c.tau.map(num) })) } : {}),
    ...(m.jointRegion
      ? { jointRegion: { level: m.jointRegion.level, open: m.jointRegion.open, Ki: m.jointRegion.ki.map(num), Kiu: m.jointRegion.kiu.map(num) } }
      : {}),
  };
}

export function analysisJson(result: AnalysisResult): { [key: string]: Json } {
  const input = result.input;
  return {
    tool: { name: TOOL_NAME, version: TOOL_VERSION },
    input: {
      source: input.source,
      ...(input.compound !== undefined ? { compound: input.compound } : {}),
      rowsRead: input.rowsRead,
      rowsUsed: input.rowsUsed,
      excluded: input.excluded.map((x) => ({ line: x.line, ...(x.column !== undefined ? { column: x.column } : {}), reason: x.reason })),
      layout: input.layout,
      separator: input.separator === '\t' ? 'tab' : input.separator,
      decimalMark: input.decimalMark,
      detection: result.table.detection
        ? { layout: result.table.detection.layout, separator: result.table.detection.separator, decimalMark: result.table.detection.decimalMark }
        : null,
      units: { substrate: input.units.substrate, inhibitor: input.units.inhibitor, rate: input.units.rate },
      warnings: input.warnings.map((w) => ({ code: w.code, message: w.message })),
    },
    errorModel: result.errorModel,
    level: result.level,
    models: result.models.map((m) => modelJson(m, result.level)),
    nested: result.nested.map((c) => ({
      simpler: c.simpler,
      fuller: c.fuller,
      f: num(c.f),
      fDf: c.fDf,
      fP: num(c.fP),
      lr: num(c.lr),
      lrP: num(c.lrP),
      primary: c.primary,
      p: num(c.p),
    })),
    ...(result.bootstrap
      ? {
          bootstrap: {
            resamples: result.bootstrap.resamples,
            seed: result.bootstrap.seed,
            scheme: result.bootstrap.scheme,
            generatingModel: result.bootstrap.generatingModel,
            selectionFrequency: result.bootstrap.selection,
            failedRefits: result.bootstrap.failures,
          },
        }
      : {}),
    verdict: {
      mechanism: result.verdict.mechanism,
      outcome: result.verdict.outcome,
      ...(result.verdict.lean ? { lean: result.verdict.lean } : {}),
      decisive: result.verdict.decisive,
      candidates: result.verdict.candidates,
      headline: result.verdict.headline,
      reasons: result.verdict.reasons,
      suggestions: result.verdict.suggestions,
    },
    diagnostics: diagnosticsJson(result),
  };
}
