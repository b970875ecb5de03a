// Which IRIs are in scope: configured prefixes, minus the built-in vocabularies unless named.
import { hasLoneSurrogate } from '../load/term-bytes.js';
import { BUILT_IN_VOCABULARY_NAMESPACES } from '../roles/vocabulary.js';
import type { TermInterner } from './interner.js';

/**
 * A test for IRIs (not blank nodes): in scope when it starts with a configured prefix (no prefixes:
 * every IRI), except that RDF, RDFS, OWL, XSD and SKOS terms need a prefix that starts with their
 * namespace (design.md).
 */
export function inScopeTest(prefixes: readonly string[]): (iri: string) => boolean {
  return (iri) => {
    const builtIn = BUILT_IN_VOCABULARY_NAMESPACES.find((namespace) => iri.startsWith(namespace));
    if (builtIn !== undefined) {
      return prefixes.some((prefix) => prefix.startsWith(builtIn) && iri.startsWith(prefix));
    }
    return prefixes.length === 0 || prefixes.some((prefix) => iri.startsWith(prefix));
  };
}

/**
 * The same test as `inScopeTest`, for term numbers, read from the terms' bytes without making
 * their texts. A prefix with a lone surrogate has no UTF-8 bytes; with such a prefix the texts
 * are made and tested as strings.
 */
export function inScopeTermTest(prefixes: readonly string[], terms: TermInterner): (termNumber: number) => boolean {
  if (prefixes.some(hasLoneSurrogate)) {
    const test = inScopeTest(prefixes);
    return (termNumber) => test(terms.text(termNumber));
  }
  const prefixBytes = prefixes.map((prefix) => Buffer.from(prefix, 'utf8'));
  const startsWith = (termNumber: number, prefix: Uint8Array) => terms.termStartsWith(termNumber, prefix);
  const builtIns = BUILT_IN_VOCABULARY_NAMESPACES.map((namespace) => ({
    bytes: Buffer.from(namespace, 'utf8'),
    // The configured prefixes that start with this namespace: the only ones that can put its terms in scope.
    naming: prefixBytes.filter((_, index) => prefixes[index].startsWith(namespace)),
  }));
  return (termNumber) => {
    const builtIn = builtIns.find((namespace) => startsWith(termNumber, namespace.bytes));
    if (builtIn !== undefined) return builtIn.naming.some((prefix) => startsWith(termNumber, prefix));
    return prefixBytes.length === 0 || prefixBytes.some((prefix) => startsWith(termNumber, prefix));
  };
}
