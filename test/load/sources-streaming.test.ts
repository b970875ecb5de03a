// loadSources reads Turtle, TriG, RDF/XML and JSON-LD as their chunks come: stored early, bad bytes and broken gzip placed exactly.
import { readFileSync } from 'node:fs';
import { Readable } from 'node:stream';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { loadSources, type LoadResultWithSkipped } from '../../src/load/sources.js';
import { StatementStore } from '../../src/load/statement-store.js';
import { randomSource } from '../random-source.js';
import { temporaryTree } from './temp-tree.js';
import { readManifest } from './w3c-manifest.js';
import { randomCuts } from './chunked-turtle.js';

const NV = 'https://data.northvale-rail.example/def/';

/** A Turtle text: a prefix line, then `count` statements, one a line: line n + 2 states that Car n is part of a Train. */
function partLines(count: number): string {
  let text = `@prefix nv: <${NV}> .\n`;
  for (let index = 0; index < count; index++) text += `nv:Car${index} nv:partOf <${NV}Train${index % 17}> . # Wagen ${index} ü\n`;
  return text;
}

/** Bytes cut at the given offsets. */
function pieces(bytes: Uint8Array, cuts: number[]): Buffer[] {
  const result: Buffer[] = [];
  let start = 0;
  for (const cut of [...cuts, bytes.length]) {
    if (cut > start) result.push(Buffer.from(bytes.subarray(start, cut)));
    start = cut;
  }
  return result;
}

/** What a load gives, as plain data to compare (statements read back from the store). */
function loaded(result: LoadResultWithSkipped): unknown {
  return {
    errors: result.errors,
    sources: result.sources.map((source) => ({
      format: source.format,
      statements: source.statements,
      errors: source.errors,
      warnings: source.warnings,
      allowComments: source.allowComments,
      prefixes: source.prefixes,
      statementCount: source.statementCount,
    })),
  };
}

describe('loadSources streams the whole-text syntaxes', () => {
  it('stores the statements of the first chunks before the last chunk has come', async () => {
    const text = partLines(6000);
    const bytes = Buffer.from(text);
    const chunks = pieces(bytes, Array.from({ length: Math.floor(bytes.length / 16384) }, (_, index) => (index + 1) * 16384));
    const store = new StatementStore();
    let storedBeforeLast = -1;
    async function* withheldEnd(): AsyncGenerator<Buffer> {
      for (const chunk of chunks.slice(0, -1)) yield chunk;
      // The last chunk waits until statements of the earlier ones are in the store (or 5 s, for a loader that gathers first).
      const deadline = Date.now() + 5000;
      while (store.size === 0 && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 5));
      storedBeforeLast = store.size;
      yield chunks[chunks.length - 1];
    }
    const result = await loadSources(['-'], { stdin: Readable.from(withheldEnd()), store });
    expect(chunks.length).toBeGreaterThan(10);
    expect(storedBeforeLast).toBeGreaterThan(5500);
    expect(result.errors).toEqual([]);
    expect(result.sources[0].statements).toHaveLength(6000);
  });

  it('places a bad UTF-8 byte in a later chunk at its line and column, keeping the statements before it', async () => {
    const lines = partLines(3000).split('\n');
    const badLine = 2500;
    const before = lines.slice(0, badLine - 1).join('\n') + '\n';
    const prefix = `nv:Car9999 nv:label "Wagen `;
    const bytes = Buffer.concat([Buffer.from(before + prefix), Buffer.from([0xff]), Buffer.from(`" .\n${lines.slice(badLine).join('\n')}`)]);
    const badOffset = Buffer.byteLength(before + prefix);
    // Cuts of 4 KiB, one right before the bad byte, and one inside the ü just before its line.
    const cuts = [...randomCuts(randomSource(1), bytes.length, 4096), badOffset, badOffset - prefix.length - 3].sort((a, b) => a - b);
    const result = await loadSources(['-'], { stdin: Readable.from(pieces(bytes, cuts)) });
    expect(result.errors).toEqual([]);
    const [source] = result.sources;
    // Line 1 declares the prefix, so lines 2 to badLine - 1 state one statement each.
    expect(source.format).toBe('turtle');
    expect(source.statements).toHaveLength(badLine - 2);
    expect(source.statements[badLine - 3].position.line).toBe(badLine - 1);
    expect(source.errors).toHaveLength(1);
    expect(source.errors[0]).toMatchObject({ file: '<stdin>', line: badLine, column: prefix.length + 1 });
    expect(source.errors[0].message).toContain('the statements before it were read, the rest of the file was not');
  });

  it('reports a truncated gzip Turtle file as an error, keeping the statements read before the cut', async () => {
    const tree = temporaryTree('isapart-stream-');
    const text = partLines(20000);
    const compressed = gzipSync(text);
    tree.write('fleet.ttl.gz', compressed.subarray(0, Math.floor(compressed.length * 0.6)));
    tree.write('fleet.ttl', text);
    const whole = await loadSources(['fleet.ttl'], { cwd: tree.root });
    const result = await loadSources(['fleet.ttl.gz'], { cwd: tree.root });
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0].file).toBe('fleet.ttl.gz');
    expect(result.errors[0].message).toMatch(/cannot be decompressed .*; its first \d+ lines were read, the rest was not\./);
    const read = result.sources[0].statements;
    expect(read.length).toBeGreaterThan(1000);
    expect(read.length).toBeLessThan(20000);
    // The cut in the middle of a statement is no syntax error: the stream broke off, the text did not end.
    expect(result.sources[0].errors).toEqual([]);
    const full = whole.sources[0].statements.slice(0, read.length);
    expect(read.map((statement) => [statement.subject, statement.position.line])).toEqual(full.map((statement) => [statement.subject, statement.position.line]));
  });
});

// Source: W3C rdf-tests repository, commit ad541a5f0479f0798608c4801369d97b8e08b36f, rdf/rdf11/rdf-xml
// (copied unchanged into test/standards/w3c-rdf-tests); and the project's JSON-LD demo file.
describe('RDF/XML and JSON-LD read from random chunks as from one', () => {
  const files = [
    ...readManifest('rdf-xml').map((test) => test.actionPath),
    fileURLToPath(new URL('../../fixtures/formats/components.jsonld', import.meta.url)),
    fileURLToPath(new URL('../../fixtures/formats/components.rdf', import.meta.url)),
  ];

  it('reads the files as RDF/XML and JSON-LD (so the comparison below is not vacuous)', async () => {
    const formats = new Set<string>();
    for (const file of files) {
      const result = await loadSources(['-'], { stdin: Readable.from([readFileSync(file)]) });
      for (const source of result.sources) formats.add(source.format);
    }
    expect([...formats].sort()).toEqual(['json-ld', 'rdf-xml']);
  });

  it.each(files.map((file) => [file.slice(file.lastIndexOf('/rdf11/') + 1)]))('%s', async (name) => {
    const file = files.find((candidate) => candidate.endsWith(name)) as string;
    const bytes = readFileSync(file);
    const whole = await loadSources(['-'], { stdin: Readable.from([bytes]) });
    const random = randomSource(bytes.length);
    for (const largest of [1, 7, 200]) {
      const chunked = await loadSources(['-'], { stdin: Readable.from(pieces(bytes, randomCuts(random, bytes.length, largest))) });
      expect(loaded(chunked)).toEqual(loaded(whole));
    }
  });
});

describe('generated JSON-LD read from random chunks as from one', () => {
  /** A Northvale Rail JSON-LD document: nested node objects, values before their @id, lists, non-ASCII labels. */
  function jsonLdDocument(random: () => number, nodes: number): string {
    const pick = <T>(items: readonly T[]): T => items[Math.floor(random() * items.length)];
    const graph: unknown[] = [];
    for (let index = 0; index < nodes; index++) {
      const node: Record<string, unknown> = {};
      // Keys before "@id" make the parser hold their statements back until the @id comes.
      if (random() < 0.5) node.label = { '@value': `Wagen ${pick(['é', '日本', '🚆', 'ß'])} ${index}`, '@language': 'de' };
      node['@id'] = `nv:Car${index}`;
      node['@type'] = 'owl:Class';
      node.subClassOf = random() < 0.3 ? [`nv:Car${Math.floor(random() * nodes)}`, 'nv:Asset'] : 'nv:Asset';
      if (random() < 0.4) node.partOf = { '@id': `nv:Train${index % 5}`, label: `Zug ${index % 5} ü`, partOf: { '@id': 'nv:Fleet' } };
      if (random() < 0.2) node.consistOf = { '@list': [`nv:Axle${index}`, `nv:Axle${index + 1}`] };
      graph.push(node);
    }
    const document = {
      '@context': {
        nv: NV,
        owl: 'http://www.w3.org/2002/07/owl#',
        rdfs: 'http://www.w3.org/2000/01/rdf-schema#',
        label: 'rdfs:label',
        subClassOf: { '@id': 'rdfs:subClassOf', '@type': '@id' },
        partOf: { '@id': 'nv:partOf' },
        consistOf: { '@id': 'nv:consistOf', '@type': '@id' },
      },
      '@graph': graph,
    };
    return JSON.stringify(document, null, random() < 0.5 ? 2 : undefined);
  }

  it('gives the same statements, places and errors for 30 documents, whole or broken', async () => {
    const random = randomSource(41);
    let statements = 0;
    let broken = 0;
    for (let round = 0; round < 30; round++) {
      let text = jsonLdDocument(random, 2 + Math.floor(random() * 12));
      // Every third document has a syntax error somewhere in it: a second comma after one (no string holds a comma).
      if (round % 3 === 2) {
        const commas = [...text.matchAll(/,/g)].map((match) => match.index as number);
        const at = commas[Math.floor(random() * commas.length)] + 1;
        text = `${text.slice(0, at)},${text.slice(at)}`;
      }
      const bytes = Buffer.from(text);
      const whole = await loadSources(['-'], { stdin: Readable.from([bytes]) });
      expect(whole.sources[0].format).toBe('json-ld');
      statements += whole.sources[0].statements.length;
      if (whole.sources[0].errors.length > 0) broken++;
      const chunked = await loadSources(['-'], { stdin: Readable.from(pieces(bytes, randomCuts(random, bytes.length, 1 + Math.floor(random() * 40)))) });
      expect(loaded(chunked)).toEqual(loaded(whole));
    }
    expect(statements).toBeGreaterThan(300);
    expect(broken).toBe(10);
  });
});
