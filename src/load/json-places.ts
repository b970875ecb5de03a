// A streaming JSON reader that checks the syntax and remembers where each object of the document starts.
import type { LineColumn } from './line-counter.js';

/** One key of a path into a JSON document: an object member's name or an array index. */
export type JsonKey = string | number;

/** Where a JSON object starts, and whether it can be a node object (not a value, list, `@reverse` or `@nest` object). */
interface ObjectPlace {
  start: LineColumn;
  isNode: boolean;
}

/** A JSON syntax error at a place. */
export interface JsonSyntaxError {
  message: string;
  hint: string;
  place: LineColumn;
  /** How many characters of the chunk being read were valid before the error. */
  validLength: number;
}

/** An open object or array. */
interface Container {
  kind: 'object' | 'array';
  /** The path of the container itself, as `pathText` gives it. */
  path: string;
  /** The key of the member being read (objects) or the index of the next item (arrays). */
  key: JsonKey;
  /** Objects: whether a member's name is expected next (after `{` or `,`). */
  expectName: boolean;
  /** Whether a value was read since the last `,` (or the opening bracket). */
  hasValue: boolean;
  /** How many members or items were read. */
  items: number;
  /** Objects: whether the name was read and `:` follows. */
  expectColon: boolean;
  place: ObjectPlace | undefined;
}

// Keys whose object value holds no statements of its own (JSON-LD 1.1, sections 4.8 and 9.4; from memory).
const NOT_NODE_PARENT_KEYS = new Set(['@reverse', '@nest', '@context']);
// Keys that make an object a value or list object rather than a node object (JSON-LD 1.1, section 9; from memory).
const NOT_NODE_KEYS = new Set(['@value', '@list', '@set']);

/** The map key of a path: each step as a marked name or index, so the name "1" and the index 1 differ. */
export function pathText(keys: readonly JsonKey[]): string {
  let text = '';
  for (const key of keys) text += typeof key === 'number' ? `\u0001${key}` : `\u0002${key}`;
  return text;
}

/**
 * Reads a JSON text chunk by chunk (RFC 8259 syntax), keeping the place of every object by its path
 * from the root. Lines break at LF, CRLF and CR; columns count UTF-16 code units from 1.
 */
export class JsonPlaces {
  private readonly objects = new Map<string, ObjectPlace>();
  private readonly stack: Container[] = [];
  private line = 1;
  private column = 1;
  private previousCode = 0;
  private rootDone = false;
  private rootSeen = false;
  /** The token being read across chunks: a string (its raw text), a number or a literal word. */
  private token: { kind: 'string' | 'number' | 'word'; text: string; escaped: boolean; start: LineColumn } | undefined;

  /** The start of the object whose members include the value at `keys` (searching outwards past non-node objects). */
  enclosingNode(keys: readonly JsonKey[]): LineColumn | undefined {
    for (let length = keys.length - 1; length >= 0; length--) {
      const place = this.objects.get(pathText(keys.slice(0, length)));
      if (place?.isNode) return place.start;
    }
    return this.objects.get('')?.start;
  }

  /** Reads the next chunk; returns the first syntax error in it, after which nothing more should be read. */
  read(chunk: string): JsonSyntaxError | undefined {
    for (let index = 0; index < chunk.length; index++) {
      const code = chunk.charCodeAt(index);
      const problem = this.token !== undefined ? this.continueToken(code, chunk[index]) : this.readStructure(code, chunk[index]);
      if (problem !== undefined) return { ...problem, validLength: index };
      this.advance(code);
    }
    return undefined;
  }

  /** Says whether the text ended where a document may end; an error otherwise. */
  end(): JsonSyntaxError | undefined {
    if (this.token !== undefined && this.token.kind !== 'string') {
      const problem = this.finishToken();
      if (problem !== undefined) return { ...problem, validLength: 0 };
    }
    if (this.rootDone) return undefined;
    const place = { line: this.line, column: this.column };
    if (!this.rootSeen) {
      return { message: 'the text holds no JSON document', hint: 'a JSON-LD document is a JSON object { ... } or an array [ ... ]', place, validLength: 0 };
    }
    const open = this.stack[this.stack.length - 1];
    const closer = this.token?.kind === 'string' ? 'the closing " of a string' : open?.kind === 'array' ? ']' : '}';
    return {
      message: `the JSON text ends before ${closer}`,
      hint: 'the file is cut off, or a bracket or quote opened above is never closed',
      place,
      validLength: 0,
    };
  }

  private advance(code: number): void {
    if (code === 10 || code === 13) {
      // The LF of a CRLF ends the same line as its CR did.
      if (code === 13 || this.previousCode !== 13) this.line++;
      this.column = 1;
    } else {
      this.column++;
    }
    this.previousCode = code;
  }

  private here(): LineColumn {
    return { line: this.line, column: this.column };
  }

  private problem(message: string, hint: string): Omit<JsonSyntaxError, 'validLength'> {
    return { message, hint, place: this.here() };
  }

  /** A character outside a string, number or word. */
  private readStructure(code: number, character: string): Omit<JsonSyntaxError, 'validLength'> | undefined {
    if (code === 0x20 || code === 0x09 || code === 0x0a || code === 0x0d) return undefined;
    if (this.rootDone) {
      return this.problem(`found '${character}' after the end of the JSON document`, 'a JSON-LD file holds one JSON value; put several nodes in one array or under "@graph"');
    }
    const top = this.stack[this.stack.length - 1];
    if (top?.kind === 'object' && top.expectColon) {
      if (code !== 0x3a) return this.problem(`found '${character}' where ':' must follow the member name`, 'write each member as "name": value');
      top.expectColon = false;
      return undefined;
    }
    if (top?.kind === 'object' && top.expectName) {
      if (code === 0x22) {
        this.token = { kind: 'string', text: '', escaped: false, start: this.here() };
        return undefined;
      }
      if (code === 0x7d && top.items === 0) return this.close();
      return this.problem(`found '${character}' where a member name in double quotes must come`, 'member names are strings in double quotes; no comma may stand before }');
    }
    if (code === 0x2c) {
      if (top === undefined || !top.hasValue) return this.problem("found ',' where a value must come", 'remove the extra comma');
      top.hasValue = false;
      if (top.kind === 'object') top.expectName = true;
      else top.key = (top.key as number) + 1;
      return undefined;
    }
    if (code === 0x7d || code === 0x5d) {
      const expected = top?.kind === 'array' ? 0x5d : 0x7d;
      if (top === undefined || code !== expected) return this.problem(`found '${character}' that closes nothing open`, 'check that brackets and braces pair up');
      // An object here awaits the value of a member; an array may be empty, but not end in a comma.
      if (!top.hasValue && (top.kind === 'object' || top.items > 0)) {
        const after = top.kind === 'object' ? 'where the value of a member must come' : 'after a comma';
        return this.problem(`found '${character}' ${after}`, 'JSON allows no comma before a closing bracket, and every member needs a value');
      }
      return this.close();
    }
    if (top !== undefined && top.hasValue) {
      return this.problem(`found '${character}' where ',' or a closing bracket must come`, 'separate members and items with commas');
    }
    return this.startValue(code, character);
  }

  /** The first character of a value. */
  private startValue(code: number, character: string): Omit<JsonSyntaxError, 'validLength'> | undefined {
    const parent = this.stack[this.stack.length - 1];
    if (parent === undefined) {
      if (code !== 0x7b && code !== 0x5b) return this.problem(`found '${character}' where a JSON object or array must start`, 'a JSON-LD document is a JSON object { ... } or an array [ ... ]');
      this.rootSeen = true;
    }
    if (code === 0x7b || code === 0x5b) {
      const path = parent === undefined ? '' : parent.path + pathText([parent.key]);
      const isObject = code === 0x7b;
      const parentKey = parent?.kind === 'object' ? (parent.key as string) : undefined;
      const place = isObject ? { start: this.here(), isNode: parentKey === undefined || !NOT_NODE_PARENT_KEYS.has(parentKey) } : undefined;
      if (place !== undefined) this.objects.set(path, place);
      this.stack.push({ kind: isObject ? 'object' : 'array', path, key: isObject ? '' : 0, expectName: isObject, hasValue: false, items: 0, expectColon: false, place });
      return undefined;
    }
    if (code === 0x22) {
      this.token = { kind: 'string', text: '', escaped: false, start: this.here() };
      return undefined;
    }
    if (code === 0x2d || (code >= 0x30 && code <= 0x39)) {
      this.token = { kind: 'number', text: character, escaped: false, start: this.here() };
      return undefined;
    }
    if (code >= 0x61 && code <= 0x7a) {
      this.token = { kind: 'word', text: character, escaped: false, start: this.here() };
      return undefined;
    }
    return this.problem(`found '${character}' where a JSON value must come`, 'a value is a "string", a number, true, false, null, an object or an array');
  }

  /** A character inside a string, number or word. */
  private continueToken(code: number, character: string): Omit<JsonSyntaxError, 'validLength'> | undefined {
    const token = this.token as NonNullable<JsonPlaces['token']>;
    if (token.kind === 'string') {
      if (token.escaped) {
        token.escaped = false;
      } else if (code === 0x5c) {
        token.escaped = true;
      } else if (code === 0x22) {
        return this.finishToken();
      } else if (code < 0x20) {
        return this.problem('a string runs past the end of its line', 'close the string with " on the same line; write a line break inside a string as \\n');
      }
      token.text += character;
      return undefined;
    }
    const continues = token.kind === 'number' ? /[0-9eE+.-]/.test(character) : code >= 0x61 && code <= 0x7a;
    if (continues) {
      token.text += character;
      return undefined;
    }
    return this.finishToken() ?? this.readStructure(code, character);
  }

  /** Ends the token being read: a member name, or a value of the open container. */
  private finishToken(): Omit<JsonSyntaxError, 'validLength'> | undefined {
    const token = this.token as NonNullable<JsonPlaces['token']>;
    this.token = undefined;
    const top = this.stack[this.stack.length - 1];
    if (token.kind === 'string') {
      let text: string;
      try {
        text = JSON.parse(`"${token.text}"`) as string;
      } catch {
        return { message: 'a string holds an invalid escape', hint: 'escapes in JSON strings are \\" \\\\ \\/ \\b \\f \\n \\r \\t and \\uXXXX', place: token.start };
      }
      if (top?.kind === 'object' && top.expectName) {
        top.key = text;
        top.expectName = false;
        top.expectColon = true;
        if (top.place !== undefined && NOT_NODE_KEYS.has(text)) top.place.isNode = false;
        return undefined;
      }
    } else if (token.kind === 'number' && !/^-?(?:0|[1-9][0-9]*)(?:\.[0-9]+)?(?:[eE][+-]?[0-9]+)?$/.test(token.text)) {
      return { message: `'${token.text}' is not a JSON number`, hint: 'numbers are written like 12, -3.5 or 1e6, without leading zeros or a trailing dot', place: token.start };
    } else if (token.kind === 'word' && !['true', 'false', 'null'].includes(token.text)) {
      return { message: `found '${token.text}' where a JSON value must come`, hint: 'the words JSON knows are true, false and null; put text in double quotes', place: token.start };
    }
    if (top !== undefined) {
      top.hasValue = true;
      top.items++;
    }
    return undefined;
  }

  private close(): undefined {
    this.stack.pop();
    const parent = this.stack[this.stack.length - 1];
    if (parent === undefined) {
      this.rootDone = true;
    } else {
      parent.hasValue = true;
      parent.items++;
    }
    return undefined;
  }
}
