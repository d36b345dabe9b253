/**
 * Reading one cell as a number, with the file's decimal mark.
 */

/** Why a cell is not a finite number. */
export type CellProblem = { kind: 'blank' } | { kind: 'infinite' } | { kind: 'text'; text: string };

const BLANK: CellProblem = { kind: 'blank' };
const INFINITE: CellProblem = { kind: 'infinite' };

const DECIMAL_POINT_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const DECIMAL_COMMA_NUMBER = /^[+-]?(\d+,?\d*|,\d+)([eE][+-]?\d+)?$/;
const INFINITY_WORD = /^[+-]?(inf|infinity|\u221e)$/i;

/**
 * Reads a cell as a finite number, or says why it is not one: blank, infinite (written as
 * inf/infinity/∞, or a number too large for a double such as 1e999), or other text. Only plain
 * decimal notation is a number: no thousands separators, no percent signs, no units in the cell.
 * (A number comes back bare, and problems as shared objects, since this runs once per cell.)
 */
export function readNumberCell(cell: string, decimalMark: '.' | ','): number | CellProblem {
  const text = cell.trim();
  if (text === '') return BLANK;
  const pattern = decimalMark === '.' ? DECIMAL_POINT_NUMBER : DECIMAL_COMMA_NUMBER;
  if (pattern.test(text)) {
    const value = Number(decimalMark === '.' ? text : text.replace(',', '.'));
    if (!Number.isFinite(value)) return INFINITE;
    return value + 0; // + 0 turns -0 into 0
  }
  if (INFINITY_WORD.test(text)) return INFINITE;
  return { kind: 'text', text };
}

/** True when the cell looks like a number written with a decimal comma, e.g. `0,25`. */
export function looksLikeDecimalComma(cell: string): boolean {
  return /^[+-]?\d*,\d+([eE][+-]?\d+)?$/.test(cell.trim());
}

/** True when the cell looks like a number written with a decimal point, e.g. `0.25`. */
export function looksLikeDecimalPoint(cell: string): boolean {
  return /^[+-]?\d*\.\d+([eE][+-]?\d+)?$/.test(cell.trim());
}
