/** Numbers as the JSON documents write them: non-finite values (and missing ones) become null. */
export type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

export function jsonNumber(x: number | null | undefined): number | null {
  return x === null || x === undefined || !Number.isFinite(x) ? null : x;
}

export function jsonPair(x: readonly [number, number] | null | undefined): [number | null, number | null] | null {
  return x ? [jsonNumber(x[0]), jsonNumber(x[1])] : null;
}
