// Remembers which n3 token brought each RDF term into being, so a statement can point at its subject.
import { BlankNode, DataFactory, Literal, NamedNode } from 'n3';
import type * as RDF from '@rdfjs/types';
import type { N3Token } from './n3-tokens.js';

/** The line of a term that was made before the first token, and so has no place of its own. */
const NO_LINE = 0;

/** An n3 named node that also keeps the 1-based line and column of the token that made it. */
class PlacedNamedNode extends NamedNode {
  sourceLine = NO_LINE;
  sourceColumn = 0;
}

/** An n3 blank node that also keeps the 1-based line and column of the token that made it. */
class PlacedBlankNode extends BlankNode {
  sourceLine = NO_LINE;
  sourceColumn = 0;
}

/** An n3 literal that also keeps the 1-based line and column of the token that made it. */
class PlacedLiteral extends Literal {
  sourceLine = NO_LINE;
  sourceColumn = 0;
}

/** A term made by the factory of `TermPositions`. */
type PlacedTerm = PlacedNamedNode | PlacedBlankNode | PlacedLiteral;

/**
 * Hands n3 a data factory whose terms record the token being read when they were made (as two
 * number fields on n3's own term classes, so no side table and no object per token). n3 creates a
 * fresh term object for each token it reads (and reuses that object when a `;` list or a closing
 * `]` returns to the subject), so the creating token of the subject object is the subject token.
 * Anonymous blank nodes are placed at their `[`, and the nodes n3 makes for a collection at its
 * `(`. This rests on how n3 2.13.12 builds terms, one reason it is pinned to that version exactly;
 * the W3C suite and position tests would show a change.
 */
export class TermPositions {
  /** The data factory to give n3's parser. */
  readonly factory: RDF.DataFactory;
  private currentLine = 1;
  private currentColumn = 1;
  private currentTokenType = '';
  private lastLiteralLine = 1;
  private lastLiteralColumn = 1;
  /** Line and column of each open `(`, two numbers per collection, innermost last. */
  private readonly openCollections: number[] = [];
  private lastBlankOfToken: PlacedBlankNode | undefined;
  private anonymousCount = 0;
  // Terms n3 makes before the first token (rdf:nil and its other constants) have no place of their own.
  private reading = false;

  /** `labelPrefix` starts every blank node label; anonymous ones continue with `-` and a counter. */
  constructor(labelPrefix: string) {
    this.factory = {
      ...DataFactory,
      namedNode: (iri: string) => this.placed(new PlacedNamedNode(iri), this.currentLine, this.currentColumn),
      // n3's own factory works out the literal's internal id (datatype, language, direction).
      literal: (value: string, languageOrDatatype?: string | RDF.NamedNode) =>
        this.placed(
          new PlacedLiteral(DataFactory.literal(value, languageOrDatatype).id),
          this.lastLiteralLine,
          this.lastLiteralColumn,
        ),
      blankNode: (label?: string) => {
        if (label !== undefined) return this.placed(new PlacedBlankNode(label), this.currentLine, this.currentColumn);
        // '-' cannot start a blank node label in Turtle, so these never meet a label from the file.
        const node = new PlacedBlankNode(`${labelPrefix}-${++this.anonymousCount}`);
        this.lastBlankOfToken = node;
        const open = this.openCollections.length;
        return open === 0
          ? this.placed(node, this.currentLine, this.currentColumn)
          : this.placed(node, this.openCollections[open - 2], this.openCollections[open - 1]);
      },
    } as RDF.DataFactory;
  }

  /** Call before n3 reads a token. */
  beginToken(token: N3Token): void {
    this.reading = true;
    this.currentLine = token.line;
    this.currentColumn = token.start + 1;
    this.currentTokenType = token.type;
    this.lastBlankOfToken = undefined;
    if (token.type === 'literal') {
      this.lastLiteralLine = this.currentLine;
      this.lastLiteralColumn = this.currentColumn;
    }
  }

  /** Call after n3 has read a token. */
  endToken(token: N3Token): void {
    // The last blank node made while reading `[` is the one the bracket stands for; any made
    // before it in the same step are collection nodes.
    if (this.currentTokenType === '[' && this.lastBlankOfToken !== undefined) {
      this.lastBlankOfToken.sourceLine = this.currentLine;
      this.lastBlankOfToken.sourceColumn = this.currentColumn;
    }
    // A collection is opened after its `(` is read, so nodes made while reading it belong to the outer one.
    if (token.type === '(') this.openCollections.push(this.currentLine, this.currentColumn);
    else if (token.type === ')') this.openCollections.length = Math.max(0, this.openCollections.length - 2);
  }

  /** The 1-based line where a term was written, or of the token being read when it came from no token of its own. */
  lineOf(term: RDF.Term): number {
    const line = isPlaced(term) ? term.sourceLine : NO_LINE;
    return line === NO_LINE ? this.currentLine : line;
  }

  /** The 1-based column where a term was written, or of the token being read when it came from no token of its own. */
  columnOf(term: RDF.Term): number {
    return isPlaced(term) && term.sourceLine !== NO_LINE ? term.sourceColumn : this.currentColumn;
  }

  private placed<T extends PlacedTerm>(term: T, line: number, column: number): T {
    if (this.reading) {
      term.sourceLine = line;
      term.sourceColumn = column;
    }
    return term;
  }
}

function isPlaced(term: RDF.Term): term is PlacedTerm {
  return term instanceof PlacedNamedNode || term instanceof PlacedBlankNode || term instanceof PlacedLiteral;
}
