// Term interner: every IRI and blank-node label numbered once, and the ones that become nodes given dense node ids.

/** The node id of a term number that is not a node. */
const NOT_A_NODE = -1;

/**
 * Numbers terms 0..termCount-1 in first-seen order, and gives the terms that become graph nodes ids
 * 0..size-1 in the order they are made nodes. A number or id never changes once given. Keeping
 * both lets the builder look each term up in a map once per statement and work with integers after.
 */
export class TermInterner {
  /** Starts from terms numbered already (a StatementStore's), or from none. */
  constructor(
    private readonly numbers = new Map<string, number>(),
    private readonly texts: string[] = [],
  ) {}

  private nodeOfNumber = new Int32Array(1024).fill(NOT_A_NODE);
  private readonly nodeTerms: string[] = [];
  private readonly nodeNumbers: number[] = [];

  /** The number of a term, giving it the next free number when it is new. */
  number(term: string): number {
    let termNumber = this.numbers.get(term);
    if (termNumber === undefined) {
      termNumber = this.texts.length;
      this.numbers.set(term, termNumber);
      this.texts.push(term);
    }
    return termNumber;
  }

  /** The number of a term, or -1 when it was never numbered. */
  numberOf(term: string): number {
    return this.numbers.get(term) ?? -1;
  }

  /** The text of a term number. */
  text(termNumber: number): string {
    return this.texts[termNumber];
  }

  /** How many terms have numbers. */
  get termCount(): number {
    return this.texts.length;
  }

  /** The node id of a term number, making the term the next node when it is not one yet. */
  makeNode(termNumber: number): number {
    if (termNumber >= this.nodeOfNumber.length) this.grow(termNumber + 1);
    let id = this.nodeOfNumber[termNumber];
    if (id === NOT_A_NODE) {
      id = this.nodeTerms.length;
      this.nodeOfNumber[termNumber] = id;
      this.nodeTerms.push(this.texts[termNumber]);
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
    const termNumber = this.numbers.get(term);
    return termNumber === undefined ? NOT_A_NODE : this.nodeOf(termNumber);
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
