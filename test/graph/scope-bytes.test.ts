// The in-scope test read from term bytes gives what the string test gives on the same texts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { TermInterner } from '../../src/graph/interner.js';
import { inScopeTermTest, inScopeTest } from '../../src/graph/scope.js';
import { StatementStore } from '../../src/load/statement-store.js';
import { BUILT_IN_VOCABULARY_NAMESPACES } from '../../src/roles/vocabulary.js';

// Pieces IRIs and prefixes are made of: the built-in namespaces (RDF, RDFS, OWL, XSD, SKOS, whose
// terms need a prefix that names them), our own namespace, and tails with non-ASCII and lone surrogates.
const starts = [...BUILT_IN_VOCABULARY_NAMESPACES, 'https://data.northvale-rail.example/', 'https://data.northvale-rail.example/def/', 'urn:x-'];
const tail = fc.string({ unit: fc.constantFrom('a', 'B', '/', '#', 'é', '中', '😀', '\uD83D', '\uDE00'), maxLength: 6 });
const text = fc.tuple(fc.constantFrom(...starts, ''), tail).map(([start, rest]) => start + rest);

describe('inScopeTermTest', () => {
  it('agrees with inScopeTest on random IRIs and prefixes, the built-in namespaces and lone surrogates included', () => {
    fc.assert(
      fc.property(fc.array(text, { maxLength: 3 }), fc.array(text, { minLength: 1, maxLength: 20 }), (prefixes, iris) => {
        const store = new StatementStore();
        const numbers = iris.map((iri) => store.term(iri));
        const byBytes = inScopeTermTest(prefixes, new TermInterner(store));
        const byText = inScopeTest(prefixes);
        iris.forEach((iri, index) => expect(byBytes(numbers[index]), `${JSON.stringify(iri)} with ${JSON.stringify(prefixes)}`).toBe(byText(iri)));
      }),
      { numRuns: 1000 },
    );
  });
});
