// Linting an edit before it runs: the findings of the data before and after the edit, compared by fingerprint (new, unchanged, absent).
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { compareWithBaseline } from '../baseline/compare.js';
import { checkLoadedWith, loadPaths, readLoadSettings, type CheckOptions, type CheckResult } from '../check.js';
import { predicatesTheGraphReads } from '../graph/read-predicates.js';
import { blankNodeLabelPrefix, defaultBaseIri } from '../load/parse.js';
import type { InputError, LoadedSource, Statement } from '../load/statement.js';
import type { EditEvaluationNote, EditReport } from '../report/context.js';
import { applySparqlEdit } from './apply-sparql-edit.js';
import { statementKey, type EditDelta } from './delta.js';
import { evaluateEdit } from './evaluate-edit.js';
import { readSparqlEdit, type SparqlEdit } from './sparql-edit.js';

/** The edit a run is asked to lint: a SPARQL Update file, and RDF files of statements to add and to remove. */
export interface EditInputs {
  editFile?: string;
  addFiles?: string[];
  removeFiles?: string[];
}

/** An edit read and checked before the data is: its update, and the statements of its --add and --remove files. */
export interface PreparedEdit {
  sparql?: SparqlEdit;
  addSources: LoadedSource[];
  removeSources: LoadedSource[];
  files: EditReport['files'];
  /** Problems that leave the edit usable, for the report. */
  warnings: InputError[];
  /** The file the edit is named after in reports. */
  file: string;
}

/**
 * Reads the edit's files: the update is parsed and every operation checked (so a refused one
 * fails before the data is read), the --add and --remove files loaded as data is. Any problem is
 * an input error, with the file and line.
 */
export async function prepareEdit(inputs: EditInputs, options: CheckOptions): Promise<PreparedEdit | { errors: InputError[] }> {
  const cwd = options.cwd ?? process.cwd();
  const settings = readLoadSettings(options);
  const keptPredicates = predicatesTheGraphReads(settings.roleMap);
  const files: EditReport['files'] = [];
  const errors: InputError[] = [];
  let sparql: SparqlEdit | undefined;
  if (inputs.editFile !== undefined) {
    const file = inputs.editFile;
    files.push({ file, role: 'edit', format: 'sparql-update' });
    let text: string | undefined;
    try {
      text = await readFile(path.resolve(cwd, file), 'utf8');
    } catch (error) {
      const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : error instanceof Error ? error.message : String(error);
      errors.push({ file, line: 0, column: 0, message: `the edit file could not be read: ${reason}`, hint: 'give the path of a SPARQL 1.1 Update file (often named *.ru) with --edit' });
    }
    if (text !== undefined) {
      // A byte order mark is no part of the update (sparqljs skips it; the line reader must too).
      const read = readSparqlEdit(file, text.replace(/^\uFEFF/, ''), { baseIri: options.baseIri ?? defaultBaseIri(file, cwd), keptPredicates });
      if ('error' in read) errors.push(read.error);
      else sparql = read;
    }
  }
  const loadEach = async (paths: string[], role: 'add' | 'remove') => {
    if (paths.length === 0) return [];
    const loaded = await loadPaths(paths, { ...options, onProgress: undefined }, settings);
    errors.push(...loaded.errors, ...loaded.sources.flatMap((source) => source.errors));
    for (const source of loaded.sources) files.push({ file: source.file, role, format: source.format });
    return loaded.sources;
  };
  const removeSources = await loadEach(inputs.removeFiles ?? [], 'remove');
  const addSources = await loadEach(inputs.addFiles ?? [], 'add');
  if (errors.length > 0) return { errors };
  const warnings = [...removeSources, ...addSources].flatMap((source) => source.warnings ?? []);
  warnings.push(...blankNodeRemovalWarnings(removeSources));
  if (sparql !== undefined && sparql.operations.length === 0) {
    warnings.push({ file: sparql.file, line: 0, column: 0, message: 'the edit holds no operation, so it changes nothing', hint: 'an edit is a SPARQL 1.1 Update such as INSERT DATA { … } or DELETE DATA { … }; check that the right file was given' });
  }
  return { sparql, addSources, removeSources, files, warnings, file: files[0]?.file ?? '<edit>' };
}

/**
 * Lints the data, applies the edit, lints the edited data, and returns the edited run's findings
 * compared with the first run's: `new` (the edit introduces it), `unchanged`, or `absent` (the
 * edit resolves it). Suppressions apply to both runs alike.
 */
export async function checkEdit(options: CheckOptions, edit: PreparedEdit): Promise<CheckResult | { errors: InputError[] }> {
  const startTime = new Date();
  const cwd = options.cwd ?? process.cwd();
  const settings = readLoadSettings(options);
  const loaded = await loadPaths(options.paths, options, settings);
  // The edit's own files are read as the edit, so a data folder holding them does not list them as unread.
  const alsoRead = edit.files.map((file) => file.file);
  const before = checkLoadedWith(loaded, options, { startTime, alsoRead });
  const delta = editDelta(edit, loaded.sources, {
    keptPredicates: predicatesTheGraphReads(settings.roleMap),
    blankNodePrefix: blankNodeLabelPrefix(edit.file, cwd),
  });
  // A FILTER that turns out to compare literals by value is refused when met, before any finding is reported.
  if ('error' in delta) return { errors: [delta.error] };
  let evaluation: EditEvaluationNote | undefined;
  const after = checkLoadedWith(loaded, options, {
    startTime,
    alsoRead,
    // The edit's allow comments (and those of --add files) apply to the statements it adds; --remove files add no statement to allow.
    allowComments: [...(edit.sparql?.allowComments ?? []), ...edit.addSources.flatMap((source) => source.allowComments)],
    evaluate: ({ roleMap, scope, rules }) => {
      const evaluated = evaluateEdit({ sources: loaded.sources, graph: before.graph, roles: roleMap, scope, rules, before: before.run ?? { findings: [], failures: [] }, delta });
      evaluation = evaluated.note;
      return { graph: evaluated.graph, run: evaluated.result };
    },
  });
  const report: EditReport = {
    files: edit.files,
    added: delta.added.length,
    removed: delta.removed.length,
    removedAbsent: removedNotInData(delta, loaded.sources),
    ignored: delta.ignored,
    removals: delta.removed,
    evaluation,
  };
  return {
    ...after,
    findings: compareWithBaseline(after.findings, before.findings),
    context: {
      ...after.context,
      edit: report,
      ruleFailures: mergedFailures(before, after),
      inputWarnings: [...after.context.inputWarnings, ...edit.warnings],
    },
  };
}

/** How many of the statements the edit removes the data does not state. */
function removedNotInData(delta: EditDelta, sources: readonly LoadedSource[]): number {
  if (delta.removed.length === 0) return 0;
  const removed = new Set(delta.removed.map(statementKey));
  for (const source of sources) {
    if (source.rows === undefined) {
      for (const statement of source.statements) removed.delete(statementKey(statement));
      continue;
    }
    // A stored source is scanned by subject number, so that only rows about a removed subject become statements.
    const { store, start, end } = source.rows;
    const subjects = new Set(delta.removed.map((statement) => store.termNumberOf(statement.subject)).filter((number) => number >= 0));
    if (subjects.size === 0) continue;
    const column = store.subjects;
    for (let row = start; row < end; row++) if (subjects.has(column[row])) removed.delete(statementKey(store.statement(row)));
  }
  return removed.size;
}

/** A warning for each --remove file whose statements have blank nodes: those never match the data's blank nodes, so they remove nothing. */
function blankNodeRemovalWarnings(sources: readonly LoadedSource[]): InputError[] {
  return sources.flatMap((source) => {
    const blank = source.statements.filter((statement) => statement.subject.startsWith('_:') || (typeof statement.object === 'string' && statement.object.startsWith('_:')));
    if (blank.length === 0) return [];
    const first = blank[0].position;
    return [
      {
        file: source.file,
        line: first.line,
        column: first.column,
        message: `${blank.length === 1 ? '1 statement' : `${blank.length} statements`} to remove ${blank.length === 1 ? 'has' : 'have'} a blank node, which names a node of this file only, so ${blank.length === 1 ? 'it removes' : 'they remove'} nothing from the data`,
        hint: 'name the nodes by IRI, or remove such statements with a DELETE … WHERE in an --edit file, whose pattern finds the data\'s blank nodes',
      },
    ];
  });
}

/** The rule failures of both runs, each rule once: a rule that failed before the edit leaves its comparison incomplete. */
function mergedFailures(before: CheckResult, after: CheckResult): CheckResult['context']['ruleFailures'] {
  const failed = new Set(after.context.ruleFailures.map((failure) => failure.ruleId));
  return [...after.context.ruleFailures, ...before.context.ruleFailures.filter((failure) => !failed.has(failure.ruleId))];
}

/**
 * The whole edit as one delta: the update's operations first, then the --remove files, then the
 * --add files; a statement's last change decides whether it is added or removed.
 */
function editDelta(edit: PreparedEdit, sources: readonly LoadedSource[], options: { keptPredicates: ReadonlySet<string>; blankNodePrefix: string }): EditDelta | { error: InputError } {
  const changes = new Map<string, { inserted: boolean; statement: Statement }>();
  const change = (statement: Statement, inserted: boolean) => {
    const key = statementKey(statement);
    changes.delete(key);
    changes.set(key, { inserted, statement });
  };
  let ignored = 0;
  if (edit.sparql !== undefined) {
    const delta = applySparqlEdit(edit.sparql, { sources, ...options });
    if ('error' in delta) return delta;
    for (const statement of delta.removed) change(statement, false);
    for (const statement of delta.added) change(statement, true);
    ignored += delta.ignored;
  }
  for (const source of edit.removeSources) {
    for (const statement of source.statements) change(statement, false);
    ignored += source.unkeptStatements ?? 0;
  }
  for (const source of edit.addSources) {
    for (const statement of source.statements) change(statement, true);
    ignored += source.unkeptStatements ?? 0;
  }
  const added: Statement[] = [];
  const removed: Statement[] = [];
  for (const { inserted, statement } of changes.values()) (inserted ? added : removed).push(statement);
  return { file: edit.file, added, removed, ignored };
}
