// The scale benchmark's inputs: generated hierarchies cached in the system's temporary folder, keyed by spec.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, statfsSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeHierarchy, type GeneratedCounts, type GeneratedSyntax } from './generate.js';

/** One generated input file and what it holds. */
export interface GeneratedInput {
  file: string;
  syntax: GeneratedSyntax;
  counts: GeneratedCounts;
}

/** Bytes per class the generator writes, a little over what 200k classes measured (922), for the disk check. */
const BYTES_PER_CLASS_ESTIMATE = 1000;

/** The cache folder; a changed generator gets new keys, so a stale file is never reused. */
export function cacheFolder(): string {
  const folder = path.join(tmpdir(), 'isapart-bench-cache');
  mkdirSync(folder, { recursive: true });
  return folder;
}

/** Short digest of the generator's source, part of every cache key. */
function generatorDigest(): string {
  const source = readFileSync(fileURLToPath(new URL('./generate.ts', import.meta.url)));
  return createHash('sha256').update(source).digest('hex').slice(0, 10);
}

/**
 * The generated file for `classes` (seed 1) in `syntax`: taken from the cache when a complete copy is
 * there (its counts file is written only after the data), otherwise generated into it.
 * Throws with a plain reason when the disk has too little room.
 */
export async function generatedInput(classes: number, syntax: GeneratedSyntax, log: (line: string) => void): Promise<GeneratedInput> {
  const folder = cacheFolder();
  const name = `hierarchy-${classes}-seed1-${generatorDigest()}.${syntax === 'turtle' ? 'ttl' : 'nt'}`;
  const file = path.join(folder, name);
  const countsFile = `${file}.counts.json`;
  if (existsSync(file) && existsSync(countsFile)) {
    log(`input: ${name} from the cache in ${folder}`);
    return { file, syntax, counts: JSON.parse(readFileSync(countsFile, 'utf8')) as GeneratedCounts };
  }
  const disk = statfsSync(folder);
  const free = disk.bavail * disk.bsize;
  const needed = classes * BYTES_PER_CLASS_ESTIMATE;
  if (free < needed * 1.2) throw new Error(`${(needed / 2 ** 30).toFixed(1)} GiB needed for ${name}, ${(free / 2 ** 30).toFixed(1)} GiB free in ${folder}`);
  log(`input: generating ${name} in ${folder} ...`);
  rmSync(countsFile, { force: true });
  const partial = `${file}.partial`;
  const counts = await writeHierarchy(partial, { classes, seed: 1 }, syntax);
  renameSync(partial, file);
  writeFileSync(countsFile, JSON.stringify(counts));
  return { file, syntax, counts };
}

/** Removes a generated input and its counts file from the cache. */
export function removeInput(input: GeneratedInput): void {
  rmSync(input.file, { force: true });
  rmSync(`${input.file}.counts.json`, { force: true });
}
