/**
 * The input stage: rate tables as they come off the plate, read, checked and put in units.
 */
export * from './types.js';
export type { ParseOptions } from './options.js';
export { parseRateText } from './parse-rate-text.js';
export { readRateFile } from './read-rate-file.js';
export { decodeRateBytes } from './decode.js';
export { convertUnits } from './convert-units.js';
export { parseConcentrationUnit, CONCENTRATION_UNITS } from './units.js';
export { designWarnings } from './design-warnings.js';
export { describeTable } from './describe-table.js';
export { MINIMUM_USABLE_POINTS } from './table-checks.js';
