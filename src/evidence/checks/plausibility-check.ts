/**
 * Concentrations no enzyme assay uses: a fitted constant (Km, Ki, Kiu) or a tested concentration
 * above IMPLAUSIBLE_MOLAR (0.1 M; chosen here: far beyond the solubility of drug-like compounds
 * and the Km of most enzymes). The usual cause is a unit slip (uM values in a column labelled M).
 * Checked only where the table gives the unit.
 */
import type { ConcentrationUnit } from '../../input/types.js';
import { unitShift } from '../../input/units.js';
import type { Caveat, ImplausibleValue } from '../verdict/caveat.js';

export const IMPLAUSIBLE_MOLAR = 0.1;

function molar(x: number, unit: ConcentrationUnit): number {
  return x * 10 ** unitShift(unit, 'M');
}

interface PlausibilityInput {
  units: { substrate: ConcentrationUnit | null; inhibitor: ConcentrationUnit | null };
  maxSubstrate: number;
  maxInhibitor: number;
  /** detected constants of the winning model, in the table's units */
  constants: Array<{ name: string; value: number; axis: 'substrate' | 'inhibitor' }>;
}

export function plausibilityCaveats(input: PlausibilityInput): Caveat[] {
  const out: Caveat[] = [];
  const flagged: ImplausibleValue[] = [];
  const check = (label: string, value: number, axis: 'substrate' | 'inhibitor') => {
    const unit = input.units[axis];
    if (unit === null || !Number.isFinite(value)) return;
    const m = molar(value, unit);
    if (m > IMPLAUSIBLE_MOLAR) flagged.push({ label, value, unit, molar: m });
  };
  check('highest [S]', input.maxSubstrate, 'substrate');
  check('highest [I]', input.maxInhibitor, 'inhibitor');
  for (const c of input.constants) check(c.name, c.value, c.axis);
  if (flagged.length) out.push({ code: 'implausible-concentration', flagged, limitMolar: IMPLAUSIBLE_MOLAR, blocking: false, leading: true });
  return out;
}
