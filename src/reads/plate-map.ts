/**
 * The plate map: what is in each well. Columns (names not case-sensitive, units in brackets as in
 * rate tables): `well`, `substrate (unit)` and `inhibitor (unit)` are needed; `compound`, `role`
 * and `plate` are optional. `role` is `sample` (the default when blank), `blank` (no enzyme: the
 * background to subtract) or `exclude` (a well to leave out, listed as such). A blank well may
 * leave [I] empty: it then serves every [I] at its [S]. Several compounds per plate are named in
 * `compound`; several plates in `plate` (a map without it applies to every plate).
 */
import { InputError, type ConcentrationUnit } from '../input/types.js';
import { locate, quoteText } from '../input/messages.js';
import { splitHeaderName } from '../input/header.js';
import { readNumberCell } from '../input/numbers.js';
import { parseConcentrationUnit } from '../input/units.js';
import type { MapEntry, PlateMap, WellRole } from './types.js';
import { canonicalWell, wellLabel } from './well-names.js';
import { readTextFile } from '../input/read-text-file.js';
import { tokenizeTable } from './read-kinetic-reads.js';

const ROLES: Record<string, WellRole> = { '': 'sample', sample: 'sample', blank: 'blank', exclude: 'exclude' };
const KNOWN = ['well', 'compound', 'substrate', 'inhibitor', 'role', 'plate'];

export async function readPlateMapFile(path: string, source = path): Promise<PlateMap> {
  return parsePlateMap(await readTextFile(path, source), source);
}

export function parsePlateMap(text: string, source: string): PlateMap {
  const table = tokenizeTable(text, source, 'expected a plate map: well,compound,substrate,inhibitor[,role]');
  const { row: header, rows, decimalMark } = table;
  const index: Record<string, number> = {};
  const notes: string[] = [];
  const units: PlateMap['units'] = { substrate: null, inhibitor: null };
  header.cells.forEach((cell, k) => {
    const place = { line: header.line, column: k + 1 };
    const { key, name, unit } = splitHeaderName(cell);
    if (key === '') return;
    if (index[key] !== undefined) throw new InputError(`${locate(source, place)}duplicate column name ${quoteText(name)}; rename one`, source, place.line, place.column);
    if (!KNOWN.includes(key)) {
      notes.push(`${locate(source, place)}plate-map column ${quoteText(name)} is not used`);
      return;
    }
    index[key] = k;
    if ((key === 'substrate' || key === 'inhibitor') && unit !== null) units[key] = parseConcentrationUnit(unit, { source, ...place });
  });
  for (const needed of ['well', 'substrate', 'inhibitor']) {
    if (index[needed] === undefined) {
      throw new InputError(
        `${locate(source, { line: header.line })}the plate map has no ${quoteText(needed)} column; it needs well, substrate (unit) and inhibitor (unit), and may have compound, role and plate`,
        source, header.line,
      );
    }
  }
  if (rows.length === 0) throw new InputError(`${locate(source, { line: header.line })}no wells below the header`, source, header.line);

  const entries: MapEntry[] = [];
  const seen = new Map<string, number>();
  for (const row of rows) {
    const cell = (key: string): string => (index[key] === undefined ? '' : (row.cells[index[key]] ?? '').trim());
    const at = (key: string) => ({ line: row.line, column: index[key] + 1 });
    const fail = (key: string, what: string): never => {
      const place = at(key);
      throw new InputError(`${locate(source, place)}${what}`, source, place.line, place.column);
    };
    const well = canonicalWell(cell('well'));
    if (well === null) fail('well', `${quoteText(cell('well'))} is not a well name; write a row letter and a column number, e.g. A1`);
    const roleText = cell('role').toLowerCase();
    const role = ROLES[roleText];
    if (role === undefined) fail('role', `role ${quoteText(cell('role'))} not understood; write sample, blank (no enzyme) or exclude, or leave it blank for a sample`);
    const plate = cell('plate');
    const key = `${plate}\u0000${well}`;
    const earlier = seen.get(key);
    if (earlier !== undefined) fail('well', `well ${wellLabel(plate, well!)} is in the map twice (also line ${earlier}); keep one line per well`);
    seen.set(key, row.line);
    const concentration = (axis: 'substrate' | 'inhibitor'): number | null => {
      const text = cell(axis);
      const value = readNumberCell(text, decimalMark);
      if (typeof value === 'number') {
        if (value < 0) fail(axis, `${axis} ${quoteText(text)} is negative; concentrations cannot be below zero`);
        return value;
      }
      if (value.kind === 'blank') {
        if (role === 'exclude' || (role === 'blank' && axis === 'inhibitor')) return null;
        fail(axis, `${axis} is blank for ${role} well ${well}; give the concentration${role === 'blank' ? ' (a blank is matched to samples at its [S])' : ''}`);
      }
      return fail(axis, `${axis} ${quoteText(text)} is not a number`);
    };
    entries.push({
      line: row.line,
      plate,
      well: well!,
      compound: cell('compound'),
      substrate: concentration('substrate'),
      inhibitor: concentration('inhibitor'),
      role: role!,
    });
  }
  const named = entries.filter((e) => e.role === 'sample' && e.compound !== '');
  if (named.length > 0) {
    const unnamed = entries.find((e) => e.role === 'sample' && e.compound === '');
    if (unnamed) {
      throw new InputError(
        `${locate(source, { line: unnamed.line, column: index.compound + 1 })}compound is blank for sample well ${unnamed.well} but other samples name one; fill it in`,
        source, unnamed.line, index.compound + 1,
      );
    }
  }
  return { source, entries, units: units as { substrate: ConcentrationUnit | null; inhibitor: ConcentrationUnit | null }, byPlate: index.plate !== undefined, notes };
}
