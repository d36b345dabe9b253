/** The work of `mechanist analyze FILE` (loaded when the command runs; options in analyze.ts). */
import type { Command } from 'commander';
import { basename, dirname, join, resolve } from 'node:path';
import { mkdirSync, statSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { decodeRateBytes, parseRateText, readRateFile, type ParseOptions } from '../../input/index.js';
import { cliProgressBar, megabytesRead, type ProgressBar } from '../progress-bar.js';
import { analyzeTable } from '../../analysis/analyze-table.js';
import type { AnalysisResult } from '../../analysis/types.js';
import type { RateTable } from '../../input/types.js';
import { analysisJson } from '../../report/results-json.js';
import { textSummary } from '../../report/text-summary.js';
import { analysisOptionsFrom, atSubstrateFor, atSubstrateOption, parseOptionsFrom, type SharedCliOptions } from '../analysis-options.js';
import { UsageError } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import type { ReportProvenance } from '../../report/html/provenance.js';
import { sha256Hex } from '../../input/file-hash.js';
import { listNames } from '../../input/messages.js';
import { analyzeSingleSubstrate, isSingleSubstrateTable, type SingleSubstrateResult } from '../../analysis/single-substrate.js';
import { doseResponseFiles, doseResponseJson, doseResponseText } from '../../report/dose-response-output.js';
import { writeFileAtomic } from '../../report/write-atomic.js';
import { concentrationOption } from '../parse-option-values.js';
import { uniqueFolderNames } from '../../batch/plan-compounds.js';
import { checkOutputFolder, checkReplaceableReportFolder } from '../../report/output-folder.js';
import { removeStaleTemporaries } from '../../report/write-atomic.js';
import { readsSummaryLine, runReads, type ReadsCliOptions } from '../reads-input.js';

export interface AnalyzeCliOptions extends SharedCliOptions, ReadsCliOptions {
  reads?: string[];
  json?: boolean;
  out?: string;
  compound?: string;
  km?: string;
}

/** Writes results.json and summary.txt of a one-[S] analysis (no figures yet for this design). */
function writeDoseResponseFiles(result: SingleSubstrateResult, dir: string): void {
  mkdirSync(dir, { recursive: true });
  for (const [name, content] of doseResponseFiles(result)) writeFileAtomic(join(dir, name), content);
}

/**
 * From this many usable points on, `analyze` says on stderr (a terminal only) what it is doing
 * before the fits start: the time of an analysis and the size of its report grow with the points
 * (README, "Big inputs"; bench/bigfile-bench.mjs), and a silent wait looks like a hang.
 */
const LARGE_TABLE_POINTS = 100_000;

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


/** Picks the table(s) to analyse: the only one, the named compound, or all with --compound all. */
export function chooseTables(tables: RateTable[], compound: string | undefined, file: string): RateTable[] {
  if (tables.length === 1 && compound === undefined) return tables;
  const names = tables.map((t) => t.compound ?? '(unnamed)');
  if (compound === undefined)
    throw new UsageError(`${file} holds ${tables.length} compounds (${listNames(names)}): choose one with --compound NAME, or use --compound all`);
  if (compound === 'all') return tables;
  const found = tables.filter((t) => t.compound === compound);
  if (found.length === 0) throw new UsageError(`${file} has no compound "${compound}"; it holds ${listNames(names)}`);
  return found;
}

/**
 * The report folder of each table: `out` itself for one table; for several (--compound all), one
 * sub-folder per compound, named as batch names them (uniqueFolderNames: safe characters, long
 * names shortened with a hash, names that differ only by case or that would be "." or ".."
 * kept apart).
 */
function outputFoldersFor(out: string, tables: readonly RateTable[]): string[] {
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
async function readInputOnce(path: string, parse: ParseOptions, bar: ProgressBar | null): Promise<{ tables: RateTable[]; bytes: Uint8Array | null }> {
  let bytes: Uint8Array | null = null;
  try {
    bytes = await readFile(path);
  } catch {
    // reported below, in the input stage's own words
  }
  if (bytes === null) return { tables: await readRateFile(path, parse), bytes: null };
  const size = bytes.length;
  // the bar counts bytes; the reader reports characters of text, about one byte each
  const onReadProgress = bar ? (done: number, total: number) => bar.update(Math.round((done / total) * size), size) : undefined;
  try {
    return { tables: parseRateText(decodeRateBytes(bytes, path), { ...parse, source: path, ...(onReadProgress ? { onReadProgress } : {}) }), bytes };
  } finally {
    bar?.finish();
  }
}

/**
 * What the report footer records about this run: the SHA-256 of the input file's bytes, the command
 * and each option as given (defaults included, marked as such).
 */
function analyzeProvenance(bytes: Uint8Array | null, file: string, cmd: Command): ReportProvenance {
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

/** Reads, analyses and writes/prints one file's tables, as `mechanist analyze` does. */
export async function runAnalyze(io: CliIo, cmd: Command, fileArgument: string | undefined, o: AnalyzeCliOptions): Promise<void> {
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
    input = await readInputOnce(path, parse, o.json ? null : cliProgressBar(io, 'reading', megabytesRead));
  }
  const tables = chooseTables(input.tables, o.compound, file);
  const at = atSubstrateOption(o);
  const km = o.km === undefined ? undefined : concentrationOption('--km', o.km);
  const folders = out !== null ? outputFoldersFor(out, tables) : [];
  if (out !== null) prepareReportFolders(out, o.out ?? out, folders);
  // One [S] level: an IC50 curve, fitted as a dose-response (src/analysis/single-substrate.ts)
  const single = tables.filter(isSingleSubstrateTable);
  if (single.length > 0) {
    if (single.length !== tables.length)
      throw new UsageError(`${file}: some compounds have one [S] level and some several; analyse them one at a time with --compound NAME`);
    const doseResults = single.map((t) => {
      const table = { ...t, source: file };
      return analyzeSingleSubstrate(table, { level: analysis.level ?? 0.95, ...(km !== undefined ? { km: atSubstrateFor(km, table, '--km') } : {}) });
    });
    if (out !== null) doseResults.forEach((r, k) => writeDoseResponseFiles(r, folders[k]));
    if (o.json) {
      const docs = doseResults.map(doseResponseJson);
      io.out(JSON.stringify(docs.length === 1 ? docs[0] : docs, null, 2) + '\n');
    } else io.out(doseResults.map(doseResponseText).join('\n'));
    return;
  }
  // several compounds: a bar over them (one compound's stages are not counted)
  const compoundBar = !o.json && tables.length > 1 ? cliProgressBar(io, 'analysing', (done, total) => `(${done}/${total} compounds)`) : null;
  compoundBar?.update(0, tables.length);
  const results: AnalysisResult[] = tables.map((t, k) => {
    if (io.errIsTTY && t.points.length >= LARGE_TABLE_POINTS) {
      compoundBar?.finish();
      io.err(`mechanist: note: ${file}${t.compound !== undefined ? ` (${t.compound})` : ''}: ${t.points.length} usable points read; the analysis takes seconds per 100,000 points, and the report's figures draw every point, so --out grows large (README, "Big inputs")\n`);
    }
    const table = { ...t, source: file };
    const result = analyzeTable(table, at === undefined ? analysis : { ...analysis, atSubstrate: atSubstrateFor(at, table) });
    compoundBar?.update(k + 1, tables.length);
    return result;
  });
  compoundBar?.finish();
  if (out !== null) {
    const provenance = analyzeProvenance(input.bytes, o.reads !== undefined ? '' : file, cmd);
    // The figure code (d3, the figures and the report page) is loaded only here, when figures are
    // drawn: --help, --json and the text summary never pay for loading it.
    const { writeResultFiles } = await import('../../report/write-results.js');
    results.forEach((r, k) => writeResultFiles(r, folders[k], provenance));
  }
  if (o.json) {
    const docs = results.map(analysisJson);
    io.out(JSON.stringify(docs.length === 1 ? docs[0] : docs, null, 2) + '\n');
  } else {
    io.out(results.map(textSummary).join('\n'));
  }
}
