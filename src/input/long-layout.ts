/**
 * The long layout: a header line, then one row per measured rate.
 *
 * Recognised columns (name case-insensitive, unit in brackets or parentheses allowed):
 * substrate, inhibitor, rate (required); sd, replicate, well, exclude, compound (optional).
 * Any other named column is kept as an annotation. Lines that hold nothing but separators and
 * spaces are not data rows and are not counted.
 */
import { InputError, type Exclusion, type RatePoint } from './types.js';
import { locate, quoteText, type Place } from './messages.js';
import { isBlankRow, type TextRow } from './tokenize.js';
import { splitHeaderName } from './header.js';
import { EXCLUDE_YES_WORDS, readExcludeFlag } from './exclude-flag.js';
import { parseConcentrationUnit } from './units.js';
import { readNumberCell } from './numbers.js';
import {
  emptyFileError,
  readConcentrationCell,
  readRateCell,
  ZERO_SUBSTRATE_REASON,
  type CompoundRows,
  type LayoutContext,
  type LayoutResult,
} from './layout-result.js';

const KNOWN_COLUMNS = ['substrate', 'inhibitor', 'rate', 'sd', 'replicate', 'well', 'exclude', 'compound'] as const;
type KnownColumn = (typeof KNOWN_COLUMNS)[number];
const REQUIRED_COLUMNS: KnownColumn[] = ['substrate', 'inhibitor', 'rate'];

interface ColumnPlan {
  known: Partial<Record<KnownColumn, number>>;
  /** annotation columns: index and header text */
  annotations: { index: number; label: string }[];
  units: LayoutResult['headerUnits'];
  width: number;
}

function planColumns(header: TextRow, dataRows: TextRow[], context: LayoutContext): ColumnPlan {
  const { source } = context;
  const seen = new Map<string, number>();
  const plan: ColumnPlan = {
    known: {},
    annotations: [],
    units: { substrate: null, inhibitor: null, rate: null },
    width: header.cells.length,
  };
  header.cells.forEach((cell, index) => {
    const column = index + 1;
    const place: Place = { line: header.line, column };
    const { name, key, unit } = splitHeaderName(cell);
    if (name === '') {
      const used = dataRows.find((row) => (row.cells[index] ?? '').trim() !== '');
      if (used) {
        throw new InputError(
          `${locate(source, place)}column ${column} has data (line ${used.line}) but no name in the header; name it or delete it`,
          source, header.line, column,
        );
      }
      return; // an empty, unnamed column (e.g. a trailing separator) is ignored
    }
    const earlier = seen.get(key);
    if (earlier !== undefined) {
      throw new InputError(
        `${locate(source, place)}duplicate column name ${quoteText(name)} (also column ${earlier}); rename one`,
        source, header.line, column,
      );
    }
    seen.set(key, column);
    if ((KNOWN_COLUMNS as readonly string[]).includes(key)) {
      const known = key as KnownColumn;
      plan.known[known] = index;
      if (unit !== null && (known === 'substrate' || known === 'inhibitor')) {
        plan.units[known] = parseConcentrationUnit(unit, { source, ...place });
      }
      if (known === 'rate') plan.units.rate = unit;
    } else {
      plan.annotations.push({ index, label: cell.trim() });
    }
  });
  for (const required of REQUIRED_COLUMNS) {
    if (plan.known[required] !== undefined) continue;
    const names = header.cells.map((c) => c.trim()).filter((c) => c !== '');
    const listed = names.length === 0 ? 'no names' : names.slice(0, 8).map(quoteText).join(', ') + (names.length > 8 ? ', ...' : '');
    const looksLikeData = typeof readNumberCell(header.cells[0] ?? '', context.decimalMark) === 'number';
    const first = (header.cells[0] ?? '').toLowerCase();
    const triedMatrix = first.includes('substrate') && first.includes('inhibitor');
    const hint = looksLikeData
      ? 'the first line looks like data; add a header line naming substrate, inhibitor and rate'
      : triedMatrix
        ? 'for the matrix layout, write the corner cell with a backslash: "substrate (uM) \\ inhibitor (nM)"'
        : `name a column ${quoteText(required)}`;
    throw new InputError(
      `${locate(source, { line: header.line })}missing required column ${quoteText(required)} (the header has ${listed}); ${hint}`,
      source, header.line,
    );
  }
  return plan;
}

/**
 * Reads rows of the long layout; `rows` start at the header line. The rows are used one at a time
 * and not kept (docs/decisions/reader-memory.md); only a header with an unnamed column makes the
 * reader hold them, to name the first row that has data there before anything else is read.
 */
export function readLongLayout(rows: Iterable<TextRow>, context: LayoutContext): LayoutResult {
  const { source } = context;
  const iterator = rows[Symbol.iterator]();
  let header: TextRow | undefined;
  for (let next = iterator.next(); !next.done; next = iterator.next()) {
    if (!isBlankRow(next.value)) {
      header = next.value;
      break;
    }
  }
  if (!header) {
    throw emptyFileError(source);
  }
  const rest: Iterable<TextRow> = { [Symbol.iterator]: () => iterator };
  const hasUnnamedColumn = header.cells.some((cell) => splitHeaderName(cell).name === '');
  const held = hasUnnamedColumn ? [...rest].filter((row) => !isBlankRow(row)) : null;
  const plan = planColumns(header, held ?? [], context);
  const col = plan.known as Required<Pick<ColumnPlan['known'], 'substrate' | 'inhibitor' | 'rate'>> & ColumnPlan['known'];

  // Compound names: either every row names one, or none does. Without held rows, whether any row
  // names one is known only at the end: rows before the first named one are kept aside until then.
  const compoundIndex = col.compound;
  const compoundOf = (row: TextRow): string => (compoundIndex === undefined ? '' : (row.cells[compoundIndex] ?? '').trim());
  const groups = new Map<string, CompoundRows>();
  const strings = new Map<string, string>();
  const shared = (text: string): string => {
    const known = strings.get(text);
    if (known !== undefined) return known;
    strings.set(text, text);
    return text;
  };
  let named: boolean | null = compoundIndex === undefined ? false : held ? held.some((row) => compoundOf(row) !== '') : null;
  let unnamedRows: TextRow[] = [];
  let dataRows = 0;

  const take = (row: TextRow): void => {
    const compound = named ? compoundOf(row) : '';
    if (named && compound === '') {
      const place = { line: row.line, column: compoundIndex! + 1 };
      throw new InputError(
        `${locate(source, place)}compound is blank here but other rows name a compound; fill it in`,
        source, place.line, place.column,
      );
    }
    let group = groups.get(compound);
    if (!group) {
      group = { compound: named ? compound : undefined, points: [], excluded: [], rowsRead: 0 };
      groups.set(compound, group);
    }
    group.rowsRead++;
    const outcome = readLongRow(row, plan, context, group.compound, shared);
    if ('reason' in outcome) group.excluded.push(outcome);
    else group.points.push(outcome);
  };

  for (const row of held ?? rest) {
    if (isBlankRow(row)) continue;
    dataRows++;
    if (named === null) {
      if (compoundOf(row) === '') {
        unnamedRows.push(row);
        continue;
      }
      named = true;
      // a blank compound before the first named row: the same error, at that row
      if (unnamedRows.length > 0) take(unnamedRows[0]);
    }
    take(row);
  }
  if (dataRows === 0) {
    throw new InputError(
      `${locate(source, { line: header.line })}no data rows below the header; add one row per measured rate`,
      source, header.line,
    );
  }
  if (named === null) {
    named = false;
    for (const row of unnamedRows) take(row);
    unnamedRows = [];
  }

  const headerPlace = (index: number): Place => ({ line: header.line, column: index + 1 });
  return {
    groups: [...groups.values()],
    headerUnits: plan.units,
    anchors: { substrate: headerPlace(col.substrate), inhibitor: headerPlace(col.inhibitor), rate: headerPlace(col.rate) },
    hasSdColumn: col.sd !== undefined,
  };
}

/** One data row: a point, or the exclusion that keeps it out (the first problem found). */
function readLongRow(
  row: TextRow,
  plan: ColumnPlan,
  context: LayoutContext,
  compound: string | undefined,
  shared: (text: string) => string,
): RatePoint | Exclusion {
  const { source } = context;
  const col = plan.known;

  if (col.exclude !== undefined) {
    const flag = readExcludeFlag(cellAt(row, col.exclude));
    if (flag === null) {
      const place = { line: row.line, column: col.exclude + 1 };
      throw new InputError(
        `${locate(source, place)}exclude value ${quoteText(cellAt(row, col.exclude).trim())} not understood; write yes to leave the row out (${EXCLUDE_YES_WORDS}) or leave it blank`,
        source, place.line, place.column,
      );
    }
    if (flag) return excludeCell(row, col, col.exclude, `flagged in the exclude column (${quoteText(cellAt(row, col.exclude).trim())})`);
  }

  const substrate = readConcentrationCell(cellAt(row, col.substrate), 'substrate', row.line, col.substrate! + 1, context);
  const inhibitor = readConcentrationCell(cellAt(row, col.inhibitor), 'inhibitor', row.line, col.inhibitor! + 1, context);
  const rate = readRateCell(cellAt(row, col.rate), 'rate', context);

  const extra = firstFilledCellFrom(row, plan.width);
  if (extra >= 0) {
    return excludeCell(
      row,
      col,
      extra,
      `row has ${row.cells.length} cells but the header has ${plan.width} columns (an unquoted separator inside a value?)`,
    );
  }
  if (typeof substrate === 'string') return excludeCell(row, col, col.substrate!, substrate);
  if (typeof inhibitor === 'string') return excludeCell(row, col, col.inhibitor!, inhibitor);
  if (typeof rate === 'string') return excludeCell(row, col, col.rate!, rate);
  if (substrate === 0) return excludeCell(row, col, col.substrate!, ZERO_SUBSTRATE_REASON);

  const point: RatePoint = { line: row.line, substrate, inhibitor, rate };
  if (col.sd !== undefined && cellAt(row, col.sd).trim() !== '') {
    const sd = readRateCell(cellAt(row, col.sd), 'sd', context);
    if (typeof sd === 'string') return excludeCell(row, col, col.sd, sd);
    if (sd <= 0) return excludeCell(row, col, col.sd, `sd ${quoteText(cellAt(row, col.sd).trim())} is not above zero; a standard deviation must be positive`);
    point.sd = sd;
  }
  if (compound !== undefined) point.compound = compound;
  const replicate = cellAt(row, col.replicate).trim();
  // one string object per distinct replicate and well name (they repeat down a long table)
  if (replicate !== '') point.replicate = shared(replicate);
  const well = cellAt(row, col.well).trim();
  if (well !== '') point.well = shared(well);
  for (const { index, label } of plan.annotations) {
    const value = cellAt(row, index).trim();
    if (value === '') continue;
    point.annotations ??= {};
    point.annotations[label] = value;
  }
  return point;
}

function cellAt(row: TextRow, index: number | undefined): string {
  return index === undefined ? '' : (row.cells[index] ?? '');
}

/** Index of the first non-blank cell at or after `start`, or -1. */
function firstFilledCellFrom(row: TextRow, start: number): number {
  for (let index = start; index < row.cells.length; index++) if (row.cells[index].trim() !== '') return index;
  return -1;
}

/** The exclusion of a row, with its [S], [I] and rate cells as written. */
function excludeCell(row: TextRow, col: ColumnPlan['known'], index: number, reason: string): Exclusion {
  return {
    line: row.line,
    column: index + 1,
    reason,
    asWritten: { substrate: cellAt(row, col.substrate), inhibitor: cellAt(row, col.inhibitor), rate: cellAt(row, col.rate) },
  };
}
