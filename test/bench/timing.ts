// Timing helpers the benchmarks share: the median of repeated measures, and one timed call.
import { performance } from 'node:perf_hooks';

/** Median of a list of numbers. */
export function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** Milliseconds one call takes, and what it returned. */
export function timed<T>(work: () => T): { ms: number; value: T } {
  const start = performance.now();
  const value = work();
  return { ms: performance.now() - start, value };
}
