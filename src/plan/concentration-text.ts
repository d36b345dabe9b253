/** Concentrations written on the command line: `20uM`, `0.5 mM`, and ranges `10uM..40uM`. */
import type { ConcentrationUnit } from '../input/types.js';
import { parseConcentrationUnit, scaleByPowerOfTen, unitShift } from '../input/units.js';

interface Concentration {
  value: number;
  unit: ConcentrationUnit;
}

/** Reads `<number><unit>`; throws an Error naming the text when it is not one. */
export function parseConcentration(text: string): Concentration {
  const m = /^\s*([0-9]*\.?[0-9]+(?:[eE][-+]?[0-9]+)?)\s*([^\s0-9.].*?)\s*$/.exec(text);
  if (!m) throw new Error(`"${text}" is not a concentration with its unit (for example 20uM)`);
  const value = Number(m[1]);
  if (!(value > 0) || !Number.isFinite(value)) throw new Error(`"${text}" must be a positive concentration`);
  return { value, unit: parseConcentrationUnit(m[2]) };
}

/** Reads a value or a range `low..high` (both with units, or the unit on the high end only). */
export function parseConcentrationRange(text: string): { range: [number, number]; unit: ConcentrationUnit } {
  const parts = text.split('..');
  if (parts.length > 2) throw new Error(`"${text}" is not a value or a range low..high`);
  if (parts.length === 1) {
    const c = parseConcentration(parts[0]);
    return { range: [c.value, c.value], unit: c.unit };
  }
  const high = parseConcentration(parts[1]);
  const low = /^\s*[0-9.eE+-]+\s*$/.test(parts[0]) ? parseConcentration(`${parts[0]}${high.unit}`) : parseConcentration(parts[0]);
  const lowValue = inUnit(low, high.unit);
  if (!(lowValue < high.value)) throw new Error(`"${text}": the low end must be below the high end`);
  return { range: [lowValue, high.value], unit: high.unit };
}

/** The value in another unit (exact decimal rescaling, src/input/units.ts). */
export function inUnit(c: Concentration, unit: ConcentrationUnit): number {
  return scaleByPowerOfTen(c.value, unitShift(c.unit, unit));
}
