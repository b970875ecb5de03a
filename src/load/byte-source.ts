// The bytes of one source as a stream of chunks: gzip recognised by its magic bytes and inflated as it streams, BOM dropped.
import { PassThrough, Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGunzip } from 'node:zlib';

/** How far reading a source has got, for a progress display. */
export interface LoadProgress {
  /** The source being read, as it is named in positions. */
  file: string;
  /** Bytes read from the file or pipe so far (compressed bytes for gzip). */
  bytesRead: number;
  /** The file's size in bytes; undefined for standard input. */
  totalBytes: number | undefined;
  /** Lines read so far from this source. */
  lines: number;
}

/** Where a source's bytes failed: reading them, or inflating them. */
export type ReadFailure = { kind: 'read' | 'gzip'; message: string };

/** The chunks of a source, and what went wrong once they stop early. */
export interface SourceChunks {
  chunks: AsyncIterable<Buffer>;
  /** Whether the source is gzip (known after the first chunk was taken). */
  readonly gzip: boolean;
  /** Set once the chunks have ended because reading or inflating failed. */
  readonly failure: ReadFailure | undefined;
}

const UTF8_BOM = [0xef, 0xbb, 0xbf];

/**
 * Streams a source's plain bytes: when its first bytes are the gzip magic number 1f 8b they are
 * inflated as they come (a truncated or corrupt stream ends the chunks with a `gzip` failure), and
 * a leading UTF-8 byte order mark is dropped. `onRawBytes` hears how many raw bytes each read took.
 */
export function sourceChunks(input: NodeJS.ReadableStream, onRawBytes: (count: number) => void): SourceChunks {
  const state: { gzip: boolean; failure: ReadFailure | undefined } = { gzip: false, failure: undefined };
  async function* raw(): AsyncGenerator<Buffer> {
    for await (const chunk of input) {
      const bytes = typeof chunk === 'string' ? Buffer.from(chunk) : (chunk as Buffer);
      onRawBytes(bytes.length);
      yield bytes;
    }
  }
  async function* plain(): AsyncGenerator<Buffer> {
    const rawChunks = raw();
    let first: IteratorResult<Buffer>;
    try {
      first = await rawChunks.next();
    } catch (error) {
      state.failure = { kind: 'read', message: (error as Error).message };
      return;
    }
    if (first.done === true) return;
    state.gzip = first.value.length >= 2 && first.value[0] === 0x1f && first.value[1] === 0x8b;
    let chunks: AsyncIterable<Buffer> = prepend(first.value, rawChunks);
    if (state.gzip) chunks = inflate(chunks, state);
    let atStart = true;
    try {
      for await (const chunk of chunks) {
        if (atStart && chunk.length > 0) {
          atStart = false;
          if (UTF8_BOM.every((byte, index) => chunk[index] === byte)) {
            if (chunk.length > 3) yield chunk.subarray(3);
            continue;
          }
        }
        if (chunk.length > 0) yield chunk;
      }
    } catch (error) {
      state.failure ??= { kind: 'read', message: (error as Error).message };
    }
  }
  return {
    chunks: plain(),
    get gzip() {
      return state.gzip;
    },
    get failure() {
      return state.failure;
    },
  };
}

async function* prepend(first: Buffer, rest: AsyncIterator<Buffer>): AsyncGenerator<Buffer> {
  yield first;
  for (let next = await rest.next(); next.done !== true; next = await rest.next()) yield next.value;
}

/** Inflates gzip chunks as they stream; a zlib error ends them and is recorded as a `gzip` failure. */
async function* inflate(chunks: AsyncIterable<Buffer>, state: { failure: ReadFailure | undefined }): AsyncGenerator<Buffer> {
  const gunzip = createGunzip();
  const output = new PassThrough();
  let inputFailed = false;
  const source = Readable.from(
    (async function* () {
      try {
        for await (const chunk of chunks) yield chunk;
      } catch (error) {
        inputFailed = true;
        throw error;
      }
    })(),
  );
  const done = pipeline(source, gunzip, output).catch((error: Error) => {
    state.failure = { kind: inputFailed ? 'read' : 'gzip', message: error.message };
  });
  try {
    for await (const chunk of output) yield chunk as Buffer;
  } catch {
    // The pipeline's own rejection says what failed.
  }
  await done;
}
