// Term interner: IRIs and blank-node labels to dense integer ids, in first-seen order.

/** Maps terms to ids 0..size-1 and back; an id never changes once given. */
export class TermInterner {
  private readonly ids = new Map<string, number>();
  private readonly terms: string[] = [];

  /** The id of the term, giving it the next free id when it is new. */
  intern(term: string): number {
    let id = this.ids.get(term);
    if (id === undefined) {
      id = this.terms.length;
      this.ids.set(term, id);
      this.terms.push(term);
    }
    return id;
  }

  /** The id of the term, or -1 when it was never interned. */
  idOf(term: string): number {
    return this.ids.get(term) ?? -1;
  }

  /** The term of an id. */
  term(id: number): string {
    return this.terms[id];
  }

  /** How many terms have ids. */
  get size(): number {
    return this.terms.length;
  }
}
