/**
 * Axis titles with units, from the units of the analysed table (result.input.units). A missing
 * unit leaves the quantity without a parenthesis rather than inventing one.
 */
import type { AnalysisResult } from '../analysis/types.js';

export interface AxisUnits {
  substrate: string | null;
  inhibitor: string | null;
  rate: string | null;
}

/** 'uM' is written with the micro sign; other units as given. */
export function displayUnit(unit: string | null | undefined): string | null {
  if (unit === null || unit === undefined || unit.trim() === '') return null;
  return unit.replace(/^u(?=M\b)/, 'µ').replace(/\bu(?=M\b)/g, 'µ');
}

export function axisUnits(result: AnalysisResult): AxisUnits {
  const u = result.input.units;
  return { substrate: displayUnit(u.substrate), inhibitor: displayUnit(u.inhibitor), rate: displayUnit(u.rate) };
}

/** True when a unit has to be bracketed before it is raised to a power or divided by. */
function compound(unit: string): boolean {
  return /[/·*\s]/.test(unit);
}

/** The reciprocal of a unit: 'µM' -> 'µM⁻¹', 'nM/s' -> '(nM/s)⁻¹'. */
export function reciprocalUnit(unit: string | null): string | null {
  if (unit === null) return null;
  return compound(unit) ? `(${unit})⁻¹` : `${unit}⁻¹`;
}

/** A quotient of units: ('µM', 'nM/s') -> 'µM/(nM/s)', ('nM/s', 'µM') -> '(nM/s)/µM'. */
export function quotientUnit(top: string | null, bottom: string | null): string | null {
  if (top === null && bottom === null) return null;
  if (bottom === null) return top;
  const t = top === null ? '1' : compound(top) ? `(${top})` : top;
  const b = compound(bottom) ? `(${bottom})` : bottom;
  return `${t}/${b}`;
}

/** "quantity (unit)" or just the quantity. */
export function withUnit(quantity: string, unit: string | null): string {
  return unit ? `${quantity} (${unit})` : quantity;
}
