/** Builds an in-memory RateTable from simulated points (tests only; invented data). */
import type { RatePoint, RateTable } from '../../src/input/types.js';
import { simulateRates, type SimulationDesign } from '../../src/simulate/simulate-rates.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';

export function tableOf(points: RatePoint[], source = 'simulated'): RateTable {
  return tableFromPoints(points, { source, units: { substrate: 'uM', inhibitor: 'uM' } });
}

export const GOOD_DESIGN = { substrate: [2, 4, 7, 10, 15, 25, 50, 100], inhibitor: [0, 1, 2, 4, 8] };
export const TRUE_PARAMS = {
  none: { Vmax: 100, Km: 10 },
  competitive: { Vmax: 100, Km: 10, Ki: 2 },
  uncompetitive: { Vmax: 100, Km: 10, Kiu: 2 },
  noncompetitive: { Vmax: 100, Km: 10, Ki: 2 },
  mixed: { Vmax: 100, Km: 10, Ki: 2, Kiu: 10 },
} as const;

export function simulatedTable(
  mechanism: keyof typeof TRUE_PARAMS,
  seed: number,
  design: { substrate: number[]; inhibitor: number[] } = GOOD_DESIGN,
  extra: Partial<SimulationDesign> = {},
): RateTable {
  return tableOf(
    simulateRates({
      mechanism,
      params: TRUE_PARAMS[mechanism],
      ...design,
      replicates: 3,
      noise: 'proportional',
      noiseLevel: 0.05,
      seed,
      ...extra,
    }),
  );
}
