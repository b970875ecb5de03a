// Reading the sources of a run: files, folders and stdin, plain or gzip, each parsed into a LoadedSource.
import { createReadStream, type ReadStream } from 'node:fs';
import { once } from 'node:events';
import { stat } from 'node:fs/promises';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { InputError, LoadResult, RdfFormat } from './statement.js';
import { detectFormat, RDF_EXTENSIONS, SNIFF_LENGTH } from './format.js';
import { blankNodeLabelPrefix, STDIN_FILE } from './parse.js';
import { parseAnySource } from './parse-any.js';
import type { ContextMap } from './jsonld-contexts.js';
import { decodeText, invalidUtf8Error, Utf8ChunkDecoder, type InvalidUtf8 } from './source-text.js';
import { sourceChunks, type LoadProgress, type ReadFailure } from './byte-source.js';
import { LineReader } from './line-reader.js';
import { StatementStore } from './statement-store.js';
import { StoringSink } from './stored-source.js';
import { joinShown, listRdfFiles } from './walk.js';

/** Options of `loadSources`. */
export interface LoadOptions {
  /** The folder relative paths start from; default the process's working folder. */
  cwd?: string;
  /** What `-` reads; default the process's standard input. */
  stdin?: NodeJS.ReadableStream;
  /** Predicates whose statements are kept; the others are counted, not stored. Default: keep all. */
  keepPredicates?: ReadonlySet<string>;
  /** Whether N-Triples and N-Quads take the line-by-line fast path (default true); false parses them whole with n3. */
  fastLines?: boolean;
  /** Called as a source is read, at least once per chunk, with how far it has got. */
  onProgress?: (progress: LoadProgress) => void;
  /** The store the statements go to; default a new one for this call. */
  store?: StatementStore;
  /** The IRI relative IRIs resolve against (`--base`); default each file's `file://` URL. */
  baseIri?: string;
  /** JSON-LD context IRI → absolute path of a local copy (`contexts:` in isapart.yaml). */
  contexts?: ContextMap;
}

/** A LoadResult that also names what inside given folders was left out of the run. */
export interface LoadResultWithSkipped extends LoadResult {
  /** Files left out for their extension, and node_modules and dot-folders as `folder/.name/`, named as the user would. */
  skippedFiles: string[];
  /** The store holding every kept statement of the sources (absent where sources were parsed one by one, as the language server does). */
  store?: StatementStore;
}

/** One file to read: the name shown in positions, and where it is. */
interface FileToRead {
  shownAs: string;
  absolutePath: string;
}

const EXTENSION_LIST = RDF_EXTENSIONS.join(', ');
const SYNTAX_LIST = 'Turtle, TriG, N-Triples, N-Quads, RDF/XML or JSON-LD';

/** Bytes read from a file at a time. */
const CHUNK_BYTES = 1 << 20;

/**
 * Reads every path in order: a file, a folder (its RDF files, recursively and sorted) or `-` for
 * standard input. A source that cannot be read becomes an error; the others are still read.
 */
export async function loadSources(paths: string[], options: LoadOptions = {}): Promise<LoadResultWithSkipped> {
  const cwd = options.cwd ?? process.cwd();
  const store = options.store ?? new StatementStore();
  const result: LoadResultWithSkipped = { sources: [], errors: [], skippedFiles: [], store };
  const reading: RunReading = {
    store,
    keep: options.keepPredicates,
    fastLines: options.fastLines ?? true,
    onProgress: options.onProgress,
    baseIri: options.baseIri,
    contexts: options.contexts,
  };
  const seen = new Set<string>();
  for (const path of paths) {
    if (path === '-') {
      if (seen.has(STDIN_FILE)) continue;
      seen.add(STDIN_FILE);
      await loadStdin({ stdin: options.stdin ?? process.stdin, cwd }, result, reading);
      continue;
    }
    for (const file of await filesOfPath(path, cwd, result)) {
      // A file named twice, or inside a folder also given, is read once.
      if (seen.has(file.absolutePath)) continue;
      seen.add(file.absolutePath);
      await loadFile({ ...file, cwd }, result, reading);
    }
  }
  return result;
}

/** The files a path stands for; a missing path or an empty folder is recorded as an error. */
async function filesOfPath(path: string, cwd: string, result: LoadResultWithSkipped): Promise<FileToRead[]> {
  const absolutePath = resolve(cwd, path);
  let isFolder: boolean;
  try {
    isFolder = (await stat(absolutePath)).isDirectory();
  } catch (error) {
    result.errors.push(missingPathError(path, error));
    return [];
  }
  if (!isFolder) return [{ shownAs: path, absolutePath }];
  const listing = await listRdfFiles(absolutePath, path);
  result.errors.push(...listing.errors);
  result.skippedFiles.push(...listing.skippedFiles.map((relative) => joinShown(path, relative)));
  if (listing.files.length === 0 && listing.errors.length === 0) {
    result.errors.push({
      file: path,
      line: 0,
      column: 0,
      message: `The folder ${path} holds no RDF files; nothing was read from it.`,
      hint: `isapart reads files ending in ${EXTENSION_LIST} (each also as .gz) in a folder and its subfolders, except node_modules and dot-folders`,
    });
  }
  return listing.files.map((relative) => ({
    shownAs: joinShown(path, relative),
    absolutePath: resolve(absolutePath, relative),
  }));
}

/** Opens one file as a stream and reads it into the result. */
async function loadFile(file: FileToRead & { cwd: string }, result: LoadResultWithSkipped, reading: RunReading): Promise<void> {
  let size: number;
  let stream: ReadStream;
  try {
    size = (await stat(file.absolutePath)).size;
    stream = createReadStream(file.absolutePath, { highWaterMark: CHUNK_BYTES });
    await once(stream, 'open');
  } catch (error) {
    result.errors.push({
      file: file.shownAs,
      line: 0,
      column: 0,
      message: `${file.shownAs} cannot be read (${errorCode(error)}); it was not read.`,
      hint: 'check that the file exists and that you may read it',
    });
    return;
  }
  await readSource(
    { input: stream, file: file.shownAs, baseIri: reading.baseIri ?? pathToFileURL(file.absolutePath).href, cwd: file.cwd, totalBytes: size },
    result,
    reading,
  );
}

/** Reads standard input to its end as the source `<stdin>`. */
async function loadStdin(input: { stdin: NodeJS.ReadableStream; cwd: string }, result: LoadResultWithSkipped, reading: RunReading): Promise<void> {
  await readSource({ input: input.stdin, file: STDIN_FILE, baseIri: reading.baseIri ?? 'file:///dev/stdin', cwd: input.cwd, totalBytes: undefined }, result, reading);
}

/** What every source of a run shares while it is read. */
interface RunReading {
  store: StatementStore;
  keep: ReadonlySet<string> | undefined;
  fastLines: boolean;
  onProgress: ((progress: LoadProgress) => void) | undefined;
  baseIri: string | undefined;
  contexts: ContextMap | undefined;
}

/** One source to read as a stream. */
interface StreamedSource {
  input: NodeJS.ReadableStream;
  file: string;
  baseIri: string;
  cwd: string;
  totalBytes: number | undefined;
}

/**
 * Streams a source: works out its syntax from its name or its first chunks, then reads N-Triples and
 * N-Quads line by line as the chunks come. Turtle, TriG, RDF/XML and JSON-LD are decoded chunk by
 * chunk (a bad UTF-8 byte ends the source with an error at its line, after what came before it)
 * and parsed as the text comes, their statements stored as they are read.
 */
async function readSource(source: StreamedSource, result: LoadResultWithSkipped, reading: RunReading): Promise<void> {
  const progress: LoadProgress = { file: source.file, bytesRead: 0, totalBytes: source.totalBytes, lines: 0 };
  const report = (): void => reading.onProgress?.({ ...progress });
  const streamed = sourceChunks(source.input, (count) => {
    progress.bytesRead += count;
  });
  const chunks = streamed.chunks[Symbol.asyncIterator]();
  const head: Buffer[] = [];
  let headBytes = 0;
  let ended = false;
  while (headBytes < SNIFF_LENGTH) {
    const next = await chunks.next();
    if (next.done === true) {
      ended = true;
      break;
    }
    head.push(next.value);
    headBytes += next.value.length;
  }
  if (streamed.failure !== undefined) {
    result.errors.push(failureError(source.file, streamed.failure, streamed.gzip, undefined));
    return;
  }
  const nameForFormat = source.file === STDIN_FILE ? '-' : source.file;
  const headText = new TextDecoder('utf-8').decode(Buffer.concat(head).subarray(0, SNIFF_LENGTH)).slice(0, SNIFF_LENGTH);
  const format: RdfFormat | undefined = detectFormat(nameForFormat, headText);
  if (format === undefined) {
    // A text whose syntax cannot be told is refused; if it is not UTF-8 at all, that is the clearer message.
    const decoded = ended ? decodeText(Buffer.concat(head), source.file) : undefined;
    result.errors.push(decoded !== undefined && 'error' in decoded ? decoded.error : unknownSyntaxError(source.file));
    return;
  }
  const rest = (async function* () {
    yield* head;
    if (ended) return;
    for (let next = await chunks.next(); next.done !== true; next = await chunks.next()) yield next.value;
  })();

  if ((format === 'n-triples' || format === 'n-quads') && reading.fastLines) {
    const reader = new LineReader({
      file: source.file,
      format,
      store: reading.store,
      keep: reading.keep,
      labelPrefix: blankNodeLabelPrefix(source.file, source.cwd),
      baseIri: source.baseIri,
      cwd: source.cwd,
    });
    for await (const chunk of rest) {
      reader.push(chunk);
      progress.lines = reader.lineNumber;
      report();
    }
    const loaded = reader.finish(streamed.failure !== undefined);
    progress.lines = reader.lineNumber;
    report();
    result.sources.push(loaded);
    // A stream that broke off is an error beside what was read before it, never a silent short read.
    if (streamed.failure !== undefined) result.errors.push(failureError(source.file, streamed.failure, streamed.gzip, reader.lineNumber));
    return;
  }

  // Every other syntax is decoded and parsed chunk by chunk; statements go to the store as they are read.
  const decoder = new Utf8ChunkDecoder();
  let invalid: InvalidUtf8 | undefined;
  const texts = (async function* () {
    for await (const chunk of rest) {
      const decoded = decoder.write(chunk);
      progress.lines = decoder.lineBreaks;
      report();
      if (decoded.text !== '') yield decoded.text;
      invalid = decoded.invalid;
      if (invalid !== undefined) return;
    }
    if (streamed.failure !== undefined) return;
    const ending = decoder.end();
    if (ending.text !== '') yield ending.text;
    invalid = ending.invalid;
  })();
  const sink = new StoringSink(reading.store, reading.keep, source.file);
  const parsed = await parseAnySource(texts, source.file, format, {
    baseIri: source.baseIri,
    cwd: source.cwd,
    contexts: reading.contexts,
    sink,
    brokenOff: () => invalid !== undefined || streamed.failure !== undefined,
  });
  const loaded = sink.stored(parsed);
  const linesRead = decoder.lineBreaks;
  if (invalid !== undefined) {
    const kept = loaded.statementCount === 0 ? 'it was not read' : 'the statements before it were read, the rest of the file was not';
    loaded.errors.push(invalidUtf8Error(source.file, invalid, kept));
  }
  result.sources.push(loaded);
  // A stream that broke off is an error beside what was read before it, never a silent short read.
  if (streamed.failure !== undefined) result.errors.push(failureError(source.file, streamed.failure, streamed.gzip, linesRead));
}

/** The error for a source whose bytes stopped coming: a failed read, or gzip that cannot be inflated. */
function failureError(file: string, failure: ReadFailure, gzip: boolean, linesRead: number | undefined): InputError {
  const kept = linesRead === undefined ? 'it was not read' : `its first ${linesRead} lines were read, the rest was not`;
  if (failure.kind === 'gzip' || gzip) {
    return {
      file,
      line: 0,
      column: 0,
      message: `${file} starts as gzip but cannot be decompressed (${failure.message}); ${kept}.`,
      hint: 'the gzip stream is truncated or corrupt: check it with gzip -t, or compress the file again',
    };
  }
  if (file === STDIN_FILE) {
    return {
      file,
      line: 0,
      column: 0,
      message: `Standard input could not be read (${failure.message}); ${linesRead === undefined ? 'what came before the failure was not used' : kept}.`,
      hint: 'check the command that feeds isapart through the pipe',
    };
  }
  return {
    file,
    line: 0,
    column: 0,
    message: `${file} cannot be read (${failure.message}); ${kept}.`,
    hint: 'check that the file exists and that you may read it',
  };
}

/** The error for a source whose syntax cannot be told from its name or content. */
function unknownSyntaxError(file: string): InputError {
  const isStdin = file === STDIN_FILE;
  return {
    file,
    line: 0,
    column: 0,
    message: isStdin
      ? 'The syntax of standard input could not be told from its content; it was not read.'
      : `The syntax of ${file} could not be told from its name or its content; it was not read.`,
    hint: isStdin
      ? `standard input has no name to tell its syntax by, only its start: check that what is piped in is ${SYNTAX_LIST}, or save it to a file ending in ${EXTENSION_LIST} and lint that file`
      : `name the file with one of the extensions ${EXTENSION_LIST} (or the same with .gz), or check that it holds ${SYNTAX_LIST}`,
  };
}

function missingPathError(path: string, error: unknown): InputError {
  const code = errorCode(error);
  return {
    file: path,
    line: 0,
    column: 0,
    message:
      code === 'ENOENT'
        ? `${path} does not exist; nothing was read from it.`
        : `${path} cannot be opened (${code}); nothing was read from it.`,
    hint: 'give a file, a folder, or - for standard input; relative paths start from the working folder',
  };
}

function errorCode(error: unknown): string {
  return (error as NodeJS.ErrnoException).code ?? (error as Error).message;
}
