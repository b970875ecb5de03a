// The JSON report: a versioned document (format `isapart-findings`, version 2) described by docs/findings.schema.json.
import type { Finding, RuleFailure, Suppression } from '../engine/finding.js';
import type { InputError, Literal, Position, RdfFormat, Statement } from '../load/statement.js';
import type { ReportContext } from './context.js';
import { countFindings, sortFindings } from './findings-summary.js';
import { relativePath } from './paths.js';

/** The `format` value that marks an isapart findings document. */
export const JSON_REPORT_FORMAT = 'isapart-findings';

/**
 * The version of the findings document; raised when a field changes meaning or goes away, or when
 * fingerprints are computed differently (version 2: a cycle's nodes sorted by term; baselineState).
 * A baseline is read only when it has this version, so fingerprints are always compared like with like.
 */
export const JSON_REPORT_VERSION = 2;

/** A statement as the JSON report writes it; `graph` is '' for the default graph. */
export interface JsonStatement {
  subject: string;
  predicate: string;
  object: string | Literal;
  graph: string;
  file: string;
  line: number;
  column: number;
}

/** One finding as the JSON report writes it. */
export interface JsonFinding {
  ruleId: string;
  level: Finding['level'];
  focus: string;
  nodes: string[];
  message: string;
  fingerprint: string;
  evidence: JsonStatement[];
  location?: Position;
  fix?: { remove: JsonStatement[] };
  suppression?: Suppression;
  baselineState?: Finding['baselineState'];
}

/** The whole findings document. */
export interface JsonReport {
  format: typeof JSON_REPORT_FORMAT;
  version: typeof JSON_REPORT_VERSION;
  tool: { name: string; version: string };
  configFile?: string;
  summary: {
    errors: number;
    warnings: number;
    notes: number;
    suppressed: number;
    inputErrors: number;
    ruleFailures: number;
    files: number;
    statements: number;
    /** With a baseline: what it was, and how many findings are new, unchanged or absent (level counts are of new ones only). */
    baseline?: { source: string; new: number; unchanged: number; absent: number };
    /** With an edit: its files, its statements, and how many findings it introduces, leaves and resolves. */
    edit?: {
      files: { file: string; role: 'edit' | 'add' | 'remove'; format: RdfFormat | 'sparql-update' }[];
      added: number;
      removed: number;
      ignored: number;
      introduced: number;
      unchanged: number;
      resolved: number;
    };
  };
  inputs: { file: string; format: RdfFormat; statements: number }[];
  findings: JsonFinding[];
  inputErrors: InputError[];
  inputWarnings: InputError[];
  ruleFailures: RuleFailure[];
}

/** Builds the findings document; paths are relative to `context.cwd`, findings in report order. */
export function toJsonReport(findings: Finding[], context: ReportContext): JsonReport {
  const cwd = context.cwd;
  const counts = countFindings(findings, context);
  const report: JsonReport = {
    format: JSON_REPORT_FORMAT,
    version: JSON_REPORT_VERSION,
    tool: { name: context.toolName, version: context.toolVersion },
    ...(context.configFile === undefined ? {} : { configFile: relativePath(context.configFile, cwd) }),
    summary: {
      errors: counts.error,
      warnings: counts.warning,
      notes: counts.note,
      suppressed: counts.suppressed,
      inputErrors: counts.inputErrors,
      ruleFailures: counts.ruleFailures,
      files: counts.files,
      statements: counts.statements,
      ...(context.baseline === undefined
        ? {}
        : { baseline: { source: context.baseline.source, new: findings.length - counts.unchanged - counts.absent, unchanged: counts.unchanged, absent: counts.absent } }),
      ...(context.edit === undefined
        ? {}
        : {
            edit: {
              files: context.edit.files.map((file) => ({ file: relativePath(file.file, cwd), role: file.role, format: file.format })),
              added: context.edit.added,
              removed: context.edit.removed,
              ignored: context.edit.ignored,
              introduced: findings.length - counts.unchanged - counts.absent,
              unchanged: counts.unchanged,
              resolved: counts.absent,
            },
          }),
    },
    inputs: context.sources.map((source) => ({
      file: relativePath(source.file, cwd),
      format: source.format,
      statements: source.statements,
    })),
    findings: sortFindings(findings).map((finding) => jsonFinding(finding, cwd)),
    inputErrors: context.inputErrors.map((error) => jsonInputError(error, cwd)),
    inputWarnings: (context.inputWarnings ?? []).map((warning) => jsonInputError(warning, cwd)),
    ruleFailures: context.ruleFailures.map((failure) => ({ ruleId: failure.ruleId, message: failure.message })),
  };
  return report;
}

function jsonInputError(error: InputError, cwd: string): InputError {
  return {
    file: relativePath(error.file, cwd),
    line: error.line,
    column: error.column,
    message: error.message,
    ...(error.hint === undefined ? {} : { hint: error.hint }),
  };
}

/** The findings document as text: 2-space indentation, fixed key order, trailing newline. */
export function toJson(findings: Finding[], context: ReportContext): string {
  return `${JSON.stringify(toJsonReport(findings, context), null, 2)}\n`;
}

function jsonFinding(finding: Finding, cwd: string): JsonFinding {
  const written: JsonFinding = {
    ruleId: finding.ruleId,
    level: finding.level,
    focus: finding.focus,
    nodes: [...finding.nodes],
    message: finding.message,
    fingerprint: finding.fingerprint,
    evidence: finding.evidence.map((statement) => jsonStatement(statement, cwd)),
  };
  if (finding.location) {
    written.location = { file: relativePath(finding.location.file, cwd), line: finding.location.line, column: finding.location.column };
  }
  if (finding.fix) written.fix = { remove: finding.fix.remove.map((statement) => jsonStatement(statement, cwd)) };
  if (finding.suppression) {
    const { kind, justification, file, line } = finding.suppression;
    written.suppression = { kind, justification, file: relativePath(file, cwd), line };
  }
  if (finding.baselineState) written.baselineState = finding.baselineState;
  return written;
}

function jsonStatement(statement: Statement, cwd: string): JsonStatement {
  const object = typeof statement.object === 'string'
    ? statement.object
    : { value: statement.object.value, datatype: statement.object.datatype, language: statement.object.language };
  return {
    subject: statement.subject,
    predicate: statement.predicate,
    object,
    graph: statement.graph,
    file: relativePath(statement.position.file, cwd),
    line: statement.position.line,
    column: statement.position.column,
  };
}
