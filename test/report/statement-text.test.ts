// createTermWriter: compact statements that n3's own parser reads back as the same statements.
import { Parser, type Quad } from 'n3';
import { describe, expect, it } from 'vitest';
import type { Literal, Statement } from '../../src/load/statement.js';
import { createTermWriter } from '../../src/report/statement-text.js';
import { ASSET, DCTERMS_IS_PART_OF, DEF, RDF_TYPE, RDFS_SUBCLASS_OF, ROLLING_STOCK, statement } from './report-fixtures.js';

const PREFIXES = { nv: DEF, nva: ASSET, rdfs: 'http://www.w3.org/2000/01/rdf-schema#', dcterms: 'http://purl.org/dc/terms/' };
const RDF_LANG_STRING = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString';
const XSD_STRING = 'http://www.w3.org/2001/XMLSchema#string';
const XSD_DATE = 'http://www.w3.org/2001/XMLSchema#date';

function literal(value: string, datatype: string, language = ''): Literal {
  return { value, datatype, language };
}

const STATEMENTS: Statement[] = [
  statement({ subject: `${DEF}Pantograph`, predicate: DCTERMS_IS_PART_OF, object: `${DEF}Locomotive`, file: ROLLING_STOCK, line: 1 }),
  statement({ subject: `${ASSET}unit/4021`, predicate: RDF_TYPE, object: `${DEF}ElectricMultipleUnit`, file: ROLLING_STOCK, line: 2 }),
  statement({ subject: '_:b7', predicate: RDFS_SUBCLASS_OF, object: `${DEF}Bogie`, file: ROLLING_STOCK, line: 3 }),
  // Local parts outside the safe prefixed-name subset: one with '#', one with a leading '.', one not ASCII.
  statement({ subject: `${DEF}Wagon#coupler`, predicate: RDFS_SUBCLASS_OF, object: `${DEF}.hidden`, file: ROLLING_STOCK, line: 4 }),
  statement({ subject: `${DEF}Zugführer`, predicate: 'http://www.w3.org/2000/01/rdf-schema#label', object: literal('Quote " and \\ and\nnewline\ttab', XSD_STRING), file: ROLLING_STOCK, line: 5 }),
  statement({ subject: `${DEF}Bogie`, predicate: 'http://www.w3.org/2000/01/rdf-schema#label', object: literal('Drehgestell', RDF_LANG_STRING, 'de'), file: ROLLING_STOCK, line: 6 }),
  statement({ subject: `${ASSET}unit/4021`, predicate: `${DEF}inService`, object: literal('2019-06-01', XSD_DATE), file: ROLLING_STOCK, line: 7 }),
];

function asComparable(quad: Quad): string {
  const object = quad.object.termType === 'Literal'
    ? `${quad.object.value}|${quad.object.datatype.value}|${quad.object.language}`
    : quad.object.value;
  const subject = quad.subject.termType === 'BlankNode' ? '_:blank' : quad.subject.value;
  return [subject, quad.predicate.value, object, quad.graph.value].join(' ');
}

function expected(value: Statement): string {
  const object = typeof value.object === 'string'
    ? value.object
    : `${value.object.value}|${value.object.language ? RDF_LANG_STRING : value.object.datatype}|${value.object.language}`;
  const subject = value.subject.startsWith('_:') ? '_:blank' : value.subject;
  return [subject, value.predicate, object, value.graph].join(' ');
}

describe('createTermWriter', () => {
  it('writes statements that the n3 Turtle parser reads back unchanged, with prefixes', () => {
    const writer = createTermWriter(PREFIXES);
    const declarations = Object.entries(PREFIXES).map(([prefix, namespace]) => `@prefix ${prefix}: <${namespace}> .`);
    for (const value of STATEMENTS) {
      const text = writer.statement(value);
      // n3's own Turtle parser (W3C RDF 1.1 Turtle) is the reference reader here.
      const quads = new Parser({ format: 'text/turtle' }).parse([...declarations, `${text} .`].join('\n'));
      expect(quads.map(asComparable), text).toEqual([expected(value)]);
    }
  });

  it('writes statements that the n3 Turtle parser reads back unchanged, without prefixes', () => {
    const writer = createTermWriter();
    for (const value of STATEMENTS) {
      const text = writer.statement(value);
      expect(text).not.toMatch(/(^|\s)(nv|rdfs|dcterms):/);
      const quads = new Parser({ format: 'text/turtle' }).parse(`${text} .`);
      expect(quads.map(asComparable), text).toEqual([expected(value)]);
    }
  });

  it('writes a named graph after the object, as N-Quads does, read back by the n3 N-Quads parser', () => {
    const inGraph = statement({ subject: `${DEF}MainSignal`, predicate: RDFS_SUBCLASS_OF, object: `${DEF}Signal`, file: ROLLING_STOCK, line: 1, graph: `${ASSET}graph/signalling` });
    const text = createTermWriter().statement(inGraph);
    // W3C RDF 1.1 N-Quads: subject, predicate, object, then the graph label.
    const quads = new Parser({ format: 'N-Quads' }).parse(`${text} .`);
    expect(quads.map(asComparable)).toEqual([expected(inGraph)]);
  });

  it('uses the longest fitting namespace, and Turtle\'s `a` for rdf:type', () => {
    const writer = createTermWriter({ nvroot: 'https://data.northvale-rail.example/', nv: DEF });
    expect(writer.term(`${DEF}Bogie`)).toBe('nv:Bogie');
    expect(writer.term('https://data.northvale-rail.example/asset/unit/4021')).toBe('<https://data.northvale-rail.example/asset/unit/4021>');
    expect(writer.statement(STATEMENTS[1])).toBe('<https://data.northvale-rail.example/asset/unit/4021> a nv:ElectricMultipleUnit');
  });
});
