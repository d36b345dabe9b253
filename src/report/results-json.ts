/**
 * The JSON document of one analysis (`mechanist analyze --json`, `results.json` in a report folder).
 * The shape is documented in README.md ("JSON output"). Non-finite numbers become null.
 */
import type { AnalysisResult, ModelResult } from '../analysis/types.js';
import type { ParameterEstimate } from '../evidence/intervals/wald-estimates.js';
import type { DerivedQuantity } from '../evidence/intervals/derived-quantities.js';
import { TOOL_NAME, TOOL_VERSION } from '../version.js';
import { diagnosticsJson } from './diagnostics-json.js';
import { jsonNumber, jsonPair, type Json } from './json-values.js';
import { wordVerdict } from '../wording/verdict-words.js';

export type { Json } from './json-values.js';


/** "ci95" for level 0.95, "ci99" for 0.99, "ci90" for 0.9 (key named for the level). */
export function levelKey(prefix: string, level: number): string {
  const pct = Math.round(level * 1000) / 10;
  return `${prefix}${String(pct).replace('.', '_')}`;
}



function estimateJson(e: ParameterEstimate, level: number): { [key: string]: Json } {
  const out: { [key: string]: Json } = {
    value: jsonNumber(e.value),
    se: jsonNumber(e.se),
    [levelKey('ci', level)]: jsonPair(e.wald),
    detected: e.detected,
  };
  if (e.exceeds !== undefined) out.exceeds = jsonNumber(e.exceeds);
  if (e.below !== undefined) out.below = jsonNumber(e.below);
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
  if (e.profile) out[levelKey('profile', level)] = [jsonNumber(e.profile[0]), jsonNumber(e.profile[1])];
  if (e.bootstrapPercentile) out[levelKey('bootPercentile', level)] = jsonPair(e.bootstrapPercentile);
  if (e.bootstrapBca) out[levelKey('bootBca', level)] = jsonPair(e.bootstrapBca);
}

function derivedJson(d: DerivedQuantity, level: number): { [key: string]: Json } {
  const out: { [key: string]: Json } = {
    name: d.name,
    ...(d.inhibitor !== undefined ? { inhibitor: d.inhibitor } : {}),
    ...(d.substrate !== undefined ? { substrate: d.substrate } : {}),
    unit: d.unit,
    value: jsonNumber(d.value),
    se: jsonNumber(d.se),
    [levelKey('ci', level)]: jsonPair(d.wald),
  };
  addIntervalFields(out, d, level);
  if (d.note) out.note = d.note;
  return out;
}

function modelJson(m: ModelResult, level: number): { [key: string]: Json } {
  const params: { [key: string]: Json } = {};
  for (const e of m.estimates) params[e.name] = estimateJson(e, level);
  return {
    mechanism: m.mechanism,
    family: m.family ?? 'classic',
    ...(m.modelId ? { model: m.modelId } : {}),
    equation: m.equation,
    converged: m.converged,
    message: m.message,
    n: m.n,
    nParams: m.p,
    df: m.df,
    sse: jsonNumber(m.sse),
    logLik: jsonNumber(m.logLik),
    aicc: jsonNumber(m.aicc),
    bic: jsonNumber(m.bic),
    deltaAicc: jsonNumber(m.deltaAicc),
    weight: jsonNumber(m.weight),
    bicWeight: jsonNumber(m.bicWeight),
    residualSd: jsonNumber(Math.sqrt(m.residualVariance)),
    params,
    ...(m.derived ? { derived: m.derived.map((d) => derivedJson(d, level)) } : {}),
    ...(m.profiles ? { profiles: m.profiles.map((c) => ({ parameter: c.parameter, cutoff: jsonNumber(c.cutoff), values: c.values.map((x) => jsonNumber(x)), tau: c.tau.map((x) => jsonNumber(x)) })) } : {}),
    ...(m.jointRegion
      ? { jointRegion: { level: m.jointRegion.level, open: m.jointRegion.open, Ki: m.jointRegion.ki.map((x) => jsonNumber(x)), Kiu: m.jointRegion.kiu.map((x) => jsonNumber(x)) } }
      : {}),
  };
}

/** `input.enzyme`: { value, unit, source } when [E]t was given, "fitted", or null. */
function enzymeJson(e: AnalysisResult['enzyme']): Json {
  if (e === null || e === 'fitted') return e;
  return { value: jsonNumber(e.value), unit: e.unit, source: e.source };
}

export function analysisJson(result: AnalysisResult): { [key: string]: Json } {
  const input = result.input;
  const verdictWords = wordVerdict(result.verdict);
  const familyWords = wordVerdict(result.family);
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
      enzyme: enzymeJson(result.enzyme),
    },
    errorModel: result.errorModel,
    level: result.level,
    // the classic five ranked by AICc, then the models of the other families fitted (each family ranked within itself)
    models: [...result.models, ...(result.familyModels ?? [])].map((m) => modelJson(m, result.level)),
    nested: result.nested.map((c) => ({
      simpler: c.simpler,
      fuller: c.fuller,
      f: jsonNumber(c.f),
      fDf: c.fDf,
      fP: jsonNumber(c.fP),
      lr: jsonNumber(c.lr),
      lrP: jsonNumber(c.lrP),
      primary: c.primary,
      p: jsonNumber(c.p),
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
      family: result.family.family,
      ...(result.family.family !== 'classic' ? { model: result.family.model } : {}),
      ...(familyWords.reasons.length || familyWords.suggestions.length ? { familyNotes: [...new Set([...familyWords.reasons, ...familyWords.suggestions])] } : {}),
      outcome: result.verdict.outcome,
      ...(result.verdict.lean ? { lean: result.verdict.lean } : {}),
      decisive: result.verdict.decisive,
      candidates: result.verdict.candidates,
      headline: verdictWords.headline,
      reasons: verdictWords.reasons,
      suggestions: verdictWords.suggestions,
      ...(result.verdict.exclusion
        ? {
            exclusion: {
              component: result.verdict.exclusion.component,
              excluded: result.verdict.exclusion.excluded,
              tests: result.verdict.exclusion.tests.map((t) => ({ claim: t.claim, bound: jsonNumber(t.bound), tau: jsonNumber(t.tau), p: jsonNumber(t.p), excluded: t.excluded })),
            },
          }
        : {}),
      caveats: result.verdict.caveats ?? [],
    },
    diagnostics: diagnosticsJson(result),
  };
}
