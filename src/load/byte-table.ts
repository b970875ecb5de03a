// A hash table keyed by byte ranges, so a term seen before is found without decoding it to a string.
import { ByteArena } from './byte-arena.js';

const EMPTY = -1;
/** How many bytes from a key's end go into its hash; IRIs of one dump share long starts and differ at the end. */
const HASHED_TAIL = 32;

/**
 * Maps byte strings to numbers. Keys are copied into a ByteArena, in the order they are set, and
 * can be read back by that entry number; lookups hash the key's length and last bytes, then
 * compare the whole key, so finding a known term costs no allocation. Open addressing with linear
 * probing, kept at most half full.
 */
export class ByteTable {
  private slots: Int32Array = new Int32Array(1 << 12).fill(EMPTY);
  private hashes: Int32Array = new Int32Array(1 << 11);
  private starts: Int32Array = new Int32Array(1 << 11);
  private lengths: Int32Array = new Int32Array(1 << 11);
  private values: Int32Array = new Int32Array(1 << 11);
  private readonly arena = new ByteArena();
  private count = 0;

  /** How many keys are stored; entry numbers are 0..size-1 in the order they were set. */
  get size(): number {
    return this.count;
  }

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

  /** Stores a number for bytes[start..end), which must not be in the table yet, and returns the key's entry number. */
  set(bytes: Buffer, start: number, end: number, value: number): number {
    if ((this.count + 1) * 2 > this.slots.length) this.growSlots();
    if (this.count === this.values.length) this.growEntries();
    const entry = this.count++;
    const hash = hashOf(bytes, start, end);
    this.hashes[entry] = hash;
    this.starts[entry] = this.arena.append(bytes, start, end);
    this.lengths[entry] = end - start;
    this.values[entry] = value;
    this.place(entry, hash);
    return entry;
  }

  /** The key of an entry, decoded as UTF-8. */
  keyText(entry: number): string {
    return this.arena.text(this.starts[entry], this.lengths[entry]);
  }

  /** Whether the key of an entry starts with the bytes of `prefix`. */
  keyStartsWith(entry: number, prefix: Uint8Array): boolean {
    return this.arena.startsWith(this.starts[entry], this.lengths[entry], prefix);
  }

  /** Bytes the table takes: its arena's blocks and its columns. */
  get allocatedBytes(): number {
    return this.arena.allocatedBytes + 4 * (this.slots.length + 4 * this.values.length);
  }

  /** Whether bytes[start..end) equal the key stored from `entryStart`, compared from the end, where IRIs differ. */
  private sameBytes(bytes: Buffer, start: number, end: number, entryStart: number): boolean {
    if (end === start) return true;
    const block = this.arena.blockOf(entryStart);
    const place = this.arena.placeOf(entryStart);
    for (let index = end - 1, other = place + (end - start) - 1; index >= start; index--, other--) {
      if (bytes[index] !== block[other]) return false;
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
