/**
 * When does a fitted inhibition constant mean "this arm of the mechanism is not detected"?
 *
 * A constant K enters the rate through the factor (1 + I/K). At the highest inhibitor
 * concentration tested, K > 100 * I_max changes that factor by less than 1%, far below what a
 * kinetic assay resolves. Such an estimate is reported as "not detected, K > bound", never as a
 * number. The factor 100 is this project's documented choice (common practice, no single source).
 */
export const DETECTION_FACTOR = 100;

export function detectionBound(maxInhibitor: number): number {
  return DETECTION_FACTOR * (maxInhibitor > 0 ? maxInhibitor : 1);
}
