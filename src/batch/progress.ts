/**
 * A one-line progress bar for batch runs, redrawn in place on a terminal ("\r", erase to end of
 * line) at most ten times a second, and closed with a newline. Silent when switched off.
 */
export interface ProgressBar {
  /** record one more finished compound */
  tick(failed: boolean): void;
  /** draw the final state and end the line */
  finish(): void;
}

const WIDTH = 28;
const REDRAW_MS = 100;

export function progressLine(done: number, total: number, failed: number): string {
  const filled = total === 0 ? WIDTH : Math.round((WIDTH * done) / total);
  const bar = '#'.repeat(filled) + '.'.repeat(WIDTH - filled);
  const failures = failed > 0 ? `, ${failed} failed` : '';
  return `[${bar}] ${done}/${total} compounds${failures}`;
}

/** A bar that writes through `write` when `enabled`; a no-op otherwise. */
export function progressBar(write: (text: string) => void, total: number, enabled: boolean): ProgressBar {
  if (!enabled) return { tick: () => undefined, finish: () => undefined };
  let done = 0;
  let failed = 0;
  let drawnAt = 0;
  const draw = () => write(`\r${progressLine(done, total, failed)}\x1b[K`);
  draw();
  return {
    tick(isFailure: boolean) {
      done += 1;
      if (isFailure) failed += 1;
      const now = Date.now();
      if (now - drawnAt >= REDRAW_MS || done === total) {
        drawnAt = now;
        draw();
      }
    },
    finish() {
      draw();
      write('\n');
    },
  };
}
