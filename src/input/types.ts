/**
 * Types shared by the input stage (parse, detect layout, units, validate) and the rest of the
 * pipeline. The fitting code only ever sees a `RateTable`.
 */

/** Concentration units understood in headers and options. */
export type ConcentrationUnit = 'M' | 'mM' | 'uM' | 'nM' | 'pM';

/** One measured initial rate that enters the fit. */
export interface RatePoint {
  /** 1-based line number in the source file (for messages and exclusion lists) */
  line: number;
  substrate: number;
  inhibitor: number;
  rate: number;
  /** per-row standard deviation, when the file has an `sd` column */
  sd?: number;
  replicate?: string;
  well?: string;
  compound?: string;
  /** any other columns, kept as annotations */
  annotations?: Record<string, string>;
}

/** A row (or cell, in the matrix layout) kept out of the fit, with the reason. */
export interface Exclusion {
  line: number;
  column?: number;
  reason: string;
  /**
   * The [S], [I] and rate of the excluded row as written in the file (untrimmed cell text; '' for
   * a blank cell), so a report can show what was left out. For a matrix cell: the [S] of its row,
   * the [I] of its column header and the cell itself.
   */
  asWritten?: { substrate: string; inhibitor: string; rate: string };
}

/** A finding that does not stop the analysis. */
export interface InputWarning {
  code: string;
  message: string;
  /** source lines the warning is about, when it is about particular rows */
  lines?: number[];
}

/** How each reading choice was made: found in the text, or set by an option. */
export type ChoiceOrigin = 'detected' | 'option';

export interface RateTable {
  /** file name (or '<memory>') */
  source: string;
  /** compound code, when the table is one compound of a multi-compound file */
  compound?: string;
  points: RatePoint[];
  /** number of data rows (long) or data cells (matrix) read */
  rowsRead: number;
  excluded: Exclusion[];
  warnings: InputWarning[];
  layout: 'long' | 'matrix';
  separator: ',' | '\t' | ';';
  decimalMark: '.' | ',';
  units: {
    substrate: ConcentrationUnit | null;
    inhibitor: ConcentrationUnit | null;
    /** rate unit, kept as text */
    rate: string | null;
  };
  /** true when the table has an `sd` column with values */
  hasSd: boolean;
  /** whether layout, separator and decimal mark were detected or set by an option */
  detection: {
    layout: ChoiceOrigin;
    separator: ChoiceOrigin;
    decimalMark: ChoiceOrigin;
  };
}

/**
 * Bad input: the CLI prints `message` on one line and exits with code 2.
 * `message` already names the file, line and column where they are known.
 */
export class InputError extends Error {
  readonly exitCode = 2;
  constructor(
    message: string,
    readonly file: string,
    readonly line?: number,
    readonly column?: number,
  ) {
    super(message);
    this.name = 'InputError';
  }
}
