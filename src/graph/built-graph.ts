// The HierarchyGraph implementation: read-only views over the interned, CSR-packed parts the builder made.
import type { InputError, LoadedSource, Statement } from '../load/statement.js';
import { SYMMETRIC_ROLES, type Role } from '../roles/role.js';
import type { GraphStats, HierarchyGraph, NodeKind } from './hierarchy-graph.js';
import { findEdge, type RoleAdjacency } from './csr.js';
import type { PrefixTable } from './display.js';
import type { TermInterner } from './interner.js';
import type { AxiomIndex } from './owl-axioms.js';
import type { StatementTable } from './statement-table.js';

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

/** What a graph was built from, kept so an edit can be applied to it without reading the data again. */
export interface BuildInputs {
  sources: readonly LoadedSource[];
  table: StatementTable;
  axioms: AxiomIndex;
}

/** Terms of nodes an edit made, after the interner's (ids interner.size and up). */
export interface AddedTerms {
  terms: readonly string[];
  ids: ReadonlyMap<string, number>;
}

/** Everything the builder hands over; nothing of it changes afterwards. */
export interface GraphParts {
  interner: TermInterner;
  /** Nodes an edit added after the interner's own (patched graphs only). */
  addedTerms?: AddedTerms;
  /** Per node, 1 when an edit removed every statement that made it a node (patched graphs only). */
  vanished?: Uint8Array;
  /** What the graph was built from (graphs made by buildHierarchyGraph only). */
  inputs?: BuildInputs;
  /** The sources with the edits applied so far, for a rebuild (patched graphs only). */
  editedSources?: () => LoadedSource[];
  adjacency: Record<Role, RoleAdjacency>;
  /** KIND_BITS per node. */
  flags: Uint8Array;
  /** Index into `statements` of the node's first statement, or -1. */
  firstStatements: Int32Array;
  /** The literal number of each node's label, -1 when none was stated. */
  labelLiterals: Int32Array;
  /** The lexical form of a literal number. */
  literalValue: (literal: number) => string;
  /** Labels an edit decided for the nodes it touched, undefined for none (patched graphs only); they win over `labelLiterals`. */
  editedLabels?: ReadonlyMap<number, string | undefined>;
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
  constructor(readonly parts: GraphParts) {
    this.nodeCount = parts.interner.size + (parts.addedTerms?.terms.length ?? 0);
    this.stats = parts.stats;
    this.problems = parts.problems;
  }

  /** The IRI or `_:label` of a node. */
  term(id: number): string {
    const { interner, addedTerms } = this.parts;
    return id < interner.size || addedTerms === undefined ? interner.term(id) : addedTerms.terms[id - interner.size];
  }

  /** The id of an IRI or `_:label`, or -1. */
  idOf(term: string): number {
    const id = this.parts.interner.idOf(term);
    return id >= 0 || this.parts.addedTerms === undefined ? id : (this.parts.addedTerms.ids.get(term) ?? -1);
  }

  /** Whether an edit removed every statement that made the node a node (its id stays, with no edges and no kinds). */
  vanished(id: number): boolean {
    return this.parts.vanished !== undefined && this.parts.vanished[id] === 1;
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
    const edited = this.parts.editedLabels;
    if (edited !== undefined && edited.has(id)) return edited.get(id);
    const literal = id < this.parts.labelLiterals.length ? this.parts.labelLiterals[id] : -1;
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
