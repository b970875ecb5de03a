// Findings and input problems of one lint as LSP diagnostics, grouped by the file they point into.
import { DiagnosticSeverity, DiagnosticTag, type Diagnostic, type DiagnosticRelatedInformation } from 'vscode-languageserver';
import type { CheckResult } from '../check.js';
import type { Finding, Level } from '../engine/finding.js';
import { UNUSED_ALLOW_RULE } from '../engine/suppress.js';
import type { InputError, Statement } from '../load/statement.js';
import { createTermWriter, type TermWriter } from '../report/statement-text.js';
import type { DocumentText } from './document-text.js';

/** The `source` of every diagnostic the server publishes. */
export const DIAGNOSTIC_SOURCE = 'isapart';

/** The `code` of a diagnostic for a syntax, input or config error. */
export const INPUT_ERROR_CODE = 'input-error';

/** The `code` of a diagnostic for input that was read but cannot be used as stated. */
export const INPUT_WARNING_CODE = 'input-warning';

/** What a finding's diagnostic carries in `data`, so a code action can find the finding again. */
export interface FindingData {
  fingerprint: string;
  ruleId: string;
  focus: string;
}

/** LSP severities of the SARIF levels (LSP 3.17: Error 1, Warning 2, Information 3). */
const SEVERITY: Record<Level, DiagnosticSeverity> = {
  error: DiagnosticSeverity.Error,
  warning: DiagnosticSeverity.Warning,
  note: DiagnosticSeverity.Information,
};

/** Where the server finds a file's text and the URI to publish it under. */
export interface DiagnosticFiles {
  textOf(file: string): DocumentText | undefined;
  uriOf(file: string): string;
}

/**
 * The diagnostics of one lint per file (absolute path). A finding gets one diagnostic in every file
 * its evidence points into, at its first statement there, with every other evidence statement as
 * related information; suppressed findings get none. Input errors are errors, input warnings warnings.
 */
export function diagnosticsByFile(result: CheckResult, files: DiagnosticFiles): Map<string, Diagnostic[]> {
  const byFile = new Map<string, Diagnostic[]>();
  const add = (file: string, diagnostic: Diagnostic) => {
    const list = byFile.get(file) ?? [];
    list.push(diagnostic);
    byFile.set(file, list);
  };
  const writer = createTermWriter(result.context.prefixes);
  for (const finding of result.findings) {
    if (finding.suppression) continue;
    for (const [file, diagnostic] of findingDiagnostics(finding, files, writer)) add(file, diagnostic);
  }
  for (const error of result.context.inputErrors) add(error.file, problemDiagnostic(error, DiagnosticSeverity.Error, INPUT_ERROR_CODE, files));
  for (const warning of result.context.inputWarnings) {
    add(warning.file, problemDiagnostic(warning, DiagnosticSeverity.Warning, INPUT_WARNING_CODE, files));
  }
  return byFile;
}

/** One diagnostic per file a finding points into. */
function findingDiagnostics(finding: Finding, files: DiagnosticFiles, writer: TermWriter): [string, Diagnostic][] {
  const data: FindingData = { fingerprint: finding.fingerprint, ruleId: finding.ruleId, focus: finding.focus };
  const base = {
    severity: SEVERITY[finding.level],
    code: finding.ruleId,
    source: DIAGNOSTIC_SOURCE,
    message: finding.message,
    data,
    ...(finding.ruleId === UNUSED_ALLOW_RULE.id ? { tags: [DiagnosticTag.Unnecessary] } : {}),
  };
  if (finding.evidence.length === 0) {
    if (finding.location === undefined) return [];
    const { file, line, column } = finding.location;
    const range = rangeIn(files, file, line, column, line);
    return [[file, { ...base, range }]];
  }
  const firstInFile = new Map<string, Statement>();
  for (const statement of finding.evidence) {
    if (!firstInFile.has(statement.position.file)) firstInFile.set(statement.position.file, statement);
  }
  return [...firstInFile].map(([file, primary]) => {
    const { line, column } = primary.position;
    const relatedInformation = finding.evidence
      .filter((statement) => statement !== primary)
      .map((statement) => relatedStatement(statement, files, writer));
    const diagnostic: Diagnostic = { ...base, range: rangeIn(files, file, line, column, primary.objectLine) };
    if (relatedInformation.length > 0) diagnostic.relatedInformation = relatedInformation;
    return [file, diagnostic];
  });
}

/** Another evidence statement, written out, at its place. */
function relatedStatement(statement: Statement, files: DiagnosticFiles, writer: TermWriter): DiagnosticRelatedInformation {
  const { file, line, column } = statement.position;
  return {
    location: { uri: files.uriOf(file), range: rangeIn(files, file, line, column, statement.objectLine) },
    message: `also stated: ${writer.statement(statement)}`,
  };
}

/** A syntax, input or config problem at its position, its hint after the message. */
function problemDiagnostic(problem: InputError, severity: DiagnosticSeverity, code: string, files: DiagnosticFiles): Diagnostic {
  return {
    severity,
    code,
    source: DIAGNOSTIC_SOURCE,
    message: problem.hint === undefined ? problem.message : `${problem.message}\nhint: ${problem.hint}`,
    range: rangeIn(files, problem.file, problem.line, problem.column, problem.line),
  };
}

/** The range of a 1-based place in a file, through its text when the server holds it. */
function rangeIn(files: DiagnosticFiles, file: string, line: number, column: number, objectLine: number) {
  const text = files.textOf(file);
  if (text !== undefined) return text.statementRange(line, column, objectLine);
  const start = { line: Math.max(0, line - 1), character: Math.max(0, column - 1) };
  return { start, end: { line: start.line, character: start.character + 1 } };
}
