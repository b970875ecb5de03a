// DELETE/INSERT … WHERE evaluated by isapart, held to a general-purpose SPARQL 1.1 engine: the npm oxigraph store runs the same update on the same statements.
import fc from 'fast-check';
import { DataFactory } from 'n3';
import { isomorphic } from 'rdf-isomorphic';
import oxigraph from 'oxigraph';
import { describe, expect, it } from 'vitest';
import { applySparqlEdit } from '../../src/edit/apply-sparql-edit.js';
import { statementKey } from '../../src/edit/delta.js';
import { readSparqlEdit } from '../../src/edit/sparql-edit.js';
import type { EditDelta } from '../../src/edit/delta.js';
import type { InputError, LoadedSource, Statement } from '../../src/load/statement.js';

/** The delta, or the refusal as a thrown error (the test's updates are all evaluated). */
function deltaOf(applied: EditDelta | { error: InputError }): EditDelta {
  if ('error' in applied) throw new Error(applied.error.message);
  return applied;
}

const NV = 'https://data.northvale-rail.example/def/';
const RDF_TYPE = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#type';
const SUBCLASS = 'http://www.w3.org/2000/01/rdf-schema#subClassOf';
const LABEL = 'http://www.w3.org/2000/01/rdf-schema#label';
const PART_OF = `${NV}partOf`;
const NOTE = `${NV}note`;
const XSD_STRING = 'http://www.w3.org/2001/XMLSchema#string';
// The predicates this test's runs keep; nv:note is read by no role, so an edit's nv:note statements are ignored.
const KEPT = new Set([RDF_TYPE, SUBCLASS, LABEL, PART_OF]);
const GRAPHS = ['', `${NV}g1`, `${NV}g2`];
const NODES = ['Car', 'Bogie', 'Wheelset', 'Axle', 'Brake', 'Unit'].map((name) => `${NV}${name}`);

const PROLOGUE = 'PREFIX nv: <https://data.northvale-rail.example/def/>\nPREFIX rdfs: <http://www.w3.org/2000/01/rdf-schema#>\n';

/** The operations the random edits are made of; `$1`, `$2` stand for nodes chosen per edit. */
const OPERATIONS = [
  'DELETE { ?a rdfs:subClassOf ?b } INSERT { ?b rdfs:subClassOf ?a } WHERE { ?a rdfs:subClassOf ?b }',
  'DELETE WHERE { ?x nv:partOf ?y . ?y rdfs:subClassOf $1 }',
  'INSERT { ?x a ?c } WHERE { ?x nv:partOf ?y . ?y a ?c }',
  'WITH nv:g1 DELETE { ?a nv:partOf ?b } INSERT { GRAPH nv:g2 { ?a nv:partOf ?b } } WHERE { ?a nv:partOf ?b }',
  'DELETE { GRAPH ?g { ?a rdfs:subClassOf ?b } } WHERE { GRAPH ?g { ?a rdfs:subClassOf ?b . ?b rdfs:subClassOf ?c } }',
  'INSERT { ?a rdfs:subClassOf ?c } WHERE { VALUES (?a ?c) { ($1 $2) ($2 UNDEF) } ?a rdfs:subClassOf ?b . ?b rdfs:subClassOf ?c }',
  'INSERT DATA { $1 rdfs:subClassOf $2 . GRAPH nv:g1 { $2 nv:partOf $1 } }',
  'DELETE DATA { $1 rdfs:subClassOf $2 }',
  'DELETE WHERE { $1 rdfs:subClassOf ?x . ?x rdfs:subClassOf ?y }',
  'INSERT { ?a nv:partOf ?a } USING nv:g1 WHERE { ?a rdfs:subClassOf ?b . { ?b a ?c } }',
  'DELETE { ?x rdfs:subClassOf ?y } WHERE { ?x rdfs:subClassOf ?y . ?y rdfs:subClassOf ?x }',
  'INSERT { ?x rdfs:label "copy" ; nv:note "seen" } WHERE { ?x rdfs:label ?l }',
  'INSERT { ?b nv:partOf ?a } USING NAMED nv:g1 WHERE { GRAPH ?g { ?a nv:partOf ?b } }',
  'DELETE { ?x a ?c } INSERT { GRAPH ?g { ?x a ?c } } WHERE { ?x a ?c . GRAPH ?g { ?c rdfs:subClassOf ?d } }',
  'INSERT { ?x rdfs:subClassOf ?x } WHERE { ?x rdfs:subClassOf ?x }',
  'DELETE WHERE { GRAPH ?g { ?a nv:partOf ?b . ?b nv:partOf ?c } }',
  'INSERT { $1 rdfs:subClassOf $2 } WHERE {}',
  'DELETE { ?b nv:partOf ?c } WHERE { GRAPH nv:g1 { ?a rdfs:subClassOf ?b } ?b nv:partOf ?c }',
  'DELETE { ?a rdfs:subClassOf ?b } WHERE { ?a rdfs:subClassOf ?b FILTER(?a != ?b) }',
  'INSERT { ?a rdfs:subClassOf $1 } WHERE { ?a a ?c FILTER NOT EXISTS { ?a rdfs:subClassOf ?any } }',
  'DELETE { ?x nv:partOf ?y } WHERE { ?x nv:partOf ?y FILTER(?y IN ($1, $2) || sameTerm(?x, $1)) }',
  'INSERT { ?x rdfs:label "tagged" } WHERE { ?x rdfs:label ?l FILTER(?l = "Car" || ?l NOT IN ("Bogie", "Axle")) }',
  'DELETE { ?a nv:partOf ?b } WHERE { ?a nv:partOf ?b { ?b rdfs:subClassOf ?c FILTER(?a = ?c) } }',
  'DELETE { ?a rdfs:subClassOf ?b } WHERE { ?a rdfs:subClassOf ?b FILTER EXISTS { ?b rdfs:subClassOf ?c FILTER(?c != ?a) } }',
  'INSERT { ?a nv:partOf ?b } WHERE { ?a rdfs:subClassOf ?b FILTER(isIRI(?b) && !isLiteral(?a) && bound(?a) && !isBlank(?b)) }',
  'DELETE { ?x a ?c } WHERE { GRAPH ?g { ?x a ?c } FILTER(?g != nv:g1 && ?unbound != ?x || !bound(?unbound)) }',
];

const statementArbitrary = fc.record({
  subject: fc.constantFrom(...NODES),
  predicate: fc.constantFrom(RDF_TYPE, SUBCLASS, PART_OF, LABEL),
  object: fc.constantFrom(...NODES),
  graph: fc.constantFrom(...GRAPHS),
});
const editArbitrary = fc.array(
  fc.record({ operation: fc.nat(OPERATIONS.length - 1), first: fc.constantFrom(...NODES), second: fc.constantFrom(...NODES) }),
  { minLength: 1, maxLength: 3 },
);

type Drawn = { subject: string; predicate: string; object: string; graph: string };

function statementsOf(drawn: Drawn[]): Statement[] {
  return drawn.map((entry, index) => ({
    subject: entry.subject,
    predicate: entry.predicate,
    object: entry.predicate === LABEL ? { value: entry.object.slice(NV.length), datatype: XSD_STRING, language: '' } : entry.object,
    graph: entry.graph,
    position: { file: 'data.trig', line: index + 1, column: 1 },
    objectLine: index + 1,
  }));
}

function oxigraphTerm(term: Statement['object']): oxigraph.NamedNode | oxigraph.Literal {
  return typeof term === 'string' ? oxigraph.namedNode(term) : oxigraph.literal(term.value, oxigraph.namedNode(term.datatype));
}

/** The store's statements as keys, each with its graph ('' for the default graph). */
function storeKeys(store: oxigraph.Store): { kept: Set<string>; notes: number } {
  const kept = new Set<string>();
  let notes = 0;
  for (const quad of store.match()) {
    const object = quad.object.termType === 'Literal' ? { value: quad.object.value, datatype: quad.object.datatype.value, language: quad.object.language } : quad.object.value;
    const graph = quad.graph.termType === 'DefaultGraph' ? '' : quad.graph.value;
    if (quad.predicate.value === NOTE) notes += 1;
    else kept.add(statementKey({ subject: quad.subject.value, predicate: quad.predicate.value, object, graph }));
  }
  return { kept, notes };
}

function runBoth(drawn: Drawn[], edit: { operation: number; first: string; second: string }[]) {
  const statements = statementsOf(drawn);
  const text = PROLOGUE + edit.map((step) => OPERATIONS[step.operation].replaceAll('$1', `<${step.first}>`).replaceAll('$2', `<${step.second}>`)).join(' ;\n');

  const store = new oxigraph.Store();
  for (const statement of statements) {
    store.add(oxigraph.quad(oxigraph.namedNode(statement.subject), oxigraph.namedNode(statement.predicate), oxigraphTerm(statement.object), statement.graph === '' ? oxigraph.defaultGraph() : oxigraph.namedNode(statement.graph)));
  }
  store.update(text);
  const expected = storeKeys(store);

  const parsed = readSparqlEdit('edit.ru', text, { baseIri: 'file:///edits/edit.ru', keptPredicates: KEPT });
  if ('error' in parsed) throw new Error(`${parsed.error.message} (line ${parsed.error.line})`);
  const source: LoadedSource = { file: 'data.trig', format: 'trig', statements, errors: [], allowComments: [], prefixes: {} };
  const delta = deltaOf(applySparqlEdit(parsed, { sources: [source], keptPredicates: KEPT, blankNodePrefix: 'bedit_' }));
  const after = new Set(statements.map(statementKey));
  for (const statement of delta.removed) after.delete(statementKey(statement));
  for (const statement of delta.added) after.add(statementKey(statement));
  return { text, expected, after, delta };
}

describe('WHERE evaluation against oxigraph', () => {
  it('leaves the same statements as oxigraph after random sequences of DELETE/INSERT operations on random data', () => {
    fc.assert(
      fc.property(fc.array(statementArbitrary, { maxLength: 14 }), editArbitrary, (drawn, edit) => {
        const { expected, after, delta } = runBoth(drawn, edit);
        // oxigraph 0.5 (npm), a SPARQL 1.1 Update engine: the statements it holds after the update.
        expect([...after].sort()).toEqual([...expected.kept].sort());
        // The nv:note statements oxigraph inserted are the ones isapart ignores (no role reads nv:note).
        expect(delta.ignored > 0).toBe(expected.notes > 0);
      }),
      { numRuns: 400, seed: 21 },
    );
  });

  it('runs every operation at least once on data where its WHERE has solutions', () => {
    const rich: Drawn[] = [];
    for (const graph of GRAPHS) {
      NODES.forEach((node, index) => {
        const next = NODES[(index + 1) % NODES.length];
        rich.push({ subject: node, predicate: SUBCLASS, object: next, graph });
        rich.push({ subject: node, predicate: PART_OF, object: NODES[(index + 2) % NODES.length], graph });
        rich.push({ subject: node, predicate: RDF_TYPE, object: next, graph });
        rich.push({ subject: node, predicate: LABEL, object: node, graph });
      });
    }
    rich.push({ subject: NODES[0], predicate: SUBCLASS, object: NODES[0], graph: '' });
    // An instance with no superclass, for FILTER NOT EXISTS.
    rich.push({ subject: `${NV}depot-7`, predicate: RDF_TYPE, object: NODES[1], graph: '' });
    for (const [index, operation] of OPERATIONS.entries()) {
      const { text, expected, after, delta } = runBoth(rich, [{ operation: index, first: NODES[0], second: NODES[1] }]);
      expect([...after].sort(), text).toEqual([...expected.kept].sort());
      // Every operation changes something on this data, so the comparison is not of two empty changes, except the
      // FILTER in an inner group that names an outer variable: SPARQL 1.1 §18.2.2 evaluates the group on its own,
      // so ?a is unbound there and the FILTER keeps nothing (oxigraph agrees, above).
      const changes = delta.added.length + delta.removed.length;
      if (operation.includes('{ ?b rdfs:subClassOf ?c FILTER(?a = ?c) }')) expect(changes, text).toBe(0);
      else expect(changes, text).toBeGreaterThan(0);
    }
  });
});

describe('blank nodes an edit inserts', () => {
  const RDF = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#';
  const kept = new Set([...KEPT, `${RDF}first`, `${RDF}rest`]);
  const updates = [
    // Fresh nodes per INSERT DATA, a blank node property list and a collection.
    'INSERT DATA { nv:Car nv:partOf [ nv:partOf nv:Unit ] . _:kit rdfs:subClassOf nv:Car ; rdfs:label "kit" . nv:Unit rdfs:label ( "a" nv:Car ) }',
    // Fresh nodes per solution of a template (two solutions here, so two nodes).
    'INSERT { ?x nv:partOf _:assembly . _:assembly rdfs:subClassOf ?y } WHERE { ?x rdfs:subClassOf ?y }',
    // The same, then an operation that finds them.
    'INSERT { ?x nv:partOf _:assembly . _:assembly rdfs:subClassOf ?y } WHERE { ?x rdfs:subClassOf ?y } ;\nDELETE WHERE { ?a nv:partOf ?b . ?b rdfs:subClassOf nv:Bogie }',
    'INSERT DATA { _:a nv:partOf nv:Car } ;\nINSERT { ?b rdfs:subClassOf ?c } WHERE { ?b nv:partOf nv:Car . nv:Car rdfs:subClassOf ?c }',
  ];
  const data: Drawn[] = [
    { subject: NODES[0], predicate: SUBCLASS, object: NODES[1], graph: '' },
    { subject: NODES[2], predicate: SUBCLASS, object: NODES[1], graph: '' },
    { subject: NODES[3], predicate: PART_OF, object: NODES[0], graph: '' },
  ];
  const quadOf = (statement: Pick<Statement, 'subject' | 'predicate' | 'object' | 'graph'>) => {
    const node = (term: string) => (term.startsWith('_:') ? DataFactory.blankNode(term.slice(2)) : DataFactory.namedNode(term));
    const object = typeof statement.object === 'string' ? node(statement.object) : DataFactory.literal(statement.object.value, DataFactory.namedNode(statement.object.datatype));
    return DataFactory.quad(node(statement.subject), DataFactory.namedNode(statement.predicate), object, statement.graph === '' ? DataFactory.defaultGraph() : DataFactory.namedNode(statement.graph));
  };

  it.each(updates)('leaves a graph isomorphic to oxigraph\'s: %s', (update) => {
    const statements = statementsOf(data);
    const text = PROLOGUE + update;
    const store = new oxigraph.Store();
    for (const statement of statements) store.add(oxigraph.quad(oxigraph.namedNode(statement.subject), oxigraph.namedNode(statement.predicate), oxigraphTerm(statement.object), oxigraph.defaultGraph()));
    store.update(text);
    const parsed = readSparqlEdit('edit.ru', text, { baseIri: 'file:///edits/edit.ru', keptPredicates: kept });
    if ('error' in parsed) throw new Error(parsed.error.message);
    const source: LoadedSource = { file: 'data.ttl', format: 'turtle', statements, errors: [], allowComments: [], prefixes: {} };
    const delta = deltaOf(applySparqlEdit(parsed, { sources: [source], keptPredicates: kept, blankNodePrefix: 'bedit_' }));
    const after = new Map(statements.map((statement) => [statementKey(statement), statement]));
    for (const statement of delta.removed) after.delete(statementKey(statement));
    for (const statement of delta.added) after.set(statementKey(statement), statement);
    const ours = [...after.values()].map(quadOf);
    // oxigraph (npm) runs the update; rdf-isomorphic compares the graphs up to blank node names (RDF 1.1 Concepts §3.6 graph isomorphism).
    const theirs = [...store.match()];
    expect(ours.length).toBe(theirs.length);
    expect(isomorphic(ours, theirs as never)).toBe(true);
    // Each update inserts blank nodes (the second deletes them again), so blank nodes were compared or went through the index.
    expect([...delta.added, ...delta.removed].some((statement) => statement.subject.startsWith('_:') || String(statement.object).startsWith('_:'))).toBe(true);
  });
});
