/**
 * Reading a rate table from a file: bytes, then text, then tables.
 */
import type { RateTable } from './types.js';
import type { ParseOptions } from './options.js';
import { readTextFile } from './read-text-file.js';
import { parseRateText } from './parse-rate-text.js';

/** Reads `path` (UTF-8, with or without BOM) and parses it; the path names the file in messages. */
export async function readRateFile(path: string, options: ParseOptions = {}): Promise<RateTable[]> {
  const text = await readTextFile(path);
  return parseRateText(text, { ...options, source: path });
}
