// Applies an edit to a built graph as a delta: ids kept, new terms appended, changed roles repacked.
import { editedSources, statementKey, type EditDelta } from '../edit/delta.js';
import type { InputError, Literal, LoadedSource, Statement } from '../load/statement.js';
import { ROLES, SYMMETRIC_ROLES, type Role, type RoleMap } from '../roles/role.js';
import { OWL_DEPRECATED, RDF_FIRST, RDF_TYPE, RDFS_LABEL, SKOS_PREF_LABEL } from '../roles/vocabulary.js';
import { buildHierarchyGraph, isTrueLiteral, labelRank } from './build.js';
import { BuiltHierarchyGraph, KIND_BITS, distinctEdgeCount, type GraphParts } from './built-graph.js';
import { EdgeCollector, findEdge, patchAdjacency, type RoleAdjacency } from './csr.js';
import type { GraphStats, HierarchyGraph, ScopeOptions } from './hierarchy-graph.js';
import { AXIOM_TYPES, STRUCTURE_PREDICATES, isBlank, isStructure } from './owl-axioms.js';
import { inScopeTest } from './scope.js';

/** One role's edge changes, as (from, to) id pairs; a symmetric edge is listed in both directions. */
export interface RoleEdgeChanges {
  added: [number, number][];
  removed: [number, number][];
  /** Edges in both graphs whose statements changed (their evidence differs). */
  restated: [number, number][];
}

/** What an edit changed in the graph, for the incremental rule run. */
export interface GraphChanges {
  /** True when the graph was rebuilt from the edited sources instead of patched; ids then differ from the old graph's. */
  rebuilt: boolean;
  /** Why the graph was rebuilt. */
  reason?: string;
  edges: Record<Role, RoleEdgeChanges>;
  /** Ids whose kind flags differ from the old graph's (added and vanished nodes included). */
  kinds: number[];
  /** Ids the edit made (from the old node count up). */
  addedNodes: number[];
  /** Old ids whose every statement the edit removed; they stay as ids with no edges and no kinds. */
  vanishedNodes: number[];
  /** Keys (statementKey) of the data's statements the edit removed. */
  removedStatements: ReadonlySet<string>;
  /** The old graph's statement objects the edit removed (evidence that no longer holds). */
  removedEvidence: ReadonlySet<Statement>;
}

/** The edited graph and what changed. */
export interface AppliedEdit {
  graph: HierarchyGraph;
  changes: GraphChanges;
}

function noEdgeChanges(): Record<Role, RoleEdgeChanges> {
  return Object.fromEntries(ROLES.map((role) => [role, { added: [], removed: [], restated: [] }])) as unknown as Record<Role, RoleEdgeChanges>;
}

/**
 * The graph with an edit applied, without reading or interning the data again: the old ids stay,
 * terms the edit brings are appended, the roles it touches are repacked from the old edges'
 * statements minus the removed ones plus the added ones (one O(V+E) pass per changed role), and
 * the kinds, first statements and labels of the touched nodes are worked out again. An edit that
 * touches OWL axiom structure, blank nodes or literal role objects, or a graph that was patched
 * already, is rebuilt from `editedSources` instead, with the reason in `changes`.
 */
export function applyEditToGraph(graph: HierarchyGraph, delta: EditDelta, roles: RoleMap, scope: ScopeOptions): AppliedEdit {
  if (!(graph instanceof BuiltHierarchyGraph)) throw new Error('an edit can be applied only to a graph made by buildHierarchyGraph');
  const { parts } = graph;
  if (parts.inputs === undefined) {
    return rebuild(parts, delta, roles, scope, 'the graph has an edit applied already, so it is rebuilt from the edited statements');
  }
  const reason = unpatchable(parts, delta, roles);
  if (reason !== undefined) return rebuild(parts, delta, roles, scope, reason);
  return new EditPatch(graph, delta, roles, scope).apply();
}

function rebuild(parts: GraphParts, delta: EditDelta, roles: RoleMap, scope: ScopeOptions, reason: string): AppliedEdit {
  const sources = parts.inputs?.sources ?? parts.editedSources?.() ?? [];
  const edited = editedSources(sources, delta);
  const rebuilt = buildHierarchyGraph(edited, roles, scope);
  if (rebuilt instanceof BuiltHierarchyGraph) rebuilt.parts.editedSources = () => edited;
  const changes: GraphChanges = {
    rebuilt: true,
    reason,
    edges: noEdgeChanges(),
    kinds: [],
    addedNodes: [],
    vanishedNodes: [],
    removedStatements: new Set(delta.removed.map(statementKey)),
    removedEvidence: new Set(),
  };
  return { graph: rebuilt, changes };
}

/** Why a delta cannot be patched in soundly, or undefined when it can. */
function unpatchable(parts: GraphParts, delta: EditDelta, roles: RoleMap): string | undefined {
  const { table, axioms } = parts.inputs as NonNullable<GraphParts['inputs']>;
  const structure = (term: string): boolean => {
    const termNumber = table.terms.numberOf(term);
    return termNumber >= 0 && isStructure(axioms, termNumber);
  };
  const check = (statement: Statement, removing: boolean): string | undefined => {
    const where = `${statement.position.file}:${statement.position.line}`;
    const object = statement.object;
    if (STRUCTURE_PREDICATES.has(statement.predicate) || (statement.predicate === RDF_TYPE && typeof object === 'string' && AXIOM_TYPES.has(object))) {
      return `the edit changes OWL axiom structure (<${statement.predicate}> at ${where}), so the graph is rebuilt`;
    }
    if (structure(statement.subject) || (typeof object === 'string' && structure(object))) {
      return `the edit names an OWL axiom structure (at ${where}), so the graph is rebuilt`;
    }
    if (isBlank(statement.subject) || (typeof object === 'string' && isBlank(object))) {
      return `the edit names a blank node (at ${where}), whose scope depends on every statement about it, so the graph is rebuilt`;
    }
    if (removing && typeof object !== 'string' && roles.get(statement.predicate) !== undefined) {
      return `the edit removes a role statement with a literal object (at ${where}), so the graph is rebuilt`;
    }
    return undefined;
  };
  for (const statement of delta.removed) {
    const found = check(statement, true);
    if (found !== undefined) return found;
  }
  for (const statement of delta.added) {
    const found = check(statement, false);
    if (found !== undefined) return found;
  }
  return undefined;
}

/** What the rescan of the old rows found for one touched term. */
interface TermFacts {
  firstAsSubject: number;
  firstAsObject: number;
  declared: boolean;
  deprecated: boolean;
  /** Appears in a kept row as subject or object (a root term is a node then). */
  present: boolean;
  /** Appears as an rdf:first object (a list member may be a node through an axiom). */
  listMember: boolean;
  label: string | undefined;
  labelRank: number;
}

/** One application of a delta to a built graph. */
class EditPatch {
  private readonly parts: GraphParts;
  private readonly inputs: NonNullable<GraphParts['inputs']>;
  private readonly oldCount: number;
  private readonly baseRow: number;
  private readonly addedTerms: string[] = [];
  private readonly addedIds = new Map<string, number>();
  /** Per role: raw edges the added statements state (from, to, row). */
  private readonly addedEdges = new Map<Role, EdgeCollector>();
  /** Per role: edges whose statements changed, as "from to" keys. */
  private readonly touchedEdges = new Map<Role, Map<string, [number, number]>>();
  private readonly removedRows = new Set<number>();
  private readonly removedKeys = new Set<string>();
  /** Term numbers (of the old table) to rescan, and ids of nodes whose kinds to recompute. */
  private readonly rescanTerms = new Set<number>();
  private readonly touchedNodes = new Set<number>();
  private readonly problems: InputError[] = [];
  private readonly roleStatements: Record<Role, number>;
  private skipped = 0;
  private readonly inScope: (iri: string) => boolean;
  private readonly rootTerms: ReadonlySet<string>;

  constructor(
    private readonly graph: BuiltHierarchyGraph,
    private readonly delta: EditDelta,
    private readonly roles: RoleMap,
    private readonly scope: ScopeOptions,
  ) {
    this.parts = graph.parts;
    this.inputs = graph.parts.inputs as NonNullable<GraphParts['inputs']>;
    this.oldCount = graph.nodeCount;
    this.baseRow = this.inputs.table.rowCount;
    this.roleStatements = { ...graph.stats.roleStatements };
    this.inScope = inScopeTest(scope.prefixes);
    this.rootTerms = new Set(scope.roots);
  }

  apply(): AppliedEdit {
    this.findRemovedRows();
    this.readRemovedRows();
    this.readAddedStatements();
    const nodeCount = this.oldCount + this.addedTerms.length;
    const adjacency = { ...this.parts.adjacency };
    for (const role of ROLES) {
      if (this.touchedEdges.has(role)) adjacency[role] = this.repack(role, nodeCount);
    }
    const edges = this.edgeChanges(adjacency);
    const facts = this.rescan();
    const flags = new Uint8Array(nodeCount);
    flags.set(this.parts.flags);
    const vanished = new Uint8Array(nodeCount);
    const firstStatements = new Int32Array(nodeCount).fill(-1);
    firstStatements.set(this.parts.firstStatements);
    const labels = new Map<number, string | undefined>(this.parts.editedLabels);
    const kinds: number[] = [];
    const vanishedNodes: number[] = [];
    const nodes = [...this.touchedNodes].sort((left, right) => left - right);
    for (const id of nodes) {
      const term = this.termOf(id);
      const found = facts.get(term);
      const added = this.addedFacts(term);
      const declared = (found?.declared ?? false) || added.declared;
      const deprecated = (found?.deprecated ?? false) || added.deprecated;
      const hasEdges = ROLES.some((role) => degree(adjacency[role], id, nodeCount) > 0);
      const root = this.rootTerms.has(term);
      const present = hasEdges || declared || deprecated || (root && ((found?.present ?? false) || added.present));
      if (!present && found?.listMember === true) {
        // An owl:AllDisjointClasses member is a node even without edges; an edit that leaves it only that is not guessed at.
        return rebuild(this.parts, this.delta, this.roles, this.scope, `the edit leaves ${term} only as a member of an RDF list, so the graph is rebuilt`);
      }
      let flag = 0;
      if (present) {
        const instanceOf = adjacency['instance-of'];
        const subclassOf = adjacency['subclass-of'];
        const isClass = declared || inDegree(instanceOf, id, nodeCount) > 0 || outDegree(subclassOf, id, nodeCount) > 0 || inDegree(subclassOf, id, nodeCount) > 0;
        if (declared) flag |= KIND_BITS['declared-class'];
        if (isClass) flag |= KIND_BITS.class;
        else if (outDegree(instanceOf, id, nodeCount) > 0) flag |= KIND_BITS.individual;
        if (deprecated) flag |= KIND_BITS.deprecated;
        if (root) flag |= KIND_BITS.root;
        if (this.inScope(term)) flag |= KIND_BITS['in-scope'];
      } else {
        vanished[id] = 1;
        vanishedNodes.push(id);
      }
      if (id >= this.oldCount || flag !== flags[id]) kinds.push(id);
      flags[id] = flag;
      firstStatements[id] = this.firstRow(found, added);
      let label = found?.label;
      if (added.label !== undefined && (label === undefined || added.labelRank < (found?.labelRank ?? 99))) label = added.label;
      labels.set(id, label);
    }
    const stats = this.stats(adjacency, nodeCount - vanishedNodes.length);
    const statementAt = (row: number): Statement => (row < this.baseRow ? this.inputs.table.statement(row) : this.delta.added[row - this.baseRow]);
    const sources = this.inputs.sources;
    const delta = this.delta;
    let edited: LoadedSource[] | undefined;
    const patched = new BuiltHierarchyGraph({
      interner: this.parts.interner,
      addedTerms: { terms: this.addedTerms, ids: this.addedIds },
      vanished,
      adjacency,
      flags,
      firstStatements,
      labelLiterals: this.parts.labelLiterals,
      literalValue: this.parts.literalValue,
      editedLabels: labels,
      statementAt,
      prefixes: this.parts.prefixes,
      stats,
      problems: [...this.parts.problems, ...this.problems],
      editedSources: () => (edited ??= editedSources(sources, delta)),
    });
    const addedNodes = this.addedTerms.map((_, index) => this.oldCount + index);
    const removedEvidence = new Set([...this.removedRows].map((row) => this.inputs.table.statement(row)));
    const changes: GraphChanges = { rebuilt: false, edges, kinds, addedNodes, vanishedNodes, removedStatements: this.removedKeys, removedEvidence };
    return { graph: patched, changes };
  }

  private termOf(id: number): string {
    return id < this.oldCount ? this.graph.term(id) : this.addedTerms[id - this.oldCount];
  }

  /** The id of a term, appending it as a new node when the old graph has none. */
  private node(term: string): number {
    let id = this.graph.idOf(term);
    if (id < 0) {
      id = this.addedIds.get(term) ?? -1;
      if (id < 0) {
        id = this.oldCount + this.addedTerms.length;
        this.addedTerms.push(term);
        this.addedIds.set(term, id);
        const termNumber = this.inputs.table.terms.numberOf(term);
        if (termNumber >= 0) this.rescanTerms.add(termNumber);
      }
    }
    this.touchedNodes.add(id);
    return id;
  }

  /** Marks an old term touched: its node (if any) has its kinds recomputed, its rows are rescanned. */
  private touchOld(term: string): void {
    const termNumber = this.inputs.table.terms.numberOf(term);
    if (termNumber >= 0) this.rescanTerms.add(termNumber);
    const id = this.graph.idOf(term);
    if (id >= 0) this.touchedNodes.add(id);
  }

  /** The rows of the old table that state a removed statement (one pass over integer columns). */
  private findRemovedRows(): void {
    const { table } = this.inputs;
    const wanted = new Set(this.delta.removed.map(statementKey));
    const subjects = new Uint8Array(table.terms.termCount);
    let any = false;
    for (const statement of this.delta.removed) {
      const termNumber = table.terms.numberOf(statement.subject);
      if (termNumber >= 0) {
        subjects[termNumber] = 1;
        any = true;
      }
    }
    if (!any) return;
    const predicates = new Uint8Array(table.predicateIris.length);
    const removedPredicates = new Set(this.delta.removed.map((statement) => statement.predicate));
    table.predicateIris.forEach((iri, index) => {
      if (removedPredicates.has(iri)) predicates[index] = 1;
    });
    for (let row = 0; row < table.rowCount; row++) {
      if (subjects[table.subjects[row]] === 0 || predicates[table.predicates[row]] === 0) continue;
      const key = statementKey(table.statement(row));
      if (wanted.has(key)) {
        this.removedRows.add(row);
        this.removedKeys.add(key);
      }
    }
  }

  private touchEdge(role: Role, from: number, to: number): void {
    let touched = this.touchedEdges.get(role);
    if (touched === undefined) this.touchedEdges.set(role, (touched = new Map()));
    touched.set(`${from} ${to}`, [from, to]);
    if (SYMMETRIC_ROLES.has(role)) touched.set(`${to} ${from}`, [to, from]);
  }

  /** Every removed row: the edge it stated, and the terms whose kinds, labels and first statements it bears on. */
  private readRemovedRows(): void {
    for (const row of this.removedRows) {
      const statement = this.inputs.table.statement(row);
      this.touchOld(statement.subject);
      if (typeof statement.object === 'string') this.touchOld(statement.object);
      const mapping = this.roles.get(statement.predicate);
      if (mapping === undefined || typeof statement.object !== 'string') continue;
      const subject = this.graph.idOf(statement.subject);
      const object = this.graph.idOf(statement.object);
      if (mapping.inverse) this.touchEdge(mapping.role, object, subject);
      else this.touchEdge(mapping.role, subject, object);
      this.roleStatements[mapping.role]--;
    }
  }

  /** Every added statement, as the builder's reader would take it, numbered after the old rows. */
  private readAddedStatements(): void {
    this.delta.added.forEach((statement, index) => {
      const row = this.baseRow + index;
      const { subject, predicate, object } = statement;
      this.touchOld(subject);
      if (typeof object === 'string') this.touchOld(object);
      const mapping = this.roles.get(predicate);
      if (mapping !== undefined) {
        if (typeof object !== 'string') {
          this.skipped++;
          this.problems.push({
            ...statement.position,
            message: `<${predicate}> (${mapping.role}) has a literal object "${object.value}", so it adds no edge`,
            hint: 'the object of a hierarchy predicate must be an IRI or a blank node; write <IRI> or a prefixed name, not a quoted string',
          });
        } else {
          const from = this.node(subject);
          const to = this.node(object);
          const [source, target] = mapping.inverse ? [to, from] : [from, to];
          let collector = this.addedEdges.get(mapping.role);
          if (collector === undefined) this.addedEdges.set(mapping.role, (collector = new EdgeCollector()));
          collector.add(source, target, row);
          if (SYMMETRIC_ROLES.has(mapping.role)) collector.add(target, source, row);
          this.touchEdge(mapping.role, source, target);
          this.roleStatements[mapping.role]++;
        }
      }
      if (predicate === RDF_TYPE && typeof object === 'string' && this.roles.classTypes.has(object)) this.node(subject);
      if (predicate === OWL_DEPRECATED && this.roles.readsDeprecated && isTrueLiteral(typeof object === 'string' ? undefined : object)) this.node(subject);
      if (this.rootTerms.has(subject)) this.node(subject);
      if (typeof object === 'string' && this.rootTerms.has(object)) this.node(object);
    });
  }

  /** A role's adjacency again: the old edges' statements that stay, then the added ones. */
  private repack(role: Role, nodeCount: number): RoleAdjacency {
    const touched = new Set<number>();
    for (const [from] of this.touchedEdges.get(role)?.values() ?? []) touched.add(from);
    return patchAdjacency(this.parts.adjacency[role], nodeCount, { removed: this.removedRows, added: this.addedEdges.get(role), touched });
  }

  /** Which touched edges the edit added, removed or restated. */
  private edgeChanges(adjacency: Record<Role, RoleAdjacency>): Record<Role, RoleEdgeChanges> {
    const changes = noEdgeChanges();
    for (const [role, touched] of this.touchedEdges) {
      const before = this.parts.adjacency[role];
      const after = adjacency[role];
      for (const [from, to] of touched.values()) {
        const had = from < this.oldCount && to < this.oldCount && findEdge(before, from, to) >= 0;
        const has = findEdge(after, from, to) >= 0;
        if (had && !has) changes[role].removed.push([from, to]);
        else if (!had && has) changes[role].added.push([from, to]);
        else if (had && has) changes[role].restated.push([from, to]);
      }
    }
    return changes;
  }

  /** One pass over the old rows that stay, for the touched terms: first statements, declarations, deprecation, labels, presence. */
  private rescan(): Map<string, TermFacts> {
    const { table } = this.inputs;
    const facts = new Map<string, TermFacts>();
    if (this.rescanTerms.size === 0) return facts;
    const marks = new Int32Array(table.terms.termCount).fill(-1);
    const byNumber: TermFacts[] = [];
    for (const termNumber of this.rescanTerms) {
      marks[termNumber] = byNumber.length;
      const fact: TermFacts = { firstAsSubject: -1, firstAsObject: -1, declared: false, deprecated: false, present: false, listMember: false, label: undefined, labelRank: 99 };
      byNumber.push(fact);
      facts.set(table.terms.text(termNumber), fact);
    }
    const kinds = table.predicateIris.map((iri) => ({
      type: iri === RDF_TYPE,
      deprecated: iri === OWL_DEPRECATED && this.roles.readsDeprecated,
      label: iri === RDFS_LABEL || iri === SKOS_PREF_LABEL,
      first: iri === RDF_FIRST,
      iri,
    }));
    const classTypes = new Int32Array(table.terms.termCount);
    for (const type of this.roles.classTypes) {
      const termNumber = table.terms.numberOf(type);
      if (termNumber >= 0) classTypes[termNumber] = 1;
    }
    const removed = this.removedRows;
    for (let row = 0; row < table.rowCount; row++) {
      const subjectMark = marks[table.subjects[row]];
      const object = table.objects[row];
      const objectMark = object >= 0 ? marks[object] : -1;
      if (subjectMark < 0 && objectMark < 0) continue;
      if (removed.has(row)) continue;
      const kind = kinds[table.predicates[row]];
      if (subjectMark >= 0) {
        const fact = byNumber[subjectMark];
        if (fact.firstAsSubject < 0) fact.firstAsSubject = row;
        fact.present = true;
        if (kind.type && object >= 0 && classTypes[object] === 1) fact.declared = true;
        if (kind.deprecated && isTrueLiteral(table.literal(row))) fact.deprecated = true;
        if (kind.label && object < 0) {
          const literal = table.literal(row) as Literal;
          const rank = labelRank(kind.iri, literal.language);
          if (fact.label === undefined || rank < fact.labelRank) {
            fact.label = literal.value;
            fact.labelRank = rank;
          }
        }
      }
      if (objectMark >= 0) {
        const fact = byNumber[objectMark];
        if (fact.firstAsObject < 0) fact.firstAsObject = row;
        fact.present = true;
        if (kind.first) fact.listMember = true;
      }
    }
    return facts;
  }

  /** The same facts from the added statements, for one term. */
  private addedFacts(term: string): TermFacts {
    const fact: TermFacts = { firstAsSubject: -1, firstAsObject: -1, declared: false, deprecated: false, present: false, listMember: false, label: undefined, labelRank: 99 };
    this.delta.added.forEach((statement, index) => {
      const row = this.baseRow + index;
      const { subject, predicate, object } = statement;
      if (subject === term) {
        if (fact.firstAsSubject < 0) fact.firstAsSubject = row;
        fact.present = true;
        if (predicate === RDF_TYPE && typeof object === 'string' && this.roles.classTypes.has(object)) fact.declared = true;
        if (predicate === OWL_DEPRECATED && this.roles.readsDeprecated && typeof object !== 'string' && isTrueLiteral(object)) fact.deprecated = true;
        if ((predicate === RDFS_LABEL || predicate === SKOS_PREF_LABEL) && typeof object !== 'string') {
          const rank = labelRank(predicate, object.language);
          if (fact.label === undefined || rank < fact.labelRank) {
            fact.label = object.value;
            fact.labelRank = rank;
          }
        }
      }
      if (object === term) {
        if (fact.firstAsObject < 0) fact.firstAsObject = row;
        fact.present = true;
      }
    });
    return fact;
  }

  /** The first statement with the node as subject (old rows first), else as object. */
  private firstRow(found: TermFacts | undefined, added: TermFacts): number {
    if (found !== undefined && found.firstAsSubject >= 0) return found.firstAsSubject;
    if (added.firstAsSubject >= 0) return added.firstAsSubject;
    if (found !== undefined && found.firstAsObject >= 0) return found.firstAsObject;
    return added.firstAsObject;
  }

  private stats(adjacency: Record<Role, RoleAdjacency>, nodes: number): GraphStats {
    const old = this.graph.stats;
    const edges = { ...old.edges };
    for (const role of ROLES) edges[role] = distinctEdgeCount(role, adjacency[role]);
    return {
      ...old,
      statements: old.statements - this.removedRows.size + this.delta.added.length,
      roleStatements: this.roleStatements,
      edges,
      skippedRoleStatements: old.skippedRoleStatements + this.skipped,
      nodes,
    };
  }
}

/** Out-degree in an adjacency that may have been packed for fewer nodes (a role the edit left alone). */
function outDegree(adjacency: RoleAdjacency, id: number, nodeCount: number): number {
  return id < nodeCount && id + 1 < adjacency.offsets.length ? adjacency.offsets[id + 1] - adjacency.offsets[id] : 0;
}

function inDegree(adjacency: RoleAdjacency, id: number, nodeCount: number): number {
  return id < nodeCount && id + 1 < adjacency.reverseOffsets.length ? adjacency.reverseOffsets[id + 1] - adjacency.reverseOffsets[id] : 0;
}

function degree(adjacency: RoleAdjacency, id: number, nodeCount: number): number {
  return outDegree(adjacency, id, nodeCount) + inDegree(adjacency, id, nodeCount);
}
