/**
 * The input files of a batch run: files as given, and the rate-table files of each folder given
 * (names ending in .csv, .tsv or .txt, sorted by name in code-point order so the order does not
 * depend on the locale). A path that does not exist is kept as a file, so that reading it fails
 * with the reader's own message and the run reports it as a failed row.
 */
import { readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';

/** File-name endings read from a folder (any case). */
const TABLE_FILE_ENDINGS = ['.csv', '.tsv', '.txt'] as const;

export interface InputFile {
  /** the path as the user wrote it (folder entries: folder as written joined with the name) */
  given: string;
  /** absolute path */
  path: string;
}

interface CollectedInputs {
  files: InputFile[];
  /** plain-words notes, e.g. a folder without table files, a file named twice */
  notes: string[];
}

function isTableFileName(name: string): boolean {
  const lower = name.toLowerCase();
  return !name.startsWith('.') && TABLE_FILE_ENDINGS.some((ending) => lower.endsWith(ending));
}

function byCodePoint(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

function isFolder(path: string): boolean {
  try {
    return statSync(path).isDirectory();
  } catch {
    return false;
  }
}

/** Expands folders and drops repeats of a file already listed (each repeat is noted). */
export function collectInputFiles(inputs: readonly string[], cwd: string): CollectedInputs {
  const files: InputFile[] = [];
  const notes: string[] = [];
  const seen = new Set<string>();
  const add = (given: string, path: string) => {
    if (seen.has(path)) {
      notes.push(`${given} is listed more than once; it is analysed once`);
      return;
    }
    seen.add(path);
    files.push({ given, path });
  };
  for (const input of inputs) {
    const path = resolve(cwd, input);
    if (!isFolder(path)) {
      add(input, path);
      continue;
    }
    const names = readdirSync(path, { withFileTypes: true })
      .filter((entry) => !entry.isDirectory() && isTableFileName(entry.name))
      .map((entry) => entry.name)
      .sort(byCodePoint);
    if (names.length === 0) notes.push(`folder ${input} holds no ${TABLE_FILE_ENDINGS.join(', ')} files`);
    for (const name of names) add(join(input, name), join(path, name));
  }
  return { files, notes };
}
