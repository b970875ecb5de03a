// Term interner: every IRI and blank-node label numbered once, and the ones that become nodes given dense node ids.

/** Terms numbered 0..n-1 in first-seen order: what a TermInterner builds on. */
export interface TermNumbering {
  /** The number of a term, numbering it when new. */
  term(text: string): number;
  /** The number of a term, or -1 when it has none. */
  termNumberOf(text: string): number;
  /** Term number → text. */
  readonly termTexts: readonly string[];
}

/** A TermNumbering kept in a Map. */
class MapNumbering implements TermNumbering {
  private readonly numbers = new Map<string, number>();
  readonly termTexts: string[] = [];

  term(text: string): number {
    let termNumber = this.numbers.get(text);
    if (termNumber === undefined) {
      termNumber = this.termTexts.length;
      this.numbers.set(text, termNumber);
      this.termTexts.push(text);
    }
    return termNumber;
  }

  termNumberOf(text: string): number {
    return this.numbers.get(text) ?? -1;
  }
}

/** The node id of a term number that is not a node. */
const NOT_A_NODE = -1;

/**
 * Numbers terms 0..termCount-1 in first-seen order, and gives the terms that become graph nodes ids
 * 0..size-1 in the order they are made nodes. A number or id never changes once given. Keeping
 * both lets the builder look each term up in a map once per statement and work with integers after.
 */
export class TermInterner {
  /** Starts from terms numbered already (a StatementStore is a TermNumbering), or from none. */
  constructor(private readonly numbering: TermNumbering = new MapNumbering()) {}

  private nodeOfNumber = new Int32Array(1024).fill(NOT_A_NODE);
  private readonly nodeTerms: string[] = [];
  private readonly nodeNumbers: number[] = [];

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
    return this.numbering.termTexts[termNumber];
  }

  /** How many terms have numbers. */
  get termCount(): number {
    return this.numbering.termTexts.length;
  }

  /** The node id of a term number, making the term the next node when it is not one yet. */
  makeNode(termNumber: number): number {
    if (termNumber >= this.nodeOfNumber.length) this.grow(termNumber + 1);
    let id = this.nodeOfNumber[termNumber];
    if (id === NOT_A_NODE) {
      id = this.nodeTerms.length;
      this.nodeOfNumber[termNumber] = id;
      this.nodeTerms.push(this.numbering.termTexts[termNumber]);
      this.nodeNumbers.push(termNumber);
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

  /** The term of a node id. */
  term(id: number): string {
    return this.nodeTerms[id];
  }

  /** How many terms are nodes. */
  get size(): number {
    return this.nodeTerms.length;
  }

  private grow(minimum: number): void {
    const grown = new Int32Array(Math.max(minimum, this.nodeOfNumber.length * 2)).fill(NOT_A_NODE);
    grown.set(this.nodeOfNumber);
    this.nodeOfNumber = grown;
  }
}
