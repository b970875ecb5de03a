// OWL axiom structures: which terms are axioms rather than hierarchy nodes, and walking RDF lists.
import type { Statement } from '../load/statement.js';
import {
  OWL_ALL_DIFFERENT,
  OWL_ALL_DISJOINT_CLASSES,
  OWL_AXIOM,
  OWL_COMPLEMENT_OF,
  OWL_INTERSECTION_OF,
  OWL_MEMBERS,
  OWL_NAMESPACE,
  OWL_ONE_OF,
  OWL_RESTRICTION,
  OWL_UNION_OF,
  RDF_FIRST,
  RDF_NIL,
  RDF_REST,
  RDF_TYPE,
} from '../roles/vocabulary.js';

/** owl:onProperty — the property a restriction is on (OWL 2 Mapping to RDF Graphs; from memory). */
const OWL_ON_PROPERTY = `${OWL_NAMESPACE}onProperty`;

/** Types that make any term, named or blank, an axiom structure (OWL 2 Mapping to RDF Graphs). */
const AXIOM_TYPES: ReadonlySet<string> = new Set([OWL_ALL_DISJOINT_CLASSES, OWL_ALL_DIFFERENT, OWL_AXIOM, OWL_RESTRICTION]);

/**
 * Predicates whose blank-node subject is an axiom structure. Only blank subjects count: an OWL 1
 * style `:C owl:unionOf (...)` on a named class keeps the named class in the hierarchy.
 */
const STRUCTURE_PREDICATES: ReadonlySet<string> = new Set([
  RDF_FIRST,
  RDF_REST,
  OWL_UNION_OF,
  OWL_INTERSECTION_OF,
  OWL_COMPLEMENT_OF,
  OWL_ONE_OF,
  OWL_MEMBERS,
  OWL_ON_PROPERTY,
]);

/** What the first pass over the statements found about axiom structures and lists. */
export interface AxiomIndex {
  /** Terms read as axiom structure, not as nodes. */
  structures: Set<string>;
  /** Terms typed owl:AllDisjointClasses. */
  allDisjointClasses: Set<string>;
  /** List node → index of its rdf:first statements (more than one makes the list broken). */
  listFirst: Map<string, number[]>;
  /** List node → index of its rdf:rest statements. */
  listRest: Map<string, number[]>;
  /** Blank nodes that are the subject of some statement (these are in scope). */
  blankSubjects: Set<string>;
}

/** Whether a term is a blank node label. */
export function isBlank(term: string): boolean {
  return term.startsWith('_:');
}

function append(map: Map<string, number[]>, key: string, value: number): void {
  const list = map.get(key);
  if (list === undefined) map.set(key, [value]);
  else list.push(value);
}

/** First pass: finds axiom structures, list cells and blank subjects in all statements. */
export function indexAxioms(statements: readonly Statement[]): AxiomIndex {
  const index: AxiomIndex = {
    structures: new Set(),
    allDisjointClasses: new Set(),
    listFirst: new Map(),
    listRest: new Map(),
    blankSubjects: new Set(),
  };
  for (let position = 0; position < statements.length; position++) {
    const { subject, predicate, object } = statements[position];
    const blank = isBlank(subject);
    if (blank) index.blankSubjects.add(subject);
    if (predicate === RDF_TYPE && typeof object === 'string' && AXIOM_TYPES.has(object)) {
      index.structures.add(subject);
      if (object === OWL_ALL_DISJOINT_CLASSES) index.allDisjointClasses.add(subject);
    } else if (STRUCTURE_PREDICATES.has(predicate) && blank) {
      index.structures.add(subject);
    }
    if (predicate === RDF_FIRST) append(index.listFirst, subject, position);
    else if (predicate === RDF_REST) append(index.listRest, subject, position);
  }
  return index;
}

/** A walked list: its members in order, or why it could not be read and at which statement. */
export type ListWalk = { members: string[] } | { problem: string; statement: number };

/**
 * The members of the RDF list starting at `head`, walked iteratively. A list that loops back on
 * itself, has a cell without exactly one rdf:first and one rdf:rest, a literal rest or a literal
 * member is reported as a problem instead.
 */
export function walkList(head: string, index: AxiomIndex, statements: readonly Statement[], origin: number): ListWalk {
  const members: string[] = [];
  const seen = new Set<string>();
  let cell = head;
  let cellStatement = origin;
  while (cell !== RDF_NIL) {
    if (seen.has(cell)) return { problem: `the list loops back to ${cell}`, statement: cellStatement };
    seen.add(cell);
    const firsts = index.listFirst.get(cell);
    const rests = index.listRest.get(cell);
    if (firsts === undefined || rests === undefined) {
      const missing = firsts === undefined ? 'rdf:first' : 'rdf:rest';
      return { problem: `list cell ${cell} has no ${missing}`, statement: cellStatement };
    }
    if (firsts.length > 1 || rests.length > 1) {
      return { problem: `list cell ${cell} has more than one rdf:first or rdf:rest`, statement: firsts[1] ?? rests[1] };
    }
    const member = statements[firsts[0]].object;
    if (typeof member !== 'string') return { problem: `list cell ${cell} has a literal member`, statement: firsts[0] };
    members.push(member);
    const rest = statements[rests[0]].object;
    if (typeof rest !== 'string') return { problem: `list cell ${cell} has a literal rdf:rest`, statement: rests[0] };
    cell = rest;
    cellStatement = rests[0];
  }
  return { members };
}
