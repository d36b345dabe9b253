/** Statistical building blocks for residual diagnostics and nested-model tests (pure functions). */
export * from './distributions.js';
export { countSignRuns, type SignRunCount } from './sign-runs.js';
export { runsDistribution, runsMoments, logBinomial, type RunsMoments } from './runs-distribution.js';
export { exactRunsTails, normalRunsTails, type RunsTailProbabilities } from './runs-p-values.js';
export { chooseRunsMethod, DEFAULT_EXACT_MAX_TOTAL, type RunsTestOptions, type RunsMethodChoice } from './runs-method.js';
export { runsTest, type RunsTestResult } from './runs-test.js';
export { pooledRunsTest, convolvedRunsDistribution, type PooledRunsTestResult } from './pooled-runs-test.js';
export { shapiroWilk, shapiroWilkCoefficients, type ShapiroWilkResult } from './shapiro-wilk.js';
export { averageRanks } from './average-ranks.js';
export { spearmanCorrelation, type SpearmanResult } from './spearman-correlation.js';
export { residualTrends } from './residual-trends.js';
export {
  lackOfFitTest, type LackOfFitOutcome, type LackOfFitResult, type LackOfFitNotApplicable,
} from './lack-of-fit-test.js';
export {
  extraSumOfSquaresTest, type ExtraSumOfSquaresInput, type ExtraSumOfSquaresResult,
} from './extra-sum-of-squares-test.js';
export { likelihoodRatioTest, type LikelihoodRatioInput, type LikelihoodRatioResult } from './likelihood-ratio-test.js';
export { studentisedResiduals, type StudentisedResiduals } from './studentised-residuals.js';
