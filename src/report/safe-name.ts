/**
 * A compound id made safe as a folder name on any common file system: runs of characters other
 * than letters, digits, ".", "_" and "-" become "_", a leading dot becomes "_" (so "." and ".."
 * cannot name the folder itself or its parent), and a name longer than SAFE_NAME_MAX_LENGTH is
 * cut and given a stable hash of the whole id, so different long ids stay different and the same
 * id gets the same folder in every run.
 */
import { createHash } from 'node:crypto';

/** Longest folder name written: far below the 255-byte limit of ext4, APFS and NTFS, leaving room for a "-<position>" suffix and the temporary name's additions. */
export const SAFE_NAME_MAX_LENGTH = 96;

/** Characters of the SHA-256 hex digest appended to a shortened name. */
const HASH_LENGTH = 12;

export function safeName(name: string): string {
  const safe = name.replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^\.+/, '_') || '_';
  if (safe.length <= SAFE_NAME_MAX_LENGTH) return safe;
  const hash = createHash('sha256').update(name, 'utf8').digest('hex').slice(0, HASH_LENGTH);
  return `${safe.slice(0, SAFE_NAME_MAX_LENGTH - HASH_LENGTH - 1)}-${hash}`;
}
