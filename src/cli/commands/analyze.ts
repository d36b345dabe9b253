/** `mechanist analyze FILE`: one compound's table, fitted, ranked and summarised. */
import { Command } from 'commander';
import { basename, dirname, resolve } from 'node:path';
import { mkdirSync, statSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { decodeRateBytes, parseRateText, readRateFile, type ParseOptions } from '../../input/index.js';
import { analyzeTable } from '../../analysis/analyze-table.js';
import type { AnalysisResult } from '../../analysis/types.js';
import type { RateTable } from '../../input/types.js';
import { analysisJson } from '../../report/results-json.js';
import { textSummary } from '../../report/text-summary.js';
import { addSharedOptions, analysisOptionsFrom, parseOptionsFrom, type SharedCliOptions } from '../analysis-options.js';
import { UsageError } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { writeResultFiles } from '../write-results.js';
import { sha256Hex, type ReportProvenance } from '../../report/html/provenance.js';
import { uniqueFolderNames } from '../../batch/plan-compounds.js';
import { checkOutputFolder, checkReplaceableReportFolder } from '../../report/output-folder.js';
import { removeStaleTemporaries } from '../../report/write-atomic.js';

/**
 * From this many usable points on, `analyze` says on stderr (a terminal only) what it is doing
 * before the fits start: the time of an analysis grows with the points (docs/benchmarks.md,
 * bench/bigfile-bench.mjs), and a silent wait of minutes looks like a hang.
 */
export const LARGE_TABLE_POINTS = 100_000;

/** From this file size on (bytes), `analyze` says on a terminal that it is reading (seconds per 10 MB: README, "Big inputs"). */
export const LARGE_FILE_BYTES = 10_000_000;

function noteLargeFile(path: string, file: string, io: CliIo): void {
  try {
    const size = statSync(path).size;
    if (size >= LARGE_FILE_BYTES) io.err(`mechanist: note: reading ${file} (${(size / 1e6).toFixed(0)} MB)\n`);
  } catch {
    // the reader words the error
  }
}
import { addReadsOptions, readsSummaryLine, runReads, type ReadsCliOptions } from '../reads-input.js';

interface AnalyzeCliOptions extends SharedCliOptions, ReadsCliOptions {
  reads?: string[];
  json?: boolean;
  out?: string;
  compound?: string;
}

/** Picks the table(s) to analyse: the only one, the named compound, or all with --compound all. */
export function chooseTables(tables: RateTable[], compound: string | undefined, file: string): RateTable[] {
  if (tables.length === 1 && compound === undefined) return tables;
  const names = tables.map((t) => t.compound ?? '(unnamed)');
  if (compound === undefined)
    throw new UsageError(`${file} holds ${tables.length} compounds (${names.join(', ')}): choose one with --compound NAME, or use --compound all`);
  if (compound === 'all') return tables;
  const found = tables.filter((t) => t.compound === compound);
  if (found.length === 0) throw new UsageError(`${file} has no compound "${compound}"; it holds ${names.join(', ')}`);
  return found;
}

/**
 * The report folder of each table: `out` itself for one table; for several (--compound all), one
 * sub-folder per compound, named as batch names them (uniqueFolderNames: safe characters, long
 * names shortened with a hash, names that differ only by case or that would be "." or ".."
 * kept apart).
 */
export function outputFoldersFor(out: string, tables: readonly RateTable[]): string[] {
  if (tables.length === 1) return [resolve(out)];
  return uniqueFolderNames(tables.map((t) => t.compound ?? '(unnamed)')).map((name) => resolve(out, name));
}

/**
 * Checks, before the analysis, that the results can be written: the --out folder (or its parent)
 * exists and takes files, and each report folder is new, empty or an earlier report; clears the
 * temporary entries a killed run left beside them. Throws OutputError (exit 2).
 */
export function prepareReportFolders(out: string, shown: string, folders: readonly string[], createParents = false): void {
  const check = checkOutputFolder(out, shown, createParents);
  const single = folders.length === 1 && folders[0] === resolve(out);
  if (single) {
    checkReplaceableReportFolder(out, shown);
    removeStaleTemporaries(dirname(out), false, basename(out));
    return;
  }
  if (check.created) mkdirSync(out, { recursive: true });
  removeStaleTemporaries(out);
  for (const folder of folders) checkReplaceableReportFolder(folder, `${shown}/${basename(folder)}`);
}


/**
 * Reads the file's bytes once, for both the tables and the SHA-256 in the report footer. When the
 * bytes cannot be read, readRateFile is left to word the error (one line naming the file).
 */
async function readInputOnce(path: string, parse: ParseOptions): Promise<{ tables: RateTable[]; bytes: Uint8Array | null }> {
  let bytes: Uint8Array | null = null;
  try {
    bytes = await readFile(path);
  } catch {
    // reported below, in the input stage's own words
  }
  if (bytes === null) return { tables: await readRateFile(path, parse), bytes: null };
  return { tables: parseRateText(decodeRateBytes(bytes, path), { ...parse, source: path }), bytes };
}

/**
 * What the report footer records about this run: the SHA-256 of the input file's bytes, the command
 * and each option as given (defaults included, marked as such).
 */
export function analyzeProvenance(bytes: Uint8Array | null, file: string, cmd: Command): ReportProvenance {
  const options: Record<string, string> = {};
  for (const option of cmd.options) {
    const key = option.attributeName();
    const value: unknown = cmd.getOptionValue(key);
    if (value === undefined) continue;
    const source = cmd.getOptionValueSource(key);
    // a negatable option (--no-profile) holds true when it was not given
    const shown = typeof value === 'boolean' ? (value !== option.negate ? 'given' : 'not given') : String(value);
    options[option.long ?? option.flags] = `${shown}${source === 'default' ? ' (default)' : ''}`;
  }
  return { ...(bytes ? { inputSha256: sha256Hex(bytes) } : {}), command: file ? `mechanist analyze ${file}` : 'mechanist analyze', options };
}

export function analyzeCommand(io: CliIo): Command {
  const cmd = new Command('analyze')
    .description('fit the five mechanisms to one rate table and rank them')
    .argument('[file]', 'CSV or TSV rate table (or give --reads and --plate-map)')
    .option('--reads <files...>', 'kinetic plate reads instead of a rate table: initial rates are found first, as `mechanist rates` does')
    .option('--json', 'print one JSON document instead of the text summary')
    .option('--out <dir>', 'write results.json, parameters.csv and summary.txt into this folder')
    .option('--compound <name>', 'which compound of a multi-compound file ("all" for each)');
  addSharedOptions(cmd);
  addReadsOptions(cmd, false);
  cmd.action(async (fileArgument: string | undefined, o: AnalyzeCliOptions) => {
    const parse = parseOptionsFrom(o);
    const analysis = analysisOptionsFrom(o);
    const out = o.out ? resolve(io.cwd, o.out) : null;
    // an output folder that cannot take the results is found before any input is even read
    if (out !== null) checkOutputFolder(out, o.out);
    let input: { tables: RateTable[]; bytes: Uint8Array | null };
    let file: string;
    if (o.reads !== undefined) {
      if (fileArgument !== undefined) throw new UsageError('give a rate table or --reads, not both');
      const run = await runReads(o.reads, o, io.cwd);
      for (const note of run.notes) io.err(`mechanist: note: ${note}\n`);
      io.err(`mechanist: ${readsSummaryLine(run.result)}\n`);
      file = `rates from ${o.reads.join(', ')}`;
      // no input hash: the table is made here, from several files (each named in the options)
      input = { tables: parseRateText(run.text, { ...parse, source: file }), bytes: null };
    } else {
      if (fileArgument === undefined) throw new UsageError('analyze needs a rate table FILE, or --reads READS --plate-map MAP');
      if (o.plateMap !== undefined) throw new UsageError('option --plate-map: only used with --reads');
      file = fileArgument;
      const path = resolve(io.cwd, file);
      if (io.errIsTTY) noteLargeFile(path, file, io);
      input = await readInputOnce(path, parse);
    }
    const tables = chooseTables(input.tables, o.compound, file);
    const folders = out !== null ? outputFoldersFor(out, tables) : [];
    if (out !== null) prepareReportFolders(out, o.out ?? out, folders);
    const results: AnalysisResult[] = tables.map((t) => {
      if (io.errIsTTY && t.points.length >= LARGE_TABLE_POINTS)
        io.err(`mechanist: note: ${file}${t.compound !== undefined ? ` (${t.compound})` : ''}: ${t.points.length} usable points read; fitting five mechanisms to them can take minutes (README, "Big inputs")\n`);
      return analyzeTable({ ...t, source: file }, analysis);
    });
    if (out !== null) {
      const provenance = analyzeProvenance(input.bytes, o.reads !== undefined ? '' : file, cmd);
      results.forEach((r, k) => writeResultFiles(r, folders[k], provenance));
    }
    if (o.json) {
      const docs = results.map(analysisJson);
      io.out(JSON.stringify(docs.length === 1 ? docs[0] : docs, null, 2) + '\n');
    } else {
      io.out(results.map(textSummary).join('\n'));
    }
  });
  return cmd;
}
