/**
 * The matrix layout: one block per plate (or per compound), each a small grid.
 *
 *   compound,CPD-7                           <- optional title row: `compound` then the name
 *   substrate (uM) \ inhibitor (nM),0,0,50,50 <- corner cell, then the [I] of each column
 *   2,10.1,9.8,7.2,7.0                       <- [S], then one rate per column
 *   ...
 *
 * The corner cell names the two axes, rows first, separated by a backslash, each with an
 * optional unit in brackets or parentheses; a third part names the rate and its unit:
 * `substrate (uM) \ inhibitor (nM) \ rate (uM/min)`. Replicates are written either as repeated
 * [I] columns or as repeated blocks (of the same compound, or all untitled). Blank lines between
 * blocks are allowed and ignored. A new block starts at the next corner cell (or title row).
 *
 * Replicate labels: the n-th cell read at a given ([S], [I]) of a compound, in reading order
 * (left to right, top to bottom, block after block), is replicate "n"; excluded cells count too,
 * so labels do not shift when a cell is blank.
 *
 * rowsRead counts data cells: (number of [I] columns) x (number of data rows) in each block.
 */
import { InputError, type ConcentrationUnit, type Exclusion } from './types.js';
import { locate, quoteText, type Place } from './messages.js';
import { isBlankRow, type TextRow } from './tokenize.js';
import { splitHeaderName } from './header.js';
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

interface CornerCell {
  substrateUnit: string | null;
  inhibitorUnit: string | null;
  rateUnit: string | null;
}

/** Reads a corner cell (`substrate (uM) \ inhibitor (nM)` ...), or null if the cell is not one. */
export function readCornerCell(cell: string): CornerCell | null {
  const parts = cell.split('\\');
  if (parts.length < 2 || parts.length > 3) return null;
  const [s, i, r] = parts.map(splitHeaderName);
  if (s.key !== 'substrate' || i.key !== 'inhibitor') return null;
  if (r !== undefined && r.key !== 'rate') return null;
  return { substrateUnit: s.unit, inhibitorUnit: i.unit, rateUnit: r?.unit ?? null };
}

/** A title row: first cell `compound`, second cell the name, nothing else. */
export function readTitleRow(row: TextRow): string | null {
  if ((row.cells[0] ?? '').trim().toLowerCase() !== 'compound') return null;
  const name = (row.cells[1] ?? '').trim();
  if (name === '' || row.cells.slice(2).some((c) => c.trim() !== '')) return null;
  return name;
}

interface Block {
  title?: string;
  titleLine?: number;
  header: TextRow;
  corner: CornerCell;
  data: TextRow[];
}

function splitBlocks(rows: TextRow[], source: string): Block[] {
  const blocks: Block[] = [];
  let pendingTitle: { name: string; line: number } | undefined;
  for (const row of rows) {
    if (isBlankRow(row)) continue;
    const title = readTitleRow(row);
    if (title !== null) {
      if (pendingTitle) {
        throw new InputError(
          `${locate(source, { line: row.line, column: 1 })}a second compound title follows the one at line ${pendingTitle.line} with no block between; add the block or delete a title`,
          source, row.line, 1,
        );
      }
      pendingTitle = { name: title, line: row.line };
      continue;
    }
    const corner = readCornerCell(row.cells[0] ?? '');
    if (corner !== null) {
      blocks.push({ title: pendingTitle?.name, titleLine: pendingTitle?.line, header: row, corner, data: [] });
      pendingTitle = undefined;
      continue;
    }
    if (pendingTitle) {
      throw new InputError(
        `${locate(source, { line: row.line, column: 1 })}a compound title (line ${pendingTitle.line}) must be followed by a block header such as "substrate (uM) \\ inhibitor (nM)"; add it`,
        source, row.line, 1,
      );
    }
    const current = blocks[blocks.length - 1];
    if (!current) {
      throw new InputError(
        `${locate(source, { line: row.line, column: 1 })}matrix layout: the first block must start with a corner cell such as "substrate (uM) \\ inhibitor (nM)"; add it`,
        source, row.line, 1,
      );
    }
    current.data.push(row);
  }
  if (pendingTitle) {
    throw new InputError(
      `${locate(source, { line: pendingTitle.line, column: 1 })}compound title with no block below it; add the block or delete the title`,
      source, pendingTitle.line, 1,
    );
  }
  if (blocks.length === 0) {
    throw emptyFileError(source);
  }
  return blocks;
}

interface BlockUnits {
  substrate: ConcentrationUnit | null;
  inhibitor: ConcentrationUnit | null;
  rate: string | null;
}

function blockUnits(block: Block, source: string): BlockUnits {
  const place = { source, line: block.header.line, column: 1 };
  return {
    substrate: block.corner.substrateUnit === null ? null : parseConcentrationUnit(block.corner.substrateUnit, place),
    inhibitor: block.corner.inhibitorUnit === null ? null : parseConcentrationUnit(block.corner.inhibitorUnit, place),
    rate: block.corner.rateUnit,
  };
}

/** The [I] value of each column of a block header (null for an unused, unnamed column). */
function inhibitorColumns(block: Block, context: LayoutContext): (number | null)[] {
  const { source } = context;
  const values: (number | null)[] = [];
  const width = Math.max(block.header.cells.length, ...block.data.map((row) => row.cells.length));
  for (let index = 1; index < width; index++) {
    const cell = block.header.cells[index] ?? '';
    const place: Place = { line: block.header.line, column: index + 1 };
    const read = readNumberCell(cell, context.decimalMark);
    if (typeof read !== 'number' && read.kind === 'blank') {
      const used = block.data.find((row) => (row.cells[index] ?? '').trim() !== '');
      if (used) {
        const at = { line: used.line, column: index + 1 };
        throw new InputError(
          `${locate(source, at)}cell has no [I] value above it (the header at line ${block.header.line} is blank in column ${index + 1}); add the [I] value or delete the cell`,
          source, at.line, at.column,
        );
      }
      values.push(null);
      continue;
    }
    if (typeof read !== 'number') {
      throw new InputError(
        `${locate(source, place)}inhibitor value ${quoteText(cell.trim())} in the block header is not a finite number; the header row holds the [I] of each column after the corner cell`,
        source, place.line, place.column,
      );
    }
    if (read < 0) {
      throw new InputError(
        `${locate(source, place)}negative inhibitor concentration ${quoteText(cell.trim())}; concentrations cannot be below zero, correct the value`,
        source, place.line, place.column,
      );
    }
    values.push(read);
  }
  // trailing unused columns are not part of the block
  while (values.length > 0 && values[values.length - 1] === null) values.pop();
  return values;
}

/** A matrix cell's [S] (its row), [I] (its column header) and rate, as written; for exclusions. */
function cellAsWritten(row: TextRow, header: TextRow, index: number): Exclusion['asWritten'] {
  return { substrate: row.cells[0] ?? '', inhibitor: header.cells[index] ?? '', rate: row.cells[index] ?? '' };
}

export function readMatrixLayout(rows: TextRow[], context: LayoutContext): LayoutResult {
  const { source } = context;
  const blocks = splitBlocks(rows, source);
  const titled = blocks.filter((b) => b.title !== undefined);
  if (titled.length > 0 && titled.length < blocks.length) {
    const untitled = blocks.find((b) => b.title === undefined)!;
    throw new InputError(
      `${locate(source, { line: untitled.header.line, column: 1 })}this block has no compound title while others have one; add a "compound,<name>" line above it`,
      source, untitled.header.line, 1,
    );
  }
  const first = blocks[0];
  const units = blockUnits(first, source);
  const groups = new Map<string, CompoundRows>();
  const replicateCounts = new Map<string, Map<string, number>>();

  for (const block of blocks) {
    const these = blockUnits(block, source);
    for (const axis of ['substrate', 'inhibitor', 'rate'] as const) {
      if (these[axis] !== units[axis]) {
        throw new InputError(
          `${locate(source, { line: block.header.line, column: 1 })}this block gives ${axis} in ${these[axis] ?? 'no unit'} but the block at line ${first.header.line} in ${units[axis] ?? 'no unit'}; use one unit throughout`,
          source, block.header.line, 1,
        );
      }
    }
    const key = block.title ?? '';
    let group = groups.get(key);
    if (!group) {
      group = { compound: block.title, points: [], excluded: [], rowsRead: 0 };
      groups.set(key, group);
      replicateCounts.set(key, new Map());
    }
    const counts = replicateCounts.get(key)!;
    const columns = inhibitorColumns(block, context);

    for (const row of block.data) {
      const beyond = row.cells.findIndex((c, index) => index > columns.length && c.trim() !== '');
      if (beyond >= 0) {
        const at = { line: row.line, column: beyond + 1 };
        throw new InputError(
          `${locate(source, at)}cell lies beyond the last [I] column of the block header (line ${block.header.line}); add its [I] value to the header or delete the cell`,
          source, at.line, at.column,
        );
      }
      const substrate = readConcentrationCell(row.cells[0] ?? '', 'substrate', row.line, 1, context);
      columns.forEach((inhibitor, offset) => {
        if (inhibitor === null) return; // an unnamed column with no data anywhere
        const column = offset + 2;
        group!.rowsRead++;
        if (typeof substrate === 'string') {
          group!.excluded.push({ line: row.line, column, reason: `${substrate} (column 1)`, asWritten: cellAsWritten(row, block.header, offset + 1) });
          return;
        }
        const pairKey = `${substrate}|${inhibitor}`;
        const replicate = (counts.get(pairKey) ?? 0) + 1;
        counts.set(pairKey, replicate);
        if (substrate === 0) {
          group!.excluded.push({ line: row.line, column, reason: ZERO_SUBSTRATE_REASON, asWritten: cellAsWritten(row, block.header, offset + 1) });
          return;
        }
        const rate = readRateCell(row.cells[offset + 1] ?? '', 'rate', context);
        if (typeof rate === 'string') {
          group!.excluded.push({ line: row.line, column, reason: rate, asWritten: cellAsWritten(row, block.header, offset + 1) });
          return;
        }
        const point = { line: row.line, substrate, inhibitor, rate, replicate: String(replicate) };
        group!.points.push(block.title === undefined ? point : { ...point, compound: block.title });
      });
    }
  }
  return {
    groups: [...groups.values()],
    headerUnits: units,
    anchors: {
      substrate: { line: first.header.line, column: 1 },
      inhibitor: { line: first.header.line, column: 1 },
      rate: { line: first.header.line, column: 1 },
    },
    hasSdColumn: false,
  };
}
