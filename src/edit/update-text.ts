// The operations of a SPARQL 1.1 Update as written (W3C SPARQL 1.1 Update §3, grammar of SPARQL 1.1 Query §19.8): their kind, line, and the triples of their data and template blocks with the line of each subject.
import { resolve as resolveIri } from 'relative-to-absolute-iri';
import type { Literal } from '../load/statement.js';
import { RDF_FIRST, RDF_NAMESPACE, RDF_NIL, RDF_REST, RDF_TYPE, XSD_BOOLEAN, XSD_STRING } from '../roles/vocabulary.js';
import { numberLiteral, unescapeCodepoints, unescapeString } from './sparql-literals.js';
import { tokenize, type Token, type TokenError } from './sparql-tokens.js';


/** A term of a data or template block: an IRI, a blank node label, a literal, or a variable. */
export type TemplateTerm =
  | { kind: 'iri'; value: string }
  | { kind: 'blank'; label: string }
  | { kind: 'literal'; literal: Literal }
  | { kind: 'variable'; name: string };

/** One triple of a block, with the place of its subject and the line of its object. */
export interface PlacedTriple {
  subject: TemplateTerm;
  predicate: TemplateTerm;
  object: TemplateTerm;
  /** The graph it is in; undefined for the default graph (or the graph WITH names). */
  graph: TemplateTerm | undefined;
  line: number;
  column: number;
  objectLine: number;
}

/** What an operation does, by its leading keywords. */
export type OperationKind =
  | 'INSERT DATA'
  | 'DELETE DATA'
  | 'DELETE WHERE'
  | 'DELETE/INSERT'
  | 'LOAD'
  | 'CLEAR'
  | 'CREATE'
  | 'DROP'
  | 'COPY'
  | 'MOVE'
  | 'ADD';

/** One operation of the update as written. */
export interface WrittenOperation {
  kind: OperationKind;
  /** How messages name it: its kind, or for DELETE/INSERT the clauses written (`INSERT … WHERE`). */
  name: string;
  /** Where its first keyword is. */
  line: number;
  column: number;
  /** The triples it inserts (INSERT DATA, or the INSERT template). */
  insert: PlacedTriple[];
  /** The triples it deletes (DELETE DATA, DELETE WHERE's pattern, or the DELETE template). */
  delete: PlacedTriple[];
}

/** The operations of an update, or where its text stops making sense to this reader. */
export type WrittenUpdate = { operations: WrittenOperation[] } | { error: TokenError };

const MANAGEMENT = new Set(['LOAD', 'CLEAR', 'CREATE', 'DROP', 'COPY', 'MOVE', 'ADD']);

/** Reads the operations of an update text; `base` is the IRI relative IRIs resolve against before any BASE. */
export function readUpdateText(text: string, base: string | undefined): WrittenUpdate {
  const { tokens, error } = tokenize(text);
  if (error !== undefined) return { error };
  const reader = new UpdateReader(tokens, base);
  try {
    return { operations: reader.operations() };
  } catch (thrown) {
    if (thrown instanceof ReadError) return { error: { message: thrown.message, line: thrown.line, column: thrown.column } };
    throw thrown;
  }
}

class ReadError extends Error {
  constructor(
    message: string,
    readonly line: number,
    readonly column: number,
  ) {
    super(message);
  }
}

/** A recursive-descent reader over the tokens; nesting depth follows the text's brackets only. */
class UpdateReader {
  private index = 0;
  private readonly prefixes = new Map<string, string>();
  private blankCount = 0;

  constructor(
    private readonly tokens: Token[],
    private base: string | undefined,
  ) {}

  operations(): WrittenOperation[] {
    const operations: WrittenOperation[] = [];
    for (;;) {
      this.prologue();
      if (this.atEnd()) return operations;
      operations.push(this.operation());
      if (this.atEnd()) return operations;
      this.expect(';');
    }
  }

  private prologue(): void {
    for (;;) {
      const keyword = this.keyword();
      if (keyword === 'BASE') {
        this.index += 1;
        this.base = this.iri(this.next());
      } else if (keyword === 'PREFIX') {
        this.index += 1;
        const name = this.next();
        if (name.kind !== 'pname' || !name.text.endsWith(':') || name.text.indexOf(':') !== name.text.length - 1) throw this.errorAt(name, 'a prefix name such as ex:');
        this.prefixes.set(name.text.slice(0, -1), this.iri(this.next()));
      } else {
        return;
      }
    }
  }

  private operation(): WrittenOperation {
    const first = this.peek();
    const keyword = this.keyword();
    const placed = (kind: OperationKind, insert: PlacedTriple[] = [], remove: PlacedTriple[] = [], name: string = kind): WrittenOperation => ({
      kind,
      name,
      line: first.line,
      column: first.column,
      insert,
      delete: remove,
    });
    if (keyword !== undefined && MANAGEMENT.has(keyword)) {
      this.skipToOperationEnd();
      return placed(keyword as OperationKind);
    }
    if (keyword === 'WITH') {
      this.index += 1;
      this.next();
      return this.modify(placed);
    }
    if (keyword === 'INSERT' && this.keywordAt(this.index + 1) === 'DATA') {
      this.index += 2;
      return placed('INSERT DATA', this.quadBlock());
    }
    if (keyword === 'DELETE' && this.keywordAt(this.index + 1) === 'DATA') {
      this.index += 2;
      return placed('DELETE DATA', [], this.quadBlock());
    }
    if (keyword === 'DELETE' && this.keywordAt(this.index + 1) === 'WHERE') {
      this.index += 2;
      return placed('DELETE WHERE', [], this.quadBlock());
    }
    if (keyword === 'INSERT' || keyword === 'DELETE') return this.modify(placed);
    throw this.errorAt(first, 'an update operation (INSERT, DELETE, LOAD, CLEAR, CREATE, DROP, COPY, MOVE, ADD)');
  }

  /** DELETE {…} INSERT {…} USING … WHERE {…}, with either template left out. */
  private modify(placed: (kind: OperationKind, insert?: PlacedTriple[], remove?: PlacedTriple[], name?: string) => WrittenOperation): WrittenOperation {
    let remove: PlacedTriple[] = [];
    let insert: PlacedTriple[] = [];
    const clauses: string[] = [];
    if (this.keyword() === 'DELETE') {
      this.index += 1;
      remove = this.quadBlock();
      clauses.push('DELETE');
    }
    if (this.keyword() === 'INSERT') {
      this.index += 1;
      insert = this.quadBlock();
      clauses.push('INSERT');
    }
    // USING clauses and the WHERE pattern are read from sparqljs's parse; here they are only passed over.
    this.skipToOperationEnd();
    return placed('DELETE/INSERT', insert, remove, `${clauses.join(' … ')} … WHERE`);
  }

  private skipToOperationEnd(): void {
    let depth = 0;
    while (!this.atEnd()) {
      const token = this.peek();
      if (token.kind === 'punct') {
        if (token.text === '{' || token.text === '(' || token.text === '[') depth += 1;
        else if (token.text === '}' || token.text === ')' || token.text === ']') depth -= 1;
        else if (token.text === ';' && depth === 0) return;
      }
      this.index += 1;
    }
  }

  /** `{ Quads }`: triples, and GRAPH blocks of triples. */
  private quadBlock(): PlacedTriple[] {
    const triples: PlacedTriple[] = [];
    this.expect('{');
    for (;;) {
      if (this.isPunct('}')) {
        this.index += 1;
        return triples;
      }
      if (this.keyword() === 'GRAPH') {
        this.index += 1;
        const graph = this.term(this.next(), 'graph');
        this.expect('{');
        this.triplesUntil('}', graph, triples);
        this.index += 1;
        if (this.isPunct('.')) this.index += 1;
        continue;
      }
      this.triplesUntil('}', undefined, triples, true);
    }
  }

  /** TriplesTemplate up to the closing token (left unread); with `stopAtGraph`, also before a GRAPH keyword. */
  private triplesUntil(close: string, graph: TemplateTerm | undefined, out: PlacedTriple[], stopAtGraph = false): void {
    while (!this.isPunct(close) && !(stopAtGraph && this.keyword() === 'GRAPH')) {
      this.triplesSameSubject(graph, out);
      if (this.isPunct('.')) this.index += 1;
      else if (!this.isPunct(close) && !(stopAtGraph && this.keyword() === 'GRAPH')) throw this.errorAt(this.peek(), `'.' or '${close}'`);
    }
  }

  private triplesSameSubject(graph: TemplateTerm | undefined, out: PlacedTriple[]): void {
    const first = this.peek();
    if (this.isPunct('[') && !this.isPunctAt(this.index + 1, ']')) {
      const subject = this.graphNode(graph, out);
      if (!this.isPunct('.') && !this.isPunct('}')) this.propertyList(subject, first, graph, out);
      return;
    }
    if (this.isPunct('(') && !this.isPunctAt(this.index + 1, ')')) {
      const subject = this.graphNode(graph, out);
      if (!this.isPunct('.') && !this.isPunct('}')) this.propertyList(subject, first, graph, out);
      return;
    }
    const subject = this.graphNode(graph, out);
    this.propertyList(subject, first, graph, out);
  }

  /** PropertyListNotEmpty: `verb objects (; verb objects)*`, each triple placed at the subject's token. */
  private propertyList(subject: TemplateTerm, at: Token, graph: TemplateTerm | undefined, out: PlacedTriple[]): void {
    for (;;) {
      const predicate = this.verb();
      for (;;) {
        const objectToken = this.peek();
        const object = this.graphNode(graph, out);
        out.push({ subject, predicate, object, graph, line: at.line, column: at.column, objectLine: objectToken.line });
        if (!this.isPunct(',')) break;
        this.index += 1;
      }
      if (!this.isPunct(';')) return;
      while (this.isPunct(';')) this.index += 1;
      if (this.isPunct('.') || this.isPunct('}') || this.isPunct(']')) return;
    }
  }

  private verb(): TemplateTerm {
    const token = this.next();
    if (token.kind === 'word' && token.text === 'a') return { kind: 'iri', value: RDF_TYPE };
    return this.term(token, 'predicate');
  }

  /** A term, a blank node property list `[ … ]` or a collection `( … )`; nested triples go to `out`. */
  private graphNode(graph: TemplateTerm | undefined, out: PlacedTriple[]): TemplateTerm {
    const token = this.peek();
    if (token.kind === 'punct' && token.text === '[') {
      this.index += 1;
      const node = this.freshBlank();
      if (this.isPunct(']')) {
        this.index += 1;
        return node;
      }
      this.propertyList(node, token, graph, out);
      this.expect(']');
      return node;
    }
    if (token.kind === 'punct' && token.text === '(') {
      this.index += 1;
      const items: { term: TemplateTerm; token: Token }[] = [];
      while (!this.isPunct(')')) {
        const itemToken = this.peek();
        items.push({ term: this.graphNode(graph, out), token: itemToken });
      }
      this.index += 1;
      if (items.length === 0) return { kind: 'iri', value: RDF_NIL };
      const nodes = items.map(() => this.freshBlank());
      items.forEach((item, position) => {
        const node = nodes[position];
        const rest = position + 1 < nodes.length ? nodes[position + 1] : ({ kind: 'iri', value: RDF_NIL } as const);
        const place = { graph, line: item.token.line, column: item.token.column, objectLine: item.token.line };
        out.push({ subject: node, predicate: { kind: 'iri', value: RDF_FIRST }, object: item.term, ...place });
        out.push({ subject: node, predicate: { kind: 'iri', value: RDF_REST }, object: rest, ...place });
      });
      return nodes[0];
    }
    this.index += 1;
    return this.term(token, 'term');
  }

  // An anonymous node's label starts with '-', which no written label can (SPARQL 1.1 §19.8, BLANK_NODE_LABEL).
  private freshBlank(): TemplateTerm {
    this.blankCount += 1;
    return { kind: 'blank', label: `-${this.blankCount}` };
  }

  private term(token: Token, role: string): TemplateTerm {
    switch (token.kind) {
      case 'iri':
        return { kind: 'iri', value: this.iri(token) };
      case 'pname':
        return { kind: 'iri', value: this.prefixedName(token) };
      case 'blank':
        return { kind: 'blank', label: token.text.slice(2) };
      case 'variable':
        return { kind: 'variable', name: token.text.slice(1) };
      case 'string':
        return { kind: 'literal', literal: this.literal(token) };
      case 'number':
        return { kind: 'literal', literal: numberLiteral(token.text) };
      case 'word':
        if (token.text === 'true' || token.text === 'false') return { kind: 'literal', literal: { value: token.text, datatype: XSD_BOOLEAN, language: '' } };
        break;
      default:
        break;
    }
    throw this.errorAt(token, `a ${role} (an IRI, prefixed name, blank node, literal or variable)`);
  }

  private literal(token: Token): Literal {
    const long = token.text.startsWith('"""') || token.text.startsWith("'''");
    const body = token.text.slice(long ? 3 : 1, long ? -3 : -1);
    const value = unescapeString(body);
    const after = this.peek();
    if (after !== undefined && after.kind === 'langtag') {
      this.index += 1;
      return { value, datatype: `${RDF_NAMESPACE}langString`, language: after.text.slice(1).toLowerCase() };
    }
    if (after !== undefined && after.kind === 'punct' && after.text === '^^') {
      this.index += 1;
      const datatype = this.next();
      const iri = datatype.kind === 'iri' ? this.iri(datatype) : datatype.kind === 'pname' ? this.prefixedName(datatype) : undefined;
      if (iri === undefined) throw this.errorAt(datatype, 'a datatype IRI after ^^');
      return { value, datatype: iri, language: '' };
    }
    return { value, datatype: XSD_STRING, language: '' };
  }

  private iri(token: Token): string {
    if (token.kind !== 'iri') throw this.errorAt(token, 'an IRI in <…>');
    const written = unescapeCodepoints(token.text.slice(1, -1));
    if (/^[A-Za-z][A-Za-z0-9+.-]*:/.test(written)) return written;
    if (this.base === undefined) throw this.errorAt(token, `an absolute IRI: <${written}> is relative and no BASE is set`);
    return resolveIri(written, this.base);
  }

  private prefixedName(token: Token): string {
    const colon = token.text.indexOf(':');
    const prefix = token.text.slice(0, colon);
    const namespace = this.prefixes.get(prefix);
    if (namespace === undefined) throw this.errorAt(token, `a declared prefix: ${prefix}: has no PREFIX line`);
    return namespace + token.text.slice(colon + 1).replace(/\\(.)/g, '$1');
  }

  private keyword(): string | undefined {
    return this.keywordAt(this.index);
  }

  private keywordAt(index: number): string | undefined {
    const token = this.tokens[index];
    return token !== undefined && token.kind === 'word' ? token.text.toUpperCase() : undefined;
  }

  private isPunct(text: string): boolean {
    return this.isPunctAt(this.index, text);
  }

  private isPunctAt(index: number, text: string): boolean {
    const token = this.tokens[index];
    return token !== undefined && token.kind === 'punct' && token.text === text;
  }

  private expect(text: string): void {
    if (!this.isPunct(text)) throw this.errorAt(this.peek(), `'${text}'`);
    this.index += 1;
  }

  private atEnd(): boolean {
    return this.index >= this.tokens.length;
  }

  private peek(): Token {
    return this.tokens[this.index];
  }

  private next(): Token {
    const token = this.tokens[this.index];
    if (token === undefined) throw this.endError();
    this.index += 1;
    return token;
  }

  private endError(): ReadError {
    const last = this.tokens[this.tokens.length - 1];
    return new ReadError('the update ends in the middle of an operation', last?.line ?? 1, last?.column ?? 1);
  }

  private errorAt(token: Token | undefined, expected: string): ReadError {
    if (token === undefined) return this.endError();
    return new ReadError(`expected ${expected}, found ${token.text}`, token.line, token.column);
  }
}
