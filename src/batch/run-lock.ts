/**
 * One batch run at a time per output folder. A run creates `<out>/.mechanist-run.lock` with
 * exclusive create (O_EXCL, atomic on local file systems), holding its process id, host and start
 * time, and removes it when it ends. A second run into the same folder finds the lock and refuses
 * with an OutputError (stage 'check') before any analysis, so two runs can never mix their rows
 * and reports. A lock whose process no longer runs on this host (a run that was killed) is taken
 * over, with a note.
 */
import { hostname } from 'node:os';
import { join } from 'node:path';
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { OutputError, errnoCode, writeProblem } from '../report/output-error.js';
import { isRunning } from '../report/process-running.js';

export const RUN_LOCK_FILE = '.mechanist-run.lock';

interface LockContent {
  pid: number;
  host: string;
  started: string;
  command: string;
}

export interface RunLock {
  /** removes the lock file (only if it is still this run's) */
  release(): void;
  /** set when a stale lock of a killed run was taken over */
  note: string | null;
}

function readLock(path: string): LockContent | null {
  try {
    return JSON.parse(readFileSync(path, 'utf8')) as LockContent;
  } catch {
    return null;
  }
}

/** Takes the output folder's run lock (the folder must exist), or throws OutputError. */
export function takeRunLock(out: string, shown: string, command: string): RunLock {
  const path = join(out, RUN_LOCK_FILE);
  const mine: LockContent = { pid: process.pid, host: hostname(), started: new Date().toISOString(), command };
  let note: string | null = null;
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      writeFileSync(path, JSON.stringify(mine) + '\n', { flag: 'wx' });
      const release = () => {
        const now = readLock(path);
        if (now !== null && now.pid === mine.pid && now.started === mine.started) rmSync(path, { force: true });
      };
      return { release, note };
    } catch (error) {
      if (errnoCode(error) !== 'EEXIST')
        throw new OutputError(`${shown}: cannot write there (${writeProblem(error)}); choose another output folder`, out, 'check');
    }
    const held = readLock(path);
    if (held === null) {
      // being written this instant by another run, or damaged: look again once, then treat as held
      if (attempt === 0) continue;
      throw new OutputError(`${shown}: another mechanist run holds this folder (${RUN_LOCK_FILE}); wait for it to finish, or choose another output folder`, out, 'check');
    }
    const elsewhere = held.host !== mine.host;
    if (elsewhere || isRunning(held.pid)) {
      const where = elsewhere ? ` on ${held.host}` : '';
      throw new OutputError(
        `${shown}: another mechanist run (process ${held.pid}${where}, started ${held.started}) is writing into this folder; wait for it to finish, or choose another output folder`,
        out, 'check',
      );
    }
    rmSync(path, { force: true });
    note = `took over the lock of an earlier run (process ${held.pid}, started ${held.started}) that ended without finishing`;
  }
  throw new OutputError(`${shown}: the run lock could not be taken; choose another output folder`, out, 'check');
}
