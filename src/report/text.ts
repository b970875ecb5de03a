// The text report: findings grouped by file for a terminal, coloured with chalk when asked.
import { Chalk, type ChalkInstance } from 'chalk';
import { statementKey } from '../edit/delta.js';
import type { Finding, Level } from '../engine/finding.js';
import type { InputError, Position } from '../load/statement.js';
import type { ReportContext } from './context.js';
import { compareText, countFindings, LEVELS, primaryPosition, sortFindings, type FindingCounts } from './findings-summary.js';
import { paintForLevel } from './level-paint.js';
import { relativePath } from './paths.js';
import { createTermWriter, type TermWriter } from './statement-text.js';

/** The report context; its prefixes (prefix → namespace IRI) write IRIs as prefixed names. */
export type TextReportContext = ReportContext;

const LEVEL_WIDTH = 'warning'.length;
const NO_LOCATION = '(no location)';
const FINDING_INDENT = '  ';
const DETAIL_INDENT = '      ';

interface TextWriter {
  paint: ChalkInstance;
  terms: TermWriter;
  cwd: string;
}

/** Renders findings, input errors and rule failures as text, ending with a one-line summary. */
export function toText(findings: Finding[], context: TextReportContext): string {
  const writer: TextWriter = {
    // Level 1 (16 colours) when colour is on: fixed, so the output never depends on the terminal.
    paint: new Chalk({ level: context.color ? 1 : 0 }),
    terms: createTermWriter(context.prefixes),
    cwd: context.cwd,
  };
  // With a baseline, only new findings are listed; unchanged ones are counted, absent ones listed apart.
  const listed = findings.filter((finding) => finding.baselineState === undefined || finding.baselineState === 'new');
  const counts = countFindings(findings, context);
  const sections = [
    inputProblemsSection(context.inputErrors, 'error', writer),
    inputProblemsSection(context.inputWarnings ?? [], 'warning', writer),
    ruleFailuresSection(context, writer),
    ...fileSections(listed.filter((finding) => !finding.suppression), writer),
    allowedSection(listed.filter((finding) => finding.suppression), writer),
    absentSection(findings.filter((finding) => finding.baselineState === 'absent'), writer, context.edit),
    baselineSection(context, counts, listed.length),
    editSection(context, writer),
  ].filter((section) => section.length > 0);
  sections.push([summaryLine(counts, writer.paint, context.baseline !== undefined || context.edit !== undefined, context.edit !== undefined)]);
  return `${sections.map((lines) => lines.join('\n')).join('\n\n')}\n`;
}

/** Input errors or input warnings, each with its position, message and hint. */
function inputProblemsSection(problems: InputError[], level: 'error' | 'warning', writer: TextWriter): string[] {
  if (problems.length === 0) return [];
  const lines = [writer.paint.bold(`input ${level}s (${problems.length})`)];
  for (const problem of problems) {
    lines.push(`${FINDING_INDENT}${writer.paint.dim(positionText(problem, writer.cwd))}  ${levelWord(level, writer.paint)}  ${problem.message}`);
    if (problem.hint) lines.push(`${DETAIL_INDENT}hint: ${problem.hint}`);
  }
  return lines;
}

function ruleFailuresSection(context: ReportContext, writer: TextWriter): string[] {
  if (context.ruleFailures.length === 0) return [];
  const lines = [writer.paint.bold(`rule failures (${context.ruleFailures.length})`)];
  for (const failure of context.ruleFailures) {
    lines.push(`${FINDING_INDENT}${levelWord('error', writer.paint)}  ${failure.ruleId}  the rule failed: ${failure.message}`);
  }
  return lines;
}

function fileSections(findings: Finding[], writer: TextWriter): string[][] {
  const byFile = new Map<string, Finding[]>();
  for (const finding of sortFindings(findings)) {
    const position = primaryPosition(finding);
    const file = position ? relativePath(position.file, writer.cwd) : NO_LOCATION;
    const group = byFile.get(file);
    if (group) group.push(finding);
    else byFile.set(file, [finding]);
  }
  const files = [...byFile.keys()].sort(compareText);
  return files.map((file) => [writer.paint.bold.underline(file), ...byFile.get(file)!.flatMap((finding) => findingLines(finding, writer))]);
}

function findingLines(finding: Finding, writer: TextWriter): string[] {
  const lines = [`${FINDING_INDENT}${levelWord(finding.level, writer.paint)}  ${finding.ruleId}  ${finding.message}`];
  for (const statement of finding.evidence) {
    lines.push(`${DETAIL_INDENT}${evidenceWhere(statement.position, writer)}${writer.terms.statement(statement)}`);
  }
  if (finding.evidence.length === 0 && finding.location) {
    lines.push(`${DETAIL_INDENT}${writer.paint.dim(positionText(finding.location, writer.cwd))}`);
  }
  for (const statement of finding.fix?.remove ?? []) {
    lines.push(`${DETAIL_INDENT}fix: remove ${evidenceWhere(statement.position, writer)}${writer.terms.statement(statement)}`);
  }
  return lines;
}

function allowedSection(suppressed: Finding[], writer: TextWriter): string[] {
  if (suppressed.length === 0) return [];
  const perRule = new Map<string, { inSource: number; external: number }>();
  for (const finding of suppressed) {
    const counts = perRule.get(finding.ruleId) ?? { inSource: 0, external: 0 };
    counts[finding.suppression!.kind] += 1;
    perRule.set(finding.ruleId, counts);
  }
  const lines = [writer.paint.bold(`allowed (${suppressed.length})`)];
  for (const ruleId of [...perRule.keys()].sort(compareText)) {
    const counts = perRule.get(ruleId)!;
    const ways = [
      counts.inSource > 0 ? `${counts.inSource} by allow comment` : '',
      counts.external > 0 ? `${counts.external} by config` : '',
    ].filter((way) => way !== '');
    lines.push(`${FINDING_INDENT}${ruleId}  ${counts.inSource + counts.external} allowed (${ways.join(', ')})`);
  }
  return lines;
}

/** Findings of the baseline that this run no longer has, each with its rule and message. */
function absentSection(absent: Finding[], writer: TextWriter, edit: ReportContext['edit']): string[] {
  if (absent.length === 0) return [];
  const lines = [writer.paint.bold(`${edit !== undefined ? 'resolved by the edit' : 'no longer found'} (${absent.length})`)];
  // An edit names the statements of its own that a resolved finding's evidence loses.
  const removals = new Map((edit?.removals ?? []).map((statement) => [statementKey(statement), statement]));
  for (const finding of sortFindings(absent)) {
    lines.push(`${FINDING_INDENT}${levelWord(finding.level, writer.paint)}  ${finding.ruleId}  ${finding.message}`);
    const removed = new Set(finding.evidence.flatMap((statement) => removals.get(statementKey(statement)) ?? []));
    for (const statement of removed) lines.push(`${DETAIL_INDENT}removed: ${evidenceWhere(statement.position, writer)}${writer.terms.statement(statement)}`);
  }
  return lines;
}

/** One line saying what the findings were compared with and how many of each state there are. */
function baselineSection(context: ReportContext, counts: FindingCounts, newCount: number): string[] {
  if (context.baseline === undefined) return [];
  const gone = counts.absent === 0 ? 'none no longer found' : `${counts.absent} no longer found`;
  return [`compared with ${context.baseline.source}: ${newCount} new, ${counts.unchanged} unchanged (not listed), ${gone}`];
}

/** What the edit read and changed: its files and its statements added, removed and ignored. */
function editSection(context: ReportContext, writer: TextWriter): string[] {
  const edit = context.edit;
  if (edit === undefined) return [];
  const files = edit.files.map((file) => `${file.role === 'edit' ? '' : `--${file.role} `}${relativePath(file.file, writer.cwd)}`).join(', ');
  const absent = edit.removedAbsent === 0 ? '' : ` (${edit.removedAbsent} of them not in the data)`;
  const ignored = edit.ignored === 0 ? '' : `, ${plural(edit.ignored, 'statement')} ignored (no role reads ${edit.ignored === 1 ? 'its' : 'their'} predicate)`;
  const lines = [`edit ${files}: ${plural(edit.added, 'statement')} added, ${edit.removed} removed${absent}${ignored}; nothing was written`];
  const how = edit.evaluation;
  if (how !== undefined && how.rebuiltBecause !== undefined) lines.push(`not patched in place: ${how.rebuiltBecause} from the edited statements`);
  if (how !== undefined && how.rebuiltBecause === undefined && how.fullRuns.length > 0) {
    const named = how.fullRuns.map((run) => `${run.ruleId} (${run.reason})`).join(', ');
    lines.push(`${plural(how.fullRuns.length, 'rule')} of ${how.rules} ran over the whole edited graph: ${named}`);
  }
  return lines;
}

function summaryLine(counts: FindingCounts, paint: ChalkInstance, withBaseline: boolean, withEdit: boolean): string {
  const levelCounts = LEVELS.map((level) => {
    const text = plural(counts[level], withBaseline ? `new ${level}` : level);
    return counts[level] > 0 ? paintForLevel(level, paint)(text) : text;
  });
  const introduced = counts.error + counts.warning + counts.note;
  const parts = [withEdit ? `introduces ${introduced}, resolves ${counts.absent}: ${levelCounts.join(', ')}` : levelCounts.join(', '), `${counts.suppressed} allowed`];
  if (withEdit) parts.push(`${counts.unchanged} unchanged`);
  else if (withBaseline) parts.push(`${counts.unchanged} unchanged`, `${counts.absent} no longer found`);
  if (counts.inputErrors > 0) parts.push(paint.red(plural(counts.inputErrors, 'input error')));
  if (counts.ruleFailures > 0) parts.push(paint.red(plural(counts.ruleFailures, 'rule failure')));
  parts.push(`${plural(counts.files, 'file')} and ${plural(counts.statements, 'statement')} read`);
  return parts.join('; ');
}

/** An evidence statement's place before it; none for a statement without a line (from an endpoint), as the heading names its source. */
function evidenceWhere(position: Position, writer: TextWriter): string {
  return position.line < 1 ? '' : `${writer.paint.dim(positionText(position, writer.cwd))}  `;
}

function positionText(position: Position, cwd: string): string {
  const file = relativePath(position.file, cwd);
  if (position.line < 1) return file;
  return position.column < 1 ? `${file}:${position.line}` : `${file}:${position.line}:${position.column}`;
}

// Padded to the longest level word, so messages line up.
function levelWord(level: Level, paint: ChalkInstance): string {
  return `${paintForLevel(level, paint)(level)}${' '.repeat(LEVEL_WIDTH - level.length)}`;
}


function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? '' : 's'}`;
}
