/**
 * The initial-rate window: the longest start of the progress curve that is consistent with a
 * straight line.
 *
 * For each start of the curve (first k usable reads, k from all of them down to MIN_WINDOW_READS),
 * a quadratic is fitted and its squared term tested (t test, two-sided). The start is straight
 * when the term is not significant at CURVATURE_P, or when the slope it implies changes by at
 * most CURVATURE_TOLERANCE between the first and the last read of the window (a real curvature too
 * small to move the line's slope by more than about half of that). The longest straight start is
 * the window (when the substrate use is known, the caller also keeps it within SUBSTRATE_USE_LIMIT,
 * the initial-rate condition of common practice: plate-rates.ts); its straight-line fit gives the rate and its standard error (ordinary least squares,
 * s / sqrt(Sxx)). When no start passes, the shortest one is used and marked `forced`.
 * Common practice for initial rates (e.g. Copeland (2000) Enzymes, 2nd ed., ch. 5: the linear
 * early phase of the progress curve); the test is the project's own formulation.
 */
import { quadraticFit } from './conversion.js';
import { CURVATURE_P, CURVATURE_TOLERANCE, MIN_WINDOW_READS } from './thresholds.js';
import type { RateWindow } from './types.js';

/** Straight line through the first n points: slope, intercept, SE of the slope, residual SD. */
export function lineThrough(t: readonly number[], y: readonly number[], n: number): { slope: number; intercept: number; se: number; residualSd: number } {
  let mt = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mt += t[i];
    my += y[i];
  }
  mt /= n;
  my /= n;
  let stt = 0;
  let sty = 0;
  for (let i = 0; i < n; i++) {
    stt += (t[i] - mt) ** 2;
    sty += (t[i] - mt) * (y[i] - my);
  }
  const slope = sty / stt;
  const intercept = my - slope * mt;
  let sse = 0;
  for (let i = 0; i < n; i++) sse += (y[i] - intercept - slope * t[i]) ** 2;
  const residualSd = n > 2 ? Math.sqrt(sse / (n - 2)) : Number.NaN;
  return { slope, intercept, se: residualSd / Math.sqrt(stt), residualSd };
}

/** Whether the first n reads are straight, with the test's p value and relative slope change. */
function straightnessOf(t: readonly number[], y: readonly number[], n: number): { straight: boolean; p: number; slopeChange: number } {
  const q = quadraticFit(t, y, n);
  const start = q.slopeAt(t[0]);
  const end = q.slopeAt(t[n - 1]);
  const middle = q.slopeAt((t[0] + t[n - 1]) / 2);
  const slopeChange = middle !== 0 ? (end - start) / Math.abs(middle) : Number.POSITIVE_INFINITY;
  const straight = q.p >= CURVATURE_P || Math.abs(slopeChange) <= CURVATURE_TOLERANCE;
  return { straight, p: q.p, slopeChange };
}

/**
 * The window for a curve of at least MIN_WINDOW_READS reads (times increasing). `maxReads` caps
 * its length (the substrate-use limit); the window never has fewer than MIN_WINDOW_READS reads.
 */
export function chooseWindow(t: readonly number[], y: readonly number[], maxReads = t.length): RateWindow {
  const n = Math.max(MIN_WINDOW_READS, Math.min(t.length, maxReads));
  let chosen = -1;
  let p = Number.NaN;
  for (let k = n; k >= MIN_WINDOW_READS; k--) {
    const test = straightnessOf(t, y, k);
    if (test.straight) {
      chosen = k;
      p = test.p;
      break;
    }
  }
  const forced = chosen < 0;
  if (forced) {
    chosen = MIN_WINDOW_READS;
    p = straightnessOf(t, y, chosen).p;
  }
  const line = lineThrough(t, y, chosen);
  return {
    first: 0,
    last: chosen - 1,
    from: t[0],
    to: t[chosen - 1],
    reads: chosen,
    slope: line.slope,
    intercept: line.intercept,
    se: line.se,
    residualSd: line.residualSd,
    curvatureP: p,
    forced,
  };
}
