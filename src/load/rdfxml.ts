// Parsing RDF/XML with rdfxml-streaming-parser, chunk by chunk, placing each statement at the element that states it.
import type * as RDF from '@rdfjs/types';
import type { SaxesTagNS } from '@rubensworks/saxes';
import { RdfXmlParser, type IActiveTag } from 'rdfxml-streaming-parser';
import type { LoadedSource } from './statement.js';
import { blankNodeLabelPrefix, defaultBaseIri, type ParseOptions } from './parse.js';
import { LineCounter, type LineColumn } from './line-counter.js';
import { addQuad, prefixedBlankNodeFactory, type StatementPlace } from './rdfjs-terms.js';
import { rdfXmlSyntaxError } from './rdfxml-errors.js';
import { readAllowComment } from './allow-comments.js';
import { StatementList } from './statement-sink.js';
import { RDF_FIRST, RDF_REST } from '../roles/vocabulary.js';


/** The parts of the parser's SAX parser (saxes) read here; the RDF/XML parser keeps it private. */
interface SaxParser {
  readonly position: number;
  readonly line: number;
  readonly columnIndex: number;
  on(event: 'opentagstart', handler: () => void): void;
  on(event: 'comment', handler: (text: string) => void): void;
  close(): unknown;
}

/** What the parser hands back as it reads. */
interface ParserListener {
  quad(quad: RDF.Quad, place: StatementPlace): void;
  comment(text: string, place: LineColumn, ownLine: boolean): void;
  prefix(prefix: string, namespace: string): void;
}

/** What the statements emitted now belong to: a node element (with the property element it is the value of), or one element. */
type Emitting =
  | { kind: 'node'; node: LineColumn; parent: LineColumn | undefined; activeTag: IActiveTag; inCollection: boolean }
  | { kind: 'element'; element: LineColumn };

/**
 * rdfxml-streaming-parser (pinned at 3.3.0) with the element positions it does not give: each
 * element's `<` is found when saxes reports the start of a tag, and the protected handlers of the
 * parser say which element each statement comes from. A node element states its own type and
 * property attributes; the property element around it states the link to it; a collection item
 * states its list links.
 */
class PlacedRdfXmlParser extends RdfXmlParser {
  readonly lines = new LineCounter();
  /** Where a failure thrown by the parser's handlers stands: the element being read. */
  failurePlace: LineColumn | undefined;
  private readonly listener: ParserListener;
  private readonly openElements: LineColumn[] = [];
  private tagStart: LineColumn = { line: 1, column: 1 };
  private lastMarkupLine = 0;
  private emitting: Emitting = { kind: 'element', element: { line: 1, column: 1 } };
  private currentPlace: StatementPlace = { line: 1, column: 1, objectLine: 1 };

  constructor(options: ConstructorParameters<typeof RdfXmlParser>[0], listener: ParserListener) {
    super(options);
    this.listener = listener;
    const sax = this.sax();
    sax.on('opentagstart', () => {
      const start = this.lines.lastIndexBefore('<', sax.position);
      this.tagStart = this.lines.positionAt(start < 0 ? sax.position : start);
    });
    sax.on('comment', (text) => {
      const start = this.lines.lastIndexBefore('<!--', sax.position);
      const place = this.lines.positionAt(start < 0 ? sax.position : start);
      this.listener.comment(text, place, place.line > this.lastMarkupLine);
    });
  }

  /** The SAX parser inside; rdfxml-streaming-parser declares it private, so it is reached by a cast. */
  sax(): SaxParser {
    return (this as unknown as { saxParser: SaxParser }).saxParser;
  }

  /** Where saxes stands now: its line and the column of the character it read last. */
  saxPlace(): LineColumn {
    const sax = this.sax();
    return { line: sax.line, column: Math.max(1, sax.columnIndex) };
  }

  protected override onTag(tag: SaxesTagNS): void {
    const start = this.tagStart;
    this.openElements.push(start);
    this.lastMarkupLine = this.sax().line;
    for (const attribute of Object.values(tag.attributes)) {
      if (attribute.prefix === 'xmlns') this.listener.prefix(attribute.local, attribute.value);
    }
    this.failurePlace = start;
    super.onTag(tag);
    this.failurePlace = undefined;
  }

  protected override onTagResource(tag: SaxesTagNS, activeTag: IActiveTag, parentTag: IActiveTag, rootTag: boolean): void {
    const elements = this.openElements;
    this.emitting = {
      kind: 'node',
      node: elements[elements.length - 1],
      parent: elements.length > 1 ? elements[elements.length - 2] : undefined,
      activeTag,
      inCollection: parentTag?.childrenCollectionSubject !== undefined,
    };
    super.onTagResource(tag, activeTag, parentTag, rootTag);
  }

  protected override onTagProperty(tag: SaxesTagNS, activeTag: IActiveTag, parentTag: IActiveTag): void {
    this.emitting = { kind: 'element', element: this.openElements[this.openElements.length - 1] };
    super.onTagProperty(tag, activeTag, parentTag);
  }

  protected override onCloseTag(): void {
    const element = this.openElements[this.openElements.length - 1] ?? this.tagStart;
    this.lastMarkupLine = this.sax().line;
    this.emitting = { kind: 'element', element };
    this.failurePlace = element;
    super.onCloseTag();
    this.failurePlace = undefined;
    this.openElements.pop();
  }

  protected override emitTriple(
    subject: RDF.Quad_Subject,
    predicate: RDF.Quad_Predicate,
    object: RDF.Quad_Object,
    statementId?: RDF.NamedNode,
    childrenTripleTerms?: RDF.Quad[],
    reifier?: RDF.NamedNode | RDF.BlankNode,
  ): void {
    this.currentPlace = this.placeOf(subject, predicate);
    super.emitTriple(subject, predicate, object, statementId, childrenTripleTerms, reifier);
  }

  /** The parser pushes each quad here; it goes to the listener with its place instead of into a stream buffer. */
  override push(chunk: unknown): boolean {
    if (chunk !== null) this.listener.quad(chunk as RDF.Quad, this.currentPlace);
    return true;
  }

  /** The element that states a statement the parser is emitting now. */
  private placeOf(subject: RDF.Term, predicate: RDF.Term): StatementPlace {
    const emitting = this.emitting;
    if (emitting.kind === 'element') {
      const { line, column } = emitting.element;
      return { line, column, objectLine: line };
    }
    const own = emitting.activeTag.subject !== undefined && subject.equals(emitting.activeTag.subject);
    const listLink = emitting.inCollection && (predicate.value === RDF_FIRST || predicate.value === RDF_REST);
    const at = own || listLink || emitting.parent === undefined ? emitting.node : emitting.parent;
    return { line: at.line, column: at.column, objectLine: emitting.node.line };
  }
}

/** A failure of the parser, with where it stands. */
interface Failure {
  error: Error;
  place: LineColumn;
}

/**
 * Parses an RDF/XML document given as text chunks (one chunk for a whole text). Each statement is
 * placed at the element that states it; relative IRIs resolve against `xml:base`, else the given
 * base IRI, else the file's URL. A syntax error keeps the statements read before it and becomes
 * one InputError at its line and column; `<!-- isapart-allow RULE-ID: reason -->` comments are
 * read like Turtle's allow comments.
 */
export async function parseRdfXml(chunks: AsyncIterable<string>, file: string, options: ParseOptions = {}): Promise<LoadedSource> {
  const source: LoadedSource = { file, format: 'rdf-xml', statements: [], errors: [], allowComments: [], prefixes: {} };
  const cwd = options.cwd ?? process.cwd();
  const list = options.sink === undefined ? new StatementList(file) : undefined;
  const sink = options.sink ?? (list as StatementList);
  let failure: Failure | undefined;
  const parser = new PlacedRdfXmlParser(
    {
      baseIRI: options.baseIri ?? defaultBaseIri(file, cwd),
      dataFactory: prefixedBlankNodeFactory(blankNodeLabelPrefix(file, cwd)),
      trackPosition: true,
    },
    {
      quad: (quad, place) => {
        if (failure === undefined) addQuad(source, sink, quad, place);
      },
      comment: (text, place, ownLine) => {
        if (failure !== undefined) return;
        const reading = readAllowComment(text, { file, line: place.line, column: place.column, ownLine });
        if (reading.kind === 'allow') source.allowComments.push(reading.comment);
        else if (reading.kind === 'malformed') source.errors.push(reading.error);
      },
      prefix: (prefix, namespace) => {
        source.prefixes[prefix] = namespace;
      },
    },
  );
  // saxes reports a well-formedness error here and reads on; only the first one counts.
  parser.on('error', (error: Error) => {
    failure ??= { error, place: parser.saxPlace() };
  });
  const fail = (error: Error | null | undefined): void => {
    if (error) failure ??= { error, place: parser.failurePlace ?? parser.saxPlace() };
  };
  let first = true;
  for await (const raw of chunks) {
    const chunk = first && raw.startsWith('\ufeff') ? raw.slice(1) : raw;
    first = false;
    parser.lines.append(chunk);
    parser._transform(chunk, 'utf8', fail);
    if (failure !== undefined) break;
  }
  if (failure === undefined && options.brokenOff?.() !== true) {
    // An unclosed element or a missing root shows only when saxes is told the text has ended.
    try {
      parser.sax().close();
    } catch (error) {
      fail(error as Error);
    }
  }
  if (failure !== undefined) source.errors.push(rdfXmlSyntaxError(file, failure.error, failure.place));
  if (list !== undefined) source.statements = list.statements;
  return source;
}
