/**
 * Data-driven starting values shared by the mechanism models. These are rough, cheap estimates
 * from the raw grid (no transformed-data regression is used for results; these only seed the
 * nonlinear fit). Common practice, no single published source.
 */
import type { KineticData } from './types.js';
import { median } from '../stats/median.js';
import { distinctLevels } from '../input/distinct-levels.js';

interface RoughScales {
  /** a little above the largest rate seen without inhibitor (or overall) */
  vmax: number;
  /** substrate concentration at which the uninhibited rate is nearest half of vmax */
  km: number;
  /** distinct non-zero inhibitor levels, ascending */
  inhibitorLevels: number[];
  /** geometric middle of the non-zero inhibitor levels (1 when there are none) */
  inhibitorMiddle: number;
}

/** Rough Vmax, Km and inhibitor scale from the raw data. */
export function roughScales(data: KineticData): RoughScales {
  const n = data.v.length;
  let vmaxFree = 0;
  let vmaxAll = 0;
  for (let k = 0; k < n; k++) {
    if (data.v[k] > vmaxAll) vmaxAll = data.v[k];
    if (data.i[k] === 0 && data.v[k] > vmaxFree) vmaxFree = data.v[k];
  }
  const vmax = 1.2 * (vmaxFree > 0 ? vmaxFree : vmaxAll > 0 ? vmaxAll : 1);
  let km = NaN;
  let best = Infinity;
  const useFree = vmaxFree > 0;
  for (let k = 0; k < n; k++) {
    if (useFree && data.i[k] !== 0) continue;
    const gap = Math.abs(data.v[k] - vmax / 2);
    if (gap < best && data.s[k] > 0) {
      best = gap;
      km = data.s[k];
    }
  }
  if (!(km > 0)) km = median(Array.from(data.s).filter((s) => s > 0)) || 1;
  const levels = distinctLevels(Array.from(data.i).filter((x) => x > 0));
  const inhibitorMiddle =
    levels.length > 0 ? Math.exp(levels.reduce((acc, x) => acc + Math.log(x), 0) / levels.length) : 1;
  return { vmax, km, inhibitorLevels: levels, inhibitorMiddle };
}


/** Inhibition-constant guesses spanning the tested inhibitor range (a small log grid). */
export function inhibitionConstantGuesses(scales: RoughScales): number[] {
  const mid = scales.inhibitorMiddle;
  return [mid * 0.2, mid, mid * 5];
}

/**
 * Two guesses for a single inhibition constant, a decade apart around the middle of the tested
 * [I] range; with the warm start from the no-inhibition solution (the constant far above the
 * range) they bracket where a one-constant model can end up.
 */
export function singleConstantGuesses(scales: RoughScales): number[] {
  const mid = scales.inhibitorMiddle;
  return [mid * 0.3, mid * 3];
}
