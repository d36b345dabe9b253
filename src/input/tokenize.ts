/**
 * Splits delimited text (CSV, TSV, semicolon-separated) into rows of cells.
 *
 * Hand-written rather than csv-parse: every message must name the line and column (field number)
 * of a cell, including lines after a quoted field that spans several lines, and blank lines must
 * stay visible (the matrix layout uses them between blocks). A single pass that counts lines
 * itself gives both exactly, in about 100 lines with no options to get wrong.
 *
 * Rules: fields are separated by one separator character; a field that starts with `"` (after
 * optional spaces) is quoted, may contain separators and line breaks, and writes a quote as `""`;
 * after the closing quote only spaces may follow before the separator. Line breaks are LF, CRLF
 * or a lone CR. A quote inside an unquoted field is kept as text.
 */
import { InputError } from './types.js';
import { locate } from './messages.js';

/** One row of cells; `line` is the 1-based line where the row starts. */
export interface TextRow {
  line: number;
  cells: string[];
}

const QUOTE = 34; // "
const LF = 10;
const CR = 13;
const SPACE = 32;
const TAB = 9;

/** Every row of `text`, in order. */
export function tokenize(text: string, separator: string, source: string): TextRow[] {
  return Array.from(textRows(text, separator, source));
}

/**
 * The rows of `text` one at a time, so a reader can use each row and let it go (a long table is
 * never held as rows of cells all at once; docs/decisions/reader-memory.md). A problem is thrown
 * when the scan reaches it.
 */
export function* textRows(
  text: string,
  separator: string,
  source: string,
  onPosition?: (done: number, total: number) => void,
): Generator<TextRow, void, undefined> {
  const sep = separator.charCodeAt(0);
  const n = text.length;
  let line = 1;
  let i = 0;
  let cells: string[] = [];
  let rowLine = 1;
  let rowsSinceReport = 0;

  while (i <= n) {
    // at the start of a field
    let j = i;
    while (j < n && (text.charCodeAt(j) === SPACE || (text.charCodeAt(j) === TAB && sep !== TAB))) j++;
    if (j < n && text.charCodeAt(j) === QUOTE) {
      const openLine = line;
      const openColumn = cells.length + 1;
      let value = '';
      let k = j + 1;
      let closed = false;
      while (k < n) {
        const c = text.charCodeAt(k);
        if (c === QUOTE) {
          if (k + 1 < n && text.charCodeAt(k + 1) === QUOTE) {
            value += '"';
            k += 2;
            continue;
          }
          closed = true;
          k++;
          break;
        }
        if (c === CR || c === LF) {
          line++;
          value += '\n';
          k += c === CR && k + 1 < n && text.charCodeAt(k + 1) === LF ? 2 : 1;
          continue;
        }
        // copy a run of ordinary characters at once
        let m = k + 1;
        while (m < n) {
          const d = text.charCodeAt(m);
          if (d === QUOTE || d === CR || d === LF) break;
          m++;
        }
        value += text.slice(k, m);
        k = m;
      }
      if (!closed) {
        throw new InputError(
          `${locate(source, { line: openLine, column: openColumn })}quoted cell is never closed; add the closing quote (")`,
          source, openLine, openColumn,
        );
      }
      while (k < n && (text.charCodeAt(k) === SPACE || text.charCodeAt(k) === TAB) && text.charCodeAt(k) !== sep) k++;
      cells.push(value);
      if (k >= n) {
        yield { line: rowLine, cells };
        break;
      }
      const after = text.charCodeAt(k);
      if (after === sep) {
        i = k + 1;
        continue;
      }
      if (after === CR || after === LF) {
        yield { line: rowLine, cells };
        cells = [];
        line++;
        i = k + (after === CR && k + 1 < n && text.charCodeAt(k + 1) === LF ? 2 : 1);
        rowLine = line;
        if (i >= n) break;
        continue;
      }
      throw new InputError(
        `${locate(source, { line, column: cells.length })}text after the closing quote of a quoted cell; put the whole cell inside the quotes`,
        source, line, cells.length,
      );
    }
    // unquoted field: up to the next separator or line break
    let k = i;
    while (k < n) {
      const c = text.charCodeAt(k);
      if (c === sep || c === CR || c === LF) break;
      k++;
    }
    cells.push(text.slice(i, k));
    if (k >= n) {
      yield { line: rowLine, cells };
      break;
    }
    const c = text.charCodeAt(k);
    if (c === sep) {
      i = k + 1;
      continue;
    }
    yield { line: rowLine, cells };
    cells = [];
    line++;
    i = k + (c === CR && k + 1 < n && text.charCodeAt(k + 1) === LF ? 2 : 1);
    rowLine = line;
    if (onPosition && ++rowsSinceReport === ROWS_PER_REPORT) {
      rowsSinceReport = 0;
      onPosition(i, n);
    }
    if (i >= n) break;
  }
  onPosition?.(n, n);
}

/** Rows between two position reports of textRows. */
const ROWS_PER_REPORT = 1024;

/** True when every cell of the row is empty or whitespace. */
export function isBlankRow(row: TextRow): boolean {
  return row.cells.every((cell) => cell.trim() === '');
}
