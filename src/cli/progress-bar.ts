/**
 * A one-line progress bar on a terminal stream (stderr by default): drawn only after the work has
 * run for about a second, redrawn at most ten times a second, erased when done. Silent when the
 * stream is not a terminal.
 */
import type { CliIo } from './io.js';

export interface ProgressBar {
  update(done: number, total: number): void;
  finish(): void;
}

interface ProgressBarOptions {
  stream?: NodeJS.WriteStream;
  /** where to draw instead of `stream` (a CLI's stderr writer) */
  write?: (text: string) => void;
  /** whether that writer is a terminal (needed with `write`; the bar is silent otherwise) */
  terminal?: boolean;
  /** wait before the first draw (ms); default 1000 */
  delayMs?: number;
  width?: number;
  /** the text after the bar; default "(done/total)" */
  count?: (done: number, total: number) => string;
}

export function progressBar(label: string, options: ProgressBarOptions = {}): ProgressBar {
  const stream = options.stream ?? process.stderr;
  const write = options.write ?? ((text: string) => stream.write(text));
  const delay = options.delayMs ?? 1000;
  const width = options.width ?? 30;
  const count = options.count ?? ((done: number, total: number) => `(${done}/${total})`);
  const started = Date.now();
  let lastDraw = 0;
  let drawn = false;
  const enabled = options.write ? options.terminal === true : stream.isTTY === true;
  const finish = () => {
    if (drawn) write('\r\x1b[K');
    drawn = false;
  };
  return {
    update(done, total) {
      if (!enabled) return;
      if (done >= total) return finish();
      const now = Date.now();
      if (now - started < delay || now - lastDraw < 100) return;
      lastDraw = now;
      const share = total > 0 ? done / total : 0;
      const filled = Math.round(share * width);
      write(`\r${label} [${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${Math.floor(share * 100)}% ${count(done, total)}`);
      drawn = true;
    },
    finish,
  };
}

/** Megabytes of a file read, for the text after a reading bar: "12.3 of 56.1 MB". */
export function megabytesRead(done: number, total: number): string {
  return `${(done / 1e6).toFixed(1)} of ${(total / 1e6).toFixed(1)} MB`;
}

/** A bar on the CLI's stderr, drawn only when that is a terminal. */
export function cliProgressBar(io: CliIo, label: string, count?: (done: number, total: number) => string): ProgressBar {
  return progressBar(label, {
    write: (text) => io.err(text),
    terminal: io.errIsTTY,
    ...(io.progressDelayMs !== undefined ? { delayMs: io.progressDelayMs } : {}),
    ...(count ? { count } : {}),
  });
}
