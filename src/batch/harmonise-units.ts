/**
 * One concentration unit per run (issue 13): the compounds of a batch are compared side by side
 * (sorted by Ki, filtered), so their constants must be in one unit. Every table is converted to
 * the unit asked for (`--unit`, already applied while reading) or, without one, to the units of
 * the first table that has them; each conversion leaves a note naming the compound and the units.
 * Conversion is exact decimal rescaling (convertUnits), so results do not depend on it beyond the
 * unit. A table whose unit is not known cannot be converted: it keeps its numbers and gets a flag.
 */
import { convertUnits } from '../input/convert-units.js';
import type { ConcentrationUnit, RateTable } from '../input/types.js';
import type { CompoundJob } from './types.js';

interface RunUnits {
  substrate: ConcentrationUnit | null;
  inhibitor: ConcentrationUnit | null;
}

/** Warning code put on a table whose unit is unknown while the run's is known. */
const UNIT_UNKNOWN_IN_RUN = 'unit-unknown-in-run';

/** Converts the jobs' tables in place to one unit per axis; returns the units and the notes. */
export function harmoniseUnits(jobs: CompoundJob[]): { units: RunUnits; notes: string[] } {
  const first = (axis: 'substrate' | 'inhibitor') => jobs.find((j) => j.table?.units[axis])?.table?.units[axis] ?? null;
  const units: RunUnits = { substrate: first('substrate'), inhibitor: first('inhibitor') };
  const notes: string[] = [];
  for (const job of jobs) {
    const table = job.table;
    if (table === null) continue;
    const target: { substrate?: ConcentrationUnit; inhibitor?: ConcentrationUnit } = {};
    const changed: string[] = [];
    const unknown: string[] = [];
    for (const axis of ['substrate', 'inhibitor'] as const) {
      const to = units[axis];
      const from = table.units[axis];
      if (to === null || from === to) continue;
      if (from === null) unknown.push(axis === 'substrate' ? '[S]' : '[I]');
      else {
        target[axis] = to;
        changed.push(`${axis === 'substrate' ? '[S]' : '[I]'} from ${from} to ${to}`);
      }
    }
    let converted: RateTable = changed.length > 0 ? convertUnits(table, target) : table;
    if (changed.length > 0) notes.push(`${job.compound}: ${changed.join(' and ')} converted, to the run's unit (the first file's; set it with --unit)`);
    if (unknown.length > 0) {
      const message = `the ${unknown.join(' and ')} unit is not known, so this compound's constants cannot be put in the run's units (${units.substrate ?? '?'} for [S], ${units.inhibitor ?? '?'} for [I]); compare it with care`;
      converted = { ...converted, warnings: [...converted.warnings, { code: UNIT_UNKNOWN_IN_RUN, message }] };
      notes.push(`${job.compound}: ${message}`);
    }
    job.table = converted;
  }
  return { units, notes };
}
