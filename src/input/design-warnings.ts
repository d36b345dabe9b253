/**
 * Design warnings that need the fitted constants, computed after the fit (pure): the checks the
 * analysis makes as verdict caveats (design-checks.ts holds their thresholds and wording), for a
 * rate table and the constants fitted to it.
 */
import type { InputWarning, RateTable } from './types.js';
import { designFindings } from './design-checks.js';

/**
 * Warnings about the range of [S] relative to the fitted Km and of [I] relative to the smaller of
 * Ki and Kiu. `fitted` is in the table's units (Km in substrate units, Ki and Kiu in inhibitor
 * units). A constant that is not finite and positive (e.g. an arm of the mechanism not detected)
 * is skipped: there is no range to compare with.
 */
export function designWarnings(
  table: RateTable,
  fitted: { Km: number; Ki?: number; Kiu?: number },
): InputWarning[] {
  if (table.points.length === 0) return [];
  const usable = (x: number | undefined): x is number => x !== undefined && Number.isFinite(x) && x > 0;
  const ks = [fitted.Ki, fitted.Kiu].filter(usable);
  const s = table.points.map((p) => p.substrate);
  const i = table.points.map((p) => p.inhibitor);
  const findings = designFindings(s, i, { Km: fitted.Km, ...(ks.length ? { K: Math.min(...ks) } : {}) }, table.units.inhibitor);
  return findings.map(({ code, message }) => ({ code, message }));
}
