/**
 * The design search: candidate grids from the constraints, screened by the prior-averaged Ds
 * criterion for the inhibition constants, re-allocated by the multiplicative algorithm, and
 * ranked by the discrimination criterion (rough chance of a firm call from the T-criterion
 * noncentralities, discrimination.ts), with Ds breaking near-ties. Decision and measurements:
 * docs/decisions/plan-design-search.md.
 */
import { modelFor } from '../models/index.js';
import type { Mechanism } from '../models/types.js';
import type { Design, DesignPoint, PlanNoise, PriorPoint } from './design-types.js';
import {
  expectedLogStandardErrors,
  fisherInformation,
  foldWidth,
  inhibitionIndices,
  logDsCriterion,
  paramsAt,
} from './fisher-information.js';
import { efficientRounding, optimumApproximateDesign, varianceFunction, type CriterionTerm } from './approximate-design.js';
import { chanceOfFirmCall } from './discrimination.js';
import { geometricCentre, inhibitionConstantSpan, inhibitionRange, priorPoints, typicalIc50, type PlanPrior } from './plan-prior.js';
import {
  budgetUnits,
  commonGrid,
  fmt,
  gridPoints,
  schemeLevels,
  singleInhibitorDesign,
  type PlanConstraints,
} from './candidate-designs.js';

export interface PlanSettings {
  prior: PlanPrior;
  /** mechanisms still in play */
  mechanisms: Mechanism[];
  noise: PlanNoise;
  constraints: PlanConstraints;
  /** wells already measured (a follow-up plan): part of every design's information and simulations */
  fixedPoints?: DesignPoint[];
}

/** The design's points with the wells already measured. */
export function withMeasured(points: readonly DesignPoint[], settings: PlanSettings): DesignPoint[] {
  return settings.fixedPoints && settings.fixedPoints.length > 0 ? [...settings.fixedPoints, ...points] : [...points];
}

export interface MechanismExpectation {
  /** rough chance of a firm, correct call, averaged over the prior points (ranking heuristic) */
  firmCallChance: number | null;
  /** expected fold width (high/low) of the 95% Wald interval of Ki / Kiu from the information, geometric mean over the prior points */
  kiFoldWidth: number | null;
  kiuFoldWidth: number | null;
}

export interface ScoredDesign {
  design: Design;
  /** smallest expected rate of any well as a share of Vmax, over the prior points of every mechanism in play */
  smallestRateShare: number;
  /** mean over the inhibited mechanisms in play of their firmCallChance */
  firmCallChance: number;
  /** mean over mechanisms and prior points of ln Ds / s for the inhibition constants */
  meanLogDs: number;
  expected: Partial<Record<Mechanism, MechanismExpectation>>;
}

/** Candidates within this much firm-call chance of the best are ranked by Ds (this tool's choice). */
const FIRM_CALL_TIE = 0.02;
/** How many Ds-screened grids are re-allocated and ranked by the discrimination criterion. */
const SCREENED_GRIDS = 12;
/**
 * The highest [I] of a candidate is at most this multiple of the upper end of the Ki (or IC50)
 * range given: beyond it the rate is too small to measure well in practice, which the proportional noise
 * model (constant CV down to zero rate) would not see and would reward (this tool's choice).
 */
const INHIBITOR_REACH = 10;
/**
 * A recommendable grid has at least this many [S] levels and non-zero [I] levels (when the budget
 * allows), so that residual and per-series checks have something to work with (common practice,
 * BRIEF section 7; the same counts the input checks warn below).
 */
const MIN_SUBSTRATE_LEVELS = 5;
const MIN_INHIBITOR_LEVELS = 3;

function inhibitedMechanisms(settings: PlanSettings): Mechanism[] {
  return settings.mechanisms.filter((m) => m !== 'none');
}

export function criterionTerms(settings: PlanSettings): CriterionTerm[] {
  return inhibitedMechanisms(settings).flatMap((mech) => {
    const model = modelFor(mech);
    return priorPoints(mech, settings.prior).map((pt) => ({ model, params: paramsAt(model, pt), interest: inhibitionIndices(model) }));
  });
}

export function meanLogDs(points: readonly DesignPoint[], terms: readonly CriterionTerm[], noise: PlanNoise): number {
  let sum = 0;
  for (const t of terms) sum += logDsCriterion(fisherInformation(t.model, t.params, points, noise), t.model.params.length, t.interest) / t.interest.length;
  return sum / terms.length;
}

/** Expected fold widths and firm-call chances per mechanism, and the overall scores. */
export function scoreDesign(design: Design, settings: PlanSettings, terms: readonly CriterionTerm[]): ScoredDesign {
  const all = withMeasured(design.points, settings);
  const expected: Partial<Record<Mechanism, MechanismExpectation>> = {};
  const chances: number[] = [];
  for (const mech of settings.mechanisms) {
    const model = modelFor(mech);
    const pts: PriorPoint[] = priorPoints(mech, settings.prior);
    const logFold: Record<'Ki' | 'Kiu', number[]> = { Ki: [], Kiu: [] };
    let chance = 0;
    for (const pt of pts) {
      const se = expectedLogStandardErrors(fisherInformation(model, paramsAt(model, pt), all, settings.noise), model.params.length);
      model.params.forEach((name, k) => {
        if (name === 'Ki' || name === 'Kiu') logFold[name].push(Math.log(foldWidth(se[k])));
      });
      if (mech !== 'none') chance += chanceOfFirmCall(pt, settings.mechanisms, all, settings.noise);
    }
    const gm = (xs: number[]) => (xs.length === 0 ? null : Math.exp(xs.reduce((s, x) => s + x, 0) / xs.length));
    const firm = mech === 'none' ? null : chance / pts.length;
    if (firm !== null) chances.push(firm);
    expected[mech] = { firmCallChance: firm, kiFoldWidth: gm(logFold.Ki), kiuFoldWidth: gm(logFold.Kiu) };
  }
  return {
    design,
    smallestRateShare: smallestRateShare(design.points, settings),
    firmCallChance: chances.length ? chances.reduce((s, x) => s + x, 0) / chances.length : 0,
    meanLogDs: meanLogDs(all, terms, settings.noise),
    expected,
  };
}

function smallestRateShare(points: readonly DesignPoint[], settings: PlanSettings): number {
  let least = Infinity;
  for (const mech of settings.mechanisms) {
    const model = modelFor(mech);
    for (const pt of priorPoints(mech, settings.prior)) {
      const p = paramsAt(model, pt);
      for (const d of points) least = Math.min(least, model.rate(p, d.substrate, d.inhibitor) / pt.Vmax);
    }
  }
  return least;
}

/** Best first: firm-call chance, then Ds among those within FIRM_CALL_TIE of the best. */
function rankScored(scored: readonly ScoredDesign[]): ScoredDesign[] {
  const best = Math.max(...scored.map((s) => s.firmCallChance));
  const near = scored.filter((s) => s.firmCallChance >= best - FIRM_CALL_TIE).sort((a, b) => b.meanLogDs - a.meanLogDs);
  const rest = scored.filter((s) => s.firmCallChance < best - FIRM_CALL_TIE).sort((a, b) => b.firmCallChance - a.firmCallChance || b.meanLogDs - a.meanLogDs);
  return [...near, ...rest];
}

interface GridSpec {
  substrate: number[];
  inhibitor: number[];
  label: string;
}

/** The [S] x [I] grids the constraints allow (I = 0 always included), deduplicated. */
function candidateGrids(settings: PlanSettings): GridSpec[] {
  const c = settings.constraints;
  const units = budgetUnits(c);
  const [kmLow, kmHigh] = settings.prior.km;
  const kHigh = inhibitionRange(settings.prior)[1];
  const uniq = (xs: number[]) => [...new Set(xs.map((x) => Number(x.toPrecision(12))))];
  const sHighs = uniq([c.maxSubstrate, Math.min(c.maxSubstrate, 5 * kmHigh), Math.min(c.maxSubstrate, 10 * kmHigh)]);
  const sLows = [kmLow / 5, kmLow / 10];
  const reach = Math.min(c.maxInhibitor, INHIBITOR_REACH * kHigh);
  const iHighs = uniq([reach, Math.min(reach, 3 * kHigh), Math.min(reach, 5 * kHigh)]);
  const roomy = units >= MIN_SUBSTRATE_LEVELS * (MIN_INHIBITOR_LEVELS + 1);
  const minS = roomy ? MIN_SUBSTRATE_LEVELS : 3;
  const minI = roomy ? MIN_INHIBITOR_LEVELS : 2;
  const kRangeLow = inhibitionRange(settings.prior)[0];
  const iLows = [kRangeLow / 3, kRangeLow];
  const seen = new Set<string>();
  const out: GridSpec[] = [];
  for (let nS = minS; nS <= 16; nS++)
    for (let nI = minI; nI <= 8; nI++) {
      if (nS * (nI + 1) > units || nS * (nI + 1) < Math.min(units, 8)) continue;
      for (const sHigh of sHighs)
        for (const sLow of sLows)
          for (const iHigh of iHighs)
            for (const iLow of iLows) {
              const s = schemeLevels(nS, Math.min(sLow, sHigh / 2), sHigh, c.dilution, 'substrate');
              const i = [0, ...schemeLevels(nI, Math.min(iLow, iHigh / 2), iHigh, c.dilution, 'inhibitor')];
              const key = `${s.map(fmt).join(',')}|${i.map(fmt).join(',')}`;
              if (seen.has(key) || new Set(s).size < minS || new Set(i).size < minI + 1) continue;
              seen.add(key);
              out.push({ substrate: s, inhibitor: i, label: `[S] ${s.length} levels ${fmt(s[0])}..${fmt(s[s.length - 1])}, [I] 0 + ${i.length - 1} levels ${fmt(i[1])}..${fmt(i[i.length - 1])}` });
            }
    }
  return out;
}

/** Uniform allocation; leftover units to the points with the largest averaged Ds variance function. */
function uniformDesign(grid: GridSpec, settings: PlanSettings, terms: readonly CriterionTerm[]): DesignPoint[] | null {
  const c = settings.constraints;
  const units = budgetUnits(c);
  const pts = gridPoints(grid.substrate, grid.inhibitor, 1);
  const left = units - pts.length;
  if (left > 0) {
    let d: number[];
    try {
      d = varianceFunction(pts, pts.map(() => 1 / pts.length), terms, settings.noise);
    } catch {
      return null;
    }
    const order = d.map((x, k) => [x, k]).sort((a, b) => b[0] - a[0]);
    for (let k = 0; k < left; k++) pts[order[k % order.length][1]].replicates++;
  }
  return pts.map((p) => ({ ...p, replicates: p.replicates * c.replicates }));
}

/** Each grid point keeps one unit; the rest follow the optimum approximate weights on the grid. */
function weightedDesign(grid: GridSpec, settings: PlanSettings, terms: readonly CriterionTerm[]): DesignPoint[] | null {
  const c = settings.constraints;
  const units = budgetUnits(c);
  const pts = gridPoints(grid.substrate, grid.inhibitor, 1);
  if (units - pts.length < 2) return null;
  try {
    const approx = optimumApproximateDesign(pts, terms, settings.noise, { maxIterations: 120, tolerance: 0.01 });
    const extra = efficientRounding(approx.weights, units - pts.length);
    return pts.map((p, k) => ({ ...p, replicates: (1 + extra[k]) * c.replicates }));
  } catch {
    return null;
  }
}

/** The prior-averaged Ds-optimum design on a rich grid, rounded to the budget (few support points). */
function dsOptimumDesign(settings: PlanSettings, terms: readonly CriterionTerm[]): Design | null {
  const c = settings.constraints;
  const [kLow] = inhibitionConstantSpan(settings.prior, settings.mechanisms);
  const kHigh = inhibitionRange(settings.prior)[1];
  const reach = Math.min(c.maxInhibitor, INHIBITOR_REACH * kHigh);
  const s = schemeLevels(12, settings.prior.km[0] / 10, c.maxSubstrate, c.dilution, 'substrate');
  const i = [0, ...schemeLevels(8, Math.min(kLow / 3, reach / 2), reach, c.dilution, 'inhibitor')];
  const pts = gridPoints(s, i, 1);
  try {
    const approx = optimumApproximateDesign(pts, terms, settings.noise, { maxIterations: 1500 });
    const n = efficientRounding(approx.weights, budgetUnits(c), 0.01);
    const points = pts.map((p, k) => ({ ...p, replicates: n[k] * c.replicates })).filter((p) => p.replicates > 0);
    return { name: 'ds-optimum', description: `prior-averaged Ds-optimum for the inhibition constants on a ${s.length} x ${i.length} grid, rounded to the budget (${points.length} distinct points)`, points };
  } catch {
    return null;
  }
}

export interface SearchResult {
  /** the screened grids, scored and ranked, best first: the designs a plan may recommend */
  recommendable: ScoredDesign[];
  /** the prior-averaged Ds-optimum (few support points: shown for reference, never recommended) */
  dsOptimum: ScoredDesign | null;
  common: ScoredDesign;
  singleInhibitor: ScoredDesign;
  /** number of grids the constraints allow (all screened by Ds) */
  gridsScreened: number;
}

export function searchDesigns(settings: PlanSettings): SearchResult {
  if (inhibitedMechanisms(settings).length === 0) throw new Error('the plan needs at least one inhibited mechanism in play');
  const terms = criterionTerms(settings);
  const grids = candidateGrids(settings);
  if (grids.length === 0) throw new Error('no grid fits the constraints: allow more wells or wider concentration ranges');
  const screened = grids
    .map((g) => ({ g, pts: uniformDesign(g, settings, terms) }))
    .filter((x): x is { g: GridSpec; pts: DesignPoint[] } => x.pts !== null)
    .map((x) => ({ ...x, ds: meanLogDs(withMeasured(x.pts, settings), terms, settings.noise) }))
    .filter((x) => Number.isFinite(x.ds))
    .sort((a, b) => b.ds - a.ds)
    .slice(0, SCREENED_GRIDS);
  const designs: Design[] = [];
  screened.forEach((x, k) => {
    designs.push({ name: `grid-${k + 1}`, description: `${x.g.label}, equal replicates`, points: x.pts });
    const w = weightedDesign(x.g, settings, terms);
    if (w) designs.push({ name: `grid-${k + 1}-weighted`, description: `${x.g.label}, replicates from the Ds-optimum weights`, points: w });
  });
  const ds = dsOptimumDesign(settings, terms);
  const km = geometricCentre(settings.prior.km);
  const ic50 = typicalIc50(settings.prior);
  return {
    recommendable: rankScored(designs.map((d) => scoreDesign(d, settings, terms))),
    dsOptimum: ds ? scoreDesign(ds, settings, terms) : null,
    common: scoreDesign(commonGrid(km, ic50, settings.constraints), settings, terms),
    singleInhibitor: scoreDesign(singleInhibitorDesign(km, ic50, settings.constraints), settings, terms),
    gridsScreened: grids.length,
  };
}
