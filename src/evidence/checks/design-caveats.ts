/**
 * Design checks that need the fitted constants, turned into verdict caveats. The thresholds and
 * wording live in src/input/design-checks.ts (shared with the library's designWarnings), so these
 * caveats carry their sentences (src/evidence/verdict/caveat.ts, WordedCaveat).
 */
import type { FitData } from '../../fit/fit-data.js';
import { designFindings, type DesignScale } from '../../input/design-checks.js';
import type { Caveat } from '../verdict/verdict.js';

export function designCaveats(data: FitData, fitted: DesignScale): Caveat[] {
  return designFindings(data.s, data.i, fitted, data.units?.inhibitor).map(({ code, blocking, ...text }) => ({ code, blocking, text }));
}
