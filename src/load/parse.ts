// Parsing Turtle, TriG, N-Triples and N-Quads with n3, chunk by chunk, into statements that know the line and column of their subject.
import { createHash } from 'node:crypto';
import { relative, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import type * as RDF from '@rdfjs/types';
import type { InputError, LoadedSource, N3Format } from './statement.js';
import { createLexer, N3_FORMAT_NAME, startChunkedParse, type N3ChunkFeed, type N3Token } from './n3-tokens.js';
import { StatementList, type StatementSink } from './statement-sink.js';
import { LineWindow } from './line-window.js';
import { TermPositions } from './term-positions.js';
import { formatName, toInputError } from './syntax-error.js';
import { readAllowComment } from './allow-comments.js';

/** Options of `parseSource` and `N3SourceReader`. */
export interface ParseOptions {
  /** The IRI relative IRIs resolve against; default the file's `file://` URL. */
  baseIri?: string;
  /** The folder a relative file name starts from; default the process's working folder. */
  cwd?: string;
  /** The blank node label prefix, when the caller has already worked it out for the file. */
  blankNodePrefix?: string;
  /** Whether the text is one line of a larger source whose other lines are read anyway (changes error messages). */
  singleLine?: boolean;
  /** Where the statements go as they are read; default a list returned as the source's `statements`. */
  sink?: StatementSink;
  /**
   * For the parsers that take an iterable of chunks: asked once the chunks have ended, whether the
   * input broke off (a failed read, a bad byte). Then the end of the chunks is not the end of the
   * document, and an unfinished statement or element there is not reported as a syntax error.
   */
  brokenOff?: () => boolean;
}

/** The file name the loader gives standard input. */
export const STDIN_FILE = '<stdin>';

/**
 * Parses one source held whole, synchronously: the text is given to an `N3SourceReader` as one
 * chunk. On a syntax error it keeps every statement read before it and records one InputError,
 * since n3 cannot resume after an error.
 */
export function parseSource(text: string, file: string, format: N3Format, options: ParseOptions = {}): LoadedSource {
  const reader = new N3SourceReader(file, format, options);
  reader.write(text);
  return reader.end();
}

/**
 * Reads one Turtle, TriG, N-Triples or N-Quads source given in text chunks with n3, and follows
 * its tokens (`onToken`/`onTokenEnd`) to give every statement the line and column of its subject
 * and the line of its object. Statements go to the sink as soon as the token that completes them
 * is read; of the text, only the lines the lexer has not finished with are kept, for the message
 * of a syntax error. Where a chunk ends makes no difference to what is read.
 */
export class N3SourceReader {
  private readonly source: LoadedSource;
  private readonly sink: StatementSink;
  private readonly list: StatementList | undefined;
  private readonly positions: TermPositions;
  private readonly pendingQuads: RDF.Quad[] = [];
  private readonly window = new LineWindow();
  private readonly feed: N3ChunkFeed;
  private lastCodeLine = 0;
  private atStart = true;

  constructor(file: string, format: N3Format, options: ParseOptions = {}) {
    this.source = { file, format, statements: [], errors: [], allowComments: [], prefixes: {} };
    this.list = options.sink === undefined ? new StatementList(file) : undefined;
    this.sink = options.sink ?? (this.list as StatementList);
    const cwd = options.cwd ?? process.cwd();
    const labelPrefix = options.blankNodePrefix ?? blankNodeLabelPrefix(file, cwd);
    this.positions = new TermPositions(labelPrefix);
    const textOfLine = (line: number): string => this.window.textOfLine(line);
    this.feed = startChunkedParse(
      {
        format: N3_FORMAT_NAME[format],
        baseIRI: options.baseIri ?? defaultBaseIri(file, cwd),
        blankNodePrefix: labelPrefix,
        factory: this.positions.factory,
        lexer: createLexer(format === 'n-triples' || format === 'n-quads'),
      },
      {
        onQuad: (error, quad) => {
          if (error) this.source.errors.push(toInputError({ file, format, textOfLine, error, singleLine: options.singleLine }));
          else if (quad) this.pendingQuads.push(quad);
        },
        onPrefix: (prefix, namespace) => {
          this.source.prefixes[prefix] = namespace.value;
        },
        onToken: (token) => {
          if (token.type === 'comment') this.readComment(token);
          else this.positions.beginToken(token);
        },
        onTokenEnd: (token) => {
          if (token.type === 'comment') return;
          this.positions.endToken(token);
          this.lastCodeLine = token.endLine ?? token.line;
          this.flushPending();
        },
      },
    );
  }

  /** Whether n3 has stopped at a syntax error, so later chunks would not be read. */
  get stopped(): boolean {
    return this.feed.unread() === null;
  }

  /** Reads the next chunk of the text as far as it goes. */
  write(chunk: string): void {
    let text = chunk;
    // One byte order mark at the start is dropped here (the text's first character, however the chunks fall).
    if (this.atStart && text !== '') {
      this.atStart = false;
      if (text.startsWith('\ufeff')) text = text.slice(1);
    }
    if (text === '') return;
    this.window.append(text);
    this.feed.write(text);
    const unread = this.feed.unread();
    if (unread !== null) this.window.dropBefore(unread.length);
  }

  /** Ends the text, finishing its last statement, and returns the source (its `statements` only when no sink was given). */
  end(): LoadedSource {
    this.feed.end();
    return this.stop();
  }

  /** Returns the source as read so far, without ending the text: for input that broke off, whose cut is no syntax error. */
  stop(): LoadedSource {
    this.flushPending();
    if (this.list !== undefined) this.source.statements = this.list.statements;
    return this.source;
  }

  // Statements wait until their token is fully read, when every term's place is settled.
  private flushPending(): void {
    const pending = this.pendingQuads;
    // Most tokens complete no statement; the array is left alone for them.
    if (pending.length === 0) return;
    for (const quad of pending) this.addStatement(quad);
    pending.length = 0;
  }

  private readComment(token: N3Token): void {
    const site = { file: this.source.file, line: token.line, column: token.start + 1, ownLine: this.lastCodeLine !== token.line };
    const reading = readAllowComment(token.value, site);
    if (reading.kind === 'allow') this.source.allowComments.push(reading.comment);
    else if (reading.kind === 'malformed') this.source.errors.push(reading.error);
  }

  /** Hands one n3 quad to the sink, or records an InputError when it holds a term isapart cannot keep. */
  private addStatement(quad: RDF.Quad): void {
    const { subject, object } = quad;
    const { positions } = this;
    if (subject.termType === 'Quad' || object.termType === 'Quad') {
      this.source.errors.push(tripleTermError(this.source, positions.lineOf(subject), positions.columnOf(subject)));
      return;
    }
    this.sink.add(quad, positions.lineOf(subject), positions.columnOf(subject), positions.lineOf(object));
  }
}

/**
 * The blank node label prefix of a file: `b`, 8 hex digits of the SHA-1 of its path relative to
 * `cwd` (with `/` separators, so `a.ttl`, `./a.ttl` and `sub/../a.ttl` agree), and `_`.
 * Standard input has a fixed prefix.
 */
export function blankNodeLabelPrefix(file: string, cwd: string = process.cwd()): string {
  const name = file === STDIN_FILE || file === '-' ? STDIN_FILE : normalisedPath(file, cwd);
  return `b${createHash('sha1').update(name).digest('hex').slice(0, 8)}_`;
}

/** The base IRI of a file when none is given: its absolute `file://` URL (`file:///dev/stdin` for stdin). */
export function defaultBaseIri(file: string, cwd: string = process.cwd()): string {
  if (file === STDIN_FILE || file === '-') return 'file:///dev/stdin';
  return pathToFileURL(resolve(cwd, file)).href;
}

/** A file's path relative to `cwd`, `/`-separated. */
function normalisedPath(file: string, cwd: string): string {
  return relative(cwd, resolve(cwd, file)).split(sep).join('/');
}

function tripleTermError(source: LoadedSource, line: number, column: number): InputError {
  return {
    file: source.file,
    line,
    column,
    message: `${formatName(source.format)} statement with an RDF 1.2 triple term was skipped: isapart reads RDF 1.1 statements only.`,
    hint: 'state the relation as a plain statement between IRIs or blank nodes',
  };
}
