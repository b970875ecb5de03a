// Test helper: lints source texts with chosen rules, through the real loader, graph, roles and engine.
import type { RolePredicates } from '../../src/config/config.js';
import { DEFAULT_PRESETS } from '../../src/config/config.js';
import type { Finding, RuleFailure } from '../../src/engine/finding.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import { runRules } from '../../src/engine/run.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import type { HierarchyGraph, ScopeOptions } from '../../src/graph/hierarchy-graph.js';
import { parseSource } from '../../src/load/parse.js';
import type { LoadedSource, N3Format } from '../../src/load/statement.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import type { Role } from '../../src/roles/role.js';

/** One source text to lint. */
export interface SourceText {
  text: string;
  file: string;
  format: N3Format;
}

/** What to lint and how: the rules run at their own levels. */
export interface LintTextsOptions {
  sources: SourceText[];
  rules: RuleDefinition[];
  scope?: ScopeOptions;
  presets?: readonly string[];
  roles?: Partial<Record<Role, RolePredicates>>;
}

/** The loaded sources, the graph and the engine's result. */
export interface LintTextsResult {
  sources: LoadedSource[];
  graph: HierarchyGraph;
  findings: Finding[];
  failures: RuleFailure[];
}

/** Parses, builds and runs; default presets, no config roles, every IRI in scope and no roots. */
export function lintTexts(options: LintTextsOptions): LintTextsResult {
  const sources = options.sources.map((source) => parseSource(source.text, source.file, source.format));
  const roleMap = buildRoleMap(options.presets ?? DEFAULT_PRESETS, options.roles ?? {});
  const graph = buildHierarchyGraph(sources, roleMap, options.scope ?? { prefixes: [], roots: [] });
  const { findings, failures } = runRules(graph, options.rules.map((rule) => ({ rule, level: rule.level })));
  return { sources, graph, findings, failures };
}
