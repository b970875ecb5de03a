// Turning the bytes of a source into text: UTF-8 checked, BOM dropped. The loader inflates gzip while
// it streams (byte-source.ts); `toSourceText` is for bytes already in hand (a git blob, an editor's file).
import { promisify } from 'node:util';
import { gunzip } from 'node:zlib';
import type { InputError } from './statement.js';

const gunzipAsync = promisify(gunzip);

/** The text of a source, or the error that kept it from being read. */
export type SourceText = { text: string } | { error: InputError };

/** Whether bytes start with the gzip magic number 1f 8b. */
export function isGzip(bytes: Uint8Array): boolean {
  return bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b;
}

/** Decompresses whole gzip bytes when they are gzip, then decodes them as `decodeText` does. */
export async function toSourceText(bytes: Uint8Array, file: string): Promise<SourceText> {
  if (!isGzip(bytes)) return decodeText(bytes, file);
  try {
    return decodeText(await gunzipAsync(bytes), file);
  } catch (error) {
    return {
      error: {
        file,
        line: 0,
        column: 0,
        message: `${file} starts as gzip but cannot be decompressed (${(error as Error).message}); it was not read.`,
        hint: 'the gzip stream is truncated or corrupt: check it with gzip -t, or compress the file again',
      },
    };
  }
}

/** Decodes UTF-8 bytes (dropping a BOM), or the error naming where the first invalid sequence starts. */
export function decodeText(plain: Uint8Array, file: string): SourceText {
  const decoder = new Utf8ChunkDecoder();
  const decoded = decoder.write(plain);
  const ending = decoded.invalid === undefined ? decoder.end() : decoded;
  if (ending.invalid !== undefined) return { error: invalidUtf8Error(file, ending.invalid, 'it was not read') };
  return { text: decoded.text + ending.text };
}

/** Where an invalid UTF-8 sequence starts: 1-based line and UTF-16 column. */
export interface InvalidUtf8 {
  line: number;
  column: number;
}

/** The text decoded from a chunk (up to an invalid sequence, when there is one) and where that sequence starts. */
export interface DecodedChunk {
  text: string;
  invalid: InvalidUtf8 | undefined;
}

/** The error for text that is not UTF-8; `kept` says what was made of the source (e.g. "it was not read"). */
export function invalidUtf8Error(file: string, invalid: InvalidUtf8, kept: string): InputError {
  return {
    file,
    line: invalid.line,
    column: invalid.column,
    message: `${file} is not valid UTF-8 text: an invalid byte sequence starts at line ${invalid.line}, column ${invalid.column}; ${kept}.`,
    hint: 'RDF files are UTF-8 text: save the file as UTF-8 (for example with iconv -f LATIN1 -t UTF-8)',
  };
}

/**
 * Decodes UTF-8 that arrives in chunks, checking it as it comes: a character cut by a chunk's end
 * waits for the next chunk, a leading BOM is dropped, and the first invalid sequence is placed by
 * the line (counted at LF) and column it has in the whole text. Nothing but the cut character and
 * the current line's length is kept between chunks.
 */
export class Utf8ChunkDecoder {
  /** The start of a character cut off at the end of the last chunk. */
  private carry: Uint8Array | undefined;
  private atStart = true;
  private newlines = 0;
  /** UTF-16 length of the decoded text since the last LF. */
  private lineLength = 0;
  private stopped = false;

  /** How many LFs the text decoded so far holds. */
  get lineBreaks(): number {
    return this.newlines;
  }

  /** Decodes the next chunk up to its last whole character; after an invalid sequence, nothing more is decoded. */
  write(bytes: Uint8Array): DecodedChunk {
    if (this.stopped) return { text: '', invalid: undefined };
    let piece = bytes;
    if (this.carry !== undefined) {
      piece = new Uint8Array(this.carry.length + bytes.length);
      piece.set(this.carry);
      piece.set(bytes, this.carry.length);
      this.carry = undefined;
    }
    const whole = wholeCharactersLength(piece);
    if (whole < piece.length) this.carry = piece.slice(whole);
    return this.decode(piece.subarray(0, whole));
  }

  /** Ends the text: a character still cut off is an invalid sequence. */
  end(): DecodedChunk {
    const rest = this.carry;
    this.carry = undefined;
    if (this.stopped || rest === undefined) return { text: '', invalid: undefined };
    return this.decode(rest);
  }

  private decode(piece: Uint8Array): DecodedChunk {
    if (piece.length === 0) return { text: '', invalid: undefined };
    const atStart = this.atStart;
    this.atStart = false;
    try {
      // TextDecoder drops a leading UTF-8 BOM unless told otherwise, which only the text's start wants.
      const text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: !atStart }).decode(piece);
      this.count(text);
      return { text, invalid: undefined };
    } catch {
      this.stopped = true;
      const found = firstInvalidSequence(piece, atStart);
      this.count(found.before);
      return { text: found.before, invalid: { line: this.newlines + 1, column: this.lineLength + 1 } };
    }
  }

  private count(text: string): void {
    const last = text.lastIndexOf('\n');
    if (last < 0) {
      this.lineLength += text.length;
      return;
    }
    for (let index = text.indexOf('\n'); index >= 0; index = text.indexOf('\n', index + 1)) this.newlines++;
    this.lineLength = text.length - last - 1;
  }
}

/** The length of a chunk's bytes up to the start of a character cut off at its end (all of it when none is). */
function wholeCharactersLength(bytes: Uint8Array): number {
  for (let back = 1; back <= 3 && back <= bytes.length; back++) {
    const byte = bytes[bytes.length - back];
    if ((byte & 0xc0) === 0x80) continue;
    if (byte < 0xc0) return bytes.length;
    const needed = byte >= 0xf0 ? 4 : byte >= 0xe0 ? 3 : 2;
    return needed > back ? bytes.length - back : bytes.length;
  }
  return bytes.length;
}

/** The 1-based line and UTF-16 column where the first invalid UTF-8 sequence starts. */
export function firstInvalidUtf8(bytes: Uint8Array): { line: number; column: number } {
  const { before } = firstInvalidSequence(bytes, true);
  const lineStart = before.lastIndexOf('\n') + 1;
  let line = 1;
  for (let index = 0; index < lineStart; index++) if (before.charCodeAt(index) === 10) line++;
  return { line, column: before.length - lineStart + 1 };
}

/** The whole characters before the first invalid UTF-8 sequence of some bytes, decoded. */
function firstInvalidSequence(bytes: Uint8Array, atStart: boolean): { before: string } {
  // A prefix that decodes (allowing a cut-off last character) stays valid when shortened,
  // so the longest valid prefix can be found by bisection.
  let valid = 0;
  let invalid = bytes.length;
  while (invalid - valid > 1) {
    const middle = Math.floor((valid + invalid) / 2);
    if (decodesAsPrefix(bytes.subarray(0, middle))) valid = middle;
    else invalid = middle;
  }
  // The last character before the bad byte may be cut off; in stream mode it is held back, not decoded.
  const before = new TextDecoder('utf-8', { ignoreBOM: !atStart }).decode(bytes.subarray(0, valid), { stream: true });
  return { before };
}

function decodesAsPrefix(bytes: Uint8Array): boolean {
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes, { stream: true });
    return true;
  } catch {
    return false;
  }
}
