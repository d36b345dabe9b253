/**
 * What the reproducibility footer records about a run: the input file's SHA-256, the options,
 * the random seed (when a resampling step used one) and the date. The date is the only part of a
 * report that changes between two runs on the same input. The hash is src/input/file-hash.ts.
 */
export interface ReportProvenance {
  /** SHA-256 (hex) of the input file's bytes, as read from disk */
  inputSha256?: string;
  /** the command that produced the report, e.g. "mechanist demo" */
  command?: string;
  /** options as given, for the record */
  options?: Record<string, string>;
  /** seed of the random resampling, when one was used */
  seed?: number | null;
  /**
   * when the report was made; default: now. null leaves the date out (the demo report, which is
   * committed and must come out byte-identical each time the README's demo is run)
   */
  generatedAt?: Date | null;
}
