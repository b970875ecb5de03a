// Findings: what a rule reports, as plain data that every formatter reads.
import type { Position, Statement } from '../load/statement.js';

/** SARIF levels a finding can have. */
export type Level = 'error' | 'warning' | 'note';

/** A rule's configured level: a finding level, or off. */
export type RuleLevel = Level | 'off';

/** How a finding was suppressed: an allow comment in the source, or an `allow:` entry in config. */
export interface Suppression {
  kind: 'inSource' | 'external';
  justification: string;
  /** Where the allow comment or config entry is. */
  file: string;
  line: number;
}

/** One reported fact about the hierarchy. */
export interface Finding {
  ruleId: string;
  level: Level;
  /** IRI or blank-node label the finding is anchored on. */
  focus: string;
  /** Involved nodes, in the rule's order (unordered pairs sorted, a cycle's members by term). */
  nodes: string[];
  message: string;
  /** The statements that made it, first one is the primary location. */
  evidence: Statement[];
  /** sha-256 hex of ruleId + nodes, never of positions. */
  fingerprint: string;
  /** Where to report a finding that has no statement evidence (an unused allow comment). */
  location?: Position;
  fix?: { remove: Statement[] };
  suppression?: Suppression;
  /** Where a baseline is in use: whether the finding is new, also in the baseline, or only in the baseline. */
  baselineState?: 'new' | 'unchanged' | 'absent';
}

/** A rule that failed while running; reported instead of crashing the run. */
export interface RuleFailure {
  ruleId: string;
  message: string;
}
