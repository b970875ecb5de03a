// Syntax errors from parseSource: statements before the error are kept, and the error says where, what and how to fix.
import { describe, expect, it } from 'vitest';
import { parseSource } from '../../src/load/parse.js';

const PREFIXES = '@prefix nv: <https://data.northvale-rail.example/def/> .\n';

describe('parseSource on broken input', () => {
  it('keeps the statements before an error in the middle, and places the error at the offending token', () => {
    const text = `${PREFIXES}nv:Bogie nv:partOf nv:Train .\nnv:Axle nv:partOf nv:Bogie\n  nv:Wheel nv:partOf nv:Axle .\n`;
    const source = parseSource(text, 'broken.ttl', 'turtle');
    expect(source.statements.map((statement) => statement.subject)).toEqual([
      'https://data.northvale-rail.example/def/Bogie',
    ]);
    expect(source.errors).toHaveLength(1);
    const [error] = source.errors;
    expect(error).toMatchObject({ file: 'broken.ttl', line: 4, column: 3 });
    expect(error.message).toContain('found the prefixed name nv:Wheel');
    expect(error.message).toContain("expected '.', ';' or ','");
    expect(error.message).toContain('The rest of the file was not read.');
    expect(error.hint).toContain("a Turtle statement ends with ' .'");
  });

  it('hints at @prefix for an undeclared prefix', () => {
    const source = parseSource(`${PREFIXES}nv:Car a rs:Wagon .\n`, 'prefix.ttl', 'turtle');
    expect(source.errors[0]).toMatchObject({ line: 2, column: 10 });
    expect(source.errors[0].message).toContain('Undefined prefix "rs:"');
    expect(source.errors[0].hint).toContain('@prefix');
  });

  it('places an error the lexer raises at the rejected text, and hints at how IRIs are written', () => {
    const source = parseSource(`${PREFIXES}nv:Car nv:partOf <https://data.northvale-rail.example/def/Train set> .\n`, 'iri.ttl', 'turtle');
    expect(source.errors).toHaveLength(1);
    expect(source.errors[0]).toMatchObject({ line: 2, column: 18 });
    expect(source.errors[0].message).toContain("found '<https://data.northvale-rail.example/def/Train'");
    expect(source.errors[0].hint).toContain('IRIs are written <...>');
  });

  it('tells N-Triples writers to spell IRIs out in full', () => {
    const text = '<https://data.northvale-rail.example/def/Car> <http://www.w3.org/2000/01/rdf-schema#subClassOf> nv:Wagon .\n';
    const source = parseSource(text, 'short.nt', 'n-triples');
    expect(source.errors[0]).toMatchObject({ line: 1, column: 97 });
    expect(source.errors[0].hint).toContain('write every IRI in full');
  });

  it('points a Turtle file with a graph block towards TriG', () => {
    const source = parseSource(`${PREFIXES}nv:fleet {\n nv:Car a nv:Wagon .\n}\n`, 'graph.ttl', 'turtle');
    expect(source.errors[0]).toMatchObject({ line: 2, column: 10 });
    expect(source.errors[0].hint).toContain('TriG');
  });

  it('reports a file cut off inside a graph block at the end of the file', () => {
    const source = parseSource(`${PREFIXES}nv:fleet {\n  nv:Car a nv:Wagon .\n`, 'cut.trig', 'trig');
    expect(source.statements).toHaveLength(1);
    expect(source.errors[0].line).toBe(4);
    expect(source.errors[0].message).toContain('found the end of the file');
    expect(source.errors[0].hint).toContain("'}'");
  });

  it('skips a statement holding an RDF 1.2 triple term with an error at its subject, and reads on', () => {
    const text = `${PREFIXES}nv:claim-1 nv:about <<( nv:Car nv:partOf nv:Train )>> .\nnv:Car nv:partOf nv:Train .\n`;
    const source = parseSource(text, 'star.ttl', 'turtle');
    expect(source.statements).toHaveLength(1);
    expect(source.statements[0].position.line).toBe(3);
    expect(source.errors).toHaveLength(1);
    expect(source.errors[0]).toMatchObject({ line: 2, column: 1 });
    expect(source.errors[0].message).toContain('triple term');
  });
});
