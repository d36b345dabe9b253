/**
 * Reading one cell as a number, with the file's decimal mark.
 */

export type CellValue =
  | { kind: 'number'; value: number }
  | { kind: 'blank' }
  | { kind: 'infinite' }
  | { kind: 'text'; text: string };

const DECIMAL_POINT_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const DECIMAL_COMMA_NUMBER = /^[+-]?(\d+,?\d*|,\d+)([eE][+-]?\d+)?$/;
const INFINITY_WORD = /^[+-]?(inf|infinity|\u221e)$/i;

/**
 * Classifies a cell: blank, a finite number, infinite (written as inf/infinity/∞, or a number too
 * large for a double such as 1e999), or other text. Only plain decimal notation is a number:
 * no thousands separators, no percent signs, no units inside the cell.
 */
export function readNumberCell(cell: string, decimalMark: '.' | ','): CellValue {
  const text = cell.trim();
  if (text === '') return { kind: 'blank' };
  const pattern = decimalMark === '.' ? DECIMAL_POINT_NUMBER : DECIMAL_COMMA_NUMBER;
  if (pattern.test(text)) {
    const value = Number(decimalMark === '.' ? text : text.replace(',', '.'));
    if (!Number.isFinite(value)) return { kind: 'infinite' };
    return { kind: 'number', value: value + 0 }; // + 0 turns -0 into 0
  }
  if (INFINITY_WORD.test(text)) return { kind: 'infinite' };
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
