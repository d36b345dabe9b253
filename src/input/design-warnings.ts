/**
 * Design warnings that need the fitted constants, computed after the fit (pure).
 *
 * The targets are common practice, stated in the NIH/NCATS Assay Guidance Manual chapter on
 * mechanism-of-action assays for enzymes: [S] from about 0.2 x Km to at least 5 x Km, since the
 * uncompetitive and mixed arms act on ES and show only near saturation; [I] from 0 up to several
 * times Ki.
 */
import type { InputWarning, RateTable } from './types.js';
import { formatConcentration } from './messages.js';

/** [S] should reach at least this multiple of Km (common practice, see above). */
const SUBSTRATE_REACH_OVER_KM = 5;

/**
 * Warnings about the range of [S] relative to the fitted Km and of [I] relative to Ki and Kiu.
 * `fitted` is in the table's units (Km in substrate units, Ki and Kiu in inhibitor units).
 * A constant that is not finite and positive (e.g. an arm of the mechanism not detected) is
 * skipped: there is no range to compare with.
 */
export function designWarnings(
  table: RateTable,
  fitted: { Km: number; Ki?: number; Kiu?: number },
): InputWarning[] {
  const warnings: InputWarning[] = [];
  if (table.points.length === 0) return warnings;
  const usable = (x: number | undefined): x is number => x !== undefined && Number.isFinite(x) && x > 0;
  const sUnit = table.units.substrate;
  const iUnit = table.units.inhibitor;
  const highestS = Math.max(...table.points.map((p) => p.substrate));
  const highestI = Math.max(...table.points.map((p) => p.inhibitor));

  if (usable(fitted.Km)) {
    const km = formatConcentration(fitted.Km, sUnit);
    const top = formatConcentration(highestS, sUnit);
    if (highestS < fitted.Km) {
      warnings.push({
        code: 'substrate-below-km',
        message: `[S] never reaches Km (highest [S] ${top}, Km ${km}); Vmax and Km are extrapolated and uncompetitive or mixed effects cannot show; extend [S] to at least ${SUBSTRATE_REACH_OVER_KM} x Km`,
      });
    } else if (highestS < SUBSTRATE_REACH_OVER_KM * fitted.Km) {
      warnings.push({
        code: 'substrate-below-5km',
        message: `[S] stays below ${SUBSTRATE_REACH_OVER_KM} x Km (highest [S] ${top}, Km ${km}); effects on ES (uncompetitive, mixed) are weakly seen, so competitive and mixed may not be told apart; extend [S] to at least ${SUBSTRATE_REACH_OVER_KM} x Km`,
      });
    }
  }
  const top = formatConcentration(highestI, iUnit);
  if (usable(fitted.Ki) && highestI <= fitted.Ki) {
    warnings.push({
      code: 'inhibitor-below-ki',
      message: `[I] never exceeds Ki (highest [I] ${top}, Ki ${formatConcentration(fitted.Ki, iUnit)}); inhibition is weak over the tested range and Ki is poorly determined; test [I] up to several times Ki`,
    });
  }
  if (usable(fitted.Kiu) && highestI <= fitted.Kiu) {
    warnings.push({
      code: 'inhibitor-below-kiu',
      message: `[I] never exceeds Kiu (highest [I] ${top}, Kiu ${formatConcentration(fitted.Kiu, iUnit)}); binding to ES is weakly probed and Kiu is poorly determined; test [I] up to several times Kiu`,
    });
  }
  return warnings;
}
