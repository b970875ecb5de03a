// parseSource and parseRdfXml against the W3C RDF 1.1 test suites for Turtle, TriG, N-Triples, N-Quads and RDF/XML.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { isomorphic } from 'rdf-isomorphic';
import { parseSource } from '../../src/load/parse.js';
import { textChunks } from '../../src/load/parse-any.js';
import { parseRdfXml } from '../../src/load/rdfxml.js';
import { expectedQuads, readManifest, statementsAsQuads, SUITES, type TestKind } from './w3c-manifest.js';

// Source: W3C rdf-tests repository, commit ad541a5f0479f0798608c4801369d97b8e08b36f, rdf/rdf11/
// (copied unchanged into test/standards/w3c-rdf-tests; W3C Test Suite Licence / 3-clause BSD).
for (const suite of SUITES) {
  const tests = readManifest(suite.folder);
  const ofKind = (kind: TestKind) => tests.filter((test) => test.kind === kind);
  const parseAction = (test: (typeof tests)[number]) =>
    parseSource(readFileSync(test.actionPath, 'utf8'), test.actionPath, suite.format, { baseIri: test.baseIri });

  describe(`W3C RDF 1.1 ${suite.folder} suite`, () => {
    it('manifest lists positive and negative syntax tests (and eval tests for Turtle and TriG)', () => {
      // W3C rdf-tests manifest.ttl of this suite: an empty read would make every check below vacuous.
      expect(ofKind('positive-syntax').length + ofKind('eval').length).toBeGreaterThan(0);
      expect(ofKind('negative-syntax').length).toBeGreaterThan(0);
      if (suite.format === 'turtle' || suite.format === 'trig') expect(ofKind('eval').length).toBeGreaterThan(0);
    });

    it.each(ofKind('positive-syntax'))('positive syntax test $name loads with no error', (test) => {
      // W3C rdf-tests, rdft:Test...PositiveSyntax: the document is in the language.
      const source = parseAction(test);
      expect(source.errors).toEqual([]);
    });

    it.each([...ofKind('negative-syntax'), ...ofKind('negative-eval')])(
      'negative test $name gives an InputError with a line',
      (test) => {
        // W3C rdf-tests, rdft:Test...NegativeSyntax / NegativeEval: the document must be rejected.
        const source = parseAction(test);
        expect(source.errors.length).toBeGreaterThan(0);
        expect(source.errors[0].line).toBeGreaterThanOrEqual(1);
        expect(source.errors[0].hint).toBeTruthy();
      },
    );

    it.each(ofKind('eval'))('eval test $name gives the statements of its mf:result', (test) => {
      // W3C rdf-tests, rdft:Test...Eval: the parsed graph is isomorphic to mf:result (parsed by n3).
      const source = parseAction(test);
      expect(source.errors).toEqual([]);
      const expected = expectedQuads(test.resultPath as string);
      const actual = statementsAsQuads(source.statements);
      expect(actual.length).toBe(expected.length);
      expect(isomorphic(actual, expected)).toBe(true);
    });
  });
}

// Source: W3C rdf-tests repository, same commit, rdf/rdf11/rdf-xml (copied unchanged into
// test/standards/w3c-rdf-tests; the licence is stated at the top of its manifest.ttl).
describe('W3C RDF 1.1 rdf-xml suite', () => {
  const tests = readManifest('rdf-xml');
  const ofKind = (kind: TestKind) => tests.filter((test) => test.kind === kind);
  const parseAction = (test: (typeof tests)[number]) =>
    parseRdfXml(textChunks(readFileSync(test.actionPath, 'utf8')), test.actionPath, { baseIri: test.baseIri });

  it('manifest lists eval and negative syntax tests', () => {
    // W3C rdf-tests rdf-xml/manifest.ttl: an empty read would make every check below vacuous.
    expect(ofKind('eval').length).toBeGreaterThan(100);
    expect(ofKind('negative-syntax').length).toBeGreaterThan(30);
  });

  it.each(ofKind('negative-syntax'))('negative syntax test $name gives an InputError with a line', async (test) => {
    // W3C rdf-tests, rdft:TestXMLNegativeSyntax: the document must be rejected.
    const source = await parseAction(test);
    expect(source.errors.length).toBeGreaterThan(0);
    expect(source.errors[0].line).toBeGreaterThanOrEqual(1);
    expect(source.errors[0].message).toMatch(/^RDF\/XML syntax error: /);
    expect(source.errors[0].hint).toBeTruthy();
  });

  it.each(ofKind('eval'))('eval test $name gives the statements of its mf:result', async (test) => {
    // W3C rdf-tests, rdft:TestXMLEval: the parsed graph is isomorphic to mf:result (parsed by n3).
    const source = await parseAction(test);
    expect(source.errors).toEqual([]);
    const expected = expectedQuads(test.resultPath as string);
    const actual = statementsAsQuads(source.statements);
    expect(actual.length).toBe(expected.length);
    expect(isomorphic(actual, expected)).toBe(true);
  });
});
