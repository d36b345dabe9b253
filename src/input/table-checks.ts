/**
 * Checks on a whole table once its rows are read: errors that stop a mechanism analysis, and
 * warnings about the design that let it go on.
 */
import { InputError, type InputWarning, type RateTable } from './types.js';
import { formatConcentration, listLines, locate, quoteText, type Place } from './messages.js';
import { repeatedRowWarnings } from './repeated-rows.js';
import { exclusionReasonsClause } from './exclusion-summary.js';
import { distinctLevels } from './distinct-levels.js';

/**
 * The mixed model has 4 parameters (Vmax, Km, Ki, Kiu); at least one more point than that is
 * needed to have a residual degree of freedom, so 5 usable points are the floor for reading any
 * table. The mechanism analysis needs more (MINIMUM_ANALYSIS_POINTS).
 */
export const MINIMUM_USABLE_POINTS = 5;

/**
 * With the error variance the mixed model has k = 5 for the criteria, and
 * AICc = -2 ln L + 2k + 2k(k + 1)/(n - k - 1) (Hurvich & Tsai 1989) is finite only for n > k + 1:
 * every model can be ranked only from 7 usable points on. analyzeTable refuses fewer.
 */
export const MINIMUM_ANALYSIS_POINTS = 7;

function compoundPrefix(table: RateTable): string {
  return table.compound === undefined ? '' : `compound ${quoteText(table.compound)}: `;
}

/**
 * Throws InputError when the usable points cannot support the analysis: fewer than 5 points; and,
 * when `requireMechanismDesign`, fewer than two inhibitor levels or no inhibitor-free control.
 */
export function checkUsableDesign(
  table: RateTable,
  anchors: { inhibitor: Place; rate: Place },
  requireMechanismDesign: boolean,
): void {
  const { source } = table;
  const n = table.points.length;
  if (n < MINIMUM_USABLE_POINTS) {
    throw new InputError(
      `${locate(source, anchors.rate)}${compoundPrefix(table)}only ${n} usable ${n === 1 ? 'point' : 'points'} (${table.rowsRead} read, ${table.excluded.length} excluded); the mixed model has 4 parameters, so at least ${MINIMUM_USABLE_POINTS} are needed; add rates or correct the excluded rows${exclusionReasonsClause(table)}`,
      source, anchors.rate.line, anchors.rate.column,
    );
  }
  if (!requireMechanismDesign) return;
  const inhibitorLevels = distinctLevels(table.points.map((p) => p.inhibitor));
  const unit = table.units.inhibitor;
  if (inhibitorLevels.length < 2) {
    const only = formatConcentration(inhibitorLevels[0], unit);
    const what = inhibitorLevels[0] === 0
      ? 'only the inhibitor-free control ([I] = 0) among the usable points; a mechanism analysis needs at least one non-zero [I] too; add rates measured with inhibitor'
      : `only one inhibitor level ([I] = ${only}) and no inhibitor-free control among the usable points; a mechanism analysis needs [I] = 0 and at least one non-zero [I]; add the missing levels`;
    throw new InputError(
      `${locate(source, anchors.inhibitor)}${compoundPrefix(table)}${what} (or turn off the mechanism-design check)`,
      source, anchors.inhibitor.line, anchors.inhibitor.column,
    );
  }
  if (inhibitorLevels[0] !== 0) {
    throw new InputError(
      `${locate(source, anchors.inhibitor)}${compoundPrefix(table)}no inhibitor-free control ([I] = 0) among the usable points; a mechanism analysis compares rates with and without inhibitor; add [I] = 0 rows (or turn off the mechanism-design check)`,
      source, anchors.inhibitor.line, anchors.inhibitor.column,
    );
  }
}

/**
 * The magnitudes a non-zero value may have: 1e-150 to 1e150. Within them every square the fit
 * forms (residuals, weights 1/sd^2, the Jacobian's cross products) stays inside the normal range
 * of a double (about 2.2e-308 to 1.8e308, IEEE 754) with decades to spare; beyond them the fits
 * under- or overflow (measured: rates of 1e300 and concentrations of 1e-300 ended in internal
 * errors, rates of 1e-300 ran over two minutes). At both ends, and with concentrations and rates
 * at opposite ends together, the analysis was checked to give the call it gives at ordinary
 * scale (test/input/numeric-range.test.ts).
 */
export const SMALLEST_MAGNITUDE = 1e-150;
export const LARGEST_MAGNITUDE = 1e150;

/** True for a non-zero value outside SMALLEST_MAGNITUDE..LARGEST_MAGNITUDE (NaN included). */
export function outsideFittableRange(x: number): boolean {
  const a = Math.abs(x);
  return a !== 0 && !(a >= SMALLEST_MAGNITUDE && a <= LARGEST_MAGNITUDE);
}

/**
 * Throws InputError, naming the line (and column in the long layout) and the value, for the first
 * usable value outside SMALLEST_MAGNITUDE..LARGEST_MAGNITUDE: a fit cannot be trusted there, and
 * the cure is a change of unit, which changes no result.
 */
export function checkNumericRange(table: RateTable, anchors: { substrate: Place; inhibitor: Place; rate: Place }): void {
  for (const p of table.points) {
    const values: Array<[string, number | undefined, Place | null]> = [
      ['substrate', p.substrate, anchors.substrate],
      ['inhibitor', p.inhibitor, anchors.inhibitor],
      ['rate', p.rate, anchors.rate],
      ['sd', p.sd, null],
    ];
    for (const [what, value, anchor] of values) {
      if (value === undefined || !outsideFittableRange(value)) continue;
      const column = table.layout === 'long' && anchor?.column !== undefined ? anchor.column : undefined;
      const place: Place = column !== undefined ? { line: p.line, column } : { line: p.line };
      const unit = what === 'substrate' ? table.units.substrate : what === 'inhibitor' ? table.units.inhibitor : null;
      const cure = unit !== null && unit !== undefined
        ? `give the ${what} in another unit (the header says ${unit})`
        : `rescale the ${what} column (a change of unit changes no result)`;
      throw new InputError(
        `${locate(table.source, place)}${compoundPrefix(table)}${what} ${value} is outside the range that can be fitted reliably (non-zero magnitudes from ${SMALLEST_MAGNITUDE} to ${LARGEST_MAGNITUDE}); ${cure}`,
        table.source, place.line, column,
      );
    }
    // with sd weights the fit squares rate/sd: the ratio obeys the same bounds
    if (p.sd !== undefined && p.rate !== 0 && outsideFittableRange(p.sd / p.rate)) {
      throw new InputError(
        `${locate(table.source, { line: p.line })}${compoundPrefix(table)}sd ${p.sd} is ${(p.sd / Math.abs(p.rate)).toExponential(1)} times its rate ${p.rate}; sd weights need sd/rate within ${SMALLEST_MAGNITUDE} to ${LARGEST_MAGNITUDE}; check the sd column (is it in the rate's unit?)`,
        table.source, p.line,
      );
    }
  }
}

/** True when some ([S], [I]) pair holds more than one rate. */
function hasRepeatedPair(points: RateTable['points']): boolean {
  const seen = new Map<number, Set<number>>();
  for (const p of points) {
    let inhibitors = seen.get(p.substrate);
    if (!inhibitors) {
      inhibitors = new Set();
      seen.set(p.substrate, inhibitors);
    }
    if (inhibitors.has(p.inhibitor)) return true;
    inhibitors.add(p.inhibitor);
  }
  return false;
}

/** More than this many decades between the smallest and largest non-zero level is suspicious. */
const WIDEST_PLAUSIBLE_DECADES = 8;
/** Common practice (no single source): at least 5 [S] levels spanning the Km. */
const FEWEST_SUBSTRATE_LEVELS = 5;
/** Common practice (no single source): at least 3 non-zero [I] levels besides the control. */
const FEWEST_INHIBITOR_LEVELS = 3;

/** Warnings about the data that need no fitted constants (see designWarnings for those). */
export function dataWarnings(table: RateTable): InputWarning[] {
  const warnings: InputWarning[] = [];
  const points = table.points;
  if (points.length === 0) return warnings;

  const notPositive = points.filter((p) => p.rate <= 0).map((p) => p.line);
  if (notPositive.length > 0) {
    warnings.push({
      code: 'rate-not-positive',
      message: `${notPositive.length} ${notPositive.length === 1 ? 'rate is' : 'rates are'} zero or negative (${listLines(notPositive)}); they stay in the fit, but check the background subtraction`,
      lines: notPositive,
    });
  }

  warnings.push(...repeatedRowWarnings(points));

  if (!hasRepeatedPair(points)) {
    warnings.push({
      code: 'single-replicate',
      message: 'every ([S], [I]) pair has a single rate; replicates let the error model and the lack of fit be checked, so measure at least in duplicate',
    });
  }

  const substrateLevels = distinctLevels(points.map((p) => p.substrate));
  const inhibitorLevels = distinctLevels(points.map((p) => p.inhibitor)).filter((v) => v > 0);
  for (const [axis, values] of [['substrate', substrateLevels], ['inhibitor', inhibitorLevels]] as const) {
    if (values.length < 2) continue;
    const decades = Math.log10(values[values.length - 1] / values[0]);
    if (decades > WIDEST_PLAUSIBLE_DECADES) {
      warnings.push({
        code: 'wide-concentration-span',
        message: `${axis} concentrations span ${decades.toFixed(1)} decades (more than ${WIDEST_PLAUSIBLE_DECADES}); check for mixed units in the ${axis} column`,
      });
    }
  }
  if (substrateLevels.length < FEWEST_SUBSTRATE_LEVELS) {
    warnings.push({
      code: 'few-substrate-levels',
      message: `only ${substrateLevels.length} substrate ${substrateLevels.length === 1 ? 'level' : 'levels'}; common practice is at least ${FEWEST_SUBSTRATE_LEVELS}, from about 0.2 x Km to 5 x Km or more, else Km and the mechanism are poorly determined`,
    });
  }
  if (inhibitorLevels.length < FEWEST_INHIBITOR_LEVELS) {
    warnings.push({
      code: 'few-inhibitor-levels',
      message: `only ${inhibitorLevels.length} non-zero inhibitor ${inhibitorLevels.length === 1 ? 'level' : 'levels'}; common practice is at least ${FEWEST_INHIBITOR_LEVELS} (e.g. 0.5, 1, 2, 4 x Ki) besides the control, else the mechanisms are hard to tell apart`,
    });
  }
  return warnings;
}
