// Counting and ordering findings the same way in every report.
import type { Finding, Level } from '../engine/finding.js';
import { compareFindings } from '../engine/run.js';
import type { Position } from '../load/statement.js';
import type { ReportContext } from './context.js';

/** Finding levels from most to least severe. */
export const LEVELS: readonly Level[] = ['error', 'warning', 'note'];

/**
 * What a report's summary counts. Level counts leave out suppressed findings; with a baseline,
 * level and suppressed counts are of new findings only, and `unchanged` and `absent` count the rest.
 */
export interface FindingCounts {
  error: number;
  warning: number;
  note: number;
  suppressed: number;
  unchanged: number;
  absent: number;
  inputErrors: number;
  ruleFailures: number;
  files: number;
  statements: number;
}

/** Where a finding is reported: its first evidence statement, else its `location`. */
export function primaryPosition(finding: Finding): Position | undefined {
  return finding.evidence.length > 0 ? finding.evidence[0].position : finding.location;
}

/** Counts findings per level (suppressed ones apart), problems, and what was read. */
export function countFindings(findings: Finding[], context: ReportContext): FindingCounts {
  const counts: FindingCounts = {
    error: 0,
    warning: 0,
    note: 0,
    suppressed: 0,
    unchanged: 0,
    absent: 0,
    inputErrors: context.inputErrors.length,
    ruleFailures: context.ruleFailures.length,
    files: context.sources.length,
    statements: 0,
  };
  for (const finding of findings) {
    if (finding.baselineState === 'unchanged' || finding.baselineState === 'absent') counts[finding.baselineState] += 1;
    else if (finding.suppression) counts.suppressed += 1;
    else counts[finding.level] += 1;
  }
  for (const source of context.sources) counts.statements += source.statements;
  return counts;
}

/** Findings in report order: by file, line, column of their primary position, then rule id and fingerprint. */
export function sortFindings(findings: Finding[]): Finding[] {
  return [...findings].sort(compareFindings);
}

/** Compares strings by UTF-16 code units, the same on every machine (no locale). */
export function compareText(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
