// The N-Triples/N-Quads fast path against n3 on every file of the W3C N-Triples and N-Quads suites.
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Parser } from 'n3';
import type * as RDF from '@rdfjs/types';
import { blankNodeLabelPrefix } from '../../src/load/parse.js';
import { RDF_TYPE, RDFS_LABEL, RDFS_SUBCLASS_OF } from '../../src/roles/vocabulary.js';
import { suiteFolder } from './w3c-manifest.js';
import { readFast, readWithN3, statementKey } from './line-reader-fixtures.js';

// Source: W3C rdf-tests repository, commit ad541a5f0479f0798608c4801369d97b8e08b36f, rdf/rdf11/
// rdf-n-triples and rdf-n-quads (copied unchanged into test/standards/w3c-rdf-tests). Every .nt and
// .nq file is read, the manifest's positive and negative tests alike, and the reference is n3.
const SUITE_FILES = [
  { folder: 'rdf-n-triples', format: 'n-triples' as const, extension: '.nt' },
  { folder: 'rdf-n-quads', format: 'n-quads' as const, extension: '.nq' },
].flatMap((suite) =>
  readdirSync(suiteFolder(suite.folder))
    .filter((name) => name.endsWith(suite.extension))
    .sort()
    .map((name) => ({ name, format: suite.format, path: `${suiteFolder(suite.folder)}${name}` })),
);

const ROLE_KEEP = new Set([RDF_TYPE, RDFS_SUBCLASS_OF, RDFS_LABEL, 'http://example/p', 'http://example/q']);
const BASE = 'http://example/base/';

/** n3's own quads for a text, terms written as the loader writes them. */
function bareN3Terms(text: string, format: 'n-triples' | 'n-quads', file: string): string[] {
  const prefix = blankNodeLabelPrefix(file, '/work/isapart-test');
  const quads = new Parser({ format: format === 'n-triples' ? 'N-Triples' : 'N-Quads', blankNodePrefix: prefix }).parse(text);
  const text_ = (term: RDF.Term): string =>
    term.termType === 'BlankNode' ? `_:${term.value}` : term.termType === 'Literal' ? JSON.stringify([term.value, term.datatype.value, term.language]) : term.value;
  return quads.map((quad) => [quad.subject, quad.predicate, quad.object, quad.graph].map((term) => (term.termType === 'DefaultGraph' ? '' : text_(term))).join(' '));
}

describe('fast line path on the W3C N-Triples and N-Quads suites', () => {
  it('finds the suites’ files', () => {
    // The W3C suites hold 70 N-Triples and 87 N-Quads files (counted in the copy; an empty list would make the rest vacuous).
    expect(SUITE_FILES.filter((file) => file.format === 'n-triples').length).toBeGreaterThan(60);
    expect(SUITE_FILES.filter((file) => file.format === 'n-quads').length).toBeGreaterThan(60);
  });

  it.each(SUITE_FILES)('$name: the same statements, lines, columns and first error as n3', ({ name, format, path }) => {
    const bytes = readFileSync(path);
    const text = bytes.toString('utf8');
    const options = { file: `w3c/${name}`, format, baseIri: BASE + name };
    const reference = readWithN3(text, options);
    for (const chunkBytes of [undefined, 7, 1]) {
      const fast = readFast(bytes, { ...options, chunkBytes });
      if (reference.errors.length === 0) {
        expect(fast.errors).toEqual([]);
        expect(fast.statements.map(statementKey)).toEqual(reference.statements.map(statementKey));
        expect(fast.statementCount).toBe(reference.statements.length);
      } else {
        // n3 stops at its first error; the fast path reports that line too and reads on after it.
        const firstLine = reference.errors[0].line;
        expect(fast.errors.length).toBeGreaterThan(0);
        expect(fast.errors[0].line).toBe(firstLine);
        expect(fast.errors[0].hint).toBeTruthy();
        const before = fast.statements.filter((statement) => statement.position.line < firstLine);
        const referenceBefore = reference.statements.filter((statement) => statement.position.line < firstLine);
        expect(before.map(statementKey)).toEqual(referenceBefore.map(statementKey));
      }
    }
  });

  it.each(SUITE_FILES)('$name: keeps exactly n3’s statements of the kept predicates', ({ name, format, path }) => {
    const bytes = readFileSync(path);
    const options = { file: `w3c/${name}`, format, baseIri: BASE + name, keep: ROLE_KEEP };
    const reference = readWithN3(bytes.toString('utf8'), options);
    if (reference.errors.length > 0) return expect(readFast(bytes, options).errors[0].line).toBe(reference.errors[0].line);
    const fast = readFast(bytes, options);
    expect(fast.statements.map(statementKey)).toEqual(reference.statements.map(statementKey));
    // The statements left out are counted, not lost.
    expect(fast.statementCount).toBe(readWithN3(bytes.toString('utf8'), { ...options, keep: undefined }).statements.length);
  });

  it.each(SUITE_FILES.filter((file) => !file.name.includes('bad')))('$name: terms equal those of a bare n3 parse', ({ name, format, path }) => {
    // Reference: n3's Parser with no positions and no factory of ours (a general-purpose reference library).
    const bytes = readFileSync(path);
    const fast = readFast(bytes, { file: `w3c/${name}`, format, baseIri: BASE + name });
    expect(fast.errors).toEqual([]);
    const ours = fast.statements.map((statement) =>
      [
        statement.subject,
        statement.predicate,
        typeof statement.object === 'string' ? statement.object : JSON.stringify([statement.object.value, statement.object.datatype, statement.object.language]),
        statement.graph,
      ].join(' '),
    );
    expect(ours).toEqual(bareN3Terms(bytes.toString('utf8'), format, `w3c/${name}`));
  });
});
