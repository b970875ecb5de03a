// A hash table keyed by byte ranges, so a term seen before is found without decoding it to a string.

const EMPTY = -1;
/** How many bytes from a key's end go into its hash; IRIs of one dump share long starts and differ at the end. */
const HASHED_TAIL = 32;

/**
 * Maps byte strings to numbers. Keys are copied into one arena; lookups hash the key's length and
 * last bytes, then compare the whole key natively (`Buffer.compare`), so finding a known term
 * costs no allocation. Open addressing with linear probing, kept at most half full.
 */
export class ByteTable {
  private slots: Int32Array = new Int32Array(1 << 12).fill(EMPTY);
  private hashes: Int32Array = new Int32Array(1 << 11);
  private starts: Int32Array = new Int32Array(1 << 11);
  private lengths: Int32Array = new Int32Array(1 << 11);
  private values: Int32Array = new Int32Array(1 << 11);
  private arena = Buffer.alloc(1 << 16);
  private arenaUsed = 0;
  private count = 0;

  /** The number stored for bytes[start..end), or -1 when the key is not in the table. */
  get(bytes: Buffer, start: number, end: number): number {
    const hash = hashOf(bytes, start, end);
    const mask = this.slots.length - 1;
    for (let slot = hash & mask; ; slot = (slot + 1) & mask) {
      const entry = this.slots[slot];
      if (entry === EMPTY) return -1;
      if (this.hashes[entry] === hash && this.lengths[entry] === end - start) {
        if (this.sameBytes(bytes, start, end, this.starts[entry])) return this.values[entry];
      }
    }
  }

  /** Stores a number for bytes[start..end), which must not be in the table yet. */
  set(bytes: Buffer, start: number, end: number, value: number): void {
    if ((this.count + 1) * 2 > this.slots.length) this.growSlots();
    if (this.count === this.values.length) this.growEntries();
    const length = end - start;
    if (this.arenaUsed + length > this.arena.length) {
      // Growing by half, not doubling: for millions of terms the arena is one of the largest buffers of a run.
      const grown = Buffer.allocUnsafe(Math.max(Math.ceil(this.arena.length * 1.5), this.arenaUsed + length));
      this.arena.copy(grown, 0, 0, this.arenaUsed);
      this.arena = grown;
    }
    bytes.copy(this.arena, this.arenaUsed, start, end);
    const entry = this.count++;
    const hash = hashOf(bytes, start, end);
    this.hashes[entry] = hash;
    this.starts[entry] = this.arenaUsed;
    this.lengths[entry] = length;
    this.values[entry] = value;
    this.arenaUsed += length;
    this.place(entry, hash);
  }

  /** Whether bytes[start..end) equal the arena's bytes from `entryStart`, compared from the end, where IRIs differ. */
  private sameBytes(bytes: Buffer, start: number, end: number, entryStart: number): boolean {
    const { arena } = this;
    for (let index = end - 1, other = entryStart + (end - start) - 1; index >= start; index--, other--) {
      if (bytes[index] !== arena[other]) return false;
    }
    return true;
  }

  private place(entry: number, hash: number): void {
    const mask = this.slots.length - 1;
    let slot = hash & mask;
    while (this.slots[slot] !== EMPTY) slot = (slot + 1) & mask;
    this.slots[slot] = entry;
  }

  private growSlots(): void {
    this.slots = new Int32Array(this.slots.length * 2).fill(EMPTY);
    for (let entry = 0; entry < this.count; entry++) this.place(entry, this.hashes[entry]);
  }

  private growEntries(): void {
    const size = Math.ceil(this.values.length * 1.5);
    const grow = (column: Int32Array): Int32Array => {
      const grown = new Int32Array(size);
      grown.set(column);
      return grown;
    };
    this.hashes = grow(this.hashes);
    this.starts = grow(this.starts);
    this.lengths = grow(this.lengths);
    this.values = grow(this.values);
  }
}

/** FNV-1a over the length and the last HASHED_TAIL bytes (common practice for short keys). */
function hashOf(bytes: Buffer, start: number, end: number): number {
  let hash = Math.imul(0x811c9dc5 ^ (end - start), 0x01000193);
  for (let index = Math.max(start, end - HASHED_TAIL); index < end; index++) hash = Math.imul(hash ^ bytes[index], 0x01000193);
  return hash & 0x7fffffff;
}
