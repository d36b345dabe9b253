/**
 * A one-line progress bar on a terminal stream (stderr by default): drawn only after the work has
 * run for about a second, redrawn at most ten times a second, erased when done. Silent when the
 * stream is not a terminal.
 */
export interface ProgressBar {
  update(done: number, total: number): void;
  finish(): void;
}

interface ProgressBarOptions {
  stream?: NodeJS.WriteStream;
  /** wait before the first draw (ms); default 1000 */
  delayMs?: number;
  width?: number;
}

export function progressBar(label: string, options: ProgressBarOptions = {}): ProgressBar {
  const stream = options.stream ?? process.stderr;
  const delay = options.delayMs ?? 1000;
  const width = options.width ?? 30;
  const started = Date.now();
  let lastDraw = 0;
  let drawn = false;
  const enabled = stream.isTTY === true;
  const finish = () => {
    if (drawn) stream.write('\r\x1b[K');
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
      stream.write(`\r${label} [${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${Math.floor(share * 100)}% (${done}/${total})`);
      drawn = true;
    },
    finish,
  };
}
