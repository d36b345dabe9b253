/**
 * Kinetic plate reads, in either of two generic shapes (detected from the header):
 *
 * - long: one row per read, columns `well`, `time` and `signal` (and an optional `plate`);
 * - wide: a `time` column, then one column per well named like `A1`.
 *
 * The time unit comes from the header (`time (s)`, `time (min)`, `time (h)`); clock cells
 * (`1:30`, `0:01:30`) are read as minutes:seconds or hours:minutes:seconds and converted to it
 * (seconds when the header gives none). Separators, decimal marks, quoting and messages follow the
 * rate-table reader (src/input/), whose tokenizer and helpers are reused. A read that cannot be
 * used (blank or non-numeric signal, blank or negative time) is listed with its line, column and
 * reason; a column that is neither a well nor a known name is listed in the notes.
 */
import { readTextFile } from '../input/read-text-file.js';
import { InputError } from '../input/types.js';
import { locate, quoteText } from '../input/messages.js';
import { detectDecimalMark, detectSeparator } from '../input/dialect.js';
import { isBlankRow, tokenize, type TextRow } from '../input/tokenize.js';
import { splitHeaderName } from '../input/header.js';
import { readNumberCell } from '../input/numbers.js';
import type { KineticReads, ReadExclusion, TimeUnit, WellCurve } from './types.js';
import { canonicalWell, wellLabel } from './well-names.js';
import { clockSeconds, parseTimeUnit, SECONDS_PER } from './time-values.js';

interface ReadsOptions {
  /** plate name for reads without a plate column (default '') */
  plate?: string;
}


/** Reads and parses a kinetic-reads file; `source` names it in messages. */
export async function readKineticReadsFile(path: string, options: ReadsOptions & { source?: string } = {}): Promise<KineticReads> {
  const source = options.source ?? path;
  return parseKineticReads(await readTextFile(path, source), { ...options, source });
}

interface Header {
  row: TextRow;
  rows: TextRow[];
  decimalMark: '.' | ',';
  source: string;
}

/** Splits text into the header row and data rows, with the dialect detected. */
export function tokenizeTable(text: string, source: string, what: string): Header {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (body.trim() === '') throw new InputError(`${locate(source)}the file is empty; ${what}`, source);
  const separator = detectSeparator(body);
  const all = tokenize(body, separator, source).filter((r) => !isBlankRow(r));
  const decimalMark = detectDecimalMark(all, separator);
  return { row: all[0], rows: all.slice(1), decimalMark, source };
}

/** Parses kinetic reads from text (long or wide shape, detected). */
export function parseKineticReads(text: string, options: ReadsOptions & { source: string }): KineticReads {
  const header = tokenizeTable(text, options.source, 'expected kinetic reads: a header with time, then reads');
  const keys = header.row.cells.map((c) => splitHeaderName(c).key);
  const long = keys.includes('well') && keys.includes('signal');
  if (!keys.includes('time')) {
    throw new InputError(
      `${locate(options.source, { line: header.row.line })}no "time" column in the header; kinetic reads need "time (s)" or "time (min)", then "well,signal" (long) or one column per well (wide)`,
      options.source, header.row.line,
    );
  }
  if (header.rows.length === 0) {
    throw new InputError(`${locate(options.source, { line: header.row.line })}no reads below the header`, options.source, header.row.line);
  }
  return long ? readLong(header, options.plate ?? '') : readWide(header, options.plate ?? '');
}

function timeUnitOf(header: Header, index: number): { unit: TimeUnit; given: boolean } {
  const { unit } = splitHeaderName(header.row.cells[index]);
  if (unit === null) return { unit: 's', given: false };
  const parsed = parseTimeUnit(unit);
  if (parsed === null) {
    const place = { line: header.row.line, column: index + 1 };
    throw new InputError(
      `${locate(header.source, place)}unknown time unit ${quoteText(unit)}; use s, min or h, e.g. "time (s)"`,
      header.source, place.line, place.column,
    );
  }
  return { unit: parsed, given: true };
}

/** A time cell in the header's unit, or the reason it is not usable. */
function readTime(cell: string, unit: TimeUnit, decimalMark: '.' | ','): number | string {
  const clock = clockSeconds(cell);
  if (clock !== null) return clock / SECONDS_PER[unit];
  const value = readNumberCell(cell, decimalMark);
  if (typeof value !== 'number') {
    return value.kind === 'blank' ? 'time is blank' : value.kind === 'infinite' ? 'time is infinite' : `time ${quoteText(value.text)} is not a number`;
  }
  if (value < 0) return `time ${quoteText(cell.trim())} is negative; times count from the start of the reaction`;
  return value;
}

function readSignal(cell: string, decimalMark: '.' | ','): number | string {
  const value = readNumberCell(cell, decimalMark);
  if (typeof value === 'number') return value;
  return value.kind === 'blank' ? 'signal is blank' : value.kind === 'infinite' ? 'signal is infinite' : `signal ${quoteText(value.text)} is not a number (an overflow marker counts as no read)`;
}

class CurveBuilder {
  private readonly curves = new Map<string, WellCurve & { seen: Map<number, number> }>();
  constructor(private readonly source: string) {}

  add(plate: string, well: string, time: number, signal: number, line: number, column: number): void {
    const key = `${plate}\u0000${well}`;
    let curve = this.curves.get(key);
    if (!curve) {
      curve = { plate, well, times: [], signals: [], lines: [], seen: new Map() };
      this.curves.set(key, curve);
    }
    const earlier = curve.seen.get(time);
    if (earlier !== undefined) {
      throw new InputError(
        `${locate(this.source, { line, column })}well ${wellLabel(plate, well)} has a second read at the same time (also line ${earlier}); give each read its own time`,
        this.source, line, column,
      );
    }
    curve.seen.set(time, line);
    curve.times.push(time);
    curve.signals.push(signal);
    curve.lines.push(line);
  }

  build(): WellCurve[] {
    return [...this.curves.values()].map(({ plate, well, times, signals, lines }) => {
      const order = times.map((_, k) => k).sort((a, b) => times[a] - times[b]);
      return { plate, well, times: order.map((k) => times[k]), signals: order.map((k) => signals[k]), lines: order.map((k) => lines[k]) };
    });
  }
}

function readLong(header: Header, defaultPlate: string): KineticReads {
  const { source, decimalMark } = header;
  const index: Record<string, number> = {};
  const notes: string[] = [];
  header.row.cells.forEach((cell, k) => {
    const { key, name } = splitHeaderName(cell);
    if (key === '') return;
    if (index[key] !== undefined) {
      throw new InputError(`${locate(source, { line: header.row.line, column: k + 1 })}duplicate column name ${quoteText(name)}; rename one`, source, header.row.line, k + 1);
    }
    if (['well', 'time', 'signal', 'plate'].includes(key)) index[key] = k;
    else notes.push(`${locate(source, { line: header.row.line, column: k + 1 })}column ${quoteText(name)} is not used by the reads reader`);
  });
  const time = timeUnitOf(header, index.time);
  const signalUnit = splitHeaderName(header.row.cells[index.signal]).unit;
  const builder = new CurveBuilder(source);
  const excluded: ReadExclusion[] = [];
  for (const row of header.rows) {
    const cell = (k: number | undefined): string => (k === undefined ? '' : (row.cells[k] ?? ''));
    const wellText = cell(index.well);
    const well = canonicalWell(wellText);
    if (well === null) {
      throw new InputError(
        `${locate(source, { line: row.line, column: index.well + 1 })}${quoteText(wellText.trim())} is not a well name; write a row letter and a column number, e.g. A1`,
        source, row.line, index.well + 1,
      );
    }
    const plate = index.plate === undefined ? defaultPlate : cell(index.plate).trim();
    const t = readTime(cell(index.time), time.unit, decimalMark);
    if (typeof t === 'string') {
      excluded.push({ line: row.line, column: index.time + 1, plate, well, reason: t });
      continue;
    }
    const s = readSignal(cell(index.signal), decimalMark);
    if (typeof s === 'string') {
      excluded.push({ line: row.line, column: index.signal + 1, plate, well, reason: s });
      continue;
    }
    builder.add(plate, well, t, s, row.line, index.time + 1);
  }
  if (!time.given) notes.push(`${locate(source, { line: header.row.line, column: index.time + 1 })}the time unit is not given; read as seconds (write "time (s)" or "time (min)")`);
  return { source, layout: 'long', timeUnit: time.unit, signalUnit, curves: builder.build(), excluded, notes };
}

function readWide(header: Header, plate: string): KineticReads {
  const { source, decimalMark } = header;
  const notes: string[] = [];
  let timeIndex = -1;
  const wells: { index: number; well: string }[] = [];
  const seen = new Map<string, number>();
  header.row.cells.forEach((cell, k) => {
    const { key, name } = splitHeaderName(cell);
    if (key === '') return;
    if (key === 'time') {
      timeIndex = k;
      return;
    }
    const well = canonicalWell(name);
    if (well === null) {
      notes.push(`${locate(source, { line: header.row.line, column: k + 1 })}column ${quoteText(name)} is not a well name and is not used`);
      return;
    }
    const earlier = seen.get(well);
    if (earlier !== undefined) {
      throw new InputError(`${locate(source, { line: header.row.line, column: k + 1 })}well ${well} has two columns (also column ${earlier}); keep one`, source, header.row.line, k + 1);
    }
    seen.set(well, k + 1);
    wells.push({ index: k, well });
  });
  if (wells.length === 0) {
    throw new InputError(`${locate(source, { line: header.row.line })}no well columns in the header; name them like A1, B12`, source, header.row.line);
  }
  const time = timeUnitOf(header, timeIndex);
  const builder = new CurveBuilder(source);
  const excluded: ReadExclusion[] = [];
  for (const row of header.rows) {
    const t = readTime(row.cells[timeIndex] ?? '', time.unit, decimalMark);
    if (typeof t === 'string') {
      for (const { well } of wells) excluded.push({ line: row.line, column: timeIndex + 1, plate, well, reason: t });
      continue;
    }
    for (const { index, well } of wells) {
      const s = readSignal(row.cells[index] ?? '', decimalMark);
      if (typeof s === 'string') excluded.push({ line: row.line, column: index + 1, plate, well, reason: s });
      else builder.add(plate, well, t, s, row.line, timeIndex + 1);
    }
  }
  if (!time.given) notes.push(`${locate(source, { line: header.row.line, column: timeIndex + 1 })}the time unit is not given; read as seconds (write "time (s)" or "time (min)")`);
  return { source, layout: 'wide', timeUnit: time.unit, signalUnit: null, curves: builder.build(), excluded, notes };
}
