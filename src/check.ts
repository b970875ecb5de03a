// The library entry point: load sources and config, build the graph, run the rules, suppress.
import path from 'node:path';
import { findConfigFile, loadConfig, emptyConfig, mergeCommandLine, checkRuleIds } from './config/load-config.js';
import type { IsapartConfig } from './config/config.js';
import { suggestionHint } from './config/nearest.js';
import { unmatchedSettingWarnings } from './config/unmatched-settings.js';
import type { Finding, Level, RuleFailure, RuleLevel } from './engine/finding.js';
import type { RuleDefinition } from './engine/rule.js';
import { createRegistry, duplicateRuleErrors } from './engine/registry.js';
import { loadBuiltinRules, loadRuleDir } from './engine/rule-file.js';
import { runRules, type RuleToRun, type RunResult } from './engine/run.js';
import { applySuppressions, UNUSED_ALLOW_RULE } from './engine/suppress.js';
import { buildHierarchyGraph } from './graph/build.js';
import type { HierarchyGraph, ScopeOptions } from './graph/hierarchy-graph.js';
import type { AllowComment, InputError, LoadedSource } from './load/statement.js';
import { RDF_EXTENSIONS } from './load/format.js';
import { loadSources, type LoadResultWithSkipped } from './load/sources.js';
import type { LoadProgress } from './load/byte-source.js';
import { predicatesTheGraphReads } from './graph/read-predicates.js';
import type { ReportContext, RuleInUse } from './report/context.js';
import { findingTermFacts } from './report/term-facts.js';
import { buildRoleMap } from './roles/role-map.js';
import type { RoleMap } from './roles/role.js';
import { endpointRequest, loadFromEndpoint, pushDownRules, type EndpointOptions } from './check-endpoint.js';
import { toolVersion } from './version.js';

/** What one run is asked to do; the command line parses into exactly this. */
export interface CheckOptions extends EndpointOptions {
  /** Files or folders; '-' for stdin (not read when `endpoint` is given). */
  paths: string[];
  cwd?: string;
  stdin?: NodeJS.ReadableStream;
  /** Like -c; otherwise the nearest isapart.yaml upward from the first path. */
  configFile?: string;
  presets?: string[];
  scope?: string[];
  roots?: string[];
  /** Rule id → level, from --rule ID=LEVEL. */
  ruleLevels?: Record<string, string>;
  /** The IRI relative IRIs in the sources resolve against (`--base`); default each file's `file://` URL. */
  baseIri?: string;
  /** Whether the text format may colour its output. */
  color?: boolean;
  /** The command line as typed, for SARIF's invocation record. */
  commandLine?: string;
  /** Called while sources are read, with how far reading has got (the CLI draws a progress bar from it). */
  onProgress?: (progress: LoadProgress) => void;
  /** false reads N-Triples and N-Quads whole with n3 instead of line by line (for comparisons; same findings). */
  fastLines?: boolean;
}

/** Everything a run produced: findings, the context every formatter reads, and the graph. */
export interface CheckResult {
  /** All findings, suppressed ones with `suppression` set, unused allows included. */
  findings: Finding[];
  context: ReportContext;
  graph: HierarchyGraph;
  /** The rules' findings and failures before suppression (empty with push-down). */
  run?: RunResult;
}

/** Levels from most to least severe, for comparisons. */
const SEVERITY: Record<Level, number> = { error: 3, warning: 2, note: 1 };

/** Runs one lint: the whole data flow from sources to suppressed findings. */
export async function check(options: CheckOptions): Promise<CheckResult> {
  const startTime = new Date();
  // The loader needs two things from the config: the predicates the graph reads (only their
  // statements are stored, the others are counted as read) and JSON-LD's local contexts.
  // checkLoaded reads the config again and reports its errors.
  const { config, roleMap } = readLoadSettings(options);
  if (options.endpoint !== undefined) {
    const endpoint = endpointRequest({ ...options, endpoint: options.endpoint }, config, roleMap);
    const pushDown = options.pushDown === true;
    const loaded = await loadFromEndpoint(endpoint, pushDown);
    const pushed = pushDown ? await pushDownRules(endpoint, config, activeRules(config)) : undefined;
    return checkLoaded(loaded, options, startTime, pushed);
  }
  const loaded = await loadPaths(options.paths, options, { config, roleMap });
  return checkLoaded(loaded, options, startTime);
}

/** What loading needs from the config: the config itself (JSON-LD contexts) and the role map (the predicates kept). */
export interface LoadSettings {
  config: IsapartConfig;
  roleMap: RoleMap;
}

/** The config and role map a run loads with; config errors are left for `checkLoaded` to report. */
export function readLoadSettings(options: CheckOptions): LoadSettings {
  const { config } = readConfig(options, options.cwd ?? process.cwd());
  return { config, roleMap: buildRoleMap(config.presets, config.roles) };
}

/** Reads paths as a run does: only the statements of predicates the graph reads are kept. */
export function loadPaths(paths: string[], options: CheckOptions, settings: LoadSettings): Promise<LoadResultWithSkipped> {
  return loadSources(paths, {
    cwd: options.cwd ?? process.cwd(),
    stdin: options.stdin,
    baseIri: options.baseIri,
    contexts: new Map(Object.entries(settings.config.contexts)),
    keepPredicates: predicatesTheGraphReads(settings.roleMap),
    fastLines: options.fastLines,
    onProgress: options.onProgress,
  });
}

/** What push-down on an endpoint found, handed to `checkLoaded` instead of running the rules here. */
export interface PushedDownResults {
  findings: Finding[];
  failures: RuleFailure[];
  errors: InputError[];
  /** Rules evaluated here instead, on a server known to answer their queries wrongly. */
  warnings: InputError[];
}

/** The rules a config switches on, with their levels. */
function activeRules(config: IsapartConfig): { rule: RuleDefinition; level: Level }[] {
  return readRules(config).rules.flatMap((rule) => {
    const level = config.rules[rule.id] ?? rule.level;
    return level === 'off' ? [] : [{ rule, level }];
  });
}

/**
 * Runs the flow after loading on sources already read (the language server keeps one per document):
 * config, rules, graph, rules run, suppression. `options.paths` still locates the config file.
 * With `pushed`, the rules already ran on an endpoint and their findings are used as they are.
 */
export function checkLoaded(
  loaded: LoadResultWithSkipped,
  options: CheckOptions,
  startTime: Date = new Date(),
  pushed?: PushedDownResults,
): CheckResult {
  return checkLoadedWith(loaded, options, { startTime, pushed });
}

/** What builds the graph and runs the rules, given the run's roles, scope and active rules. */
export type EvaluateStep = (input: { sources: LoadedSource[]; roleMap: RoleMap; scope: ScopeOptions; rules: RuleToRun[] }) => { graph: HierarchyGraph; run: RunResult };

/** How `checkLoadedWith` runs: when it started, push-down results, and the step that builds the graph and runs the rules. */
export interface CheckLoadedSteps {
  startTime?: Date;
  pushed?: PushedDownResults;
  /** Default: build the graph from the sources and run every active rule on it. */
  evaluate?: EvaluateStep;
  /** Allow comments besides the sources' own (an edit file's, for the statements it adds). */
  allowComments?: AllowComment[];
  /** Files the run reads otherwise (an edit file), not to be listed as left unread in a folder. */
  alsoRead?: string[];
}

const buildAndRun: EvaluateStep = ({ sources, roleMap, scope, rules }) => {
  const graph = buildHierarchyGraph(sources, roleMap, scope);
  return { graph, run: runRules(graph, rules) };
};

/** `checkLoaded` with the graph build and rule run replaceable (an edit's findings come from its own step). */
export function checkLoadedWith(loaded: LoadResultWithSkipped, options: CheckOptions, steps: CheckLoadedSteps): CheckResult {
  const startTime = steps.startTime ?? new Date();
  const pushed = steps.pushed;
  const cwd = options.cwd ?? process.cwd();
  const inputErrors: InputError[] = [];

  const { config, errors: configErrors } = readConfig(options, cwd);
  inputErrors.push(...configErrors);

  const { rules, errors: ruleErrors } = readRules(config);
  inputErrors.push(...ruleErrors);

  // Role conflicts within the config file are reported by parseConfig at their lines.
  const roleMap = buildRoleMap(config.presets, config.roles);

  const pushDown = pushed !== undefined;
  inputErrors.push(...loaded.errors);
  for (const source of loaded.sources) inputErrors.push(...source.errors);

  const knownIds = new Set([...rules.map((rule) => rule.id), UNUSED_ALLOW_RULE.id]);
  const allComments = [...loaded.sources.flatMap((source) => source.allowComments), ...(steps.allowComments ?? [])];
  // A comment naming no known rule can suppress nothing: it is an error (with the nearest id), not an unused-allow note.
  const comments = allComments.filter((comment) => knownIds.has(comment.ruleId));
  inputErrors.push(...unknownCommentRuleErrors(allComments, [...knownIds]));

  const rulesInUse: RuleInUse[] = rules.map((rule) => ({ rule, level: config.rules[rule.id] ?? rule.level }));
  const active = rulesInUse.flatMap(({ rule, level }) => (level === 'off' ? [] : [{ rule, level }]));
  const scope: ScopeOptions = { prefixes: config.scope, roots: config.roots };
  // Push-down ran the rules already; the graph is still built, for the report's term facts.
  const evaluated = pushDown
    ? { graph: buildHierarchyGraph(loaded.sources, roleMap, scope), run: { findings: [], failures: [] } }
    : (steps.evaluate ?? buildAndRun)({ sources: loaded.sources, roleMap, scope, rules: active });
  const { graph, run } = evaluated;
  const inputWarnings = [
    ...loaded.sources.flatMap((source) => source.warnings ?? []),
    ...(graph.problems ?? []),
    ...skippedFileWarnings(loaded.skippedFiles, { cwd, config, alsoRead: steps.alsoRead ?? [] }),
    ...nothingReadWarnings(loaded.sources),
    // Push-down builds no graph here, so it cannot tell which settings match nothing.
    ...(pushDown ? [] : unmatchedSettingWarnings(graph, config, { commandLineScope: options.scope ?? [], commandLineRoots: options.roots ?? [] })),
  ];
  if (pushed !== undefined) inputErrors.push(...pushed.errors);
  if (pushed !== undefined) inputWarnings.push(...pushed.warnings);
  const { findings: raw, failures } = pushed ?? run;

  const unusedLevel = config.rules[UNUSED_ALLOW_RULE.id] ?? UNUSED_ALLOW_RULE.level;
  const { findings: suppressed, unused } = applySuppressions(raw, comments, config.allow);
  // An allow for a rule that is switched off has nothing to suppress, and is not worth a note either.
  const unusedShown = unused.filter((finding) => (config.rules[finding.focus] ?? '') !== 'off');
  // An endpoint that could not be read, or a rule that failed there, leaves allows unused for no fault of theirs.
  const endpointFailed = options.endpoint !== undefined && (loaded.errors.length > 0 || (pushed?.errors.length ?? 0) > 0);
  const failedRules = new Set(failures.map((failure) => failure.ruleId));
  const unusedKept = endpointFailed ? [] : unusedShown.filter((finding) => !failedRules.has(finding.focus));
  const findings = unusedLevel === 'off' ? suppressed : [...suppressed, ...unusedKept.map((f) => ({ ...f, level: unusedLevel }))];

  const context: ReportContext = {
    toolName: 'isapart',
    toolVersion: toolVersion(),
    cwd,
    sources: loaded.sources.map((source) => ({
      file: source.file,
      format: source.format,
      statements: source.statementCount ?? source.statements.length,
    })),
    inputErrors,
    inputWarnings,
    ruleFailures: failures,
    rules: [...rulesInUse, { rule: UNUSED_ALLOW_RULE, level: unusedLevel }],
    configFile: config.file,
    prefixes: declaredPrefixes(loaded.sources),
    stats: graph.stats,
    ...findingTermFacts(findings, graph, roleMap),
    color: options.color ?? false,
    startTime,
    endTime: new Date(),
    commandLine: options.commandLine ?? `isapart check ${options.paths.join(' ')}`,
  };
  return { findings, context, graph, run };
}

/** How many skipped file names one warning lists before it only counts the rest. */
const SKIPPED_NAMES_SHOWN = 5;

/**
 * One warning naming the files inside the given folders that were left out for their extension, so
 * that nothing is dropped unseen. The config file and rule files in use are read, so not listed.
 */
function skippedFileWarnings(skippedFiles: string[], settings: { cwd: string; config: IsapartConfig; alsoRead: string[] }): InputError[] {
  const { cwd, config } = settings;
  const alsoRead = new Set(settings.alsoRead.map((file) => path.resolve(cwd, file)));
  const consumed = (shown: string) => {
    const absolute = path.resolve(cwd, shown);
    return absolute === config.file || alsoRead.has(absolute) || config.ruleDirs.some((folder) => absolute.startsWith(folder + path.sep));
  };
  const skipped = skippedFiles.filter((shown) => !consumed(shown));
  if (skipped.length === 0) return [];
  const folder = commonFolder(skipped);
  // The loader lists a folder it did not walk with a trailing slash, a file without.
  const folders = skipped.filter((shown) => shown.endsWith('/'));
  const files = skipped.filter((shown) => !shown.endsWith('/'));
  const clauses: string[] = [];
  if (files.length > 0) {
    const count = files.length === 1 ? '1 file was not read, as its name does' : `${files.length} files were not read, as their names do`;
    clauses.push(`${count} not end in ${RDF_EXTENSIONS.join(', ')} (or those with .gz): ${namesUnder(folder, files)}`);
  }
  if (folders.length > 0) {
    const count = folders.length === 1 ? '1 folder was not walked' : `${folders.length} folders were not walked`;
    clauses.push(`${count} (hidden folders and node_modules): ${namesUnder(folder, folders)}`);
  }
  return [
    {
      file: folder,
      line: 0,
      column: 0,
      message: `under this folder ${clauses.join('; ')}`,
      hint: 'name an RDF file on the command line to read it whatever its extension (an .xml file is then read as RDF/XML; any other syntax is told from its content)',
    },
  ];
}

/** The first few of the paths, relative to the folder (a folder keeps its trailing slash), then a count of the rest. */
function namesUnder(folder: string, shown: string[]): string {
  const named = shown
    .slice(0, SKIPPED_NAMES_SHOWN)
    .map((item) => path.relative(folder, item).split(path.sep).join('/') + (item.endsWith('/') ? '/' : ''))
    .join(', ');
  return shown.length > SKIPPED_NAMES_SHOWN ? `${named} and ${shown.length - SKIPPED_NAMES_SHOWN} more` : named;
}

/** A warning when sources were read but none held a statement, so that an empty export does not pass unnoticed. */
function nothingReadWarnings(sources: LoadedSource[]): InputError[] {
  const read = (source: LoadedSource): number => source.statementCount ?? source.statements.length;
  if (sources.length === 0 || sources.some((source) => read(source) > 0 || source.errors.length > 0)) return [];
  const files = sources.length === 1 ? `${sources[0].file} holds` : `none of the ${sources.length} files read holds`;
  return [
    {
      file: sources[0].file,
      line: 0,
      column: 0,
      message: `${files} no RDF statement, so nothing was linted`,
      hint: 'check that the export or the command feeding standard input produced data',
    },
  ];
}

/** The deepest folder that holds every one of the given paths (as written, not resolved). */
function commonFolder(files: string[]): string {
  let folder = path.dirname(files[0]);
  const inside = (file: string) => folder === '.' || file.startsWith(folder + '/') || file.startsWith(folder + path.sep);
  while (!files.every(inside)) {
    const parent = path.dirname(folder);
    if (parent === folder) break;
    folder = parent;
  }
  return folder;
}

/** Errors for allow comments that name a rule id no loaded rule has, with the nearest id as a hint. */
function unknownCommentRuleErrors(comments: AllowComment[], knownIds: string[]): InputError[] {
  const known = new Set(knownIds);
  return comments
    .filter((comment) => !known.has(comment.ruleId))
    .map((comment) => ({
      file: comment.file,
      line: comment.line,
      column: comment.column,
      message: `unknown rule id \`${comment.ruleId}\` in an isapart-allow comment; it suppresses nothing`,
      hint: suggestionHint(comment.ruleId, knownIds.filter((id) => id !== UNUSED_ALLOW_RULE.id), 'rule ids'),
    }));
}

/**
 * The prefixes declared across the sources, chosen as the graph chooses them for messages: a name
 * keeps its first namespace and a namespace its first name, so messages and evidence agree.
 */
function declaredPrefixes(sources: LoadedSource[]): Record<string, string> {
  const prefixes: Record<string, string> = {};
  const namespaces = new Set<string>();
  for (const source of sources) {
    for (const [name, namespace] of Object.entries(source.prefixes)) {
      if (name in prefixes || namespaces.has(namespace)) continue;
      prefixes[name] = namespace;
      namespaces.add(namespace);
    }
  }
  return prefixes;
}

/** Finds and reads the config, then applies the command-line overrides. */
function readConfig(options: CheckOptions, cwd: string): { config: IsapartConfig; errors: InputError[] } {
  const errors: InputError[] = [];
  const firstPath = options.paths.find((p) => p !== '-');
  const configFile = options.configFile
    ? path.resolve(cwd, options.configFile)
    : findConfigFile(path.resolve(cwd, firstPath ?? '.'));
  let config = emptyConfig();
  if (configFile) {
    const read = loadConfig(configFile);
    config = read.config;
    errors.push(...read.errors);
  }
  const merged = mergeCommandLine(config, {
    presets: options.presets,
    scope: options.scope,
    roots: options.roots,
    ruleLevels: options.ruleLevels,
  });
  errors.push(...merged.errors);
  return { config: merged.config, errors };
}

/** The rules a run would use, with their effective levels, for `isapart rules` and `explain`. */
export function rulesInUse(options: Pick<CheckOptions, 'configFile' | 'cwd' | 'paths' | 'ruleLevels'>): {
  rules: RuleInUse[];
  errors: InputError[];
} {
  const cwd = options.cwd ?? process.cwd();
  const { config, errors } = readConfig({ paths: options.paths, configFile: options.configFile, ruleLevels: options.ruleLevels }, cwd);
  const read = readRules(config);
  const rules = read.rules.map((rule) => ({ rule, level: config.rules[rule.id] ?? rule.level }));
  rules.push({ rule: UNUSED_ALLOW_RULE, level: config.rules[UNUSED_ALLOW_RULE.id] ?? UNUSED_ALLOW_RULE.level });
  return { rules, errors: [...errors, ...read.errors] };
}

/** Reads the built-in rules and the configured rule folders into one registry, and checks config ids. */
function readRules(config: IsapartConfig): { rules: RuleDefinition[]; errors: InputError[] } {
  const builtin = loadBuiltinRules();
  const all = [...builtin.rules];
  const errors = [...builtin.errors];
  for (const dir of config.ruleDirs) {
    const read = loadRuleDir(dir);
    all.push(...read.rules);
    errors.push(...read.errors);
  }
  // A repeated id is reported, and the first definition (built-in before rule-dirs) is kept.
  const duplicates = duplicateRuleErrors(all);
  errors.push(...duplicates);
  const seen = new Set<string>();
  const unique = all.filter((rule) => !seen.has(rule.id) && Boolean(seen.add(rule.id)));
  const rules = [...createRegistry(unique).values()];
  errors.push(...checkRuleIds(config, [...rules.map((rule) => rule.id), UNUSED_ALLOW_RULE.id]));
  return { rules, errors };
}

/** Whether a level is at or above a threshold level. */
export function atOrAbove(level: Level, threshold: Level): boolean {
  return SEVERITY[level] >= SEVERITY[threshold];
}

/** The threshold `--fail-on` takes: a level, or never. */
export type FailOn = Level | 'never';

/** The exit code of a run: 2 on any input error, 1 on an unsuppressed (and, with a baseline, new) finding at or above failOn, else 0. */
export function exitCodeFor(result: CheckResult, failOn: FailOn): 0 | 1 | 2 {
  if (result.context.inputErrors.length > 0 || result.context.ruleFailures.length > 0) return 2;
  if (failOn === 'never') return 0;
  // With a baseline only new findings count: unchanged ones were there before, absent ones are gone.
  const failing = result.findings.some(
    (finding) => !finding.suppression && finding.baselineState !== 'unchanged' && finding.baselineState !== 'absent' && atOrAbove(finding.level, failOn),
  );
  return failing ? 1 : 0;
}

/** A parsed rule level, or undefined when the text is none of error|warning|note|off. */
export function parseRuleLevel(text: string): RuleLevel | undefined {
  return text === 'error' || text === 'warning' || text === 'note' || text === 'off' ? text : undefined;
}
