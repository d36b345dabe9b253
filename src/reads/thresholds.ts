/**
 * Every threshold of the reads stage in one place, so that README and DEVELOPERS can quote them
 * from the code. Each says where it comes from.
 */

/** Fewest reads an initial-rate window may hold: a quadratic needs 3 parameters and the curvature
 * test then keeps 2 degrees of freedom (the project's own choice). */
export const MIN_WINDOW_READS = 5;

/** Significance level of the curvature test that decides whether a start of the curve is straight
 * (common practice: 5%). */
export const CURVATURE_P = 0.05;

/** A window whose slope changes by at most this fraction from its first to its last read counts as
 * straight even when the change is statistically clear: the line's slope is then within about half
 * of it (1%) of the tangent (the project's own choice, sized for the 2% accuracy target). */
export const CURVATURE_TOLERANCE = 0.02;

/** Substrate use in the window above this fraction is flagged (common practice: the initial-rate
 * condition of "under about 10% converted"). */
export const SUBSTRATE_USE_LIMIT = 0.1;

/** Significance level of the lag and burst tests on the first half of the curve (the project's own
 * choice: much stricter than the window test, since a flag leaves the well out and a 384-well
 * plate holds 384 tests; about 0.4 false flags per plate). */
export const SHAPE_P = 0.001;

/** A decline of the slope over the first half of the curve counts as a burst when it exceeds this
 * many times the fraction of substrate used there (substrate use alone can lower the rate by at
 * most that fraction) and at least BURST_MIN_DECLINE (the project's own choice). */
export const BURST_FACTOR = 2;
export const BURST_MIN_DECLINE = 0.1;

/** Detector saturation without a stated ceiling: at least this many reads of a well equal to the
 * highest reading of the plate (a clipped detector repeats its top value; the project's own choice). */
export const SATURATION_RUN = 3;

/** A well is noisy when the scatter about its line is above this many times the median scatter of
 * the plate's wells (the project's own choice). */
export const NOISY_FACTOR = 3;

/** The integrated Michaelis-Menten fit is used only when the curve goes on to use at least this
 * fraction of the substrate; below it one curve does not determine Km (the project's own choice). */
export const INTEGRATED_MIN_USE = 0.2;

/** Significant digits kept when the fraction of substrate used is compared with its limit, so that
 * a fraction of exactly 10% is not flagged because of rounding in the last bit. */
export const FRACTION_DIGITS = 12;
