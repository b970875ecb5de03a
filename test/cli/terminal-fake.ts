// Test helpers for the CLI: a Terminal that captures output and takes stdin text, temp folders, runs.
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { main } from '../../src/cli/main.js';
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

/** A fresh temporary folder holding the given files (names may contain folders). */
export function folderWith(files: Record<string, string>): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'isapart-cli-'));
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(path.dirname(path.join(dir, name)), { recursive: true });
    writeFileSync(path.join(dir, name), text);
  }
  return dir;
}

/** Runs the CLI in a folder, with `input` on stdin, and returns the exit code and the output. */
export async function runCli(dir: string, args: string[], input = ''): Promise<{ code: number; out: string; err: string }> {
  const terminal = fakeTerminal(dir, input);
  const code = await main(args, terminal);
  return { code, out: terminal.stdout.join(''), err: terminal.stderr.join('') };
}
