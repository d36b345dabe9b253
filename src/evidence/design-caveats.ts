/**
 * Design checks that need the fitted constants, turned into verdict caveats (BRIEF section 7;
 * NIH/NCATS Assay Guidance Manual, mechanism-of-action chapter; thresholds are common practice).
 *
 *  - highest [S] below 2 x Km: the effect on the enzyme-substrate complex (Vmax) is barely seen,
 *    so competitive, noncompetitive and mixed cannot be told apart reliably (blocking);
 *  - highest [S] below 5 x Km: uncompetitive and mixed arms poorly determined (warning);
 *  - lowest [S] above Km: the effect on free enzyme (Km) is barely seen (blocking);
 *  - a single non-zero [I]: the mechanism rests on one inhibited series (blocking);
 *  - highest [I] below the fitted inhibition constant: inhibition is weak over the whole range (warning).
 */
import { withUnit, type FitData } from '../fit/fit-data.js';
import type { Caveat } from './verdict.js';

interface FittedScale {
  Km: number;
  /** the smaller detected inhibition constant of the winning model, if any */
  K?: number;
}

function fmt(x: number): string {
  return Number(x.toPrecision(2)).toString();
}

export function designCaveats(data: FitData, fitted: FittedScale): Caveat[] {
  const out: Caveat[] = [];
  let smax = 0;
  let smin = Infinity;
  let imax = 0;
  const levels = new Set<number>();
  for (let k = 0; k < data.v.length; k++) {
    smax = Math.max(smax, data.s[k]);
    smin = Math.min(smin, data.s[k]);
    imax = Math.max(imax, data.i[k]);
    if (data.i[k] > 0) levels.add(data.i[k]);
  }
  const km = fitted.Km;
  if (km > 0 && Number.isFinite(km)) {
    const top = smax / km;
    if (top < 2) {
      out.push({
        code: 'substrate-below-2km',
        message: `the highest [S] is only ${fmt(top)} x Km: effects on the enzyme-substrate complex are barely visible`,
        blocking: true,
        suggestion: 'add substrate concentrations up to 5-10 x Km',
        headline: `The highest [S] is only ${fmt(top)} x Km, too low to tell the mechanisms apart: no firm call.`,
      });
    } else if (top < 5) {
      out.push({
        code: 'substrate-below-5km',
        message: `the highest [S] is ${fmt(top)} x Km (below 5 x Km): the uncompetitive arm is poorly determined`,
        blocking: false,
        suggestion: 'add substrate concentrations up to 5-10 x Km',
      });
    }
    if (smin / km > 1) {
      out.push({
        code: 'substrate-above-km',
        message: `the lowest [S] is ${fmt(smin / km)} x Km: effects on free enzyme are barely visible`,
        blocking: true,
        suggestion: 'add substrate concentrations down to about 0.2 x Km',
      });
    }
  }
  if (levels.size === 1) {
    out.push({
      code: 'single-inhibitor-level',
      message: 'only one non-zero inhibitor concentration was tested: the mechanism rests on a single inhibited series',
      blocking: true,
      suggestion: 'test at least three non-zero inhibitor concentrations, for example 0.5, 1, 2 and 4 x Ki',
    });
  }
  if (fitted.K !== undefined && Number.isFinite(fitted.K) && imax < fitted.K) {
    out.push({
      code: 'inhibitor-below-k',
      message: `the highest [I] (${withUnit(fmt(imax), data.units?.inhibitor)}) stays below the fitted inhibition constant (${withUnit(fmt(fitted.K), data.units?.inhibitor)}): inhibition is weak throughout`,
      blocking: false,
      suggestion: 'extend [I] to several times the inhibition constant',
    });
  }
  return out;
}
