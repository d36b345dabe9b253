/**
 * mechanist as a library: read a rate table, analyse it, and render the results.
 * The command line (src/cli/) is a thin layer over these exports.
 *
 *   import { readRateFile, analyze } from 'mechanist';
 *   const [table] = await readRateFile('rates.csv');
 *   const result = analyze(table, { errorModel: 'proportional' });
 *   console.log(wordVerdict(result.verdict).headline);
 *
 * The verdict and its caveats are data (codes with their numbers); wordVerdict and wordCaveat give
 * the sentences the report prints.
 */
export { analyzeTable as analyze, analyzeTable, AnalysisError, type AnalysisOptions } from './analysis/analyze-table.js';
export type * from './analysis/types.js';
export * from './input/index.js';
export { MECHANISMS, modelFor } from './models/index.js';
export type { Mechanism, MechanismModel, ParamName, KineticData } from './models/types.js';
export { fitMechanism, type MechanismFit, type FitOptions } from './fit/fit-mechanism.js';
export { fitAllMechanisms } from './fit/fit-all-mechanisms.js';
export { fitDataFromArrays, fitDataFromTable, type FitData } from './fit/fit-data.js';
export { ERROR_MODELS, type ErrorModel } from './fit/error-models.js';
export { levenbergMarquardt } from './fit/levenberg-marquardt.js';
export type * from './fit/least-squares-problem.js';
export type { ParameterEstimate, EstimateName } from './evidence/intervals/wald-estimates.js';
export type { NestedComparison } from './evidence/selection/nested-comparisons.js';
export type { Verdict, VerdictOutcome } from './evidence/verdict/verdict.js';
export type { Advice, ExclusionFinding, InhibitorReach, VerdictHeadline, VerdictReason } from './evidence/verdict/verdict-findings.js';
export type { Caveat, CodedCaveat, WordedCaveat } from './evidence/verdict/caveat.js';
export { wordVerdict, type VerdictWords } from './wording/verdict-words.js';
export { wordCaveat, type CaveatWords } from './wording/caveat-words.js';
export { simulateRates, ratesToCsv, trueRate, type SimulationDesign, type NoiseModel } from './simulate/simulate-rates.js';
export { seededRandom, type RandomSource } from './simulate/random.js';
export { tableFromPoints, type InMemoryTableOptions } from './simulate/table-from-points.js';
export { analysisJson } from './report/results-json.js';
export { textSummary } from './report/text-summary.js';
export { TOOL_NAME, TOOL_VERSION } from './version.js';
export {
  runBatch,
  summarizeAnalysis,
  failedSummary,
  summaryCsv,
  summaryJson,
  summaryColumns,
  indexPage,
  type BatchOptions,
  type BatchResult,
  type BatchSettings,
  type CompoundSummary,
  type ConstantSummary,
  type IntervalKind,
} from './batch/index.js';

// Output safety (issue 16): errors about the output folder, the atomic writers, a batch's lock and interruption
export { OutputError, type OutputStage } from './report/output-error.js';
export { checkOutputFolder } from './report/output-folder.js';
export { writeFileAtomic, writeFilesAtomic, writeFolderAtomic } from './report/write-atomic.js';
export { InterruptedError, RUN_LOCK_FILE } from './batch/index.js';
// the reads stage: kinetic plate reads and a plate map to a rate table (issue 12)
export {
  parseKineticReads,
  readKineticReadsFile,
  parsePlateMap,
  readPlateMapFile,
  parseConversionFactor,
  conversionIn,
  fitStandardCurve,
  readStandardCurve,
  standardCurveConversion,
  ratesFromReads,
  rateTableText,
  correctForDepletion,
  chordFactor,
  lambertW,
  wrightOmega,
  productFormed,
  substrateLeft,
  fitIntegratedCurve,
  readThresholds,
  type KineticReads,
  type PlateMap,
  type MapEntry,
  type WellRate,
  type WellFlag,
  type FlagCode,
  type RateWindow,
  type Conversion,
  type PlateRates,
  type RatesOptions,
  type IntegratedFit,
  type StandardCurveFit,
} from './reads/index.js';
export { simulatePlate, apparentConstants, type PlateDesign, type SimulatedPlate } from './simulate/simulate-plate.js';
export { readsReportHtml } from './report/html/reads-page.js';
export * from './plan/index.js';
// Single-[S] tables (IC50 curves): dose-response fits, IC50 intervals, Cheng-Prusoff Ki per mechanism (issue 13)
export { isSingleSubstrateTable, substrateLevels, analyzeSingleSubstrate } from './analysis/single-substrate.js';
export type { SingleSubstrateOptions, SingleSubstrateResult } from './analysis/single-substrate.js';
export { fitDoseResponse, doseResponseRate, DOSE_RESPONSE_LABELS } from './fit/dose-response-fit.js';
export type { DoseResponseFit, DoseResponseModel } from './fit/dose-response-fit.js';
export { doseResponseEvidence, chengPrusoffKi } from './evidence/constants/dose-response.js';
export type { DoseResponseEvidence, DoseResponseModelResult, ImpliedKi, ChengPrusoffMechanism } from './evidence/constants/dose-response.js';
export { doseResponseJson, doseResponseText } from './report/dose-response-output.js';
export { parseConcentration, concentrationIn } from './input/units.js';
export type { Concentration } from './input/units.js';
// Model registry and the tight-binding and partial families (issue 10)
export {
  registerModel,
  registeredModels,
  lookupModel,
  modelId,
  familyOf,
  nestedPairsAmong,
  embedByRules,
  dimensionOf,
  unitOfDimension,
  type DerivedPair,
} from './models/registry.js';
export type { ModelFamily, ParamSpec, ParamDimension, Containment, NestingRule, Covariate, ModelCapabilities } from './models/types.js';
export { TIGHT_BINDING_GIVEN, TIGHT_BINDING_FITTED, apparentConstant } from './models/tight-binding.js';
export { morrisonFractions, type MorrisonFractions } from './models/morrison.js';
export { PARTIAL_MODELS, partialCompetitive, partialNoncompetitive, partialMixed } from './models/partial.js';
export { fitFamily } from './fit/fit-family.js';
export { compareFamilies, oneParameterTest, TIGHT_BINDING_RATIO, FAMILY_LEVEL, PARTIAL_AICC_MARGIN, type FamilyCall } from './evidence/selection/family-comparison.js';
export { resolveEnzyme, type EnzymeOption, type EnzymeInput, type FamilyRequest } from './analysis/stage-families.js';
export { simulateModelRates, type ModelSimulation } from './simulate/simulate-model.js';
