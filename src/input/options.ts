import type { ConcentrationUnit } from './types.js';

/** Options for reading a rate table. Every option overrides what would be found in the file. */
export interface ParseOptions {
  /** layout of the file; detected from the first lines when not given */
  layout?: 'long' | 'matrix';
  /** field separator; detected from the first non-blank line when not given */
  separator?: ',' | '\t' | ';';
  /** decimal mark; detected from the cells when not given (always '.' with ',' separators) */
  decimalMark?: '.' | ',';
  /** unit of the substrate values; sets it when the header has none, replaces it when it has one */
  substrateUnit?: ConcentrationUnit;
  /** unit of the inhibitor values; sets it when the header has none, replaces it when it has one */
  inhibitorUnit?: ConcentrationUnit;
  /** rate unit text; sets or replaces the one in the header */
  rateUnit?: string;
  /** convert the concentrations to these units after reading (see convertUnits) */
  outputUnits?: { substrate?: ConcentrationUnit; inhibitor?: ConcentrationUnit };
  /**
   * default true: each table must hold an inhibitor-free control and at least one other
   * inhibitor level among its usable points, as a mechanism analysis compares them
   */
  requireMechanismDesign?: boolean;
  /**
   * called now and then while the rows of a long table are read, with the characters of text read
   * so far and in all (the last call has done === total); for a progress display
   */
  onReadProgress?: (done: number, total: number) => void;
}
