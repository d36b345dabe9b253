/**
 * Time in the reads: the unit from the header (`time (s)`, `time (min)`, `time (h)`) and cells
 * written as plain numbers or as a clock (`1:30`, `0:01:30`, `1:02:03.5`: minutes:seconds or
 * hours:minutes:seconds, as plate readers often export them).
 */
import type { TimeUnit } from './types.js';

const UNIT_SPELLINGS: Record<string, TimeUnit> = {
  s: 's', sec: 's', secs: 's', second: 's', seconds: 's',
  min: 'min', mins: 'min', minute: 'min', minutes: 'min',
  h: 'h', hr: 'h', hrs: 'h', hour: 'h', hours: 'h',
};

export const SECONDS_PER: Record<TimeUnit, number> = { s: 1, min: 60, h: 3600 };

/** The time unit written in a header, or null when it is not one. */
export function parseTimeUnit(text: string): TimeUnit | null {
  return UNIT_SPELLINGS[text.trim().toLowerCase()] ?? null;
}

const CLOCK = /^(\d+):([0-5]?\d)(?::([0-5]?\d(?:\.\d+)?))?$/;

/** Seconds of a clock cell (`m:ss` or `h:mm:ss`), or null when the cell is not a clock. */
export function clockSeconds(cell: string): number | null {
  const match = CLOCK.exec(cell.trim());
  if (!match) return null;
  if (match[3] === undefined) return Number(match[1]) * 60 + Number(match[2]);
  return Number(match[1]) * 3600 + Number(match[2]) * 60 + Number(match[3]);
}
