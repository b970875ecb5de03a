// RDF/XML and JSON-LD: told by name or content, read through the loader, never parsed as Turtle.
import { readFileSync, rmSync } from 'node:fs';
import { Readable } from 'node:stream';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { detectFormat } from '../../src/load/format.js';
import { loadSources } from '../../src/load/sources.js';
import { temporaryTree } from './temp-tree.js';
import { readManifest } from './w3c-manifest.js';

const NV = 'https://data.northvale-rail.example/def/';
const RDF_NS = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#';
const PART_OF = `${NV}partOf`;
const RDF_XML = `<?xml version="1.0"?>\n<rdf:RDF xmlns:rdf="${RDF_NS}" xmlns:nv="${NV}">\n  <rdf:Description rdf:about="${NV}Pantograph"><nv:partOf rdf:resource="${NV}Locomotive"/></rdf:Description>\n</rdf:RDF>\n`;
// JSON-LD 1.1 keywords "@context" and "@id" (from memory: JSON-LD 1.1, section 1.7).
const JSON_LD = `{\n  "@context": { "nv": "${NV}" },\n  "@id": "nv:Pantograph",\n  "nv:partOf": { "@id": "nv:Locomotive" }\n}\n`;
const TURTLE = `@prefix nv: <${NV}> .\nnv:Pantograph nv:partOf nv:Locomotive .\n`;
const PANTOGRAPH_PART = { subject: `${NV}Pantograph`, predicate: PART_OF, object: `${NV}Locomotive` };

/** Loads `-` from the given text. */
function loadStdinText(text: string) {
  return loadSources(['-'], { stdin: Readable.from([Buffer.from(text)]) });
}

describe('recognising RDF/XML from the W3C RDF/XML test suite', () => {
  // Source: W3C rdf-tests rdf/rdf11/rdf-xml (test/standards/w3c-rdf-tests), every eval and negative
  // syntax test input: all are XML documents (negative ones break RDF/XML rules, not XML's start).
  const tests = readManifest('rdf-xml');

  it('tells each one apart as RDF/XML by content alone', () => {
    let recognised = 0;
    for (const test of tests) {
      expect(detectFormat('-', readFileSync(test.actionPath, 'utf8')), test.name).toBe('rdf-xml');
      recognised++;
    }
    expect(recognised).toBeGreaterThan(150);
  });

  it('reads an eval test file by its .rdf name with no error', async () => {
    const test = tests.find((entry) => entry.kind === 'eval' && entry.actionPath.endsWith('.rdf'));
    if (test === undefined) throw new Error('the RDF/XML manifest lists no .rdf eval test');
    const result = await loadSources([test.actionPath]);
    expect(result.errors).toEqual([]);
    expect(result.sources.map((source) => source.format)).toEqual(['rdf-xml']);
    expect(result.sources[0].errors).toEqual([]);
  });
});

let root: string;

beforeAll(() => {
  const tree = temporaryTree('isapart-markup-');
  root = tree.root;
  const write = tree.write;
  write('vocab/assets.owl', RDF_XML);
  write('vocab/assets.rdf.gz', gzipSync(RDF_XML));
  write('vocab/assets.xml', RDF_XML);
  write('vocab/assets.jsonld', JSON_LD);
  write('vocab/assets.ttl', TURTLE);
  write('misnamed/turtle-named-owl.owl', TURTLE);
  write('exports/assets.export', RDF_XML);
  write('exports/assets-ld.export', JSON_LD);
});

afterAll(() => {
  rmSync(root, { recursive: true, force: true });
});

describe('files named as RDF/XML or JSON-LD', () => {
  it('are read by their extension, plain or gzip, with the statement at its element or node object', async () => {
    const names = ['vocab/assets.owl', 'vocab/assets.rdf.gz', 'vocab/assets.xml', 'vocab/assets.jsonld'];
    const result = await loadSources(names, { cwd: root });
    expect(result.errors).toEqual([]);
    expect(result.sources.map((source) => [source.file, source.format, source.errors.length])).toEqual([
      ['vocab/assets.owl', 'rdf-xml', 0],
      ['vocab/assets.rdf.gz', 'rdf-xml', 0],
      ['vocab/assets.xml', 'rdf-xml', 0],
      ['vocab/assets.jsonld', 'json-ld', 0],
    ]);
    for (const source of result.sources) expect(source.statements).toMatchObject([PANTOGRAPH_PART]);
    // RDF/XML: the <nv:partOf> element on line 3; JSON-LD: the root node object's { on line 1.
    const elementColumn = RDF_XML.split('\n')[2].indexOf('<nv:partOf') + 1;
    expect(result.sources[0].statements[0].position).toEqual({ file: 'vocab/assets.owl', line: 3, column: elementColumn });
    expect(result.sources[3].statements[0].position).toEqual({ file: 'vocab/assets.jsonld', line: 1, column: 1 });
  });

  it('gives a Turtle file named .owl an RDF/XML syntax error at line 1, not a silent Turtle read', async () => {
    const result = await loadSources(['misnamed/turtle-named-owl.owl'], { cwd: root });
    expect(result.sources).toHaveLength(1);
    const [source] = result.sources;
    expect(source.statements).toEqual([]);
    expect(source.errors).toHaveLength(1);
    expect(source.errors[0]).toMatchObject({ file: 'misnamed/turtle-named-owl.owl', line: 1 });
    expect(source.errors[0].message).toMatch(/^RDF\/XML syntax error: /);
  });

  it('are told by content when their extension is none of the known ones', async () => {
    const result = await loadSources(['exports/assets.export', 'exports/assets-ld.export'], { cwd: root });
    expect(result.errors).toEqual([]);
    expect(result.sources.map((source) => source.format)).toEqual(['rdf-xml', 'json-ld']);
    for (const source of result.sources) expect(source.statements).toMatchObject([PANTOGRAPH_PART]);
  });

  it('are read inside a folder, except .xml, which is listed as skipped', async () => {
    const result = await loadSources(['vocab'], { cwd: root });
    expect(result.errors).toEqual([]);
    expect(result.sources.map((source) => source.file)).toEqual([
      'vocab/assets.jsonld',
      'vocab/assets.owl',
      'vocab/assets.rdf.gz',
      'vocab/assets.ttl',
    ]);
    expect(result.skippedFiles).toEqual(['vocab/assets.xml']);
  });
});

describe('RDF/XML and JSON-LD on stdin', () => {
  it('reads RDF/XML starting with <?xml, or with <rdf:RDF and no declaration', async () => {
    for (const text of [RDF_XML, RDF_XML.slice(RDF_XML.indexOf('<rdf:RDF'))]) {
      const result = await loadStdinText(text);
      expect(result.errors).toEqual([]);
      expect(result.sources.map((source) => [source.file, source.format])).toEqual([['<stdin>', 'rdf-xml']]);
      expect(result.sources[0].statements).toMatchObject([PANTOGRAPH_PART]);
    }
  });

  it('reads a JSON-LD object, and an array of objects, told by "@context" or "@id"', async () => {
    const array = `[ { "@id": "${NV}Pantograph", "${PART_OF}": [ { "@id": "${NV}Locomotive" } ] } ]`;
    for (const text of [JSON_LD, array]) {
      const result = await loadStdinText(text);
      expect(result.errors).toEqual([]);
      expect(result.sources.map((source) => source.format)).toEqual(['json-ld']);
      expect(result.sources[0].statements).toMatchObject([PANTOGRAPH_PART]);
    }
  });

  it('does not take Turtle, TriG or N-Triples that start with "<", "[" or "{" for XML or JSON', () => {
    // RFC 3987 (from memory): a scheme and ':' make an absolute IRI, so <rdf:RDF> is one and the line is N-Triples.
    expect(detectFormat('-', `<rdf:RDF> <${RDF_NS}type> <${NV}Document> .\n`)).toBe('n-triples');
    expect(detectFormat('-', `@prefix nv: <${NV}> .\n[ a nv:Coupler ] nv:partOf nv:Car .\n`)).toBe('turtle');
    expect(detectFormat('-', `{ <${NV}Car> <${NV}partOf> <${NV}Train> . }\n`)).toBe('trig');
    expect(detectFormat('-', `{ <${NV}Car> <${NV}label> "@id" . }\n`)).toBe('trig');
    expect(detectFormat('-', `[ <${NV}label> "{\\"@id\\": 1}" ] <${NV}partOf> <${NV}Car> .\n`)).toBe('turtle');
  });

  it('leaves plain JSON without JSON-LD keywords as content whose syntax cannot be told', async () => {
    const result = await loadStdinText('{ "depot": "Northvale North", "tracks": 12 }\n');
    expect(result.sources).toEqual([]);
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0].message).toBe('The syntax of standard input could not be told from its content; it was not read.');
    expect(result.errors[0].hint).toContain('RDF/XML or JSON-LD');
  });
});
