/**
 * Candidate designs built from the constraints: the levels each dilution scheme allows, grids of
 * [S] x [I] levels at the well budget, and the two reference designs every plan is compared with:
 * the commonly used grid ([S] from Km/5 to 5 Km, [I] from IC50/3 to 3 IC50 plus zero, as described
 * by Jang et al. 2025, Nat. Commun. 16:5217) and a design with one inhibitor level above the IC50
 * (the alternative the same paper proposes; the level 2 x IC50 is this tool's choice).
 */
import type { Design, DesignPoint } from './design-types.js';
import { distinctLevels } from '../input/distinct-levels.js';

/** How the concentrations may be made: any value, a serial dilution with a fixed fold, or a list. */
export type DilutionScheme = { kind: 'free' } | { kind: 'serial'; fold: number } | { kind: 'list'; substrate?: number[]; inhibitor?: number[] };

export interface PlanConstraints {
  /** highest [S] (solubility), substrate units */
  maxSubstrate: number;
  /** highest [I], inhibitor units */
  maxInhibitor: number;
  /** wells available for this compound */
  wells: number;
  /** replicate wells per design point (the smallest unit of the budget) */
  replicates: number;
  plate: 96 | 384;
  dilution: DilutionScheme;
}

const COMMON_GRID_SUBSTRATE_SPAN: readonly [number, number] = [1 / 5, 5];
const COMMON_GRID_INHIBITOR_SPAN: readonly [number, number] = [1 / 3, 3];
const SINGLE_INHIBITOR_FACTOR = 2;

/** Units of the budget: groups of `replicates` wells. */
export function budgetUnits(c: PlanConstraints): number {
  return Math.floor(c.wells / c.replicates);
}

/** n levels from low to high, evenly spaced on a log scale (ascending). */
export function geometricLevels(n: number, low: number, high: number): number[] {
  if (n === 1) return [high];
  return Array.from({ length: n }, (_, k) => low * (high / low) ** (k / (n - 1)));
}

/**
 * n positive levels reaching `high` as the scheme allows: free (geometric from low), serial
 * (high / fold^k) or a list (n entries at most `high`, spread evenly over the sorted list).
 */
export function schemeLevels(n: number, low: number, high: number, scheme: DilutionScheme, which: 'substrate' | 'inhibitor'): number[] {
  if (scheme.kind === 'serial') return Array.from({ length: n }, (_, k) => high / scheme.fold ** (n - 1 - k));
  if (scheme.kind === 'list') {
    const list = scheme[which];
    if (list && list.length > 0) {
      const allowed = distinctLevels(list.filter((x) => x > 0 && x <= high * (1 + 1e-12)));
      if (allowed.length <= n) return allowed;
      if (n === 1) return [allowed[allowed.length - 1]];
      return Array.from({ length: n }, (_, k) => allowed[Math.round((k * (allowed.length - 1)) / (n - 1))]);
    }
  }
  return geometricLevels(n, low, high);
}

/** The full grid of the levels (I = 0 included by the caller), `units` per point times replicates. */
export function gridPoints(substrate: readonly number[], inhibitor: readonly number[], replicates: number): DesignPoint[] {
  return inhibitor.flatMap((i) => substrate.map((s) => ({ substrate: roundLevel(s), inhibitor: roundLevel(i), replicates })));
}

/** Concentrations are rounded to 4 significant digits, as they will be pipetted and written on the plate map. */
function roundLevel(x: number): number {
  return x === 0 ? 0 : Number(x.toPrecision(4));
}

/** Grid dimensions for the common grid at the budget: up to 5 non-zero [I] levels, at least 6 [S] levels when possible. */
export function commonGridShape(units: number): { substrate: number; inhibitor: number } {
  for (let nI = 5; nI >= 2; nI--) {
    const nS = Math.floor(units / (nI + 1));
    if (nS >= 6) return { substrate: nS, inhibitor: nI };
  }
  return { substrate: Math.max(2, Math.floor(units / 3)), inhibitor: 2 };
}

export function commonGrid(km: number, ic50: number, c: PlanConstraints): Design {
  const shape = commonGridShape(budgetUnits(c));
  const sHigh = Math.min(COMMON_GRID_SUBSTRATE_SPAN[1] * km, c.maxSubstrate);
  const iHigh = Math.min(COMMON_GRID_INHIBITOR_SPAN[1] * ic50, c.maxInhibitor);
  const s = geometricLevels(shape.substrate, COMMON_GRID_SUBSTRATE_SPAN[0] * km, sHigh);
  const i = [0, ...geometricLevels(shape.inhibitor, COMMON_GRID_INHIBITOR_SPAN[0] * ic50, iHigh)];
  return {
    name: 'common-grid',
    description: `[S] ${shape.substrate} levels from Km/5 to 5 Km, [I] 0 and ${shape.inhibitor} levels from IC50/3 to 3 IC50 (Km ${fmt(km)}, IC50 ${fmt(ic50)})`,
    points: gridPoints(s, i, c.replicates),
  };
}

export function singleInhibitorDesign(km: number, ic50: number, c: PlanConstraints): Design {
  const nS = Math.max(2, Math.floor(budgetUnits(c) / 2));
  const s = geometricLevels(nS, COMMON_GRID_SUBSTRATE_SPAN[0] * km, Math.min(COMMON_GRID_SUBSTRATE_SPAN[1] * km, c.maxSubstrate));
  const level = Math.min(SINGLE_INHIBITOR_FACTOR * ic50, c.maxInhibitor);
  return {
    name: 'single-inhibitor',
    description: `[S] ${nS} levels from Km/5 to 5 Km at [I] = 0 and at one level, ${SINGLE_INHIBITOR_FACTOR} x IC50 = ${fmt(level)}`,
    points: gridPoints(s, [0, level], c.replicates),
  };
}

export function fmt(x: number): string {
  return String(Number(x.toPrecision(3)));
}
