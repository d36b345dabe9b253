/**
 * Why a table has too few usable points: the commonest exclusion reasons, each with how many
 * rows it hit, the first place (line, column) and the cell as written, and the setting that would
 * fix it when there is one (a decimal comma read in a decimal-point file, thousands separators,
 * a separator inside values...). Used by the "too few usable points" error (table-checks.ts).
 */
import type { Exclusion, RateTable } from './types.js';
import { ZERO_SUBSTRATE_REASON } from './layout-result.js';

/** How many reasons the message lists at most. */
const REASONS_SHOWN = 3;

const QUOTED = /"([^"]*)"/;
const THOUSANDS_WITH_COMMAS = /^[+-]?\d{1,3}(,\d{3})+(\.\d+)?$/;
const THOUSANDS_WITH_POINTS = /^[+-]?\d{1,3}(\.\d{3})+(,\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d*,\d+([eE][+-]?\d+)?$/;
const DECIMAL_POINT = /^[+-]?\d*\.\d+([eE][+-]?\d+)?$/;

interface ReasonGroup {
  key: string;
  count: number;
  first: Exclusion;
}

/** The reason with its quoted value blanked, so that rows failing the same way group together. */
function reasonKey(reason: string): string {
  return reason.replace(/"[^"]*"/g, '""').replace(/\d+ cells/, 'N cells');
}

/** The setting or correction that removes this kind of exclusion, or '' when none is known. */
function fixFor(reason: string, table: Pick<RateTable, 'decimalMark' | 'separator'>): string {
  const cell = QUOTED.exec(reason)?.[1] ?? '';
  if (/ is not a number/.test(reason)) {
    if (table.decimalMark === '.' && THOUSANDS_WITH_COMMAS.test(cell))
      return 'if the comma is a decimal mark, read the file with --decimal-mark comma (decimalMark: \',\'); if it groups thousands, remove the thousands separators';
    if (table.decimalMark === '.' && DECIMAL_COMMA.test(cell)) return 'read the file with --decimal-mark comma (decimalMark: \',\')';
    if (table.decimalMark === ',' && THOUSANDS_WITH_POINTS.test(cell)) return 'remove the thousands separators (a number is plain decimal notation)';
    if (table.decimalMark === ',' && DECIMAL_POINT.test(cell)) return 'read the file with --decimal-mark point (decimalMark: \'.\')';
    if (/^[+-]?[\d.,]+\s*[%a-zA-Zµ]/.test(cell)) return 'write plain numbers: units and percent signs belong in the header, not in the cells';
    return 'write numbers in these cells, or leave them blank';
  }
  if (reason === ZERO_SUBSTRATE_REASON) return 'rows at [S] = 0 are blanks; if [S] is in another column, name that column "substrate"';
  if (/ is blank$/.test(reason)) return 'fill in the blank cells';
  if (/cells but the header has/.test(reason)) return `check the separator (the file is read as ${separatorName(table.separator)}; set it with --separator), or quote values that hold it`;
  if (/^flagged in the exclude column/.test(reason)) return 'these rows are flagged in the exclude column';
  return '';
}

function separatorName(separator: string): string {
  return separator === '\t' ? 'tab-separated' : separator === ';' ? 'semicolon-separated' : 'comma-separated';
}

/** Exclusions grouped by reason, the commonest first (ties: the one met first in the file). */
export function groupExclusions(excluded: readonly Exclusion[]): ReasonGroup[] {
  const groups = new Map<string, ReasonGroup>();
  for (const e of excluded) {
    const key = reasonKey(e.reason);
    const group = groups.get(key);
    if (group) group.count += 1;
    else groups.set(key, { key, count: 1, first: e });
  }
  return [...groups.values()].sort((a, b) => b.count - a.count || a.first.line - b.first.line);
}

/**
 * One clause for the error message, e.g. `excluded because: 6 rows, first line 2 column 1:
 * substrate "1,5" is not a number (...); fix: read the file with --decimal-mark comma ...`.
 * Empty when nothing was excluded.
 */
export function exclusionReasonsClause(table: Pick<RateTable, 'excluded' | 'decimalMark' | 'separator'>): string {
  const groups = groupExclusions(table.excluded);
  if (groups.length === 0) return '';
  const parts = groups.slice(0, REASONS_SHOWN).map((g) => {
    const where = `line ${g.first.line}${g.first.column !== undefined ? ` column ${g.first.column}` : ''}`;
    const fix = fixFor(g.first.reason, table);
    const count = `${g.count} ${g.count === 1 ? 'row' : 'rows'}${g.count > 1 ? `, first at ${where}` : ` at ${where}`}`;
    return `${count}: ${g.first.reason}${fix ? ` (fix: ${fix})` : ''}`;
  });
  const more = groups.length > REASONS_SHOWN ? `; and ${groups.length - REASONS_SHOWN} other reasons (listed with --json or in the report)` : '';
  return `; excluded because: ${parts.join('; ')}${more}`;
}
