// parseJsonLd: statements placed at their node object, chunks, syntax errors, and contexts that are never fetched.
import dns from 'node:dns';
import http from 'node:http';
import https from 'node:https';
import net from 'node:net';
import { rmSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import fc from 'fast-check';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { textChunks } from '../../src/load/parse-any.js';
import { parseJsonLd } from '../../src/load/jsonld.js';
import { JsonPlaces } from '../../src/load/json-places.js';
import { temporaryTree } from './temp-tree.js';
import { statementRows } from './statement-rows.js';

const NV = 'https://data.northvale-rail.example/def/';
const RDFS = 'http://www.w3.org/2000/01/rdf-schema#';
const CONTEXT = `{ "nv": "${NV}", "rdfs": "${RDFS}", "subClassOf": { "@id": "rdfs:subClassOf", "@type": "@id" } }`;

const TEXT = [
  '{',
  `  "@context": ${CONTEXT},`,
  '  "@graph": [',
  '    {',
  '      "@id": "nv:Pantograph",',
  '      "@type": "rdfs:Class",',
  '      "subClassOf": "nv:CurrentCollector",',
  '      "nv:partOf": [ { "@id": "nv:Locomotive" } ]',
  '    },',
  '    {',
  '      "nv:partOf": { "@id": "nv:Roof", "nv:partOf": { "@id": "nv:Car" } },',
  '      "@id": "nv:Pan2"',
  '    },',
  '    { "@reverse": { "nv:partOf": { "@id": "nv:Door" } }, "@id": "nv:Car", "rdfs:label": "Car 🚆" }',
  '  ]',
  '}',
  '',
].join('\n');

const rows = statementRows;

describe('parseJsonLd places each statement at the node object that states it', () => {
  it('in @graph, with @id before or after the properties, nested, and through @reverse', async () => {
    const source = await parseJsonLd(textChunks(TEXT), 'fleet/assets.jsonld');
    expect(source.errors).toEqual([]);
    // Lines and columns of the node objects' '{' in TEXT above.
    expect(rows(source)).toEqual([
      ['nv:Pantograph', 'rdfs:subClassOf', 'nv:CurrentCollector', 4, 5],
      ['nv:Pantograph', 'nv:partOf', 'nv:Locomotive', 4, 5],
      ['nv:Pantograph', 'rdf:type', 'rdfs:Class', 4, 5],
      ['nv:Roof', 'nv:partOf', 'nv:Car', 11, 20],
      ['nv:Pan2', 'nv:partOf', 'nv:Roof', 10, 5],
      ['nv:Car', 'rdfs:label', 'Car 🚆', 14, 5],
      ['nv:Door', 'nv:partOf', 'nv:Car', 14, 5],
    ]);
    expect(source.prefixes).toMatchObject({ nv: NV, rdfs: RDFS });
  });

  it('gives the same statements and places whatever the chunks, CRLF line ends included', async () => {
    const crlf = TEXT.replace(/\n/g, '\r\n');
    const whole = rows(await parseJsonLd(textChunks(crlf), 'fleet/assets.jsonld'));
    expect(whole.length).toBe(7);
    await fc.assert(
      fc.asyncProperty(fc.uniqueArray(fc.integer({ min: 1, max: crlf.length - 1 }), { maxLength: 30 }), async (cuts) => {
        const sorted = [0, ...cuts.sort((a, b) => a - b), crlf.length];
        async function* pieces() {
          for (let index = 0; index + 1 < sorted.length; index++) yield crlf.slice(sorted[index], sorted[index + 1]);
        }
        expect(rows(await parseJsonLd(pieces(), 'fleet/assets.jsonld'))).toEqual(whole);
      }),
      { numRuns: 40 },
    );
  });

  it('resolves relative @id values against the given base', async () => {
    const source = await parseJsonLd(textChunks(`{ "@id": "Bogie", "${NV}partOf": { "@id": "Car" } }`), 'a.jsonld', { baseIri: NV });
    expect(source.statements).toMatchObject([{ subject: `${NV}Bogie`, object: `${NV}Car` }]);
  });
});

describe('parseJsonLd syntax errors', () => {
  it('a trailing comma: one error at its line and column, with a hint', async () => {
    const text = TEXT.replace('"@id": "nv:Pan2"', '"@id": "nv:Pan2",');
    const source = await parseJsonLd(textChunks(text), 'a.jsonld');
    expect(source.errors).toEqual([
      {
        file: 'a.jsonld',
        line: 13,
        column: 5,
        message: "JSON syntax error: found '}' where a member name in double quotes must come. The rest of the file was not read.",
        hint: 'member names are strings in double quotes; no comma may stand before }',
      },
    ]);
  });

  it('a cut-off file says so at its end', async () => {
    const source = await parseJsonLd(textChunks(TEXT.slice(0, TEXT.indexOf('"@graph"'))), 'a.jsonld');
    expect(source.errors).toMatchObject([{ line: 3, message: 'JSON syntax error: the JSON text ends before }. The rest of the file was not read.' }]);
  });

  it('a JSON-LD error (a number as @type) is placed at its node object', async () => {
    const source = await parseJsonLd(textChunks(`[\n  { "@id": "${NV}A", "@type": 5 }\n]`), 'a.jsonld');
    expect(source.errors).toHaveLength(1);
    expect(source.errors[0]).toMatchObject({ line: 2, column: 3 });
    expect(source.errors[0].message).toMatch(/^JSON-LD error: .*@type/);
  });
});

describe('JsonPlaces reads JSON as JSON.parse does', () => {
  // Reference: the JavaScript engine's JSON.parse (ECMA-404 / RFC 8259 syntax). JsonPlaces takes an
  // object or array at the root only, as JSON-LD documents are.
  const accepts = (text: string) => {
    const places = new JsonPlaces();
    return places.read(text) === undefined && places.end() === undefined;
  };
  const parses = (text: string) => {
    try {
      const value: unknown = JSON.parse(text);
      return typeof value === 'object' && value !== null;
    } catch {
      return false;
    }
  };

  it('accepts every JSON object or array fast-check makes, however it is laid out', () => {
    fc.assert(
      fc.property(fc.oneof(fc.array(fc.jsonValue()), fc.dictionary(fc.string(), fc.jsonValue())), fc.constantFrom(0, 2, '\t'), (value, indent) => {
        expect(accepts(JSON.stringify(value, null, indent))).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it('rejects a text exactly when JSON.parse does, after a random edit', () => {
    const edits = fc.constantFrom(',', '}', ']', '{', '[', '"', ':', ' ', '1', '-', 'e', 'tru', '\\', '\n');
    fc.assert(
      fc.property(fc.dictionary(fc.string({ maxLength: 4 }), fc.jsonValue({ maxDepth: 2 })), fc.nat(), edits, fc.boolean(), (value, at, edit, remove) => {
        const text = JSON.stringify({ graph: value });
        const index = at % (text.length + 1);
        const edited = remove ? text.slice(0, index) + text.slice(index + 1) : text.slice(0, index) + edit + text.slice(index);
        expect(accepts(edited), edited).toBe(parses(edited));
      }),
      { numRuns: 1000 },
    );
  });
});

describe('JSON-LD contexts', () => {
  let root: string;
  const calls: string[] = [];

  beforeAll(() => {
    const tree = temporaryTree('isapart-contexts-');
    root = tree.root;
    tree.write('contexts/northvale.jsonld', `{ "@context": ${CONTEXT} }`);
  });

  afterAll(() => {
    rmSync(root, { recursive: true, force: true });
  });

  afterEach(() => {
    vi.restoreAllMocks();
    calls.length = 0;
  });

  /** Makes every way out to the network throw and be recorded. */
  function blockNetwork(): void {
    const refuse = (name: string) => () => {
      calls.push(name);
      throw new Error(`${name} was called`);
    };
    vi.spyOn(net.Socket.prototype, 'connect').mockImplementation(refuse('net.Socket.connect'));
    vi.spyOn(http, 'request').mockImplementation(refuse('http.request'));
    vi.spyOn(http, 'get').mockImplementation(refuse('http.get'));
    vi.spyOn(https, 'request').mockImplementation(refuse('https.request'));
    vi.spyOn(https, 'get').mockImplementation(refuse('https.get'));
    vi.spyOn(dns, 'lookup').mockImplementation(refuse('dns.lookup'));
    vi.spyOn(globalThis, 'fetch').mockImplementation(refuse('fetch'));
  }

  const remote = 'https://data.northvale-rail.example/context.jsonld';
  const document = `{\n  "@context": "${remote}",\n  "@id": "nv:Pantograph",\n  "subClassOf": "nv:CurrentCollector"\n}\n`;

  it('a remote context is an error naming its IRI, and no socket, request, lookup or fetch is made', async () => {
    blockNetwork();
    const source = await parseJsonLd(textChunks(document), 'fleet/remote.jsonld');
    expect(calls).toEqual([]);
    expect(source.statements).toEqual([]);
    expect(source.errors).toEqual([
      {
        file: 'fleet/remote.jsonld',
        line: 1,
        column: 1,
        message: `the JSON-LD context <${remote}> is remote, and isapart does not fetch remote contexts. The rest of the file was not read.`,
        hint: `save a copy of the context and map its IRI to the file in isapart.yaml: contexts: { "${remote}": ./contexts/local-copy.jsonld }`,
      },
    ]);
  });

  it('a remote context mapped to a local copy is read from it, still with no network', async () => {
    blockNetwork();
    const contexts = new Map([[remote, `${root}/contexts/northvale.jsonld`]]);
    const source = await parseJsonLd(textChunks(document), 'fleet/remote.jsonld', { contexts });
    expect(calls).toEqual([]);
    expect(source.errors).toEqual([]);
    expect(rows(source)).toEqual([['nv:Pantograph', 'rdfs:subClassOf', 'nv:CurrentCollector', 1, 1]]);
  });

  it('a mapped copy that is missing is an error naming the IRI and the path', async () => {
    const contexts = new Map([[remote, `${root}/contexts/missing.jsonld`]]);
    const source = await parseJsonLd(textChunks(document), 'fleet/remote.jsonld', { contexts });
    expect(source.errors).toHaveLength(1);
    expect(source.errors[0].message).toContain(`<${remote}> cannot be read from ${root}/contexts/missing.jsonld (ENOENT)`);
    expect(source.errors[0].hint).toContain('contexts:');
  });

  it('a context next to the document, named relatively, is read from disk', async () => {
    const text = document.replace(remote, '../contexts/northvale.jsonld');
    const source = await parseJsonLd(textChunks(text), 'fleet/local.jsonld', { baseIri: pathToFileURL(`${root}/fleet/local.jsonld`).href });
    expect(source.errors).toEqual([]);
    expect(source.statements).toHaveLength(1);
  });
});

describe('parseJsonLd keys that state nothing', () => {
  it('warns once per key and node object, at that object, for a key with no IRI and a blank node key; not for a key mapped to null', async () => {
    const text = [
      '{',
      `  "@context": { "nv": "${NV}", "internalNote": null },`,
      '  "@graph": [',
      '    { "@id": "nv:A", "nv:partOf": { "@id": "nv:B" }, "depotName": "North", "internalNote": "x", "_:p": 2, "extra": { "nv:x": 1 } },',
      '    { "@id": "nv:C", "depotName": ["South", "East"] }',
      '  ]',
      '}',
    ].join('\n');
    const source = await parseJsonLd(textChunks(text), 'a.jsonld');
    expect(source.errors).toEqual([]);
    expect(source.statements).toHaveLength(1);
    expect((source.warnings ?? []).map((warning) => [warning.line, warning.column, warning.message.split('"')[1]])).toEqual([
      [4, 5, 'depotName'],
      [4, 5, '_:p'],
      [4, 5, 'extra'],
      [5, 5, 'depotName'],
    ]);
    expect(source.warnings?.[0].hint).toContain('"@vocab"');
  });
});
