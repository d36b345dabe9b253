/**
 * Errors about the output folder, in one plain line: found before any analysis runs (`stage:
 * 'check'`: the folder is a file, its parent is missing, it cannot be written, another run holds
 * it), or while writing (`stage: 'write'`: the disk filled up, the folder vanished). The CLI maps
 * them to exit codes (src/cli/exit-codes.ts).
 */
export type OutputStage = 'check' | 'write';

export class OutputError extends Error {
  constructor(message: string, readonly path: string, readonly stage: OutputStage) {
    super(message);
    this.name = 'OutputError';
  }
}

/** Plain words for the errno codes a write can end in. */
const WRITE_PROBLEMS: Record<string, string> = {
  ENOSPC: 'no space left on the device',
  EDQUOT: 'the disk quota is used up',
  EROFS: 'the file system is read-only',
  EACCES: 'permission denied',
  EPERM: 'permission denied',
  ENAMETOOLONG: 'the name is too long for the file system',
  ENOTDIR: 'a part of the path is a file, not a folder',
  ENOENT: 'the folder no longer exists',
  EISDIR: 'a folder is in the way',
  EEXIST: 'something else is in the way',
  EIO: 'an input/output error of the device',
};

export function errnoCode(error: unknown): string {
  return String((error as NodeJS.ErrnoException | undefined)?.code ?? '');
}

/** "no space left on the device" for ENOSPC, and so on; the code itself when it is not listed. */
export function writeProblem(error: unknown): string {
  const code = errnoCode(error);
  return WRITE_PROBLEMS[code] ?? (code !== '' ? code : error instanceof Error ? error.message : String(error));
}
