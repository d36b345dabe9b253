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

/**
 * Natural-scale names of fitted parameters. alpha is derived (Kiu / Ki), never fitted directly.
 * beta (residual activity of the enzyme-substrate-inhibitor complex, partial models) and Et
 * (total active enzyme, tight-binding models when it is fitted) belong to the other families.
 */
export type ParamName = 'Vmax' | 'Km' | 'Ki' | 'Kiu' | 'beta' | 'Et';

/** Model families: the rapid-equilibrium equations, tight binding (Morrison), partial (hyperbolic). */
export type ModelFamily = 'classic' | 'tight-binding' | 'partial';

/**
 * What a parameter measures, which fixes its unit and its starting scale: a rate (rate unit),
 * a substrate or an inhibitor concentration (their units), an enzyme concentration (inhibitor
 * unit: it enters the Morrison quadratic beside [I]), or a pure number.
 */
export type ParamDimension = 'rate' | 'substrate' | 'inhibitor' | 'enzyme' | 'dimensionless';

/** The declarative description of one fitted parameter (every parameter is positive, fitted as ln p). */
export interface ParamSpec {
  name: ParamName;
  dimension: ParamDimension;
}

/**
 * How a model is a limit or restriction of a larger one: the larger model's parameters that give
 * this model. `limit` sends one parameter to the edge of its domain (zero or infinity); `equal`
 * ties two parameters; `fixed` pins one at a value. A limit at the edge is a boundary of the
 * parameter space (Self & Liang 1987: the nominal tests are then conservative).
 */
export type NestingRule =
  | { kind: 'limit'; param: ParamName; to: 'zero' | 'infinity' }
  | { kind: 'equal'; param: ParamName; sameAs: ParamName }
  | { kind: 'fixed'; param: ParamName; value: number };

/** A smaller model contained in this one, and the constraints or limits that give it. */
export interface Containment {
  /** id of the smaller model (see modelId in registry.ts) */
  model: string;
  rules: readonly NestingRule[];
}

/** The per-point covariates a model may read besides [S] and [I]. */
export type Covariate = 'enzyme';

/** What starting-value generators may look at: the design and the observed rates. */
export interface KineticData {
  /** substrate concentrations, one per point */
  readonly s: Float64Array;
  /** inhibitor concentrations, one per point */
  readonly i: Float64Array;
  /** observed rates, one per point */
  readonly v: Float64Array;
  /** total active enzyme per point (inhibitor units), for models that read it */
  readonly e?: Float64Array;
}

export interface MechanismModel {
  readonly mechanism: Mechanism;
  /** Human-readable name, e.g. "competitive". */
  readonly label: string;
  /** The rate law in plain text, for reports. */
  readonly equation: string;
  /** Names of the fitted parameters, in the order used by `rate` and `gradLog`. */
  readonly params: readonly ParamName[];
  /** v(S, I) at natural-scale parameters p (same order as `params`); e: total enzyme, for models that read it. */
  rate(p: ArrayLike<number>, s: number, i: number, e?: number): number;
  /**
   * Writes d v / d ln(p_k) for every parameter into out[offset .. offset + params.length).
   * Analytic; tested against central differences.
   */
  gradLog(p: ArrayLike<number>, s: number, i: number, out: Float64Array, offset: number, e?: number): void;
  /**
   * Optional: `rate` at every point of `data` into out[0 .. n), the same numbers as n calls of
   * `rate`. A fit evaluates the rates of all points thousands of times per analysis; one call per
   * evaluation, with the loop inside the model's own file, lets the engine inline the rate law
   * instead of calling it through a site shared by every model (docs/decisions/analysis-cost.md).
   */
  rates?(p: ArrayLike<number>, data: KineticData, out: Float64Array): void;
  /** Optional: `gradLog` at every point, row-major n x params.length (point k at offset k * params.length). */
  gradLogs?(p: ArrayLike<number>, data: KineticData, out: Float64Array): void;
  /** Data-driven starting values on the natural scale (each a full parameter vector). */
  starts(data: KineticData): number[][];
  /** family; absent means 'classic' */
  readonly family?: ModelFamily;
  /** what each parameter measures (same order as `params`); absent: the classic scale table */
  readonly specs?: readonly ParamSpec[];
  /** registry id; absent: the mechanism for a classic model, `<family> <mechanism>` otherwise */
  readonly id?: string;
  /** the smaller models this one contains, each with the constraints or limits that give it */
  readonly contains?: readonly Containment[];
  /** per-point covariates the rate reads (absent: none) */
  readonly covariates?: readonly Covariate[];
  /** what the model supports downstream */
  readonly capabilities?: ModelCapabilities;
}

export interface ModelCapabilities {
  /** the classic closed forms (apparent Km/Vmax per [I], Cheng-Prusoff IC50) apply */
  classicClosedForms?: boolean;
  /** residual activity at saturating [I] for a given [S] (partial models) */
  residualActivity?(p: ArrayLike<number>, s: number): number;
}
