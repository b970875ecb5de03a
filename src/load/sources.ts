// Reading the sources of a run: files, folders and stdin, plain or gzip, each parsed into a LoadedSource.
import { readFile, stat } from 'node:fs/promises';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { InputError, LoadResult, RdfFormat } from './statement.js';
import { detectFormat, RDF_EXTENSIONS, SNIFF_LENGTH } from './format.js';
import { STDIN_FILE } from './parse.js';
import { parseAnySource, textChunks } from './parse-any.js';
import type { ContextMap } from './jsonld-contexts.js';
import { toSourceText } from './source-text.js';
import { joinShown, listRdfFiles } from './walk.js';

/** Options of `loadSources`. */
export interface LoadOptions {
  /** The folder relative paths start from; default the process's working folder. */
  cwd?: string;
  /** What `-` reads; default the process's standard input. */
  stdin?: NodeJS.ReadableStream;
  /** The IRI relative IRIs resolve against (`--base`); default each file's `file://` URL. */
  baseIri?: string;
  /** JSON-LD context IRI → absolute path of a local copy (`contexts:` in isapart.yaml). */
  contexts?: ContextMap;
}

/** What parsing needs besides the text: the folder of the run, the base IRI and the local contexts. */
type ParseSettings = Pick<LoadOptions, 'baseIri' | 'contexts'> & { cwd: string };

/** A LoadResult that also names what inside given folders was left out of the run. */
export interface LoadResultWithSkipped extends LoadResult {
  /** Files left out for their extension, and node_modules and dot-folders as `folder/.name/`, named as the user would. */
  skippedFiles: string[];
}

/** One file to read: the name shown in positions, and where it is. */
interface FileToRead {
  shownAs: string;
  absolutePath: string;
}

const EXTENSION_LIST = RDF_EXTENSIONS.join(', ');
const SYNTAX_LIST = 'Turtle, TriG, N-Triples, N-Quads, RDF/XML or JSON-LD';

/**
 * Reads every path in order: a file, a folder (its RDF files, recursively and sorted) or `-` for
 * standard input. A source that cannot be read becomes an error; the others are still read.
 */
export async function loadSources(paths: string[], options: LoadOptions = {}): Promise<LoadResultWithSkipped> {
  const cwd = options.cwd ?? process.cwd();
  const settings: ParseSettings = { cwd, baseIri: options.baseIri, contexts: options.contexts };
  const result: LoadResultWithSkipped = { sources: [], errors: [], skippedFiles: [] };
  const seen = new Set<string>();
  for (const path of paths) {
    if (path === '-') {
      if (seen.has(STDIN_FILE)) continue;
      seen.add(STDIN_FILE);
      await loadStdin({ stdin: options.stdin ?? process.stdin, settings }, result);
      continue;
    }
    for (const file of await filesOfPath(path, cwd, result)) {
      // A file named twice, or inside a folder also given, is read once.
      if (seen.has(file.absolutePath)) continue;
      seen.add(file.absolutePath);
      await loadFile({ ...file, settings }, result);
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

/** Reads, decodes and parses one file into the result. */
async function loadFile(file: FileToRead & { settings: ParseSettings }, result: LoadResultWithSkipped): Promise<void> {
  let bytes: Uint8Array;
  try {
    bytes = await readFile(file.absolutePath);
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
  await parseBytes({ bytes, file: file.shownAs, baseIri: file.settings.baseIri ?? pathToFileURL(file.absolutePath).href, settings: file.settings }, result);
}

/** Reads standard input to its end and parses it as the source `<stdin>`. */
async function loadStdin(input: { stdin: NodeJS.ReadableStream; settings: ParseSettings }, result: LoadResultWithSkipped): Promise<void> {
  const { stdin, settings } = input;
  const chunks: Buffer[] = [];
  try {
    for await (const chunk of stdin) chunks.push(typeof chunk === 'string' ? Buffer.from(chunk) : chunk);
  } catch (error) {
    result.errors.push({
      file: STDIN_FILE,
      line: 0,
      column: 0,
      message: `Standard input could not be read (${(error as Error).message}); what came before the failure was not used.`,
      hint: 'check the command that feeds isapart through the pipe',
    });
    return;
  }
  await parseBytes({ bytes: Buffer.concat(chunks), file: STDIN_FILE, baseIri: settings.baseIri ?? 'file:///dev/stdin', settings }, result);
}

/** Decodes a source's bytes, works out its format and parses it into the result. */
async function parseBytes(
  source: { bytes: Uint8Array; file: string; baseIri: string; settings: ParseSettings },
  result: LoadResultWithSkipped,
): Promise<void> {
  const decoded = await toSourceText(source.bytes, source.file);
  if ('error' in decoded) {
    result.errors.push(decoded.error);
    return;
  }
  const nameForFormat = source.file === STDIN_FILE ? '-' : source.file;
  const head = decoded.text.slice(0, SNIFF_LENGTH);
  const format: RdfFormat | undefined = detectFormat(nameForFormat, head);
  if (format === undefined) {
    result.errors.push(unknownSyntaxError(source.file));
    return;
  }
  const { cwd, contexts } = source.settings;
  result.sources.push(await parseAnySource(textChunks(decoded.text), source.file, format, { baseIri: source.baseIri, cwd, contexts }));
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
