/**
 * One CSV cell (RFC 4180): empty for null and non-finite numbers, yes/no for booleans, and text
 * quoted (inner quotes doubled) when it holds a comma, a quote or a line break.
 *
 * Text that a spreadsheet would run as a formula is neutralised (OWASP, "CSV Injection"): a text
 * cell that starts with `=`, `+`, `-`, `@`, a tab or a carriage return gets a leading apostrophe,
 * which spreadsheets read as "this is text". Numbers are never touched, so a negative rate or
 * estimate stays a number the spreadsheet can compute with; text that is a plain decimal number
 * (a compound named "-5") is left as it is too, since a number is not a formula
 * (docs/decisions/csv-formula-cells.md).
 */
type CsvValue = number | string | boolean | null | undefined;

/** First characters that make a spreadsheet read a cell as a formula (OWASP list). */
const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** The text with a leading apostrophe when a spreadsheet would otherwise run it as a formula. */
export function neutraliseFormula(text: string): string {
  return FORMULA_START.test(text) && !PLAIN_NUMBER.test(text) ? `'${text}` : text;
}

export function csvCell(x: CsvValue): string {
  if (x === null || x === undefined) return '';
  if (typeof x === 'boolean') return x ? 'yes' : 'no';
  if (typeof x === 'number') return Number.isFinite(x) ? String(x) : '';
  const text = neutraliseFormula(x);
  return /[",\n\r]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
