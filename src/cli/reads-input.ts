/**
 * The options that take kinetic reads to a rate table, shared by `rates`, `analyze` and `batch`:
 * reads files, a plate map, the conversion and the window choice. Reads the files, runs the reads
 * stage and returns the rate table text with the notes to print.
 */
import type { Command } from 'commander';
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
import { numberOption, positiveNumber } from './parse-option-values.js';

export interface ReadsCliOptions {
  plateMap?: string;
  conversion?: string;
  pathLength?: string;
  ceiling?: string;
  rateFrom?: string;
  depletionCorrection?: boolean;
}

/** Adds --plate-map, --conversion, --path-length, --ceiling and --rate-from. */
export function addReadsOptions(cmd: Command, mapRequired: boolean): Command {
  const map = '--plate-map <file>';
  const mapHelp = 'plate map CSV: well,compound,substrate (unit),inhibitor (unit)[,role][,plate]';
  (mapRequired ? cmd.requiredOption(map, mapHelp) : cmd.option(map, `${mapHelp} (with --reads)`));
  return cmd
    .option('--conversion <factor|file>', 'signal per product concentration (6.22/mM; 6220/M/cm with --path-length) or a standard-curve CSV (concentration (unit),signal)')
    .option('--path-length <cm>', 'optical path length in cm, for a conversion per cm (Beer-Lambert law)')
    .option('--ceiling <signal>', 'detector ceiling: reads at or above it are saturated (default: the plate top value, when repeated)')
    .option('--no-depletion-correction', 'report the window slope as it is, without correcting it for the substrate used in the window')
    .option('--rate-from <method>', 'window (straight early window, default) | integrated (v0 of the integrated Michaelis-Menten fit where valid)', 'window');
}

export interface ReadsRun {
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
