// Paths and URIs of input files as reports show them: relative to the folder the run started in.
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { isUrlLocation } from '../load/endpoint-location.js';
import { STDIN_FILE } from '../load/parse.js';

export { STDIN_FILE } from '../load/parse.js';

/** A file's path relative to `cwd`, with forward slashes; stdin stays as the loader names it, a path on another root stays absolute. */
export function relativePath(file: string, cwd: string): string {
  // An endpoint is named by its URL, which is no path.
  if (file === STDIN_FILE || isUrlLocation(file)) return file;
  const absolute = path.resolve(cwd, file);
  const relative = path.relative(cwd, absolute);
  // On Windows a path on another drive has no relative form.
  const shown = relative === '' || path.isAbsolute(relative) ? absolute : relative;
  return shown.split(path.sep).join('/');
}

/** Whether a path from `relativePath` is relative (and so resolves against the run's folder). */
export function isRelativeShownPath(shown: string): boolean {
  return shown !== STDIN_FILE && !isUrlLocation(shown) && !path.isAbsolute(shown) && !/^[A-Za-z]:\//.test(shown);
}

/**
 * A file as a URI reference: relative to `cwd` with each segment percent-encoded, or an absolute
 * `file:` URL when it has no relative form; undefined for stdin, which has no URI.
 */
export function fileUri(file: string, cwd: string): string | undefined {
  if (file === STDIN_FILE) return undefined;
  if (isUrlLocation(file)) return file;
  const shown = relativePath(file, cwd);
  if (!isRelativeShownPath(shown)) return pathToFileURL(path.resolve(cwd, file)).href;
  const reference = shown.split('/').map(encodePathSegment).join('/');
  // A colon before the first slash would read as a scheme (RFC 3986, section 4.2).
  return /^[^/]*:/.test(reference) ? `./${reference}` : reference;
}

// Characters RFC 3986 allows as they are in a path segment (pchar), which encodeURIComponent escapes.
const PATH_SEGMENT_UNESCAPES: Record<string, string> = { '%3A': ':', '%40': '@', '%24': '$', '%26': '&', '%2B': '+', '%2C': ',', '%3B': ';', '%3D': '=' };

function encodePathSegment(segment: string): string {
  return encodeURIComponent(segment).replace(/%(3A|40|24|26|2B|2C|3B|3D)/g, (escape) => PATH_SEGMENT_UNESCAPES[escape]);
}

/** The folder as an absolute `file:` URL ending in `/`, so relative URIs resolve against it. */
export function folderUri(folder: string): string {
  const href = pathToFileURL(path.resolve(folder)).href;
  return href.endsWith('/') ? href : `${href}/`;
}
