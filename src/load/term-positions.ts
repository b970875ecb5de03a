// Remembers which n3 token brought each RDF term into being, so a statement can point at its subject.
import { DataFactory } from 'n3';
import type * as RDF from '@rdfjs/types';
import type { N3Token } from './n3-tokens.js';

/** A place in the source: 1-based line and 1-based UTF-16 column. */
export interface TokenPlace {
  line: number;
  column: number;
}

/**
 * Hands n3 a data factory that records, for every term object it creates, the token being read
 * at that moment. n3 creates a fresh term object for each token it reads (and reuses that object
 * when a `;` list or a closing `]` returns to the subject), so the creating token of the subject
 * object is the subject token. Anonymous blank nodes are placed at their `[`, and the nodes n3
 * makes for a collection at its `(`. This rests on how n3 2.13.12 builds terms, one reason it is
 * pinned to that version exactly; the W3C suite and position tests would show a change.
 */
export class TermPositions {
  /** The data factory to give n3's parser. */
  readonly factory: RDF.DataFactory;
  private readonly placeOfTerm = new WeakMap<object, TokenPlace>();
  private currentToken: TokenPlace = { line: 1, column: 1 };
  private currentTokenType = '';
  private lastLiteralToken: TokenPlace = { line: 1, column: 1 };
  private readonly openCollections: TokenPlace[] = [];
  private lastBlankOfToken: object | undefined;
  private anonymousCount = 0;
  // Terms n3 makes before the first token (rdf:nil and its other constants) have no place of their own.
  private reading = false;

  /** `labelPrefix` starts every blank node label; anonymous ones continue with `-` and a counter. */
  constructor(labelPrefix: string) {
    this.factory = {
      ...DataFactory,
      namedNode: (iri: string) => this.placed(DataFactory.namedNode(iri), this.currentToken),
      literal: (value: string, languageOrDatatype?: string | RDF.NamedNode) =>
        this.placed(DataFactory.literal(value, languageOrDatatype), this.lastLiteralToken),
      blankNode: (label?: string) => {
        if (label !== undefined) return this.placed(DataFactory.blankNode(label), this.currentToken);
        // '-' cannot start a blank node label in Turtle, so these never meet a label from the file.
        const node = DataFactory.blankNode(`${labelPrefix}-${++this.anonymousCount}`);
        this.lastBlankOfToken = node;
        return this.placed(node, this.openCollections.at(-1) ?? this.currentToken);
      },
    } as RDF.DataFactory;
  }

  /** Call before n3 reads a token. */
  beginToken(token: N3Token): void {
    this.reading = true;
    this.currentToken = { line: token.line, column: token.start + 1 };
    this.currentTokenType = token.type;
    this.lastBlankOfToken = undefined;
    if (token.type === 'literal') this.lastLiteralToken = this.currentToken;
  }

  /** Call after n3 has read a token. */
  endToken(token: N3Token): void {
    // The last blank node made while reading `[` is the one the bracket stands for; any made
    // before it in the same step are collection nodes.
    if (this.currentTokenType === '[' && this.lastBlankOfToken !== undefined) {
      this.placeOfTerm.set(this.lastBlankOfToken, this.currentToken);
    }
    // A collection is opened after its `(` is read, so nodes made while reading it belong to the outer one.
    if (token.type === '(') this.openCollections.push(this.currentToken);
    else if (token.type === ')') this.openCollections.pop();
  }

  /** Where a term was written, or the token being read when the term came from no token of its own. */
  placeOf(term: RDF.Term): TokenPlace {
    return this.placeOfTerm.get(term) ?? this.currentToken;
  }

  private placed<T extends object>(term: T, place: TokenPlace): T {
    if (this.reading) this.placeOfTerm.set(term, place);
    return term;
  }
}
