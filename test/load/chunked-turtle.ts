// Helpers for the chunked-parse tests: generated Turtle and TriG with the features a chunk boundary can cut, and a byte-chunked parse.
import type { LoadedSource, N3Format } from '../../src/load/statement.js';
import { N3SourceReader, type ParseOptions } from '../../src/load/parse.js';
import { Utf8ChunkDecoder } from '../../src/load/source-text.js';

const NV = 'https://data.northvale-rail.example/def/';

/** A generated document and the byte offsets just inside its multi-byte characters, tokens, comments and long strings. */
export interface GeneratedDocument {
  text: string;
  /** Byte offsets where a cut falls inside one of the features, by feature. */
  cuts: Record<'multiByte' | 'token' | 'comment' | 'longString', number[]>;
}

const WORDS = ['Wagen', 'Drehgestell', 'Stromabnehmer', 'Kupplung', 'Gleis', 'Weiche', 'Schwelle'];
// Characters of 2, 3 and 4 UTF-8 bytes; the last is a surrogate pair in UTF-16.
const NON_ASCII = ['é', 'Ž', 'ß', '日本', '線路', '😀', '🚆'];

/**
 * A Northvale Rail Turtle (or TriG) document of `statements` subjects, built from `random`: prefixed
 * names and full IRIs, `;` and `,` lists, blank nodes and collections, literals with language tags,
 * datatypes, `"""` strings over several lines, numbers, comments (allow comments at line ends and
 * alone) and non-ASCII text of every UTF-8 length; LF, CRLF or CR line ends.
 */
export function generatedDocument(random: () => number, statements: number, format: 'turtle' | 'trig'): GeneratedDocument {
  const pick = <T>(items: readonly T[]): T => items[Math.floor(random() * items.length)];
  const newlineDraw = random();
  // Mostly LF; CRLF and the old lone CR too, which n3 also counts as a line end.
  const newline = newlineDraw < 0.2 ? '\r\n' : newlineDraw < 0.3 ? '\r' : '\n';
  const parts: { text: string; kind?: keyof GeneratedDocument['cuts'] }[] = [];
  const add = (text: string, kind?: keyof GeneratedDocument['cuts']): void => {
    parts.push({ text, kind });
  };
  const word = (): string => `${pick(WORDS)}${random() < 0.3 ? pick(NON_ASCII) : ''}`;
  add(`@prefix nv: <${NV}> .${newline}`, 'token');
  add(`PREFIX rdfs: <http://www.w3.org/2000/01/rdf-schema#>${newline}`, 'token');
  add(`# Northvale Rail asset graph, Teil ${pick(NON_ASCII)}${newline}`, 'comment');
  let openGraph = false;
  for (let index = 0; index < statements; index++) {
    if (format === 'trig' && !openGraph && random() < 0.2) {
      add(`nv:graph${index} {${newline}`, 'token');
      openGraph = true;
    }
    if (random() < 0.15) add(`# isapart-allow orphan-class: ${word()} stands alone${newline}`, 'comment');
    const subject = random() < 0.8 ? `nv:${pick(WORDS)}${index}` : random() < 0.5 ? `<${NV}Asset${index}>` : `_:b${index}`;
    add(subject, 'token');
    add(` a nv:RollingStock`, 'token');
    add(` ;${newline}  rdfs:label `);
    add(`"${word()} ${word()}"@de`, 'multiByte');
    if (random() < 0.5) add(` , "${word()}"@en`, 'token');
    if (random() < 0.3) add(` ;${newline}  rdfs:comment """${word()}${newline}über ${word()}${newline}${pick(NON_ASCII)} "quoted" """`, 'longString');
    if (random() < 0.3) add(` ;${newline}  nv:partOf [ a nv:Bogie ; nv:axles ${Math.floor(random() * 4)} ]`, 'token');
    if (random() < 0.2) add(` ;${newline}  nv:consistOf ( nv:Car${index} nv:Car${index + 1} )`, 'token');
    if (random() < 0.2) add(` ;${newline}  nv:mass "${(random() * 90).toFixed(2)}"^^<http://www.w3.org/2001/XMLSchema#decimal>`, 'token');
    add(` ;${newline}  nv:partOf nv:${pick(WORDS)}${Math.floor(random() * statements)} .`, 'token');
    if (random() < 0.25) add(` # isapart-allow kind-and-part: sold as one kit ${pick(NON_ASCII)}`, 'comment');
    add(newline);
    if (openGraph && random() < 0.3) {
      add(`}${newline}`);
      openGraph = false;
    }
  }
  if (openGraph) add(`}${newline}`);
  const cuts: GeneratedDocument['cuts'] = { multiByte: [], token: [], comment: [], longString: [] };
  let offset = 0;
  for (const part of parts) {
    const bytes = Buffer.byteLength(part.text);
    if (part.kind !== undefined) cuts[part.kind].push(offset + 1 + Math.floor(random() * Math.max(1, bytes - 2)));
    // Every multi-byte character is a place to cut inside, whatever part it is in.
    let at = offset;
    for (const character of part.text) {
      const length = Buffer.byteLength(character);
      if (length > 1) cuts.multiByte.push(at + 1 + Math.floor(random() * (length - 1)));
      at += length;
    }
    offset += bytes;
  }
  return { text: parts.map((part) => part.text).join(''), cuts };
}

/** Parses bytes cut at the given offsets: each piece goes through the UTF-8 decoder and then to the reader. */
export function parseCutBytes(bytes: Uint8Array, cuts: readonly number[], file: string, format: N3Format, options: ParseOptions = {}): LoadedSource {
  const decoder = new Utf8ChunkDecoder();
  const reader = new N3SourceReader(file, format, options);
  let start = 0;
  for (const cut of [...cuts].sort((a, b) => a - b)) {
    if (cut <= start || cut >= bytes.length) continue;
    reader.write(decoder.write(bytes.subarray(start, cut)).text);
    start = cut;
  }
  reader.write(decoder.write(bytes.subarray(start)).text);
  reader.write(decoder.end().text);
  return reader.end();
}

/** Offsets cutting `length` bytes into chunks of random sizes from 1 to `largest`. */
export function randomCuts(random: () => number, length: number, largest: number): number[] {
  const cuts: number[] = [];
  for (let at = 1 + Math.floor(random() * largest); at < length; at += 1 + Math.floor(random() * largest)) cuts.push(at);
  return cuts;
}

/** Offsets cutting `length` bytes into chunks of one byte. */
export function everyByte(length: number): number[] {
  return Array.from({ length: Math.max(0, length - 1) }, (_, index) => index + 1);
}
