// Finds, reads and validates isapart.yaml, and applies command-line overrides to the result.
import { readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { isMap, LineCounter, parseDocument, type YAMLError } from 'yaml';
import type { InputError } from '../load/statement.js';
import { isPresetName } from '../roles/presets.js';
import { describeRoleConflict, findRoleConflicts } from '../roles/role-map.js';
import { DEFAULT_PRESETS, KNOWN_PRESETS, type IsapartConfig } from './config.js';
import {
  folderProblem,
  readAllow,
  readPresets,
  readRoles,
  readRoots,
  readRuleDirs,
  readRules,
  readScope,
  roleIriKey,
  RULE_LEVELS,
  type RoleIriPositions,
} from './config-sections.js';
import { readEndpoint } from './endpoint-section.js';
import { iriProblem } from './iri-check.js';
import { suggestionHint } from './nearest.js';
import { readContexts } from './contexts-section.js';
import {
  describeNode,
  isEmptyNode,
  mappingEntries,
  positionOf,
  reportAt,
  type LineColumn,
  type MappingEntry,
  type YamlReadContext,
} from './yaml-nodes.js';

/** The file name searched for upward from the linted paths. */
export const CONFIG_FILE_NAME = 'isapart.yaml';

/** The `file` of errors that come from command-line options rather than from a file. */
export const COMMAND_LINE_SOURCE = '<command line>';

/** Every top-level key of isapart.yaml, in the order design.md lists them. */
export const CONFIG_KEYS = ['presets', 'roles', 'scope', 'roots', 'rules', 'rule-dirs', 'allow', 'contexts', 'endpoint'] as const;

/** A config together with the problems found while reading it (any problem makes the run exit 2). */
export interface ConfigResult {
  config: IsapartConfig;
  errors: InputError[];
}

/** Command-line options that change the config; `ruleLevels` is `--rule ID=LEVEL` already split. */
export interface CommandLineOverrides {
  presets?: string[];
  scope?: string[];
  roots?: string[];
  ruleLevels?: Record<string, string>;
}

/** The config of a run without isapart.yaml: the default presets and nothing else. */
export function emptyConfig(): IsapartConfig {
  return { presets: [...DEFAULT_PRESETS], roles: {}, scope: [], roots: [], rules: {}, ruleLines: {}, ruleDirs: [], allow: [], contexts: {} };
}

/** The nearest isapart.yaml in a folder, or in a file's folder, or in any folder above; stops at the root. */
export function findConfigFile(startPath: string): string | undefined {
  const start = path.resolve(startPath);
  let folder = statSync(start, { throwIfNoEntry: false })?.isDirectory() ? start : path.dirname(start);
  for (;;) {
    const candidate = path.join(folder, CONFIG_FILE_NAME);
    if (statSync(candidate, { throwIfNoEntry: false })?.isFile()) return candidate;
    const parent = path.dirname(folder);
    if (parent === folder) return undefined;
    folder = parent;
  }
}

/** Why a config file cannot be read, in words: missing, a folder, not permitted, or the system's reason. */
function unreadableReason(error: unknown): string {
  const code = (error as NodeJS.ErrnoException).code;
  if (code === 'ENOENT') return 'there is no such file';
  if (code === 'EISDIR') return 'it is a folder, not a file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission to read it is denied';
  return error instanceof Error ? error.message : String(error);
}

/** Reads and validates a config file; an unreadable file is an error with no line (line 0). */
export function loadConfig(file: string): ConfigResult {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    const config = { ...emptyConfig(), file };
    const hint = `check the path given with --config (a YAML file such as ${CONFIG_FILE_NAME}), or leave the option out to use the nearest ${CONFIG_FILE_NAME} upward from the first path`;
    return { config, errors: [{ file, line: 0, column: 0, message: `the config file cannot be read: ${unreadableReason(error)}`, hint }] };
  }
  return parseConfig(text, file, { folderProblem });
}

/** A hint for a YAML syntax error, by the yaml package's error code (and its message, for unclosed brackets). */
function syntaxHint(code: YAMLError['code'], message: string): string {
  // The yaml package reports an unclosed `[` or `{` as an indentation problem where it gives up.
  if (/^Flow (sequence|map|mapping) /.test(message)) return 'close the `[` or `{` opened above with `]` or `}` on the same entry, or indent its continuation lines';
  switch (code) {
    case 'DUPLICATE_KEY':
      return 'each key may appear once in a mapping; merge the two entries';
    case 'BAD_INDENT':
    case 'TAB_AS_INDENT':
      return 'indent nested entries with spaces, by the same amount for entries of one mapping or list';
    case 'MULTIPLE_DOCS':
      return 'isapart.yaml holds one document; remove the `---` or `...` separator';
    case 'MISSING_CHAR':
      return 'close every `[`, `{` and quote that is opened';
    default:
      return 'check the YAML syntax here; quote a value that contains `: `, `#` or starts with a special character';
  }
}

/** The first line of the yaml package's message (its position is given separately). */
function plainYamlMessage(error: YAMLError): string {
  return error.message.split('\n')[0];
}

const KEY_READERS: Record<Exclude<(typeof CONFIG_KEYS)[number], 'roles'>, (context: YamlReadContext, entry: MappingEntry, config: IsapartConfig) => void> = {
  presets: readPresets,
  scope: readScope,
  roots: readRoots,
  rules: readRules,
  'rule-dirs': readRuleDirs,
  allow: readAllow,
  contexts: readContexts,
  endpoint: readEndpoint,
};

/** Reports predicates that the presets and `roles:` map two incompatible ways, at the `roles:` IRI. */
function reportRoleConflicts(context: YamlReadContext, config: IsapartConfig, positions: RoleIriPositions, presetsAt: LineColumn | undefined): void {
  for (const conflict of findRoleConflicts(config.presets, config.roles)) {
    const at = positions.get(roleIriKey(conflict.second.role, conflict.second.inverse, conflict.predicate)) ?? presetsAt ?? { line: 1, column: 1 };
    context.errors.push({
      file: context.file,
      line: at.line,
      column: at.column,
      message: describeRoleConflict(conflict),
      hint: 'map each predicate to one role, one way; remove one of the two mappings',
    });
  }
}

/** Errors in file order (stable for errors at one position). */
function sortedByPosition(errors: InputError[]): InputError[] {
  return [...errors].sort((left, right) => left.line - right.line || left.column - right.column);
}

/** What parseConfig may check beyond the text: with `folderProblem`, that each `rule-dirs` folder exists. */
export interface ParseConfigOptions {
  folderProblem?: (absolutePath: string) => string | undefined;
}

/** Validates the text of an isapart.yaml; returns the best config it could read and every problem found. */
export function parseConfig(text: string, file: string, options: ParseConfigOptions = {}): ConfigResult {
  const lineCounter = new LineCounter();
  const document = parseDocument(text, { lineCounter, prettyErrors: false });
  const context: YamlReadContext = { file, document, lineCounter, errors: [], folderProblem: options.folderProblem };
  for (const problem of [...document.errors, ...document.warnings]) {
    const { line, col } = lineCounter.linePos(problem.pos[0]);
    const kind = problem.name === 'YAMLWarning' ? 'warning' : 'syntax error';
    context.errors.push({ file, line, column: col, message: `YAML ${kind}: ${plainYamlMessage(problem)}`, hint: syntaxHint(problem.code, plainYamlMessage(problem)) });
  }
  const config: IsapartConfig = { ...emptyConfig(), file };
  const contents = document.contents;
  if (contents === null || isEmptyNode(contents)) return { config, errors: sortedByPosition(context.errors) };
  if (!isMap(contents)) {
    reportAt(
      context,
      contents,
      `the config must be a mapping of keys such as \`presets:\` and \`scope:\`, found ${describeNode(contents)}`,
      `known keys: ${CONFIG_KEYS.join(', ')}`,
    );
    return { config, errors: sortedByPosition(context.errors) };
  }
  const positions: RoleIriPositions = new Map();
  let presetsAt: LineColumn | undefined;
  for (const entry of mappingEntries(context, contents)) {
    if (entry.key === 'roles') {
      readRoles(context, entry, config, positions);
    } else if (entry.key in KEY_READERS) {
      if (entry.key === 'presets') presetsAt = positionOf(context, entry.keyNode);
      KEY_READERS[entry.key as keyof typeof KEY_READERS](context, entry, config);
    } else {
      reportAt(context, entry.keyNode, `unknown key \`${entry.key}\``, suggestionHint(entry.key, CONFIG_KEYS, 'keys'));
    }
  }
  reportRoleConflicts(context, config, positions, presetsAt);
  return { config, errors: sortedByPosition(context.errors) };
}

/**
 * Unknown rule ids in `rules:` and `allow:`, with a nearest-id hint. An id in `rules` with no
 * recorded line came from `--rule` and is reported against the command line (line 0: no line).
 * The config keeps only lines, so the others stand at column 1 of their line.
 */
export function checkRuleIds(config: IsapartConfig, knownIds: readonly string[]): InputError[] {
  const errors: InputError[] = [];
  const known = new Set(knownIds);
  const configFile = config.file ?? COMMAND_LINE_SOURCE;
  for (const id of Object.keys(config.rules)) {
    if (known.has(id)) continue;
    const line = config.ruleLines[id];
    const message = line === undefined ? `--rule: unknown rule id \`${id}\`` : `unknown rule id \`${id}\` in \`rules\``;
    const file = line === undefined ? COMMAND_LINE_SOURCE : configFile;
    errors.push({ file, line: line ?? 0, column: line === undefined ? 0 : 1, message, hint: suggestionHint(id, knownIds, 'rule ids') });
  }
  for (const entry of config.allow) {
    if (known.has(entry.rule)) continue;
    const message = `unknown rule id \`${entry.rule}\` in an \`allow\` entry`;
    errors.push({ file: entry.file, line: entry.line, column: 1, message, hint: suggestionHint(entry.rule, knownIds, 'rule ids') });
  }
  return errors;
}

/** An error in a command-line option: it has no line, so it is placed at line 0 (shown without one). */
function commandLineError(option: string, message: string, hint: string): InputError {
  return { file: COMMAND_LINE_SOURCE, line: 0, column: 0, message: `${option}: ${message}`, hint };
}

/** Adds the valid IRIs of a repeatable option to a list; reports the others naming the option. */
function addIris(target: string[], values: readonly string[], option: { name: string; example: string }, errors: InputError[]): void {
  for (const value of values) {
    const problem = iriProblem(value);
    if (problem !== undefined) {
      errors.push(commandLineError(option.name, `\`${value}\` is not an absolute IRI: ${problem}`, `write a full IRI such as ${option.name} ${option.example}`));
    } else if (!target.includes(value)) {
      target.push(value);
    }
  }
}

/** A copy of the config with `--preset`, `--scope`, `--root` added and `--rule` levels applied. */
export function mergeCommandLine(config: IsapartConfig, options: CommandLineOverrides): ConfigResult {
  const errors: InputError[] = [];
  const merged: IsapartConfig = {
    ...config,
    presets: [...config.presets],
    scope: [...config.scope],
    roots: [...config.roots],
    rules: { ...config.rules },
  };
  for (const name of options.presets ?? []) {
    if (!isPresetName(name)) errors.push(commandLineError('--preset', `unknown preset \`${name}\``, suggestionHint(name, KNOWN_PRESETS, 'presets')));
    else if (!merged.presets.includes(name)) merged.presets.push(name);
  }
  addIris(merged.scope, options.scope ?? [], { name: '--scope', example: 'https://data.northvale-rail.example/' }, errors);
  addIris(merged.roots, options.roots ?? [], { name: '--root', example: 'https://data.northvale-rail.example/def/Asset' }, errors);
  for (const [id, level] of Object.entries(options.ruleLevels ?? {})) {
    const known = RULE_LEVELS.find((candidate) => candidate === level);
    if (known === undefined) errors.push(commandLineError('--rule', `\`${id}=${level}\` has an unknown level \`${level}\``, `levels: ${RULE_LEVELS.join(', ')}`));
    else merged.rules[id] = known;
  }
  const earlier = new Set(findRoleConflicts(config.presets, config.roles).map(describeRoleConflict));
  for (const conflict of findRoleConflicts(merged.presets, merged.roles).map(describeRoleConflict)) {
    // Conflicts already in the config were reported when it was read; only new ones are the option's.
    if (!earlier.has(conflict)) errors.push(commandLineError('--preset', conflict, 'map each predicate to one role, one way; drop the preset or the config mapping'));
  }
  return { config: merged, errors };
}
