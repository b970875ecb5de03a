// Statement positions from parseSource: the subject token's line and UTF-16 column, and the object's line.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Lexer } from 'n3';
import { parseSource } from '../../src/load/parse.js';
import type { Statement } from '../../src/load/statement.js';
import type { N3Token } from '../../src/load/n3-tokens.js';
import { readManifest } from './w3c-manifest.js';

const NV = 'https://data.northvale-rail.example/def/';
const ASSET = 'https://data.northvale-rail.example/asset/';
const RDF_NS = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#';

/** [subject, predicate, object, line, column, objectLine], blank nodes renamed _:1, _:2 ... by first appearance. */
type Row = [string, string, string, number, number, number];

function rows(statements: Statement[]): Row[] {
  const blankNames = new Map<string, string>();
  const name = (term: string): string => {
    if (!term.startsWith('_:')) return term.replace(NV, 'nv:').replace(ASSET, 'asset:').replace(RDF_NS, 'rdf:');
    if (!blankNames.has(term)) blankNames.set(term, `_:${blankNames.size + 1}`);
    return blankNames.get(term) as string;
  };
  return statements.map((statement) => [
    name(statement.subject),
    name(statement.predicate),
    typeof statement.object === 'string' ? name(statement.object) : `"${statement.object.value}"`,
    statement.position.line,
    statement.position.column,
    statement.objectLine,
  ]);
}

const TURTLE = [
  '@prefix nv: <https://data.northvale-rail.example/def/> .',
  '@prefix asset: <https://data.northvale-rail.example/asset/> .',
  '',
  'asset:unit-4711 a nv:ElectricMultipleUnit ;',
  '    nv:hasPart asset:pantograph-4711-a ,',
  '        asset:pantograph-4711-b .',
  '  asset:bogie-17 nv:partOf asset:unit-4711 .',
  '[ a nv:Coupler ] nv:partOf asset:unit-4711 .',
  '<https://data.northvale-rail.example/asset/wagen-ä-🚆> a nv:Wagon . asset:wagon-9 a nv:Wagon .',
  'asset:unit-4712 nv:hasPart [ a nv:Axle ;',
  '    nv:partOf [ a nv:Bogie ] ] .',
  '( asset:seat-1 asset:seat-2 ) nv:partOf asset:unit-4712 .',
  'asset:unit-4712 nv:label "Unit',
  '4712""" .',
].join('\n');

describe('parseSource positions in Turtle', () => {
  it('places each statement at its subject token, and gives the line of its object', () => {
    // Counted by hand from TURTLE above. Line 9: the IRI before asset:wagon-9 is 54 UTF-16 code
    // units long ("ä" is one unit, the emoji two), so the subject starts at column 54 + 14 + 1 = 69
    // (it would be 68 counted in code points and 72 in UTF-8 bytes).
    const text = TURTLE.replace('"Unit\n4712"""', '"""Unit\n4712"""');
    const source = parseSource(text, 'fixtures/positions.ttl', 'turtle');
    expect(source.errors).toEqual([]);
    expect(rows(source.statements)).toEqual<Row[]>([
      ['asset:unit-4711', 'rdf:type', 'nv:ElectricMultipleUnit', 4, 1, 4],
      ['asset:unit-4711', 'nv:hasPart', 'asset:pantograph-4711-a', 4, 1, 5],
      ['asset:unit-4711', 'nv:hasPart', 'asset:pantograph-4711-b', 4, 1, 6],
      ['asset:bogie-17', 'nv:partOf', 'asset:unit-4711', 7, 3, 7],
      ['_:1', 'rdf:type', 'nv:Coupler', 8, 1, 8],
      ['_:1', 'nv:partOf', 'asset:unit-4711', 8, 1, 8],
      ['asset:wagen-ä-🚆', 'rdf:type', 'nv:Wagon', 9, 1, 9],
      ['asset:wagon-9', 'rdf:type', 'nv:Wagon', 9, 69, 9],
      ['_:2', 'rdf:type', 'nv:Axle', 10, 28, 10],
      ['_:3', 'rdf:type', 'nv:Bogie', 11, 15, 11],
      ['_:2', 'nv:partOf', '_:3', 10, 28, 11],
      ['asset:unit-4712', 'nv:hasPart', '_:2', 10, 1, 10],
      ['_:4', 'rdf:first', 'asset:seat-1', 12, 1, 12],
      ['_:4', 'rdf:rest', '_:5', 12, 1, 12],
      ['_:5', 'rdf:first', 'asset:seat-2', 12, 1, 12],
      ['_:5', 'rdf:rest', 'rdf:nil', 12, 1, 12],
      ['_:4', 'nv:partOf', 'asset:unit-4712', 12, 1, 12],
      ['asset:unit-4712', 'nv:label', '"Unit\n4712"', 13, 1, 13],
    ]);
    expect(source.prefixes).toEqual({ nv: NV, asset: ASSET });
  });

  it('places nodes of a collection used as an object at its "(", and a "[" inside it at the "["', () => {
    const text = `@prefix nv: <${NV}> .\nnv:Train nv:consistsOf ( nv:Car [ a nv:Locomotive ]\n  ( nv:Seat ) ) .`;
    const source = parseSource(text, 'consist.ttl', 'turtle');
    expect(source.errors).toEqual([]);
    const listRows = rows(source.statements);
    // Columns counted by hand: "(" at 24 on line 2, "[" at 33 on line 2, the inner "(" at 3 on line 3.
    // Collection nodes have no token of their own, so as objects they also count as on their "(" line.
    expect(listRows).toEqual<Row[]>([
      ['_:1', 'rdf:first', 'nv:Car', 2, 24, 2],
      ['_:1', 'rdf:rest', '_:2', 2, 24, 2],
      ['_:2', 'rdf:first', '_:3', 2, 24, 2],
      ['_:3', 'rdf:type', 'nv:Locomotive', 2, 33, 2],
      ['_:2', 'rdf:rest', '_:4', 2, 24, 2],
      ['_:5', 'rdf:first', 'nv:Seat', 3, 3, 3],
      ['_:4', 'rdf:first', '_:5', 2, 24, 3],
      ['_:5', 'rdf:rest', 'rdf:nil', 3, 3, 3],
      ['_:4', 'rdf:rest', 'rdf:nil', 2, 24, 3],
      ['nv:Train', 'nv:consistsOf', '_:1', 2, 1, 2],
    ]);
  });

  it('places TriG statements inside a graph block at their own subject and names the graph', () => {
    const text = `@prefix nv: <${NV}> .\nnv:fleet-2024 {\n  nv:Car nv:partOf nv:Train .\n}\nnv:Train a nv:Class .`;
    const source = parseSource(text, 'fleet.trig', 'trig');
    expect(source.errors).toEqual([]);
    expect(source.statements.map((statement) => [statement.graph, statement.position.line, statement.position.column])).toEqual([
      [`${NV}fleet-2024`, 3, 3],
      ['', 5, 1],
    ]);
  });
});

describe('parseSource positions in N-Triples and N-Quads', () => {
  it('gives line N column 1 for the statement on line N', () => {
    const lines = [
      `<${ASSET}unit-4711> <${NV}hasPart> <${ASSET}bogie-17> .`,
      '# a comment line',
      `_:coupler <${NV}partOf> <${ASSET}unit-4711> .`,
      '',
      `<${ASSET}unit-4711> <${NV}label> "Unit 4711"@en .`,
    ];
    const source = parseSource(lines.join('\n'), 'assets.nt', 'n-triples');
    expect(source.errors).toEqual([]);
    expect(source.statements.map((statement) => [statement.position.line, statement.position.column])).toEqual([
      [1, 1],
      [3, 1],
      [5, 1],
    ]);
    expect(source.statements[2].graph).toBe('');
  });

  it('gives the graph of an N-Quads statement', () => {
    const text = `<${ASSET}a> <${NV}partOf> <${ASSET}b> <${ASSET}graph-1> .\n<${ASSET}a> <${NV}partOf> <${ASSET}c> .\n`;
    const source = parseSource(text, 'assets.nq', 'n-quads');
    expect(source.statements.map((statement) => [statement.graph, statement.position.line])).toEqual([
      [`${ASSET}graph-1`, 1],
      ['', 2],
    ]);
  });

  for (const suite of [
    { folder: 'rdf-n-triples', format: 'n-triples' as const, lexerFormat: 'N-Triples' },
    { folder: 'rdf-n-quads', format: 'n-quads' as const, lexerFormat: 'N-Quads' },
  ]) {
    it(`places every statement of the W3C ${suite.folder} positive tests where n3's own lexer puts its first token`, () => {
      // Source: W3C rdf-tests rdf/rdf11/${suite.folder} positive syntax tests, tokenized by n3's Lexer
      // (the reference library): a statement starts at the first token after the previous ' .'.
      let compared = 0;
      for (const test of readManifest(suite.folder).filter((entry) => entry.kind === 'positive-syntax')) {
        const text = readFileSync(test.actionPath, 'utf8');
        const tokens = new Lexer({ lineMode: true }).tokenize(text) as unknown as N3Token[];
        const starts: Array<[number, number]> = [];
        let atStatementStart = true;
        for (const token of tokens) {
          if (token.type === 'eof') break;
          if (atStatementStart) starts.push([token.line, token.start + 1]);
          atStatementStart = token.type === '.';
        }
        const source = parseSource(text, test.actionPath, suite.format);
        expect(source.statements.map((statement) => [statement.position.line, statement.position.column])).toEqual(starts);
        compared += starts.length;
      }
      expect(compared).toBeGreaterThan(20);
    });
  }
});
