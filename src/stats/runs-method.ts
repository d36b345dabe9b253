/**
 * Choosing between exact and normal-approximation p-values for the runs tests (runs-test.ts,
 * pooled-runs-test.ts). The default limit of 50 for n+ + n- covers every case with n+ and n- both
 * <= 20, the range of the Swed-Eisenhart (1943) tables.
 */

export type RunsMethodChoice = 'auto' | 'exact' | 'normal';

export interface RunsTestOptions {
  method?: RunsMethodChoice;
  /** largest n+ + n- for which 'auto' uses exact probabilities; default 50 */
  exactMaxTotal?: number;
}

const DEFAULT_EXACT_MAX_TOTAL = 50;

/** Resolves 'auto' to 'exact' when every series total is within the exact limit. */
export function chooseRunsMethod(options: RunsTestOptions, seriesTotals: number[]): 'exact' | 'normal' {
  const choice = options.method ?? 'auto';
  if (choice !== 'auto') return choice;
  const limit = options.exactMaxTotal ?? DEFAULT_EXACT_MAX_TOTAL;
  return seriesTotals.every((t) => t <= limit) ? 'exact' : 'normal';
}
