// The edit reader places every statement of a SPARQL 1.1 Update at its subject's line, and reads the same triples as sparqljs.
import fc from 'fast-check';
import { Parser as SparqlParser, type Quads, type Update } from 'sparqljs';
import { describe, expect, it } from 'vitest';
import { readUpdateText, type PlacedTriple, type TemplateTerm, type WrittenOperation } from '../../src/edit/update-text.js';

const NV = 'https://data.northvale-rail.example/def/';
const RDFS_SUBCLASS = 'http://www.w3.org/2000/01/rdf-schema#subClassOf';
const RDFS_LABEL = 'http://www.w3.org/2000/01/rdf-schema#label';
const BASE = 'https://data.northvale-rail.example/edits/';

function operationsOf(text: string): WrittenOperation[] {
  const read = readUpdateText(text, BASE);
  if ('error' in read) throw new Error(`${read.error.message} at line ${read.error.line}`);
  return read.operations;
}

/** A term as a short string, blank nodes as `_` (labels differ between readers), variables as `?name`. */
function termText(term: TemplateTerm | undefined): string {
  if (term === undefined) return '';
  if (term.kind === 'iri') return `<${term.value}>`;
  if (term.kind === 'blank') return '_';
  if (term.kind === 'variable') return `?${term.name}`;
  const { value, datatype, language } = term.literal;
  return `${JSON.stringify(value)}${language ? `@${language}` : `^^${datatype}`}`;
}

function ours(triples: PlacedTriple[]): string[] {
  return triples.map((triple) => [triple.subject, triple.predicate, triple.object, triple.graph].map(termText).join(' ')).sort();
}

/** sparqljs's triples of a quad list in the same short form: the reference parser's reading (sparqljs 3.7.4). */
function theirs(quads: Quads[] | undefined): string[] {
  const text = (term: unknown): string => {
    if (term === undefined) return '';
    const rdf = term as { termType: string; value: string; language?: string; datatype?: { value: string } };
    if (rdf.termType === 'NamedNode') return `<${rdf.value}>`;
    if (rdf.termType === 'BlankNode') return '_';
    if (rdf.termType === 'Variable') return `?${rdf.value}`;
    return `${JSON.stringify(rdf.value)}${rdf.language ? `@${rdf.language}` : `^^${rdf.datatype?.value}`}`;
  };
  return (quads ?? [])
    .flatMap((block) => block.triples.map((triple) => [triple.subject, triple.predicate, triple.object, block.type === 'graph' ? block.name : undefined].map(text).join(' ')))
    .sort();
}

function sparqljsUpdate(text: string): Update {
  return new SparqlParser({ baseIRI: BASE }).parse(text) as Update;
}

/** Expects our operations to hold the same inserted and deleted triples as sparqljs's. */
function expectSameAsSparqljs(text: string): void {
  const mine = operationsOf(text);
  const reference = sparqljsUpdate(text).updates;
  expect(mine.length).toBe(reference.length);
  mine.forEach((operation, index) => {
    const other = reference[index] as { insert?: Quads[]; delete?: Quads[] };
    expect(ours(operation.insert)).toEqual(theirs(other.insert));
    expect(ours(operation.delete)).toEqual(theirs(other.delete));
  });
}

/** The line of each triple, keyed by its short form (each triple of these tests is written once). */
function linesOf(triples: PlacedTriple[]): Record<string, number> {
  return Object.fromEntries(triples.map((triple) => [[triple.subject, triple.predicate, triple.object].map(termText).join(' '), triple.line]));
}

describe('lines of data and template statements', () => {
  it('puts each triple of an INSERT DATA at its subject, across ; and , lists, comments and strings holding ; { #', () => {
    const text = [
      'PREFIX rdfs: <http://www.w3.org/2000/01/rdf-schema#>', // 1
      '# a comment with ; and { and } does not split anything', // 2
      'PREFIX nv: <https://data.northvale-rail.example/def/>', // 3
      'INSERT DATA {', // 4
      '  nv:Pantograph rdfs:subClassOf nv:RoofEquipment ;', // 5
      '    rdfs:label "Pantograph; roof {collector} # not a comment" ,', // 6
      '      """long', // 7
      'label; two lines""" .', // 8
      '  nv:Bogie', // 9
      '    rdfs:subClassOf nv:RunningGear . # trailing comment', // 10
      '}', // 11
    ].join('\n');
    const [operation] = operationsOf(text);
    expect(operation.kind).toBe('INSERT DATA');
    expect(operation.line).toBe(4);
    expect(linesOf(operation.insert)).toEqual({
      [`<${NV}Pantograph> <${RDFS_SUBCLASS}> <${NV}RoofEquipment>`]: 5,
      [`<${NV}Pantograph> <${RDFS_LABEL}> ${JSON.stringify('Pantograph; roof {collector} # not a comment')}^^http://www.w3.org/2001/XMLSchema#string`]: 5,
      [`<${NV}Pantograph> <${RDFS_LABEL}> ${JSON.stringify('long\nlabel; two lines')}^^http://www.w3.org/2001/XMLSchema#string`]: 5,
      [`<${NV}Bogie> <${RDFS_SUBCLASS}> <${NV}RunningGear>`]: 9,
    });
    // The object of the two-line string starts on line 7; the object line follows each object.
    expect(operation.insert.map((triple) => triple.objectLine)).toEqual([5, 6, 7, 10]);
    expectSameAsSparqljs(text);
  });

  it('places the operations after a string that spans lines, and the triples of DELETE/INSERT templates', () => {
    const text = [
      'PREFIX nv: <https://data.northvale-rail.example/def/>', // 1
      'INSERT DATA { nv:Bogie nv:note """one', // 2
      'two', // 3
      'three""" } ;', // 4
      'DELETE { ?class <http://www.w3.org/2000/01/rdf-schema#subClassOf> nv:Component }', // 5
      'INSERT {', // 6
      '  ?class', // 7
      '    <http://www.w3.org/2000/01/rdf-schema#subClassOf> nv:RunningGear', // 8
      '}', // 9
      'WHERE { ?class <http://www.w3.org/2000/01/rdf-schema#subClassOf> nv:Component ; nv:x "a;b" }', // 10
    ].join('\n');
    const operations = operationsOf(text);
    expect(operations.map((operation) => [operation.kind, operation.line])).toEqual([
      ['INSERT DATA', 2],
      ['DELETE/INSERT', 5],
    ]);
    expect(operations[1].delete.map((triple) => [termText(triple.object), triple.line, triple.column])).toEqual([[`<${NV}Component>`, 5, 10]]);
    expect(operations[1].insert.map((triple) => [termText(triple.object), triple.line, triple.column])).toEqual([[`<${NV}RunningGear>`, 7, 3]]);
    expectSameAsSparqljs(text);
  });

  it('reads GRAPH blocks, BASE and relative IRIs, blank node property lists and collections as sparqljs does', () => {
    const text = [
      'BASE <https://data.northvale-rail.example/>', // 1
      'PREFIX nv: <def/>', // 2
      'INSERT DATA {', // 3
      '  <def/Wheelset> nv:partOf [ nv:partOf nv:Bogie ] .', // 4
      '  GRAPH <graph/assets> {', // 5
      '    nv:Coupler a nv:Class ; nv:sizes ( 1 2.5 -3 4e2 ) ;', // 6
      '      nv:active true, false ; nv:name "Kupplung"@DE-at', // 7
      '  }', // 8
      '  nv:Brake nv:label "x"^^nv:code', // 9
      '} ;', // 10
      'PREFIX ex: <http://example.org/>', // 11
      'DELETE DATA { GRAPH ex:g { ex:a ex:b ex:c } ex:d ex:e ex:f }', // 12
    ].join('\n');
    const operations = operationsOf(text);
    expect(operations.map((operation) => operation.line)).toEqual([3, 12]);
    const graphs = new Set(operations[0].insert.map((triple) => termText(triple.graph)));
    expect(graphs).toEqual(new Set(['', '<https://data.northvale-rail.example/graph/assets>']));
    const wheelset = operations[0].insert.filter((triple) => triple.line === 4);
    // The blank node's own triple is placed at its `[`, on the same line.
    expect(wheelset.map((triple) => triple.column).sort((a, b) => a - b)).toEqual([3, 28]);
    expect(operations[1].delete.map((triple) => [termText(triple.graph), triple.line])).toEqual([
      ['<http://example.org/g>', 12],
      ['', 12],
    ]);
    expectSameAsSparqljs(text);
  });

  it('reads a DELETE WHERE pattern and an update with WITH and USING', () => {
    const text = [
      'PREFIX nv: <https://data.northvale-rail.example/def/>',
      'WITH <https://data.northvale-rail.example/graph/assets>',
      'DELETE { ?s nv:partOf ?o } INSERT { ?o nv:hasPart ?s } USING <https://data.northvale-rail.example/graph/assets> WHERE { ?s nv:partOf ?o } ;',
      'DELETE WHERE {',
      '  ?s nv:partOf nv:Car ,',
      '     nv:Unit .',
      '}',
    ].join('\n');
    const operations = operationsOf(text);
    expect(operations.map((operation) => [operation.kind, operation.line])).toEqual([
      ['DELETE/INSERT', 2],
      ['DELETE WHERE', 4],
    ]);
    expect(operations[1].delete.map((triple) => triple.line)).toEqual([5, 5]);
    expectSameAsSparqljs(text);
  });
});

// Random updates: each subject written on a known line, with random line breaks, comments and
// punctuation between tokens; the reader must give those lines, and sparqljs the same triples.
const SUBJECTS = ['nv:Bogie', '<https://data.northvale-rail.example/def/Car>', 'nv:Pantograph', '_:b1'];
const PREDICATES = ['nv:partOf', 'a', '<http://www.w3.org/2000/01/rdf-schema#subClassOf>', 'nv:label'];
const OBJECTS = ['nv:Car', '"a ; b { c } # d"', "'''x\ny'''", '12', '"Wagen"@de', '_:b2', '"3"^^nv:code', '-4.5', '<assets/x>'];

interface Group {
  subject: string;
  lists: { predicate: string; objects: string[] }[];
}

const groupArbitrary = fc.record({
  subject: fc.constantFrom(...SUBJECTS),
  lists: fc.array(fc.record({ predicate: fc.constantFrom(...PREDICATES), objects: fc.array(fc.constantFrom(...OBJECTS), { minLength: 1, maxLength: 3 }) }), { minLength: 1, maxLength: 3 }),
});
const gapArbitrary = fc.constantFrom(' ', '\n', ' # note ; { \n', '\n\n  ', '\t');

function writeUpdate(groups: Group[], gaps: string[]): { text: string; expected: number[] } {
  let text = 'PREFIX nv: <https://data.northvale-rail.example/def/>\nINSERT DATA {';
  let gapIndex = 0;
  const gap = () => gaps[gapIndex++ % gaps.length];
  const expected: number[] = [];
  const line = () => text.split('\n').length;
  for (const group of groups) {
    text += gap();
    const subjectLine = line();
    text += group.subject;
    group.lists.forEach((list, listIndex) => {
      if (listIndex > 0) text += `${gap()};`;
      text += `${gap()}${list.predicate}`;
      list.objects.forEach((object, objectIndex) => {
        if (objectIndex > 0) text += `${gap()},`;
        text += `${gap()}${object}`;
        expected.push(subjectLine);
      });
    });
    text += `${gap()}.`;
  }
  return { text: `${text}${gap()}}\n`, expected };
}

describe('random INSERT DATA layouts', () => {
  it('gives every triple its subject line and reads the triples sparqljs reads', () => {
    fc.assert(
      fc.property(fc.array(groupArbitrary, { minLength: 1, maxLength: 5 }), fc.array(gapArbitrary, { minLength: 1, maxLength: 8 }), (groups, gaps) => {
        const { text, expected } = writeUpdate(groups, gaps);
        const [operation] = operationsOf(text);
        expect(operation.insert.map((triple) => triple.line)).toEqual(expected);
        expectSameAsSparqljs(text);
      }),
      { numRuns: 300, seed: 8 },
    );
  });
});

describe('text the reader refuses', () => {
  it('names the line of a prefix that was never declared', () => {
    const read = readUpdateText('PREFIX nv: <https://data.northvale-rail.example/def/>\nINSERT DATA {\n  nv:a nv:b nv:c .\n  fleet:x nv:b nv:c }', BASE);
    expect(read).toMatchObject({ error: { line: 4, column: 3 } });
  });
});
