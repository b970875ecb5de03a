// detectFormat: by extension, and by sniffing content for `-` and unknown extensions.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { detectFormat, RDF_EXTENSIONS } from '../../src/load/format.js';
import { parseSource } from '../../src/load/parse.js';
import { readManifest, SUITES } from './w3c-manifest.js';

const NV = 'https://data.northvale-rail.example/def/';

describe('detectFormat by extension', () => {
  it('maps the extensions, in any case and under .gz', () => {
    expect(RDF_EXTENSIONS).toEqual(['.ttl', '.trig', '.nt', '.nq', '.rdf', '.owl', '.jsonld']);
    expect(detectFormat('vocab/assets.owl', '')).toBe('rdf-xml');
    expect(detectFormat('vocab/assets.RDF.gz', '')).toBe('rdf-xml');
    expect(detectFormat('vocab/assets.xml', '')).toBe('rdf-xml');
    expect(detectFormat('vocab/assets.jsonld', '')).toBe('json-ld');
    expect(detectFormat('fleet/cars.ttl', '')).toBe('turtle');
    expect(detectFormat('fleet/cars.TTL', '')).toBe('turtle');
    expect(detectFormat('fleet/graphs.trig.gz', '')).toBe('trig');
    expect(detectFormat('dump.nt.gz', '')).toBe('n-triples');
    expect(detectFormat('dump.nq', '')).toBe('n-quads');
  });

  it('trusts the extension over the content', () => {
    expect(detectFormat('cars.nt', `@prefix nv: <${NV}> .`)).toBe('n-triples');
  });
});

describe('detectFormat by content', () => {
  it('recognises Turtle by directives, prefixed names, ";" and "["', () => {
    expect(detectFormat('-', `@prefix nv: <${NV}> .\nnv:Car a nv:Wagon .`)).toBe('turtle');
    expect(detectFormat('-', `PREFIX nv: <${NV}>\nnv:Car a nv:Wagon .`)).toBe('turtle');
    expect(detectFormat('-', `@base <${NV}> .\n<Car> <partOf> <Train> .`)).toBe('turtle');
    expect(detectFormat('notes.txt', `<${NV}Car> <${NV}p> <${NV}a> ; <${NV}q> <${NV}b> .`)).toBe('turtle');
    expect(detectFormat('-', `<${NV}Car> <${NV}p> [ <${NV}q> <${NV}b> ] .`)).toBe('turtle');
  });

  it('recognises TriG by a graph block, but not by braces inside strings', () => {
    expect(detectFormat('-', `@prefix nv: <${NV}> .\nnv:fleet { nv:Car a nv:Wagon . }`)).toBe('trig');
    expect(detectFormat('-', `<${NV}Car> <${NV}label> "a {curly} name" .`)).toBe('n-triples');
  });

  it('recognises N-Triples and N-Quads lines', () => {
    const triple = `<${NV}Car> <${NV}partOf> <${NV}Train> .`;
    const quad = `<${NV}Car> <${NV}partOf> <${NV}Train> <${NV}fleet> .`;
    expect(detectFormat('-', `${triple}\n_:b1 <${NV}label> "Car"@en .\n`)).toBe('n-triples');
    expect(detectFormat('-', `${triple}\n${quad}\n`)).toBe('n-quads');
  });

  it('gives undefined for text that is no RDF, and Turtle for an empty document', () => {
    expect(detectFormat('README', 'Northvale Rail asset graph, see the wiki.')).toBeUndefined();
    expect(detectFormat('-', '')).toBe('turtle');
    expect(detectFormat('-', '# only a comment\n')).toBe('turtle');
  });

  it('sniffs the W3C N-Triples and N-Quads positive tests as their own syntax or one that reads them', () => {
    // Source: W3C rdf-tests rdf/rdf11 N-Triples and N-Quads positive syntax tests. Every N-Triples
    // document is also N-Quads and Turtle, so a sniff of any of those reads it correctly.
    const readers = { 'n-triples': ['n-triples', 'turtle'], 'n-quads': ['n-quads', 'n-triples', 'trig'] } as const;
    let sniffed = 0;
    for (const suite of SUITES.filter((entry) => entry.format === 'n-triples' || entry.format === 'n-quads')) {
      for (const test of readManifest(suite.folder).filter((entry) => entry.kind === 'positive-syntax')) {
        const text = readFileSync(test.actionPath, 'utf8');
        if (text.trim() === '' || /^\s*(#.*)?$/.test(text.trim())) continue;
        const format = detectFormat('-', text);
        expect(readers[suite.format as 'n-triples' | 'n-quads'] as readonly string[]).toContain(format);
        sniffed++;
      }
    }
    expect(sniffed).toBeGreaterThan(50);
  });

  it('sniffs every W3C positive and eval test document as a syntax that then parses it without error', () => {
    // Source: W3C rdf-tests rdf/rdf11 Turtle, TriG, N-Triples and N-Quads suites (positive syntax and
    // eval tests), read as if they came through stdin with no file name.
    let parsed = 0;
    for (const suite of SUITES) {
      for (const test of readManifest(suite.folder).filter((entry) => entry.kind === 'positive-syntax' || entry.kind === 'eval')) {
        const text = readFileSync(test.actionPath, 'utf8');
        const format = detectFormat('-', text);
        if (format === undefined || format === 'rdf-xml' || format === 'json-ld') throw new Error(`${test.name}: sniffed as ${format ?? 'nothing'}`);
        const source = parseSource(text, test.actionPath, format, { baseIri: test.baseIri });
        expect(source.errors, test.name).toEqual([]);
        parsed++;
      }
    }
    expect(parsed).toBeGreaterThan(500);
  });
});
