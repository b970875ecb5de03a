// Property test: on generated N-Triples and N-Quads lines the fast path keeps exactly what n3 yields.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DCTERMS_IS_PART_OF, RDF_TYPE, RDFS_LABEL, RDFS_SUBCLASS_OF, XSD_NAMESPACE } from '../../src/roles/vocabulary.js';
import { readFast, readWithN3, statementKey } from './line-reader-fixtures.js';

const EXAMPLE = 'https://data.northvale-rail.example/def/';
const KEEP = new Set([RDF_TYPE, RDFS_SUBCLASS_OF, DCTERMS_IS_PART_OF, RDFS_LABEL]);
const PREDICATES = [...KEEP, `${EXAMPLE}serialNumber`, `${EXAMPLE}note`];

/**
 * Lines from parts that n3 reads and parts it refuses; `odd` is the weight of the refused ones
 * against 100 for the others, low for whole documents (so they run long before a first error) and
 * higher for single lines.
 */
function lineOf(quads: boolean, odd: number) {
  const iriChar = fc.oneof(
    { weight: 100, arbitrary: fc.constantFrom(...'abcXYZ019/_-.~#?=&%:') },
    { weight: 15, arbitrary: fc.constantFrom('é', '日', '😀', 'ß') },
    { weight: 5, arbitrary: fc.constantFrom('\\u00E9', '\\U0001F600', '\\u0041') },
    { weight: odd, arbitrary: fc.constantFrom(' ', '{', '\\n') },
  );
  const iriStart = fc.oneof(
    { weight: 100, arbitrary: fc.constantFrom(EXAMPLE, 'urn:x:') },
    { weight: odd, arbitrary: fc.constantFrom('http://example.org/a b', 'relative/') },
  );
  const iri = fc.tuple(iriStart, fc.array(iriChar, { maxLength: 12 })).map(([start, chars]) => `<${start}${chars.join('')}>`);
  const blankLabel = fc
    .tuple(fc.constantFrom(...'abQ_9'), fc.array(fc.oneof({ weight: 100, arbitrary: fc.constantFrom(...'xyz0-._') }, { weight: 5, arbitrary: fc.constant('é') }), { maxLength: 6 }))
    .map(([first, rest]) => `_:${first}${rest.join('')}`);
  const literalChar = fc.oneof(
    { weight: 100, arbitrary: fc.constantFrom(...'abc XYZ 123<>#.,;:@^_-') },
    { weight: 15, arbitrary: fc.constantFrom('é', '日本', '😀', '\t') },
    { weight: 15, arbitrary: fc.constantFrom('\\"', '\\\\', '\\n', '\\t', '\\u00E9', '\\U0001F600', "\\'") },
    { weight: odd, arbitrary: fc.constantFrom('\\x', '"') },
  );
  const suffix = fc.oneof(
    { weight: 100, arbitrary: fc.constantFrom('', '', '@en', '@en-GB', '@DE-ch', `^^<${XSD_NAMESPACE}integer>`, `^^<${XSD_NAMESPACE}string>`) },
    { weight: odd, arbitrary: fc.constantFrom('@abcdefghi', '^^<http://www.w3.org/1999/02/22-rdf-syntax-ns#langString>') },
  );
  const literal = fc.tuple(fc.array(literalChar, { maxLength: 14 }), suffix).map(([chars, tail]) => `"${chars.join('')}"${tail}`);
  // No space at all between terms is allowed and is read by n3, but can glue a blank node label to the next term.
  const space = fc.oneof({ weight: 100, arbitrary: fc.constantFrom(' ', ' ', '\t', '  ') }, { weight: 5 + odd, arbitrary: fc.constant('') });
  const subject = fc.oneof({ weight: 4, arbitrary: iri }, { weight: 1, arbitrary: blankLabel });
  const object = fc.oneof({ weight: 3, arbitrary: iri }, { weight: 1, arbitrary: blankLabel }, { weight: 3, arbitrary: literal });
  const ending = fc.oneof(
    { weight: 100, arbitrary: fc.constantFrom(' .', ' .', '.', ' . ', ' . # a note', ' . # isapart-allow kind-and-part: sold as one kit', ' .\t#x') },
    { weight: odd, arbitrary: fc.constantFrom(' . # isapart-allow', ' ', ' ..') },
  );
  const predicate = fc.oneof({ weight: 100, arbitrary: fc.constantFrom(...PREDICATES).map((p) => `<${p}>`) }, { weight: 10, arbitrary: iri });
  const graph = quads ? fc.option(fc.tuple(space, fc.oneof(iri, blankLabel)).map(([s, g]) => `${s}${g}`), { nil: '' }) : fc.constant('');
  const statementLine = fc.tuple(fc.constantFrom('', '', ' ', '\t'), subject, space, predicate, space, object, graph, ending).map((parts) => parts.join(''));
  return fc.oneof(
    { weight: 12, arbitrary: statementLine },
    { weight: 1, arbitrary: fc.constantFrom('', '   ', '# a comment line', '# isapart-allow orphan-class: a root on purpose', '\t# isapart-allow nothing') },
  );
}

const LINES_PER_DOCUMENT = 50;
const DOCUMENTS = 50;

describe.each([
  { format: 'n-triples' as const, quads: false },
  { format: 'n-quads' as const, quads: true },
])('fast line path on generated $format lines', ({ format, quads }) => {
  it(`keeps exactly n3's statements of the kept predicates, with the same lines and allow comments (${DOCUMENTS * LINES_PER_DOCUMENT} lines)`, () => {
    let compared = 0;
    let readByN3 = 0;
    fc.assert(
      fc.property(fc.array(lineOf(quads, 1), { minLength: LINES_PER_DOCUMENT, maxLength: LINES_PER_DOCUMENT }), fc.integer({ min: 1, max: 64 }), (lines, chunkBytes) => {
        const text = lines.join(quads ? '\r\n' : '\n');
        const options = { file: 'generated.nt', format, keep: KEEP, chunkBytes };
        const reference = readWithN3(text, options);
        const fast = readFast(Buffer.from(text), options);
        // Reference: n3's own parser on the whole text. n3 stops at its first error, and it lets a
        // statement missing its dot run on into the next line, which N-Triples does not allow (one
        // statement per line); so the texts are compared up to the first line n3 refuses on its own.
        const badLines = lines.map((text, index) => (readWithN3(text, options).errors.length > 0 ? index + 1 : 0)).filter((n) => n > 0);
        const firstBad = badLines[0] ?? Number.POSITIVE_INFINITY;
        const stop = Math.min(firstBad, reference.errors[0]?.line ?? Number.POSITIVE_INFINITY);
        const upTo = <T extends { line: number }>(items: T[]) => items.filter((item) => item.line < stop);
        expect(fast.statements.filter((s) => s.position.line < stop).map(statementKey)).toEqual(
          reference.statements.filter((s) => s.position.line < stop).map(statementKey),
        );
        expect(upTo(fast.allowComments)).toEqual(upTo(reference.allowComments));
        if (stop === Number.POSITIVE_INFINITY) expect(fast.errors).toEqual([]);
        else expect(fast.errors[0]?.line).toBe(stop);
        compared += Math.min(stop - 1, lines.length);
        readByN3 += fast.linesReadByN3;
        // The fast path reports every bad line, and only those.
        expect([...new Set(fast.errors.map((error) => error.line))]).toEqual(badLines);
      }),
      { numRuns: DOCUMENTS, seed: 20261201 },
    );
    // Enough lines were compared before any first error for the property to mean something.
    expect(compared).toBeGreaterThan(DOCUMENTS * 5);
    // Both ways of reading a line were taken often: the byte scan for most, n3 for the escapes and odd lines.
    expect(readByN3).toBeGreaterThan(DOCUMENTS * 5);
    expect(readByN3).toBeLessThan((DOCUMENTS * LINES_PER_DOCUMENT * 3) / 4);
  });

  it('gives each generated line alone the same statements and error or no error as n3 (1,000 lines)', () => {
    fc.assert(
      fc.property(lineOf(quads, 20), (text) => {
        const options = { file: 'one-line.nt', format };
        const reference = readWithN3(text, options);
        const fast = readFast(Buffer.from(text), options);
        expect(fast.errors.length > 0).toBe(reference.errors.length > 0);
        if (reference.errors.length === 0) expect(fast.statements.map(statementKey)).toEqual(reference.statements.map(statementKey));
        else expect(fast.errors[0]).toMatchObject({ line: reference.errors[0].line, column: reference.errors[0].column });
      }),
      { numRuns: 1000, seed: 7 },
    );
  });
});
