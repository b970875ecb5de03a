// Parser for WordNet's `data.noun` (format of wndb(5WN)), checked line by line, for the open-dataset test.
import { readFileSync } from 'node:fs';

/** One pointer of a synset line: `pointer_symbol synset_offset pos source/target`. */
export interface WordnetPointer {
  symbol: string;
  /** Target synset offset, 8 digits as written. */
  target: string;
  /** Part of speech of the target: n, v, a, s or r. */
  targetPos: string;
  /** `0000` for a semantic pointer; otherwise source and target word numbers (hex). */
  sourceTarget: string;
}

/** One synset line of `data.noun`. */
export interface NounSynset {
  /** Byte offset of the line in the file, 8 digits as written (the synset's key). */
  offset: string;
  /** 1-based line number in the file. */
  line: number;
  lexFileNumber: number;
  words: string[];
  pointers: WordnetPointer[];
  gloss: string;
}

/** The parsed file: synsets in file order, and how many licence header lines came first. */
export interface NounData {
  file: string;
  headerLines: number;
  synsets: NounSynset[];
  /** Pointers whose target is a noun synset that has no line in the file (must be empty). */
  danglingNounTargets: { offset: string; pointer: WordnetPointer }[];
}

/** Reads and checks `data.noun`; a malformed line throws an Error naming the file and line. */
export function readNounData(file: string): NounData {
  const bytes = readFileSync(file);
  // The format keys each synset by its byte offset; for ASCII text a string index is a byte offset.
  const nonAscii = bytes.findIndex((byte) => byte > 0x7f);
  if (nonAscii >= 0) {
    throw new Error(`${file}: byte ${nonAscii} is not ASCII. Hint: expected the plain-ASCII WordNet data.noun`);
  }
  const text = bytes.toString('latin1');
  const synsets: NounSynset[] = [];
  let headerLines = 0;
  let lineStart = 0;
  let lineNumber = 0;
  while (lineStart < text.length) {
    let lineEnd = text.indexOf('\n', lineStart);
    if (lineEnd < 0) lineEnd = text.length;
    lineNumber += 1;
    const lineText = text.slice(lineStart, lineEnd);
    if (lineText.startsWith('  ')) {
      if (synsets.length > 0) fail(file, lineNumber, 'a header line after synset lines', 'header lines come first');
      headerLines += 1;
    } else {
      synsets.push(parseSynsetLine({ file, lineNumber, lineText, byteOffset: lineStart }));
    }
    lineStart = lineEnd + 1;
  }
  return { file, headerLines, synsets, danglingNounTargets: findDanglingTargets(synsets) };
}

/** The data line being parsed, with where it stands in the file. */
interface LineInput {
  file: string;
  lineNumber: number;
  lineText: string;
  byteOffset: number;
}

/** Parses one synset line: `offset lex_filenum ss_type w_cnt (word lex_id)... p_cnt pointers... | gloss`. */
function parseSynsetLine(input: LineInput): NounSynset {
  const { file, lineNumber, lineText, byteOffset } = input;
  const glossStart = lineText.indexOf(' | ');
  if (glossStart < 0) fail(file, lineNumber, 'no " | " before the gloss', 'every noun synset line ends with a gloss');
  const fields = lineText.slice(0, glossStart).split(' ');
  let next = 0;
  const take = (what: string, pattern: RegExp): string => {
    const field = fields[next];
    if (field === undefined || !pattern.test(field)) {
      fail(file, lineNumber, `field ${next + 1} should be ${what}, found ${JSON.stringify(field ?? '')}`, 'see wndb(5WN)');
    }
    next += 1;
    return field;
  };
  const offset = take('an 8-digit synset offset', /^\d{8}$/);
  if (Number(offset) !== byteOffset) {
    fail(file, lineNumber, `synset offset ${offset} is not the line's byte offset ${byteOffset}`, 'the file must be unchanged');
  }
  const lexFileNumber = Number(take('a 2-digit lexicographer file number', /^\d{2}$/));
  take('the synset type n', /^n$/);
  const wordCount = parseInt(take('a 2-digit hexadecimal word count', /^[0-9a-f]{2}$/), 16);
  const words: string[] = [];
  for (let index = 0; index < wordCount; index += 1) {
    words.push(take('a word', /^\S+$/));
    take('a 1-digit hexadecimal lex_id', /^[0-9a-f]$/);
  }
  const pointerCount = Number(take('a 3-digit pointer count', /^\d{3}$/));
  const pointers: WordnetPointer[] = [];
  for (let index = 0; index < pointerCount; index += 1) {
    const symbol = take('a pointer symbol', /^[!@~#%=+;\-\\<^$&*>][a-z]?$/);
    const target = take('an 8-digit target offset', /^\d{8}$/);
    const targetPos = take('a target part of speech (n, v, a, s or r)', /^[nvasr]$/);
    const sourceTarget = take('a 4-digit hexadecimal source/target', /^[0-9a-f]{4}$/);
    pointers.push({ symbol, target, targetPos, sourceTarget });
  }
  if (next !== fields.length) {
    fail(file, lineNumber, `${fields.length - next} unexpected fields before the gloss`, 'nouns have no verb frames');
  }
  return { offset, line: lineNumber, lexFileNumber, words, pointers, gloss: lineText.slice(glossStart + 3).trimEnd() };
}

/** Pointers to a noun synset offset that has no line of its own. */
function findDanglingTargets(synsets: NounSynset[]): NounData['danglingNounTargets'] {
  const offsets = new Set(synsets.map((synset) => synset.offset));
  const dangling: NounData['danglingNounTargets'] = [];
  for (const synset of synsets) {
    for (const pointer of synset.pointers) {
      if (pointer.targetPos === 'n' && !offsets.has(pointer.target)) dangling.push({ offset: synset.offset, pointer });
    }
  }
  return dangling;
}

/** Throws the parse error for one line, with a hint. */
function fail(file: string, line: number, message: string, hint: string): never {
  const error = new Error(`${file}:${line}: ${message}. Hint: ${hint}`);
  Object.assign(error, { file, line });
  throw error;
}
