// Linting the same paths as they were at a git revision, to serve as the baseline of `--since`.
import { statSync } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { checkLoaded, type CheckOptions, type CheckResult } from '../check.js';
import { detectFormat, formatFromExtension, SNIFF_LENGTH } from '../load/format.js';
import { parseAnySource, textChunks } from '../load/parse-any.js';
import type { LoadResultWithSkipped } from '../load/sources.js';
import type { InputError, LoadedSource } from '../load/statement.js';
import { toSourceText } from '../load/source-text.js';
import { joinShown } from '../load/walk.js';
import { fileAtRevision, filesAtRevision, pathInWorkTree, resolveRevision, type Revision } from './git-revision.js';

/** What `--since` produced: the run at the revision, or the error that kept it from running. */
export type RevisionLint = { result: CheckResult; revision: Revision } | { error: InputError };

/**
 * Lints `options.paths` as they were at `revisionName`, read from git objects (no checkout is
 * touched), with the same settings as the current run: `configFile` is the config the current run
 * used (undefined: none), so both runs apply the same rules and levels. A path that did not exist
 * at the revision is read as empty; a folder is read as the loader reads one (RDF extensions,
 * no dot-folders or node_modules). Shown names and base IRIs are the current run's, so blank
 * nodes and relative IRIs get the same identities, and with them the same fingerprints.
 */
export async function lintAtRevision(options: CheckOptions, revisionName: string, configFile: string | undefined): Promise<RevisionLint> {
  const cwd = options.cwd ?? process.cwd();
  if (options.paths.includes('-')) {
    return { error: { file: '<stdin>', line: 0, column: 0, message: '--since cannot read standard input at a revision', hint: 'name the files or folders to lint, or compare with a saved report using --baseline FILE' } };
  }
  const resolved = await resolveRevision(cwd, revisionName);
  if ('error' in resolved) return resolved;
  const { revision } = resolved;
  const loaded: LoadResultWithSkipped = { sources: [], errors: [], skippedFiles: [] };
  const seen = new Set<string>();
  for (const shownPath of options.paths) {
    const absolute = path.resolve(cwd, shownPath);
    const treePath = pathInWorkTree(revision, absolute);
    if (treePath === undefined) {
      return { error: { file: shownPath, line: 0, column: 0, message: `--since: ${shownPath} is outside the git work tree ${revision.topFolder}`, hint: 'lint paths inside the repository, or compare with a saved report using --baseline FILE' } };
    }
    for (const file of await filesOfPathAtRevision(revision, shownPath, absolute, treePath)) {
      if (seen.has(file.treePath)) continue;
      seen.add(file.treePath);
      const bytes = (await fileAtRevision(revision, file.treePath)) ?? Buffer.alloc(0);
      await addSource(loaded, { bytes, shownAs: file.shownAs, absolutePath: file.absolutePath, cwd });
    }
  }
  const result = checkLoaded(loaded, { ...options, configFile, commandLine: `${options.commandLine ?? 'isapart check'} (at ${revisionName})` });
  return { result, revision };
}

/** One file to read at the revision. */
interface RevisionFile {
  shownAs: string;
  absolutePath: string;
  treePath: string;
}

/** The files a path stands for at the revision: a named file (even one missing then), or a folder's RDF files. */
async function filesOfPathAtRevision(revision: Revision, shownPath: string, absolute: string, treePath: string): Promise<RevisionFile[]> {
  const listed = await filesAtRevision(revision, treePath);
  const wasFile = listed.length === 1 && listed[0] === treePath;
  const isFolderNow = statSync(absolute, { throwIfNoEntry: false })?.isDirectory() ?? false;
  if (wasFile || (!isFolderNow && listed.length === 0)) return [{ shownAs: shownPath, absolutePath: absolute, treePath }];
  const prefix = treePath === '' ? '' : `${treePath}/`;
  return listed.flatMap((name) => {
    const relative = name.slice(prefix.length);
    const parts = relative.split('/');
    // The loader's walk: no dot-folders or node_modules, and files by RDF extension only.
    if (parts.slice(0, -1).some((part) => part === 'node_modules' || part.startsWith('.'))) return [];
    if (formatFromExtension(parts[parts.length - 1]) === undefined) return [];
    return [{ shownAs: joinShown(shownPath, relative), absolutePath: path.join(absolute, ...parts), treePath: name }];
  });
}

/** Decodes and parses one file's bytes as the loader would, into the result. */
async function addSource(loaded: LoadResultWithSkipped, file: { bytes: Uint8Array; shownAs: string; absolutePath: string; cwd: string }): Promise<void> {
  const decoded = await toSourceText(file.bytes, file.shownAs);
  if ('error' in decoded) {
    loaded.errors.push(decoded.error);
    return;
  }
  const format = decoded.text.trim() === '' ? (formatFromExtension(file.shownAs) ?? 'turtle') : detectFormat(file.shownAs, decoded.text.slice(0, SNIFF_LENGTH));
  if (format === undefined) {
    loaded.errors.push({ file: file.shownAs, line: 0, column: 0, message: `the syntax of ${file.shownAs} at the base revision could not be told`, hint: 'name the file with an RDF extension' });
    return;
  }
  const source: LoadedSource = await parseAnySource(textChunks(decoded.text), file.shownAs, format, { baseIri: pathToFileURL(file.absolutePath).href, cwd: file.cwd });
  loaded.sources.push(source);
}
