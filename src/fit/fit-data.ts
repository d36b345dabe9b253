/** The numeric arrays a fit works on, built once from a RateTable. */
import type { RateTable } from '../input/types.js';

export interface FitData {
  /** substrate concentration per point */
  s: Float64Array;
  /** inhibitor concentration per point */
  i: Float64Array;
  /** observed rate per point */
  v: Float64Array;
  /** per-point SD from the file, when present for every point */
  sd?: Float64Array;
  /** concentration units of s and i, when the table knows them (for messages only; never for the fit) */
  units?: { substrate: string | null; inhibitor: string | null };
  /** total active enzyme per point, in inhibitor units (tight-binding models only) */
  e?: Float64Array;
  /** true: every point is its own residual, never pooled with its replicates (src/fit/replicate-groups.ts) */
  perPointFit?: boolean;
}

export function fitDataFromTable(table: RateTable): FitData {
  const n = table.points.length;
  const s = new Float64Array(n);
  const i = new Float64Array(n);
  const v = new Float64Array(n);
  let sd: Float64Array | undefined = new Float64Array(n);
  table.points.forEach((p, k) => {
    s[k] = p.substrate;
    i[k] = p.inhibitor;
    v[k] = p.rate;
    if (sd && p.sd !== undefined && p.sd > 0) sd[k] = p.sd;
    else sd = undefined;
  });
  const units = { substrate: table.units.substrate, inhibitor: table.units.inhibitor };
  return sd ? { s, i, v, sd, units } : { s, i, v, units };
}

/** A FitData from plain arrays (library convenience). */
export function fitDataFromArrays(s: ArrayLike<number>, i: ArrayLike<number>, v: ArrayLike<number>, sd?: ArrayLike<number>): FitData {
  const data: FitData = { s: Float64Array.from(s), i: Float64Array.from(i), v: Float64Array.from(v) };
  if (sd) data.sd = Float64Array.from(sd);
  return data;
}

/** The highest inhibitor concentration tested (0 for a table without inhibitor). */
export function maxInhibitor(data: FitData): number {
  let imax = 0;
  for (const x of data.i) if (x > imax) imax = x;
  return imax;
}

/** The highest substrate concentration tested (a loop: no spread of a million-point array). */
export function maxSubstrate(data: FitData): number {
  let smax = 0;
  for (const x of data.s) if (x > smax) smax = x;
  return smax;
}

/** The points at the given indices, in that order. */
export function subsetFitData(data: FitData, indices: readonly number[]): FitData {
  const pick = (a: Float64Array) => Float64Array.from(indices, (k) => a[k]);
  return { s: pick(data.s), i: pick(data.i), v: pick(data.v), ...(data.sd ? { sd: pick(data.sd) } : {}), ...(data.e ? { e: pick(data.e) } : {}) };
}
