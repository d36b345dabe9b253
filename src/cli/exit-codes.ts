/**
 * Exit codes of every command (documented in README.md and `mechanist --help`):
 *   0    success
 *   1    the analysis could not be completed (the message says why); for batch: a compound failed
 *   2    bad input or usage (the message names the file, line and column where there is one);
 *        also an output folder found unusable before any analysis ran (an existing file, a
 *        missing parent, read-only or full, a folder another run is writing into)
 *   3    the results could not be written while the run was writing them (disk full, folder
 *        removed); nothing half-written is left
 *   130  interrupted (Ctrl-C, SIGINT; SIGTERM gives 143); the run's temporary files are removed
 */
export const EXIT_OK = 0;
export const EXIT_ANALYSIS_FAILED = 1;
export const EXIT_BAD_INPUT = 2;
export const EXIT_WRITE_FAILED = 3;
/** 128 + the signal number, the shell's convention: SIGINT (2) gives 130, SIGTERM (15) 143. */
export const EXIT_INTERRUPTED = 130;
export const EXIT_TERMINATED = 143;

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
  2  bad input or usage (the message names file, line and column), or an unusable output folder
  3  the results could not be written (disk full...); nothing half-written is left
  130  interrupted (143 for SIGTERM); temporary files are removed`;
