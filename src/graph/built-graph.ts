// The HierarchyGraph implementation: read-only views over the interned, CSR-packed parts the builder made.
import type { InputError, Statement } from '../load/statement.js';
import { SYMMETRIC_ROLES, type Role } from '../roles/role.js';
import type { GraphStats, HierarchyGraph, NodeKind } from './hierarchy-graph.js';
import { findEdge, type RoleAdjacency } from './csr.js';
import type { PrefixTable } from './display.js';
import type { TermInterner } from './interner.js';

/** The bit of each node kind in the node flag bytes. */
export const KIND_BITS: Readonly<Record<NodeKind, number>> = {
  class: 1,
  individual: 2,
  'declared-class': 4,
  deprecated: 8,
  root: 16,
  'in-scope': 32,
};

/** The neighbour list of a node without edges of a role; empty, so it cannot be modified. */
const NO_NEIGHBOURS = new Int32Array(0);

/** Everything the builder hands over; nothing of it changes afterwards. */
export interface GraphParts {
  interner: TermInterner;
  adjacency: Record<Role, RoleAdjacency>;
  /** KIND_BITS per node. */
  flags: Uint8Array;
  /** Index into `statements` of the node's first statement, or -1. */
  firstStatements: Int32Array;
  /** The literal number of each node's label, -1 when none was stated. */
  labelLiterals: Int32Array;
  /** The lexical form of a literal number. */
  literalValue: (literal: number) => string;
  /** The statement of a row of the run's statement table; evidence indices are such rows. */
  statementAt: (row: number) => Statement;
  prefixes: PrefixTable;
  stats: GraphStats;
  problems: InputError[];
}

/** A built hierarchy graph. */
export class BuiltHierarchyGraph implements HierarchyGraph {
  readonly nodeCount: number;
  readonly stats: GraphStats;
  readonly problems: readonly InputError[];

  /** Wraps the builder's parts. */
  constructor(private readonly parts: GraphParts) {
    this.nodeCount = parts.interner.size;
    this.stats = parts.stats;
    this.problems = parts.problems;
  }

  /** The IRI or `_:label` of a node. */
  term(id: number): string {
    return this.parts.interner.term(id);
  }

  /** The id of an IRI or `_:label`, or -1. */
  idOf(term: string): number {
    return this.parts.interner.idOf(term);
  }

  /** Targets of the node's outgoing edges of a role, ascending (empty for a node without such edges or an unknown id). */
  successors(role: Role, id: number): Int32Array {
    const { offsets, targets } = this.parts.adjacency[role];
    return neighbourView(targets, offsets[id], offsets[id + 1]);
  }

  /** Sources of the node's incoming edges of a role, ascending (empty for a node without such edges or an unknown id). */
  predecessors(role: Role, id: number): Int32Array {
    const { reverseOffsets, reverseSources } = this.parts.adjacency[role];
    return neighbourView(reverseSources, reverseOffsets[id], reverseOffsets[id + 1]);
  }

  /** Whether the edge from → to of the role exists. */
  hasEdge(role: Role, from: number, to: number): boolean {
    return this.validId(from) && this.validId(to) && findEdge(this.parts.adjacency[role], from, to) >= 0;
  }

  /** The statements that stated the edge; a symmetric edge stores both directions' statements on each. */
  edgeStatements(role: Role, from: number, to: number): Statement[] {
    if (!this.validId(from) || !this.validId(to)) return [];
    const adjacency = this.parts.adjacency[role];
    const edge = findEdge(adjacency, from, to);
    if (edge < 0) return [];
    const found: Statement[] = [];
    for (let index = adjacency.evidenceOffsets[edge]; index < adjacency.evidenceOffsets[edge + 1]; index++) {
      found.push(this.parts.statementAt(adjacency.evidence[index]));
    }
    return found;
  }

  /** Whether the node is of a kind. */
  is(kind: NodeKind, id: number): boolean {
    return this.validId(id) && (this.parts.flags[id] & KIND_BITS[kind]) !== 0;
  }

  /** The first statement with the node as subject, else as object. */
  firstStatement(id: number): Statement | undefined {
    if (!this.validId(id)) return undefined;
    const index = this.parts.firstStatements[id];
    return index < 0 ? undefined : this.parts.statementAt(index);
  }

  /** A prefixed name when a declared prefix fits, else `<IRI>` or `_:label`. */
  displayName(id: number): string {
    return this.parts.prefixes.shorten(this.term(id));
  }

  /** The node's rdfs:label or skos:prefLabel, when stated. */
  label(id: number): string | undefined {
    if (!this.validId(id)) return undefined;
    const literal = this.parts.labelLiterals[id];
    return literal < 0 ? undefined : this.parts.literalValue(literal);
  }

  private validId(id: number): boolean {
    return Number.isInteger(id) && id >= 0 && id < this.nodeCount;
  }
}

/**
 * The part start..end of a neighbour column. Nodes without neighbours share one empty view, since
 * making a view costs more than the lookup; an unknown id has undefined ends and gets it too.
 */
function neighbourView(column: Int32Array, start: number, end: number): Int32Array {
  return start === end ? NO_NEIGHBOURS : column.subarray(start, end);
}

/** Distinct edges of a role's adjacency; a symmetric edge and its mirror count once. */
export function distinctEdgeCount(role: Role, adjacency: RoleAdjacency): number {
  const stored = adjacency.targets.length;
  if (!SYMMETRIC_ROLES.has(role)) return stored;
  return (stored - adjacency.selfLoops) / 2 + adjacency.selfLoops;
}
