// The progress bar: drawn on standard error only when it is a terminal, never in CI, with -q or --no-progress, never on stdout.
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { Readable, Writable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { LoadProgressBar } from '../../src/cli/progress.js';
import { fakeTerminal, folderWith, type FakeTerminal } from './terminal-fake.js';

/** A writable stream that says it is a terminal and keeps what is written to it. */
function fakeTtyStream(): Writable & { isTTY: boolean; columns: number; written: string[] } {
  const written: string[] = [];
  const stream = new Writable({
    write(chunk, _encoding, done) {
      written.push(String(chunk));
      done();
    },
  }) as Writable & { isTTY: boolean; columns: number; written: string[] };
  // cli-progress moves the cursor through node:readline, which needs only write() on the stream.
  stream.isTTY = true;
  stream.columns = 120;
  stream.written = written;
  return stream;
}

const LINE = '<https://data.northvale-rail.example/def/Bogie> <http://www.w3.org/2000/01/rdf-schema#subClassOf> <https://data.northvale-rail.example/def/Assembly> .\n';

/** A folder with an N-Triples file large enough for several chunks, and a terminal whose stderr is a fake TTY. */
function setUp(env: Record<string, string> = {}): { dir: string; terminal: FakeTerminal; tty: ReturnType<typeof fakeTtyStream> } {
  const dir = folderWith({});
  writeFileSync(path.join(dir, 'assets.nt'), LINE.repeat(30_000));
  const terminal = fakeTerminal(dir);
  const tty = fakeTtyStream();
  terminal.errStream = tty;
  terminal.env = env;
  return { dir, terminal, tty };
}

describe('the progress bar of isapart check', () => {
  it('is drawn on a terminal standard error with the file, bytes, lines/s, and never on standard output', async () => {
    const { terminal, tty } = setUp();
    const code = await main(['check', 'assets.nt', '--fail-on', 'never'], terminal);
    expect(code).toBe(0);
    const drawn = tty.written.join('');
    expect(drawn).toContain('reading assets.nt');
    expect(drawn).toMatch(/\d+(\.\d)? MB of \d+(\.\d)? MB/);
    expect(drawn).toContain('lines/s');
    expect(terminal.stdout.join('')).not.toContain('reading assets.nt');
    expect(terminal.stdout.join('')).toContain('statements read');
  });

  it.each([
    { name: '--no-progress', args: ['--no-progress'], env: {} as Record<string, string> },
    { name: '-q', args: ['-q'], env: {} },
    { name: 'CI=true', args: [], env: { CI: 'true' } },
  ])('is not drawn with $name', async ({ args, env }) => {
    const { terminal, tty } = setUp(env);
    await main(['check', 'assets.nt', '--fail-on', 'never', ...args], terminal);
    expect(tty.written.join('')).toBe('');
  });

  it('is not drawn when standard error is not a terminal', async () => {
    const { terminal, tty } = setUp();
    tty.isTTY = false;
    await main(['check', 'assets.nt', '--fail-on', 'never'], terminal);
    expect(tty.written.join('')).toBe('');
  });

  it('shows a spinner with bytes and lines for standard input, whose size is unknown', async () => {
    const { terminal, tty } = setUp();
    terminal.stdin = Readable.from([Buffer.from(LINE.repeat(20_000))]);
    await main(['check', '-', '--fail-on', 'never'], terminal);
    const drawn = tty.written.join('');
    expect(drawn).toContain('reading <stdin>');
    expect(drawn).toMatch(/lines \| [\d,]+ lines\/s|[\d,]+ lines \|/);
    expect(drawn).not.toContain(' of ');
  });

  it('gives the time left for a file of known size', () => {
    const tty = fakeTtyStream();
    const bar = new LoadProgressBar(tty);
    bar.update({ file: 'big.nt', bytesRead: 1_000_000, totalBytes: 10_000_000, lines: 10_000 });
    bar.update({ file: 'big.nt', bytesRead: 5_000_000, totalBytes: 10_000_000, lines: 50_000 });
    bar.stop();
    const drawn = tty.written.join('');
    expect(drawn).toContain('reading big.nt');
    expect(drawn).toContain('10% | 1.0 MB of 10.0 MB');
  });
});
