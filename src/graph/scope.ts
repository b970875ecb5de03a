// Which IRIs are in scope: configured prefixes, minus the built-in vocabularies unless named.
import { BUILT_IN_VOCABULARY_NAMESPACES } from '../roles/vocabulary.js';

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
