/**
 * Reading a rate table from a file: bytes, then text, then tables.
 */
import { readFile } from 'node:fs/promises';
import { InputError, type RateTable } from './types.js';
import type { ParseOptions } from './options.js';
import { locate } from './messages.js';
import { decodeRateBytes } from './decode.js';
import { parseRateText } from './parse-rate-text.js';

const READ_PROBLEMS: Record<string, string> = {
  ENOENT: 'no such file; check the path',
  EISDIR: 'this is a folder, not a file; give the path of a CSV or TSV file',
  EACCES: 'permission denied; check the file permissions',
  EPERM: 'permission denied; check the file permissions',
};

/** Reads `path` (UTF-8, with or without BOM) and parses it; the path names the file in messages. */
export async function readRateFile(path: string, options: ParseOptions = {}): Promise<RateTable[]> {
  let bytes: Uint8Array;
  try {
    bytes = await readFile(path);
  } catch (error) {
    const code = (error as { code?: string }).code ?? '';
    const problem = READ_PROBLEMS[code] ?? `cannot be read (${code || 'unknown reason'}); check the path and the file`;
    throw new InputError(`${locate(path)}${problem}`, path);
  }
  const text = decodeRateBytes(bytes, path);
  return parseRateText(text, { ...options, source: path });
}
