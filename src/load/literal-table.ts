// The literals a run keeps: lexical forms as bytes in an arena, datatype and language as one shared kind number.
import type { Literal } from './statement.js';
import { ByteArena } from './byte-arena.js';
import { ByteTable } from './byte-table.js';
import { IntColumn } from './int-column.js';
import { writeTermBytes } from './term-bytes.js';

/** A literal's datatype and language, shared by every literal of that kind. */
export interface LiteralKind {
  datatype: string;
  language: string;
}

/**
 * Literals numbered 0..size-1 in the order they are added. A lexical form is stored as its UTF-8
 * bytes and decoded only when asked for, so a million labels cost their bytes and three integers
 * each, not a string object each; a form with a lone surrogate (see `writeTermBytes`) is kept as
 * its text. Datatype and language are a kind number: each distinct pair is stored once.
 */
export class LiteralTable {
  private readonly arena = new ByteArena();
  private readonly starts = new IntColumn();
  private readonly lengths = new IntColumn();
  private readonly kindColumn = new IntColumn();
  private count = 0;
  /** Lexical forms that UTF-8 cannot hold, by literal number. */
  private readonly oddValues = new Map<number, string>();
  private readonly kinds: LiteralKind[] = [];
  private readonly kindNumbers = new Map<string, number>();
  /** What follows a literal's closing quote in a file (`@en`, `^^<IRI>`, nothing) → its kind number. */
  private readonly suffixKinds = new ByteTable();
  private scratch = Buffer.alloc(4096);

  /** How many literals are stored. */
  get size(): number {
    return this.count;
  }

  /** The kind number of a datatype and language, numbering the pair when new. */
  kindOf(datatype: string, language: string): number {
    // Neither an IRI nor a language tag holds a line break.
    const key = `${datatype}\n${language}`;
    let kind = this.kindNumbers.get(key);
    if (kind === undefined) {
      kind = this.kinds.length;
      this.kinds.push({ datatype, language });
      this.kindNumbers.set(key, kind);
    }
    return kind;
  }

  /**
   * The kind number of a literal written with the suffix bytes[start..end) after its closing
   * quote; `decode` gives its datatype and language the first time a suffix is met.
   */
  kindOfSuffix(bytes: Buffer, start: number, end: number, decode: () => LiteralKind): number {
    let kind = this.suffixKinds.get(bytes, start, end);
    if (kind < 0) {
      const { datatype, language } = decode();
      kind = this.kindOf(datatype, language);
      this.suffixKinds.set(bytes, start, end, kind);
    }
    return kind;
  }

  /** Adds a literal given as text and returns its number. */
  add(literal: Literal): number {
    if (literal.value.length * 3 > this.scratch.length) this.scratch = Buffer.alloc(literal.value.length * 3);
    const { length, loneSurrogate } = writeTermBytes(literal.value, this.scratch);
    if (loneSurrogate) {
      this.oddValues.set(this.count, literal.value);
      return this.push(0, 0, this.kindOf(literal.datatype, literal.language));
    }
    return this.addBytes(this.scratch, 0, length, this.kindOf(literal.datatype, literal.language));
  }

  /** Adds a literal whose lexical form is the UTF-8 bytes[start..end), of a kind from `kindOf` or `kindOfSuffix`. */
  addBytes(bytes: Buffer, start: number, end: number, kind: number): number {
    return this.push(this.arena.append(bytes, start, end), end - start, kind);
  }

  /** The lexical form of a literal. */
  value(literal: number): string {
    if (this.oddValues.size > 0) {
      const odd = this.oddValues.get(literal);
      if (odd !== undefined) return odd;
    }
    return this.arena.text(this.starts.values[literal], this.lengths.values[literal]);
  }

  /** The datatype and language of a literal (a shared object: never modify it). */
  kind(literal: number): LiteralKind {
    return this.kinds[this.kindColumn.values[literal]];
  }

  /** A literal as a new object. */
  literal(literal: number): Literal {
    const { datatype, language } = this.kind(literal);
    return { value: this.value(literal), datatype, language };
  }

  /** Bytes the table takes: arena blocks and columns. */
  get allocatedBytes(): number {
    return this.arena.allocatedBytes + 4 * 3 * this.starts.values.length + this.suffixKinds.allocatedBytes;
  }

  private push(start: number, length: number, kind: number): number {
    const index = this.count;
    if (index === this.starts.values.length) {
      for (const column of [this.starts, this.lengths, this.kindColumn]) column.reserve(index + 1);
    }
    this.starts.values[index] = start;
    this.lengths.values[index] = length;
    this.kindColumn.values[index] = kind;
    this.count++;
    return index;
  }
}
