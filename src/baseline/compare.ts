// Comparing a run's findings with a baseline's by fingerprint: new, unchanged, or absent.
import type { Finding } from '../engine/finding.js';

/** How many findings of a comparison are in each state. */
export interface BaselineCounts {
  new: number;
  unchanged: number;
  absent: number;
}

/**
 * The run's findings with `baselineState` set, then the baseline's findings that the run no longer
 * has, marked `absent`. A finding is unchanged when the baseline holds its fingerprint; a
 * fingerprint held n times in the baseline matches at most n findings of the run.
 */
export function compareWithBaseline(findings: readonly Finding[], baseline: readonly Finding[]): Finding[] {
  const remaining = new Map<string, Finding[]>();
  for (const earlier of baseline) {
    const same = remaining.get(earlier.fingerprint);
    if (same === undefined) remaining.set(earlier.fingerprint, [earlier]);
    else same.push(earlier);
  }
  const compared: Finding[] = findings.map((finding) => {
    const same = remaining.get(finding.fingerprint);
    if (same === undefined || same.length === 0) return { ...finding, baselineState: 'new' };
    same.shift();
    return { ...finding, baselineState: 'unchanged' };
  });
  for (const left of remaining.values()) {
    // An absent finding was suppressed or not in that run; now it is simply gone.
    for (const earlier of left) compared.push({ ...earlier, fix: undefined, suppression: undefined, baselineState: 'absent' });
  }
  return compared;
}

/** Counts the states of compared findings (findings without a state count as new). */
export function countBaselineStates(findings: readonly Finding[]): BaselineCounts {
  const counts: BaselineCounts = { new: 0, unchanged: 0, absent: 0 };
  for (const finding of findings) counts[finding.baselineState ?? 'new'] += 1;
  return counts;
}

/** Whether a finding counts for the exit code and the summary: not one the baseline already had, nor one gone since. */
export function isNewOrUncompared(finding: Finding): boolean {
  return finding.baselineState === undefined || finding.baselineState === 'new';
}
