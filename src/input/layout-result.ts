/**
 * What a layout reader hands back: points and exclusions grouped by compound, the units named
 * in the header, and where the key columns sit (for messages about a whole table).
 */
import { InputError, type ConcentrationUnit, type Exclusion, type RatePoint } from './types.js';
import { locate, quoteText, type Place } from './messages.js';
import { looksLikeDecimalComma, looksLikeDecimalPoint, readNumberCell, type CellProblem } from './numbers.js';

export interface CompoundRows {
  compound?: string;
  points: RatePoint[];
  excluded: Exclusion[];
  /** data rows (long) or data cells (matrix) read for this compound */
  rowsRead: number;
}

export interface LayoutResult {
  groups: CompoundRows[];
  headerUnits: { substrate: ConcentrationUnit | null; inhibitor: ConcentrationUnit | null; rate: string | null };
  /** header cells of the substrate, inhibitor and rate columns (matrix: the corner cell) */
  anchors: { substrate: Place; inhibitor: Place; rate: Place };
  hasSdColumn: boolean;
}

export interface LayoutContext {
  source: string;
  decimalMark: '.' | ',';
}

/**
 * Reads a substrate or inhibitor cell: a number >= 0, or (as a string) the reason it cannot be
 * used. A negative value is an error (a concentration cannot be below zero, so the file is wrong
 * rather than the point unusual); blank, text and infinite values are reasons for an exclusion.
 */
export function readConcentrationCell(
  cell: string,
  what: 'substrate' | 'inhibitor',
  line: number,
  column: number,
  context: LayoutContext,
): number | string {
  const read = readNumberCell(cell, context.decimalMark);
  if (typeof read !== 'number') return problemReason(read, cell, what, context);
  if (read < 0) {
    throw new InputError(
      `${locate(context.source, { line, column })}negative ${what} concentration ${quoteText(cell.trim())}; concentrations cannot be below zero, correct the value`,
      context.source, line, column,
    );
  }
  return read;
}

/** A rate (or sd) cell: any finite number, or (as a string) the reason it cannot be used. */
export function readRateCell(cell: string, what: string, context: LayoutContext): number | string {
  const read = readNumberCell(cell, context.decimalMark);
  return typeof read === 'number' ? read : problemReason(read, cell, what, context);
}

function problemReason(problem: CellProblem, cell: string, what: string, context: LayoutContext): string {
  switch (problem.kind) {
    case 'blank':
      return `${what} is blank`;
    case 'infinite':
      return `${what} is infinite (${quoteText(cell.trim())})`;
    case 'text': {
      const shown = quoteText(problem.text);
      // quoteText describes a missing-value marker instead of quoting it: word the reason around that
      if (!shown.startsWith('"')) return `${what} holds ${shown}, not a number`;
      return `${what} ${shown} is not a number${decimalHint(problem.text, context)}`;
    }
  }
}

/** The error for a file that holds no cells at all (only blank lines, spaces or separators). */
export function emptyFileError(source: string): InputError {
  return new InputError(`${locate(source, { line: 1 })}the file is empty; it needs a header line and data rows`, source, 1);
}

/** Reason text for a row or cell at [S] = 0. */
export const ZERO_SUBSTRATE_REASON =
  '[S] = 0: a rate without substrate is a blank (background), not a point on the curve';

function decimalHint(text: string, context: LayoutContext): string {
  if (context.decimalMark === ',' && looksLikeDecimalPoint(text)) return ' (this file is read with decimal commas)';
  if (context.decimalMark === '.' && looksLikeDecimalComma(text)) return ' (this file is read with decimal points)';
  return '';
}
