// Parsing JSON-LD with jsonld-streaming-parser, chunk by chunk, placing each statement at the node object that states it.
import type * as RDF from '@rdfjs/types';
import { JsonLdParser } from 'jsonld-streaming-parser';
import type { InputError, LoadedSource } from './statement.js';
import { blankNodeLabelPrefix, defaultBaseIri, type ParseOptions } from './parse.js';
import type { LineColumn } from './line-counter.js';
import { JsonPlaces, type JsonKey } from './json-places.js';
import { addQuad, prefixedBlankNodeFactory } from './rdfjs-terms.js';
import { LocalContextLoader, type ContextMap } from './jsonld-contexts.js';
import { StatementList } from './statement-sink.js';

/** Options of `parseJsonLd`: those of every parser, and where remote contexts have local copies. */
export interface JsonLdParseOptions extends ParseOptions {
  /** Context IRI → absolute path of a local copy; no other remote context is read. */
  contexts?: ContextMap;
}

/** The parts of the parser's state read or wrapped here; jsonld-streaming-parser keeps them private. */
interface ParserInternals {
  parsingContext: {
    getUnidentifiedValueBufferSafe(depth: number): BufferedValue[];
    getUnidentifiedGraphBufferSafe(depth: number): BufferedValue[];
    getExpandOptions(): unknown;
  };
  util: { predicateToTerm(context: ExpandingContext, key: unknown): RDF.Term | null };
  lastOnValueJob: Promise<void>;
}

/** The part of a parsed JSON-LD context used here: expanding a key as a vocabulary term. */
interface ExpandingContext {
  expandTerm(term: string, vocab: boolean, options: unknown): string | null;
}

/** What the parser reports besides statements: a key whose value JSON-LD drops, at its node object. */
type DroppedKeyListener = (key: string, place: LineColumn) => void;

/** A statement part the parser holds back until a node's `@id` or its graph is known. */
interface BufferedValue {
  subject?: RDF.Term;
  object?: RDF.Term;
}

const START: LineColumn = { line: 1, column: 1 };

/**
 * jsonld-streaming-parser (pinned at 5.0.1) with the places it does not give. The parser works in
 * jobs, one per JSON value, each with the path of keys to its value; `JsonPlaces` read the same text
 * and know where each object on such a path starts, so a statement is placed at the node object
 * around the value whose job emits it. Statements the parser holds back until a later `@id` or the
 * end of a graph keep the place of the job that held them back, by the identity of their terms.
 */
class PlacedJsonLdParser extends JsonLdParser {
  private readonly places: JsonPlaces;
  private readonly onQuad: (quad: RDF.Quad, place: LineColumn) => void;
  private readonly heldBack = new WeakMap<RDF.Term, LineColumn>();
  /** The node object of the job being run. */
  currentPlace: LineColumn = START;
  /** The member name the job's value stands under (through array items), or undefined at the root. */
  private currentKey: JsonKey | undefined;

  constructor(
    options: ConstructorParameters<typeof JsonLdParser>[0],
    places: JsonPlaces,
    listeners: { quad: (quad: RDF.Quad, place: LineColumn) => void; droppedKey: DroppedKeyListener },
  ) {
    super(options);
    this.places = places;
    this.onQuad = listeners.quad;
    const internals = this as unknown as ParserInternals;
    const context = internals.parsingContext;
    for (const name of ['getUnidentifiedValueBufferSafe', 'getUnidentifiedGraphBufferSafe'] as const) {
      const original = context[name].bind(context);
      context[name] = (depth: number) => this.remembering(original(depth));
    }
    // A key that expands to no IRI states nothing, and JSON-LD drops it without a word; it is reported instead.
    // A key mapped to null in the context is dropped on purpose and expands to nothing, so it is not reported.
    const util = internals.util;
    const predicateToTerm = util.predicateToTerm.bind(util);
    util.predicateToTerm = (termContext, key) => {
      const term = predicateToTerm(termContext, key);
      // Only the job of the key's own value reports it, so checks made for values deeper down do not repeat it.
      const ownKey = key === this.currentKey;
      if (term === null && ownKey && typeof key === 'string' && !key.startsWith('@') && termContext.expandTerm(key, true, context.getExpandOptions())) {
        listeners.droppedKey(key, this.currentPlace);
      }
      return term;
    };
  }

  /** Waits for the jobs of the text written so far. */
  settled(): Promise<void> {
    return (this as unknown as ParserInternals).lastOnValueJob;
  }

  override async newOnValueJob(keys: JsonKey[], value: unknown, depth: number, lastDepthCheck: boolean): Promise<void> {
    const place = this.nodeAround(keys, depth);
    let key = depth;
    while (key > 0 && typeof keys[key] === 'number') key--;
    const ownKey = keys[key];
    this.currentPlace = place;
    this.currentKey = ownKey;
    await super.newOnValueJob(keys, value, depth, lastDepthCheck);
    this.currentPlace = place;
    this.currentKey = ownKey;
  }

  override async flushBuffer(depth: number, keys: JsonKey[]): Promise<void> {
    const jobPlace = this.currentPlace;
    this.currentPlace = this.nodeAround(keys, depth);
    await super.flushBuffer(depth, keys);
    this.currentPlace = jobPlace;
  }

  /** The parser pushes each quad here; it goes to the listener with its place instead of into a stream buffer. */
  override push(chunk: unknown): boolean {
    if (chunk === null) return true;
    const quad = chunk as RDF.Quad;
    const place = this.heldBack.get(quad.object) ?? this.heldBack.get(quad.subject) ?? this.currentPlace;
    this.onQuad(quad, place);
    return true;
  }

  /** The node object whose members hold the key at `depth` of a job's path (the root has path [undefined]). */
  private nodeAround(keys: JsonKey[], depth: number): LineColumn {
    return this.places.enclosingNode(keys.slice(1, depth + 1)) ?? START;
  }

  /** A buffer whose held-back values remember the place of the job that held them back. */
  private remembering(buffer: BufferedValue[]): BufferedValue[] {
    if (Object.prototype.hasOwnProperty.call(buffer, 'push')) return buffer;
    const remember = (term: RDF.Term | undefined): void => {
      if (term !== undefined && typeof term === 'object' && !this.heldBack.has(term)) this.heldBack.set(term, this.currentPlace);
    };
    Object.defineProperty(buffer, 'push', {
      value: (...values: BufferedValue[]) => {
        for (const value of values) {
          remember(value.object);
          remember(value.subject);
        }
        return Array.prototype.push.apply(buffer, values);
      },
    });
    return buffer;
  }
}

/** A failure while reading, with where it stands. */
interface Failure {
  message: string;
  hint: string;
  place: LineColumn;
}

/**
 * Parses a JSON-LD document given as text chunks (one chunk for a whole text). Each statement is
 * placed at the `{` of the node object that states it. Remote contexts are never fetched: a context
 * IRI is read from the local copy `contexts` maps it to, a `file:` context from disk, and any other
 * is an error naming it. A syntax error keeps the statements read before it and becomes one
 * InputError at its line and column.
 */
export async function parseJsonLd(chunks: AsyncIterable<string>, file: string, options: JsonLdParseOptions = {}): Promise<LoadedSource> {
  const source: LoadedSource = { file, format: 'json-ld', statements: [], errors: [], allowComments: [], prefixes: {} };
  const cwd = options.cwd ?? process.cwd();
  const places = new JsonPlaces();
  const list = options.sink === undefined ? new StatementList(file) : undefined;
  const sink = options.sink ?? (list as StatementList);
  const loader = new LocalContextLoader(options.contexts ?? new Map());
  let failure: Failure | undefined;
  const droppedKeys = new Set<string>();
  const parser = new PlacedJsonLdParser(
    {
      baseIRI: options.baseIri ?? defaultBaseIri(file, cwd),
      dataFactory: prefixedBlankNodeFactory(blankNodeLabelPrefix(file, cwd)) as unknown as RDF.DataFactory<RDF.BaseQuad>,
      documentLoader: loader,
    },
    places,
    {
      quad: (quad, place) => {
        if (failure === undefined) addQuad(source, sink, quad, { line: place.line, column: place.column, objectLine: place.line });
      },
      droppedKey: (key, place) => {
        const seen = `${key} ${place.line} ${place.column}`;
        if (failure !== undefined || droppedKeys.has(seen)) return;
        droppedKeys.add(seen);
        (source.warnings ??= []).push(droppedKeyWarning(file, key, place));
      },
    },
  );
  const fail = (error: unknown): void => {
    failure ??= processingFailure(error as Error, loader, parser.currentPlace);
  };
  parser.on('error', fail);
  parser.on('context', (context: unknown) => collectPrefixes(context, source.prefixes));
  const write = (text: string): Promise<void> =>
    new Promise((resolve) => {
      parser._transform(text, 'utf8', (error) => {
        if (error) fail(error);
        resolve();
      });
    });
  let first = true;
  let carried = '';
  for await (const raw of chunks) {
    const whole = carried + (first && raw.startsWith('\ufeff') ? raw.slice(1) : raw);
    first = false;
    // The JSON parser inside works on UTF-8 bytes, so a surrogate pair cut between chunks waits for its second half.
    const last = whole.charCodeAt(whole.length - 1);
    const cut = last >= 0xd800 && last <= 0xdbff;
    carried = cut ? whole.slice(-1) : '';
    const chunk = cut ? whole.slice(0, -1) : whole;
    const syntax = places.read(chunk);
    // The parser gets only the valid text, so it stops where the syntax error is, with what came before.
    await write(syntax === undefined ? chunk : chunk.slice(0, syntax.validLength));
    if (syntax !== undefined) failure ??= { message: `JSON syntax error: ${syntax.message}`, hint: syntax.hint, place: syntax.place };
    if (failure !== undefined) break;
  }
  const brokenOff = options.brokenOff?.() === true;
  if (failure === undefined && carried !== '' && !brokenOff) {
    const syntax = places.read(carried);
    if (syntax === undefined) await write(carried);
    else failure = { message: `JSON syntax error: ${syntax.message}`, hint: syntax.hint, place: syntax.place };
  }
  if (failure === undefined && !brokenOff) {
    const ending = places.end();
    if (ending !== undefined) failure = { message: `JSON syntax error: ${ending.message}`, hint: ending.hint, place: ending.place };
  }
  await parser.settled().catch(fail);
  if (failure !== undefined) source.errors.push(failureError(file, failure));
  if (list !== undefined) source.statements = list.statements;
  return source;
}

/** A JSON-LD processing failure, with the loader's own words when a context could not be read. */
function processingFailure(error: Error, loader: LocalContextLoader, place: LineColumn): Failure {
  const refused = loader.firstRefusal;
  if (refused !== undefined) return { message: refused.message, hint: refused.hint, place };
  const code = (error as Error & { code?: string }).code;
  return {
    message: `JSON-LD error: ${error.message.replace(/\.$/, '')}${code !== undefined ? ` (${code})` : ''}`,
    hint: 'check this node object against JSON-LD 1.1: keys map to IRIs through the context, @id values are IRIs or blank node labels',
    place,
  };
}

function failureError(file: string, failure: Failure): InputError {
  return {
    file,
    line: failure.place.line,
    column: failure.place.column,
    message: `${failure.message}. The rest of the file was not read.`,
    hint: failure.hint,
  };
}

/** The warning for a key whose value JSON-LD drops because the key maps to no IRI. */
function droppedKeyWarning(file: string, key: string, place: LineColumn): InputError {
  const blank = key.startsWith('_:');
  return {
    file,
    line: place.line,
    column: place.column,
    message: blank
      ? `the key "${key}" of this node object is a blank node, which RDF 1.1 allows no predicate to be; its value was not read`
      : `the key "${key}" of this node object maps to no IRI through the context, so JSON-LD drops its value; it was not read`,
    hint: blank
      ? 'use an IRI for the property'
      : `map the key in "@context" (such as "${key}": "https://data.northvale-rail.example/def/${key}") or set "@vocab"; map it to null to leave it out on purpose`,
  };
}

/** The prefixes a context defines as plain IRIs ending in `/` or `#`, for showing IRIs in messages. */
function collectPrefixes(context: unknown, prefixes: Record<string, string>): void {
  const contexts = Array.isArray(context) ? context : [context];
  for (const entry of contexts) {
    if (entry === null || typeof entry !== 'object') continue;
    for (const [term, value] of Object.entries(entry as Record<string, unknown>)) {
      if (!term.startsWith('@') && typeof value === 'string' && /^[A-Za-z][A-Za-z0-9+.-]*:.*[/#]$/.test(value)) prefixes[term] = value;
    }
  }
}
