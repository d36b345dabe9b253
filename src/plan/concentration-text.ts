/**
 * Concentrations the planner is given on the command line: a positive value that must carry its unit
 * (`20uM`, `0.5 mM`) and ranges `10uM..40uM`. The text is read by the one concentration reader of
 * src/input/units.ts; the planner only adds that the unit is required and the range syntax.
 */
import type { ConcentrationUnit } from '../input/types.js';
import { concentrationIn, parseConcentration } from '../input/units.js';

interface UnitConcentration {
  value: number;
  unit: ConcentrationUnit;
}

/** Reads `<number><unit>` with the unit required and the value positive; throws an Error naming the text. */
export function parseUnitConcentration(text: string): UnitConcentration {
  const c = parseConcentration(text, { unitRequired: true });
  if (!(c.value > 0) || !Number.isFinite(c.value) || c.unit === null) throw new Error(`"${text}" must be a positive concentration`);
  return { value: c.value, unit: c.unit };
}

/** Reads a value or a range `low..high` (both with units, or the unit on the high end only). */
export function parseConcentrationRange(text: string): { range: [number, number]; unit: ConcentrationUnit } {
  const parts = text.split('..');
  if (parts.length > 2) throw new Error(`"${text}" is not a value or a range low..high`);
  if (parts.length === 1) {
    const c = parseUnitConcentration(parts[0]);
    return { range: [c.value, c.value], unit: c.unit };
  }
  const high = parseUnitConcentration(parts[1]);
  const low = /^\s*[0-9.eE+-]+\s*$/.test(parts[0]) ? parseUnitConcentration(`${parts[0]}${high.unit}`) : parseUnitConcentration(parts[0]);
  const lowValue = concentrationIn(low, high.unit);
  if (!(lowValue < high.value)) throw new Error(`"${text}": the low end must be below the high end`);
  return { range: [lowValue, high.value], unit: high.unit };
}
