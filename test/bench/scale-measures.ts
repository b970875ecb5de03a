// The reference measures of the scale benchmark, one per child process: newline scan, n3 bare parse, oxigraph.
// Usage: node --import tsx test/bench/scale-measures.ts newline-scan|n3-parse|oxigraph FILE SYNTAX [SCOPE-JSON]
// Prints one JSON line: the work's own wall and CPU milliseconds (module loading excluded) and what it counted.
import { closeSync, createReadStream, openSync, readSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { StreamParser } from 'n3';
import oxigraph from 'oxigraph';
import { ruleQueries, type BenchScope } from './sparql-rules.js';

/** Bytes per read for the chunked readers. */
const CHUNK_BYTES = 1 << 20;

/** The syntaxes the benchmark generates. */
type Syntax = 'n-triples' | 'turtle';

/** The file's chunks, read with fs one after another; the buffer is fresh for each chunk. */
function* fileChunks(file: string): Generator<Uint8Array> {
  const descriptor = openSync(file, 'r');
  try {
    for (;;) {
      const buffer = Buffer.allocUnsafe(CHUNK_BYTES);
      const read = readSync(descriptor, buffer, 0, CHUNK_BYTES, null);
      if (read === 0) return;
      yield buffer.subarray(0, read);
    }
  } finally {
    closeSync(descriptor);
  }
}

/** The floor: read the file in chunks and count line feeds (0x0A). */
function newlineScan(file: string): Record<string, number> {
  const descriptor = openSync(file, 'r');
  const buffer = Buffer.allocUnsafe(CHUNK_BYTES);
  let lines = 0;
  let bytes = 0;
  try {
    for (;;) {
      const read = readSync(descriptor, buffer, 0, CHUNK_BYTES, null);
      if (read === 0) break;
      bytes += read;
      let at = buffer.indexOf(0x0a, 0);
      while (at !== -1 && at < read) {
        lines += 1;
        at = buffer.indexOf(0x0a, at + 1);
      }
    }
  } finally {
    closeSync(descriptor);
  }
  return { lines, bytes };
}

/** n3's streaming parser over a file stream, keeping nothing but a count. */
async function n3Parse(file: string, syntax: Syntax): Promise<Record<string, number>> {
  const parser = new StreamParser({ format: syntax === 'turtle' ? 'Turtle' : 'N-Triples' });
  let quads = 0;
  await new Promise<void>((resolve, reject) => {
    parser.on('data', () => {
      quads += 1;
    });
    parser.on('end', resolve);
    parser.on('error', reject);
    createReadStream(file, { highWaterMark: CHUNK_BYTES }).on('error', reject).pipe(parser);
  });
  return { quads };
}

/** Loads the file into an in-memory oxigraph store, streamed in chunks, then runs the four rule queries. */
function oxigraphLoadAndQuery(file: string, syntax: Syntax, scope: BenchScope): Record<string, number> {
  const store = new oxigraph.Store();
  const start = performance.now();
  // no_transaction: the store is fresh and private, so the bulk path is the fair choice for the store.
  store.load(fileChunks(file), { format: syntax === 'turtle' ? 'text/turtle' : 'application/n-triples', no_transaction: true });
  const result: Record<string, number> = { loadMs: performance.now() - start, quads: store.size };
  for (const query of ruleQueries(scope)) {
    const queryStart = performance.now();
    const rows = store.query(query.sparql);
    if (!Array.isArray(rows)) throw new Error(`query for ${query.ruleId} did not return rows`);
    result[`${query.ruleId}.ms`] = performance.now() - queryStart;
    result[`${query.ruleId}.rows`] = rows.length;
  }
  return result;
}

const [measure, file, syntaxArgument, scopeJson] = process.argv.slice(2);
const syntax: Syntax = syntaxArgument === 'turtle' ? 'turtle' : 'n-triples';
const start = performance.now();
const cpuStart = process.cpuUsage();
let counts: Record<string, number>;
if (measure === 'newline-scan') counts = newlineScan(file);
else if (measure === 'n3-parse') counts = await n3Parse(file, syntax);
else if (measure === 'oxigraph') counts = oxigraphLoadAndQuery(file, syntax, JSON.parse(scopeJson) as BenchScope);
else {
  console.error('usage: scale-measures.ts newline-scan|n3-parse|oxigraph FILE n-triples|turtle [SCOPE-JSON]');
  process.exit(2);
}
const cpu = process.cpuUsage(cpuStart);
console.log(JSON.stringify({ ms: performance.now() - start, cpuMs: (cpu.user + cpu.system) / 1000, ...counts }));
