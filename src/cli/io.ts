/** Where the command line writes; injectable so the CLI can be tested in-process. */
export interface CliIo {
  out(text: string): void;
  err(text: string): void;
  /** true when stderr is a terminal (progress bars only then) */
  errIsTTY: boolean;
  /** wait before a progress bar first draws (ms); default 1000 (tests set 0 to see the bars) */
  progressDelayMs?: number;
  cwd: string;
  /**
   * Calls `handler` once on SIGINT or SIGTERM (with the signal's name); returns a function that
   * removes it. Absent in-process (tests), where nothing is interrupted.
   */
  onInterrupt?: (handler: (signal: NodeJS.Signals) => void) => () => void;
}

export function processIo(): CliIo {
  return {
    out: (t) => process.stdout.write(t),
    err: (t) => process.stderr.write(t),
    errIsTTY: Boolean(process.stderr.isTTY),
    cwd: process.cwd(),
    onInterrupt: (handler) => {
      const signals: NodeJS.Signals[] = ['SIGINT', 'SIGTERM'];
      const listener = (signal: NodeJS.Signals) => {
        remove(); // a second Ctrl-C then ends the process at once
        handler(signal);
      };
      const remove = () => {
        for (const s of signals) process.off(s, listener);
      };
      for (const s of signals) process.on(s, listener);
      return remove;
    },
  };
}
