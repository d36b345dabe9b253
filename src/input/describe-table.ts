/**
 * A one-line account of how a table was read, for the command line and the report.
 */
import type { RateTable } from './types.js';

const SEPARATOR_NAMES = { ',': 'comma', '\t': 'tab', ';': 'semicolon' } as const;

/**
 * e.g. `rates.csv, compound "A": long layout (detected), semicolon-separated (detected), decimal
 * comma (detected); 40 rows read, 38 used, 2 excluded; substrate in uM, inhibitor in nM`.
 */
export function describeTable(table: RateTable): string {
  const what = table.compound === undefined ? table.source : `${table.source}, compound "${table.compound}"`;
  const counted = table.layout === 'long' ? 'rows' : 'cells';
  const unit = (u: string | null): string => u ?? 'no unit given';
  return (
    `${what}: ${table.layout} layout (${table.detection.layout}), ` +
    `${SEPARATOR_NAMES[table.separator]}-separated (${table.detection.separator}), ` +
    `decimal ${table.decimalMark === ',' ? 'comma' : 'point'} (${table.detection.decimalMark}); ` +
    `${table.rowsRead} ${counted} read, ${table.points.length} used, ${table.excluded.length} excluded; ` +
    `substrate in ${unit(table.units.substrate)}, inhibitor in ${unit(table.units.inhibitor)}, rate in ${unit(table.units.rate)}`
  );
}
