// The hierarchy graph builder: edges, evidence, node kinds, OWL axioms, names, stats.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import type { HierarchyGraph } from '../../src/graph/hierarchy-graph.js';
import {
  DCTERMS_HAS_PART,
  DCTERMS_IS_PART_OF,
  OWL_CLASS,
  OWL_DEPRECATED,
  OWL_DISJOINT_WITH,
  OWL_EQUIVALENT_CLASS,
  RDF_TYPE,
  RDFS_CLASS,
  RDFS_LABEL,
  RDFS_NAMESPACE,
  RDFS_SUBCLASS_OF,
  SKOS_PREF_LABEL,
  XSD_BOOLEAN,
} from '../../src/roles/vocabulary.js';
import { NORTHVALE, literal, parseTurtle, source, statement, testRoleMap } from './graph-fixtures.js';

const N = NORTHVALE;
const noScope = { prefixes: [], roots: [] };

function idsOf(graph: HierarchyGraph, ...locals: string[]): number[] {
  return locals.map((local) => graph.idOf(N + local));
}

describe('edges and evidence', () => {
  it('merges an edge stated directly and through an inverse predicate into one edge with both statements', () => {
    const direct = statement(N + 'Pantograph', DCTERMS_IS_PART_OF, N + 'Roof', { line: 1 });
    const inverse = statement(N + 'Roof', DCTERMS_HAS_PART, N + 'Pantograph', { line: 2 });
    const graph = buildHierarchyGraph([source([direct, inverse])], testRoleMap(), noScope);
    const [pantograph, roof] = idsOf(graph, 'Pantograph', 'Roof');
    expect(graph.hasEdge('part-of', pantograph, roof)).toBe(true);
    expect(graph.hasEdge('part-of', roof, pantograph)).toBe(false);
    expect(graph.edgeStatements('part-of', pantograph, roof)).toEqual([direct, inverse]);
    expect(graph.stats.edges['part-of']).toBe(1);
    expect(graph.stats.roleStatements['part-of']).toBe(2);
  });

  it('merges an edge stated twice, across two files, keeping both statements in source order', () => {
    const first = statement(N + 'Bogie', RDFS_SUBCLASS_OF, N + 'Assembly', { file: 'a.ttl', line: 4 });
    const again = statement(N + 'Bogie', RDFS_SUBCLASS_OF, N + 'Assembly', { file: 'b.ttl', line: 9 });
    const graph = buildHierarchyGraph([source([first], {}, 'a.ttl'), source([again], {}, 'b.ttl')], testRoleMap(), noScope);
    const [bogie, assembly] = idsOf(graph, 'Bogie', 'Assembly');
    expect(Array.from(graph.successors('subclass-of', bogie))).toEqual([assembly]);
    expect(Array.from(graph.predecessors('subclass-of', assembly))).toEqual([bogie]);
    expect(graph.edgeStatements('subclass-of', bogie, assembly).map((s) => s.position.file)).toEqual(['a.ttl', 'b.ttl']);
    expect(graph.stats.edges['subclass-of']).toBe(1);
  });

  it('stores symmetric roles both ways, each edge with the statements of both directions', () => {
    const forward = statement(N + 'Locomotive', OWL_DISJOINT_WITH, N + 'Wagon', { line: 1 });
    const backward = statement(N + 'Wagon', OWL_DISJOINT_WITH, N + 'Locomotive', { line: 2 });
    const same = statement(N + 'Railcar', OWL_EQUIVALENT_CLASS, N + 'MultipleUnitCar', { line: 3 });
    const graph = buildHierarchyGraph([source([forward, backward, same])], testRoleMap(), noScope);
    const [locomotive, wagon, railcar, unitCar] = idsOf(graph, 'Locomotive', 'Wagon', 'Railcar', 'MultipleUnitCar');
    expect(graph.hasEdge('disjoint-with', locomotive, wagon)).toBe(true);
    expect(graph.hasEdge('disjoint-with', wagon, locomotive)).toBe(true);
    expect(graph.edgeStatements('disjoint-with', wagon, locomotive)).toEqual([forward, backward]);
    expect(graph.edgeStatements('disjoint-with', locomotive, wagon)).toEqual([forward, backward]);
    expect(graph.hasEdge('equivalent-to', unitCar, railcar)).toBe(true);
    expect(graph.edgeStatements('equivalent-to', unitCar, railcar)).toEqual([same]);
    expect(graph.stats.edges['disjoint-with']).toBe(1);
    expect(graph.stats.edges['equivalent-to']).toBe(1);
  });

  it('keeps a symmetric self-loop as one edge with its statement once', () => {
    const self = statement(N + 'Tender', OWL_DISJOINT_WITH, N + 'Tender', { line: 1 });
    const graph = buildHierarchyGraph([source([self])], testRoleMap(), noScope);
    const tender = graph.idOf(N + 'Tender');
    expect(Array.from(graph.successors('disjoint-with', tender))).toEqual([tender]);
    expect(graph.edgeStatements('disjoint-with', tender, tender)).toEqual([self]);
    expect(graph.stats.edges['disjoint-with']).toBe(1);
  });

  it('gives ascending successors and predecessors, ids in first-seen order, -1 and [] for unknowns', () => {
    const statements = [
      statement(N + 'Axle', RDFS_SUBCLASS_OF, N + 'Part', { line: 1 }),
      statement(N + 'Axle', RDFS_SUBCLASS_OF, N + 'Component', { line: 2 }),
      statement(N + 'Axle', RDFS_SUBCLASS_OF, N + 'Asset', { line: 3 }),
      statement(N + 'Wheel', RDFS_SUBCLASS_OF, N + 'Part', { line: 4 }),
    ];
    const graph = buildHierarchyGraph([source(statements)], testRoleMap(), noScope);
    expect(idsOf(graph, 'Axle', 'Part', 'Component', 'Asset', 'Wheel')).toEqual([0, 1, 2, 3, 4]);
    expect(Array.from(graph.successors('subclass-of', 0))).toEqual([1, 2, 3]);
    expect(Array.from(graph.predecessors('subclass-of', 1))).toEqual([0, 4]);
    expect(graph.idOf(N + 'Nothing')).toBe(-1);
    expect(graph.hasEdge('subclass-of', 0, 99)).toBe(false);
    expect(graph.edgeStatements('subclass-of', 1, 0)).toEqual([]);
    expect(graph.stats.nodes).toBe(5);
    expect(graph.stats.statements).toBe(4);
  });

  it('skips and counts role statements with a literal object, with a positioned problem and a hint', () => {
    const bad = statement(N + 'Coupler', RDFS_SUBCLASS_OF, literal('Equipment'), { file: 'stock.ttl', line: 7 });
    const good = statement(N + 'Coupler', RDFS_SUBCLASS_OF, N + 'Equipment', { file: 'stock.ttl', line: 8 });
    const graph = buildHierarchyGraph([source([bad, good], {}, 'stock.ttl')], testRoleMap(), noScope);
    expect(graph.stats.skippedRoleStatements).toBe(1);
    expect(graph.stats.roleStatements['subclass-of']).toBe(1);
    expect(graph.stats.edges['subclass-of']).toBe(1);
    expect(graph.problems).toHaveLength(1);
    expect(graph.problems![0]).toMatchObject({ file: 'stock.ttl', line: 7, column: 1 });
    expect(graph.problems![0].message).toContain('literal object');
    expect(graph.problems![0].hint).toBeTruthy();
  });
});

describe('node kinds', () => {
  const statements = [
    statement(N + 'Unit4711', RDF_TYPE, N + 'Locomotive', { line: 1 }),
    statement(N + 'Locomotive', RDFS_SUBCLASS_OF, N + 'RollingStock', { line: 2 }),
    statement(N + 'Signal', RDF_TYPE, OWL_CLASS, { line: 3 }),
    statement(N + 'SteamEngine', OWL_DEPRECATED, literal('true', '', XSD_BOOLEAN), { line: 4 }),
    statement(N + 'Tender', OWL_DEPRECATED, literal('1'), { line: 5 }),
    statement(N + 'Coach', OWL_DEPRECATED, literal('false', '', XSD_BOOLEAN), { line: 6 }),
    statement(N + 'Coach', RDFS_SUBCLASS_OF, N + 'RollingStock', { line: 7 }),
    statement('_:depot', DCTERMS_IS_PART_OF, N + 'Network', { line: 8 }),
    statement(N + 'Platform', DCTERMS_IS_PART_OF, '_:station', { line: 9 }),
    statement(N + 'Asset', RDFS_LABEL, literal('Asset'), { line: 10 }),
    statement(RDFS_CLASS, RDFS_SUBCLASS_OF, 'http://www.w3.org/2000/01/rdf-schema#Resource', { line: 11 }),
    statement('https://other.example/Thing', RDFS_SUBCLASS_OF, N + 'Asset', { line: 12 }),
  ];

  it('tells classes, individuals, declared classes, deprecated terms, roots and scope apart', () => {
    const scope = { prefixes: [N], roots: [N + 'Asset', N + 'NeverMentioned'] };
    const graph = buildHierarchyGraph([source(statements)], testRoleMap(), scope);
    const kindsOf = (term: string): string[] => {
      const id = graph.idOf(term);
      return (['class', 'individual', 'declared-class', 'deprecated', 'root', 'in-scope'] as const).filter((kind) => graph.is(kind, id));
    };
    expect(kindsOf(N + 'Unit4711')).toEqual(['individual', 'in-scope']);
    expect(kindsOf(N + 'Locomotive')).toEqual(['class', 'in-scope']);
    // The rdf:type owl:Class statement declares the class and stays an instance-of edge too.
    expect(kindsOf(N + 'Signal')).toEqual(['class', 'declared-class', 'in-scope']);
    expect(graph.hasEdge('instance-of', graph.idOf(N + 'Signal'), graph.idOf(OWL_CLASS))).toBe(true);
    expect(kindsOf(OWL_CLASS)).toEqual(['class']);
    expect(kindsOf(N + 'SteamEngine')).toEqual(['deprecated', 'in-scope']);
    expect(kindsOf(N + 'Tender')).toEqual(['deprecated', 'in-scope']);
    expect(kindsOf(N + 'Coach')).toEqual(['class', 'in-scope']);
    expect(kindsOf(N + 'Asset')).toEqual(['class', 'root', 'in-scope']);
    expect(graph.idOf(N + 'NeverMentioned')).toBe(-1);
    // A blank node is in scope when it is the subject of a statement (design.md).
    expect(kindsOf('_:depot')).toEqual(['in-scope']);
    expect(kindsOf('_:station')).toEqual([]);
    expect(kindsOf(RDFS_CLASS)).toEqual(['class']);
    expect(kindsOf('https://other.example/Thing')).toEqual(['class']);
    expect(graph.is('class', -1)).toBe(false);
  });

  it('puts every IRI in scope without prefixes, except the RDF, RDFS, OWL, XSD and SKOS namespaces', () => {
    const graph = buildHierarchyGraph([source(statements)], testRoleMap(), noScope);
    expect(graph.is('in-scope', graph.idOf('https://other.example/Thing'))).toBe(true);
    expect(graph.is('in-scope', graph.idOf(N + 'Locomotive'))).toBe(true);
    expect(graph.is('in-scope', graph.idOf(RDFS_CLASS))).toBe(false);
    expect(graph.is('in-scope', graph.idOf(OWL_CLASS))).toBe(false);
  });

  it('puts a built-in namespace in scope only when a prefix names it, not through a broader prefix', () => {
    const named = buildHierarchyGraph([source(statements)], testRoleMap(), { prefixes: [RDFS_NAMESPACE], roots: [] });
    expect(named.is('in-scope', named.idOf(RDFS_CLASS))).toBe(true);
    expect(named.is('in-scope', named.idOf(N + 'Locomotive'))).toBe(false);
    const broad = buildHierarchyGraph([source(statements)], testRoleMap(), { prefixes: ['http://www.w3.org/'], roots: [] });
    expect(broad.is('in-scope', broad.idOf(RDFS_CLASS))).toBe(false);
    expect(broad.is('in-scope', broad.idOf(OWL_CLASS))).toBe(false);
  });

  it('ignores owl:deprecated when the role map does not read it', () => {
    const graph = buildHierarchyGraph([source(statements)], testRoleMap({ readsDeprecated: false }), noScope);
    expect(graph.idOf(N + 'SteamEngine')).toBe(-1);
    expect(graph.is('deprecated', graph.idOf(N + 'Coach'))).toBe(false);
  });
});

describe('OWL axiom structures', () => {
  const prefixes = `@prefix owl: <http://www.w3.org/2002/07/owl#> .
@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix nv: <${N}> .
`;

  it('reads owl:AllDisjointClasses with a 3-member list as 3 disjoint pairs, evidenced by owl:members', () => {
    // Shape of AllDisjointClasses in the OWL 2 Mapping to RDF Graphs, Table 1 (from memory); n3 builds the list.
    const turtle = `${prefixes}[] a owl:AllDisjointClasses ; owl:members ( nv:Locomotive nv:Wagon nv:Coach ) .\n`;
    const loaded = parseTurtle(turtle, 'disjoint.ttl');
    const graph = buildHierarchyGraph([loaded], testRoleMap(), noScope);
    const [locomotive, wagon, coach] = idsOf(graph, 'Locomotive', 'Wagon', 'Coach');
    const members = loaded.statements.find((s) => s.predicate.endsWith('#members'));
    for (const [a, b] of [[locomotive, wagon], [locomotive, coach], [wagon, coach]]) {
      expect(graph.hasEdge('disjoint-with', a, b)).toBe(true);
      expect(graph.hasEdge('disjoint-with', b, a)).toBe(true);
      expect(graph.edgeStatements('disjoint-with', a, b)).toEqual([members]);
    }
    expect(graph.stats.edges['disjoint-with']).toBe(3);
    // The axiom node and its list cells are not nodes; all 8 statements are read as axiom.
    expect(graph.nodeCount).toBe(3);
    expect(graph.stats.axiomStatements).toBe(loaded.statements.length);
    expect(loaded.statements.length).toBe(8);
    expect(graph.stats.skippedRoleStatements).toBe(1);
  });

  it('adds no disjoint pairs when the role map does not read AllDisjointClasses', () => {
    const turtle = `${prefixes}[] a owl:AllDisjointClasses ; owl:members ( nv:Locomotive nv:Wagon ) .\n`;
    const graph = buildHierarchyGraph([parseTurtle(turtle, 'disjoint.ttl')], testRoleMap({ readsAllDisjointClasses: false }), noScope);
    expect(graph.stats.edges['disjoint-with']).toBe(0);
    expect(graph.nodeCount).toBe(0);
  });

  it('skips and counts a cyclic or unterminated member list instead of failing', () => {
    const turtle = `${prefixes}@prefix rdf: <http://www.w3.org/1999/02/22-rdf-syntax-ns#> .
_:loop a owl:AllDisjointClasses ; owl:members _:cell1 .
_:cell1 rdf:first nv:Locomotive ; rdf:rest _:cell2 .
_:cell2 rdf:first nv:Wagon ; rdf:rest _:cell1 .
_:open a owl:AllDisjointClasses ; owl:members _:cell3 .
_:cell3 rdf:first nv:Coach ; rdf:rest _:cell4 .
_:cell4 rdf:first nv:Tender .
_:fine a owl:AllDisjointClasses ; owl:members ( nv:Signal nv:Points ) .
`;
    const graph = buildHierarchyGraph([parseTurtle(turtle, 'broken.ttl')], testRoleMap(), noScope);
    expect(graph.stats.brokenLists).toBe(2);
    expect(graph.problems!.map((problem) => problem.message)).toEqual([
      expect.stringContaining('loops back'),
      expect.stringContaining('has no rdf:rest'),
    ]);
    expect(graph.problems!.every((problem) => problem.file === 'broken.ttl' && problem.line > 0 && problem.hint)).toBe(true);
    expect(graph.stats.edges['disjoint-with']).toBe(1);
    expect(graph.hasEdge('disjoint-with', graph.idOf(N + 'Signal'), graph.idOf(N + 'Points'))).toBe(true);
    expect(graph.idOf(N + 'Locomotive')).toBe(-1);
  });

  it('reads restrictions and class expressions as axioms, skipping role statements that end in them', () => {
    const turtle = `${prefixes}nv:Pantograph rdfs:subClassOf nv:Equipment ,
    [ a owl:Restriction ; owl:onProperty nv:mountedOn ; owl:someValuesFrom nv:Roof ] .
nv:Traction owl:equivalentClass [ owl:unionOf ( nv:Electric nv:Diesel ) ] .
`;
    const loaded = parseTurtle(turtle, 'axioms.ttl');
    const graph = buildHierarchyGraph([loaded], testRoleMap(), noScope);
    expect(graph.stats.edges['subclass-of']).toBe(1);
    expect(graph.stats.edges['equivalent-to']).toBe(0);
    expect(graph.stats.edges['instance-of']).toBe(0);
    // Skipped: subClassOf [restriction], rdf:type owl:Restriction, equivalentClass [union].
    expect(graph.stats.skippedRoleStatements).toBe(3);
    expect(graph.idOf(N + 'Roof')).toBe(-1);
    expect(graph.idOf(N + 'Traction')).toBe(-1);
    expect(graph.stats.axiomStatements).toBe(loaded.statements.length - 1);
  });
});

describe('names and first statements', () => {
  it('shortens with the longest declared prefix whose local part is simple, else <IRI>', () => {
    const statements = [
      statement(N + 'Bogie', RDFS_SUBCLASS_OF, N + 'stock/Frame', { line: 1 }),
      statement(N + 'Odd.', RDFS_SUBCLASS_OF, N + 'has space', { line: 2 }),
      statement('_:yard', DCTERMS_IS_PART_OF, 'urn:x-northvale:depot', { line: 3 }),
    ];
    const prefixes = { nv: N, stock: N + 'stock/', rdfs: RDFS_NAMESPACE };
    const graph = buildHierarchyGraph([source(statements, prefixes)], testRoleMap(), noScope);
    const name = (term: string): string => graph.displayName(graph.idOf(term));
    expect(name(N + 'Bogie')).toBe('nv:Bogie');
    expect(name(N + 'stock/Frame')).toBe('stock:Frame');
    expect(name(N + 'Odd.')).toBe(`<${N}Odd.>`);
    expect(name(N + 'has space')).toBe(`<${N}has space>`);
    expect(name('_:yard')).toBe('_:yard');
    expect(name('urn:x-northvale:depot')).toBe('<urn:x-northvale:depot>');
  });

  it('keeps the first binding of a prefix name, so a name never means two IRIs', () => {
    const a = source([statement(N + 'A', RDFS_SUBCLASS_OF, 'https://other.example/B', { line: 1 })], { x: N }, 'a.ttl');
    const b = source([], { x: 'https://other.example/' }, 'b.ttl');
    const graph = buildHierarchyGraph([a, b], testRoleMap(), noScope);
    expect(graph.displayName(graph.idOf(N + 'A'))).toBe('x:A');
    expect(graph.displayName(graph.idOf('https://other.example/B'))).toBe('<https://other.example/B>');
  });

  it('prefers a language-less or English label, and rdfs:label over skos:prefLabel', () => {
    const statements = [
      statement(N + 'Bogie', RDFS_SUBCLASS_OF, N + 'Assembly', { line: 1 }),
      statement(N + 'Bogie', RDFS_LABEL, literal('Drehgestell', 'de'), { line: 2 }),
      statement(N + 'Bogie', SKOS_PREF_LABEL, literal('bogie', 'en'), { line: 3 }),
      statement(N + 'Bogie', RDFS_LABEL, literal('Bogie', 'en-GB'), { line: 4 }),
      statement(N + 'Assembly', SKOS_PREF_LABEL, literal('assembly'), { line: 5 }),
    ];
    const graph = buildHierarchyGraph([source(statements)], testRoleMap(), noScope);
    expect(graph.label(graph.idOf(N + 'Bogie'))).toBe('Bogie');
    expect(graph.label(graph.idOf(N + 'Assembly'))).toBe('assembly');
    expect(graph.label(99)).toBeUndefined();
  });

  it('gives the first statement with the node as subject, else as object', () => {
    const mention = statement(N + 'Depot', N + 'operatedBy', N + 'Bogie', { line: 1 });
    const asObject = statement(N + 'Wheel', DCTERMS_IS_PART_OF, N + 'Bogie', { line: 2 });
    const asSubject = statement(N + 'Bogie', RDFS_SUBCLASS_OF, N + 'Assembly', { line: 3 });
    const graph = buildHierarchyGraph([source([mention, asObject, asSubject])], testRoleMap(), noScope);
    expect(graph.firstStatement(graph.idOf(N + 'Bogie'))).toBe(asSubject);
    expect(graph.firstStatement(graph.idOf(N + 'Assembly'))).toBe(asSubject);
    expect(graph.firstStatement(graph.idOf(N + 'Wheel'))).toBe(asObject);
    expect(graph.firstStatement(-1)).toBeUndefined();
  });

  it('gives a statement read before the term became a node as its first statement', () => {
    const label = statement(N + 'Bogie', RDFS_LABEL, literal('Bogie'), { line: 1 });
    const mention = statement(N + 'Depot', N + 'operatedBy', N + 'Assembly', { line: 2 });
    const kind = statement(N + 'Bogie', RDFS_SUBCLASS_OF, N + 'Assembly', { line: 3 });
    const graph = buildHierarchyGraph([source([label, mention, kind])], testRoleMap(), noScope);
    expect(graph.firstStatement(graph.idOf(N + 'Bogie'))).toBe(label);
    // Assembly is never a subject, so its first statement as object counts, though it was no node then.
    expect(graph.firstStatement(graph.idOf(N + 'Assembly'))).toBe(mention);
    expect(graph.label(graph.idOf(N + 'Bogie'))).toBe('Bogie');
  });

  it('numbers nodes in the order they become nodes, and gives terms that never do no id', () => {
    const statements = [
      statement(N + 'Depot', N + 'operatedBy', N + 'Yard', { line: 1 }),
      statement(N + 'Yard', RDFS_SUBCLASS_OF, N + 'Site', { line: 2 }),
      statement(N + 'Depot', RDFS_SUBCLASS_OF, N + 'Site', { line: 3 }),
      statement(N + 'Crew', N + 'operatedBy', N + 'Depot', { line: 4 }),
    ];
    const graph = buildHierarchyGraph([source(statements)], testRoleMap(), noScope);
    expect(idsOf(graph, 'Yard', 'Site', 'Depot')).toEqual([0, 1, 2]);
    expect(graph.idOf(N + 'Crew')).toBe(-1);
    expect(graph.nodeCount).toBe(3);
    expect(graph.term(2)).toBe(N + 'Depot');
  });

  it('gives empty neighbour lists to a node without edges of a role and to an unknown id', () => {
    const statements = [
      statement(N + 'Axle', RDFS_SUBCLASS_OF, N + 'Part', { line: 1 }),
      statement(N + 'Wheel', RDFS_SUBCLASS_OF, N + 'Part', { line: 2 }),
    ];
    const graph = buildHierarchyGraph([source(statements)], testRoleMap(), noScope);
    const [axle, part] = idsOf(graph, 'Axle', 'Part');
    expect(Array.from(graph.successors('subclass-of', axle))).toEqual([part]);
    expect(Array.from(graph.predecessors('subclass-of', part))).toEqual([0, 2]);
    expect(graph.successors('subclass-of', part).length).toBe(0);
    expect(graph.predecessors('part-of', axle).length).toBe(0);
    expect(graph.successors('subclass-of', 99).length).toBe(0);
    expect(graph.predecessors('subclass-of', -2).length).toBe(0);
  });
});

describe('a published vocabulary: the RDFS vocabulary in Turtle', () => {
  // Source: W3C rdf-schema repository ns/rdfs.ttl (copy in test/standards/w3c-rdf-schema), read by n3's parser.
  const rdfs = parseTurtle(readFileSync('test/standards/w3c-rdf-schema/rdfs.ttl', 'utf8'), 'rdfs.ttl');
  const graph = buildHierarchyGraph([rdfs], testRoleMap(), { prefixes: [RDFS_NAMESPACE], roots: [] });
  const id = (local: string): number => graph.idOf(RDFS_NAMESPACE + local);

  it('has rdfs:Datatype as both an instance and a subclass of rdfs:Class (RDF Schema 1.1, 2.4; from memory)', () => {
    expect(graph.hasEdge('instance-of', id('Datatype'), id('Class'))).toBe(true);
    expect(graph.hasEdge('subclass-of', id('Datatype'), id('Class'))).toBe(true);
    expect(graph.is('declared-class', id('Datatype'))).toBe(true);
  });

  it('counts every statement of the file and names terms with its own prefixes', () => {
    expect(graph.stats.statements).toBe(rdfs.statements.length);
    const subclassStatements = rdfs.statements.filter((s) => s.predicate === RDFS_SUBCLASS_OF).length;
    expect(graph.stats.roleStatements['subclass-of']).toBe(subclassStatements);
    expect(graph.stats.edges['subclass-of']).toBe(subclassStatements);
    expect(graph.displayName(id('Class'))).toBe('rdfs:Class');
    expect(graph.label(id('Class'))).toBe('Class');
    // rdfs:Resource is stated a class and in scope, as the RDFS prefix names its namespace.
    expect(graph.is('in-scope', id('Resource'))).toBe(true);
    expect(graph.is('class', id('Resource'))).toBe(true);
    expect(Array.from(graph.successors('subclass-of', id('Class')))).toEqual([id('Resource')]);
  });
});
