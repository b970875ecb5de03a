// The progress bar of `isapart check` on standard error: bytes read, lines per second, and the time left.
import cliProgress from 'cli-progress';
import type { LoadProgress } from '../load/byte-source.js';
import type { Terminal } from './terminal.js';

/** A stream the bar can draw on; only a terminal (isTTY) gets one. */
export type ProgressStream = NodeJS.WritableStream & { isTTY?: boolean; columns?: number };

/** Spinner frames for standard input, whose size is not known (common practice in terminal tools). */
const SPINNER = ['|', '/', '-', '\\'];

/**
 * Whether to draw the bar: asked for (no `--no-progress`), not `--quiet`, standard error is a
 * terminal, and not in CI (the `CI` variable that CI services set).
 */
export function progressWanted(options: { progress: boolean; quiet?: boolean }, terminal: Terminal): boolean {
  const ci = terminal.env.CI;
  const inCi = ci !== undefined && ci !== '' && ci !== '0' && ci.toLowerCase() !== 'false';
  return options.progress && options.quiet !== true && terminal.errStream?.isTTY === true && !inCi;
}

/** Megabytes with one decimal. */
function megabytes(bytes: number): string {
  return `${(bytes / 1e6).toFixed(1)} MB`;
}

/**
 * Draws the reading of the sources as one bar on a terminal stream: for a file of known size, how
 * much of it is read, the rate in lines per second and the time left; for standard input, a
 * spinner with the bytes and lines read so far. It never writes to standard output.
 */
export class LoadProgressBar {
  private readonly bar: cliProgress.SingleBar;
  private file: string | undefined;
  private fileStart = 0;
  private frame = 0;
  private started = false;

  constructor(stream: ProgressStream) {
    this.bar = new cliProgress.SingleBar({
      stream,
      format: (_options, params, payload: Record<string, string>) =>
        payload.known === 'yes'
          ? `reading ${payload.file} [${bar(params.progress)}] ${Math.floor(params.progress * 100)}% | ${payload.read} of ${payload.size} | ${payload.rate} lines/s | ${params.eta > 0 ? `${params.eta} s left` : ''}`
          : `reading ${payload.file} ${payload.spinner} ${payload.read} | ${payload.lines} lines | ${payload.rate} lines/s`,
      clearOnComplete: true,
      hideCursor: false,
      fps: 10,
      etaBuffer: 50,
    });
  }

  /** Shows how far a source has got (call it as often as the loader reports). */
  update(progress: LoadProgress): void {
    const now = Date.now();
    if (progress.file !== this.file) {
      this.file = progress.file;
      this.fileStart = now;
    }
    const seconds = Math.max((now - this.fileStart) / 1000, 0.001);
    const known = progress.totalBytes !== undefined && progress.totalBytes > 0;
    const payload = {
      file: progress.file,
      known: known ? 'yes' : 'no',
      read: megabytes(progress.bytesRead),
      size: known ? megabytes(progress.totalBytes ?? 0) : '',
      lines: progress.lines.toLocaleString('en'),
      rate: Math.round(progress.lines / seconds).toLocaleString('en'),
      spinner: SPINNER[this.frame++ % SPINNER.length],
    };
    const total = known ? (progress.totalBytes ?? 1) : Math.max(progress.bytesRead, 1);
    if (!this.started) {
      this.started = true;
      this.bar.start(total, progress.bytesRead, payload);
      return;
    }
    if (this.bar.getTotal() !== total) this.bar.setTotal(total);
    this.bar.update(progress.bytesRead, payload);
  }

  /** Removes the bar, so that what is printed next starts on a clean line. */
  stop(): void {
    if (this.started) this.bar.stop();
  }
}

/** A bar of 30 characters for a fraction 0..1. */
function bar(fraction: number): string {
  const filled = Math.round(Math.min(Math.max(fraction, 0), 1) * 30);
  return '='.repeat(filled) + ' '.repeat(30 - filled);
}
