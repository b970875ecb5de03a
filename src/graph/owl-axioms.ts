// OWL axiom structures: which terms are axioms rather than hierarchy nodes, and walking RDF lists.
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
import type { StatementTable } from './statement-table.js';

/** owl:onProperty — the property a restriction is on (OWL 2 Mapping to RDF Graphs; from memory). */
const OWL_ON_PROPERTY = `${OWL_NAMESPACE}onProperty`;

/** Types that make any term, named or blank, an axiom structure (OWL 2 Mapping to RDF Graphs). */
export const AXIOM_TYPES: ReadonlySet<string> = new Set([OWL_ALL_DISJOINT_CLASSES, OWL_ALL_DIFFERENT, OWL_AXIOM, OWL_RESTRICTION]);

/**
 * Predicates whose blank-node subject is an axiom structure. Only blank subjects count: an OWL 1
 * style `:C owl:unionOf (...)` on a named class keeps the named class in the hierarchy.
 */
export const STRUCTURE_PREDICATES: ReadonlySet<string> = new Set([
  RDF_FIRST,
  RDF_REST,
  OWL_UNION_OF,
  OWL_INTERSECTION_OF,
  OWL_COMPLEMENT_OF,
  OWL_ONE_OF,
  OWL_MEMBERS,
  OWL_ON_PROPERTY,
]);

/** Bits of `AxiomIndex.termFlags`. */
const STRUCTURE = 1;
const ALL_DISJOINT_CLASSES = 2;
const BLANK_SUBJECT = 4;

/** What the first pass over the statements found about axiom structures and lists, by term number. */
export interface AxiomIndex {
  /** Per term number: STRUCTURE, ALL_DISJOINT_CLASSES and BLANK_SUBJECT bits. */
  termFlags: Uint8Array;
  /** List node → rows of its rdf:first statements (more than one makes the list broken). */
  listFirst: Map<number, number[]>;
  /** List node → rows of its rdf:rest statements. */
  listRest: Map<number, number[]>;
}

/** The bytes every blank node's text starts with (see `isBlank`). */
export const BLANK_START = Buffer.from('_:', 'utf8');

/** Whether a term is a blank node label. */
export function isBlank(term: string): boolean {
  return term.startsWith('_:');
}

/** Whether a term is read as axiom structure, not as a node. */
export function isStructure(index: AxiomIndex, termNumber: number): boolean {
  return (index.termFlags[termNumber] & STRUCTURE) !== 0;
}

/** Whether a term is typed owl:AllDisjointClasses. */
export function isAllDisjointClasses(index: AxiomIndex, termNumber: number): boolean {
  return (index.termFlags[termNumber] & ALL_DISJOINT_CLASSES) !== 0;
}

/** Whether a term is a blank node that is the subject of some statement (these are in scope). */
export function isBlankSubject(index: AxiomIndex, termNumber: number): boolean {
  return (index.termFlags[termNumber] & BLANK_SUBJECT) !== 0;
}

function append(map: Map<number, number[]>, key: number, value: number): void {
  const list = map.get(key);
  if (list === undefined) map.set(key, [value]);
  else list.push(value);
}

/** The flags a predicate IRI can give its subject, worked out once per distinct predicate. */
interface PredicateKind {
  isType: boolean;
  isStructurePredicate: boolean;
  isFirst: boolean;
  isRest: boolean;
}

/** First pass: finds axiom structures, list cells and blank subjects in all statements. */
export function indexAxioms(table: StatementTable): AxiomIndex {
  const { terms, subjects, objects, predicates } = table;
  const index: AxiomIndex = { termFlags: new Uint8Array(terms.termCount), listFirst: new Map(), listRest: new Map() };
  const kinds: PredicateKind[] = table.predicateIris.map((iri) => ({
    isType: iri === RDF_TYPE,
    isStructurePredicate: STRUCTURE_PREDICATES.has(iri),
    isFirst: iri === RDF_FIRST,
    isRest: iri === RDF_REST,
  }));
  const axiomTypes = new Map<number, boolean>();
  for (const type of AXIOM_TYPES) {
    const termNumber = terms.numberOf(type);
    if (termNumber >= 0) axiomTypes.set(termNumber, type === OWL_ALL_DISJOINT_CLASSES);
  }
  const blankTerms = new Uint8Array(terms.termCount);
  for (let termNumber = 0; termNumber < blankTerms.length; termNumber++) {
    if (terms.termStartsWith(termNumber, BLANK_START)) blankTerms[termNumber] = 1;
  }
  // A blank node whose only statements were not kept is still a subject of the linted files.
  for (const subject of table.unkeptBlankSubjects) index.termFlags[subject] |= BLANK_SUBJECT;
  for (let row = 0; row < subjects.length; row++) {
    const subject = subjects[row];
    const object = objects[row];
    const kind = kinds[predicates[row]];
    const blank = blankTerms[subject] === 1;
    if (blank) index.termFlags[subject] |= BLANK_SUBJECT;
    const allDisjoint = kind.isType && object >= 0 ? axiomTypes.get(object) : undefined;
    if (allDisjoint !== undefined) {
      index.termFlags[subject] |= STRUCTURE;
      if (allDisjoint) index.termFlags[subject] |= ALL_DISJOINT_CLASSES;
    } else if (kind.isStructurePredicate && blank) {
      index.termFlags[subject] |= STRUCTURE;
    }
    if (kind.isFirst) append(index.listFirst, subject, row);
    else if (kind.isRest) append(index.listRest, subject, row);
  }
  return index;
}

/** A walked list: its members' term numbers in order, or why it could not be read and at which row. */
export type ListWalk = { members: number[] } | { problem: string; statement: number };

/**
 * The members of the RDF list starting at term `head`, walked iteratively. A list that loops back
 * on itself, has a cell without exactly one rdf:first and one rdf:rest, a literal rest or a literal
 * member is reported as a problem instead.
 */
export function walkList(head: number, index: AxiomIndex, table: StatementTable, origin: number): ListWalk {
  const { terms, objects } = table;
  const nil = terms.numberOf(RDF_NIL);
  const members: number[] = [];
  const seen = new Set<number>();
  let cell = head;
  let cellStatement = origin;
  while (cell !== nil) {
    const cellText = terms.text(cell);
    if (seen.has(cell)) return { problem: `the list loops back to ${cellText}`, statement: cellStatement };
    seen.add(cell);
    const firsts = index.listFirst.get(cell);
    const rests = index.listRest.get(cell);
    if (firsts === undefined || rests === undefined) {
      const missing = firsts === undefined ? 'rdf:first' : 'rdf:rest';
      return { problem: `list cell ${cellText} has no ${missing}`, statement: cellStatement };
    }
    if (firsts.length > 1 || rests.length > 1) {
      return { problem: `list cell ${cellText} has more than one rdf:first or rdf:rest`, statement: firsts[1] ?? rests[1] };
    }
    const member = objects[firsts[0]];
    if (member < 0) return { problem: `list cell ${cellText} has a literal member`, statement: firsts[0] };
    members.push(member);
    const rest = objects[rests[0]];
    if (rest < 0) return { problem: `list cell ${cellText} has a literal rdf:rest`, statement: rests[0] };
    cell = rest;
    cellStatement = rests[0];
  }
  return { members };
}
