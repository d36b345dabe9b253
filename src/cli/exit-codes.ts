/**
 * Exit codes of every command (documented in README.md and `mechanist --help`):
 *   0  success
 *   1  the analysis could not be completed (the message says why); for batch: a compound failed
 *   2  bad input or usage (the message names the file, line and column where there is one)
 */
export const EXIT_OK = 0;
export const EXIT_ANALYSIS_FAILED = 1;
export const EXIT_BAD_INPUT = 2;

/** A usage mistake on the command line (exit 2). */
export class UsageError extends Error {
  readonly exitCode = EXIT_BAD_INPUT;
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

export const EXIT_CODE_HELP = `Exit codes:
  0  success
  1  the analysis could not be completed (the message says why; batch: at least one compound failed)
  2  bad input or usage (the message names file, line and column)`;
