// removableLines: which statements can be deleted as whole lines, proved by parsing the edited file again.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Parser } from 'n3';
import type * as RDF from '@rdfjs/types';
import { isomorphic } from 'rdf-isomorphic';
import { removableLines, type LineRemoval } from '../../src/fix/text-removal.js';
import { N3_FORMAT_NAME } from '../../src/load/n3-tokens.js';
import { parseSource } from '../../src/load/parse.js';
import type { N3Format, Statement } from '../../src/load/statement.js';
import { readManifest, SUITES } from '../load/w3c-manifest.js';

const BASE = 'https://data.northvale-rail.example/graph/assets.ttl';
const NV = '@prefix nv: <https://data.northvale-rail.example/def/> .\n@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .\n';

/** Every statement of a text with its removal (or undefined). */
function removals(text: string, format: N3Format = 'turtle', baseIri = BASE): { statement: Statement; removal: LineRemoval | undefined }[] {
  const source = parseSource(text, 'assets.ttl', format, { baseIri });
  expect(source.errors).toEqual([]);
  return source.statements.map((statement) => ({ statement, removal: removableLines(statement, text, format, { baseIri }) }));
}

/** The text without the removal's lines. */
function withoutLines(text: string, removal: LineRemoval): string {
  const body = text.startsWith('\ufeff') ? text.slice(1) : text;
  const lines = body.match(/[^\r\n]*(\r\n|\r|\n)|[^\r\n]+$/g) ?? [];
  const joined = lines.slice(0, removal.firstLine - 1).join('') + lines.slice(removal.lastLine).join('');
  expect(lines.slice(removal.firstLine - 1, removal.lastLine).join('')).toBe(removal.text);
  return joined;
}

/** Quads as n3 itself parses a text (the reference parser, independent of isapart's loader). */
function n3Quads(text: string, format: N3Format, baseIri: string): RDF.Quad[] {
  return new Parser({ format: N3_FORMAT_NAME[format], baseIRI: baseIri }).parse(text);
}

/** One quad of n3's parse that is the statement, compared by value (blank nodes by being blank). */
function isStatement(quad: RDF.Quad, statement: Statement): boolean {
  const same = (term: RDF.Term, expected: string): boolean =>
    expected.startsWith('_:') ? term.termType === 'BlankNode' : term.termType === 'NamedNode' && term.value === expected;
  const object = statement.object;
  return (
    (statement.graph === '' ? quad.graph.termType === 'DefaultGraph' : same(quad.graph, statement.graph)) &&
    same(quad.subject, statement.subject) &&
    quad.predicate.value === statement.predicate &&
    (typeof object === 'string'
      ? same(quad.object, object)
      : quad.object.termType === 'Literal' && quad.object.value === object.value && quad.object.datatype.value === object.datatype && quad.object.language === object.language)
  );
}

/**
 * The removal's promise, checked with n3's parser and rdf-isomorphic (general-purpose libraries):
 * the edited text parses, and its graph is the original graph less exactly the statement.
 */
function expectExactlyRemoved(text: string, statement: Statement, removal: LineRemoval, format: N3Format, baseIri: string): void {
  const before = n3Quads(text, format, baseIri);
  const after = n3Quads(withoutLines(text, removal), format, baseIri);
  expect(after.length).toBe(before.length - 1);
  const gone = before.findIndex((quad) => isStatement(quad, statement) && !after.some((kept) => kept.equals(quad)));
  const index = gone >= 0 ? gone : before.findIndex((quad) => isStatement(quad, statement));
  expect(index).toBeGreaterThanOrEqual(0);
  const expected = before.filter((_, position) => position !== index);
  expect(isomorphic(after, expected)).toBe(true);
}

describe('removableLines on single statements', () => {
  it('gives the whole line of a statement standing alone, with its trailing comment and line end', () => {
    const text = `${NV}nv:Pantograph rdfs:subClassOf nv:RoofEquipment .   # the roof kit\nnv:RoofEquipment rdfs:subClassOf nv:Equipment .\n`;
    const [first, second] = removals(text);
    expect(first.removal).toEqual({ file: 'assets.ttl', firstLine: 3, lastLine: 3, text: 'nv:Pantograph rdfs:subClassOf nv:RoofEquipment .   # the roof kit\n' });
    expect(second.removal?.firstLine).toBe(4);
    expectExactlyRemoved(text, first.statement, first.removal as LineRemoval, 'turtle', BASE);
  });

  it('spans the lines of a statement written over several lines, and of a long literal', () => {
    const text = `${NV}nv:Bogie\n    rdfs:subClassOf\n        nv:RunningGear .\nnv:Bogie rdfs:comment """A frame\nwith wheelsets.""" .\n`;
    const [split, literal] = removals(text);
    expect([split.removal?.firstLine, split.removal?.lastLine]).toEqual([3, 5]);
    expect([literal.removal?.firstLine, literal.removal?.lastLine]).toEqual([6, 7]);
    expectExactlyRemoved(text, split.statement, split.removal as LineRemoval, 'turtle', BASE);
    expectExactlyRemoved(text, literal.statement, literal.removal as LineRemoval, 'turtle', BASE);
  });

  it('keeps CR LF and lone CR line ends as n3 counts them', () => {
    const text = '@prefix nv: <https://data.northvale-rail.example/def/> .\r\nnv:A nv:partOf nv:B .\r\nnv:C nv:partOf nv:D .\rnv:E nv:partOf nv:F .';
    const found = removals(text);
    expect(found.map(({ removal }) => removal?.text)).toEqual(['nv:A nv:partOf nv:B .\r\n', 'nv:C nv:partOf nv:D .\r', 'nv:E nv:partOf nv:F .']);
    for (const { statement, removal } of found) expectExactlyRemoved(text, statement, removal as LineRemoval, 'turtle', BASE);
  });

  it('resolves prefixed names with the directives in force at the statement, also redefined ones and @base', () => {
    const text = `@prefix nv: <https://data.northvale-rail.example/old/> .\nnv:A nv:partOf nv:B .\n@prefix nv: <https://data.northvale-rail.example/def/> .\n@base <https://data.northvale-rail.example/asset/> .\nnv:A nv:partOf <unit-7> .\n`;
    const found = removals(text);
    expect(found[1].statement.object).toBe('https://data.northvale-rail.example/asset/unit-7');
    expect(found.map(({ removal }) => removal?.firstLine)).toEqual([2, 5]);
    for (const { statement, removal } of found) expectExactlyRemoved(text, statement, removal as LineRemoval, 'turtle', BASE);
  });

  it('handles labelled blank nodes, typed and language literals, and the SPARQL-style directives', () => {
    const text = `PREFIX nv: <https://data.northvale-rail.example/def/>\nPREFIX xsd: <http://www.w3.org/2001/XMLSchema#>\n_:unit nv:partOf nv:Train .\nnv:Train nv:axles "8"^^xsd:integer .\nnv:Train nv:label "Zug"@de .\n`;
    const found = removals(text);
    expect(found.every(({ removal }) => removal !== undefined)).toBe(true);
    for (const { statement, removal } of found) expectExactlyRemoved(text, statement, removal as LineRemoval, 'turtle', BASE);
  });
});

describe('removableLines refuses what is not one statement on its own lines', () => {
  const unsafe: [string, string][] = [
    ['a ; list', `${NV}nv:Bogie rdfs:subClassOf nv:RunningGear ;\n    rdfs:label "bogie" .\n`],
    ['a , list', `${NV}nv:Bogie rdfs:subClassOf nv:RunningGear , nv:Frame .\n`],
    ['two statements on one line', `${NV}nv:A rdfs:subClassOf nv:B . nv:C rdfs:subClassOf nv:D .\n`],
    ['a blank-node property list', `${NV}nv:Coach nv:hasPart [ rdfs:label "door" ] .\n`],
    ['an anonymous blank node', `${NV}[] nv:partOf nv:Coach .\n`],
    ['a collection', `${NV}nv:Coach nv:parts ( nv:Door nv:Seat ) .\n`],
    ['a directive on the same line', `@prefix nv: <https://data.northvale-rail.example/def/> . nv:A nv:partOf nv:B .\n`],
  ];
  it.each(unsafe)('%s gives undefined for every statement', (_, text) => {
    for (const { removal } of removals(text)) expect(removal).toBeUndefined();
  });

  it('accepts a trailing comment after the closing dot', () => {
    const text = `${NV}nv:A rdfs:subClassOf nv:B .\nnv:C rdfs:subClassOf nv:D . # two\n`;
    expect(removals(text).map(({ removal }) => removal?.firstLine)).toEqual([3, 4]);
  });

  it('in TriG removes a line inside a graph block that stays valid, never the triple closed by the brace', () => {
    const text = `${NV}nv:fleet {\n  nv:A nv:partOf nv:B .\n  nv:C nv:partOf nv:D\n}\n{ nv:E nv:partOf nv:F . }\n`;
    const found = removals(text, 'trig');
    expect(found.map(({ removal }) => removal?.firstLine)).toEqual([4, undefined, undefined]);
    expectExactlyRemoved(text, found[0].statement, found[0].removal as LineRemoval, 'trig', BASE);
    const single = `${NV}nv:fleet {\n  nv:A nv:partOf nv:B .\n}\n`;
    const [only] = removals(single, 'trig');
    // The block left empty is still valid TriG.
    expectExactlyRemoved(single, only.statement, only.removal as LineRemoval, 'trig', BASE);
  });

  it('gives undefined when the text is not the statement’s file (the re-parse finds another triple)', () => {
    const text = `${NV}nv:A rdfs:subClassOf nv:B .\n`;
    const [{ statement }] = removals(text);
    expect(removableLines(statement, `${NV}nv:A rdfs:subClassOf nv:C .\n`, 'turtle', { baseIri: BASE })).toBeUndefined();
    expect(removableLines({ ...statement, position: { ...statement.position, line: 40 } }, text, 'turtle')).toBeUndefined();
  });
});

describe('removableLines on N-Triples and N-Quads', () => {
  it('removes one line and keeps the rest, comments included', () => {
    const nt = '<https://data.northvale-rail.example/a> <http://purl.org/dc/terms/isPartOf> <https://data.northvale-rail.example/b> . # x\n# note\n_:n <http://purl.org/dc/terms/isPartOf> "lit"@en .\n';
    const found = removals(nt, 'n-triples');
    expect(found.map(({ removal }) => removal?.firstLine)).toEqual([1, 3]);
    for (const { statement, removal } of found) expectExactlyRemoved(nt, statement, removal as LineRemoval, 'n-triples', BASE);
    const nq = '<https://data.northvale-rail.example/a> <http://purl.org/dc/terms/isPartOf> <https://data.northvale-rail.example/b> <https://data.northvale-rail.example/g> .\n';
    const [quad] = removals(nq, 'n-quads');
    expect(quad.removal?.text).toBe(nq);
  });
});

/** Statement forms a modeller writes, each with whether removableLines must accept it. */
const FORMS: { text: (index: number) => string; removable: boolean }[] = [
  { text: (i) => `nv:C${i} rdfs:subClassOf nv:C${i + 1} .\n`, removable: true },
  { text: (i) => `nv:C${i} rdfs:subClassOf nv:C${i + 1} . # note ${i}\n`, removable: true },
  { text: (i) => `nv:C${i}\n  nv:partOf\n  nv:C${i + 2} .\n`, removable: true },
  { text: (i) => `  nv:C${i} rdfs:label """part\n${i}""" .\n`, removable: true },
  { text: (i) => `nv:C${i} rdfs:subClassOf nv:C${i + 1} ;\n  nv:partOf nv:C${i + 3} .\n`, removable: false },
  { text: (i) => `nv:C${i} nv:partOf nv:C${i + 1} , nv:C${i + 2} .\n`, removable: false },
  { text: (i) => `nv:C${i} nv:partOf nv:C${i + 1} . nv:C${i + 5} nv:partOf nv:C${i} .\n`, removable: false },
  { text: (i) => `nv:C${i} nv:hasPart [ rdfs:label "p${i}" ] .\n`, removable: false },
  { text: () => `# a comment line\n\n`, removable: false },
];

describe('removableLines on generated files (fast-check)', () => {
  it('accepts exactly the single-statement forms, and every accepted removal takes out exactly that triple', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: FORMS.length - 1 }), { minLength: 1, maxLength: 12 }), (choices) => {
        const parts = choices.map((choice, index) => ({ form: FORMS[choice], text: FORMS[choice].text(index * 10) }));
        const text = NV + parts.map((part) => part.text).join('');
        let line = 3;
        for (const part of parts) {
          const found = removals(text).filter(({ statement }) => statement.position.line === line);
          for (const { statement, removal } of found) {
            expect(removal !== undefined).toBe(part.form.removable);
            if (removal !== undefined) expectExactlyRemoved(text, statement, removal, 'turtle', BASE);
          }
          line += part.text.split('\n').length - 1;
        }
      }),
      { numRuns: 60 },
    );
  });
});

describe('removableLines on the W3C RDF 1.1 test suites', () => {
  // Source: the W3C RDF 1.1 Turtle, TriG, N-Triples and N-Quads suites (test/standards/w3c-rdf-tests):
  // every statement of every file the suites say is valid; wherever a removal is offered, n3 must
  // read the edited file as the original graph less exactly that statement.
  for (const { folder, format } of SUITES) {
    it(`${folder}: every offered removal leaves a valid file without exactly that statement`, () => {
      let offered = 0;
      let checked = 0;
      for (const test of readManifest(folder)) {
        if (test.kind !== 'eval' && test.kind !== 'positive-syntax') continue;
        const text = readFileSync(test.actionPath, 'utf8');
        const baseIri = test.baseIri ?? `file://${test.actionPath}`;
        const source = parseSource(text, test.actionPath, format, { baseIri });
        if (source.errors.length > 0) continue;
        for (const statement of source.statements) {
          checked++;
          const removal = removableLines(statement, text, format, { baseIri });
          if (removal === undefined) continue;
          offered++;
          expectExactlyRemoved(text, statement, removal, format, baseIri);
        }
      }
      expect(checked).toBeGreaterThan(50);
      expect(offered).toBeGreaterThan(20);
    });
  }
});
