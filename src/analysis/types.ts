/** Result types of one analysis (one compound, one rate table). */
import type { Mechanism, ModelFamily } from '../models/types.js';
import type { MechanismFit } from '../fit/fit-mechanism.js';
import type { ErrorModel } from '../fit/error-models.js';
import type { FitData } from '../fit/fit-data.js';
import type { Exclusion, InputWarning, RateTable } from '../input/types.js';
import type { ParameterEstimate } from '../evidence/intervals/wald-estimates.js';
import type { NestedComparison } from '../evidence/selection/nested-comparisons.js';
import type { Verdict } from '../evidence/verdict/verdict.js';
import type { FamilyCall } from '../evidence/selection/family-comparison.js';
import type { DerivedQuantity } from '../evidence/intervals/derived-quantities.js';
import type { ResidualDiagnostics } from '../evidence/diagnostics/residual-diagnostics.js';
import type { SeriesDisagreement, SeriesFit } from '../evidence/diagnostics/series-fits.js';
import type { ErrorModelCheck } from '../evidence/diagnostics/error-model-check.js';
import type { ProfileCurve } from '../evidence/intervals/profile-likelihood.js';
import type { JointRegion } from '../evidence/intervals/joint-region.js';

// Produced by the evidence stage and owned there; re-exported so the result types stay in one place for readers.
export type { ProfileCurve } from '../evidence/intervals/profile-likelihood.js';
export type { JointRegion } from '../evidence/intervals/joint-region.js';
export type { SeriesFit } from '../evidence/diagnostics/series-fits.js';

/** What a bootstrap run did, and how often each mechanism ranked first by AICc across resamples. */
export interface BootstrapSummary {
  resamples: number;
  seed: number;
  /** plain-words description of the resampling scheme */
  scheme: string;
  weights: 'rademacher' | 'mammen';
  /** the model whose fitted values and residuals generated the resamples */
  generatingModel: Mechanism;
  /** share of resamples in which each mechanism ranked first by AICc */
  selection: Record<string, number>;
  /** resamples whose refit failed, per mechanism */
  failures: Record<string, number>;
}

export interface ModelResult {
  mechanism: Mechanism;
  /** model family (absent: classic; set for the tight-binding and partial models) */
  family?: ModelFamily;
  /** registry id (absent: the mechanism, for the classic five) */
  modelId?: string;
  label: string;
  equation: string;
  converged: boolean;
  message: string;
  n: number;
  /** fitted rate parameters (sigma excluded) */
  p: number;
  /** parameters counted by the criteria (p + 1 for sigma) */
  k: number;
  df: number;
  sse: number;
  logLik: number;
  aicc: number;
  bic: number;
  deltaAicc: number;
  /** Akaike weight from AICc */
  weight: number;
  /** Schwarz weight from BIC */
  bicWeight: number;
  estimates: ParameterEstimate[];
  /** profile-likelihood curves, when computed */
  profiles?: ProfileCurve[];
  /** joint (Ki, Kiu) region, mixed model only, when computed */
  jointRegion?: JointRegion;
  /** pKi, pKiu, IC50 and apparent constants with intervals (intervals stage) */
  derived?: DerivedQuantity[];
  /** residual variance s^2 = SSE_w / df */
  residualVariance: number;
  fit: MechanismFit;
}

/** The robust (bisquare) refit beside the least-squares one. */
export interface RobustSummary {
  /** points given robustness weight below 0.5, with their source line */
  downWeighted: Array<{ index: number; line: number; substrate: number; inhibitor: number; rate: number; weight: number }>;
  /** ranking of the robust fits (best first) */
  ranking: Array<{ mechanism: Mechanism; aicc: number; weight: number }>;
  verdict: Verdict;
  /** true when the robust call differs from the least-squares call */
  changesVerdict: boolean;
}

/** What the analysis used for [E]t (JSON `input.enzyme`). */
export type EnzymeInput = { value: number; unit: string | null; source: 'option' | 'column' } | 'fitted' | null;

export interface InputSummary {
  source: string;
  compound?: string;
  rowsRead: number;
  rowsUsed: number;
  excluded: Exclusion[];
  layout: RateTable['layout'];
  separator: RateTable['separator'];
  decimalMark: RateTable['decimalMark'];
  units: RateTable['units'];
  warnings: InputWarning[];
}

export interface AnalysisResult {
  input: InputSummary;
  errorModel: ErrorModel;
  /** confidence level of the intervals */
  level: number;
  /** sorted by AICc, best first */
  models: ModelResult[];
  nested: NestedComparison[];
  verdict: Verdict;
  /** which family (classic, tight-binding, partial) the call belongs to, with its reasons */
  family: FamilyCall;
  /** [E]t used by the tight-binding family: a value (inhibitor units), 'fitted', or null */
  enzyme: EnzymeInput;
  /** the fitted models of the other families (tight-binding, partial), when any were fitted */
  familyModels?: ModelResult[];
  /** residual diagnostics of the family models the call can name, by registry id */
  familyResidualChecks?: Record<string, ResidualDiagnostics>;
  /** bootstrap summary, when a bootstrap was run */
  bootstrap?: BootstrapSummary;
  /** per-series Michaelis-Menten fits (diagnostic input of the slope and intercept replots) */
  seriesFits?: SeriesFit[];
  /** per-series estimates that disagree with the winning global model */
  seriesDisagreements?: SeriesDisagreement[];
  /** residual diagnostics per mechanism */
  residualChecks?: Partial<Record<Mechanism, ResidualDiagnostics>>;
  /** the error-model comparison on the winning mechanism */
  errorModelCheck?: ErrorModelCheck | null;
  /** how the error model was chosen: given by the user, or automatically (with the scores) */
  errorModelChoice?: { automatic: boolean; scores: Array<{ errorModel: ErrorModel; bestAicc: number }> };
  /** the bounded-influence refit, when requested */
  robust?: RobustSummary;
  /** the points that entered the fit */
  data: FitData;
  /** the table the analysis was run on */
  table: RateTable;
}
