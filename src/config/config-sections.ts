// Readers for each top-level key of isapart.yaml: they validate one value and fill the config.
import { statSync } from 'node:fs';
import path from 'node:path';
import { isMap, isSeq, type Node } from 'yaml';
import type { RuleLevel } from '../engine/finding.js';
import { isPresetName } from '../roles/presets.js';
import { ROLES, type Role } from '../roles/role.js';
import { KNOWN_PRESETS, type IsapartConfig, type RolePredicates } from './config.js';
import { iriProblem } from './iri-check.js';
import { suggestionHint } from './nearest.js';
import {
  blameNode,
  describeNode,
  listItems,
  listItemText,
  mappingEntries,
  positionOf,
  reportAt,
  stringValue,
  type LineColumn,
  type MappingEntry,
  type YamlReadContext,
} from './yaml-nodes.js';

/** The levels a rule can be set to in config or with `--rule`. */
export const RULE_LEVELS: readonly RuleLevel[] = ['error', 'warning', 'note', 'off'];

/** The example IRI used in hints. */
const EXAMPLE_IRI = 'https://data.northvale-rail.example/def/Asset';

/** Where each extra role predicate was written, keyed by `roleIriKey`, for placing conflict errors. */
export type RoleIriPositions = Map<string, LineColumn>;

/** The key under which `RoleIriPositions` keeps one role predicate. */
export function roleIriKey(role: Role, inverse: boolean, iri: string): string {
  return `${role} ${inverse ? 'inverse' : 'iri'} ${iri}`;
}

/** How to name the items of an IRI list in messages: one item with its article, and the whole list. */
interface IriListWording {
  item: string;
  list: string;
  example: string;
}

const PREDICATE_IRIS: IriListWording = { item: 'a predicate IRI', list: 'a list of predicate IRIs', example: 'https://data.northvale-rail.example/def/partOf' };

/** The text of an IRI item, or undefined (reported) when it is not text or not an absolute IRI. */
function readIri(context: YamlReadContext, item: Node, owner: string, what: string): string | undefined {
  const text = listItemText(context, item, owner, what);
  if (text === undefined) return undefined;
  const problem = iriProblem(text);
  if (problem !== undefined) {
    reportAt(context, item, `\`${text}\` in \`${owner}\` is not an absolute IRI: ${problem}`, `write a full IRI such as ${EXAMPLE_IRI}`);
    return undefined;
  }
  return text;
}

/** The IRIs of a list value, deduplicated, invalid ones reported. */
function readIriList(
  context: YamlReadContext,
  entry: MappingEntry,
  owner: string,
  wording: IriListWording,
  positions?: (iri: string, at: LineColumn) => void,
): string[] {
  const items = listItems(context, entry, wording.list, `[${wording.example}]`) ?? [];
  const iris: string[] = [];
  for (const item of items) {
    const iri = readIri(context, item, owner, wording.item);
    if (iri === undefined || iris.includes(iri)) continue;
    iris.push(iri);
    positions?.(iri, positionOf(context, item));
  }
  return iris;
}

/** `presets: [rdfs, owl, ...]` — replaces the default list. */
export function readPresets(context: YamlReadContext, entry: MappingEntry, config: IsapartConfig): void {
  const items = listItems(context, entry, 'a list of preset names', '[rdfs, owl, obo]');
  if (items === undefined) return;
  const presets: string[] = [];
  for (const item of items) {
    const name = listItemText(context, item, 'presets', 'a preset name');
    if (name === undefined) continue;
    if (!isPresetName(name)) {
      reportAt(context, item, `unknown preset \`${name}\``, suggestionHint(name, KNOWN_PRESETS, 'presets'));
      continue;
    }
    if (!presets.includes(name)) presets.push(name);
  }
  config.presets = presets;
}

/** One role's value: a list of IRIs, or `{ iri: [...], inverse: [...] }`. */
function readRolePredicates(context: YamlReadContext, role: Role, entry: MappingEntry, positions: RoleIriPositions): RolePredicates | undefined {
  const predicates: RolePredicates = { iri: [], inverse: [] };
  const remember = (inverse: boolean) => (iri: string, at: LineColumn) => positions.set(roleIriKey(role, inverse, iri), at);
  if (isMap(entry.value)) {
    for (const inner of mappingEntries(context, entry.value)) {
      if (inner.key === 'iri' || inner.key === 'inverse') {
        const inverse = inner.key === 'inverse';
        predicates[inner.key] = readIriList(context, inner, `roles: ${role}: ${inner.key}`, PREDICATE_IRIS, remember(inverse));
      } else {
        reportAt(
          context,
          inner.keyNode,
          `unknown key \`${inner.key}\` in \`roles: ${role}\``,
          suggestionHint(inner.key, ['iri', 'inverse'], 'keys'),
        );
      }
    }
    return predicates;
  }
  if (!isSeq(entry.value)) {
    reportAt(
      context,
      blameNode(entry),
      `\`roles: ${role}\` must be a list of predicate IRIs or a mapping with \`iri\` and \`inverse\` lists, found ${describeNode(entry.value)}`,
      `write \`${role}: [https://data.northvale-rail.example/def/partOf]\` or \`${role}: { iri: [...], inverse: [...] }\``,
    );
    return undefined;
  }
  predicates.iri = readIriList(context, entry, `roles: ${role}`, PREDICATE_IRIS, remember(false));
  return predicates;
}

function isRole(name: string): name is Role {
  return (ROLES as readonly string[]).includes(name);
}

/** `roles: { ROLE: [...] | { iri, inverse } }` — extra predicate mappings. */
export function readRoles(context: YamlReadContext, entry: MappingEntry, config: IsapartConfig, positions: RoleIriPositions): void {
  if (!isMap(entry.value)) {
    reportAt(
      context,
      blameNode(entry),
      `\`roles\` must be a mapping from role to predicate IRIs, found ${describeNode(entry.value)}`,
      `write \`roles: { subclass-of: [https://data.northvale-rail.example/def/kindOf] }\``,
    );
    return;
  }
  for (const roleEntry of mappingEntries(context, entry.value)) {
    if (!isRole(roleEntry.key)) {
      reportAt(context, roleEntry.keyNode, `unknown role \`${roleEntry.key}\``, suggestionHint(roleEntry.key, ROLES, 'roles'));
      continue;
    }
    const predicates = readRolePredicates(context, roleEntry.key, roleEntry, positions);
    if (predicates !== undefined) config.roles[roleEntry.key] = predicates;
  }
}

/** `scope: [PREFIX, ...]` — in-scope IRI prefixes. */
export function readScope(context: YamlReadContext, entry: MappingEntry, config: IsapartConfig): void {
  config.scope = readIriList(context, entry, 'scope', { item: 'an IRI prefix', list: 'a list of IRI prefixes', example: 'https://data.northvale-rail.example/' });
}

/** `roots: [IRI, ...]` — classes allowed to have no superclass. */
export function readRoots(context: YamlReadContext, entry: MappingEntry, config: IsapartConfig): void {
  config.roots = readIriList(context, entry, 'roots', { item: 'a class IRI', list: 'a list of class IRIs', example: EXAMPLE_IRI });
}

function isRuleLevel(text: string): text is RuleLevel {
  return (RULE_LEVELS as readonly string[]).includes(text);
}

/** `rules: { RULE-ID: LEVEL }` — level overrides; ids are checked later against the loaded rules. */
export function readRules(context: YamlReadContext, entry: MappingEntry, config: IsapartConfig): void {
  if (!isMap(entry.value)) {
    reportAt(
      context,
      blameNode(entry),
      `\`rules\` must be a mapping from rule id to level, found ${describeNode(entry.value)}`,
      'write `rules: { redundant-subclass: note, orphan-class: off }`',
    );
    return;
  }
  for (const rule of mappingEntries(context, entry.value)) {
    const level = stringValue(rule.value);
    if (level === undefined || !isRuleLevel(level)) {
      const found = level === undefined ? describeNode(rule.value) : `\`${level}\``;
      reportAt(
        context,
        blameNode(rule),
        `the level of rule \`${rule.key}\` must be one of ${RULE_LEVELS.join(', ')}, found ${found}`,
        `levels: ${RULE_LEVELS.join(', ')}`,
      );
      continue;
    }
    config.rules[rule.key] = level;
    config.ruleLines[rule.key] = positionOf(context, rule.keyNode).line;
  }
}

/** Why a path is not a usable folder (missing, or a file), or undefined when it is a folder; reads the file system. */
export function folderProblem(absolute: string): string | undefined {
  const found = statSync(absolute, { throwIfNoEntry: false });
  if (found === undefined) return `does not exist (looked for ${absolute})`;
  if (!found.isDirectory()) return `is a file, not a folder (${absolute})`;
  return undefined;
}

/** `rule-dirs: [PATH, ...]` — folders of extra rule files, resolved against the config file's folder. */
export function readRuleDirs(context: YamlReadContext, entry: MappingEntry, config: IsapartConfig): void {
  const items = listItems(context, entry, 'a list of folders', '[./team-rules]') ?? [];
  const base = path.dirname(path.resolve(context.file));
  for (const item of items) {
    const folder = listItemText(context, item, 'rule-dirs', 'a folder path');
    if (folder === undefined) continue;
    if (folder.trim().length === 0) {
      reportAt(
        context,
        item,
        'an item of `rule-dirs` is an empty path',
        'write a folder relative to this config file, such as ./team-rules',
      );
      continue;
    }
    const absolute = path.resolve(base, folder);
    const problem = context.folderProblem?.(absolute);
    if (problem !== undefined) {
      reportAt(
        context,
        item,
        `the rule folder \`${folder}\` in \`rule-dirs\` ${problem}; its rules were not loaded`,
        `paths in rule-dirs are relative to the folder of this config file (${base}); create the folder or correct the path`,
      );
      continue;
    }
    if (!config.ruleDirs.includes(absolute)) config.ruleDirs.push(absolute);
  }
}

const ALLOW_KEYS = ['rule', 'focus', 'reason'];

/** One `allow:` item: `{ rule, focus, reason? }`. */
function readAllowEntry(context: YamlReadContext, item: Node, config: IsapartConfig): void {
  const example = `write \`- { rule: kind-and-part, focus: ${EXAMPLE_IRI}, reason: ... }\``;
  if (!isMap(item)) {
    reportAt(context, item, `each item of \`allow\` must be a mapping with \`rule\` and \`focus\`, found ${describeNode(item)}`, example);
    return;
  }
  const values: Partial<Record<string, string>> = {};
  let focusNode: Node | undefined;
  let wrongType = false;
  for (const field of mappingEntries(context, item)) {
    if (!ALLOW_KEYS.includes(field.key)) {
      reportAt(context, field.keyNode, `unknown key \`${field.key}\` in an \`allow\` entry`, suggestionHint(field.key, ALLOW_KEYS, 'keys'));
      continue;
    }
    const text = stringValue(field.value);
    if (text === undefined) {
      reportAt(
        context,
        blameNode(field),
        `\`${field.key}\` of an \`allow\` entry must be text, found ${describeNode(field.value)}`,
        example,
      );
      wrongType = true;
      continue;
    }
    values[field.key] = text;
    if (field.key === 'focus') focusNode = field.value;
  }
  // A key of the wrong type was reported already; "missing" would only repeat it.
  if (!wrongType) {
    for (const required of ['rule', 'focus']) {
      if (values[required] === undefined) reportAt(context, item, `an \`allow\` entry has no \`${required}\``, example);
    }
  }
  const focus = values.focus;
  if (wrongType || values.rule === undefined || focus === undefined) return;
  const problem = iriProblem(focus);
  if (problem !== undefined) {
    const hint = focus.startsWith('_:')
      ? 'blank node labels differ between runs; suppress such a finding with an `# isapart-allow` comment in the source'
      : `write a full IRI such as ${EXAMPLE_IRI}`;
    reportAt(context, focusNode, `the focus \`${focus}\` of an \`allow\` entry is not an absolute IRI: ${problem}`, hint);
    return;
  }
  config.allow.push({ rule: values.rule, focus, reason: values.reason ?? '', file: context.file, line: positionOf(context, item).line });
}

/** `allow: [{ rule, focus, reason? }, ...]` — findings to suppress. */
export function readAllow(context: YamlReadContext, entry: MappingEntry, config: IsapartConfig): void {
  const items = listItems(context, entry, 'a list of `{ rule, focus }` entries', `[{ rule: kind-and-part, focus: ${EXAMPLE_IRI} }]`) ?? [];
  for (const item of items) readAllowEntry(context, item, config);
}
