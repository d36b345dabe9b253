/**
 * Shape checks of one progress curve that do not depend on the rest of the plate: detector
 * saturation, and a lag or a burst in the first half of the curve.
 *
 * A lag (the rate rises) or a burst (it falls faster than the substrate use can explain) are
 * curvature of the wrong kind for a steady-state initial rate, a hint of slow-binding or
 * time-dependent inhibition (Morrison, J. F. and Walsh, C. T. (1988) Adv. Enzymol. Relat. Areas Mol.
 * Biol. 61, 201-301). Test: a quadratic through the first half of the usable reads (at least
 * MIN_WINDOW_READS). A curve whose squared term is significantly positive (two-sided t test at
 * SHAPE_P) speeds up: a lag. A burst is a slope that falls by significantly more (one-sided t test
 * at SHAPE_P on the squared term, against the fall allowed) than BURST_FACTOR times the fraction
 * of substrate used there, and at least BURST_MIN_DECLINE, relative to the window's slope. Substrate use alone lowers the rate of a
 * Michaelis-Menten enzyme by at most the fraction used (the limit [S] << Km, where v is
 * proportional to [S]).
 */
import { tCdf } from '../stats/distributions.js';
import { quadraticFit } from './conversion.js';
import { formatNumber } from '../input/messages.js';
import { BURST_FACTOR, BURST_MIN_DECLINE, MIN_WINDOW_READS, SATURATION_RUN, SHAPE_P } from './thresholds.js';
import type { WellFlag } from './types.js';

/** Indices of saturated reads: at or above `ceiling` when given, else the plate's top value repeated. */
export function saturatedReads(signals: readonly number[], ceiling: number | undefined, plateTop: number): number[] {
  if (ceiling !== undefined) return signals.flatMap((s, k) => (s >= ceiling ? [k] : []));
  const tolerance = 1e-9 * Math.max(1, Math.abs(plateTop));
  const atTop = signals.flatMap((s, k) => (Math.abs(s - plateTop) <= tolerance ? [k] : []));
  return atTop.length >= SATURATION_RUN ? atTop : [];
}

/**
 * Lag and burst flags. `values` are corrected reads (product concentration when `substrate` is
 * given, else signal); `intercept` is the window line's value at t = 0.
 */
export function shapeFlags(
  times: readonly number[],
  values: readonly number[],
  slope: number,
  intercept: number,
  substrate: number | null,
  timeUnit: string,
): WellFlag[] {
  const n = Math.max(MIN_WINDOW_READS, Math.ceil(times.length / 2));
  if (times.length < n || slope === 0) return [];
  const q = quadraticFit(times, values, n);
  const direction = Math.sign(slope);
  const span = `${formatNumber(times[0])}-${formatNumber(times[n - 1])} ${timeUnit}`;
  if (q.p < SHAPE_P && q.c * direction > 0) {
    return [{ code: 'lag', message: `lag: the rate rises over ${span} (curvature p = ${formatNumber(q.p)}), a hint of slow-binding or time-dependent inhibition, or an assay that is not at steady state` }];
  }
  if (substrate === null || !(substrate > 0) || !(q.seC > 0)) return [];
  const span0 = times[n - 1] - times[0];
  const s0 = Math.abs(slope);
  const decline = (-2 * q.c * direction * span0) / s0;
  const used = Math.max(0, (values[n - 1] - intercept) * direction) / substrate;
  const allowed = Math.max(BURST_MIN_DECLINE, BURST_FACTOR * used);
  // H0: the decline is at most `allowed`, i.e. c * direction >= -allowed s0 / (2 span)
  const t = (q.c * direction + (allowed * s0) / (2 * span0)) / q.seC;
  const p = tCdf(t, n - 3);
  if (p < SHAPE_P) {
    return [{
      code: 'burst',
      message: `burst: the rate falls by ${formatNumber(100 * decline)}% over ${span} while only ${formatNumber(100 * used)}% of the substrate is used (p = ${formatNumber(p)} against a fall of ${formatNumber(100 * allowed)}%), a hint of slow-binding or time-dependent inhibition`,
    }];
  }
  return [];
}
