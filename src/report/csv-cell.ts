/**
 * One CSV cell (RFC 4180): empty for null and non-finite numbers, yes/no for booleans, and text
 * quoted (inner quotes doubled) when it holds a comma, a quote or a line break.
 */
export type CsvValue = number | string | boolean | null | undefined;

export function csvCell(x: CsvValue): string {
  if (x === null || x === undefined) return '';
  if (typeof x === 'boolean') return x ? 'yes' : 'no';
  if (typeof x === 'number') return Number.isFinite(x) ? String(x) : '';
  return /[",\n\r]/.test(x) ? `"${x.replace(/"/g, '""')}"` : x;
}
