/** The shapes shared by the planning modules: a design, the noise expected, the prior. */
import type { Mechanism } from '../models/types.js';

/** One distinct ([S], [I]) point of a design and how many wells it gets. */
export interface DesignPoint {
  substrate: number;
  inhibitor: number;
  replicates: number;
}

/** A named design: its distinct points (concentrations in the plan's substrate and inhibitor units). */
export interface Design {
  name: string;
  /** one line on how the design was built */
  description: string;
  points: DesignPoint[];
}

/** The noise the plan assumes: SD = level (constant) or SD = level x rate (proportional). */
export interface PlanNoise {
  model: 'constant' | 'proportional';
  level: number;
}

/** True constants of one mechanism at one prior point (natural scale, plan units). */
export interface PriorPoint {
  mechanism: Mechanism;
  Vmax: number;
  Km: number;
  Ki?: number;
  Kiu?: number;
}

export function wellCount(design: Design): number {
  return design.points.reduce((sum, p) => sum + p.replicates, 0);
}
