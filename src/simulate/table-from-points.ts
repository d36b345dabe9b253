/**
 * A RateTable built in memory from points (simulations, tests, benchmarks and library users who
 * hold their rates in arrays): every point is used, nothing is excluded, the layout is long.
 */
import type { RatePoint, RateTable } from '../input/types.js';

export interface InMemoryTableOptions {
  source?: string;
  units?: Partial<RateTable['units']>;
  compound?: string;
}

export function tableFromPoints(points: RatePoint[], options: InMemoryTableOptions = {}): RateTable {
  return {
    source: options.source ?? '<memory>',
    ...(options.compound !== undefined ? { compound: options.compound } : {}),
    points,
    rowsRead: points.length,
    excluded: [],
    warnings: [],
    layout: 'long',
    separator: ',',
    decimalMark: '.',
    units: { substrate: null, inhibitor: null, rate: null, ...options.units },
    hasSd: points.length > 0 && points.every((p) => p.sd !== undefined && p.sd > 0),
    detection: { layout: 'option', separator: 'option', decimalMark: 'option' },
  };
}
