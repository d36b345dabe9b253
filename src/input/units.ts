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

/**
 * Spellings accepted in any letter case, because no other unit could be meant: `um`, `UM`, `nm`,
 * `NM`, `pm`, `PM`, `µm` ... (issue 13). Milli and molar are not among them: `m` and `M` differ by
 * case alone (`MM`, `mm`, `Mm` could be millimolar or a slip), so those stay strict, with a hint.
 */
const CASE_FREE_SPELLINGS: Record<string, ConcentrationUnit> = {
  um: 'uM',
  '\u00b5m': 'uM',
  '\u03bcm': 'uM',
  nm: 'nM',
  pm: 'pM',
};

/** Spellings where only the case of m/M is wrong, with what to write instead. */
const MILLI_OR_MOLAR_HINT: Record<string, string> = {
  mm: 'write mM for millimolar (m and M differ: m is milli, M is molar)',
  m: 'write M for molar or mM for millimolar (m and M differ: m is milli, M is molar)',
};

export const CONCENTRATION_UNITS: readonly ConcentrationUnit[] = ['M', 'mM', 'uM', 'nM', 'pM'];

/**
 * Reads a concentration unit (`M`, `mM`, `uM`, `µM`, `μM`, `nM`, `pM`; micro, nano and pico in any
 * case; the case of m and M matters, since they differ). Throws InputError naming the unknown unit; `where` adds file, line and column.
 */
export function parseConcentrationUnit(
  text: string,
  where?: { source: string } & Place,
): ConcentrationUnit {
  const trimmed = text.trim();
  const unit = UNIT_SPELLINGS[trimmed] ?? CASE_FREE_SPELLINGS[trimmed.toLowerCase()];
  if (unit !== undefined) return unit;
  const prefix = where ? locate(where.source, where) : '';
  const hint = MILLI_OR_MOLAR_HINT[trimmed.toLowerCase()];
  throw new InputError(
    hint !== undefined
      ? `${prefix}concentration unit ${quoteText(trimmed)} is ambiguous; ${hint}`
      : `${prefix}unknown concentration unit ${quoteText(trimmed)}; use M, mM, uM (or \u00b5M), nM or pM`,
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

/** A concentration as written on the command line: a number and, when given, its unit. */
export interface Concentration {
  value: number;
  unit: ConcentrationUnit | null;
}

/**
 * Reads `25uM`, `25 uM`, `2.5e-5 M` or a plain `25` (unit null: the caller's unit applies; with
 * `unitRequired` a plain number is refused). The unit is read by parseConcentrationUnit (micro, nano
 * and pico in any case). Throws InputError.
 */
export function parseConcentration(text: string, options: { unitRequired?: boolean } = {}): Concentration {
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(\S*)\s*$/.exec(text);
  if (m === null || (options.unitRequired && m[2] === ''))
    throw new InputError(
      options.unitRequired
        ? `${quoteText(text)} is not a concentration with its unit (for example 20uM)`
        : `${quoteText(text)} is not a concentration; write a number with an optional unit, e.g. 25uM`,
      '',
    );
  const value = Number(m[1]);
  return { value, unit: m[2] === '' ? null : parseConcentrationUnit(m[2]) };
}

/** The value of `c` in `to` (exact decimal rescaling); a plain number is taken to be in `to` already. */
export function concentrationIn(c: Concentration, to: ConcentrationUnit): number {
  return c.unit === null ? c.value : scaleByPowerOfTen(c.value, unitShift(c.unit, to));
}
