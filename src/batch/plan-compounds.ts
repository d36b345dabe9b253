/**
 * From input files to the list of compounds to analyse: each file is read (one table per
 * compound), each compound gets an id unique within the run and a report folder name unique
 * within the run, in input order (file order, then compound order within the file).
 *
 * Compound ids (documented in README, "Batch: compound ids"):
 *  - the compound name from the file's `compound` column or block title; for a file without
 *    compound names, the file name without its ending (plate1.csv -> plate1);
 *  - an id that more than one input shares is made longer, for each sharer, step by step until it
 *    is unique: first with the file name (CPD-7@plate1.csv, or plate1.csv for an unnamed table),
 *    then with the path as given (CPD-7@run2/plate1.csv, or run2/plate1.csv), and last with the
 *    position in the run (CPD-7@run2/plate1.csv#12).
 */
import { readFileSync } from 'node:fs';
import { basename, extname } from 'node:path';
import { sha256Hex } from '../input/file-hash.js';
import { readRateFile } from '../input/read-rate-file.js';
import type { ParseOptions } from '../input/options.js';
import { InputError, type RateTable } from '../input/types.js';
import { safeName } from '../report/safe-name.js';
import type { InputFile } from './collect-inputs.js';
import type { CompoundJob } from './types.js';

interface Entry {
  source: string;
  inputSha256: string | null;
  nameInFile: string | null;
  table: RateTable | null;
  readError: string | null;
}

/** The id of an entry at a given length: 0 shortest, 3 longest (always unique). */
function idAtLevel(entry: Entry, level: number, position: number): string {
  const file = basename(entry.source);
  const named = entry.nameInFile;
  switch (level) {
    case 0:
      return named ?? basename(file, extname(file));
    case 1:
      return named !== null ? `${named}@${file}` : file;
    case 2:
      return named !== null ? `${named}@${entry.source}` : entry.source;
    default:
      return `${idAtLevel(entry, 2, position)}#${position}`;
  }
}

/** Unique ids for all entries (see the rule in the header). */
export function uniqueCompoundIds(entries: ReadonlyArray<Pick<Entry, 'source' | 'nameInFile'>>): string[] {
  const levels = entries.map(() => 0);
  const idOf = (k: number) => idAtLevel(entries[k] as Entry, levels[k], k + 1);
  for (;;) {
    const groups = new Map<string, number[]>();
    entries.forEach((_, k) => {
      const id = idOf(k);
      groups.set(id, [...(groups.get(id) ?? []), k]);
    });
    let raised = false;
    for (const members of groups.values()) {
      if (members.length < 2) continue;
      for (const k of members) {
        if (levels[k] < 3) {
          levels[k] += 1;
          raised = true;
        }
      }
    }
    if (!raised) return entries.map((_, k) => idOf(k));
  }
}

/**
 * Report folder names: safeName of the id; where two ids give the same folder name (ignoring
 * case, for case-insensitive file systems), the later ones get "-<position>" appended.
 */
export function uniqueFolderNames(ids: readonly string[]): string[] {
  const taken = new Set<string>();
  return ids.map((id, k) => {
    let name = safeName(id);
    if (taken.has(name.toLowerCase())) name = `${name}-${k + 1}`;
    while (taken.has(name.toLowerCase())) name = `${name}_`;
    taken.add(name.toLowerCase());
    return name;
  });
}

/** The reader's message, naming the file as the user gave it rather than by its absolute path. */
function readFailureMessage(error: InputError, file: InputFile): string {
  return error.message.split(file.path).join(file.given).replace(/\s*\n\s*/g, ' ').trim();
}

async function readEntries(file: InputFile, parse: ParseOptions): Promise<Entry[]> {
  try {
    const tables = await readRateFile(file.path, parse);
    const inputSha256 = sha256Hex(readFileSync(file.path));
    return tables.map((table) => ({
      source: file.given,
      inputSha256,
      nameInFile: table.compound ?? null,
      table: { ...table, source: file.given },
      readError: null,
    }));
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    return [{ source: file.given, inputSha256: null, nameInFile: null, table: null, readError: readFailureMessage(error, file) }];
  }
}

/** Reads every file and lists the compounds in input order, with unique ids and folder names. */
export async function planCompounds(
  files: readonly InputFile[],
  parse: ParseOptions = {},
  onFile?: (done: number, total: number) => void,
): Promise<CompoundJob[]> {
  const entries: Entry[] = [];
  for (const [k, file] of files.entries()) {
    entries.push(...(await readEntries(file, parse)));
    onFile?.(k + 1, files.length);
  }
  const ids = uniqueCompoundIds(entries);
  const folders = uniqueFolderNames(ids);
  return entries.map((entry, k) => ({
    position: k + 1,
    compound: ids[k],
    nameInFile: entry.nameInFile,
    source: entry.source,
    folder: folders[k],
    table: entry.table,
    readError: entry.readError,
    inputSha256: entry.inputSha256,
  }));
}
