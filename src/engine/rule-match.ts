// Reads and checks a rule's `match` entries: their shapes, paths, node kinds and which variables they bind.
import { isMap, isScalar, isSeq, type Node } from 'yaml';
import { NODE_KINDS } from '../graph/hierarchy-graph.js';
import { matchesEmpty, parsePath } from './path.js';
import { nodeOffset, valueStart, type RuleFileReader } from './rule-reader.js';
import type { MatchEntry, Variable } from './rule.js';

/** The entry keys of a map-shaped match entry. */
export const ENTRY_KEYS = ['is', 'not', 'differ', 'cycle', 'absent'] as const;

/** A variable and the YAML node that names it (for error positions). */
interface VariableUse {
  variable: Variable;
  node: Node | null;
}

/** One read entry: what it binds (positive entries), what it needs bound, and nested entries of a `not`. */
interface ReadEntry {
  entry: MatchEntry;
  binds: VariableUse[];
  needs: VariableUse[];
  nested: ReadEntry[];
  /** The member-list variable of a `cycle`. */
  list?: VariableUse;
}

/** A checked match: its entries, the node variables bound at top level, and the member-list variables. */
export interface MatchReading {
  entries: MatchEntry[];
  bound: Set<Variable>;
  lists: Set<Variable>;
}

const SHAPE_HINT = 'an entry is [?x, PATH, ?y], {is: [?x, KIND]}, {not: [...]}, {differ: [?x, ?y]}, {cycle: {path: PATH, members: ?m}} or {absent: [?x, PATH]}';

/** Reads `match`; every problem is recorded on the reader. */
export function readMatch(reader: RuleFileReader, node: Node | null): MatchReading | undefined {
  const items = reader.sequence(node, 'match', SHAPE_HINT);
  if (items === undefined) return undefined;
  if (items.length === 0) {
    reader.error(node, 'match has no entries', SHAPE_HINT);
    return undefined;
  }
  const read = readEntries(reader, items);
  if (read === undefined) return undefined;
  const lists = new Map<Variable, VariableUse>();
  collectLists(reader, read, lists);
  const bound = new Set<Variable>();
  checkConjunction(reader, read, new Set(), lists, bound);
  return { entries: read.map((entry) => entry.entry), bound, lists: new Set(lists.keys()) };
}

function readEntries(reader: RuleFileReader, items: (Node | null)[]): ReadEntry[] | undefined {
  const read: ReadEntry[] = [];
  let failed = false;
  for (const item of items) {
    const entry = readEntry(reader, item);
    if (entry === undefined) failed = true;
    else read.push(entry);
  }
  return failed ? undefined : read;
}

function readEntry(reader: RuleFileReader, node: Node | null): ReadEntry | undefined {
  if (isSeq(node)) {
    const items = node.items as (Node | null)[];
    if (items.length !== 3) {
      reader.error(node, `a path entry has three items, this one has ${items.length}`, 'write [?x, PATH, ?y]');
      return undefined;
    }
    const subject = reader.variable(items[0], 'path entry');
    const path = readPath(reader, items[1], false);
    const object = reader.variable(items[2], 'path entry');
    if (subject === undefined || path === undefined || object === undefined) return undefined;
    return {
      entry: { type: 'path', subject, path, object },
      binds: [{ variable: subject, node: items[0] }, { variable: object, node: items[2] }],
      needs: [],
      nested: [],
    };
  }
  if (!isMap(node) || node.items.length !== 1) {
    reader.error(node, 'a match entry must be a list of three items or a map with one key', SHAPE_HINT);
    return undefined;
  }
  const pair = node.items[0];
  const keyNode = pair.key as Node | null;
  const key = isScalar(keyNode) ? String(keyNode.value) : '';
  const value = pair.value as Node | null;
  switch (key) {
    case 'is': {
      const items = pairOf(reader, value, 'is', 'write {is: [?x, KIND]}');
      if (items === undefined) return undefined;
      const variable = reader.variable(items[0], 'is');
      const kind = reader.string(items[1], 'a node kind', `kinds: ${NODE_KINDS.join(', ')}`);
      if (kind !== undefined && !(NODE_KINDS as readonly string[]).includes(kind)) {
        reader.unknownName(items[1], 'node kind', kind, NODE_KINDS);
        return undefined;
      }
      if (variable === undefined || kind === undefined) return undefined;
      return { entry: { type: 'is', variable, kind }, binds: [{ variable, node: items[0] }], needs: [], nested: [] };
    }
    case 'differ': {
      const items = pairOf(reader, value, 'differ', 'write {differ: [?x, ?y]}');
      if (items === undefined) return undefined;
      const left = reader.variable(items[0], 'differ');
      const right = reader.variable(items[1], 'differ');
      if (left === undefined || right === undefined) return undefined;
      return {
        entry: { type: 'differ', left, right },
        binds: [],
        needs: [{ variable: left, node: items[0] }, { variable: right, node: items[1] }],
        nested: [],
      };
    }
    case 'absent': {
      const items = pairOf(reader, value, 'absent', 'write {absent: [?x, PATH]}');
      if (items === undefined) return undefined;
      const variable = reader.variable(items[0], 'absent');
      const path = readPath(reader, items[1], false);
      if (variable === undefined || path === undefined) return undefined;
      return { entry: { type: 'absent', variable, path }, binds: [], needs: [{ variable, node: items[0] }], nested: [] };
    }
    case 'not': {
      const items = reader.sequence(value, 'not', 'write {not: [entries...]}');
      if (items === undefined) return undefined;
      if (items.length === 0) {
        reader.error(value, 'not has no entries', 'write {not: [entries...]} with at least one entry');
        return undefined;
      }
      const nested = readEntries(reader, items);
      if (nested === undefined) return undefined;
      return { entry: { type: 'not', entries: nested.map((inner) => inner.entry) }, binds: [], needs: [], nested };
    }
    case 'cycle':
      return readCycle(reader, value);
    default:
      reader.unknownName(keyNode, 'match entry', key, ENTRY_KEYS);
      return undefined;
  }
}

function readCycle(reader: RuleFileReader, value: Node | null): ReadEntry | undefined {
  const hint = 'write {cycle: {path: PATH, members: ?m}}';
  if (!isMap(value)) {
    reader.error(value, 'cycle must be a map with path and members', hint);
    return undefined;
  }
  let path: string | undefined;
  let members: string | undefined;
  let membersNode: Node | null = null;
  let failed = false;
  for (const pair of value.items) {
    const keyNode = pair.key as Node | null;
    const key = isScalar(keyNode) ? String(keyNode.value) : '';
    if (key === 'path') {
      path = readPath(reader, pair.value as Node | null, true);
      failed ||= path === undefined;
    } else if (key === 'members') {
      membersNode = pair.value as Node | null;
      members = reader.variable(membersNode, 'cycle members');
      failed ||= members === undefined;
    } else {
      reader.unknownName(keyNode, 'cycle key', key, ['path', 'members']);
      failed = true;
    }
  }
  if (failed) return undefined;
  if (path === undefined || members === undefined) {
    reader.error(value, `cycle needs ${path === undefined ? 'path' : 'members'}`, hint);
    return undefined;
  }
  return { entry: { type: 'cycle', path, members }, binds: [], needs: [], nested: [], list: { variable: members, node: membersNode } };
}

function pairOf(reader: RuleFileReader, value: Node | null, what: string, hint: string): (Node | null)[] | undefined {
  const items = reader.sequence(value, what, hint);
  if (items === undefined) return undefined;
  if (items.length !== 2) {
    reader.error(value, `${what} takes two items, this one has ${items.length}`, hint);
    return undefined;
  }
  return items;
}

/** Reads a path string; a syntax error points at its column inside the path. */
function readPath(reader: RuleFileReader, node: Node | null, rejectEmptyMatch: boolean): string | undefined {
  const text = reader.string(node, 'a path', 'write role names joined with / | ^ + * ?, e.g. subclass-of+');
  if (text === undefined) return undefined;
  const parsed = parsePath(text);
  if (!parsed.ok) {
    reader.errorAt(nodeOffset(node) + valueStart(node) + parsed.error.offset, `path '${text}': ${parsed.error.message}`, parsed.error.hint);
    return undefined;
  }
  if (rejectEmptyMatch && matchesEmpty(parsed.path)) {
    // A zero-length match makes every node its own cycle, which is never what a cycle entry means.
    reader.error(node, `cycle path '${text}' also matches zero edges, so every node would be a cycle`, 'use + instead of *, or drop ?');
    return undefined;
  }
  return text;
}

/** Records every cycle's member-list variable; a list variable may be bound only once. */
function collectLists(reader: RuleFileReader, entries: ReadEntry[], lists: Map<Variable, VariableUse>): void {
  for (const entry of entries) {
    if (entry.list !== undefined) {
      if (lists.has(entry.list.variable)) {
        reader.error(entry.list.node, `${entry.list.variable} is bound by two cycle entries`, 'give each cycle its own members variable');
      } else {
        lists.set(entry.list.variable, entry.list);
      }
    }
    collectLists(reader, entry.nested, lists);
  }
}

/**
 * Checks that every variable a filter needs is bound by a positive entry of this conjunction or an
 * enclosing one, and that member lists are not used as nodes. Adds this conjunction's bound variables to `bound`.
 */
function checkConjunction(
  reader: RuleFileReader,
  entries: ReadEntry[],
  outer: Set<Variable>,
  lists: Map<Variable, VariableUse>,
  bound: Set<Variable>,
): void {
  const available = new Set(outer);
  for (const entry of entries) for (const use of entry.binds) available.add(use.variable);
  for (const entry of entries) {
    for (const use of [...entry.binds, ...entry.needs]) {
      if (lists.has(use.variable)) {
        reader.error(use.node, `${use.variable} holds a cycle's member list and cannot stand for one node`, 'use another variable here');
      }
    }
    for (const use of entry.needs) {
      if (!available.has(use.variable)) {
        reader.error(
          use.node,
          `${use.variable} is not bound by a positive entry`,
          'bind it with a path entry [?x, PATH, ?y] or {is: [?x, KIND]} in the same or an enclosing conjunction',
        );
      }
    }
    if (entry.nested.length > 0) checkConjunction(reader, entry.nested, available, lists, new Set());
  }
  for (const entry of entries) for (const use of entry.binds) bound.add(use.variable);
}
