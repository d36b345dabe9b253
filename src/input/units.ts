/**
 * Concentration units: parsing unit text and exact decimal rescaling between units.
 */
import { InputError, type ConcentrationUnit } from './types.js';
import { locate, quoteText, type Place } from './messages.js';

/** Power of ten of each unit relative to mol/L. */
const DECIMAL_EXPONENT: Record<ConcentrationUnit, number> = { M: 0, mM: -3, uM: -6, nM: -9, pM: -12 };

/** The written forms accepted for each unit. Both the micro sign (U+00B5) and Greek mu (U+03BC) mean micro. */
const UNIT_SPELLINGS: Record<string, ConcentrationUnit> = {
  M: 'M',
  mM: 'mM',
  uM: 'uM',
  '\u00b5M': 'uM',
  '\u03bcM': 'uM',
  nM: 'nM',
  pM: 'pM',
};

export const CONCENTRATION_UNITS: readonly ConcentrationUnit[] = ['M', 'mM', 'uM', 'nM', 'pM'];

/**
 * Reads a concentration unit (`M`, `mM`, `uM`, `µM`, `μM`, `nM`, `pM`; case matters, since m and M
 * differ). Throws InputError naming the unknown unit; `where` adds file, line and column.
 */
export function parseConcentrationUnit(
  text: string,
  where?: { source: string } & Place,
): ConcentrationUnit {
  const unit = UNIT_SPELLINGS[text.trim()];
  if (unit !== undefined) return unit;
  const prefix = where ? locate(where.source, where) : '';
  throw new InputError(
    `${prefix}unknown concentration unit ${quoteText(text.trim())}; use M, mM, uM (or \u00b5M), nM or pM`,
    where?.source ?? '',
    where?.line,
    where?.column,
  );
}

/** The power of ten that takes a value in `from` to a value in `to` (uM -> nM is +3). */
export function unitShift(from: ConcentrationUnit, to: ConcentrationUnit): number {
  return DECIMAL_EXPONENT[from] - DECIMAL_EXPONENT[to];
}

/**
 * value x 10^power, done on the decimal digits rather than by a multiplication: the shortest
 * decimal that prints `value` gets its exponent moved, then is read back. So 1500 (nM) becomes
 * exactly the double that "1.5" (uM) reads as, which a multiplication by 0.001 would not
 * guarantee. Units then never change which points are equal.
 */
export function scaleByPowerOfTen(value: number, power: number): number {
  if (power === 0 || value === 0 || !Number.isFinite(value)) return value;
  const [mantissa, exponent] = String(value).split('e');
  return Number(`${mantissa}e${Number(exponent ?? 0) + power}`);
}
