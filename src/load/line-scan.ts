// Scanning one N-Triples or N-Quads line as bytes: where its terms are, when the line is simple enough to be sure.

/** What the scan found on a line; offsets are byte offsets into the buffer. */
export interface ScannedLine {
  /** Subject: `<IRI>` (start at `<`, end after `>`) or `_:label`. */
  subjectStart: number;
  subjectEnd: number;
  /** Predicate IRI, without its angle brackets. */
  predicateStart: number;
  predicateEnd: number;
  objectStart: number;
  objectEnd: number;
  /** For a literal object: its lexical form's bytes, then language tag or datatype IRI (without brackets); -1 when none. */
  literalEnd: number;
  languageStart: number;
  languageEnd: number;
  datatypeStart: number;
  datatypeEnd: number;
  /** Whether the literal's lexical form holds `\` escapes. */
  literalEscaped: boolean;
  /** N-Quads graph term, -1 when none. */
  graphStart: number;
  graphEnd: number;
  /** Offset of a `#` comment after the closing dot, -1 when none. */
  commentStart: number;
  /** Whether every term's bytes are ASCII, so latin1 decoding gives the same text as UTF-8. */
  ascii: boolean;
}

const TAB = 9;
const SPACE = 32;
const QUOTE = 34;
const HASH = 35;
const DOT = 46;
const LESS = 60;
const GREATER = 62;
const AT = 64;
const BACKSLASH = 92;
const CARET = 94;
const UNDERSCORE = 95;
const COLON = 58;
const DASH = 45;

/** Byte classes: 1 a byte that may stand inside an IRI written without escapes (N-Triples IRIREF), 2 also non-ASCII. */
const IRI_BYTE = new Uint8Array(256);
for (let byte = 0x21; byte < 0x7f; byte++) IRI_BYTE[byte] = 1;
for (const excluded of '<>"{}|^`\\') IRI_BYTE[excluded.charCodeAt(0)] = 0;
for (let byte = 0x80; byte < 0x100; byte++) IRI_BYTE[byte] = 2;

/** ASCII letters, digits and `_`: what a simple blank node label is made of (plus inner `.` and `-`). */
const LABEL_BYTE = new Uint8Array(256);
for (let byte = 0; byte < 128; byte++) {
  const char = String.fromCharCode(byte);
  if (/[A-Za-z0-9_]/.test(char)) LABEL_BYTE[byte] = 1;
}

function isLetter(byte: number): boolean {
  return (byte >= 65 && byte <= 90) || (byte >= 97 && byte <= 122);
}

function isSpace(byte: number): boolean {
  return byte === SPACE || byte === TAB;
}

/**
 * Reads the terms of a line `bytes[start..end)` (no line ending) into `found`. Returns false when
 * the line is not simple: anything the fast path cannot prove to read exactly as n3 reads it
 * (escapes in IRIs, relative IRIs, non-ASCII blank node labels, `\U` escapes, unusual punctuation,
 * a wrong number of terms, ...). Such a line is then read by n3 instead.
 */
export function scanLine(bytes: Uint8Array, start: number, end: number, quads: boolean, found: ScannedLine): boolean {
  found.ascii = true;
  let position = skipSpace(bytes, start, end);
  // Subject.
  found.subjectStart = position;
  position = scanTerm(bytes, position, end, found);
  if (position < 0) return false;
  found.subjectEnd = position;
  position = skipSpace(bytes, position, end);
  // Predicate: an IRI.
  if (bytes[position] !== LESS) return false;
  found.predicateStart = position + 1;
  position = scanIri(bytes, position, end, found);
  if (position < 0) return false;
  found.predicateEnd = position - 1;
  position = skipSpace(bytes, position, end);
  // Object: an IRI, a blank node or a literal.
  found.objectStart = position;
  found.literalEnd = -1;
  found.languageStart = -1;
  found.datatypeStart = -1;
  found.literalEscaped = false;
  if (bytes[position] === QUOTE) position = scanLiteral(bytes, position, end, found);
  else position = scanTerm(bytes, position, end, found);
  if (position < 0) return false;
  found.objectEnd = position;
  position = skipSpace(bytes, position, end);
  // An optional graph term in N-Quads.
  found.graphStart = -1;
  found.graphEnd = -1;
  if (quads && bytes[position] !== DOT) {
    found.graphStart = position;
    position = scanTerm(bytes, position, end, found);
    if (position < 0) return false;
    found.graphEnd = position;
    position = skipSpace(bytes, position, end);
  }
  if (position >= end || bytes[position] !== DOT) return false;
  position = skipSpace(bytes, position + 1, end);
  found.commentStart = -1;
  if (position < end) {
    if (bytes[position] !== HASH) return false;
    found.commentStart = position;
  }
  return true;
}

/** The offset of the first byte at or after `position` that is not a space or tab. */
export function skipSpace(bytes: Uint8Array, position: number, end: number): number {
  while (position < end && isSpace(bytes[position])) position++;
  return position;
}

/** An `<IRI>` or `_:label` term; returns the offset after it, -1 when not simple. */
function scanTerm(bytes: Uint8Array, position: number, end: number, found: ScannedLine): number {
  if (bytes[position] === LESS) return scanIri(bytes, position, end, found);
  if (bytes[position] === UNDERSCORE) return scanBlank(bytes, position, end);
  return -1;
}

/** `<IRI>` with no escapes, absolute (a scheme, then `:`); returns the offset after `>`. */
function scanIri(bytes: Uint8Array, position: number, end: number, found: ScannedLine): number {
  let index = position + 1;
  // A scheme: a letter, then letters, digits, + . -, then ':' (RFC 3986; n3 tests the same).
  if (index >= end || !isLetter(bytes[index])) return -1;
  index++;
  while (index < end) {
    const byte = bytes[index];
    if (byte === COLON) break;
    if (!(isLetter(byte) || (byte >= 48 && byte <= 57) || byte === 43 || byte === DOT || byte === DASH)) return -1;
    index++;
  }
  if (index >= end) return -1;
  for (index++; index < end; index++) {
    const byte = bytes[index];
    const kind = IRI_BYTE[byte];
    if (kind === 1) continue;
    if (kind === 2) {
      found.ascii = false;
      continue;
    }
    return byte === GREATER ? index + 1 : -1;
  }
  return -1;
}

/** `_:label` of ASCII letters, digits, `_`, `-` and single inner `.`s, followed by a space or tab; returns the offset after the label. */
function scanBlank(bytes: Uint8Array, position: number, end: number): number {
  if (position + 2 >= end || bytes[position + 1] !== COLON || LABEL_BYTE[bytes[position + 2]] !== 1) return -1;
  let index = position + 3;
  while (index < end && (LABEL_BYTE[bytes[index]] === 1 || bytes[index] === DASH || (bytes[index] === DOT && bytes[index - 1] !== DOT))) index++;
  // A label may not end in '.'; n3 would then read the dot as the statement's end.
  if (bytes[index - 1] === DOT) return -1;
  // A space must follow, so where the label ends is never in doubt.
  if (index >= end || !isSpace(bytes[index])) return -1;
  return index;
}

/** `"..."` with an optional `@lang` or `^^<IRI>`; returns the offset after it. */
function scanLiteral(bytes: Uint8Array, position: number, end: number, found: ScannedLine): number {
  let index = position + 1;
  for (; index < end; index++) {
    const byte = bytes[index];
    if (byte === QUOTE) break;
    if (byte === BACKSLASH) {
      const length = escapeLength(bytes, index, end);
      if (length < 0) return -1;
      found.literalEscaped = true;
      index += length - 1;
    } else if (byte >= 0x80) {
      found.ascii = false;
    }
  }
  if (index >= end) return -1;
  found.literalEnd = index;
  index++;
  if (bytes[index] === AT) {
    found.languageStart = index + 1;
    index = scanLanguage(bytes, index + 1, end);
    if (index < 0) return -1;
    found.languageEnd = index;
  } else if (bytes[index] === CARET) {
    if (bytes[index + 1] !== CARET || bytes[index + 2] !== LESS) return -1;
    found.datatypeStart = index + 3;
    index = scanIri(bytes, index + 2, end, found);
    if (index < 0) return -1;
    found.datatypeEnd = index - 1;
  }
  // A literal must be followed by a space, a tab or the dot.
  if (index < end && !isSpace(bytes[index]) && bytes[index] !== DOT) return -1;
  return index;
}

/** Length of a simple `\` escape at `index` (`\t \b \n \r \f \" \' \\`, or `\u` and 4 hex digits outside the surrogates), -1 otherwise. */
function escapeLength(bytes: Uint8Array, index: number, end: number): number {
  const next = bytes[index + 1];
  if (index + 1 >= end) return -1;
  if (next === 116 || next === 98 || next === 110 || next === 114 || next === 102 || next === QUOTE || next === 39 || next === BACKSLASH) {
    return 2;
  }
  if (next !== 117 || index + 5 >= end) return -1;
  let value = 0;
  for (let digit = index + 2; digit < index + 6; digit++) {
    const hex = hexValue(bytes[digit]);
    if (hex < 0) return -1;
    value = value * 16 + hex;
  }
  // A lone surrogate escape is left to n3 (common practice: such text is rare and its handling varies).
  return value >= 0xd800 && value <= 0xdfff ? -1 : 6;
}

function hexValue(byte: number): number {
  if (byte >= 48 && byte <= 57) return byte - 48;
  if (byte >= 65 && byte <= 70) return byte - 55;
  if (byte >= 97 && byte <= 102) return byte - 87;
  return -1;
}

/** A language tag: letters, then `-` and letters or digits, each part at most 8 long (n3 refuses longer); returns the offset after it. */
function scanLanguage(bytes: Uint8Array, position: number, end: number): number {
  let index = position;
  let partLength = 0;
  while (index < end && isLetter(bytes[index])) {
    index++;
    partLength++;
  }
  if (partLength === 0 || partLength > 8) return -1;
  while (index < end && bytes[index] === DASH) {
    index++;
    partLength = 0;
    while (index < end && (isLetter(bytes[index]) || (bytes[index] >= 48 && bytes[index] <= 57))) {
      index++;
      partLength++;
    }
    if (partLength === 0 || partLength > 8) return -1;
  }
  return index;
}
