/**
 * Agreement to a number of significant digits, as a relative error: |x - ref| <= 0.5 * 10^(1 - d) * |ref|
 * (half a unit in the d-th significant digit). Common practice, no single source.
 */
export function agreesToDigits(x: number, ref: number, digits: number): boolean {
  return Math.abs(x - ref) <= 0.5 * 10 ** (1 - digits) * Math.abs(ref);
}
