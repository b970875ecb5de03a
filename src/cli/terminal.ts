// The process seen from the CLI: output streams, standard input, environment and working folder.

/** What the commands need from the process; tests pass their own. */
export interface Terminal {
  out(text: string): void;
  err(text: string): void;
  /** Whether standard output is a terminal (colour is off otherwise). */
  outIsTty: boolean;
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
    env: process.env,
    stdin: process.stdin,
    cwd: process.cwd(),
  };
}
