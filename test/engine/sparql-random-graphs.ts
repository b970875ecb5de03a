// Small random graphs for push-down differential tests: every kind of term and statement the graph reads.
import fc from 'fast-check';
import type { Literal, Statement } from '../../src/load/statement.js';
import type { RoleMap } from '../../src/roles/role.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import {
  DCTERMS_HAS_PART,
  DCTERMS_IS_PART_OF,
  OWL_ALL_DISJOINT_CLASSES,
  OWL_CLASS,
  OWL_DEPRECATED,
  OWL_DISJOINT_WITH,
  OWL_EQUIVALENT_CLASS,
  OWL_MEMBERS,
  OWL_NAMESPACE,
  OWL_RESTRICTION,
  RDF_FIRST,
  RDF_NIL,
  RDF_REST,
  RDF_TYPE,
  RDFS_SUBCLASS_OF,
  SKOS_BROADER,
  SKOS_NARROWER,
  XSD_BOOLEAN,
} from '../../src/roles/vocabulary.js';
import { sourceOf } from './sparql-harness.js';
import type { LoadedSource } from '../../src/load/statement.js';

const NV = 'https://data.northvale-rail.example/def/';
const OTHER = 'https://vocabulary.example.org/';
const PART_OF = `${NV}partOf`;
const HAS_PART = `${NV}hasPart`;

/** Nodes a random graph is made of: in-scope IRIs, an out-of-scope IRI, a built-in term, blank nodes. */
const NODES = [`${NV}A`, `${NV}B`, `${NV}C`, `${NV}D`, `${NV}E`, `${OTHER}F`, `${OWL_NAMESPACE}Thing`, '_:b1', '_:b2'];
/** Predicates of the random statements: the presets', the config's own, an inverse and a symmetric one. */
const PREDICATES = [RDF_TYPE, RDFS_SUBCLASS_OF, RDFS_SUBCLASS_OF, DCTERMS_IS_PART_OF, DCTERMS_HAS_PART, PART_OF, HAS_PART, OWL_DISJOINT_WITH, OWL_EQUIVALENT_CLASS, SKOS_BROADER, SKOS_NARROWER];

const TRUE: Literal = { value: 'true', datatype: XSD_BOOLEAN, language: '' };

let line = 0;
function statement(subject: string, predicate: string, object: string | Literal): Statement {
  line++;
  return { subject, predicate, object, graph: '', position: { file: 'random.nt', line, column: 1 }, objectLine: line };
}

/** Extra structures: a class declaration, a deprecation, an AllDisjointClasses list, a restriction, a literal role object. */
const extras = fc.record({
  declared: fc.subarray(NODES.slice(0, 6), { maxLength: 2 }),
  deprecated: fc.subarray(NODES.slice(0, 6), { maxLength: 2 }),
  allDisjoint: fc.option(fc.subarray(NODES.slice(0, 6), { minLength: 2, maxLength: 3 }), { nil: undefined }),
  restrictionOf: fc.option(fc.constantFrom(...NODES.slice(0, 5)), { nil: undefined }),
  literalObject: fc.boolean(),
});

/** A random graph: statements, extra structures, roots, scope, and whether the skos preset is on. */
export const graphs = fc.record({
  edges: fc.array(fc.tuple(fc.nat(NODES.length - 1), fc.nat(PREDICATES.length - 1), fc.nat(NODES.length - 1)), { minLength: 1, maxLength: 12 }),
  extras,
  roots: fc.subarray(NODES.slice(0, 6), { maxLength: 2 }),
  scope: fc.constantFrom([NV], [], [NV, OTHER], [NV, OWL_NAMESPACE]),
  skos: fc.boolean(),
});

/** One generated graph. */
export type RandomGraph = typeof graphs extends fc.Arbitrary<infer T> ? T : never;

function statementsOf(graph: RandomGraph): Statement[] {
  const statements = graph.edges.map(([subject, predicate, object]) => statement(NODES[subject], PREDICATES[predicate], NODES[object]));
  for (const node of graph.extras.declared) statements.push(statement(node, RDF_TYPE, OWL_CLASS));
  for (const node of graph.extras.deprecated) statements.push(statement(node, OWL_DEPRECATED, TRUE));
  if (graph.extras.allDisjoint !== undefined) {
    statements.push(statement('_:ax', RDF_TYPE, OWL_ALL_DISJOINT_CLASSES), statement('_:ax', OWL_MEMBERS, '_:l0'));
    graph.extras.allDisjoint.forEach((member, index, members) => {
      statements.push(statement(`_:l${index}`, RDF_FIRST, member));
      statements.push(statement(`_:l${index}`, RDF_REST, index === members.length - 1 ? RDF_NIL : `_:l${index + 1}`));
    });
  }
  if (graph.extras.restrictionOf !== undefined) {
    statements.push(statement(graph.extras.restrictionOf, RDFS_SUBCLASS_OF, '_:r'), statement('_:r', RDF_TYPE, OWL_RESTRICTION));
    statements.push(statement('_:r', `${OWL_NAMESPACE}onProperty`, PART_OF));
  }
  if (graph.extras.literalObject) statements.push(statement(`${NV}A`, RDFS_SUBCLASS_OF, { value: 'Asset', datatype: '', language: '' }));
  return statements;
}


/** The sources and setting of a random graph, with the config's own part-of predicates. */
export function randomRun(graph: RandomGraph): { sources: LoadedSource[]; setting: { roleMap: RoleMap; scope: string[]; roots: string[] } } {
  const presets = graph.skos ? ['rdfs', 'owl', 'dcterms', 'skos'] : ['rdfs', 'owl', 'dcterms'];
  const roleMap = buildRoleMap(presets, { 'part-of': { iri: [PART_OF], inverse: [HAS_PART] } });
  return { sources: [sourceOf('random.nt', statementsOf(graph))], setting: { roleMap, scope: [...graph.scope], roots: graph.roots } };
}
