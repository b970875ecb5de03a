// Builds the HierarchyGraph from loaded statements: intern terms, read roles and axioms, pack CSR.
import type { InputError, Literal, LoadedSource, Statement } from '../load/statement.js';
import { ROLES, SYMMETRIC_ROLES, type Role, type RoleMap } from '../roles/role.js';
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
import { TermInterner } from './interner.js';
import { type AxiomIndex, indexAxioms, isBlank, walkList } from './owl-axioms.js';
import { inScopeTest } from './scope.js';

/** Lexical forms of a true owl:deprecated (xsd:boolean allows "true" and "1", XSD 1.1 Part 2; from memory). */
const TRUE_FORMS: ReadonlySet<string> = new Set(['true', '1']);

/** Whether a literal is a true boolean: `"true"^^xsd:boolean`, `"true"`, `"1"`. */
function isTrueLiteral(object: string | Literal): boolean {
  if (typeof object === 'string') return false;
  const plain = object.datatype === XSD_STRING || object.datatype === '';
  return (plain || object.datatype === XSD_BOOLEAN) && TRUE_FORMS.has(object.value.trim());
}

/** A label candidate's rank, lower is better: a language-less or English label first, rdfs:label before skos:prefLabel. */
function labelRank(predicate: string, literal: Literal): number {
  const language = literal.language.toLowerCase();
  const preferredLanguage = language === '' || language === 'en' || language.startsWith('en-');
  return (preferredLanguage ? 0 : 2) + (predicate === RDFS_LABEL ? 0 : 1);
}

function emptyRoleCounts(): Record<Role, number> {
  return Object.fromEntries(ROLES.map((role) => [role, 0])) as Record<Role, number>;
}

/** The second pass: reads every statement once, interning node terms in first-seen order. */
class StatementReader {
  readonly interner = new TermInterner();
  readonly collectors = Object.fromEntries(ROLES.map((role) => [role, new EdgeCollector()])) as Record<Role, EdgeCollector>;
  readonly declaredClasses: number[] = [];
  readonly deprecated: number[] = [];
  readonly labels = new Map<string, { value: string; rank: number }>();
  readonly problems: InputError[] = [];
  readonly roleStatements = emptyRoleCounts();
  axiomStatements = 0;
  skippedRoleStatements = 0;
  brokenLists = 0;
  private readonly roots: ReadonlySet<string>;

  constructor(
    private readonly statements: readonly Statement[],
    private readonly axioms: AxiomIndex,
    private readonly roles: RoleMap,
    scope: ScopeOptions,
  ) {
    this.roots = new Set(scope.roots);
  }

  /** Reads all statements in source order. */
  readAll(): void {
    for (let index = 0; index < this.statements.length; index++) this.read(index);
  }

  private read(index: number): void {
    const statement = this.statements[index];
    const { subject, predicate, object } = statement;
    const subjectIsAxiom = this.axioms.structures.has(subject);
    const objectIsAxiom = typeof object === 'string' && this.axioms.structures.has(object);
    if (subjectIsAxiom || objectIsAxiom) this.axiomStatements++;
    if (subjectIsAxiom && predicate === OWL_MEMBERS && this.axioms.allDisjointClasses.has(subject)) {
      if (this.roles.readsAllDisjointClasses) this.readDisjointMembers(index);
    }

    const mapping = this.roles.get(predicate);
    if (mapping !== undefined) {
      if (typeof object !== 'string') {
        this.skippedRoleStatements++;
        this.problems.push({
          ...statement.position,
          message: `<${predicate}> (${mapping.role}) has a literal object "${object.value}", so it adds no edge`,
          hint: 'the object of a hierarchy predicate must be an IRI or a blank node; write <IRI> or a prefixed name, not a quoted string',
        });
      } else if (subjectIsAxiom || objectIsAxiom) {
        this.skippedRoleStatements++;
      } else {
        const from = this.interner.intern(subject);
        const to = this.interner.intern(object);
        this.addEdge(mapping.role, mapping.inverse ? to : from, mapping.inverse ? from : to, index);
        this.roleStatements[mapping.role]++;
      }
    }
    if (subjectIsAxiom) return;
    if (predicate === RDF_TYPE && typeof object === 'string' && this.roles.classTypes.has(object)) {
      this.declaredClasses.push(this.interner.intern(subject));
    }
    if (predicate === OWL_DEPRECATED && this.roles.readsDeprecated && isTrueLiteral(object)) {
      this.deprecated.push(this.interner.intern(subject));
    }
    if ((predicate === RDFS_LABEL || predicate === SKOS_PREF_LABEL) && typeof object !== 'string') {
      this.offerLabel(subject, predicate, object);
    }
    if (this.roots.has(subject)) this.interner.intern(subject);
    if (typeof object === 'string' && !objectIsAxiom && this.roots.has(object)) this.interner.intern(object);
  }

  /** Adds an edge; a symmetric role gets its mirror too, with the same statement. */
  private addEdge(role: Role, from: number, to: number, statement: number): void {
    this.collectors[role].add(from, to, statement);
    if (SYMMETRIC_ROLES.has(role)) this.collectors[role].add(to, from, statement);
  }

  /** owl:AllDisjointClasses owl:members (...): every pair of distinct members is disjoint-with. */
  private readDisjointMembers(index: number): void {
    const statement = this.statements[index];
    const walk = typeof statement.object === 'string'
      ? walkList(statement.object, this.axioms, this.statements, index)
      : { problem: 'owl:members has a literal object', statement: index };
    if ('problem' in walk) {
      this.brokenLists++;
      const where = this.statements[walk.statement].position;
      this.problems.push({
        ...where,
        message: `the owl:members list of owl:AllDisjointClasses ${statement.subject} cannot be read: ${walk.problem}; its disjointness is skipped`,
        hint: 'write the members as a Turtle collection, e.g. owl:members ( :A :B :C )',
      });
      return;
    }
    const members = [...new Set(walk.members)];
    // Class expressions among the members cannot be hierarchy nodes; their pairs are skipped.
    const named = members.filter((member) => !this.axioms.structures.has(member));
    if (named.length < members.length) this.skippedRoleStatements++;
    const ids = named.map((member) => this.interner.intern(member));
    for (let left = 0; left < ids.length; left++) {
      for (let right = left + 1; right < ids.length; right++) this.addEdge('disjoint-with', ids[left], ids[right], index);
    }
    if (ids.length > 1) this.roleStatements['disjoint-with']++;
  }

  private offerLabel(subject: string, predicate: string, literal: Literal): void {
    const rank = labelRank(predicate, literal);
    const current = this.labels.get(subject);
    if (current === undefined || rank < current.rank) this.labels.set(subject, { value: literal.value, rank });
  }
}

/** Node kind flags from the packed adjacency and what the reader found. */
function nodeFlags(options: {
  reader: StatementReader;
  adjacency: Record<Role, RoleAdjacency>;
  axioms: AxiomIndex;
  scope: ScopeOptions;
}): Uint8Array {
  const { reader, adjacency, axioms, scope } = options;
  const { interner } = reader;
  const flags = new Uint8Array(interner.size);
  for (const id of reader.declaredClasses) flags[id] |= KIND_BITS['declared-class'] | KIND_BITS.class;
  for (const id of reader.deprecated) flags[id] |= KIND_BITS.deprecated;
  for (const root of scope.roots) {
    const id = interner.idOf(root);
    if (id >= 0) flags[id] |= KIND_BITS.root;
  }
  const instanceOf = adjacency['instance-of'];
  const subclassOf = adjacency['subclass-of'];
  const inScope = inScopeTest(scope.prefixes);
  for (let id = 0; id < flags.length; id++) {
    const isClass =
      instanceOf.reverseOffsets[id + 1] > instanceOf.reverseOffsets[id] ||
      subclassOf.offsets[id + 1] > subclassOf.offsets[id] ||
      subclassOf.reverseOffsets[id + 1] > subclassOf.reverseOffsets[id];
    if (isClass) flags[id] |= KIND_BITS.class;
    const hasType = instanceOf.offsets[id + 1] > instanceOf.offsets[id];
    if (hasType && (flags[id] & KIND_BITS.class) === 0) flags[id] |= KIND_BITS.individual;
    const term = interner.term(id);
    if (isBlank(term) ? axioms.blankSubjects.has(term) : inScope(term)) flags[id] |= KIND_BITS['in-scope'];
  }
  return flags;
}

/** Index of each node's first statement as subject, else as object (-1 when none). */
function firstStatements(interner: TermInterner, statements: readonly Statement[]): Int32Array {
  const asSubject = new Int32Array(interner.size).fill(-1);
  const asObject = new Int32Array(interner.size).fill(-1);
  for (let index = 0; index < statements.length; index++) {
    const { subject, object } = statements[index];
    const subjectId = interner.idOf(subject);
    if (subjectId >= 0 && asSubject[subjectId] < 0) asSubject[subjectId] = index;
    if (typeof object === 'string') {
      const objectId = interner.idOf(object);
      if (objectId >= 0 && asObject[objectId] < 0) asObject[objectId] = index;
    }
  }
  for (let id = 0; id < asSubject.length; id++) if (asSubject[id] < 0) asSubject[id] = asObject[id];
  return asSubject;
}

/**
 * Builds the hierarchy graph of a run. Counts in `stats`: `axiomStatements` are statements with an
 * axiom structure at either end; `skippedRoleStatements` are role statements that added no edge
 * (literal object, axiom structure end, or class expressions among owl:AllDisjointClasses members);
 * `brokenLists` are owl:AllDisjointClasses lists that could not be walked. Literal role objects and
 * broken lists are also listed in `problems` with their position and a hint.
 */
export function buildHierarchyGraph(sources: LoadedSource[], roles: RoleMap, scope: ScopeOptions): HierarchyGraph {
  const statements: Statement[] = [];
  for (const source of sources) for (const statement of source.statements) statements.push(statement);
  const axioms = indexAxioms(statements);
  const reader = new StatementReader(statements, axioms, roles, scope);
  reader.readAll();

  const nodeCount = reader.interner.size;
  const adjacency = Object.fromEntries(
    ROLES.map((role) => [role, buildAdjacency(nodeCount, reader.collectors[role])]),
  ) as Record<Role, RoleAdjacency>;
  const labels = new Map<number, string>();
  for (const [term, { value }] of reader.labels) {
    const id = reader.interner.idOf(term);
    if (id >= 0) labels.set(id, value);
  }
  const edges = emptyRoleCounts();
  for (const role of ROLES) edges[role] = distinctEdgeCount(role, adjacency[role]);
  const stats: GraphStats = {
    statements: statements.length,
    roleStatements: reader.roleStatements,
    edges,
    axiomStatements: reader.axiomStatements,
    skippedRoleStatements: reader.skippedRoleStatements,
    brokenLists: reader.brokenLists,
    nodes: nodeCount,
  };
  return new BuiltHierarchyGraph({
    interner: reader.interner,
    adjacency,
    flags: nodeFlags({ reader, adjacency, axioms, scope }),
    firstStatements: firstStatements(reader.interner, statements),
    labels,
    statements,
    prefixes: new PrefixTable(sources),
    stats,
    problems: reader.problems,
  });
}
