/**
 * The geometry of the linear replots, from the constants of a global fit (pure functions; the
 * figures draw exactly these lines, and test/figures/replot-geometry.test.ts checks where they
 * meet against the published results).
 *
 * Every mechanism is written as the mixed rate law with an absent arm at infinity:
 *   v = Vmax·S / (Km·(1 + I/Ki) + S·(1 + I/Kiu))
 * (competitive: Kiu = ∞; uncompetitive: Ki = ∞; noncompetitive: Ki = Kiu; none: both ∞;
 * Segel, I. H. (1975) Enzyme Kinetics, ch. 3). Rearranged, each replot is a straight line in its
 * own coordinates, one line per level of the concentration held fixed:
 *
 *   double reciprocal  1/v  = (Km/Vmax)(1 + I/Ki)·(1/S) + (1 + I/Kiu)/Vmax          per [I]
 *                      (Lineweaver, H. and Burk, D. (1934) J. Am. Chem. Soc. 56, 658-666)
 *   Dixon              1/v  = (Km/(Ki·S) + 1/Kiu)·I/Vmax + (Km/S + 1)/Vmax          per [S]
 *                      (Dixon, M. (1953) Biochem. J. 55, 170-171)
 *   Cornish-Bowden     S/v  = (Km/Ki + S/Kiu)·I/Vmax + (Km + S)/Vmax                per [S]
 *                      (Cornish-Bowden, A. (1974) Biochem. J. 137, 143-144)
 *   Hanes-Woolf        S/v  = (1 + I/Kiu)/Vmax·S + Km(1 + I/Ki)/Vmax                per [I]
 *   Eadie-Hofstee      v    = -Km_app·(v/S) + Vmax_app                                per [I]
 *   slope replot       Km_app/Vmax_app = Km/Vmax + Km/(Vmax·Ki)·I    (x-intercept -Ki)
 *   intercept replot   1/Vmax_app      = 1/Vmax + 1/(Vmax·Kiu)·I     (x-intercept -Kiu)
 * with Vmax_app = Vmax/(1 + I/Kiu) and Km_app = Km(1 + I/Ki)/(1 + I/Kiu).
 * (Hanes-Woolf, Eadie-Hofstee and the slope/intercept replots as set out in Cornish-Bowden, A.
 * (2012) Fundamentals of Enzyme Kinetics, 4th ed.)
 */
import type { ModelResult } from '../analysis/types.js';
import { inhibitionArms } from '../evidence/constants/apparent-constants.js';

/** The rate constants of a global fit, an absent arm at +Infinity. */
export interface RateConstants {
  Vmax: number;
  Km: number;
  Ki: number;
  Kiu: number;
}

/** A straight line y = slope·x + intercept. */
export interface Line {
  slope: number;
  intercept: number;
}

export interface Point {
  x: number;
  y: number;
}

/** The constants of a fitted model, in the mixed form (see the file comment and inhibitionArms). */
export function rateConstants(model: Pick<ModelResult, 'mechanism' | 'fit'>): RateConstants {
  const names = model.fit.model.params;
  const p = model.fit.params;
  const { ki, kiu } = inhibitionArms(model.mechanism, names, p);
  return { Vmax: p[names.indexOf('Vmax')], Km: p[names.indexOf('Km')], Ki: ki, Kiu: kiu };
}

/** The global-fit rate at (S, I). */
export function modelRate(c: RateConstants, s: number, i: number): number {
  return (c.Vmax * s) / (c.Km * (1 + i / c.Ki) + s * (1 + i / c.Kiu));
}

/**
 * Apparent Michaelis-Menten constants at inhibitor level I, from constants already in the mixed
 * form (src/evidence/constants/apparent-constants.ts computes the same from a fit's parameter vector).
 */
function apparentAtLevel(c: RateConstants, i: number): { Vmax: number; Km: number } {
  const u = 1 + i / c.Kiu;
  return { Vmax: c.Vmax / u, Km: (c.Km * (1 + i / c.Ki)) / u };
}

/** 1/v against 1/[S] at inhibitor level I. */
export function doubleReciprocalLine(c: RateConstants, i: number): Line {
  return { slope: (c.Km / c.Vmax) * (1 + i / c.Ki), intercept: (1 + i / c.Kiu) / c.Vmax };
}

/** 1/v against [I] at substrate level S. */
export function dixonLine(c: RateConstants, s: number): Line {
  return { slope: (c.Km / (c.Ki * s) + 1 / c.Kiu) / c.Vmax, intercept: (c.Km / s + 1) / c.Vmax };
}

/** [S]/v against [I] at substrate level S. */
export function cornishBowdenLine(c: RateConstants, s: number): Line {
  return { slope: (c.Km / c.Ki + s / c.Kiu) / c.Vmax, intercept: (c.Km + s) / c.Vmax };
}

/** [S]/v against [S] at inhibitor level I. */
export function hanesWoolfLine(c: RateConstants, i: number): Line {
  return { slope: (1 + i / c.Kiu) / c.Vmax, intercept: (c.Km * (1 + i / c.Ki)) / c.Vmax };
}

/** v against v/[S] at inhibitor level I. */
export function eadieHofsteeLine(c: RateConstants, i: number): Line {
  const app = apparentAtLevel(c, i);
  return { slope: -app.Km, intercept: app.Vmax };
}

/** Km_app/Vmax_app (the double-reciprocal slope) against [I]. */
export function slopeReplotLine(c: RateConstants): Line {
  return { slope: c.Km / (c.Vmax * c.Ki), intercept: c.Km / c.Vmax };
}

/** 1/Vmax_app (the double-reciprocal intercept) against [I]. */
export function interceptReplotLine(c: RateConstants): Line {
  return { slope: 1 / (c.Vmax * c.Kiu), intercept: 1 / c.Vmax };
}

/** Where the line crosses y = 0; null for a horizontal line. */
export function xIntercept(line: Line): number | null {
  return line.slope === 0 || !Number.isFinite(line.slope) ? null : -line.intercept / line.slope;
}

/**
 * Where two lines meet; null when they are parallel to working precision (slopes equal within
 * 1e-9 of their size), as the double-reciprocal lines of an uncompetitive fit are.
 */
export function meetingPoint(a: Line, b: Line): Point | null {
  const ds = a.slope - b.slope;
  const scale = Math.max(Math.abs(a.slope), Math.abs(b.slope));
  if (!(Math.abs(ds) > 1e-9 * scale)) return null;
  const x = (b.intercept - a.intercept) / ds;
  return { x, y: a.slope * x + a.intercept };
}

/** The coordinates each replot puts a measured point at. */
export const REPLOT_TRANSFORMS = {
  doubleReciprocal: (s: number, _i: number, v: number): Point => ({ x: 1 / s, y: 1 / v }),
  dixon: (_s: number, i: number, v: number): Point => ({ x: i, y: 1 / v }),
  cornishBowden: (s: number, i: number, v: number): Point => ({ x: i, y: s / v }),
  hanesWoolf: (s: number, _i: number, v: number): Point => ({ x: s, y: s / v }),
  eadieHofstee: (s: number, _i: number, v: number): Point => ({ x: v / s, y: v }),
} as const;
