/** The work of `mechanist analyze FILE` (loaded when the command runs; options in analyze.ts). */
import type { Command } from 'commander';
import { resolve } from 'node:path';
import { readFile } from 'node:fs/promises';
import { decodeRateBytes, parseRateText, readRateFile, type ParseOptions } from '../../input/index.js';
import { analyzeTable } from '../../analysis/analyze-table.js';
import type { AnalysisResult } from '../../analysis/types.js';
import type { RateTable } from '../../input/types.js';
import { analysisJson } from '../../report/results-json.js';
import { textSummary } from '../../report/text-summary.js';
import { analysisOptionsFrom, atSubstrateFor, atSubstrateOption, parseOptionsFrom, type SharedCliOptions } from '../analysis-options.js';
import { UsageError } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { sha256Hex, type ReportProvenance } from '../../report/html/provenance.js';
import { safeName } from '../../report/safe-name.js';
import { listNames } from '../../input/messages.js';
import { analyzeSingleSubstrate, isSingleSubstrateTable, type SingleSubstrateResult } from '../../analysis/single-substrate.js';
import { doseResponseFiles, doseResponseJson, doseResponseText } from '../../report/dose-response-output.js';
import { writeFileAtomic } from '../../report/write-atomic.js';
import { concentrationOption } from '../parse-option-values.js';
import type { Concentration } from '../../input/units.js';
import { join } from 'node:path';

export interface AnalyzeCliOptions extends SharedCliOptions {
  json?: boolean;
  out?: string;
  compound?: string;
  km?: string;
}

/** Km for the Cheng-Prusoff Ki of a one-[S] table, in the table's [S] unit. */
function kmFor(km: Concentration, table: RateTable): number {
  try {
    return atSubstrateFor(km, table);
  } catch (e) {
    if (e instanceof UsageError) throw new UsageError(e.message.replace('option --at-substrate', 'option --km'));
    throw e;
  }
}

/** Writes results.json and summary.txt of a one-[S] analysis (no figures yet for this design). */
function writeDoseResponseFiles(result: SingleSubstrateResult, dir: string): void {
  for (const [name, content] of doseResponseFiles(result)) writeFileAtomic(join(dir, name), content);
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

export function outputFolderFor(out: string, table: RateTable, many: boolean): string {
  return many && table.compound !== undefined ? resolve(out, safeName(table.compound)) : resolve(out);
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
  return { ...(bytes ? { inputSha256: sha256Hex(bytes) } : {}), command: `mechanist analyze ${file}`, options };
}


/** Reads, analyses and writes/prints one file's tables, as `mechanist analyze` does. */
export async function runAnalyze(io: CliIo, cmd: Command, file: string, o: AnalyzeCliOptions): Promise<void> {
  const parse = parseOptionsFrom(o);
  const analysis = analysisOptionsFrom(o);
  const path = resolve(io.cwd, file);
  const input = await readInputOnce(path, parse);
  const tables = chooseTables(input.tables, o.compound, file);
  const at = atSubstrateOption(o);
  const km = o.km === undefined ? undefined : concentrationOption('--km', o.km);
  // One [S] level: an IC50 curve, fitted as a dose-response (src/analysis/single-substrate.ts)
  const single = tables.filter(isSingleSubstrateTable);
  if (single.length > 0) {
    if (single.length !== tables.length)
      throw new UsageError(`${file}: some compounds have one [S] level and some several; analyse them one at a time with --compound NAME`);
    const doseResults = single.map((t) => {
      const table = { ...t, source: file };
      return analyzeSingleSubstrate(table, { level: analysis.level ?? 0.95, ...(km !== undefined ? { km: kmFor(km, table) } : {}) });
    });
    if (o.out) for (const r of doseResults) writeDoseResponseFiles(r, outputFolderFor(resolve(io.cwd, o.out), r.table, doseResults.length > 1));
    if (o.json) {
      const docs = doseResults.map(doseResponseJson);
      io.out(JSON.stringify(docs.length === 1 ? docs[0] : docs, null, 2) + '\n');
    } else io.out(doseResults.map(doseResponseText).join('\n'));
    return;
  }
  const results: AnalysisResult[] = tables.map((t) => {
    const table = { ...t, source: file };
    return analyzeTable(table, at === undefined ? analysis : { ...analysis, atSubstrate: atSubstrateFor(at, table) });
  });
  if (o.out) {
    const provenance = analyzeProvenance(input.bytes, file, cmd);
    // The figure code (d3 on a jsdom document) is loaded only here, when figures are drawn:
    // loading it costs about a second, which --help, --json and the text summary never pay.
    const { writeResultFiles } = await import('../write-results.js');
    for (const r of results) writeResultFiles(r, outputFolderFor(resolve(io.cwd, o.out), r.table, results.length > 1), provenance);
  }
  if (o.json) {
    const docs = results.map(analysisJson);
    io.out(JSON.stringify(docs.length === 1 ? docs[0] : docs, null, 2) + '\n');
  } else {
    io.out(results.map(textSummary).join('\n'));
  }
}
