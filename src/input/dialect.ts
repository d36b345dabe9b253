/**
 * Detecting the separator and the decimal mark of a delimited text file.
 */
import type { TextRow } from './tokenize.js';
import { looksLikeDecimalComma, looksLikeDecimalPoint } from './numbers.js';

type Separator = ',' | '\t' | ';';

/**
 * The separator, read from the first non-blank line (outside quotes): a tab if it holds one,
 * else a semicolon if it holds one, else a comma. Headers rarely hold tabs or semicolons inside
 * names, while semicolon files often hold decimal commas, so the order matters.
 */
export function detectSeparator(text: string): Separator {
  const lines = text.split(/\r\n|\r|\n/, 50);
  const first = lines.find((l) => l.trim() !== '') ?? '';
  let inQuotes = false;
  let tabs = 0;
  let semicolons = 0;
  for (const c of first) {
    if (c === '"') inQuotes = !inQuotes;
    else if (!inQuotes && c === '\t') tabs++;
    else if (!inQuotes && c === ';') semicolons++;
  }
  if (tabs > 0) return '\t';
  if (semicolons > 0) return ';';
  return ',';
}

/**
 * The decimal mark. With comma separators it is the point. Otherwise the cells vote: numbers like
 * `0,25` for the comma, `0.25` for the point; the larger count wins (cells of the other kind are
 * then not numbers, and are excluded with that reason). With no vote, semicolon files take the
 * comma (the usual pairing in spreadsheet exports) and tab files the point.
 */
export function detectDecimalMark(rows: Iterable<TextRow>, separator: Separator): '.' | ',' {
  if (separator === ',') return '.';
  let commas = 0;
  let points = 0;
  for (const row of rows) {
    for (const cell of row.cells) {
      if (looksLikeDecimalComma(cell)) commas++;
      else if (looksLikeDecimalPoint(cell)) points++;
    }
  }
  if (commas > points) return ',';
  if (points > commas) return '.';
  return separator === ';' ? ',' : '.';
}
