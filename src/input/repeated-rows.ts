/**
 * Blocks of rows that repeat earlier rows exactly (same [S], same [I], same rate, in the same
 * order): the mark of a block pasted twice. Measured rates almost never repeat to the last digit
 * several rows running, and a pasted copy would be counted as extra replicates, making the fit
 * look more precise than it is. Found here, reported as a warning with the lines; the analysis
 * turns it into a blocking caveat (src/analysis/stage-diagnostics.ts).
 */
import type { InputWarning, RatePoint } from './types.js';

/** A run of at least this many consecutive repeated rows counts as a pasted block (chosen here). */
const REPEATED_BLOCK_ROWS = 4;
/** Rows whose exact values occur more often than this are not searched (constant blocks, zeros). */
const MAX_OCCURRENCES = 8;

interface RepeatedBlock {
  /** first and last source line of the copy */
  lines: [number, number];
  /** first and last source line of the rows it repeats */
  repeats: [number, number];
  rows: number;
}

function same(a: RatePoint, b: RatePoint): boolean {
  return a.substrate === b.substrate && a.inhibitor === b.inhibitor && a.rate === b.rate;
}

/**
 * Earlier rows by rate: one index, or several in increasing order. Keyed by the number (no key
 * text per row: on a table of a million rows, text keys were most of the reader's peak memory).
 */
type Seen = Map<number, number | number[]>;

const NONE: readonly number[] = [];

/** The earlier rows with exactly the values of `points[k]`, in increasing order. */
function earlierCopies(seen: Seen, points: readonly RatePoint[], k: number): readonly number[] {
  const bucket = seen.get(points[k].rate);
  if (bucket === undefined) return NONE;
  if (typeof bucket === 'number') return same(points[bucket], points[k]) ? [bucket] : NONE;
  return bucket.filter((j) => same(points[j], points[k]));
}

/** Every maximal block of REPEATED_BLOCK_ROWS or more rows that repeats earlier rows exactly. */
function repeatedBlocks(points: readonly RatePoint[]): RepeatedBlock[] {
  const seen: Seen = new Map();
  const blocks: RepeatedBlock[] = [];
  let k = 0;
  while (k < points.length) {
    const earlier = earlierCopies(seen, points, k);
    let best = 0;
    let from = -1;
    if (earlier.length <= MAX_OCCURRENCES) {
      for (const j of earlier) {
        let length = 0;
        while (k + length < points.length && j + length < k && same(points[j + length], points[k + length])) length++;
        if (length > best) {
          best = length;
          from = j;
        }
      }
    }
    if (best >= REPEATED_BLOCK_ROWS) {
      blocks.push({ lines: [points[k].line, points[k + best - 1].line], repeats: [points[from].line, points[from + best - 1].line], rows: best });
      for (let m = k; m < k + best; m++) remember(seen, points[m], m);
      k += best;
    } else {
      remember(seen, points[k], k);
      k++;
    }
  }
  return blocks;
}

function remember(seen: Seen, p: RatePoint, index: number): void {
  const bucket = seen.get(p.rate);
  if (bucket === undefined) seen.set(p.rate, index);
  else if (typeof bucket === 'number') seen.set(p.rate, [bucket, index]);
  else bucket.push(index);
}

/** The warning for the repeated blocks of a table, or none. */
export function repeatedRowWarnings(points: readonly RatePoint[]): InputWarning[] {
  return repeatedBlocks(points).map((b) => ({
    code: 'repeated-block',
    message: `lines ${b.lines[0]}-${b.lines[1]} repeat lines ${b.repeats[0]}-${b.repeats[1]} exactly (${b.rows} rows with the same [S], [I] and rate): a block pasted twice would count as extra replicates; remove the copy, or confirm the values`,
    lines: points.filter((p) => p.line >= b.lines[0] && p.line <= b.lines[1]).map((p) => p.line),
  }));
}
