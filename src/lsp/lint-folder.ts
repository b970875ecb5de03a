// One workspace folder as the server lints it: every RDF file under it, open buffers laid over the files on disk.
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { checkLoaded, type CheckResult } from '../check.js';
import { detectFormat, RDF_EXTENSIONS, SNIFF_LENGTH } from '../load/format.js';
import { parseAnySource, textChunks } from '../load/parse-any.js';
import { toSourceText } from '../load/source-text.js';
import { loadSources } from '../load/sources.js';
import type { InputError, LoadedSource } from '../load/statement.js';
import { listRdfFiles } from '../load/walk.js';
import { DocumentText } from './document-text.js';

/** What one file contributes: its parsed source (none when it could not be read), errors, and its text. */
interface FileEntry {
  source?: LoadedSource;
  errors: InputError[];
  text?: DocumentText;
}

/** Counters the server reports on its `isapart/heap` request, so tests can see what work was done. */
export interface LintCounters {
  /** Documents parsed, from disk or from a buffer. */
  parses: number;
  /** Whole lints run. */
  lints: number;
}

/**
 * The files of one folder, each parsed once and kept until it changes. A buffer the editor has
 * open replaces the file on disk until it is closed; `lint` runs the core's flow on what is kept.
 */
export class LintFolder {
  private readonly onDisk = new Map<string, FileEntry>();
  private readonly buffers = new Map<string, FileEntry>();
  private readonly pendingBuffers = new Map<string, string>();
  private folderErrors: InputError[] = [];

  /** `root` is the folder's absolute path; file names are absolute paths, relative ones resolve against it. */
  constructor(
    readonly root: string,
    private readonly counters: LintCounters,
  ) {}

  /** Whether an absolute path lies in this folder. */
  contains(file: string): boolean {
    const relative = path.relative(this.root, file);
    return relative !== '' && !relative.startsWith('..') && !path.isAbsolute(relative);
  }

  /** Whether the folder's walk reads a file there: it is not inside node_modules or a dot-folder, as the loader skips them. */
  walks(file: string): boolean {
    if (!this.contains(file)) return false;
    const folders = path.relative(this.root, path.dirname(file)).split(path.sep).filter((segment) => segment !== '');
    return !folders.some((segment) => segment === 'node_modules' || segment.startsWith('.'));
  }

  /** Reads every RDF file under the folder afresh (by the loader's extensions, skipping what it skips). */
  async loadAll(): Promise<void> {
    const listing = await listRdfFiles(this.root, this.root);
    this.folderErrors = listing.errors;
    this.onDisk.clear();
    for (const relative of listing.files) await this.reloadFile(path.join(this.root, relative));
  }

  /** Reads one file from disk again (it was created or changed); a file that is gone is forgotten. */
  async reloadFile(file: string): Promise<void> {
    let bytes: Uint8Array | undefined;
    try {
      bytes = await readFile(file);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') {
        this.onDisk.delete(file);
        return;
      }
    }
    // The loader gives the errors of an unreadable or unknown file exactly as `isapart check` would.
    const loaded = await loadSources([file], { cwd: this.root });
    this.counters.parses++;
    const source = loaded.sources[0];
    const entry: FileEntry = { source, errors: loaded.errors };
    if (source !== undefined) {
      const decoded = await toSourceText(bytes as Uint8Array, file);
      if ('text' in decoded) entry.text = new DocumentText(stripBom(decoded.text));
    }
    this.onDisk.set(file, entry);
  }

  /** Forgets a file deleted from disk, or every file under a deleted folder. */
  removeFile(file: string): void {
    const folderPrefix = file.endsWith(path.sep) ? file : file + path.sep;
    for (const known of [...this.onDisk.keys()]) {
      if (known === file || known.startsWith(folderPrefix)) this.onDisk.delete(known);
    }
  }

  /** Lays an editor buffer over a file; it is parsed at the next lint, so rapid edits cost one parse. */
  setBuffer(file: string, text: string): void {
    this.pendingBuffers.set(file, text);
  }

  /** Parses the buffers changed since the last lint; a buffer whose syntax cannot be told is not linted. */
  private async parsePendingBuffers(): Promise<void> {
    // Taken out first: a buffer changed while these are parsed waits for the next lint.
    const pending = [...this.pendingBuffers];
    this.pendingBuffers.clear();
    for (const [file, text] of pending) {
      const format = detectFormat(file, text.slice(0, SNIFF_LENGTH));
      this.counters.parses++;
      if (format === undefined) {
        const error: InputError = {
          file,
          line: 0,
          column: 0,
          message: 'The syntax of this document could not be told from its name or its content; it is not linted.',
          hint: `name the file with one of the extensions ${RDF_EXTENSIONS.join(', ')}, or check that it holds Turtle, TriG, N-Triples or N-Quads`,
        };
        this.buffers.set(file, { errors: [error], text: new DocumentText(text) });
        continue;
      }
      const source = await parseAnySource(textChunks(text), file, format, { cwd: this.root });
      this.buffers.set(file, { source, errors: [], text: new DocumentText(stripBom(text)) });
    }
  }

  /** Drops a buffer; the file on disk counts again. */
  closeBuffer(file: string): void {
    this.pendingBuffers.delete(file);
    this.buffers.delete(file);
  }

  /** The text the folder holds for a file (its buffer, else as read from disk). */
  textOf(file: string): DocumentText | undefined {
    return (this.buffers.get(file) ?? this.onDisk.get(file))?.text;
  }

  /** The source the folder holds for a file (its buffer, else as read from disk). */
  sourceOf(file: string): LoadedSource | undefined {
    return (this.buffers.get(file) ?? this.onDisk.get(file))?.source;
  }

  /** Every file the folder holds, buffers included, in the loader's order. */
  files(): string[] {
    return [...new Set([...this.onDisk.keys(), ...this.buffers.keys(), ...this.pendingBuffers.keys()])].sort(byCodeUnits);
  }

  /** Lints what the folder holds now, with the isapart.yaml found from its root (read afresh each time). */
  async lint(): Promise<CheckResult> {
    await this.parsePendingBuffers();
    const sources: LoadedSource[] = [];
    const errors: InputError[] = [...this.folderErrors];
    for (const file of this.files()) {
      const entry = (this.buffers.get(file) ?? this.onDisk.get(file)) as FileEntry;
      errors.push(...entry.errors);
      if (entry.source !== undefined) sources.push(entry.source);
    }
    this.counters.lints++;
    return checkLoaded({ sources, errors, skippedFiles: [] }, { paths: [this.root], cwd: this.root, commandLine: 'isapart lsp' });
  }
}

/** The text without a leading byte order mark, as the parser reads it (positions count from after it). */
function stripBom(text: string): string {
  return text.startsWith('\ufeff') ? text.slice(1) : text;
}

/** Orders strings by UTF-16 code units, as the loader orders a folder's files. */
function byCodeUnits(left: string, right: string): number {
  return left < right ? -1 : left > right ? 1 : 0;
}
