// Test helpers for large inputs: N-Triples lines written to a file in batches, never held whole.
import { createWriteStream } from 'node:fs';
import { once } from 'node:events';

/** Lines written per batch. */
const BATCH = 10_000;

/** Writes `count` lines, line i (0-based) being `lineAt(i)`, each ended by a newline. */
export async function writeLines(file: string, count: number, lineAt: (index: number) => string): Promise<void> {
  const stream = createWriteStream(file);
  for (let start = 0; start < count; start += BATCH) {
    const batch: string[] = [];
    for (let index = start; index < Math.min(count, start + BATCH); index++) batch.push(lineAt(index));
    if (!stream.write(`${batch.join('\n')}\n`)) await once(stream, 'drain');
  }
  stream.end();
  await once(stream, 'finish');
}
