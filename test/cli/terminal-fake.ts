// A Terminal for tests: captures output, takes stdin text, runs in a given folder.
import { Readable } from 'node:stream';
import type { Terminal } from '../../src/cli/terminal.js';

/** A captured terminal and what was written to it. */
export interface FakeTerminal extends Terminal {
  stdout: string[];
  stderr: string[];
}

/** Makes a terminal whose stdin holds `input` and whose output is captured. */
export function fakeTerminal(cwd: string, input = '', tty = false): FakeTerminal {
  const stdout: string[] = [];
  const stderr: string[] = [];
  return {
    stdout,
    stderr,
    out: (text) => void stdout.push(text),
    err: (text) => void stderr.push(text),
    outIsTty: tty,
    env: {},
    stdin: Readable.from([input]),
    cwd,
  };
}
