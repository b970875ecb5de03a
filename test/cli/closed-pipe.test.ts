// A reader that closes the pipe early (`isapart ... | head`) ends the run quietly, without a stack trace.
import { spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** Runs the built command, closes its standard output after the first chunk, and collects what it wrote to stderr. */
function runAndCloseEarly(args: string[]): Promise<{ code: number | null; stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [path.join(root, 'bin/isapart.js'), ...args], { cwd: root });
    let stderr = '';
    child.stderr.on('data', (chunk) => (stderr += chunk));
    child.stdout.once('data', () => child.stdout.destroy());
    child.on('close', (code) => resolve({ code, stderr }));
  });
}

describe('a closed output pipe', () => {
  it('ends a long report quietly', async () => {
    // 5,000 classes with no superclass: a report of megabytes, far more than one pipe buffer, so writes go on after the close.
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-pipe-'));
    const lines = Array.from({ length: 5_000 }, (_, i) => `<https://data.northvale-rail.example/def/C${i}> <http://www.w3.org/1999/02/22-rdf-syntax-ns#type> <http://www.w3.org/2002/07/owl#Class> .`);
    writeFileSync(path.join(dir, 'classes.nt'), lines.join('\n') + '\n');
    const { code, stderr } = await runAndCloseEarly(['check', path.join(dir, 'classes.nt'), '--format', 'json', '--fail-on', 'never']);
    expect(stderr).not.toMatch(/EPIPE|Error/);
    expect(code).toBe(0);
  });
});
