/**
 * Writing outputs so that nothing half-written is ever visible:
 *  - writeFileAtomic: one file, written under a hidden temporary name in the same folder and then
 *    renamed into place (rename is atomic within a file system, POSIX rename(2));
 *  - writeFolderAtomic: a whole folder (a report), built under a hidden temporary name beside its
 *    final place and then renamed into place; an older folder of that name is first moved aside
 *    and removed after the switch, so the folder is, at any moment, the old one, the new one, or
 *    absent, never a mix.
 * On a failed write (disk full, read-only...) the temporary file or folder is removed and an
 * OutputError names the path and the problem. A process killed mid-write can leave only a
 * hidden temporary entry (`.NAME.PID.RANDOM.tmp`); removeStaleTemporaries clears those of
 * processes that no longer run.
 */
import { mkdirSync, readdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { OutputError, errnoCode, writeProblem } from './output-error.js';
import { isRunning } from './process-running.js';

/** Temporary entries written by this module: `.<final name>.<pid>.<random>.tmp`. */
const TEMPORARY_NAME = /^\..*\.(\d+)\.[a-z0-9]+\.tmp$/;

/** A fresh hidden temporary path beside `path`, tagged with this process id. */
export function temporaryPathFor(path: string): string {
  return join(dirname(path), `.${basename(path)}.${process.pid}.${Math.random().toString(36).slice(2, 10)}.tmp`);
}

/** The process id a temporary entry name carries, or null when the name is not one of ours. */
export function temporaryOwner(name: string): number | null {
  const m = TEMPORARY_NAME.exec(name);
  return m ? Number(m[1]) : null;
}

function writeFailure(path: string, error: unknown): OutputError {
  if (error instanceof OutputError) return error;
  return new OutputError(`cannot write ${path}: ${writeProblem(error)}; nothing was left half-written`, path, 'write');
}

export function writeFileAtomic(path: string, content: string | Uint8Array): void {
  let tmp: string | null = null;
  try {
    mkdirSync(dirname(path), { recursive: true });
    tmp = temporaryPathFor(path);
    writeFileSync(tmp, content, { flag: 'wx' });
    renameSync(tmp, path);
    tmp = null;
  } catch (error) {
    if (tmp !== null) rmSync(tmp, { force: true });
    throw writeFailure(path, error);
  }
}

/**
 * Writes several files as one batch of renames: every file is first written under its temporary
 * name, then all are renamed in a row, so a failure while writing leaves every old file in place.
 */
export function writeFilesAtomic(files: ReadonlyArray<readonly [string, string | Uint8Array]>): void {
  const staged: Array<[string, string]> = [];
  let current = '';
  try {
    for (const [path, content] of files) {
      current = path;
      mkdirSync(dirname(path), { recursive: true });
      const tmp = temporaryPathFor(path);
      staged.push([tmp, path]);
      writeFileSync(tmp, content, { flag: 'wx' });
    }
    for (const [tmp, path] of staged) {
      current = path;
      renameSync(tmp, path);
    }
  } catch (error) {
    for (const [tmp] of staged) rmSync(tmp, { force: true });
    throw writeFailure(current, error);
  }
}

/** Moves a finished temporary folder to `dir`, replacing an older folder there. */
function placeFolder(tmp: string, dir: string): void {
  for (let attempt = 0; ; attempt++) {
    try {
      renameSync(tmp, dir); // succeeds when dir is absent or an empty folder
      return;
    } catch (error) {
      const code = errnoCode(error);
      if ((code !== 'ENOTEMPTY' && code !== 'EEXIST') || attempt >= 5) throw error;
    }
    const old = temporaryPathFor(dir);
    try {
      renameSync(dir, old);
    } catch (error) {
      if (errnoCode(error) !== 'ENOENT') throw error; // someone else moved it: try again
      continue;
    }
    try {
      renameSync(tmp, dir);
    } catch (error) {
      if (['ENOTEMPTY', 'EEXIST'].includes(errnoCode(error))) {
        // another writer placed its folder in between: ours is not newer, drop the old one and retry
        rmSync(old, { recursive: true, force: true });
        continue;
      }
      try {
        renameSync(old, dir); // put the older folder back
      } catch {
        // leave the older folder under its temporary name; the next run removes it
      }
      throw error;
    }
    rmSync(old, { recursive: true, force: true });
    return;
  }
}

/**
 * Writes `files` (paths relative to `dir`, e.g. `figures/curves.svg`) as the whole content of
 * the folder `dir`, which appears complete or not at all. An older `dir` is replaced whole.
 */
export function writeFolderAtomic(dir: string, files: ReadonlyArray<readonly [string, string | Uint8Array]>): void {
  let tmp: string | null = null;
  try {
    mkdirSync(dirname(dir), { recursive: true });
    tmp = temporaryPathFor(dir);
    mkdirSync(tmp);
    for (const [relative, content] of files) {
      const path = join(tmp, relative);
      mkdirSync(dirname(path), { recursive: true });
      writeFileSync(path, content, { flag: 'wx' });
    }
    placeFolder(tmp, dir);
    tmp = null;
  } catch (error) {
    if (tmp !== null) rmSync(tmp, { recursive: true, force: true });
    throw writeFailure(dir, error);
  }
}

/**
 * Removes the temporary entries in `folder` left by processes that no longer run (a run killed
 * mid-write), and with `includeOwn` this process's own; returns the names removed. Entries of
 * other running processes are left alone. A missing folder has none. With `forName`, only the
 * temporaries of that final name (`.<forName>.<pid>...tmp`) are considered.
 */
export function removeStaleTemporaries(folder: string, includeOwn = false, forName?: string): string[] {
  let names: string[];
  try {
    names = readdirSync(folder);
  } catch {
    return [];
  }
  const removed: string[] = [];
  for (const name of names) {
    const owner = temporaryOwner(name);
    if (owner === null || (forName !== undefined && !name.startsWith(`.${forName}.`))) continue;
    if (owner === process.pid ? !includeOwn : isRunning(owner)) continue;
    rmSync(join(folder, name), { recursive: true, force: true });
    removed.push(name);
  }
  return removed;
}
