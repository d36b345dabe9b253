/**
 * Correction of window rates for the substrate used inside the window.
 *
 * A straight line through a stretch of a Michaelis-Menten progress curve has the slope of a chord,
 * below the tangent at t = 0 by about (f/2) Km/(Km + S0) for a fraction f used: most at low [S],
 * which would bend the rate curve like a larger Km (BRIEF section 15). With Km known the chord can
 * be computed exactly: for a trial v0, the curve P(t) of the integrated equation (Vmax = v0 (Km +
 * S0)/S0; Schnell & Mendoza 1997) is sampled at the window's read times and fitted by the same
 * least-squares line; v0 is scaled by observed slope / simulated slope until the two agree.
 *
 * Km comes from the plate itself: for each compound and [I], v = Vapp S/(Kmapp + S) is fitted to
 * the window rates of its unflagged wells (weights 1/SE^2; Kmapp on a log grid, Vapp by linear
 * least squares at each Kmapp, which is exact for fixed Kmapp). A series with fewer than
 * MIN_SERIES_LEVELS [S] levels is left uncorrected and its wells say so. The correction is
 * second order in f, so an error in Kmapp moves it only a little; each well reports its factor.
 */
import { productFormed } from './integrated-michaelis-menten.js';
import { lineThrough } from './initial-window.js';
import type { WellRate } from './types.js';

/** Fewest distinct [S] levels in a series for its Kmapp to be estimated (the project's own choice). */
const MIN_SERIES_LEVELS = 3;

const GRID_POINTS = 241;

/** Kmapp of one series by weighted least squares on a log grid from min[S]/100 to 100 max[S]. */
function seriesKm(points: readonly { s: number; v: number; w: number }[]): number {
  const sMin = Math.min(...points.map((p) => p.s));
  const sMax = Math.max(...points.map((p) => p.s));
  const lo = Math.log(sMin / 100);
  const hi = Math.log(sMax * 100);
  let best = Number.POSITIVE_INFINITY;
  let bestK = Math.exp(hi);
  for (let g = 0; g < GRID_POINTS; g++) {
    const k = Math.exp(lo + ((hi - lo) * g) / (GRID_POINTS - 1));
    let sxx = 0;
    let sxv = 0;
    for (const p of points) {
      const x = p.s / (k + p.s);
      sxx += p.w * x * x;
      sxv += p.w * x * p.v;
    }
    const vmax = sxv / sxx;
    let sse = 0;
    for (const p of points) sse += p.w * (p.v - (vmax * p.s) / (k + p.s)) ** 2;
    if (sse < best) {
      best = sse;
      bestK = k;
    }
  }
  return bestK;
}

/** The factor v0 / chord slope for a window of `times` on a curve with this Km and S0. */
export function chordFactor(times: readonly number[], observedSlope: number, km: number, s0: number): number {
  if (!(observedSlope > 0)) return 1;
  let v0 = observedSlope;
  for (let step = 0; step < 8; step++) {
    const vmax = (v0 * (km + s0)) / s0;
    const product = times.map((t) => productFormed(t, vmax, km, s0));
    const simulated = lineThrough(times, product, times.length).slope;
    const next = (v0 * observedSlope) / simulated;
    const done = Math.abs(next - v0) <= 1e-12 * v0;
    v0 = next;
    if (done) break;
  }
  return v0 / observedSlope;
}

/** Applies the correction to window rates in place; returns notes for series left uncorrected. */
export function correctForDepletion(wells: WellRate[]): string[] {
  const series = new Map<string, WellRate[]>();
  for (const w of wells) {
    if (w.method !== 'window' || w.rate === null || w.substrate === null || !(w.substrate > 0) || w.fractionUsed === null) continue;
    const key = `${w.compound}\u0000${w.inhibitor}`;
    series.set(key, [...(series.get(key) ?? []), w]);
  }
  const notes: string[] = [];
  for (const list of series.values()) {
    const good = list.filter((w) => w.flags.length === 0 && w.role === 'sample' && w.rate! > 0);
    const levels = new Set(good.map((w) => w.substrate)).size;
    if (levels < MIN_SERIES_LEVELS) {
      for (const w of list) w.depletion = { factor: 1, km: null, note: `not corrected for substrate use: the series has ${levels} usable [S] levels, ${MIN_SERIES_LEVELS} are needed to estimate its Km` };
      const first = list[0];
      notes.push(`${first.compound ? `${first.compound}, ` : ''}[I] = ${first.inhibitor}: window rates not corrected for substrate use (${levels} usable [S] levels, ${MIN_SERIES_LEVELS} needed)`);
      continue;
    }
    const km = seriesKm(good.map((w) => ({ s: w.substrate!, v: w.rate!, w: w.se && w.se > 0 ? 1 / (w.se * w.se) : 1 })));
    for (const w of list) {
      const times = w.times.slice(w.window!.first, w.window!.last + 1);
      const factor = chordFactor(times, w.rate!, km, w.substrate!);
      w.rate = w.rate! * factor;
      w.se = w.se === null ? null : w.se * factor;
      w.depletion = { factor, km, note: null };
    }
  }
  return notes;
}
