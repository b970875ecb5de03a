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
  try {
    // TextDecoder drops a leading UTF-8 BOM unless told otherwise.
    return { text: new TextDecoder('utf-8', { fatal: true }).decode(plain) };
  } catch {
    const { line, column } = firstInvalidUtf8(plain);
    return {
      error: {
        file,
        line,
        column,
        message: `${file} is not valid UTF-8 text: an invalid byte sequence starts at line ${line}, column ${column}; it was not read.`,
        hint: 'RDF files are UTF-8 text: save the file as UTF-8 (for example with iconv -f LATIN1 -t UTF-8)',
      },
    };
  }
}

/** The 1-based line and UTF-16 column where the first invalid UTF-8 sequence starts. */
export function firstInvalidUtf8(bytes: Uint8Array): { line: number; column: number } {
  // A prefix that decodes (allowing a cut-off last character) stays valid when shortened,
  // so the longest valid prefix can be found by bisection.
  let valid = 0;
  let invalid = bytes.length;
  while (invalid - valid > 1) {
    const middle = Math.floor((valid + invalid) / 2);
    if (decodesAsPrefix(bytes.subarray(0, middle))) valid = middle;
    else invalid = middle;
  }
  const before = new TextDecoder('utf-8').decode(bytes.subarray(0, valid));
  const lineStart = before.lastIndexOf('\n') + 1;
  // The last character before the bad byte may be cut off and decode to U+FFFD; drop it.
  const lineText = before.slice(lineStart).replace(/\ufffd$/, '');
  let line = 1;
  for (let index = 0; index < lineStart; index++) if (before.charCodeAt(index) === 10) line++;
  return { line, column: lineText.length + 1 };
}

function decodesAsPrefix(bytes: Uint8Array): boolean {
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes, { stream: true });
    return true;
  } catch {
    return false;
  }
}
