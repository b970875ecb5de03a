// `isapart rules --sparql RULE-ID`: prints one rule's push-down query with the setting it was compiled for.
import { suggestionHint } from '../config/nearest.js';
import { pushDownPlan } from '../push-down-plan.js';
import { pushDownQueryText } from '../report/sparql-query.js';
import { printInputErrors } from './print-problems.js';
import type { Terminal } from './terminal.js';

/** What `rules --sparql` takes: the rule id, and the settings a check would use. */
export interface SparqlQueryCommandOptions {
  config?: string;
  preset?: string[];
  scope?: string[];
  root?: string[];
  graph?: string;
}

/** Runs `isapart rules --sparql RULE-ID`; exit 2, and no query, on a config error, an unknown id or a rule that cannot be pushed down. */
export async function runSparqlQueryCommand(ruleId: string, options: SparqlQueryCommandOptions, terminal: Terminal): Promise<number> {
  let plan;
  try {
    plan = pushDownPlan({ configFile: options.config, cwd: terminal.cwd, presets: options.preset, scope: options.scope, roots: options.root, graph: options.graph });
  } catch (error) {
    terminal.err(`isapart: ${error instanceof Error ? error.message : String(error)}\n`);
    return 2;
  }
  printInputErrors(plan.errors, terminal);
  // A query compiled from a config with errors would leave out what the user asked for: print none.
  if (plan.errors.length > 0) return 2;
  const found = plan.rules.find((entry) => entry.rule.id === ruleId);
  if (found === undefined) {
    const hint = suggestionHint(ruleId, plan.rules.map((entry) => entry.rule.id), 'rule ids');
    terminal.err(`isapart: no rule '${ruleId}'\n  hint: ${hint}; 'isapart rules' lists them\n`);
    return 2;
  }
  if (found.query === undefined) {
    terminal.err(`isapart: rule ${ruleId} cannot be pushed down: ${found.problem?.message ?? 'unknown reason'}\n  hint: ${found.problem?.hint ?? ''}\n`);
    return 2;
  }
  terminal.out(pushDownQueryText(found.query, plan.setting, plan.configFile));
  return 0;
}
