/**
 * Reading a text file for the readers (rate tables, plate reads, plate maps, standard curves):
 * bytes, decoded as UTF-8 (with or without BOM), or a one-line InputError naming the file.
 */
import { readFile } from 'node:fs/promises';
import { InputError } from './types.js';
import { locate } from './messages.js';
import { decodeRateBytes } from './decode.js';

const READ_PROBLEMS: Record<string, string> = {
  ENOENT: 'no such file; check the path',
  EISDIR: 'this is a folder, not a file; give the path of a CSV or TSV file',
  EACCES: 'permission denied; check the file permissions',
  EPERM: 'permission denied; check the file permissions',
};

/** The text of the file at `path`; `source` names it in messages (default: the path). */
export async function readTextFile(path: string, source = path): Promise<string> {
  let bytes: Uint8Array;
  try {
    bytes = await readFile(path);
  } catch (error) {
    const code = (error as { code?: string }).code ?? '';
    const problem = READ_PROBLEMS[code] ?? `cannot be read (${code || 'unknown reason'}); check the path and the file`;
    throw new InputError(`${locate(source)}${problem}`, source);
  }
  return decodeRateBytes(bytes, source);
}
