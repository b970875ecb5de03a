// The shape of a rule file in rules/ (and in configured rule-dirs), after validation.
import type { Level } from './finding.js';

/** A variable as written in a rule, with its `?`: `?a`. */
export type Variable = string;

/** One entry of a rule's `match` conjunction. */
export type MatchEntry =
  | { type: 'path'; subject: Variable; path: string; object: Variable }
  | { type: 'is'; variable: Variable; kind: string }
  | { type: 'not'; entries: MatchEntry[] }
  | { type: 'differ'; left: Variable; right: Variable }
  | { type: 'cycle'; path: string; members: Variable }
  | { type: 'absent'; variable: Variable; path: string };

/** A triple pattern of `fix.remove`: `[?a, ROLE, ?b]`. */
export interface RemovePattern {
  subject: Variable;
  role: string;
  object: Variable;
}

/** A validated rule definition. `file` is where it was read from. */
export interface RuleDefinition {
  id: string;
  level: Level;
  summary: string;
  description: string;
  match: MatchEntry[];
  report: {
    focus: Variable;
    nodes: Variable[];
    /** Pairs of variables whose order carries no meaning (symmetric facts); sorted before reporting. */
    unordered: Variable[][];
    /** Message template; `{a}` is the display name of ?a. */
    message: string;
  };
  fix?: { remove: RemovePattern[] };
  examples: { flagged: string; clean: string };
  file: string;
}
