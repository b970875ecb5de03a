// Runs one benchmark measure as a child process: wall time, peak RSS, and bounds on time and memory.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';

/** Limits past which a child is stopped and its cell reported as skipped. */
export interface ChildBounds {
  timeoutMs: number;
  maxRssBytes: number;
}

/** What one child run gave. */
export interface ChildResult {
  wallMs: number;
  /** Peak resident set size as the child's own getrusage reports it at exit; null if it never got there. */
  maxRssBytes: number | null;
  /** User plus system CPU time of the whole process, from the same report; null with it. */
  cpuMs: number | null;
  exitCode: number | null;
  stdout: string;
  stderr: string;
  /** Why the child was stopped, when it was. */
  stopped?: string;
}

const RSS_MARKER = 'isapart-bench-max-rss-kb:';
/**
 * Preloaded into every child: on exit, print the process's peak RSS (process.resourceUsage().maxRSS,
 * in kilobytes) and its CPU time (microseconds) to stderr, so the figures cover every thread of the
 * process, wasm memory included.
 */
const RSS_PRELOAD = `data:text/javascript,process.on("exit",()=>{const u=process.resourceUsage();process.stderr.write("\\n${RSS_MARKER}"+u.maxRSS+" "+(u.userCPUTime+u.systemCPUTime)+"\\n")})`;
/** How often the memory bound is checked. */
const POLL_MS = 500;

/** The child's current resident set size from /proc, or 0 where /proc is not there. */
function currentRssBytes(pid: number): number {
  try {
    const match = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return match ? Number(match[1]) * 1024 : 0;
  } catch {
    return 0;
  }
}

/** Runs `node [nodeOptions] ...args` in `cwd`, bounded, and collects its output, wall time and peak RSS. */
export function runNodeChild(args: string[], cwd: string, bounds: ChildBounds, nodeOptions: string[] = []): Promise<ChildResult> {
  return new Promise((resolve, reject) => {
    const start = performance.now();
    const child = spawn(process.execPath, ['--import', RSS_PRELOAD, ...nodeOptions, ...args], { cwd, stdio: ['ignore', 'pipe', 'pipe'] });
    const stdout: Buffer[] = [];
    const stderr: Buffer[] = [];
    let stopped: string | undefined;
    child.stdout.on('data', (chunk: Buffer) => stdout.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => stderr.push(chunk));
    const stop = (reason: string): void => {
      if (stopped) return;
      stopped = reason;
      child.kill('SIGKILL');
    };
    const timer = setTimeout(() => stop(`stopped after ${(bounds.timeoutMs / 60_000).toFixed(0)} min`), bounds.timeoutMs);
    const poll = setInterval(() => {
      const rss = child.pid ? currentRssBytes(child.pid) : 0;
      if (rss > bounds.maxRssBytes) stop(`stopped at ${(rss / 2 ** 30).toFixed(1)} GiB RSS`);
    }, POLL_MS);
    child.on('error', reject);
    child.on('close', (exitCode) => {
      const wallMs = performance.now() - start;
      clearTimeout(timer);
      clearInterval(poll);
      let errorText = Buffer.concat(stderr).toString('utf8');
      let maxRssBytes: number | null = null;
      let cpuMs: number | null = null;
      const markerAt = errorText.lastIndexOf(`\n${RSS_MARKER}`);
      if (markerAt !== -1) {
        const [kilobytes, micros] = errorText.slice(markerAt + RSS_MARKER.length + 1).trim().split(' ');
        maxRssBytes = Number(kilobytes) * 1024;
        cpuMs = Number(micros) / 1000;
        errorText = errorText.slice(0, markerAt);
      }
      resolve({ wallMs, maxRssBytes, cpuMs, exitCode, stdout: Buffer.concat(stdout).toString('utf8'), stderr: errorText, stopped });
    });
  });
}
