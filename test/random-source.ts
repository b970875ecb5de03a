// One seeded pseudo-random generator for tests and benchmarks, so a failure or a run can be replayed.

/** mulberry32: a small, fast, deterministic 32-bit generator (common practice for reproducible tests); values in [0, 1). */
export function randomSource(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let value = state;
    value = Math.imul(value ^ (value >>> 15), value | 1);
    value ^= value + Math.imul(value ^ (value >>> 7), value | 61);
    return ((value ^ (value >>> 14)) >>> 0) / 4294967296;
  };
}
