// Builds the HierarchyGraph from loaded statements: intern terms, read roles and axioms, pack CSR.
import type { InputError, Literal, LoadedSource } from '../load/statement.js';
import { ROLES, SYMMETRIC_ROLES, type PredicateMapping, type Role, type RoleMap } from '../roles/role.js';
import {
  OWL_DEPRECATED,
  OWL_MEMBERS,
  RDF_TYPE,
  RDFS_LABEL,
  SKOS_PREF_LABEL,
  XSD_BOOLEAN,
  XSD_STRING,
} from '../roles/vocabulary.js';
import type { GraphStats, HierarchyGraph, ScopeOptions } from './hierarchy-graph.js';
import { BuiltHierarchyGraph, KIND_BITS, distinctEdgeCount } from './built-graph.js';
import { EdgeCollector, buildAdjacency, type RoleAdjacency } from './csr.js';
import { PrefixTable } from './display.js';
import type { TermInterner } from './interner.js';
import {
  type AxiomIndex,
  indexAxioms,
  BLANK_START,
  isAllDisjointClasses,
  isBlankSubject,
  isStructure,
  walkList,
} from './owl-axioms.js';
import { inScopeTermTest } from './scope.js';
import { tabulateStatements, type StatementTable } from './statement-table.js';

/** Lexical forms of a true owl:deprecated (xsd:boolean allows "true" and "1", XSD 1.1 Part 2; from memory). */
const TRUE_FORMS: ReadonlySet<string> = new Set(['true', '1']);

/** Whether a literal is a true boolean: `"true"^^xsd:boolean`, `"true"`, `"1"`. */
export function isTrueLiteral(object: Literal | undefined): boolean {
  if (object === undefined) return false;
  const plain = object.datatype === XSD_STRING || object.datatype === '';
  return (plain || object.datatype === XSD_BOOLEAN) && TRUE_FORMS.has(object.value.trim());
}

/** A label candidate's rank, lower is better: a language-less or English label first, rdfs:label before skos:prefLabel. */
export function labelRank(predicate: string, literalLanguage: string): number {
  const language = literalLanguage.toLowerCase();
  const preferredLanguage = language === '' || language === 'en' || language.startsWith('en-');
  return (preferredLanguage ? 0 : 2) + (predicate === RDFS_LABEL ? 0 : 1);
}

function emptyRoleCounts(): Record<Role, number> {
  return Object.fromEntries(ROLES.map((role) => [role, 0])) as Record<Role, number>;
}

/** What one distinct predicate means to the reader, worked out once instead of per statement. */
interface PredicateFacts {
  iri: string;
  mapping: PredicateMapping | undefined;
  /** The collector of the mapped role's edges. */
  collector: EdgeCollector | undefined;
  symmetric: boolean;
  isType: boolean;
  isMembers: boolean;
  isDeprecated: boolean;
  isLabel: boolean;
}

/** A term without a label, in the label columns. */
const NO_LABEL = -1;

/** Bits of the reader's per-term marks. */
const ROOT_TERM = 1;
const CLASS_TYPE_TERM = 2;

/** The second pass: reads every statement once, making terms nodes in the order they first play a part. */
class StatementReader {
  readonly collectors = Object.fromEntries(ROLES.map((role) => [role, new EdgeCollector()])) as Record<Role, EdgeCollector>;
  readonly declaredClasses: number[] = [];
  readonly deprecated: number[] = [];
  /** Literal number of the best label so far per term number (-1: none), and its rank (see labelRank). */
  readonly labelLiterals: Int32Array;
  readonly labelRanks: Int8Array;
  readonly problems: InputError[] = [];
  readonly roleStatements = emptyRoleCounts();
  axiomStatements = 0;
  skippedRoleStatements = 0;
  brokenLists = 0;
  private readonly predicateFacts: PredicateFacts[];
  private readonly termMarks: Uint8Array;

  constructor(
    private readonly table: StatementTable,
    private readonly axioms: AxiomIndex,
    private readonly roles: RoleMap,
    scope: ScopeOptions,
  ) {
    const { terms } = table;
    this.predicateFacts = table.predicateIris.map((iri) => this.factsOf(iri));
    this.termMarks = new Uint8Array(terms.termCount);
    this.labelLiterals = new Int32Array(terms.termCount).fill(NO_LABEL);
    this.labelRanks = new Int8Array(terms.termCount);
    for (const root of scope.roots) this.mark(root, ROOT_TERM);
    for (const classType of roles.classTypes) this.mark(classType, CLASS_TYPE_TERM);
  }

  /** Reads all statements in source order. */
  readAll(): void {
    for (let row = 0; row < this.table.rowCount; row++) this.read(row);
  }

  private factsOf(iri: string): PredicateFacts {
    const mapping = this.roles.get(iri);
    return {
      iri,
      mapping,
      collector: mapping === undefined ? undefined : this.collectors[mapping.role],
      symmetric: mapping !== undefined && SYMMETRIC_ROLES.has(mapping.role),
      isType: iri === RDF_TYPE,
      isMembers: iri === OWL_MEMBERS,
      isDeprecated: iri === OWL_DEPRECATED,
      isLabel: iri === RDFS_LABEL || iri === SKOS_PREF_LABEL,
    };
  }

  private mark(term: string, bit: number): void {
    const termNumber = this.table.terms.numberOf(term);
    if (termNumber >= 0) this.termMarks[termNumber] |= bit;
  }

  private read(row: number): void {
    const { terms } = this.table;
    const subject = this.table.subjects[row];
    const object = this.table.objects[row];
    const facts = this.predicateFacts[this.table.predicates[row]];
    const subjectIsAxiom = isStructure(this.axioms, subject);
    const objectIsAxiom = object >= 0 && isStructure(this.axioms, object);
    if (subjectIsAxiom || objectIsAxiom) this.axiomStatements++;
    if (subjectIsAxiom && facts.isMembers && isAllDisjointClasses(this.axioms, subject)) {
      if (this.roles.readsAllDisjointClasses) this.readDisjointMembers(row);
    }

    const { mapping, collector } = facts;
    if (mapping !== undefined && collector !== undefined) {
      if (object < 0) {
        this.skippedRoleStatements++;
        const statement = this.table.statement(row);
        this.problems.push({
          ...statement.position,
          message: `<${facts.iri}> (${mapping.role}) has a literal object "${(statement.object as Literal).value}", so it adds no edge`,
          hint: 'the object of a hierarchy predicate must be an IRI or a blank node; write <IRI> or a prefixed name, not a quoted string',
        });
      } else if (subjectIsAxiom || objectIsAxiom) {
        this.skippedRoleStatements++;
      } else {
        const from = terms.makeNode(subject);
        const to = terms.makeNode(object);
        if (mapping.inverse) this.addEdge(collector, facts.symmetric, to, from, row);
        else this.addEdge(collector, facts.symmetric, from, to, row);
        this.roleStatements[mapping.role]++;
      }
    }
    if (subjectIsAxiom) return;
    if (facts.isType && object >= 0 && (this.termMarks[object] & CLASS_TYPE_TERM) !== 0) {
      this.declaredClasses.push(terms.makeNode(subject));
    }
    if (facts.isDeprecated && this.roles.readsDeprecated && isTrueLiteral(this.table.literal(row))) {
      this.deprecated.push(terms.makeNode(subject));
    }
    if (facts.isLabel && object < 0) this.offerLabel(subject, facts.iri, -2 - object);
    if ((this.termMarks[subject] & ROOT_TERM) !== 0) terms.makeNode(subject);
    if (object >= 0 && !objectIsAxiom && (this.termMarks[object] & ROOT_TERM) !== 0) terms.makeNode(object);
  }

  /** Adds an edge; a symmetric role gets its mirror too, with the same statement. */
  private addEdge(collector: EdgeCollector, symmetric: boolean, from: number, to: number, statement: number): void {
    collector.add(from, to, statement);
    if (symmetric) collector.add(to, from, statement);
  }

  /** owl:AllDisjointClasses owl:members (...): every pair of distinct members is disjoint-with. */
  private readDisjointMembers(row: number): void {
    const { objects, terms } = this.table;
    const statement = this.table.statement(row);
    const walk = objects[row] >= 0
      ? walkList(objects[row], this.axioms, this.table, row)
      : { problem: 'owl:members has a literal object', statement: row };
    if ('problem' in walk) {
      this.brokenLists++;
      const where = this.table.statement(walk.statement).position;
      this.problems.push({
        ...where,
        message: `the owl:members list of owl:AllDisjointClasses ${statement.subject} cannot be read: ${walk.problem}; its disjointness is skipped`,
        hint: 'write the members as a Turtle collection, e.g. owl:members ( :A :B :C )',
      });
      return;
    }
    const members = [...new Set(walk.members)];
    // Class expressions among the members cannot be hierarchy nodes; their pairs are skipped.
    const named = members.filter((member) => !isStructure(this.axioms, member));
    if (named.length < members.length) this.skippedRoleStatements++;
    const ids = named.map((member) => terms.makeNode(member));
    const collector = this.collectors['disjoint-with'];
    const symmetric = SYMMETRIC_ROLES.has('disjoint-with');
    for (let left = 0; left < ids.length; left++) {
      for (let right = left + 1; right < ids.length; right++) this.addEdge(collector, symmetric, ids[left], ids[right], row);
    }
    if (ids.length > 1) this.roleStatements['disjoint-with']++;
  }

  /** Keeps literal k as the subject's label when it ranks better than the one kept so far; its text is made only when shown. */
  private offerLabel(subject: number, predicate: string, literal: number): void {
    const rank = labelRank(predicate, this.table.literalKind(literal).language);
    if (this.labelLiterals[subject] === NO_LABEL || rank < this.labelRanks[subject]) {
      this.labelLiterals[subject] = literal;
      this.labelRanks[subject] = rank;
    }
  }
}

/** Node kind flags from the packed adjacency and what the reader found. */
function nodeFlags(options: {
  reader: StatementReader;
  terms: TermInterner;
  adjacency: Record<Role, RoleAdjacency>;
  axioms: AxiomIndex;
  scope: ScopeOptions;
}): Uint8Array {
  const { reader, terms, adjacency, axioms, scope } = options;
  const flags = new Uint8Array(terms.size);
  for (const id of reader.declaredClasses) flags[id] |= KIND_BITS['declared-class'] | KIND_BITS.class;
  for (const id of reader.deprecated) flags[id] |= KIND_BITS.deprecated;
  for (const root of scope.roots) {
    const id = terms.idOf(root);
    if (id >= 0) flags[id] |= KIND_BITS.root;
  }
  const instanceOf = adjacency['instance-of'];
  const subclassOf = adjacency['subclass-of'];
  const inScope = inScopeTermTest(scope.prefixes, terms);
  for (let id = 0; id < flags.length; id++) {
    const isClass =
      instanceOf.reverseOffsets[id + 1] > instanceOf.reverseOffsets[id] ||
      subclassOf.offsets[id + 1] > subclassOf.offsets[id] ||
      subclassOf.reverseOffsets[id + 1] > subclassOf.reverseOffsets[id];
    if (isClass) flags[id] |= KIND_BITS.class;
    const hasType = instanceOf.offsets[id + 1] > instanceOf.offsets[id];
    if (hasType && (flags[id] & KIND_BITS.class) === 0) flags[id] |= KIND_BITS.individual;
    // Read from the term's bytes: making 3 million texts here would cost more than the rest of the loop.
    const termNumber = terms.numberOfNode(id);
    const blank = terms.termStartsWith(termNumber, BLANK_START);
    if (blank ? isBlankSubject(axioms, termNumber) : inScope(termNumber)) flags[id] |= KIND_BITS['in-scope'];
  }
  return flags;
}

/** Row of each node's first statement as subject, else as object (-1 when none). */
function firstStatements(table: StatementTable): Int32Array {
  const { terms, subjects, objects } = table;
  const asSubject = new Int32Array(terms.size).fill(-1);
  const asObject = new Int32Array(terms.size).fill(-1);
  for (let row = 0; row < subjects.length; row++) {
    const subjectId = terms.nodeOf(subjects[row]);
    if (subjectId >= 0 && asSubject[subjectId] < 0) asSubject[subjectId] = row;
    if (objects[row] >= 0) {
      const objectId = terms.nodeOf(objects[row]);
      if (objectId >= 0 && asObject[objectId] < 0) asObject[objectId] = row;
    }
  }
  for (let id = 0; id < asSubject.length; id++) if (asSubject[id] < 0) asSubject[id] = asObject[id];
  return asSubject;
}

/** Label literal numbers by node id (-1: none), from the reader's by term number. */
function nodeLabels(reader: StatementReader, terms: TermInterner): Int32Array {
  const labels = new Int32Array(terms.size).fill(NO_LABEL);
  for (let termNumber = 0; termNumber < reader.labelLiterals.length; termNumber++) {
    const id = terms.nodeOf(termNumber);
    if (id >= 0) labels[id] = reader.labelLiterals[termNumber];
  }
  return labels;
}

/**
 * Builds the hierarchy graph of a run. Counts in `stats`: `axiomStatements` are statements with an
 * axiom structure at either end; `skippedRoleStatements` are role statements that added no edge
 * (literal object, axiom structure end, or class expressions among owl:AllDisjointClasses members);
 * `brokenLists` are owl:AllDisjointClasses lists that could not be walked. Literal role objects and
 * broken lists are also listed in `problems` with their position and a hint.
 */
export function buildHierarchyGraph(sources: LoadedSource[], roles: RoleMap, scope: ScopeOptions): HierarchyGraph {
  const table = tabulateStatements(sources);
  const axioms = indexAxioms(table);
  const reader = new StatementReader(table, axioms, roles, scope);
  reader.readAll();

  const { terms } = table;
  const nodeCount = terms.size;
  const adjacency = Object.fromEntries(
    ROLES.map((role) => [role, buildAdjacency(nodeCount, reader.collectors[role])]),
  ) as Record<Role, RoleAdjacency>;
  const edges = emptyRoleCounts();
  for (const role of ROLES) edges[role] = distinctEdgeCount(role, adjacency[role]);
  const stats: GraphStats = {
    statements: sources.reduce((sum, source) => sum + (source.statementCount ?? source.statements.length), 0),
    roleStatements: reader.roleStatements,
    edges,
    axiomStatements: reader.axiomStatements,
    skippedRoleStatements: reader.skippedRoleStatements,
    brokenLists: reader.brokenLists,
    nodes: nodeCount,
  };
  return new BuiltHierarchyGraph({
    interner: terms,
    adjacency,
    flags: nodeFlags({ reader, terms, adjacency, axioms, scope }),
    firstStatements: firstStatements(table),
    labelLiterals: nodeLabels(reader, terms),
    literalValue: table.literalValue,
    statementAt: table.statement,
    prefixes: new PrefixTable(sources),
    stats,
    problems: reader.problems,
    inputs: { sources, table, axioms },
  });
}
