/**
 * Rates that show no enzyme activity at all, found before any model is fitted: every rate zero or
 * negative, or every rate the same. Fitting the five mechanisms to such a table only ranks
 * rounding noise, so the analysis stops with a plain statement of what the rates look like and
 * what to check (the sign convention of the slope, the blank subtraction, the column chosen).
 */
import type { FitData } from '../../fit/fit-data.js';
import { rounded } from '../../text/format-number.js';

type NoActivityKind = 'all-zero' | 'not-positive' | 'all-equal' | 'control-not-positive' | 'too-few-positive';

/** A rate curve needs at least this many positive rates to be described at all (the Michaelis-Menten model has 2 constants). */
const FEWEST_POSITIVE_RATES = 3;

interface NoActivityFinding {
  kind: NoActivityKind;
  message: string;
}

const sig = (x: number): string => rounded(x, 3);

/** The finding when the rates show no activity, else null. */
export function noActivityFinding(data: FitData): NoActivityFinding | null {
  const n = data.v.length;
  if (n === 0) return null;
  let max = -Infinity;
  let min = Infinity;
  let controlMax = -Infinity;
  let controls = 0;
  let positive = 0;
  for (let k = 0; k < n; k++) {
    if (data.v[k] > 0) positive++;
    max = Math.max(max, data.v[k]);
    min = Math.min(min, data.v[k]);
    if (data.i[k] === 0) {
      controls++;
      controlMax = Math.max(controlMax, data.v[k]);
    }
  }
  if (max === 0 && min === 0)
    return { kind: 'all-zero', message: 'no activity: every rate is zero, so there is nothing to fit; check that the enzyme was active and that the rate column is the right one' };
  if (max <= 0)
    return {
      kind: 'not-positive',
      message: `no activity: every rate is zero or negative (highest ${sig(max)}); if the signal falls as product forms, reverse the sign of the slopes; otherwise check the blank subtraction`,
    };
  if (max === min)
    return {
      kind: 'all-equal',
      message: `every rate equals ${sig(max)}: the rates do not change with [S] or [I], so no mechanism can be read from them; check that the column holds measured rates and not a copied value`,
    };
  if (positive < FEWEST_POSITIVE_RATES)
    return {
      kind: 'too-few-positive',
      message: `no activity to fit: only ${positive} of ${n} rates are positive (at least ${FEWEST_POSITIVE_RATES} are needed); check the blank subtraction and the rate column`,
    };
  if (controls > 0 && controlMax <= 0)
    return {
      kind: 'control-not-positive',
      message: `no activity without inhibitor: every rate at [I] = 0 is zero or negative (highest ${sig(controlMax)}); check the control wells and the blank subtraction`,
    };
  return null;
}
