// Term interner: every IRI and blank-node label numbered once, and the ones that become nodes given dense node ids.

/** Terms numbered 0..n-1 in first-seen order, as a StatementStore numbers them: what a TermInterner builds on. */
export interface TermNumbering {
  /** The number of a term, numbering it when new. */
  term(text: string): number;
  /** The number of a term, or -1 when it has none. */
  termNumberOf(text: string): number;
  /** The text of a term number. */
  text(termNumber: number): string;
  /** Whether a term's text starts with the text whose UTF-8 bytes are `prefix` (one without lone surrogates). */
  termStartsWith(termNumber: number, prefix: Uint8Array): boolean;
  /** How many terms are numbered. */
  readonly termCount: number;
}

/** The node id of a term number that is not a node. */
const NOT_A_NODE = -1;

/**
 * Numbers terms 0..termCount-1 in first-seen order, and gives the terms that become graph nodes ids
 * 0..size-1 in the order they are made nodes. A number or id never changes once given. Keeping
 * both lets the builder look each term up in a map once per statement and work with integers after.
 * Texts stay with the numbering: a node's text is made when it is asked for.
 */
export class TermInterner {
  /** Starts from terms numbered already (a StatementStore is a TermNumbering). */
  constructor(private readonly numbering: TermNumbering) {}

  private nodeOfNumber = new Int32Array(1024).fill(NOT_A_NODE);
  /** Term number by node id; the first `nodeCount` entries are used. */
  private nodeNumbers = new Int32Array(1024);
  private nodeCount = 0;

  /** The number of a term, giving it the next free number when it is new. */
  number(term: string): number {
    return this.numbering.term(term);
  }

  /** The number of a term, or -1 when it was never numbered. */
  numberOf(term: string): number {
    return this.numbering.termNumberOf(term);
  }

  /** The text of a term number. */
  text(termNumber: number): string {
    return this.numbering.text(termNumber);
  }

  /** Whether a term's text starts with the text whose UTF-8 bytes are `prefix` (one without lone surrogates). */
  termStartsWith(termNumber: number, prefix: Uint8Array): boolean {
    return this.numbering.termStartsWith(termNumber, prefix);
  }

  /** How many terms have numbers. */
  get termCount(): number {
    return this.numbering.termCount;
  }

  /** The node id of a term number, making the term the next node when it is not one yet. */
  makeNode(termNumber: number): number {
    if (termNumber >= this.nodeOfNumber.length) this.grow(termNumber + 1);
    let id = this.nodeOfNumber[termNumber];
    if (id === NOT_A_NODE) {
      id = this.nodeCount++;
      if (id === this.nodeNumbers.length) {
        const grown = new Int32Array(this.nodeNumbers.length * 2);
        grown.set(this.nodeNumbers);
        this.nodeNumbers = grown;
      }
      this.nodeOfNumber[termNumber] = id;
      this.nodeNumbers[id] = termNumber;
    }
    return id;
  }

  /** The node id of a term number, or -1 when the term is not a node. */
  nodeOf(termNumber: number): number {
    return termNumber < this.nodeOfNumber.length ? this.nodeOfNumber[termNumber] : NOT_A_NODE;
  }

  /** The term number of a node id. */
  numberOfNode(id: number): number {
    return this.nodeNumbers[id];
  }

  /** The node id of the term, making it a node when it is not one yet. */
  intern(term: string): number {
    return this.makeNode(this.number(term));
  }

  /** The node id of the term, or -1 when it is not a node. */
  idOf(term: string): number {
    const termNumber = this.numbering.termNumberOf(term);
    return termNumber < 0 ? NOT_A_NODE : this.nodeOf(termNumber);
  }

  /** The term of a node id (made from its bytes: a new string each time). */
  term(id: number): string {
    // An id that is not a node has no text, as before, when texts were read from an array.
    return id >= 0 && id < this.nodeCount ? this.numbering.text(this.nodeNumbers[id]) : (undefined as unknown as string);
  }

  /** How many terms are nodes. */
  get size(): number {
    return this.nodeCount;
  }

  private grow(minimum: number): void {
    const grown = new Int32Array(Math.max(minimum, this.nodeOfNumber.length * 2)).fill(NOT_A_NODE);
    grown.set(this.nodeOfNumber);
    this.nodeOfNumber = grown;
  }
}
