/**
 * The reads stage: kinetic plate reads and a plate map in, a long rate table out. It comes before
 * the input stage (src/input/), whose tokenizer, units and error types it uses.
 */
export * from './types.js';
export { parseKineticReads, readKineticReadsFile } from './read-kinetic-reads.js';
export { parsePlateMap, readPlateMapFile } from './plate-map.js';
export { parseConversionFactor, conversionIn, fitStandardCurve, readStandardCurve, standardCurveConversion, type StandardCurveFit } from './conversion.js';
export { ratesFromReads, type PlateRates, type RatesOptions } from './plate-rates.js';
export { correctForDepletion, chordFactor } from './depletion-correction.js';
export { rateTableText, wellsWithoutCompound } from './rate-table-text.js';
export { lambertW, wrightOmega } from './lambert-w.js';
export { productFormed, substrateLeft, fitIntegratedCurve, type IntegratedFit } from './integrated-michaelis-menten.js';
export * as readThresholds from './thresholds.js';
