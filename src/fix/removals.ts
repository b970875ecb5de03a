// The safe line removals of every fix statement of a run, with each source file read once.
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Finding } from '../engine/finding.js';
import { STDIN_FILE } from '../load/parse.js';
import { isGzip } from '../load/source-text.js';
import type { RdfFormat, Statement } from '../load/statement.js';
import { removableLines, type LineRemoval } from './text-removal.js';

/**
 * For every statement some finding's fix removes, its whole-line removal when `removableLines`
 * says it is safe. Files are read again from disk (relative names from `cwd`); standard input,
 * gzip files and files that cannot be read give no removal, since their text cannot be edited in place.
 */
export async function textRemovalsFor(
  findings: readonly Finding[],
  sources: readonly { file: string; format: RdfFormat }[],
  cwd: string,
): Promise<Map<Statement, LineRemoval>> {
  const formats = new Map(sources.map((source) => [source.file, source.format]));
  const byFile = new Map<string, Statement[]>();
  for (const finding of findings) {
    for (const statement of finding.fix?.remove ?? []) {
      const same = byFile.get(statement.position.file);
      if (same === undefined) byFile.set(statement.position.file, [statement]);
      else same.push(statement);
    }
  }
  const removals = new Map<Statement, LineRemoval>();
  for (const [file, statements] of byFile) {
    const format = formats.get(file);
    if (format === undefined || file === STDIN_FILE) continue;
    const absolute = path.resolve(cwd, file);
    let bytes: Buffer;
    try {
      bytes = await readFile(absolute);
    } catch {
      continue;
    }
    if (isGzip(bytes)) continue;
    const text = bytes.toString('utf8');
    const baseIri = pathToFileURL(absolute).href;
    for (const statement of statements) {
      const removal = removableLines(statement, text, format, { baseIri });
      if (removal !== undefined) removals.set(statement, removal);
    }
  }
  return removals;
}
