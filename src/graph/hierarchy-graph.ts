// The read-only typed graph every rule runs on: interned node ids and per-role adjacency.
import type { InputError, Statement } from '../load/statement.js';
import type { Role } from '../roles/role.js';

/** Kinds a node can be of; `{is: [?x, KIND]}` in a rule tests one. */
export const NODE_KINDS = ['class', 'individual', 'declared-class', 'deprecated', 'root', 'in-scope'] as const;

/** One node kind. */
export type NodeKind = (typeof NODE_KINDS)[number];

/** Counts of what the build read, for the summary (nothing is dropped without being counted). */
export interface GraphStats {
  statements: number;
  /** Statements that became (or confirmed) a role edge, per role. */
  roleStatements: Record<Role, number>;
  /** Distinct edges per role (a symmetric edge counts once). */
  edges: Record<Role, number>;
  /** Statements read as OWL axiom structure (AllDisjointClasses, lists, class expressions). */
  axiomStatements: number;
  /** Role statements skipped because an end is a literal or an axiom structure. */
  skippedRoleStatements: number;
  /** owl:AllDisjointClasses member lists that could not be walked (cyclic, branching, unterminated). */
  brokenLists?: number;
  nodes: number;
}

/**
 * The hierarchy of one run. Node ids are 0..nodeCount-1; a node is an IRI or a blank node
 * (`_:label`). Edges are stored per role in the direction of design.md, deduplicated, each keeping
 * every statement that stated it. Built once; nothing mutates it afterwards.
 */
export interface HierarchyGraph {
  readonly nodeCount: number;
  readonly stats: GraphStats;
  /** Input the build could not read as stated (a literal object of a role predicate, a broken list), with position and hint. */
  readonly problems?: readonly InputError[];
  /** The IRI or `_:label` of a node. */
  term(id: number): string;
  /**
   * Whether the id belongs to a term that an applied edit stripped of every statement: ids never
   * change, so it stays, with no edges and no kinds, and node enumerations skip it. Absent: never.
   */
  vanished?(id: number): boolean;
  /** The id of an IRI or `_:label`, or -1 when the graph has no such node. */
  idOf(term: string): number;
  /** Targets of the node's outgoing edges of a role, ascending (a view: never modify it). */
  successors(role: Role, id: number): Int32Array;
  /** Sources of the node's incoming edges of a role, ascending (a view: never modify it). */
  predecessors(role: Role, id: number): Int32Array;
  /** Whether the edge from → to of the role exists. */
  hasEdge(role: Role, from: number, to: number): boolean;
  /** The statements that stated the edge (for a symmetric role, those of both directions). */
  edgeStatements(role: Role, from: number, to: number): Statement[];
  /** Whether the node is of a kind. */
  is(kind: NodeKind, id: number): boolean;
  /** The first statement with the node as subject (else as object), for findings with no edge. */
  firstStatement(id: number): Statement | undefined;
  /** A short name for messages: a prefixed name when a declared prefix fits, else `<IRI>` or `_:label`. */
  displayName(id: number): string;
  /** The node's rdfs:label or skos:prefLabel, when stated. */
  label(id: number): string | undefined;
}

/** What decides which nodes are in scope and which are roots. */
export interface ScopeOptions {
  /** In-scope IRI prefixes; empty means every IRI (but the RDF, RDFS, OWL, XSD, SKOS namespaces). */
  prefixes: string[];
  /** Classes allowed to have no superclass. */
  roots: string[];
}
