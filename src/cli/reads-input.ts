/**
 * The options that take kinetic reads to a rate table, shared by `rates`, `analyze` and `batch`:
 * reads files, a plate map, the conversion and the window choice. Reads the files, runs the reads
 * stage and returns the rate table text with the notes to print.
 */
import { existsSync, statSync } from 'node:fs';
import { basename, extname, resolve } from 'node:path';
import { InputError } from '../input/types.js';
import {
  parseConversionFactor,
  rateTableText,
  ratesFromReads,
  readKineticReadsFile,
  readPlateMapFile,
  readStandardCurve,
  standardCurveConversion,
  wellsWithoutCompound,
  type PlateRates,
  type RatesOptions,
} from '../reads/index.js';
import { UsageError } from './exit-codes.js';
import type { ReadsCliOptions } from './reads-options.js';
export type { ReadsCliOptions } from './reads-options.js';
import { numberOption, positiveNumber } from './parse-option-values.js';

interface ReadsRun {
  result: PlateRates;
  text: string;
  /** lines for stderr: notes, excluded reads, wells without a compound */
  notes: string[];
}

/** Reads every file, runs the reads stage, renders the rate table. Paths are relative to `cwd`. */
export async function runReads(readsPaths: string[], o: ReadsCliOptions, cwd: string): Promise<ReadsRun> {
  if (!o.plateMap) throw new UsageError('kinetic reads need a plate map: give --plate-map FILE');
  const several = readsPaths.length > 1;
  const reads = [];
  for (const path of readsPaths) {
    const plate = several ? basename(path, extname(path)) : '';
    reads.push(await readKineticReadsFile(resolve(cwd, path), { source: path, plate }));
  }
  const map = await readPlateMapFile(resolve(cwd, o.plateMap), o.plateMap);
  const options: RatesOptions = {};
  if (o.conversion !== undefined) {
    const path = resolve(cwd, o.conversion);
    if (existsSync(path) && statSync(path).isFile()) {
      if (o.pathLength !== undefined) throw new UsageError('option --path-length: not used with a standard-curve file');
      const fit = await readStandardCurve(path);
      options.conversion = standardCurveConversion(fit, o.conversion);
    } else {
      const pathLength = o.pathLength === undefined ? undefined : positiveNumber('--path-length', o.pathLength);
      try {
        options.conversion = parseConversionFactor(o.conversion, pathLength);
      } catch (e) {
        if (e instanceof InputError) throw new UsageError(e.message);
        throw e;
      }
    }
  } else if (o.pathLength !== undefined) {
    throw new UsageError('option --path-length: give --conversion with an extinction coefficient per cm too');
  }
  if (o.ceiling !== undefined) options.ceiling = numberOption('--ceiling', o.ceiling);
  if (o.rateFrom !== undefined) {
    if (o.rateFrom !== 'window' && o.rateFrom !== 'integrated') throw new UsageError(`option --rate-from: "${o.rateFrom}" is not window or integrated`);
    options.rateFrom = o.rateFrom;
  }
  if (o.depletionCorrection === false) options.depletionCorrection = false;
  const result = ratesFromReads(reads, map, options);
  const notes = [...result.notes];
  if (result.conversion) notes.push(`conversion: ${result.conversion.description}`);
  for (const e of result.excludedReads) notes.push(`${e.source}:${e.line}${e.column ? `:${e.column}` : ''}: read of well ${e.plate ? `${e.plate}/` : ''}${e.well} left out: ${e.reason}`);
  const orphans = wellsWithoutCompound(result);
  if (orphans.length > 0) notes.push(`wells without a compound (excluded in the plate map) are not in the rate table: ${orphans.join(', ')}`);
  return { result, text: rateTableText(result), notes };
}

/** One line: how many wells gave a rate, how many were flagged and why. */
export function readsSummaryLine(result: PlateRates): string {
  const rated = result.wells.filter((w) => w.rate !== null).length;
  const left = result.wells.filter((w) => w.excludeReason !== null);
  const counts = new Map<string, number>();
  for (const w of left) for (const f of w.flags) counts.set(f.code, (counts.get(f.code) ?? 0) + 1);
  const inMap = result.wells.filter((w) => w.role === 'exclude').length;
  const why = [...counts].map(([code, n]) => `${code} ${n}`).concat(inMap > 0 ? [`excluded in the map ${inMap}`] : []);
  return `${result.wells.length} wells read: ${rated} with a rate, ${left.length} marked excluded${why.length ? ` (${why.join(', ')})` : ''}; ${result.blanks.length} blank wells; rates in ${result.units.rate}, from the ${result.rateFrom === 'integrated' ? 'integrated Michaelis-Menten fit where valid' : 'straight early window'}`;
}
