/**
 * What `mechanist rates` is given: its options as commander parses them, and the page --report
 * writes. Shared by rates.ts (the command, loaded at start-up) and rates-action.ts (the work,
 * loaded when it runs), so neither imports the other.
 */
import type { ReadsCliOptions } from '../reads-options.js';

/** The page that --report writes. */
export const READS_PAGE = 'reads.html';

export interface RatesCliOptions extends ReadsCliOptions {
  out?: string;
  report?: string;
  quiet?: boolean;
}
