// RDF/XML and JSON-LD: recognised by name or content and refused with one clear error, never parsed as Turtle.
import { readFileSync, rmSync } from 'node:fs';
import { Readable } from 'node:stream';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { detectFormat, detectUnreadSyntax } from '../../src/load/format.js';
import { loadSources } from '../../src/load/sources.js';
import { temporaryTree } from './temp-tree.js';
import { readManifest } from './w3c-manifest.js';

const NV = 'https://data.northvale-rail.example/def/';
const RDF_NS = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#';
const RDF_XML = `<?xml version="1.0"?>\n<rdf:RDF xmlns:rdf="${RDF_NS}" xmlns:nv="${NV}">\n  <rdf:Description rdf:about="${NV}Pantograph"><nv:partOf rdf:resource="${NV}Locomotive"/></rdf:Description>\n</rdf:RDF>\n`;
// JSON-LD 1.1 keywords "@context" and "@id" (from memory: JSON-LD 1.1, section 1.7).
const JSON_LD = `{\n  "@context": { "nv": "${NV}" },\n  "@id": "nv:Pantograph",\n  "nv:partOf": { "@id": "nv:Locomotive" }\n}\n`;
const TURTLE = `@prefix nv: <${NV}> .\nnv:Pantograph nv:partOf nv:Locomotive .\n`;

/** Loads `-` from the given text. */
function loadStdinText(text: string) {
  return loadSources(['-'], { stdin: Readable.from([Buffer.from(text)]) });
}

describe('recognising RDF/XML from the W3C RDF/XML test suite', () => {
  // Source: W3C rdf-tests rdf/rdf11/rdf-xml (test/standards/w3c-rdf-tests), every eval and negative
  // syntax test input: all are XML documents (negative ones break RDF/XML rules, not XML's start).
  const tests = readManifest('rdf-xml');

  it('tells each one apart as RDF/XML by content alone, and never as a syntax isapart reads', () => {
    let recognised = 0;
    for (const test of tests) {
      const text = readFileSync(test.actionPath, 'utf8');
      expect(detectFormat('-', text), test.name).toBeUndefined();
      expect(detectUnreadSyntax('-', text)?.syntax, test.name).toBe('RDF/XML');
      recognised++;
    }
    expect(recognised).toBeGreaterThan(150);
  });

  it('refuses one as a file with one error naming RDF/XML and a hint to convert it', async () => {
    const test = tests.find((entry) => entry.kind === 'eval' && entry.actionPath.endsWith('.rdf'));
    if (test === undefined) throw new Error('the RDF/XML manifest lists no .rdf eval test');
    const result = await loadSources([test.actionPath]);
    expect(result.sources).toEqual([]);
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0]).toMatchObject({ file: test.actionPath, line: 0, column: 0 });
    expect(result.errors[0].message).toBe(`RDF/XML is not read by isapart: ${test.actionPath} was not read (its name ends in .rdf).`);
    expect(result.errors[0].hint).toContain('convert it to Turtle or N-Triples first');
  });
});

let root: string;

beforeAll(() => {
  const tree = temporaryTree('isapart-unread-');
  root = tree.root;
  const write = tree.write;
  write('vocab/assets.owl', RDF_XML);
  write('vocab/assets.rdf.gz', gzipSync(RDF_XML));
  write('vocab/assets.xml', RDF_XML);
  write('vocab/assets.jsonld', JSON_LD);
  write('vocab/turtle-named-owl.owl', TURTLE);
  write('vocab/assets.ttl', TURTLE);
  write('exports/assets.export', RDF_XML);
  write('exports/assets-ld.export', JSON_LD);
});

afterAll(() => {
  rmSync(root, { recursive: true, force: true });
});

describe('files named as RDF/XML or JSON-LD', () => {
  it('give one clear error each when named, whatever they hold', async () => {
    const names = ['vocab/assets.owl', 'vocab/assets.rdf.gz', 'vocab/assets.xml', 'vocab/assets.jsonld', 'vocab/turtle-named-owl.owl'];
    const result = await loadSources(names, { cwd: root });
    expect(result.sources).toEqual([]);
    expect(result.errors.map((error) => [error.file, error.line, error.column, error.message])).toEqual([
      ['vocab/assets.owl', 0, 0, 'RDF/XML is not read by isapart: vocab/assets.owl was not read (its name ends in .owl).'],
      ['vocab/assets.rdf.gz', 0, 0, 'RDF/XML is not read by isapart: vocab/assets.rdf.gz was not read (its name ends in .rdf.gz).'],
      ['vocab/assets.xml', 0, 0, 'RDF/XML is not read by isapart: vocab/assets.xml was not read (its name ends in .xml).'],
      ['vocab/assets.jsonld', 0, 0, 'JSON-LD is not read by isapart: vocab/assets.jsonld was not read (its name ends in .jsonld).'],
      ['vocab/turtle-named-owl.owl', 0, 0, 'RDF/XML is not read by isapart: vocab/turtle-named-owl.owl was not read (its name ends in .owl).'],
    ]);
    for (const error of result.errors) {
      expect(error.hint).toContain('convert it to Turtle or N-Triples first');
      // A file already in Turtle under an RDF/XML name is told how to be read.
      expect(error.hint).toContain('.ttl, .trig, .nt, .nq');
    }
  });

  it('are told by content when their extension is none of the known ones', async () => {
    const result = await loadSources(['exports/assets.export', 'exports/assets-ld.export'], { cwd: root });
    expect(result.sources).toEqual([]);
    expect(result.errors.map((error) => error.message)).toEqual([
      'RDF/XML is not read by isapart: exports/assets.export was not read (it starts as XML does, with <?xml).',
      'JSON-LD is not read by isapart: exports/assets-ld.export was not read (it is JSON with the key "@context").',
    ]);
  });

  it('are skipped inside a folder and listed as skipped, with no error', async () => {
    const result = await loadSources(['vocab'], { cwd: root });
    expect(result.errors).toEqual([]);
    expect(result.sources.map((source) => source.file)).toEqual(['vocab/assets.ttl']);
    expect(result.skippedFiles).toEqual([
      'vocab/assets.jsonld',
      'vocab/assets.owl',
      'vocab/assets.rdf.gz',
      'vocab/assets.xml',
      'vocab/turtle-named-owl.owl',
    ]);
  });
});

describe('RDF/XML and JSON-LD on stdin', () => {
  it('refuses RDF/XML starting with <?xml, or with <rdf:RDF and no declaration', async () => {
    for (const text of [RDF_XML, RDF_XML.slice(RDF_XML.indexOf('<rdf:RDF'))]) {
      const result = await loadStdinText(text);
      expect(result.sources).toEqual([]);
      expect(result.errors).toHaveLength(1);
      expect(result.errors[0]).toMatchObject({ file: '<stdin>', line: 0, column: 0 });
      expect(result.errors[0].message).toMatch(/^RDF\/XML is not read by isapart: standard input was not read/);
      expect(result.errors[0].hint).toBe('convert it to Turtle or N-Triples first, with an RDF converter of your choice, and pipe the result in');
    }
  });

  it('refuses a JSON-LD object, and an array of objects, with "@context" or "@id"', async () => {
    const array = `[ { "@id": "${NV}Pantograph", "${NV}partOf": [ { "@id": "${NV}Locomotive" } ] } ]`;
    for (const [text, key] of [[JSON_LD, '@context'], [array, '@id']]) {
      const result = await loadStdinText(text);
      expect(result.sources).toEqual([]);
      expect(result.errors.map((error) => error.message)).toEqual([
        `JSON-LD is not read by isapart: standard input was not read (it is JSON with the key "${key}").`,
      ]);
    }
  });

  it('does not take Turtle, TriG or N-Triples that start with "<", "[" or "{" for XML or JSON', () => {
    // RFC 3987 (from memory): a scheme and ':' make an absolute IRI, so <rdf:RDF> is one and the line is N-Triples.
    expect(detectFormat('-', `<rdf:RDF> <${RDF_NS}type> <${NV}Document> .\n`)).toBe('n-triples');
    expect(detectFormat('-', `@prefix nv: <${NV}> .\n[ a nv:Coupler ] nv:partOf nv:Car .\n`)).toBe('turtle');
    expect(detectFormat('-', `{ <${NV}Car> <${NV}partOf> <${NV}Train> . }\n`)).toBe('trig');
    expect(detectUnreadSyntax('-', `{ <${NV}Car> <${NV}label> "@id" . }\n`)).toBeUndefined();
    expect(detectUnreadSyntax('-', `[ <${NV}label> "{\\"@id\\": 1}" ] <${NV}partOf> <${NV}Car> .\n`)).toBeUndefined();
  });

  it('leaves plain JSON without JSON-LD keywords as content whose syntax cannot be told', async () => {
    const result = await loadStdinText('{ "depot": "Northvale North", "tracks": 12 }\n');
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0].message).toBe('The syntax of standard input could not be told from its content; it was not read.');
  });
});
