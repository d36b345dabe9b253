/**
 * Shared contract of a reversible-inhibition mechanism (rapid-equilibrium, single substrate,
 * [E] << Ki). Each mechanism lives in its own file and exports one `MechanismModel`.
 *
 * Parameters are fitted on the log scale: theta_k = ln(p_k). The model therefore supplies the
 * derivative of the rate with respect to ln(p_k), which is p_k * d v / d p_k.
 *
 * Sources for the rate equations: Segel, I. H. (1975) Enzyme Kinetics, Wiley, ch. 3;
 * Cornish-Bowden, A. (2012) Fundamentals of Enzyme Kinetics, 4th ed., ch. 6.
 */

/** The five mechanisms compared by the tool. */
export type Mechanism = 'none' | 'competitive' | 'uncompetitive' | 'noncompetitive' | 'mixed';

/** Natural-scale names of fitted parameters. alpha is derived (Kiu / Ki), never fitted directly. */
export type ParamName = 'Vmax' | 'Km' | 'Ki' | 'Kiu';

/** What starting-value generators may look at: the design and the observed rates. */
export interface KineticData {
  /** substrate concentrations, one per point */
  readonly s: Float64Array;
  /** inhibitor concentrations, one per point */
  readonly i: Float64Array;
  /** observed rates, one per point */
  readonly v: Float64Array;
}

export interface MechanismModel {
  readonly mechanism: Mechanism;
  /** Human-readable name, e.g. "competitive". */
  readonly label: string;
  /** The rate law in plain text, for reports. */
  readonly equation: string;
  /** Names of the fitted parameters, in the order used by `rate` and `gradLog`. */
  readonly params: readonly ParamName[];
  /** v(S, I) at natural-scale parameters p (same order as `params`). */
  rate(p: ArrayLike<number>, s: number, i: number): number;
  /**
   * Writes d v / d ln(p_k) for every parameter into out[offset .. offset + params.length).
   * Analytic; tested against central differences.
   */
  gradLog(p: ArrayLike<number>, s: number, i: number, out: Float64Array, offset: number): void;
  /** Data-driven starting values on the natural scale (each a full parameter vector). */
  starts(data: KineticData): number[][];
}
