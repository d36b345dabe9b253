/**
 * Counts the runs of equal signs in a sequence of residuals: the statistic of the
 * Wald-Wolfowitz runs test (Wald, A. and Wolfowitz, J. (1940) Ann. Math. Stat. 11, 147-162).
 *
 * Convention for zeros: an exact zero has no sign, so it is dropped before counting and the
 * number dropped is reported (`zerosDropped`); the neighbours of a dropped zero are then
 * compared with each other. Non-finite values are an error, never dropped.
 */

export interface SignRunCount {
  /** number of maximal blocks of consecutive equal signs (0 when every value is zero) */
  runs: number;
  /** count of strictly positive values */
  nPositive: number;
  /** count of strictly negative values */
  nNegative: number;
  /** count of exact zeros that were dropped */
  zerosDropped: number;
}

export function countSignRuns(values: ArrayLike<number>): SignRunCount {
  let runs = 0;
  let nPositive = 0;
  let nNegative = 0;
  let zerosDropped = 0;
  let previousSign = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) {
      throw new RangeError(`countSignRuns: value at index ${i} is not a finite number (${v})`);
    }
    if (v === 0) {
      zerosDropped++;
      continue;
    }
    const sign = v > 0 ? 1 : -1;
    if (sign > 0) nPositive++;
    else nNegative++;
    if (sign !== previousSign) runs++;
    previousSign = sign;
  }
  return { runs, nPositive, nNegative, zerosDropped };
}
