/** Where the command line writes; injectable so the CLI can be tested in-process. */
export interface CliIo {
  out(text: string): void;
  err(text: string): void;
  /** true when stderr is a terminal (progress bars only then) */
  errIsTTY: boolean;
  cwd: string;
}

export function processIo(): CliIo {
  return {
    out: (t) => process.stdout.write(t),
    err: (t) => process.stderr.write(t),
    errIsTTY: Boolean(process.stderr.isTTY),
    cwd: process.cwd(),
  };
}
