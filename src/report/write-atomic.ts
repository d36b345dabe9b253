/**
 * Writes a file under a temporary name in the same folder, then renames it into place, so that an
 * interrupted run never leaves a half-written output (rename is atomic within a filesystem, POSIX).
 */
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join, basename } from 'node:path';

export function writeFileAtomic(path: string, content: string | Uint8Array): void {
  const dir = dirname(path);
  mkdirSync(dir, { recursive: true });
  const tmp = join(dir, `.${basename(path)}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`);
  writeFileSync(tmp, content);
  renameSync(tmp, path);
}
