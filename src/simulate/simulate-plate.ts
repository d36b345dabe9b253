/**
 * A simulated kinetic plate: progress curves from the integrated Michaelis-Menten equation
 * (Schnell & Mendoza 1997 closed form, src/reads/integrated-michaelis-menten.ts) for a chosen
 * mechanism at each ([S], [I]), plus no-enzyme blank wells, as a wide reads file and a plate map.
 * At constant [I] a reversible inhibitor of the five models gives a Michaelis-Menten curve with
 * Vapp = Vmax / (1 + I/Kiu) and Kmapp = Km (1 + I/Ki) / (1 + I/Kiu) (Segel (1975) Enzyme
 * Kinetics, ch. 3), if product does not inhibit and the inhibitor binds fast. Invented data, for
 * tests, benchmarks and demos only.
 */
import type { Mechanism, ParamName } from '../models/types.js';
import { productFormed } from '../reads/integrated-michaelis-menten.js';
import { seededRandom } from './random.js';
import { trueRate } from './simulate-rates.js';

export interface PlateDesign {
  mechanism: Mechanism;
  /** Vmax in concentration (the [S] unit) per time unit; Km in the [S] unit; Ki, Kiu in the [I] unit */
  params: Partial<Record<ParamName, number>>;
  substrate: number[];
  inhibitor: number[];
  replicates: number;
  /** read times, in `timeUnit` */
  times: number[];
  timeUnit?: 's' | 'min';
  /** signal per unit of product concentration */
  signalPerUnit: number;
  /** signal at t = 0 (before any product) */
  baseline?: number;
  /** background drift of the signal per time unit, the same in every well (blanks show it) */
  drift?: number;
  /** SD of the read noise, in signal units */
  noiseSd: number;
  seed: number;
  compound?: string;
  /** blank wells per [S] (at [I] not given), default 2 */
  blanksPerSubstrate?: number;
  substrateUnit?: string;
  inhibitorUnit?: string;
}

interface SimulatedWell {
  well: string;
  substrate: number;
  inhibitor: number | null;
  role: 'sample' | 'blank';
  /** the true initial rate (0 for blanks) */
  v0: number;
  vmaxApparent: number;
  kmApparent: number;
}

export interface SimulatedPlate {
  readsCsv: string;
  mapCsv: string;
  wells: SimulatedWell[];
}

const ROW_LETTERS = 'ABCDEFGHIJKLMNOP';

/** Apparent Vmax and Km at a fixed [I]. */
export function apparentConstants(mechanism: Mechanism, params: Partial<Record<ParamName, number>>, inhibitor: number): { vmax: number; km: number } {
  const ki = mechanism === 'competitive' || mechanism === 'noncompetitive' || mechanism === 'mixed' ? params.Ki! : Number.POSITIVE_INFINITY;
  const kiu = mechanism === 'noncompetitive' ? params.Ki! : mechanism === 'uncompetitive' || mechanism === 'mixed' ? params.Kiu! : Number.POSITIVE_INFINITY;
  const a = 1 + inhibitor / ki;
  const b = 1 + inhibitor / kiu;
  return { vmax: params.Vmax! / b, km: (params.Km! * a) / b };
}

export function simulatePlate(design: PlateDesign): SimulatedPlate {
  const rng = seededRandom(design.seed);
  const wells: SimulatedWell[] = [];
  for (const s of design.substrate) {
    for (const i of design.inhibitor) {
      const { vmax, km } = apparentConstants(design.mechanism, design.params, i);
      for (let r = 0; r < design.replicates; r++) {
        wells.push({ well: '', substrate: s, inhibitor: i, role: 'sample', v0: trueRate(design.mechanism, design.params, s, i), vmaxApparent: vmax, kmApparent: km });
      }
    }
    for (let b = 0; b < (design.blanksPerSubstrate ?? 2); b++) wells.push({ well: '', substrate: s, inhibitor: null, role: 'blank', v0: 0, vmaxApparent: 0, kmApparent: 1 });
  }
  const columns = wells.length > 96 ? 24 : 12;
  if (wells.length > 384) throw new Error(`the design needs ${wells.length} wells; a plate holds 384`);
  wells.forEach((w, k) => {
    w.well = `${ROW_LETTERS[Math.floor(k / columns)]}${(k % columns) + 1}`;
  });
  const baseline = design.baseline ?? 0.05;
  const drift = design.drift ?? 0;
  const unit = design.timeUnit ?? 's';
  const lines = [[`time (${unit})`, ...wells.map((w) => w.well)].join(',')];
  for (const t of design.times) {
    const row = [String(t)];
    for (const w of wells) {
      const product = w.role === 'blank' ? 0 : productFormed(t, w.vmaxApparent, w.kmApparent, w.substrate);
      const signal = baseline + drift * t + design.signalPerUnit * product + design.noiseSd * rng.normal();
      row.push(signal.toPrecision(8));
    }
    lines.push(row.join(','));
  }
  const su = design.substrateUnit ?? 'uM';
  const iu = design.inhibitorUnit ?? 'uM';
  const map = [`well,compound,substrate (${su}),inhibitor (${iu}),role`];
  for (const w of wells) map.push(`${w.well},${w.role === 'blank' ? '' : design.compound ?? 'QX-101'},${w.substrate},${w.inhibitor ?? ''},${w.role}`);
  return { readsCsv: lines.join('\n') + '\n', mapCsv: map.join('\n') + '\n', wells };
}
