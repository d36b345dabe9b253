/**
 * The fingerprint of an input file: SHA-256 of its bytes, recorded in every report's footer and
 * in a batch's compound list so a result can be traced to the exact file it was computed from.
 */
import { createHash } from 'node:crypto';

/** SHA-256 of the bytes, as lower-case hex (FIPS 180-4, via node:crypto). */
export function sha256Hex(bytes: Uint8Array | string): string {
  return createHash('sha256').update(bytes).digest('hex');
}
