// The parts of n3 2.13.12 the loader relies on beyond its published typings: tokens, a synchronous lexer, chunked input.
import { EventEmitter } from 'node:events';
import { Lexer, Parser, type Token, type TokenCallback } from 'n3';
import type * as RDF from '@rdfjs/types';
import type { N3Format } from './statement.js';

/** The name n3's parser takes for each syntax. */
export const N3_FORMAT_NAME: Readonly<Record<N3Format, string>> = Object.freeze({
  turtle: 'Turtle',
  trig: 'TriG',
  'n-triples': 'N-Triples',
  'n-quads': 'N-Quads',
});

/**
 * A lexer token as n3 2.x hands it to `onToken`/`onTokenEnd`: 1-based `line`, 0-based end-exclusive
 * UTF-16 `start`/`end` within that line; a token spanning lines also has `endLine`.
 */
export interface N3Token {
  type: string;
  value: string;
  prefix: string;
  line: number;
  start: number;
  end: number;
  endLine?: number;
}

/** The context n3 attaches to a syntax error; `token` is undefined when the lexer raised it. */
export interface N3ErrorContext {
  token?: N3Token;
  line: number;
  previousToken?: N3Token;
}

/** The named callbacks of n3 2.x `Parser.parse`. */
export interface N3ParseCallbacks {
  onQuad: (error: (Error & { context?: N3ErrorContext }) | null, quad: RDF.Quad | null) => void;
  onPrefix?: (prefix: string, namespace: RDF.NamedNode) => void;
  onToken?: (token: N3Token) => void;
  onTokenEnd?: (token: N3Token) => void;
}

/** The options of n3 2.x `Parser` that the loader passes. */
export interface N3ParserOptions {
  format: string;
  baseIRI?: string;
  blankNodePrefix: string;
  factory: RDF.DataFactory;
  lexer: Lexer;
}

interface LexerInternals {
  _tokenizeString(input: string, callback: (error: Error | null, token: N3Token) => void): void;
  /** The text read but not yet lexed: undefined before the first chunk, null once the lexer stopped at an error. */
  _input: string | null | undefined;
}

/**
 * A lexer that hands a string's tokens over synchronously even when given a callback.
 * n3's own lexer defers a string to a microtask when a callback is given, and without one it
 * lexes the whole input before parsing, so a late lexical error would lose the statements before it.
 * This calls the private `_tokenizeString`, which is why n3 is pinned to exactly 2.13.12.
 */
export class SynchronousLexer extends Lexer {
  /** Tokenizes a string synchronously through the callback; other inputs go to n3's own lexer. */
  override tokenize(input: string): Token[];
  override tokenize(input: string | EventEmitter, callback: TokenCallback): void;
  override tokenize(input: string | EventEmitter, callback?: TokenCallback): Token[] | void {
    if (callback === undefined) return super.tokenize(input as string);
    if (typeof input !== 'string') return super.tokenize(input, callback);
    const internals = this as unknown as Partial<LexerInternals>;
    if (typeof internals._tokenizeString !== 'function') {
      throw new Error('n3 lexer internals changed: isapart needs n3 2.13.12 exactly');
    }
    internals._tokenizeString(input, callback as unknown as (error: Error | null, token: N3Token) => void);
  }
}

/** Creates n3's lexer for a format, with comment tokens switched on. */
export function createLexer(lineMode: boolean): SynchronousLexer {
  return new SynchronousLexer({ lineMode, n3: false, comments: true });
}

/** Text handed to n3's parser chunk by chunk; each chunk is lexed and parsed before `write` returns. */
export interface N3ChunkFeed {
  /** Lexes and parses the next chunk as far as it goes; a token cut at its end waits for the next chunk. */
  write(text: string): void;
  /** Says the text has ended, so the last token and statement are finished (or found incomplete). */
  end(): void;
  /** The text the lexer holds unread (the start of an unfinished token), '' when none, or null after a syntax error. */
  unread(): string | null;
}

/**
 * Starts n3's parser on a text that will come in chunks. n3's lexer takes a stream as an event
 * emitter of `data` and `end`: it keeps the unread tail of each chunk and goes on with the next one,
 * synchronously within the event, so the callbacks have run for every complete token when `write`
 * returns. `unread` reads the lexer's private `_input` (n3 is pinned to 2.13.12 exactly).
 */
export function startChunkedParse(options: N3ParserOptions, callbacks: N3ParseCallbacks): N3ChunkFeed {
  const parser = new Parser(options as unknown as ConstructorParameters<typeof Parser>[0]);
  const parse = parser.parse as unknown as (input: EventEmitter, callbacks: N3ParseCallbacks) => void;
  const input = new EventEmitter();
  parse.call(parser, input, callbacks);
  const lexer = options.lexer as unknown as Partial<LexerInternals>;
  return {
    write: (text) => {
      if (text !== '') input.emit('data', text);
    },
    end: () => {
      input.emit('end');
    },
    unread: () => (lexer._input === undefined ? '' : lexer._input),
  };
}

/** Runs n3's parser synchronously over a whole string with token callbacks, as one chunk. */
export function parseWithTokens(text: string, options: N3ParserOptions, callbacks: N3ParseCallbacks): void {
  const feed = startChunkedParse(options, callbacks);
  feed.write(text);
  feed.end();
}
