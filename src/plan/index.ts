/** Planning the experiment (`mechanist plan`): the library API of src/plan. */
export { planExperiment, planAssumptions, monteCarloScore, type PlanRequest, type PlanResult, type PlanCandidate, type CandidateRole } from './plan-experiment.js';
export { searchDesigns, scoreDesign, type PlanSettings, type ScoredDesign, type SearchResult, type MechanismExpectation } from './design-search.js';
export { fisherInformation, logDsCriterion, expectedLogStandardErrors, foldWidth } from './fisher-information.js';
export { optimumApproximateDesign, efficientRounding, varianceFunction, type CriterionTerm, type ApproximateDesign } from './approximate-design.js';
export { rivalNoncentrality, chanceRivalSetAside } from './discrimination.js';
export { monteCarloPrediction, monteCarloAnalysisOptions, type MechanismPrediction } from './monte-carlo.js';
export { commonGrid, singleInhibitorDesign, type PlanConstraints, type DilutionScheme } from './candidate-designs.js';
export { priorPoints, type PlanPrior } from './plan-prior.js';
export { plateMapCsv, plateWells, type PlateWell } from './plate-map.js';
export { planJson } from './plan-json.js';
export { planText } from './plan-text.js';
export { parseConcentrationRange } from './concentration-text.js';
export type { Design, DesignPoint, PlanNoise, PriorPoint } from './design-types.js';
export { planFigures, type WellsCurvePoint } from './plan-figures.js';
export { planPage } from './plan-page.js';
export { wellsCurve } from './wells-curve.js';
export { followUpBasis, summaryFromResult, summaryFromJson, type FollowUpBasis, type FittedSummary } from './follow-up.js';
