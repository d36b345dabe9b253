/**
 * Simulated rate grids from any registered model (tight-binding and partial included), with the
 * same seeded noise as simulate-rates.ts. Invented data for benchmarks and tests only.
 */
import type { MechanismModel, ParamName } from '../models/types.js';
import type { RatePoint } from '../input/types.js';
import type { NoiseModel } from './simulate-rates.js';
import { seededRandom } from './random.js';

export interface ModelSimulation {
  model: MechanismModel;
  params: Partial<Record<ParamName, number>>;
  substrate: readonly number[];
  inhibitor: readonly number[];
  /** total enzyme for models that read it (same unit as inhibitor) */
  enzyme?: number;
  replicates: number;
  noise: NoiseModel;
  noiseLevel: number;
  seed: number;
}

export function simulateModelRates(sim: ModelSimulation): RatePoint[] {
  const rng = seededRandom(sim.seed);
  const p = sim.model.params.map((name) => {
    const x = sim.params[name];
    if (x === undefined || !(x > 0)) throw new Error(`simulation needs a positive ${name}`);
    return x;
  });
  const points: RatePoint[] = [];
  let line = 2;
  for (const i of sim.inhibitor)
    for (const s of sim.substrate) {
      const v = sim.model.rate(p, s, i, sim.enzyme);
      const sd = sim.noise === 'constant' ? sim.noiseLevel : sim.noise === 'proportional' ? sim.noiseLevel * v : sim.noiseLevel * Math.sqrt(v);
      for (let r = 1; r <= sim.replicates; r++) points.push({ line: line++, substrate: s, inhibitor: i, rate: v + sd * rng.normal(), replicate: String(r) });
    }
  return points;
}
