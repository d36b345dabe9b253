/**
 * The input stage from text to tables: dialect, layout, rows, units, checks.
 */
import { InputError, type ConcentrationUnit, type InputWarning, type RateTable } from './types.js';
import type { ParseOptions } from './options.js';
import { locate, quoteText } from './messages.js';
import { refuseBinaryText } from './decode.js';
import { detectDecimalMark, detectSeparator } from './dialect.js';
import { textRows, tokenize } from './tokenize.js';
import { detectLayout } from './detect-layout.js';
import { readLongLayout } from './long-layout.js';
import { readMatrixLayout } from './matrix-layout.js';
import { parseConcentrationUnit } from './units.js';
import { convertUnits } from './convert-units.js';
import { checkNumericRange, checkUsableDesign, dataWarnings } from './table-checks.js';
import { emptyFileError, type CompoundRows, type LayoutResult } from './layout-result.js';

const SEPARATORS = [',', '\t', ';'] as const;

/**
 * Reads a rate table from text (a leading byte-order mark is dropped). Returns one RateTable per
 * compound, in order of first appearance; a file without compound names gives one table with
 * `compound` undefined. Throws InputError (one line, with file:line:column) for bad input.
 */
export function parseRateText(text: string, options: ParseOptions & { source: string }): RateTable[] {
  const source = options.source;
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  refuseBinaryText(body, source);
  if (body.trim() === '') {
    throw emptyFileError(source);
  }
  if (options.separator !== undefined && !SEPARATORS.includes(options.separator)) {
    throw new InputError(`${locate(source)}separator option ${quoteText(String(options.separator))} not supported; use ",", ";" or a tab`, source);
  }
  if (options.decimalMark !== undefined && options.decimalMark !== '.' && options.decimalMark !== ',') {
    throw new InputError(`${locate(source)}decimal mark option ${quoteText(String(options.decimalMark))} not supported; use "." or ","`, source);
  }
  if (options.layout !== undefined && options.layout !== 'long' && options.layout !== 'matrix') {
    throw new InputError(`${locate(source)}layout option ${quoteText(String(options.layout))} not supported; use long or matrix`, source);
  }

  const separator = options.separator ?? detectSeparator(body);
  // The rows are scanned as they are needed (a vote for the decimal mark, the first rows for the
  // layout, then the reading itself) rather than held all at once: docs/decisions/reader-memory.md.
  const rows = () => textRows(body, separator, source);
  const decimalMark = options.decimalMark ?? detectDecimalMark(rows(), separator);
  const layout = options.layout ?? detectLayout(rows());
  const context = { source, decimalMark };
  const read =
    layout === 'long'
      ? readLongLayout(textRows(body, separator, source, options.onReadProgress), context)
      : readMatrixLayout(tokenize(body, separator, source), context);

  const { units, warnings: unitWarnings } = resolveUnits(read, options, source);
  const detection = {
    layout: options.layout === undefined ? 'detected' : 'option',
    separator: options.separator === undefined ? 'detected' : 'option',
    decimalMark: options.decimalMark === undefined ? 'detected' : 'option',
  } as const;

  return read.groups.map((group) => {
    let table = buildTable(group, read, { source, layout, separator, decimalMark, units, detection });
    checkUsableDesign(table, read.anchors, options.requireMechanismDesign ?? true);
    if (options.outputUnits) table = convertUnits(table, options.outputUnits);
    checkNumericRange(table, read.anchors);
    table.warnings = [...unitWarnings, ...sdWarnings(group, read), ...dataWarnings(table)];
    return table;
  });
}

function buildTable(
  group: CompoundRows,
  read: LayoutResult,
  shared: Pick<RateTable, 'source' | 'layout' | 'separator' | 'decimalMark' | 'units' | 'detection'>,
): RateTable {
  const table: RateTable = {
    source: shared.source,
    points: group.points,
    rowsRead: group.rowsRead,
    excluded: group.excluded,
    warnings: [],
    layout: shared.layout,
    separator: shared.separator,
    decimalMark: shared.decimalMark,
    units: { ...shared.units },
    hasSd: read.hasSdColumn && group.points.length > 0 && group.points.every((p) => p.sd !== undefined),
    detection: shared.detection,
  };
  if (group.compound !== undefined) table.compound = group.compound;
  return table;
}

/** Units from the header, replaced by options where given; warnings for replaced or missing units. */
function resolveUnits(
  read: LayoutResult,
  options: ParseOptions,
  source: string,
): { units: RateTable['units']; warnings: InputWarning[] } {
  const warnings: InputWarning[] = [];
  const pick = (axis: 'substrate' | 'inhibitor', given: ConcentrationUnit | undefined): ConcentrationUnit | null => {
    const header = read.headerUnits[axis];
    if (given === undefined) {
      if (header === null) {
        warnings.push({
          code: 'unit-missing',
          message: `the ${axis} unit is not given; constants in ${axis} units will be printed without a unit; write it in the header, e.g. "${axis} (uM)"`,
        });
      }
      return header;
    }
    const unit = parseConcentrationUnit(given, { source });
    if (header !== null && header !== unit) {
      warnings.push({
        code: 'unit-overridden',
        message: `the header gives ${axis} in ${header} but the ${axis} unit option says ${unit}; the values are read as ${unit}`,
      });
    }
    return unit;
  };
  const substrate = pick('substrate', options.substrateUnit);
  const inhibitor = pick('inhibitor', options.inhibitorUnit);
  const rate = options.rateUnit ?? read.headerUnits.rate;
  return { units: { substrate, inhibitor, rate }, warnings };
}

/** A warning when the sd column is filled on some usable rows only. */
function sdWarnings(group: CompoundRows, read: LayoutResult): InputWarning[] {
  if (!read.hasSdColumn) return [];
  const missing = group.points.filter((p) => p.sd === undefined).map((p) => p.line);
  if (missing.length === 0 || missing.length === group.points.length) return [];
  return [{
    code: 'sd-incomplete',
    message: `the sd column is blank on ${missing.length} usable ${missing.length === 1 ? 'row' : 'rows'}; per-row sd weights need every sd, so choose another error model or fill them in`,
    lines: missing,
  }];
}
