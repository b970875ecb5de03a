// `isapart check`: normalise the options, run the library, write the report, return the exit code.
import path from 'node:path';
import { prepareBaseline, type BaselineSource } from '../baseline/apply.js';
import { isNewOrUncompared } from '../baseline/compare.js';
import { atOrAbove, check, exitCodeFor, parseRuleLevel, type CheckOptions, type FailOn } from '../check.js';
import { iriProblem } from '../config/iri-check.js';
import { checkEdit, prepareEdit, type EditInputs } from '../edit/check-edit.js';
import type { Finding, Level } from '../engine/finding.js';
import { textRemovalsFor } from '../fix/removals.js';
import { toHtml } from '../report/html/html.js';
import { toJson } from '../report/json.js';
import { toSarif } from '../report/sarif.js';
import { toSparqlUpdate } from '../report/sparql-update.js';
import { toText } from '../report/text.js';
import type { Terminal } from './terminal.js';
import { LoadProgressBar, progressWanted } from './progress.js';
import { printInputErrors, printRuleFailures } from './print-problems.js';
import { outputPathProblem, writeFailureReason, writeFileAtomically } from './write-output.js';

/** The options of `isapart check` as commander parses them. */
export interface CheckCommandOptions {
  format: 'text' | 'json' | 'sarif' | 'html' | 'sparql-update';
  output?: string;
  config?: string;
  preset?: string[];
  rule?: string[];
  scope?: string[];
  root?: string[];
  base?: string;
  failOn: FailOn;
  color: boolean;
  quiet?: boolean;
  baseline?: string;
  since?: string;
  /** false for --no-progress. */
  progress?: boolean;
  endpoint?: string;
  graph?: string;
  pushDown?: boolean;
  /** --edit files; more than one is refused. */
  edit?: string[];
  add?: string[];
  remove?: string[];
}

/** Why the edit options cannot be used with the others given, or undefined when they can. */
function editUsageProblem(options: CheckCommandOptions): string | undefined {
  if ((options.edit ?? []).length > 1) {
    return `--edit takes one SPARQL Update file (given: ${options.edit!.join(', ')}); put the operations in one file, separated by ;, in the order they are to run`;
  }
  const given = [options.edit !== undefined ? '--edit' : '', (options.add ?? []).length > 0 ? '--add' : '', (options.remove ?? []).length > 0 ? '--remove' : ''].filter(Boolean);
  if (given.length === 0) return undefined;
  const named = given.join('/');
  if (options.baseline !== undefined || options.since !== undefined) {
    return `${named} compares the data with itself after the edit, which is its own baseline; leave out ${options.baseline !== undefined ? '--baseline' : '--since'}, or compare with a baseline in a separate run`;
  }
  if (options.endpoint !== undefined) {
    return `${named} lints an edit of files; to lint an edit of an endpoint's data, export the graph to a file (e.g. a CONSTRUCT query saved as N-Triples) and give it as the data path`;
  }
  if (options.format === 'sparql-update') {
    return `-f sparql-update writes a fix script for the data as it is, and ${named} lints data that does not exist yet; fix the edit file instead (its new findings name the edit's lines), or run without ${named} for the data's fix script`;
  }
  return undefined;
}

/** Why the endpoint options cannot be used together with the paths given, or undefined when they can. */
function endpointUsageProblem(paths: string[], options: CheckCommandOptions): string | undefined {
  if (options.endpoint === undefined) {
    if (options.pushDown === true) return '--push-down runs the rules on a SPARQL endpoint: give it with --endpoint URL';
    if (options.graph !== undefined) return '--graph names a graph of a SPARQL endpoint: give the endpoint with --endpoint URL';
    return undefined;
  }
  // Commander fills in '.' when no path is given.
  if (paths.length !== 1 || paths[0] !== '.') return `--endpoint reads from the endpoint instead of files; leave out the paths (${paths.join(' ')}), or lint them in a separate run`;
  return undefined;
}

const FORMATTERS = { text: toText, json: toJson, sarif: toSarif, html: toHtml, 'sparql-update': toSparqlUpdate } as const;

/** Parses `--rule ID=LEVEL` values; a malformed one is a usage error message. */
function parseRuleOptions(values: string[]): { levels: Record<string, string>; error?: string } {
  const levels: Record<string, string> = {};
  for (const value of values) {
    const [id, level, ...rest] = value.split('=');
    if (!id || level === undefined || rest.length > 0 || parseRuleLevel(level) === undefined) {
      return { levels, error: `--rule ${value}: expected ID=LEVEL with LEVEL one of error, warning, note, off (e.g. --rule orphan-class=off)` };
    }
    levels[id] = level;
  }
  return { levels };
}

/** Whether the text report may use colour. */
function colourAllowed(options: CheckCommandOptions, terminal: Terminal): boolean {
  if (!options.color || options.output) return false;
  if (terminal.env.NO_COLOR !== undefined && terminal.env.NO_COLOR !== '') return false;
  return terminal.outIsTty;
}

/** The line that says how many findings `--quiet` left out, per level, or '' when it left out none. */
function quietNote(hidden: Finding[], threshold: Level): string {
  if (hidden.length === 0) return '';
  const counts = (['warning', 'note'] as const)
    .map((level) => ({ level, count: hidden.filter((finding) => finding.level === level).length }))
    .filter((entry) => entry.count > 0)
    .map((entry) => `${entry.count} ${entry.level}${entry.count === 1 ? '' : 's'}`);
  return `--quiet: ${counts.join(', ')} below level ${threshold} not shown (the counts above leave them out); run without -q to see them\n`;
}

/** Runs `isapart check` and returns its exit code. */
export async function runCheckCommand(
  paths: string[],
  options: CheckCommandOptions,
  terminal: Terminal,
  commandLine: string,
): Promise<number> {
  const rules = parseRuleOptions(options.rule ?? []);
  if (rules.error) {
    terminal.err(`isapart: ${rules.error}\n`);
    return 2;
  }
  const baseProblem = options.base === undefined ? undefined : iriProblem(options.base);
  if (baseProblem !== undefined) {
    terminal.err(`isapart: --base ${options.base}: not an absolute IRI: ${baseProblem}\n  hint: give the IRI the document's relative IRIs resolve against, such as https://data.northvale-rail.example/def/\n`);
    return 2;
  }
  const editProblem = editUsageProblem(options);
  if (editProblem !== undefined) {
    terminal.err(`isapart: ${editProblem}\n`);
    return 2;
  }
  const endpointProblem = endpointUsageProblem(paths, options);
  if (endpointProblem !== undefined) {
    terminal.err(`isapart: ${endpointProblem}\n`);
    return 2;
  }
  const outputFile = options.output === undefined ? undefined : path.resolve(terminal.cwd, options.output);
  // Checked before linting, so a long run is not wasted on a report that cannot be written.
  const outputProblem = outputFile === undefined ? undefined : outputPathProblem(outputFile);
  if (outputProblem !== undefined) {
    terminal.err(`isapart: -o ${options.output}: cannot write the report there: ${outputProblem.reason}\n  hint: ${outputProblem.hint}\n`);
    return 2;
  }
  const bar = progressWanted({ progress: options.progress !== false, quiet: options.quiet }, terminal) && terminal.errStream !== undefined
    ? new LoadProgressBar(terminal.errStream)
    : undefined;
  const checkOptions: CheckOptions = {
    paths,
    cwd: terminal.cwd,
    stdin: terminal.stdin,
    configFile: options.config,
    presets: options.preset,
    scope: options.scope,
    roots: options.root,
    baseIri: options.base,
    ruleLevels: rules.levels,
    color: colourAllowed(options, terminal),
    commandLine,
    onProgress: bar === undefined ? undefined : (progress) => bar.update(progress),
    endpoint: options.endpoint,
    graph: options.graph,
    pushDown: options.pushDown,
    env: terminal.env,
  };
  if (options.baseline !== undefined && options.since !== undefined) {
    terminal.err('isapart: --baseline and --since each give the baseline; use one of them\n');
    return 2;
  }
  const source: BaselineSource | undefined =
    options.baseline !== undefined ? { file: options.baseline } : options.since !== undefined ? { revision: options.since } : undefined;
  // The baseline is checked before linting, so a long run is not wasted on a comparison that cannot be made.
  const baseline = source === undefined ? undefined : await prepareBaseline(source, checkOptions);
  if (baseline !== undefined && 'error' in baseline) {
    printInputErrors([baseline.error], terminal);
    return 2;
  }
  const editInputs: EditInputs = { editFile: options.edit?.[0], addFiles: options.add ?? [], removeFiles: options.remove ?? [] };
  const editing = editInputs.editFile !== undefined || (editInputs.addFiles ?? []).length > 0 || (editInputs.removeFiles ?? []).length > 0;
  // The edit is read and checked before the data, so a refused operation does not wait for a long load.
  const edit = editing ? await prepareEdit(editInputs, checkOptions) : undefined;
  if (edit !== undefined && 'errors' in edit) {
    printInputErrors(edit.errors, terminal);
    return 2;
  }
  const checked = await (edit === undefined ? check(checkOptions) : checkEdit(checkOptions, edit)).finally(() => bar?.stop());
  if ('errors' in checked) {
    printInputErrors(checked.errors, terminal);
    return 2;
  }
  let result = checked;
  if (baseline !== undefined) {
    const compared = await baseline.prepared(result);
    if ('error' in compared) {
      printInputErrors([compared.error], terminal);
      return 2;
    }
    result = compared;
  }
  if (options.format === 'sarif') {
    result = { ...result, context: { ...result.context, removals: await textRemovalsFor(result.findings, result.context.sources, terminal.cwd) } };
  }
  const threshold: Level = options.failOn === 'never' ? 'error' : options.failOn;
  const quietText = options.quiet === true && options.format === 'text';
  const shown = quietText
    ? result.findings.filter((finding) => finding.suppression || !isNewOrUncompared(finding) || atOrAbove(finding.level, threshold))
    : result.findings;
  // With a baseline the note counts what --quiet left out of the new findings, as the summary does.
  const hidden = quietText ? result.findings.filter((finding) => isNewOrUncompared(finding) && !finding.suppression && !atOrAbove(finding.level, threshold)) : [];
  const report = FORMATTERS[options.format](shown, result.context) + quietNote(hidden, threshold);
  // A report that is not text on the terminal (a file, or JSON/SARIF on stdout) would leave the errors unseen.
  if (outputFile !== undefined || options.format !== 'text') {
    printInputErrors(result.context.inputErrors, terminal);
    printRuleFailures(result.context.ruleFailures, terminal);
  }
  if (outputFile === undefined) {
    terminal.out(report);
    return exitCodeFor(result, options.failOn);
  }
  try {
    await writeFileAtomically(outputFile, report);
  } catch (error) {
    terminal.err(`isapart: -o ${options.output}: the report could not be written: ${writeFailureReason(error)}\n`);
    return 2;
  }
  return exitCodeFor(result, options.failOn);
}
