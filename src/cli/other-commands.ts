// `isapart rules`, `explain` and `init`: small commands around the rule registry and the config.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { rulesInUse } from '../check.js';
import { starterConfig } from '../config/starter.js';
import { suggestionHint } from '../config/nearest.js';
import { explainRule, rulesToJson, rulesToMarkdown, rulesToText } from '../report/rules-list.js';
import { printInputErrors } from './print-problems.js';
import type { Terminal } from './terminal.js';
import { writeFileAtomically } from './write-output.js';

/** Runs `isapart rules`. */
export async function runRulesCommand(
  options: { format: 'text' | 'json' | 'markdown'; config?: string; color: boolean },
  terminal: Terminal,
): Promise<number> {
  const { rules, errors } = rulesInUse({ configFile: options.config, cwd: terminal.cwd, paths: ['.'] });
  printInputErrors(errors, terminal);
  const color = options.color && terminal.outIsTty && !terminal.env.NO_COLOR;
  const text =
    options.format === 'json' ? rulesToJson(rules) : options.format === 'markdown' ? rulesToMarkdown(rules) : rulesToText(rules, color);
  terminal.out(text);
  return errors.length > 0 ? 2 : 0;
}

/** Runs `isapart explain RULE-ID`. */
export async function runExplainCommand(ruleId: string, options: { config?: string }, terminal: Terminal): Promise<number> {
  const { rules, errors } = rulesInUse({ configFile: options.config, cwd: terminal.cwd, paths: ['.'] });
  printInputErrors(errors, terminal);
  const found = rules.find((entry) => entry.rule.id === ruleId);
  if (!found) {
    const hint = suggestionHint(ruleId, rules.map((entry) => entry.rule.id), 'rule ids');
    terminal.err(`isapart: no rule '${ruleId}'\n  hint: ${hint}; 'isapart rules' lists them with their summaries\n`);
    return 2;
  }
  terminal.out(explainRule(found.rule, found.level));
  return errors.length > 0 ? 2 : 0;
}

/** Runs `isapart init`: writes a starter isapart.yaml unless one exists. */
export async function runInitCommand(options: { force?: boolean }, terminal: Terminal): Promise<number> {
  const file = path.join(terminal.cwd, 'isapart.yaml');
  if (existsSync(file) && !options.force) {
    terminal.err(`isapart: ${file} exists already; use --force to overwrite it\n`);
    return 2;
  }
  await writeFileAtomically(file, starterConfig());
  terminal.out(`wrote ${file}\n`);
  return 0;
}
