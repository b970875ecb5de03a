// Byte strings appended into fixed-size blocks, addressed by one offset: storage that grows without copying.

/** Bytes per block: 2^20, so an offset is block * 2^20 + place in the block. */
const BLOCK_BITS = 20;
const BLOCK_BYTES = 1 << BLOCK_BITS;
const PLACE_MASK = BLOCK_BYTES - 1;
/** Bytes of the first block at first: a small source's tables stay small. */
const FIRST_BLOCK_BYTES = 1 << 16;

/**
 * Append-only storage of byte strings. Each string lies whole inside one block (a string longer
 * than a block gets blocks of its own), so growing never copies what is stored and never holds an
 * old and a new copy at once, as a doubling buffer does; at most one block is partly empty. Only
 * the first block starts smaller, at 64 KiB, and doubles (copied) until it is a whole block.
 * Offsets are below 2^31, so an arena holds up to 2 GiB.
 */
export class ByteArena {
  /** Block i holds the offsets i * 2^20 up to the next block's; a long string's extra slots repeat its block. */
  private readonly blocks: Buffer[] = [];
  /** The next free offset. */
  private used = 0;
  private allocated = 0;

  /** Stores bytes[start..end) and returns its offset. */
  append(bytes: Uint8Array, start: number, end: number): number {
    const length = end - start;
    if (length === 0) return 0;
    let offset = this.used;
    if (offset + length > this.blocks.length * BLOCK_BYTES) offset = this.addBlocks(length);
    let block = this.blocks[offset >>> BLOCK_BITS];
    const place = offset & PLACE_MASK;
    if (place + length > block.length) block = this.growFirstBlock(place + length);
    block.set(bytes.subarray(start, end), place);
    // After a string with blocks of its own, the next string starts a new block.
    this.used = length > BLOCK_BYTES ? this.blocks.length * BLOCK_BYTES : offset + length;
    return offset;
  }

  /** The block that holds the string at `offset`. */
  blockOf(offset: number): Buffer {
    return this.blocks[offset >>> BLOCK_BITS];
  }

  /** Where the string at `offset` starts in its block. */
  placeOf(offset: number): number {
    return offset & PLACE_MASK;
  }

  /** The stored string at `offset`, `length` bytes long, decoded as UTF-8. */
  text(offset: number, length: number): string {
    if (length === 0) return '';
    const place = offset & PLACE_MASK;
    return this.blocks[offset >>> BLOCK_BITS].toString('utf8', place, place + length);
  }

  /** Whether the stored string at `offset` (`length` bytes) starts with `prefix`. */
  startsWith(offset: number, length: number, prefix: Uint8Array): boolean {
    if (prefix.length > length) return false;
    if (prefix.length === 0) return true;
    const block = this.blocks[offset >>> BLOCK_BITS];
    // A loop, not Buffer.compare: prefixes are short and most differ early, where a native call costs more than the bytes.
    for (let index = 0, place = offset & PLACE_MASK; index < prefix.length; index++, place++) {
      if (block[place] !== prefix[index]) return false;
    }
    return true;
  }

  /** Bytes the blocks take, used or not. */
  get allocatedBytes(): number {
    return this.allocated;
  }

  /** Starts a new block (or, for a string longer than a block, enough of them) and returns the offset of its start. */
  private addBlocks(length: number): number {
    const count = Math.max(1, Math.ceil(length / BLOCK_BYTES));
    if ((this.blocks.length + count) * BLOCK_BYTES > 2 ** 31) {
      throw new RangeError('more than 2 GiB of distinct term and literal text: too large for one run');
    }
    // Not from Node's shared pool: each block lives as long as the run.
    const small = this.blocks.length === 0 && length <= FIRST_BLOCK_BYTES;
    const block = Buffer.allocUnsafeSlow(small ? FIRST_BLOCK_BYTES : count * BLOCK_BYTES);
    this.allocated += block.length;
    const offset = this.blocks.length * BLOCK_BYTES;
    for (let slot = 0; slot < count; slot++) this.blocks.push(block);
    return offset;
  }

  /** Grows the first block, the only one shorter than a block, to hold `needed` bytes, and returns it. */
  private growFirstBlock(needed: number): Buffer {
    const old = this.blocks[0];
    const grown = Buffer.allocUnsafeSlow(Math.min(BLOCK_BYTES, Math.max(needed, old.length * 2)));
    old.copy(grown, 0, 0, this.used);
    this.blocks[0] = grown;
    this.allocated += grown.length - old.length;
    return grown;
  }
}
