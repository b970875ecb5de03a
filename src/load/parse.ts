// Parsing one source text with n3 into statements that know the line and column of their subject.
import { createHash } from 'node:crypto';
import { relative, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import type * as RDF from '@rdfjs/types';
import { Literal as N3Literal } from 'n3';
import type { InputError, Literal, LoadedSource, N3Format, Statement } from './statement.js';
import { createLexer, N3_FORMAT_NAME, parseWithTokens, type N3Token } from './n3-tokens.js';
import { TermPositions } from './term-positions.js';
import { formatName, toInputError } from './syntax-error.js';
import { readAllowComment } from './allow-comments.js';

/** Options of `parseSource`. */
export interface ParseOptions {
  /** The IRI relative IRIs resolve against; default the file's `file://` URL. */
  baseIri?: string;
  /** The folder a relative file name starts from; default the process's working folder. */
  cwd?: string;
  /** The blank node label prefix, when the caller has already worked it out for the file. */
  blankNodePrefix?: string;
  /** Whether the text is one line of a larger source whose other lines are read anyway (changes error messages). */
  singleLine?: boolean;
}

/** The file name the loader gives standard input. */
export const STDIN_FILE = '<stdin>';

/**
 * Parses one source synchronously. On a syntax error it keeps every statement read before it and
 * records one InputError, since n3 cannot resume after an error.
 */
export function parseSource(text: string, file: string, format: N3Format, options: ParseOptions = {}): LoadedSource {
  const source: LoadedSource = { file, format, statements: [], errors: [], allowComments: [], prefixes: {} };
  const input = text.startsWith('\ufeff') ? text.slice(1) : text;
  const cwd = options.cwd ?? process.cwd();
  const labelPrefix = options.blankNodePrefix ?? blankNodeLabelPrefix(file, cwd);
  const positions = new TermPositions(labelPrefix);
  const pendingQuads: RDF.Quad[] = [];
  let lastCodeLine = 0;

  // Statements wait until their token is fully read, when every term's place is settled.
  const flushPending = (): void => {
    for (const quad of pendingQuads) addStatement(source, quad, positions);
    pendingQuads.length = 0;
  };
  const readComment = (token: N3Token): void => {
    const site = { file, line: token.line, column: token.start + 1, ownLine: lastCodeLine !== token.line };
    const reading = readAllowComment(token.value, site);
    if (reading.kind === 'allow') source.allowComments.push(reading.comment);
    else if (reading.kind === 'malformed') source.errors.push(reading.error);
  };

  parseWithTokens(
    input,
    {
      format: N3_FORMAT_NAME[format],
      baseIRI: options.baseIri ?? defaultBaseIri(file, cwd),
      blankNodePrefix: labelPrefix,
      factory: positions.factory,
      lexer: createLexer(format === 'n-triples' || format === 'n-quads'),
    },
    {
      onQuad: (error, quad) => {
        if (error) source.errors.push(toInputError({ file, format, text: input, error, singleLine: options.singleLine }));
        else if (quad) pendingQuads.push(quad);
      },
      onPrefix: (prefix, namespace) => {
        source.prefixes[prefix] = namespace.value;
      },
      onToken: (token) => {
        if (token.type === 'comment') readComment(token);
        else positions.beginToken(token);
      },
      onTokenEnd: (token) => {
        if (token.type === 'comment') return;
        positions.endToken(token);
        lastCodeLine = token.endLine ?? token.line;
        flushPending();
      },
    },
  );
  flushPending();
  return source;
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

/** Turns one n3 quad into a Statement, or into an InputError when it holds a term isapart cannot keep. */
function addStatement(source: LoadedSource, quad: RDF.Quad, positions: TermPositions): void {
  const { subject, object } = quad;
  const line = positions.lineOf(subject);
  const column = positions.columnOf(subject);
  if (subject.termType === 'Quad' || object.termType === 'Quad') {
    source.errors.push(tripleTermError(source, line, column));
    return;
  }
  const statement: Statement = {
    subject: termText(subject),
    predicate: quad.predicate.value,
    object: object.termType === 'Literal' ? literalOf(object) : termText(object),
    graph: quad.graph.termType === 'DefaultGraph' ? '' : termText(quad.graph),
    position: { file: source.file, line, column },
    objectLine: positions.lineOf(object),
  };
  source.statements.push(statement);
}

/** A literal's parts; n3's `datatypeString` gives the datatype IRI without making a term for it. */
export function literalOf(literal: RDF.Literal): Literal {
  const datatype = literal instanceof N3Literal ? literal.datatypeString : literal.datatype.value;
  return { value: literal.value, datatype, language: literal.language };
}

/** An IRI as itself, a blank node as `_:label`. */
export function termText(term: RDF.Term): string {
  return term.termType === 'BlankNode' ? `_:${term.value}` : term.value;
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
