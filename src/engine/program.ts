// Compiles a validated rule definition to a program: variables as integer slots, paths parsed.
import { NODE_KINDS, type NodeKind } from '../graph/hierarchy-graph.js';
import { ROLES, type Role } from '../roles/role.js';
import { matchesEmpty, parseValidPath, type PathExpression } from './path.js';
import type { MatchEntry, RuleDefinition, Variable } from './rule.js';

/** One match entry with its variables replaced by slots (node slots, or a list slot for `cycle`). */
export type ProgramEntry =
  | { type: 'path'; subject: number; object: number; path: PathExpression; text: string }
  | { type: 'is'; slot: number; kind: NodeKind }
  | { type: 'not'; entries: ProgramEntry[] }
  | { type: 'differ'; left: number; right: number }
  | { type: 'cycle'; path: PathExpression; text: string; members: number }
  | { type: 'absent'; slot: number; path: PathExpression; text: string };

/** A reported variable: a node slot, or a list slot holding a cycle's members. */
export type SlotReference = { list: false; slot: number } | { list: true; slot: number };

/** A fix pattern with slots. */
export interface ProgramRemove {
  subject: number;
  role: Role;
  object: number;
}

/** A rule ready to plan against a graph. */
export interface RuleProgram {
  rule: RuleDefinition;
  nodeSlotCount: number;
  listSlotCount: number;
  match: ProgramEntry[];
  focus: SlotReference;
  nodes: SlotReference[];
  /** Pairs of node slots whose order carries no meaning. */
  unordered: [number, number][];
  /** The message split into literal text and variable references. */
  message: (string | SlotReference)[];
  remove: ProgramRemove[];
}

const PLACEHOLDER = /\{([A-Za-z_][A-Za-z0-9_]*)\}/g;

/**
 * Compiles a rule definition. The rule file validator reports every problem with a line first;
 * this throws for a definition that did not pass it (such a rule becomes a RuleFailure).
 */
export function compileRule(rule: RuleDefinition): RuleProgram {
  const nodeSlots = new Map<Variable, number>();
  const listSlots = new Map<Variable, number>();
  const nodeSlot = (variable: Variable): number => {
    if (listSlots.has(variable)) throw new Error(`${variable} holds a cycle's member list and cannot stand for one node`);
    let slot = nodeSlots.get(variable);
    if (slot === undefined) {
      slot = nodeSlots.size;
      nodeSlots.set(variable, slot);
    }
    return slot;
  };
  const compileEntries = (entries: MatchEntry[]): ProgramEntry[] => entries.map((entry) => compileEntry(entry));
  const compileEntry = (entry: MatchEntry): ProgramEntry => {
    switch (entry.type) {
      case 'path':
        return { type: 'path', subject: nodeSlot(entry.subject), object: nodeSlot(entry.object), path: parseValidPath(entry.path), text: entry.path };
      case 'is':
        return { type: 'is', slot: nodeSlot(entry.variable), kind: nodeKind(entry.kind) };
      case 'not':
        return { type: 'not', entries: compileEntries(entry.entries) };
      case 'differ':
        return { type: 'differ', left: nodeSlot(entry.left), right: nodeSlot(entry.right) };
      case 'absent':
        return { type: 'absent', slot: nodeSlot(entry.variable), path: parseValidPath(entry.path), text: entry.path };
      case 'cycle': {
        if (nodeSlots.has(entry.members) || listSlots.has(entry.members)) {
          throw new Error(`${entry.members} is bound twice; a cycle's member list needs a variable of its own`);
        }
        const path = parseValidPath(entry.path);
        if (matchesEmpty(path)) throw new Error(`cycle path '${entry.path}' matches zero edges, so every node would be a cycle`);
        listSlots.set(entry.members, listSlots.size);
        return { type: 'cycle', path, text: entry.path, members: listSlots.size - 1 };
      }
    }
  };
  // Cycle entries first, so their list variables are known before any other entry names them.
  const ordered = [...rule.match.filter((entry) => entry.type === 'cycle'), ...rule.match.filter((entry) => entry.type !== 'cycle')];
  const compiled = new Map<MatchEntry, ProgramEntry>();
  for (const entry of ordered) compiled.set(entry, compileEntry(entry));
  const match = rule.match.map((entry) => compiled.get(entry) as ProgramEntry);

  const reference = (variable: Variable): SlotReference => {
    const list = listSlots.get(variable);
    if (list !== undefined) return { list: true, slot: list };
    const slot = nodeSlots.get(variable);
    if (slot === undefined) throw new Error(`${variable} in report is not bound by the match`);
    return { list: false, slot };
  };
  const nodeReference = (variable: Variable, where: string): number => {
    const found = reference(variable);
    if (found.list) throw new Error(`${variable} is a member list and cannot be used in ${where}`);
    return found.slot;
  };
  const unordered = rule.report.unordered.map((pair): [number, number] => {
    if (pair.length !== 2) throw new Error('each unordered entry must be a pair of variables');
    return [nodeReference(pair[0], 'unordered'), nodeReference(pair[1], 'unordered')];
  });
  const message: (string | SlotReference)[] = [];
  let last = 0;
  for (const placeholder of rule.report.message.matchAll(PLACEHOLDER)) {
    const index = placeholder.index ?? 0;
    if (index > last) message.push(rule.report.message.slice(last, index));
    message.push(reference(`?${placeholder[1]}`));
    last = index + placeholder[0].length;
  }
  if (last < rule.report.message.length) message.push(rule.report.message.slice(last));
  const remove = (rule.fix?.remove ?? []).map((pattern) => ({
    subject: nodeReference(pattern.subject, 'fix'),
    role: role(pattern.role),
    object: nodeReference(pattern.object, 'fix'),
  }));
  return {
    rule,
    nodeSlotCount: nodeSlots.size,
    listSlotCount: listSlots.size,
    match,
    focus: reference(rule.report.focus),
    nodes: rule.report.nodes.map(reference),
    unordered,
    message,
    remove,
  };
}

function nodeKind(kind: string): NodeKind {
  const found = NODE_KINDS.find((known) => known === kind);
  if (found === undefined) throw new Error(`unknown node kind '${kind}'`);
  return found;
}

function role(name: string): Role {
  const found = ROLES.find((known) => known === name);
  if (found === undefined) throw new Error(`unknown role '${name}' in fix`);
  return found;
}
