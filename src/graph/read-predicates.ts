// The predicates whose statements the graph build reads, so the loader can leave every other statement unstored.
import type { RoleMap } from '../roles/role.js';
import { OWL_DEPRECATED, RDF_TYPE, RDFS_LABEL, SKOS_PREF_LABEL } from '../roles/vocabulary.js';
import { STRUCTURE_PREDICATES } from './owl-axioms.js';

/**
 * Every predicate `buildHierarchyGraph` looks at with this RoleMap: the role predicates, rdf:type
 * (instance-of, declared classes, axiom types), owl:deprecated, the labels used in messages, and
 * the list and class-expression predicates that mark OWL axiom structures.
 */
export function predicatesTheGraphReads(roles: RoleMap): ReadonlySet<string> {
  return new Set([...roles.predicates, RDF_TYPE, OWL_DEPRECATED, RDFS_LABEL, SKOS_PREF_LABEL, ...STRUCTURE_PREDICATES]);
}
