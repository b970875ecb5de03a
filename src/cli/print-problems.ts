// Input errors and rule failures on standard error, for runs whose report does not reach the terminal.
import type { RuleFailure } from '../engine/finding.js';
import type { InputError } from '../load/statement.js';
import { relativePath } from '../report/paths.js';
import type { Terminal } from './terminal.js';

/** Where a problem is: `file:line:column`, `file:line`, or the file alone when it has no line. */
function placeOf(problem: InputError, cwd: string): string {
  const file = problem.file.startsWith('<') ? problem.file : relativePath(problem.file, cwd);
  if (problem.line < 1) return file;
  return problem.column < 1 ? `${file}:${problem.line}` : `${file}:${problem.line}:${problem.column}`;
}

/** Prints input errors to stderr as `file:line:col: error: message`, each hint on its own line. */
export function printInputErrors(errors: readonly InputError[], terminal: Terminal): void {
  for (const error of errors) {
    // An error about no file (a command-line option) is named by the program instead.
    const place = error.file === '' ? 'isapart' : placeOf(error, terminal.cwd);
    terminal.err(`${place}: error: ${error.message}${error.hint ? `\n  hint: ${error.hint}` : ''}\n`);
  }
}

/** Prints rule failures to stderr, one line each, naming the rule. */
export function printRuleFailures(failures: readonly RuleFailure[], terminal: Terminal): void {
  for (const failure of failures) terminal.err(`isapart: rule ${failure.ruleId} failed: ${failure.message}\n`);
}
