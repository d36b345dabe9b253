/**
 * Simulated initial-rate grids from a chosen mechanism: the generator behind `mechanist simulate`,
 * the recovery and calibration benchmarks, and the tests. Invented data for simulations only.
 */
import { modelFor } from '../models/index.js';
import type { Mechanism, ParamName } from '../models/types.js';
import type { RatePoint } from '../input/types.js';
import { seededRandom } from './random.js';

/** How noise is added: constant SD (absolute), or SD proportional to rate / to sqrt(rate). */
export type NoiseModel = 'constant' | 'proportional' | 'sqrt';

export interface SimulationDesign {
  mechanism: Mechanism;
  /** true parameter values on the natural scale (only those of the mechanism are used) */
  params: Partial<Record<ParamName, number>>;
  substrate: number[];
  inhibitor: number[];
  replicates: number;
  noise: NoiseModel;
  /** constant: the SD; proportional: the coefficient of variation (0.05 = 5%); sqrt: SD = level*sqrt(v) */
  noiseLevel: number;
  seed: number;
}

/** The true, noise-free rate for each design point. */
export function trueRate(mechanism: Mechanism, params: Partial<Record<ParamName, number>>, s: number, i: number): number {
  const model = modelFor(mechanism);
  const p = model.params.map((name) => {
    const value = params[name];
    if (value === undefined || !(value > 0)) throw new Error(`simulation needs a positive ${name} for the ${model.label} model`);
    return value;
  });
  return model.rate(p, s, i);
}

/** Rates on the full grid substrate x inhibitor x replicates, with seeded noise. */
export function simulateRates(design: SimulationDesign): RatePoint[] {
  const rng = seededRandom(design.seed);
  const points: RatePoint[] = [];
  let line = 2;
  for (const i of design.inhibitor) {
    for (const s of design.substrate) {
      const v = trueRate(design.mechanism, design.params, s, i);
      const sd =
        design.noise === 'constant'
          ? design.noiseLevel
          : design.noise === 'proportional'
            ? design.noiseLevel * v
            : design.noiseLevel * Math.sqrt(v);
      for (let r = 1; r <= design.replicates; r++) {
        points.push({ line: line++, substrate: s, inhibitor: i, rate: v + sd * rng.normal(), replicate: String(r) });
      }
    }
  }
  return points;
}

/** The points as a long-layout CSV (header `substrate,inhibitor,rate,replicate`). */
export function ratesToCsv(points: RatePoint[], units?: { substrate?: string; inhibitor?: string; rate?: string }): string {
  const col = (name: string, unit?: string) => (unit ? `${name} (${unit})` : name);
  const lines = [
    [col('substrate', units?.substrate), col('inhibitor', units?.inhibitor), col('rate', units?.rate), 'replicate'].join(','),
  ];
  for (const p of points) lines.push([fmt(p.substrate), fmt(p.inhibitor), fmt(p.rate), p.replicate ?? ''].join(','));
  return lines.join('\n') + '\n';
}

function fmt(x: number): string {
  return Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(10)));
}
