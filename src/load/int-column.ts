// A growable column of 32-bit integers, the storage of the loader's tables.

/** Rows a column holds before it first grows. */
const INITIAL_ROWS = 1024;

/** A growable column of 32-bit integers. */
export class IntColumn {
  values = new Int32Array(INITIAL_ROWS);

  /** Makes room for `rows` values, growing by half so that appending stays amortised constant time. */
  reserve(rows: number): void {
    if (rows <= this.values.length) return;
    const grown = new Int32Array(Math.max(rows, Math.ceil(this.values.length * 1.5)));
    grown.set(this.values);
    this.values = grown;
  }
}
