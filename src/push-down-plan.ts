// The effective push-down setting of a run (config and command line) and every rule compiled to SPARQL.
import path from 'node:path';
import { rulesInUse, type CheckOptions } from './check.js';
import { emptyConfig, findConfigFile, loadConfig, mergeCommandLine } from './config/load-config.js';
import type { Level } from './engine/finding.js';
import type { RuleDefinition } from './engine/rule.js';
import { compileRuleToSparql, PushDownError, type PushDownQuery, type PushDownSetting } from './engine/sparql-compile.js';
import { UNUSED_ALLOW_RULE } from './engine/suppress.js';
import type { InputError } from './load/statement.js';
import { buildRoleMap } from './roles/role-map.js';

/** What the queries are compiled for: the config and command-line settings a check would use, and an optional graph. */
export type PushDownOptions = Pick<CheckOptions, 'configFile' | 'cwd' | 'presets' | 'scope' | 'roots' | 'ruleLevels'> & { graph?: string };

/** One rule with its effective level, and its query or why it cannot be pushed down. */
export interface PushDownRule {
  rule: RuleDefinition;
  level: Level | 'off';
  query?: PushDownQuery;
  problem?: PushDownError;
}

/** The setting, the rules (unused-allow excepted: it reads allow comments in files) and config errors. */
export interface PushDownPlan {
  setting: PushDownSetting;
  /** The config file read, if any. */
  configFile?: string;
  rules: PushDownRule[];
  errors: InputError[];
}

/**
 * Compiles every rule of a run (built-in and rule-dirs) to its push-down query, with the roles,
 * scope and roots of the config and command line. A rule that cannot be compiled for this setting
 * carries its PushDownError instead of a query; nothing is left out silently.
 */
export function pushDownPlan(options: PushDownOptions): PushDownPlan {
  const cwd = options.cwd ?? process.cwd();
  // The config as check() finds it: -c, else the nearest isapart.yaml upward; then the command line.
  const configFile = options.configFile ? path.resolve(cwd, options.configFile) : findConfigFile(path.resolve(cwd, '.'));
  const fromFile = configFile ? loadConfig(configFile) : { config: emptyConfig(), errors: [] };
  const merged = mergeCommandLine(fromFile.config, { presets: options.presets, scope: options.scope, roots: options.roots, ruleLevels: options.ruleLevels });
  const config = merged.config;
  const errors = [...fromFile.errors, ...merged.errors];
  const read = rulesInUse({ configFile: options.configFile, cwd, paths: ['.'], ruleLevels: options.ruleLevels });
  const setting: PushDownSetting = { roleMap: buildRoleMap(config.presets, config.roles), scope: config.scope, roots: config.roots, graph: options.graph };
  const rules = read.rules
    .filter((entry) => entry.rule.id !== UNUSED_ALLOW_RULE.id)
    .map(({ rule, level }): PushDownRule => {
      try {
        return { rule, level, query: compileRuleToSparql(rule, setting) };
      } catch (error) {
        if (error instanceof PushDownError) return { rule, level, problem: error };
        throw error;
      }
    });
  const seen = new Set<string>();
  const allErrors = [...errors, ...read.errors].filter((error) => {
    const key = `${error.file}:${error.line}:${error.column}:${error.message}`;
    return !seen.has(key) && Boolean(seen.add(key));
  });
  return { setting, configFile, rules, errors: allErrors };
}
