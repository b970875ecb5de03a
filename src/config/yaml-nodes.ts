// Reading a parsed YAML document node by node, with every complaint placed at its node's line and column.
import { isAlias, isMap, isScalar, isSeq, type Document, type LineCounter, type Node, type Pair, type YAMLMap } from 'yaml';
import type { InputError } from '../load/statement.js';

/** What reading one YAML file needs: where it is, how to place offsets, and where errors go. */
export interface YamlReadContext {
  file: string;
  document: Document;
  lineCounter: LineCounter;
  errors: InputError[];
  /** Checks a folder named in the file (undefined: not checked, as for text that is not on disk). */
  folderProblem?: (absolutePath: string) => string | undefined;
}

/** A 1-based line and column. */
export interface LineColumn {
  line: number;
  column: number;
}

/** One key of a mapping with its text, its key node, and its value node (aliases resolved). */
export interface MappingEntry {
  key: string;
  keyNode: Node;
  value: Node | undefined;
}

/** The node an alias points at, or the node itself. */
export function resolveNode(context: YamlReadContext, node: unknown): Node | undefined {
  if (isAlias(node)) return node.resolve(context.document) as Node | undefined;
  return (node ?? undefined) as Node | undefined;
}

/** The 1-based line and column where a node starts (line 1, column 1 when it has no range). */
export function positionOf(context: YamlReadContext, node: Node | undefined): LineColumn {
  const offset = node?.range?.[0];
  if (offset === undefined) return { line: 1, column: 1 };
  const { line, col } = context.lineCounter.linePos(offset);
  return { line, column: col };
}

/** Records an error at a node. */
export function reportAt(context: YamlReadContext, node: Node | undefined, message: string, hint: string): void {
  context.errors.push({ file: context.file, ...positionOf(context, node), message, hint });
}

/** A short description of what a node is, for "expected X, found Y" messages. */
export function describeNode(node: Node | undefined): string {
  if (node === undefined) return 'nothing';
  if (isMap(node)) return 'a mapping';
  if (isSeq(node)) return 'a list';
  if (isScalar(node)) {
    const value = node.value;
    if (value === null || value === undefined) return 'nothing';
    if (typeof value === 'string') return `the text \`${value}\``;
    if (typeof value === 'number' || typeof value === 'bigint') return `the number ${String(value)}`;
    if (typeof value === 'boolean') return `the boolean ${String(value)}`;
  }
  return 'a value of another kind';
}

/** Whether a node is missing or a YAML null (`key:` with nothing after it, or `~`). */
export function isEmptyNode(node: Node | undefined): boolean {
  return node === undefined || (isScalar(node) && (node.value === null || node.value === undefined));
}

/** The text of a string scalar, or undefined for any other node. */
export function stringValue(node: Node | undefined): string | undefined {
  return isScalar(node) && typeof node.value === 'string' ? node.value : undefined;
}

/** The entries of a mapping; non-text keys are reported and counted out, never silently dropped. */
export function mappingEntries(context: YamlReadContext, map: YAMLMap): MappingEntry[] {
  const entries: MappingEntry[] = [];
  for (const pair of map.items as Pair<unknown, unknown>[]) {
    const keyNode = resolveNode(context, pair.key);
    const key = stringValue(keyNode);
    if (key === undefined) {
      reportAt(
        context,
        keyNode ?? resolveNode(context, pair.value),
        `a key must be text, found ${describeNode(keyNode)}`,
        'write the key as a plain word such as `scope`',
      );
      continue;
    }
    entries.push({ key, keyNode: keyNode as Node, value: resolveNode(context, pair.value) });
  }
  return entries;
}

/** The node to blame for a value: the value itself, or its key when the value is empty. */
export function blameNode(entry: MappingEntry): Node {
  return isEmptyNode(entry.value) ? entry.keyNode : (entry.value as Node);
}

/** The items of a list value, or undefined (reported) when the value is not a list. */
export function listItems(context: YamlReadContext, entry: MappingEntry, expected: string, example: string): Node[] | undefined {
  if (isSeq(entry.value)) return entry.value.items.map((item) => resolveNode(context, item) as Node);
  reportAt(
    context,
    blameNode(entry),
    `\`${entry.key}\` must be ${expected}, found ${describeNode(entry.value)}`,
    `write a list, for example \`${entry.key}: ${example}\``,
  );
  return undefined;
}

/** The text of a list item, or undefined (reported) when it is not text. */
export function listItemText(context: YamlReadContext, item: Node, owner: string, expectedItem: string): string | undefined {
  const text = stringValue(item);
  if (text === undefined) {
    reportAt(
      context,
      item,
      `each item of \`${owner}\` must be ${expectedItem}, found ${describeNode(item)}`,
      `write ${expectedItem} as text; quote it if YAML reads it as another kind`,
    );
  }
  return text;
}
