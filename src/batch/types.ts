/**
 * Types of a batch run: many compounds analysed one by one, each summed up in one row of a
 * summary table (summary.csv, summary.json, index.html).
 */
import type { Mechanism } from '../models/types.js';
import type { VerdictOutcome } from '../evidence/verdict/verdict.js';
import type { RateTable } from '../input/types.js';

/**
 * How the interval of a constant in the summary was obtained:
 *  - 'profile': profile-likelihood interval (an end is null when the profile stays open)
 *  - 'wald': Wald interval (estimate +/- t * SE)
 *  - 'not-detected': the constant ran past the detection bound; `low` is that bound (the data say
 *    only that the constant lies above it), `high` is null; for alpha both ends are null
 *  - 'unavailable': the estimate has no interval (singular information matrix)
 */
export type IntervalKind = 'profile' | 'wald' | 'not-detected' | 'unavailable';

/** One inhibition constant (Ki, Kiu or alpha) of the called mechanism, with its interval. */
export interface ConstantSummary {
  value: number | null;
  low: number | null;
  high: number | null;
  interval: IntervalKind;
}

/** Whether the compound was analysed, or why not. */
export type CompoundStatus = 'analysed' | 'failed';

/** The summary row of one compound. Every value is plain JSON data (no timings, no dates). */
export interface CompoundSummary {
  /** 1-based position in input order (file order, then compound order within a file) */
  position: number;
  /** the compound's id, unique within the run (see README, "Batch: compound ids") */
  compound: string;
  /** the compound name written in the file, or null when the file names none */
  nameInFile: string | null;
  /** the input file as given (folder entries joined to the folder path as given) */
  source: string;
  status: CompoundStatus;
  /** verdict outcome and called mechanism (null when failed) */
  outcome: VerdictOutcome | null;
  mechanism: Mechanism | null;
  /** family of the call: classic, tight-binding or partial (null when failed) */
  family: string | null;
  lean: 'competitive' | 'uncompetitive' | null;
  decisive: boolean | null;
  headline: string | null;
  /** the error model the compound was fitted with (differs between compounds only with 'auto') */
  errorModel: string | null;
  /** the model ranked first by AICc, its Akaike weight, and the AICc gap to the second model */
  topModel: Mechanism | null;
  topWeight: number | null;
  gapToSecond: number | null;
  /** the model whose constants are reported below: the called mechanism */
  constantsOf: Mechanism | null;
  Ki: ConstantSummary | null;
  Kiu: ConstantSummary | null;
  alpha: ConstantSummary | null;
  /** residual activity of a partial call, and a fitted [E]t (null otherwise) */
  beta: ConstantSummary | null;
  Et: ConstantSummary | null;
  Km: number | null;
  Vmax: number | null;
  /**
   * a table with one [S] level (an IC50 curve, src/analysis/single-substrate.ts): its IC50 from the
   * dose-response fit, in the [I] unit; null for every other compound
   */
  IC50: ConstantSummary | null;
  /** units of the constants: Km in the [S] unit, Ki and Kiu in the [I] unit, Vmax in the rate unit (null when not known) */
  units: { substrate: string | null; inhibitor: string | null; rate: string | null };
  rowsUsed: number | null;
  rowsExcluded: number | null;
  /** input warnings and fits that did not converge, in plain words */
  flags: string[];
  /** why the compound could not be analysed (null when analysed) */
  error: string | null;
  /** path of the compound's report, relative to the output folder (null without --reports) */
  report: string | null;
}

/** One unit of work: a compound's table (or the reason its file could not be read). */
export interface CompoundJob {
  position: number;
  compound: string;
  nameInFile: string | null;
  source: string;
  /** folder name of its report under compounds/, unique within the run */
  folder: string;
  table: RateTable | null;
  /** set when the file could not be read */
  readError: string | null;
  /** SHA-256 of the input file's bytes, for the report's reproducibility footer (null if unread) */
  inputSha256: string | null;
}
