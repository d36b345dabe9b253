/**
 * Telling the long layout from the matrix layout by the first non-blank rows.
 */
import { isBlankRow, type TextRow } from './tokenize.js';
import { readCornerCell, readTitleRow } from './matrix-layout.js';

/**
 * Matrix when the first non-blank row starts with a corner cell (`substrate (uM) \ inhibitor (nM)`),
 * or is a compound title row followed by one; long otherwise.
 */
export function detectLayout(rows: Iterable<TextRow>): 'long' | 'matrix' {
  const filled: TextRow[] = [];
  for (const row of rows) {
    if (!isBlankRow(row)) filled.push(row);
    if (filled.length === 2) break;
  }
  const [first, second] = filled;
  if (!first) return 'long';
  if (readCornerCell(first.cells[0] ?? '') !== null) return 'matrix';
  if (readTitleRow(first) !== null && second && readCornerCell(second.cells[0] ?? '') !== null) return 'matrix';
  return 'long';
}
