/**
 * Types of the reads stage: kinetic plate reads and a plate map in, one initial rate per well out.
 */
import type { ConcentrationUnit } from '../input/types.js';

export type TimeUnit = 's' | 'min' | 'h';

/** The reads of one well, in time order. */
export interface WellCurve {
  plate: string;
  well: string;
  times: number[];
  signals: number[];
  /** source line of each read */
  lines: number[];
}

/** A read left out, with its place and reason. */
export interface ReadExclusion {
  line: number;
  column?: number;
  plate: string;
  well: string;
  reason: string;
}

export interface KineticReads {
  source: string;
  layout: 'long' | 'wide';
  timeUnit: TimeUnit;
  /** the signal unit as written in the header, or null */
  signalUnit: string | null;
  curves: WellCurve[];
  excluded: ReadExclusion[];
  /** columns ignored and similar remarks, each naming its place */
  notes: string[];
}

export type WellRole = 'sample' | 'blank' | 'exclude';

export interface MapEntry {
  line: number;
  plate: string;
  well: string;
  compound: string;
  substrate: number | null;
  /** null: not given (a blank well without [I] matches every [I] at its [S]) */
  inhibitor: number | null;
  role: WellRole;
}

export interface PlateMap {
  source: string;
  entries: MapEntry[];
  units: { substrate: ConcentrationUnit | null; inhibitor: ConcentrationUnit | null };
  /** true when the map has a plate column */
  byPlate: boolean;
  notes: string[];
}

/** Signal per unit of product concentration, already in the substrate unit of the map. */
export interface Conversion {
  /** signal change per unit of product (may be negative: a signal that falls as product forms) */
  signalPerUnit: number;
  /** the unit of product (and substrate) concentration */
  unit: ConcentrationUnit;
  /** how the factor was obtained, for the output */
  description: string;
}

export type FlagCode = 'substrate-use' | 'lag' | 'burst' | 'saturated' | 'few-reads' | 'noisy' | 'curved-start';

export interface WellFlag {
  code: FlagCode;
  message: string;
}

export interface RateWindow {
  /** index of the first and last read used (in the curve's usable reads) */
  first: number;
  last: number;
  from: number;
  to: number;
  reads: number;
  slope: number;
  intercept: number;
  se: number;
  residualSd: number;
  /** p value of the quadratic term in the chosen window */
  curvatureP: number;
  /** true when no start of the curve passed the straightness test and the shortest one is used */
  forced: boolean;
}

/** A well's rate, with its plate-map fields (the map line as `mapLine`). */
export interface WellRate extends Omit<MapEntry, 'line'> {
  mapLine: number;
  /** the initial rate reported (concentration, or signal without a conversion, per time unit) */
  rate: number | null;
  se: number | null;
  method: 'window' | 'integrated' | null;
  window: RateWindow | null;
  /** fraction of substrate used by the end of the window (null without a conversion) */
  fractionUsed: number | null;
  integrated: import('./integrated-michaelis-menten.js').IntegratedFit | null;
  /** why the integrated fit was not used or not run, when it was not */
  integratedNote: string | null;
  flags: WellFlag[];
  /** how the blank was chosen, in words */
  blank: string;
  /** times and corrected values (concentration or signal) of the usable reads, for figures */
  times: number[];
  values: number[];
  /** reads left out of the curve (saturated), by time */
  droppedTimes: number[];
  droppedValues: number[];
  /**
   * the window rate's correction for substrate used in the window (depletion-correction.ts):
   * rate = line slope x factor; km is the series' Kmapp used; null when not applied
   */
  depletion: { factor: number; km: number | null; note: string | null } | null;
  /** why the well has no rate or is left out, when it is */
  excludeReason: string | null;
}
