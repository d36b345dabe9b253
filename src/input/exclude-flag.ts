/**
 * The `exclude` column: a row is left out of the fit when its cell holds a "yes".
 *
 * Yes (case-insensitive): yes, y, true, t, 1, x, exclude, excluded, omit, omitted, drop, skip.
 * No: blank, no, n, false, f, 0, keep, include, included.
 * Anything else is an error, so that a typo never decides silently whether a row is fitted.
 */

const YES = new Set(['yes', 'y', 'true', 't', '1', 'x', 'exclude', 'excluded', 'omit', 'omitted', 'drop', 'skip']);
const NO = new Set(['', 'no', 'n', 'false', 'f', '0', 'keep', 'include', 'included']);

/** true (exclude the row), false (keep it), or null when the text is not understood. */
export function readExcludeFlag(cell: string): boolean | null {
  const text = cell.trim().toLowerCase();
  if (YES.has(text)) return true;
  if (NO.has(text)) return false;
  return null;
}

export const EXCLUDE_YES_WORDS = [...YES].join('/');
