/**
 * Converting a table's concentrations to chosen units (a pure function).
 */
import { InputError, type ConcentrationUnit, type RateTable } from './types.js';
import { locate } from './messages.js';
import { scaleByPowerOfTen, unitShift } from './units.js';

/**
 * Returns a copy of `table` with substrate and/or inhibitor values in the target units. Km is then
 * in the substrate unit and Ki, Kiu in the inhibitor unit; the two may differ (mM substrate, nM
 * inhibitor). Values are rescaled on their decimal digits (see scaleByPowerOfTen), so 1500 nM and
 * 1.5 uM give the same number. Throws InputError when a target is set for an axis whose unit is
 * not known.
 */
export function convertUnits(
  table: RateTable,
  target: { substrate?: ConcentrationUnit; inhibitor?: ConcentrationUnit },
): RateTable {
  const shift = { substrate: 0, inhibitor: 0 };
  for (const axis of ['substrate', 'inhibitor'] as const) {
    const to = target[axis];
    if (to === undefined) continue;
    const from = table.units[axis];
    if (from === null) {
      throw new InputError(
        `${locate(table.source)}cannot convert ${axis} to ${to}: the ${axis} unit is not known; give it in the header, e.g. "${axis} (uM)", or set it with the ${axis} unit option`,
        table.source,
      );
    }
    shift[axis] = unitShift(from, to);
  }
  return {
    ...table,
    points: table.points.map((p) => ({
      ...p,
      substrate: scaleByPowerOfTen(p.substrate, shift.substrate),
      inhibitor: scaleByPowerOfTen(p.inhibitor, shift.inhibitor),
    })),
    units: {
      ...table.units,
      substrate: target.substrate ?? table.units.substrate,
      inhibitor: target.inhibitor ?? table.units.inhibitor,
    },
  };
}
