/** Test helpers: read a fixture of test/fixtures/input as the CLI would, and catch InputErrors. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { decodeRateBytes, InputError, parseRateText, type ParseOptions, type RateTable } from '../../src/input/index.js';

export const FIXTURES = fileURLToPath(new URL('../fixtures/input/', import.meta.url));
export const EXAMPLES = fileURLToPath(new URL('../../examples/', import.meta.url));

/** Parses test/fixtures/input/<name>; messages name the file as `<name>`. */
export function readFixture(name: string, options: ParseOptions = {}, folder = FIXTURES): RateTable[] {
  const text = decodeRateBytes(readFileSync(folder + name), name);
  return parseRateText(text, { ...options, source: name });
}

/** The InputError thrown by `run`; fails the test if nothing (or something else) is thrown. */
export function inputErrorOf(run: () => unknown): InputError {
  try {
    run();
  } catch (error) {
    if (error instanceof InputError) return error;
    throw new Error(`expected an InputError, got ${String(error)}`);
  }
  throw new Error('expected an InputError, nothing was thrown');
}

/** Points without line numbers, sorted, for comparing tables written differently. */
export function sortedPoints(table: RateTable): { substrate: number; inhibitor: number; rate: number; replicate?: string }[] {
  return table.points
    .map((p) => ({ substrate: p.substrate, inhibitor: p.inhibitor, rate: p.rate, replicate: p.replicate }))
    .sort((a, b) => a.substrate - b.substrate || a.inhibitor - b.inhibitor || (a.replicate ?? '').localeCompare(b.replicate ?? '') || a.rate - b.rate);
}
