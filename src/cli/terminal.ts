// The process seen from the CLI: output streams, standard input, environment and working folder.

/** What the commands need from the process; tests pass their own. */
export interface Terminal {
  out(text: string): void;
  err(text: string): void;
  /** Whether standard output is a terminal (colour is off otherwise). */
  outIsTty: boolean;
  /** Standard error as a stream, for the progress bar (drawn only when it is a terminal). */
  errStream?: NodeJS.WritableStream & { isTTY?: boolean };
  env: Record<string, string | undefined>;
  stdin: NodeJS.ReadableStream;
  cwd: string;
}

/** The real process's terminal. */
export function processTerminal(): Terminal {
  return {
    out: (text) => process.stdout.write(text),
    err: (text) => process.stderr.write(text),
    outIsTty: Boolean(process.stdout.isTTY),
    errStream: process.stderr,
    env: process.env,
    stdin: process.stdin,
    cwd: process.cwd(),
  };
}
