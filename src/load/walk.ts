// Listing the RDF files under a folder: recursive, sorted, skipping node_modules and dot-folders.
import { readdir, realpath, stat } from 'node:fs/promises';
import { join } from 'node:path';
import type { InputError } from './statement.js';
import { isReadInFolders } from './format.js';

/** The RDF files found under a folder, as `/`-separated paths relative to it, and what could not be read. */
export interface FolderListing {
  files: string[];
  /**
   * What was left out of the run, relative like `files`: files with other extensions, and
   * node_modules and dot-folders as the folder path with a trailing `/` (their contents unlisted).
   */
  skippedFiles: string[];
  errors: InputError[];
}

/** Lists the files with RDF extensions under `folder` (absolute); `shownAs` names it in errors. */
export async function listRdfFiles(folder: string, shownAs: string): Promise<FolderListing> {
  const listing: FolderListing = { files: [], skippedFiles: [], errors: [] };
  const visitedFolders = new Set<string>([await realpath(folder)]);
  // An explicit stack of relative folder paths, so deep trees cannot exhaust the call stack.
  const pending: string[] = [''];
  while (pending.length > 0) {
    const relativeFolder = pending.pop() as string;
    const shownFolder = joinShown(shownAs, relativeFolder);
    let entries;
    try {
      entries = await readdir(join(folder, relativeFolder), { withFileTypes: true });
    } catch (error) {
      listing.errors.push(unreadable(shownFolder, error, 'folder'));
      continue;
    }
    for (const entry of entries) {
      const relativePath = relativeFolder === '' ? entry.name : `${relativeFolder}/${entry.name}`;
      const absolutePath = join(folder, relativePath);
      let isFolder = entry.isDirectory();
      if (entry.isSymbolicLink()) {
        try {
          isFolder = (await stat(absolutePath)).isDirectory();
        } catch (error) {
          listing.errors.push(unreadable(joinShown(shownAs, relativePath), error, 'link'));
          continue;
        }
      }
      if (isFolder) {
        if (entry.name === 'node_modules' || entry.name.startsWith('.')) {
          listing.skippedFiles.push(`${relativePath}/`);
          continue;
        }
        const real = await realpath(absolutePath);
        // A link back up the tree would otherwise be walked forever.
        if (visitedFolders.has(real)) continue;
        visitedFolders.add(real);
        pending.push(relativePath);
      } else if (isReadInFolders(entry.name)) {
        listing.files.push(relativePath);
      } else {
        listing.skippedFiles.push(relativePath);
      }
    }
  }
  listing.files.sort(byCodeUnits);
  listing.skippedFiles.sort(byCodeUnits);
  return listing;
}

/** A path inside a folder as the user would write it: the folder as given, then the relative part. */
export function joinShown(shownFolder: string, relativePath: string): string {
  if (relativePath === '') return shownFolder;
  if (shownFolder === '.' || shownFolder === './') return relativePath;
  return shownFolder.endsWith('/') ? `${shownFolder}${relativePath}` : `${shownFolder}/${relativePath}`;
}

/** Orders strings by UTF-16 code units, the same on every machine and locale. */
function byCodeUnits(left: string, right: string): number {
  return left < right ? -1 : left > right ? 1 : 0;
}

function unreadable(shownPath: string, error: unknown, what: 'folder' | 'link'): InputError {
  const code = (error as NodeJS.ErrnoException).code ?? 'error';
  return {
    file: shownPath,
    line: 0,
    column: 0,
    message:
      what === 'link'
        ? `${shownPath} is a link that cannot be followed (${code}); it was not read.`
        : `The folder ${shownPath} cannot be listed (${code}); its files were not read.`,
    hint: what === 'link' ? 'fix or remove the broken link' : 'check that the folder exists and that you may read it',
  };
}
