/**
 * Whether a process id is alive on this machine, for leftovers of killed runs (temporary folders,
 * run locks): signal 0 tests for the process without touching it; EPERM means it exists but
 * belongs to someone else (Node.js process.kill; POSIX kill(2)).
 */
import { errnoCode } from './output-error.js';

export function isRunning(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return errnoCode(error) === 'EPERM';
  }
}
