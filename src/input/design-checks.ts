/**
 * Design checks that need the fitted constants (pure): the one place for their thresholds and
 * wording. The analysis turns them into verdict caveats (src/evidence/checks/design-caveats.ts); the
 * library's designWarnings (design-warnings.ts) turns them into input warnings.
 *
 * Targets (BRIEF section 7; NIH/NCATS Assay Guidance Manual, mechanism-of-action chapter, for
 * [S] from about 0.2 x Km to at least 5 x Km and [I] up to several times Ki; the cut-offs are
 * common practice):
 *  - highest [S] below 2 x Km: the effect on the enzyme-substrate complex (Vmax) is barely seen,
 *    so competitive, noncompetitive and mixed cannot be told apart reliably (blocking);
 *  - highest [S] below 5 x Km: uncompetitive and mixed arms poorly determined (warning);
 *  - lowest [S] above Km: the effect on free enzyme (Km) is barely seen (blocking);
 *  - a single non-zero [I]: the mechanism rests on one inhibited series (blocking);
 *  - highest [I] below the fitted inhibition constant: inhibition is weak over the whole range (warning).
 */
import { rounded, valueWithUnit } from '../text/format-number.js';

/** Below this multiple of Km for the highest [S], no firm call (blocking). */
const SUBSTRATE_FLOOR_OVER_KM = 2;
/** The highest [S] should reach at least this multiple of Km. */
const SUBSTRATE_REACH_OVER_KM = 5;
/** Above this multiple of Km for the lowest [S], the effect on free enzyme is barely seen (blocking). */
const LOWEST_SUBSTRATE_OVER_KM = 1;

/** One design shortfall: a code, its sentence, whether it blocks a firm call, and the fix. */
interface DesignFinding {
  code: string;
  message: string;
  blocking: boolean;
  suggestion?: string;
  /** when it blocks the call: the sentence that should lead the verdict */
  headline?: string;
}

/** The fitted constants the checks compare with, in the table's units. */
export interface DesignScale {
  Km: number;
  /** the smaller detected inhibition constant, if any */
  K?: number;
}

const fmt = (x: number): string => rounded(x, 2);

/**
 * The design findings for points at substrate s[k] and inhibitor i[k] against the fitted scale.
 * A Km or K that is not finite (an arm not detected) is skipped: there is no range to compare with.
 */
export function designFindings(s: ArrayLike<number>, i: ArrayLike<number>, fitted: DesignScale, inhibitorUnit?: string | null): DesignFinding[] {
  const out: DesignFinding[] = [];
  let smax = 0;
  let smin = Infinity;
  let imax = 0;
  const levels = new Set<number>();
  for (let k = 0; k < s.length; k++) {
    smax = Math.max(smax, s[k]);
    smin = Math.min(smin, s[k]);
    imax = Math.max(imax, i[k]);
    if (i[k] > 0) levels.add(i[k]);
  }
  const km = fitted.Km;
  if (km > 0 && Number.isFinite(km)) {
    const top = smax / km;
    if (top < SUBSTRATE_FLOOR_OVER_KM) {
      out.push({
        code: 'substrate-below-2km',
        message: `the highest [S] is only ${fmt(top)} x Km: effects on the enzyme-substrate complex are barely visible`,
        blocking: true,
        suggestion: 'add substrate concentrations up to 5-10 x Km',
        headline: `The highest [S] is only ${fmt(top)} x Km, too low to tell the mechanisms apart: no firm call.`,
      });
    } else if (top < SUBSTRATE_REACH_OVER_KM) {
      out.push({
        code: 'substrate-below-5km',
        message: `the highest [S] is ${fmt(top)} x Km (below ${SUBSTRATE_REACH_OVER_KM} x Km): the uncompetitive arm is poorly determined`,
        blocking: false,
        suggestion: 'add substrate concentrations up to 5-10 x Km',
      });
    }
    if (smin / km > LOWEST_SUBSTRATE_OVER_KM) {
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
      message: `the highest [I] (${valueWithUnit(fmt(imax), inhibitorUnit)}) stays below the fitted inhibition constant (${valueWithUnit(fmt(fitted.K), inhibitorUnit)}): inhibition is weak throughout`,
      blocking: false,
      suggestion: 'extend [I] to several times the inhibition constant',
    });
  }
  return out;
}
