/**
 * Small helpers that keep every input message on one plain line: a `file:line:column: ` prefix,
 * user text quoted safely, and numbers written without float noise.
 */

/** Where a finding sits: 1-based line and (field) column; either may be unknown. */
export interface Place {
  line?: number;
  column?: number;
}

/** `rates.csv:4:2: ` (or `rates.csv:4: `, or `rates.csv: `) for the start of a message. */
export function locate(source: string, place: Place = {}): string {
  let at = source;
  if (place.line !== undefined) {
    at += `:${place.line}`;
    if (place.column !== undefined) at += `:${place.column}`;
  }
  return `${at}: `;
}

const LONGEST_QUOTE = 40;

/**
 * User text in double quotes, cut to 40 characters, control characters shown as `\uXXXX`.
 * Text that reads like a JavaScript missing value ("NaN", "undefined") is described instead of
 * quoted, so that no message ever shows those words (a rule of the project).
 */
export function quoteText(text: string): string {
  if (/NaN|undefined/.test(text)) return 'a missing-value marker';
  let shown = text.length > LONGEST_QUOTE ? `${text.slice(0, LONGEST_QUOTE)}...` : text;
  shown = shown.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
  return `"${shown}"`;
}

/** A finite number with at most 4 significant digits, e.g. 0.0125, 1.5e-7, 2500. */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return value > 0 ? 'infinity' : value < 0 ? 'minus infinity' : 'not a number';
  return String(Number(value.toPrecision(4)));
}

/** `10 nM`, or `10` when the unit is not known. */
export function formatConcentration(value: number, unit: string | null): string {
  return unit ? `${formatNumber(value)} ${unit}` : formatNumber(value);
}

/** `lines 4, 9, 12` (at most 6 listed, then `and 3 more`). */
export function listLines(lines: number[]): string {
  const shown = lines.slice(0, 6).join(', ');
  const more = lines.length > 6 ? ` and ${lines.length - 6} more` : '';
  return `${lines.length === 1 ? 'line' : 'lines'} ${shown}${more}`;
}

/** Names quoted as given, at most `shown` of them, then `and N more`: "A, B, C and 1497 more". */
export function listNames(names: readonly string[], shown = 5): string {
  if (names.length <= shown) return names.join(', ');
  return `${names.slice(0, shown).join(', ')} and ${names.length - shown} more`;
}
