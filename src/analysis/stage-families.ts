/**
 * The tight-binding and partial families beside the classic five: which of them to fit, the
 * enzyme concentration they read, their fits (src/fit/fit-family.ts), ranking, tests and profile
 * intervals, and the evidence the family comparison (src/evidence/selection/family-comparison.ts) reads.
 * When neither family is requested nothing here runs, and the classic analysis is unchanged.
 */
import type { Mechanism, MechanismModel } from '../models/types.js';
import { familyOf, lookupModel, modelId, nestedPairsAmong, registeredModels, containmentOf } from '../models/registry.js';
import type { MechanismFit } from '../fit/fit-mechanism.js';
import type { FitData } from '../fit/fit-data.js';
import type { ErrorModel } from '../fit/error-models.js';
import { fitFamily } from '../fit/fit-family.js';
import { InputError, type ConcentrationUnit, type RateTable } from '../input/types.js';
import { parseConcentrationUnit, scaleByPowerOfTen, unitShift } from '../input/units.js';
import { compareNested, type NestedComparison } from '../evidence/selection/nested-comparisons.js';
import { profileAllOfFit } from '../evidence/intervals/profile-likelihood.js';
import { oneParameterTest, partialWinner, type BoundaryTest, type FamilyModelEvidence, type PartialEvidence, type TightBindingEvidence } from '../evidence/selection/family-comparison.js';
import type { Caveat, Verdict } from '../evidence/verdict/verdict.js';
import { familyBootstrap } from '../evidence/bootstrap/family-bootstrap.js';
import type { WildWeights } from '../evidence/bootstrap/bootstrap-tasks.js';
import { residualDiagnostics, type ResidualDiagnostics } from '../evidence/diagnostics/residual-diagnostics.js';
import { DRAWN_PROFILES } from './stage-intervals.js';
import { caveatsFor } from './stage-diagnostics.js';
import type { EnzymeInput, ModelResult } from './types.js';

/** `--enzyme`: a concentration with its unit, or 'fit' (active-site concentration unknown). */
export type EnzymeOption = { value: number; unit: ConcentrationUnit } | 'fit';

export type { EnzymeInput };

export interface FamilyRequest {
  enzyme?: EnzymeOption;
  /** fit the partial family (docs/decisions/family-selection.md: on request only) */
  partial?: boolean;
  /** wild bootstrap of the family models the call can name (src/evidence/bootstrap/family-bootstrap.ts) */
  bootstrap?: { resamples: number; seed: number; weights?: WildWeights };
}

interface FamilyTools {
  rank(fits: readonly MechanismFit[], data: FitData, level: number): ModelResult[];
  verdict(models: readonly ModelResult[], nested: readonly NestedComparison[], caveats: readonly Caveat[], data: FitData): Verdict;
}

export interface FamilyStage {
  enzyme: EnzymeInput;
  /** the models of the other families, each family ranked by AICc within itself */
  models: ModelResult[];
  tight?: TightBindingEvidence;
  partial?: PartialEvidence;
  /** the tight-binding verdict, when that family was fitted */
  tightVerdict?: Verdict;
  /** residual diagnostics of the family models that can be named (by registry id) */
  checks: Record<string, ResidualDiagnostics>;
}

/** An unusable enzyme setting is bad input (exit code 2), named by file and line where there is one. */
function enzymeError(message: string, file: string, line?: number): InputError {
  return new InputError(message, file, line);
}

const ENZYME_HEADER = /^\s*enzyme\s*(?:[([]\s*([^)\]]+?)\s*[)\]])?\s*$/i;

/** The enzyme column of a table (an annotation headed `enzyme` or `enzyme (nM)`), if any. */
function enzymeColumn(table: RateTable): string | undefined {
  for (const p of table.points) for (const key of Object.keys(p.annotations ?? {})) if (ENZYME_HEADER.test(key)) return key;
  return undefined;
}

/**
 * [E]t per point in the table's inhibitor unit: from the option (one value for every point), or
 * from an `enzyme` column (every used row needs a non-negative number). Null when neither is given.
 */
export function resolveEnzyme(table: RateTable, option: EnzymeOption | undefined): { e: Float64Array | null; input: EnzymeInput } {
  const n = table.points.length;
  const target = table.units.inhibitor;
  const convert = (value: number, unit: ConcentrationUnit | null, where: string): number => {
    if (unit === null || target === null) {
      if (unit !== target && unit !== null)
        throw enzymeError(`${table.source}: the inhibitor unit is unknown, so the enzyme concentration (${where}) cannot be converted; declare it with --inhibitor-unit`, table.source);
      return value;
    }
    return scaleByPowerOfTen(value, unitShift(unit, target));
  };
  if (option === 'fit') return { e: null, input: 'fitted' };
  if (option) {
    if (!(option.value >= 0) || !Number.isFinite(option.value)) throw enzymeError(`--enzyme must be a non-negative concentration (got ${option.value})`, table.source);
    const v = convert(option.value, option.unit, '--enzyme');
    return { e: new Float64Array(n).fill(v), input: { value: v, unit: target, source: 'option' } };
  }
  const key = enzymeColumn(table);
  if (!key) return { e: null, input: null };
  const unitText = ENZYME_HEADER.exec(key)?.[1];
  const unit = unitText ? parseConcentrationUnit(unitText) : null;
  const e = new Float64Array(n);
  table.points.forEach((p, k) => {
    const cell = p.annotations?.[key]?.trim() ?? '';
    const x = /^[+]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(cell) ? Number(cell) : NaN;
    if (!(x >= 0)) throw enzymeError(`${table.source}:${p.line}: the enzyme column holds ${cell === '' ? 'a blank' : `"${cell}"`}; give a non-negative concentration on every used row`, table.source, p.line);
    e[k] = convert(x, unit, `column "${key}"`);
  });
  const max = e.reduce((a, b) => Math.max(a, b), 0);
  return { e, input: { value: max, unit: target, source: 'column' } };
}

function evidenceOf(m: ModelResult): FamilyModelEvidence {
  return { id: m.modelId ?? m.mechanism, family: m.family ?? 'classic', mechanism: m.mechanism, aicc: m.aicc, logLik: m.logLik, converged: m.converged, estimates: m.estimates };
}

function tagged(models: ModelResult[]): ModelResult[] {
  for (const m of models) {
    m.family = familyOf(m.fit.model);
    m.modelId = modelId(m.fit.model);
  }
  return models;
}

function addProfiles(model: ModelResult | undefined, data: FitData, level: number): void {
  if (!model || !(model.fit.df > 0) || !Number.isFinite(model.fit.sse)) return;
  const found = profileAllOfFit(model.fit, data, { level, beyondEnds: DRAWN_PROFILES });
  model.profiles = found.map((p) => p.curve);
  for (const e of model.estimates) {
    const p = found.find((x) => x.name === e.name);
    if (p) e.profile = p.interval;
  }
}

/**
 * Caveats on a family model's own fit: its residual checks and the design checks with its
 * constants (the classic winner's residual caveats say nothing about another family's fit). The
 * per-series comparison uses classic apparent constants and is left out.
 */
function familyCaveats(winner: ModelResult | undefined, data: FitData, checks?: Record<string, ResidualDiagnostics>): Caveat[] {
  if (!winner || !(winner.fit.df > 0)) return [];
  const d = residualDiagnostics(winner.fit, data);
  if (checks) checks[winner.modelId ?? winner.mechanism] = d;
  return caveatsFor(winner, { residuals: { [winner.mechanism]: d }, seriesFits: [], seriesDisagreements: [], errorModelCheck: null }, data);
}

function addBootstrap(model: ModelResult | undefined, data: FitData, level: number, request: FamilyRequest['bootstrap']): void {
  if (!request || !model || !(model.fit.df > 0) || !Number.isFinite(model.fit.sse)) return;
  const found = familyBootstrap(model.fit, data, { ...request, level });
  for (const e of model.estimates) {
    const b = found[e.name];
    if (!b || !e.detected) continue;
    if (b.percentile) e.bootstrapPercentile = b.percentile;
    if (b.bca) e.bootstrapBca = b.bca;
  }
}

function registryLookup(id: string): MechanismModel | undefined {
  return lookupModel(id);
}

export function runFamilies(
  table: RateTable,
  data: FitData,
  errorModel: ErrorModel,
  classicFits: readonly MechanismFit[],
  level: number,
  request: FamilyRequest,
  tools: FamilyTools,
  profile: boolean,
): FamilyStage | null {
  const enzyme = resolveEnzyme(table, request.enzyme);
  if (enzyme.input === null && !request.partial) return null;
  const stage: FamilyStage = { enzyme: enzyme.input, models: [], checks: {} };
  const none = classicFits.find((f) => f.mechanism === 'none');

  if (enzyme.input !== null) {
    const fitted = enzyme.input === 'fitted';
    const models = registeredModels('tight-binding').filter((m) => (fitted ? m.params.includes('Et') : m.covariates?.includes('enzyme')));
    const dataE: FitData = enzyme.e ? { ...data, e: enzyme.e } : data;
    const fits = fitFamily(models, dataE, errorModel, classicFits);
    const all = none ? [none, ...fits] : fits;
    const ranked = tools.rank(all, dataE, level).filter((m) => m.fit !== none);
    tagged(ranked);
    const byModel = new Map(all.map((f) => [f.model, f]));
    const nested = nestedPairsAmong(all.map((f) => f.model), registryLookup)
      .filter((p) => byModel.has(p.simpler))
      .map((p) => compareNested(byModel.get(p.simpler)!, byModel.get(p.fuller)!));
    const noneResult = none ? tools.rank([none], data, level) : [];
    const candidates = [...ranked, ...noneResult].sort((a, b) => a.aicc - b.aicc);
    const preliminary = tools.verdict(candidates, nested, [], dataE);
    const caveats = familyCaveats(ranked.find((m) => m.mechanism === preliminary.mechanism), dataE, stage.checks);
    const verdict = tools.verdict(candidates, nested, caveats, dataE);
    if (verdict.mechanism !== preliminary.mechanism) familyCaveats(ranked.find((m) => m.mechanism === verdict.mechanism), dataE, stage.checks);
    if (profile) addProfiles(ranked.find((m) => m.mechanism === verdict.mechanism), dataE, level);
    addBootstrap(ranked.find((m) => m.mechanism === verdict.mechanism), dataE, level, request.bootstrap);
    const againstClassic: Partial<Record<Mechanism, BoundaryTest>> = {};
    if (fitted)
      for (const f of fits) {
        const c = classicFits.find((x) => x.mechanism === f.mechanism);
        if (c) againstClassic[f.mechanism] = oneParameterTest(c.logLik, f.logLik, true);
      }
    stage.tight = {
      enzyme: fitted ? 'fitted' : 'given',
      ...(enzyme.e ? { enzymeLevel: enzyme.e.reduce((a, b) => Math.max(a, b), 0) } : {}),
      models: ranked.map(evidenceOf),
      verdict,
      ...(fitted ? { againstClassic } : {}),
    };
    stage.tightVerdict = verdict;
    stage.models.push(...ranked);
  }

  if (request.partial) {
    const models = registeredModels('partial');
    const fits = fitFamily(models, data, errorModel, classicFits);
    const ranked = tagged(tools.rank(fits, data, level));
    const againstFull: Record<string, BoundaryTest> = {};
    const withinFamily: Record<string, BoundaryTest> = {};
    for (const f of fits) {
      for (const c of classicFits) {
        const rule = containmentOf(c.model, f.model);
        if (rule) againstFull[modelId(f.model)] = oneParameterTest(c.logLik, f.logLik, rule.rules.some((r) => r.kind === 'limit'));
      }
      for (const g of fits) {
        const rule = containmentOf(g.model, f.model);
        if (rule && g !== f) withinFamily[modelId(g.model)] = oneParameterTest(g.logLik, f.logLik, rule.rules.some((r) => r.kind === 'limit'));
      }
    }
    // the model the family comparison will name (same rule, src/evidence/selection/family-comparison.ts) gets the profiles and the fit checks
    const evidence = ranked.map(evidenceOf);
    const usable = evidence.filter((m) => m.converged && Number.isFinite(m.aicc));
    const pickId = usable.length ? partialWinner(usable, { models: evidence, againstFull, withinFamily, blocking: [] }).model.id : undefined;
    const picked = ranked.find((m) => m.modelId === pickId);
    if (profile) addProfiles(picked, data, level);
    addBootstrap(picked, data, level, request.bootstrap);
    const blocking = familyCaveats(picked, data, stage.checks).filter((c) => c.blocking);
    stage.partial = { models: evidence, againstFull, withinFamily, blocking };
    stage.models.push(...ranked);
  }
  return stage;
}
