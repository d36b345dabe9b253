/**
 * Checks on an output folder made before any analysis runs, so that a folder that cannot take
 * the results is reported at once in one line (OutputError, stage 'check') rather than after the
 * work, or as an internal error:
 *  - the path is an existing file;
 *  - its parent folder is missing (a mistyped path is not silently created), or is a file;
 *  - nothing can be created in it (read-only file system, no permission, no space): found by
 *    creating and removing a small hidden probe file, which also works for root, for whom
 *    permission bits do not decide;
 *  - for a report folder that is replaced whole (analyze --out), it holds files that are not a
 *    report's, which the replacement would delete.
 */
import { readdirSync, rmSync, statSync, writeFileSync, type Stats } from 'node:fs';
import { dirname, join } from 'node:path';
import { OutputError, writeProblem } from './output-error.js';
import { temporaryOwner, temporaryPathFor } from './write-atomic.js';

/** What a results folder holds: src/report/write-results.ts and `mechanist plan --out` write exactly these. */
export const REPORT_ENTRIES: ReadonlySet<string> = new Set([
  // an analysis report folder
  'report.html', 'results.json', 'parameters.csv', 'summary.txt', 'figures',
  // a plan folder (mechanist plan --out)
  'plan.html', 'plan.json', 'plate-map.csv',
]);

/** Files an operating system's file browser drops into folders it shows; replacing them loses nothing. */
const FILE_BROWSER_FILES: ReadonlySet<string> = new Set(['.DS_Store', 'Thumbs.db', 'desktop.ini']);

/** True for an entry a report folder may hold: a report file, a temporary entry of ours, or file-browser clutter. */
export function isReportEntry(name: string): boolean {
  return REPORT_ENTRIES.has(name) || FILE_BROWSER_FILES.has(name) || temporaryOwner(name) !== null;
}

function statOrNull(path: string): Stats | null {
  try {
    return statSync(path);
  } catch {
    return null;
  }
}

function probeWritable(folder: string, shown: string): void {
  const probe = temporaryPathFor(join(folder, 'mechanist-probe'));
  try {
    writeFileSync(probe, 'probe\n', { flag: 'wx' });
  } catch (error) {
    throw new OutputError(`${shown}: cannot write there (${writeProblem(error)}); choose another output folder`, folder, 'check');
  } finally {
    rmSync(probe, { force: true });
  }
}

interface OutputCheck {
  /** true when the folder does not exist yet (it will be created) */
  created: boolean;
}

/**
 * Checks that `path` can serve as an output folder: an existing folder that can be written, or a
 * new folder inside an existing, writable parent (`createParents` lifts the parent rule, for a
 * default path such as reports/demo). `shown` is the path as the user wrote it.
 */
export function checkOutputFolder(path: string, shown: string = path, createParents = false): OutputCheck {
  const stats = statOrNull(path);
  if (stats !== null && !stats.isDirectory())
    throw new OutputError(`${shown}: is an existing file, not a folder; give a folder for the output`, path, 'check');
  if (stats !== null) {
    probeWritable(path, shown);
    return { created: false };
  }
  let parent = dirname(path);
  if (createParents) while (statOrNull(parent) === null && dirname(parent) !== parent) parent = dirname(parent);
  const parentStats = statOrNull(parent);
  if (parentStats === null)
    throw new OutputError(`${shown}: its parent folder ${parent} does not exist; create it first, or give another output folder`, path, 'check');
  if (!parentStats.isDirectory())
    throw new OutputError(`${shown}: ${parent} is a file, not a folder; give another output folder`, path, 'check');
  probeWritable(parent, shown);
  return { created: true };
}

/**
 * For a report folder that will be replaced whole: refuses one that holds anything other than a
 * report's files (and hidden temporary entries of an interrupted run), which would be lost.
 */
export function checkReplaceableReportFolder(path: string, shown: string = path): void {
  const stats = statOrNull(path);
  if (stats === null || !stats.isDirectory()) return;
  // the folder is swapped for the new one, so its parent must take the temporary folder too
  probeWritable(dirname(path), `${shown} (its parent folder)`);
  const foreign = readdirSync(path).filter((name) => !isReportEntry(name));
  if (foreign.length > 0) {
    const shownNames = foreign.slice(0, 3).join(', ') + (foreign.length > 3 ? `, and ${foreign.length - 3} more` : '');
    throw new OutputError(
      `${shown}: holds files that are not part of a report (${shownNames}); the report folder is replaced whole, so give a new or empty folder, or an earlier report folder`,
      path, 'check',
    );
  }
}
