/**
 * Blank correction: the background of no-enzyme wells, subtracted read by read.
 *
 * For a sample well, the blanks are the wells of role `blank` on the same plate at the same [S]
 * and the same [I]; a blank that leaves [I] empty serves every [I] at its [S]. Blanks with the
 * sample's [I] are preferred; without any, those with [I] not given are used. The background at
 * each read time is the mean of those blanks, each interpolated linearly in time (held at its end
 * values outside its range). Without a matching blank nothing is subtracted, and the well says so.
 * (Blank wells give the drift to subtract: BRIEF section 15, common practice.)
 */
import type { MapEntry, WellCurve } from './types.js';
import { listWells } from './well-names.js';

interface BlankChoice {
  /** background at each read time of the sample, or null when no blank matches */
  background: number[] | null;
  description: string;
}

/** Value of a curve at time x, by linear interpolation (ends held). */
function interpolate(times: readonly number[], values: readonly number[], x: number): number {
  const n = times.length;
  if (x <= times[0]) return values[0];
  if (x >= times[n - 1]) return values[n - 1];
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (times[mid] <= x) lo = mid;
    else hi = mid;
  }
  const f = (x - times[lo]) / (times[hi] - times[lo]);
  return values[lo] + f * (values[hi] - values[lo]);
}

export function chooseBlank(
  sample: MapEntry,
  times: readonly number[],
  blanks: readonly { entry: MapEntry; curve: WellCurve }[],
): BlankChoice {
  const atS = blanks.filter((b) => b.entry.substrate === sample.substrate && b.curve.times.length > 0);
  const sameI = atS.filter((b) => b.entry.inhibitor !== null && b.entry.inhibitor === sample.inhibitor);
  const anyI = atS.filter((b) => b.entry.inhibitor === null);
  const used = sameI.length > 0 ? sameI : anyI;
  if (used.length === 0) return { background: null, description: 'no blank at this [S] and [I]: not blank-corrected' };
  const background = times.map((x) => {
    let sum = 0;
    for (const b of used) sum += interpolate(b.curve.times, b.curve.signals, x);
    return sum / used.length;
  });
  const which = sameI.length > 0 ? 'same [S] and [I]' : 'same [S], [I] not given';
  return { background, description: `minus the mean of blank ${used.length === 1 ? 'well' : 'wells'} ${listWells(used.map((b) => b.entry.well))} (${which})` };
}
