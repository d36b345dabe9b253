/**
 * Well names on a microplate: one or two row letters then a column number (`A1`, `a01`, `AF48`).
 * Names are compared in the form letters upper-case, number without leading zeros (`A01` = `A1`).
 */

const WELL = /^([A-Za-z]{1,2})0*(\d{1,3})$/;

/** The canonical well name, or null when the text is not a well name. */
export function canonicalWell(text: string): string | null {
  const match = WELL.exec(text.trim());
  if (!match || match[2] === '' || Number(match[2]) === 0) return null;
  return `${match[1].toUpperCase()}${Number(match[2])}`;
}

/** `plate 2 / A1`, or `A1` on an unnamed plate. */
export function wellLabel(plate: string, well: string): string {
  return plate === '' ? well : `${plate}/${well}`;
}

/** `A1, A2, B7` (at most 12 shown, then "and N more"). */
export function listWells(labels: readonly string[]): string {
  const shown = labels.slice(0, 12).join(', ');
  return labels.length > 12 ? `${shown} and ${labels.length - 12} more` : shown;
}
