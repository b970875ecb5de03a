// parseRdfXml: statements placed at the element that states them, chunks, base IRIs, blank nodes, errors.
import net from 'node:net';
import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import { blankNodeLabelPrefix } from '../../src/load/parse.js';
import { textChunks } from '../../src/load/parse-any.js';
import { parseRdfXml } from '../../src/load/rdfxml.js';
import { statementRows } from './statement-rows.js';

const NV = 'https://data.northvale-rail.example/def/';
const RDF_NS = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#';
const RDFS = 'http://www.w3.org/2000/01/rdf-schema#';

/** An RDF/XML document of Northvale classes with the given body inside rdf:RDF. */
const document = (body: string) =>
  `<?xml version="1.0"?>\n<rdf:RDF xmlns:rdf="${RDF_NS}" xmlns:rdfs="${RDFS}" xmlns:nv="${NV}">\n${body}</rdf:RDF>\n`;

const BODY = [
  `  <rdfs:Class rdf:about="${NV}Pantograph">`,
  '    <rdfs:subClassOf>',
  `      <rdfs:Class rdf:about="${NV}CurrentCollector"/>`,
  '    </rdfs:subClassOf>',
  `    <nv:partOf rdf:resource="${NV}Locomotive"/>`,
  '    <rdfs:label xml:lang="en">Pantograph 🚆</rdfs:label>',
  '    <nv:fittedTo rdf:parseType="Collection">',
  `      <rdf:Description rdf:about="${NV}Class90"/>`,
  `      <rdf:Description rdf:about="${NV}Class91"/>`,
  '    </nv:fittedTo>',
  '  </rdfs:Class>',
  '  <rdf:Description',
  `      rdf:about="${NV}Roof" nv:code="R1">`,
  `    <nv:partOf><nv:Car rdf:nodeID="car1"/></nv:partOf>`,
  '  </rdf:Description>',
  '',
].join('\n');
const TEXT = document(BODY);
const LINES = TEXT.split('\n');

/** The 1-based line and column of the first `needle` on a line of TEXT at or after `fromLine`. */
function placeOf(needle: string, fromLine = 1): { line: number; column: number } {
  for (let index = fromLine - 1; index < LINES.length; index++) {
    const column = LINES[index].indexOf(needle);
    if (column >= 0) return { line: index + 1, column: column + 1 };
  }
  throw new Error(`${needle} is not in the document`);
}

const rows = statementRows;

describe('parseRdfXml places each statement at the element that states it', () => {
  it('a node element its type, a property element its value, a collection item its list links', async () => {
    const source = await parseRdfXml(textChunks(TEXT), 'vocab/assets.rdf');
    expect(source.errors).toEqual([]);
    const at = (needle: string, fromLine = 1) => {
      const place = placeOf(needle, fromLine);
      return [place.line, place.column];
    };
    const list = rows(source);
    const [firstLink, secondLink, car] = [list[6][0], list[8][0], list[11][0]];
    expect(list).toEqual([
      ['nv:Pantograph', 'rdf:type', 'rdfs:Class', ...at('<rdfs:Class')],
      ['nv:CurrentCollector', 'rdf:type', 'rdfs:Class', ...at('<rdfs:Class', 4)],
      // The link to a nested node element is stated by the property element around it.
      ['nv:Pantograph', 'rdfs:subClassOf', 'nv:CurrentCollector', ...at('<rdfs:subClassOf>')],
      ['nv:Pantograph', 'nv:partOf', 'nv:Locomotive', ...at('<nv:partOf rdf:resource')],
      ['nv:Pantograph', 'rdfs:label', 'Pantograph 🚆', ...at('<rdfs:label')],
      ['nv:Pantograph', 'nv:fittedTo', firstLink, ...at('<nv:fittedTo')],
      [firstLink, 'rdf:first', 'nv:Class90', ...at(`<rdf:Description rdf:about="${NV}Class90`)],
      [firstLink, 'rdf:rest', secondLink, ...at(`<rdf:Description rdf:about="${NV}Class91`)],
      [secondLink, 'rdf:first', 'nv:Class91', ...at(`<rdf:Description rdf:about="${NV}Class91`)],
      [secondLink, 'rdf:rest', 'rdf:nil', ...at('<nv:fittedTo')],
      // A start tag over two lines is placed at its '<'; the property attribute belongs to it.
      ['nv:Roof', 'nv:code', 'R1', ...at('<rdf:Description', 13)],
      [car, 'rdf:type', 'nv:Car', ...at('<nv:Car')],
      ['nv:Roof', 'nv:partOf', car, ...at('<nv:partOf>')],
    ]);
    expect(car).toMatch(/^_:b[0-9a-f]{8}_car1$/);
    expect(source.prefixes).toEqual({ rdf: RDF_NS, rdfs: RDFS, nv: NV });
  });

  it('gives the same statements and places whatever the chunks, CRLF line ends and surrogate pairs included', async () => {
    const crlf = TEXT.replace(/\n/g, '\r\n');
    const whole = rows(await parseRdfXml(textChunks(crlf), 'vocab/assets.rdf'));
    expect(whole.length).toBe(13);
    await fc.assert(
      fc.asyncProperty(fc.uniqueArray(fc.integer({ min: 1, max: crlf.length - 1 }), { maxLength: 40 }), async (cuts) => {
        const sorted = [0, ...cuts.sort((a, b) => a - b), crlf.length];
        async function* pieces() {
          for (let index = 0; index + 1 < sorted.length; index++) yield crlf.slice(sorted[index], sorted[index + 1]);
        }
        expect(rows(await parseRdfXml(pieces(), 'vocab/assets.rdf'))).toEqual(whole);
      }),
      { numRuns: 60 },
    );
  });
});

describe('parseRdfXml base IRIs and blank nodes', () => {
  const relative = document(`  <rdf:Description rdf:about="Bogie"><nv:partOf rdf:resource="#Car"/></rdf:Description>\n`);

  it('resolves relative IRIs against the given base, else the file URL, and xml:base over both', async () => {
    const withBase = await parseRdfXml(textChunks(relative), 'a.rdf', { baseIri: NV });
    expect(withBase.statements[0]).toMatchObject({ subject: `${NV}Bogie`, object: `${NV}#Car` });
    const withFile = await parseRdfXml(textChunks(relative), 'vocab/a.rdf', { cwd: '/data' });
    expect(withFile.statements[0].subject).toBe('file:///data/vocab/Bogie');
    const xmlBase = relative.replace('<rdf:RDF ', `<rdf:RDF xml:base="${NV}fleet/" `);
    const overridden = await parseRdfXml(textChunks(xmlBase), 'a.rdf', { baseIri: 'https://elsewhere.example/' });
    expect(overridden.statements[0].subject).toBe(`${NV}fleet/Bogie`);
  });

  it('prefixes blank node labels per file, named and anonymous ones apart', async () => {
    const text = document(`  <rdf:Description rdf:nodeID="b1"><nv:partOf><rdf:Description/></nv:partOf></rdf:Description>\n`);
    const first = await parseRdfXml(textChunks(text), 'fleet/one.rdf', { cwd: '/data' });
    const second = await parseRdfXml(textChunks(text), 'fleet/two.rdf', { cwd: '/data' });
    const prefix = blankNodeLabelPrefix('fleet/one.rdf', '/data');
    expect(first.statements[0].subject).toBe(`_:${prefix}b1`);
    expect(first.statements[0].object).toMatch(new RegExp(`^_:${prefix}-\\d+$`));
    expect(second.statements[0].subject).not.toBe(first.statements[0].subject);
  });
});

describe('parseRdfXml errors', () => {
  it('an unclosed element: one error at the end, statements before it kept', async () => {
    const cut = TEXT.slice(0, TEXT.indexOf('    <rdfs:label'));
    const source = await parseRdfXml(textChunks(cut), 'vocab/cut.rdf');
    expect(source.statements.map((statement) => statement.predicate)).toEqual([`${RDF_NS}type`, `${RDF_NS}type`, `${RDFS}subClassOf`, `${NV}partOf`]);
    expect(source.errors).toHaveLength(1);
    expect(source.errors[0]).toMatchObject({ file: 'vocab/cut.rdf', line: placeOf('<rdfs:label').line });
    expect(source.errors[0].message).toMatch(/^RDF\/XML syntax error: unclosed tag: rdfs:Class\. The rest of the file was not read\.$/);
    expect(source.errors[0].hint).toContain('closed');
  });

  it('an undeclared prefix names it, at its element; nothing after it is kept', async () => {
    const text = document(`  <rdfs:Class rdf:about="${NV}A"/>\n  <ex:Thing rdf:about="${NV}B"/>\n  <rdfs:Class rdf:about="${NV}C"/>\n`);
    const source = await parseRdfXml(textChunks(text), 'a.rdf');
    expect(source.statements.map((statement) => statement.subject)).toEqual([`${NV}A`]);
    expect(source.errors).toHaveLength(1);
    expect(source.errors[0].line).toBe(4);
    expect(source.errors[0].message).toContain('ex');
    expect(source.errors[0].hint).toBe('declare the prefix with xmlns:ex="..." on this element or one around it');
  });

  it('an RDF/XML rule broken (two subjects on one node element) is placed at that element', async () => {
    const text = document(`  <rdf:Description rdf:about="${NV}A" rdf:nodeID="a"/>\n`);
    const source = await parseRdfXml(textChunks(text), 'a.rdf');
    expect(source.errors).toMatchObject([{ line: 3, column: 3 }]);
    expect(source.errors[0].hint).toContain('names its subject once');
  });
});

describe('parseRdfXml allow comments', () => {
  it('reads <!-- isapart-allow RULE-ID: reason --> after an element or alone on the line above', async () => {
    const text = document(
      `  <rdfs:Class rdf:about="${NV}A"/> <!-- isapart-allow orphan-class: top of the fleet -->\n  <!-- isapart-allow kind-and-part: sold as a kit -->\n  <rdfs:Class rdf:about="${NV}B"/>\n  <!-- an ordinary comment -->\n`,
    );
    const source = await parseRdfXml(textChunks(text), 'a.rdf');
    expect(source.errors).toEqual([]);
    expect(source.allowComments).toEqual([
      { file: 'a.rdf', line: 3, column: text.split('\n')[2].indexOf('<!--') + 1, ruleId: 'orphan-class', reason: 'top of the fleet', ownLine: false },
      { file: 'a.rdf', line: 4, column: 3, ruleId: 'kind-and-part', reason: 'sold as a kit', ownLine: true },
    ]);
  });
});

describe('parseRdfXml on a long document in many chunks', () => {
  it('reads every statement of 20,000 elements fed in 4 KiB chunks, each placed on its own line', async () => {
    const count = 20_000;
    async function* generated() {
      yield `<?xml version="1.0"?>\n<rdf:RDF xmlns:rdf="${RDF_NS}" xmlns:rdfs="${RDFS}">\n`;
      let pending = '';
      for (let index = 0; index < count; index++) {
        pending += `  <rdf:Description rdf:about="${NV}Part${index}"><rdfs:subClassOf rdf:resource="${NV}Part${index >> 1}"/></rdf:Description>\n`;
        while (pending.length >= 4096) {
          yield pending.slice(0, 4096);
          pending = pending.slice(4096);
        }
      }
      yield `${pending}</rdf:RDF>\n`;
    }
    const source = await parseRdfXml(generated(), 'fleet/parts.rdf');
    expect(source.errors).toEqual([]);
    expect(source.statements).toHaveLength(count);
    // Element N is on line N + 3; its property element starts after the node element's start tag.
    const last = source.statements[count - 1];
    expect(last).toMatchObject({ subject: `${NV}Part${count - 1}`, position: { line: count + 2 } });
    expect(last.position.column).toBe(`  <rdf:Description rdf:about="${NV}Part${count - 1}">`.length + 1);
  });
});

describe('parseRdfXml and the network', () => {
  it('declares internal entities from a DOCTYPE and never fetches an external one', async () => {
    const calls: string[] = [];
    const refuse = (name: string) => () => {
      calls.push(name);
      throw new Error(`${name} was called`);
    };
    vi.spyOn(net.Socket.prototype, 'connect').mockImplementation(refuse('net.Socket.connect'));
    vi.spyOn(globalThis, 'fetch').mockImplementation(refuse('fetch'));
    try {
      const text = `<?xml version="1.0"?>\n<!DOCTYPE rdf:RDF [\n  <!ENTITY nv "${NV}">\n  <!ENTITY remote SYSTEM "https://data.northvale-rail.example/entities.dtd">\n]>\n<rdf:RDF xmlns:rdf="${RDF_NS}" xmlns:rdfs="${RDFS}">\n  <rdf:Description rdf:about="&nv;Bogie"><rdfs:subClassOf rdf:resource="&nv;Component"/></rdf:Description>\n</rdf:RDF>\n`;
      const source = await parseRdfXml(textChunks(text), 'a.rdf');
      expect(calls).toEqual([]);
      expect(source.statements).toMatchObject([{ subject: `${NV}Bogie`, object: `${NV}Component` }]);
    } finally {
      vi.restoreAllMocks();
    }
  });
});
