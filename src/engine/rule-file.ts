// Reads and validates rule files (YAML, one rule each): every problem with file, line, column and a hint.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { LineCounter, isMap, isScalar, parseDocument, type Node } from 'yaml';
import type { InputError } from '../load/statement.js';
import { ROLES } from '../roles/role.js';
import type { Level } from './finding.js';
import { compileRule } from './program.js';
import { readMatch, type MatchReading } from './rule-match.js';
import { RuleFileReader, nodeOffset, valueStart } from './rule-reader.js';
import type { RemovePattern, RuleDefinition, Variable } from './rule.js';

/** The keys of a rule file. */
export const RULE_KEYS = ['id', 'level', 'summary', 'description', 'match', 'report', 'fix', 'examples'] as const;
const REQUIRED_KEYS = ['id', 'level', 'summary', 'description', 'match', 'report', 'examples'] as const;
const REPORT_KEYS = ['focus', 'nodes', 'message', 'unordered'] as const;
const EXAMPLE_KEYS = ['flagged', 'clean'] as const;
const LEVELS: readonly Level[] = ['error', 'warning', 'note'];
const RULE_ID = /^[a-z][a-z0-9]*(-[a-z0-9]+)*$/;
const PLACEHOLDER = /\{([^{}]*)\}/g;

/** The line of each parsed rule's `id:` key, for errors that name a rule (duplicates). */
const idLines = new WeakMap<RuleDefinition, number>();

/** The line where a rule's id stands in its file (1 when unknown). */
export function ruleIdLine(rule: RuleDefinition): number {
  return idLines.get(rule) ?? 1;
}

/** Parses one rule file; the rule is given only when there are no errors. */
export function parseRuleFile(text: string, file: string): { rule?: RuleDefinition; errors: InputError[] } {
  const lineCounter = new LineCounter();
  const document = parseDocument(text, { lineCounter, prettyErrors: false, uniqueKeys: true });
  const reader = new RuleFileReader(file, lineCounter);
  for (const problem of [...document.errors, ...document.warnings]) {
    const message = problem.message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '');
    reader.errorAt(problem.pos[0], `YAML: ${message}`, 'check indentation, a missing colon, or an unclosed quote or bracket here');
  }
  if (document.errors.length > 0) return { errors: reader.errors };
  const root = document.contents as Node | null;
  if (!isMap(root)) {
    reader.error(root, 'a rule file must be a map of keys (id, level, summary, ...)', `keys: ${RULE_KEYS.join(', ')}`);
    return { errors: reader.errors };
  }
  const values = new Map<string, { key: Node; value: Node | null }>();
  for (const pair of root.items) {
    const key = pair.key as Node;
    const name = isScalar(key) ? String(key.value) : '';
    if (!(RULE_KEYS as readonly string[]).includes(name)) reader.unknownName(key, 'key', name, RULE_KEYS);
    else values.set(name, { key, value: pair.value as Node | null });
  }
  for (const name of REQUIRED_KEYS) {
    if (!values.has(name)) reader.error(root, `the rule has no '${name}'`, `add a '${name}:' key; required keys: ${REQUIRED_KEYS.join(', ')}`);
  }
  const value = (name: string): Node | null => values.get(name)?.value ?? null;

  const id = values.has('id') ? readId(reader, value('id')) : undefined;
  const level = values.has('level') ? readLevel(reader, value('level')) : undefined;
  const summary = values.has('summary') ? reader.text(value('summary'), 'summary', 'one sentence saying what the rule flags') : undefined;
  const description = values.has('description')
    ? reader.text(value('description'), 'description', 'say what the rule flags, why it matters, and how to fix it')
    : undefined;
  const match = values.has('match') ? readMatch(reader, value('match')) : undefined;
  const report = values.has('report') && match !== undefined ? readReport(reader, value('report'), match) : undefined;
  const fix = values.has('fix') && match !== undefined ? readFix(reader, value('fix'), match) : undefined;
  const examples = values.has('examples') ? readExamples(reader, value('examples')) : undefined;
  if (reader.errors.length > 0) return { errors: reader.errors };
  const rule: RuleDefinition = {
    id: id as string,
    level: level as Level,
    summary: summary as string,
    description: description as string,
    match: (match as MatchReading).entries,
    report: report as RuleDefinition['report'],
    examples: examples as RuleDefinition['examples'],
    file,
  };
  if (fix !== undefined) rule.fix = { remove: fix };
  try {
    compileRule(rule);
  } catch (error) {
    reader.error(value('match'), `the rule does not compile: ${error instanceof Error ? error.message : String(error)}`, 'check the match and report variables');
    return { errors: reader.errors };
  }
  idLines.set(rule, reader.position(nodeOffset(values.get('id')?.key)).line);
  return { rule, errors: [] };
}

function readId(reader: RuleFileReader, node: Node | null): string | undefined {
  const id = reader.string(node, 'id', 'lower-case words joined by hyphens, e.g. part-cycle');
  if (id !== undefined && !RULE_ID.test(id)) {
    reader.error(node, `id '${id}' is not lower-case words joined by hyphens`, 'e.g. part-cycle or kind-and-part');
    return undefined;
  }
  return id;
}

function readLevel(reader: RuleFileReader, node: Node | null): Level | undefined {
  const level = reader.string(node, 'level', `one of ${LEVELS.join(', ')}`);
  if (level === undefined) return undefined;
  const found = LEVELS.find((known) => known === level);
  if (found === undefined) {
    const hint = level === 'off' ? "a rule file gives a finding level; switch a rule off in isapart.yaml's rules:" : `one of ${LEVELS.join(', ')}`;
    reader.error(node, `level '${level}' is not a finding level`, hint);
  }
  return found;
}

/** Keys of a map node, each checked against the known ones. */
function mapEntries(reader: RuleFileReader, node: Node | null, what: string, known: readonly string[]): Map<string, Node | null> | undefined {
  if (!isMap(node)) {
    reader.error(node, `${what} must be a map`, `keys: ${known.join(', ')}`);
    return undefined;
  }
  const entries = new Map<string, Node | null>();
  for (const pair of node.items) {
    const key = pair.key as Node;
    const name = isScalar(key) ? String(key.value) : '';
    if (known.includes(name)) entries.set(name, pair.value as Node | null);
    else reader.unknownName(key, `${what} key`, name, known);
  }
  return entries;
}

function readReport(reader: RuleFileReader, node: Node | null, match: MatchReading): RuleDefinition['report'] | undefined {
  const entries = mapEntries(reader, node, 'report', REPORT_KEYS);
  if (entries === undefined) return undefined;
  for (const key of ['focus', 'nodes', 'message']) {
    if (!entries.has(key)) reader.error(node, `report has no '${key}'`, 'report needs focus, nodes and message');
  }
  const reported = (valueNode: Node | null, variable: string | undefined): string | undefined => {
    if (variable === undefined) return undefined;
    if (!match.bound.has(variable) && !match.lists.has(variable)) {
      reader.error(valueNode, `${variable} is not bound by a positive entry of match`, 'report only variables bound outside not and absent');
      return undefined;
    }
    return variable;
  };
  const focusNode = entries.get('focus') ?? null;
  const focus = entries.has('focus') ? reported(focusNode, reader.variable(focusNode, 'report focus')) : undefined;
  const nodes: Variable[] = [];
  const nodeItems = entries.has('nodes') ? reader.sequence(entries.get('nodes'), 'report nodes', 'write nodes: [?a, ?b]') : [];
  for (const item of nodeItems ?? []) {
    const variable = reported(item, reader.variable(item, 'report nodes'));
    if (variable !== undefined) nodes.push(variable);
  }
  const unordered: Variable[][] = [];
  if (entries.has('unordered')) {
    const pairs = reader.sequence(entries.get('unordered'), 'unordered', 'write unordered: [[?a, ?b]]') ?? [];
    for (const pairNode of pairs) {
      const items = reader.sequence(pairNode, 'an unordered pair', 'write [?a, ?b]');
      if (items === undefined) continue;
      if (items.length !== 2) {
        reader.error(pairNode, `an unordered pair has two variables, this one has ${items.length}`, 'write [?a, ?b]');
        continue;
      }
      const pair = items.map((item) => reader.variable(item, 'unordered'));
      pair.forEach((variable, index) => {
        if (variable === undefined) return;
        if (!nodes.includes(variable)) reader.error(items[index], `${variable} is not in report nodes`, 'an unordered pair names two of the reported nodes');
        else if (match.lists.has(variable)) reader.error(items[index], `${variable} is a member list`, 'an unordered pair names two single nodes');
      });
      if (pair[0] !== undefined && pair[1] !== undefined) unordered.push([pair[0], pair[1]]);
    }
  }
  const messageNode = entries.get('message') ?? null;
  const message = entries.has('message') ? reader.text(messageNode, 'message', 'a sentence with {a} for the display name of ?a') : undefined;
  if (message !== undefined) {
    // A placeholder may name any variable bound outside not/absent: it always has a value to show.
    const named = new Set([...match.bound, ...match.lists].map((variable) => variable.slice(1)));
    for (const placeholder of message.matchAll(PLACEHOLDER)) {
      if (named.has(placeholder[1])) continue;
      reader.error(
        messageNode,
        `message placeholder {${placeholder[1]}} names no variable bound by a positive entry of match`,
        `placeholders name bound variables: ${[...named].map((name) => `{${name}}`).join(', ')}`,
        valueStart(messageNode) + (placeholder.index ?? 0),
      );
    }
  }
  if (focus === undefined || message === undefined || nodeItems === undefined) return undefined;
  return { focus, nodes, unordered, message };
}

function readFix(reader: RuleFileReader, node: Node | null, match: MatchReading): RemovePattern[] | undefined {
  const entries = mapEntries(reader, node, 'fix', ['remove']);
  if (entries === undefined) return undefined;
  const hint = 'write remove: [[?a, ROLE, ?b]] with ROLE one of the roles';
  const items = reader.sequence(entries.get('remove') ?? null, 'fix remove', hint);
  if (items === undefined) return undefined;
  const patterns: RemovePattern[] = [];
  for (const item of items) {
    const parts = reader.sequence(item, 'a remove pattern', hint);
    if (parts === undefined) continue;
    if (parts.length !== 3) {
      reader.error(item, `a remove pattern has three items, this one has ${parts.length}`, hint);
      continue;
    }
    const [subject, object] = [parts[0], parts[2]].map((part) => {
      const variable = reader.variable(part, 'fix remove');
      if (variable !== undefined && !match.bound.has(variable)) {
        reader.error(part, `${variable} is not bound to a node by a positive entry of match`, 'a fix removes an edge between two bound nodes');
        return undefined;
      }
      return variable;
    });
    const role = reader.string(parts[1], 'a role', `roles: ${ROLES.join(', ')}`);
    if (role !== undefined && !(ROLES as readonly string[]).includes(role)) reader.unknownName(parts[1], 'role', role, ROLES);
    else if (subject !== undefined && object !== undefined && role !== undefined) patterns.push({ subject, role, object });
  }
  return patterns;
}

function readExamples(reader: RuleFileReader, node: Node | null): RuleDefinition['examples'] | undefined {
  const entries = mapEntries(reader, node, 'examples', EXAMPLE_KEYS);
  if (entries === undefined) return undefined;
  const texts: Partial<Record<(typeof EXAMPLE_KEYS)[number], string>> = {};
  for (const key of EXAMPLE_KEYS) {
    if (!entries.has(key)) {
      reader.error(node, `examples has no '${key}'`, `add ${key}: | with Turtle that ${key === 'flagged' ? 'must produce' : 'must not produce'} this finding`);
      continue;
    }
    texts[key] = reader.text(entries.get(key) ?? null, `examples ${key}`, 'Turtle text, usually a block: | followed by indented lines');
  }
  if (texts.flagged === undefined || texts.clean === undefined) return undefined;
  return { flagged: texts.flagged, clean: texts.clean };
}

/** Reads every `*.yaml` / `*.yml` rule file of a folder, in sorted order. */
export function loadRuleDir(dir: string): { rules: RuleDefinition[]; errors: InputError[] } {
  let names: string[];
  try {
    if (!statSync(dir).isDirectory()) {
      return { rules: [], errors: [{ file: dir, line: 0, column: 0, message: 'not a folder of rule files', hint: 'rule-dirs lists folders of *.yaml rule files' }] };
    }
    names = readdirSync(dir).filter((name) => name.endsWith('.yaml') || name.endsWith('.yml')).sort();
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    return { rules: [], errors: [{ file: dir, line: 0, column: 0, message: `cannot read the rule folder: ${message}`, hint: 'check the path in rule-dirs' }] };
  }
  const rules: RuleDefinition[] = [];
  const errors: InputError[] = [];
  for (const name of names) {
    const file = join(dir, name);
    let text: string;
    try {
      text = readFileSync(file, 'utf8');
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      errors.push({ file, line: 0, column: 0, message: `cannot read the rule file: ${message}`, hint: 'check that the file is readable' });
      continue;
    }
    const { rule, errors: fileErrors } = parseRuleFile(text, file);
    errors.push(...fileErrors);
    if (rule !== undefined) rules.push(rule);
  }
  return { rules, errors };
}

/** Reads the built-in rules shipped in the package's `rules/` folder (works from src/engine and dist/engine). */
export function loadBuiltinRules(): { rules: RuleDefinition[]; errors: InputError[] } {
  return loadRuleDir(fileURLToPath(new URL('../../rules/', import.meta.url)));
}
