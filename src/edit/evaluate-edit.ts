// The one place an edit's findings are computed: the graph with the edit applied, and the rules' findings on it.
import { runRules, type RuleToRun, type RunResult } from '../engine/run.js';
import { buildHierarchyGraph } from '../graph/build.js';
import type { HierarchyGraph, ScopeOptions } from '../graph/hierarchy-graph.js';
import type { LoadedSource } from '../load/statement.js';
import type { RoleMap } from '../roles/role.js';
import { editedSources, type EditDelta } from './delta.js';

/** Everything the evaluation of an edit may use: the run before the edit and the edit itself. */
export interface EditEvaluationInput {
  /** The sources as loaded, before the edit. */
  sources: readonly LoadedSource[];
  /** The graph built from them. */
  graph: HierarchyGraph;
  roles: RoleMap;
  scope: ScopeOptions;
  /** The active rules with their levels. */
  rules: RuleToRun[];
  /** The rules' findings and failures on `graph`, before suppression. */
  before: RunResult;
  delta: EditDelta;
}

/** The edited graph and the rules' findings and failures on it, before suppression. */
export interface EditEvaluation {
  graph: HierarchyGraph;
  result: RunResult;
}

/**
 * Evaluates the rules on the data as the edit would leave it. This rebuilds the graph from the
 * edited statements (`editedSources`) and runs every rule; an incremental evaluation must give
 * the same findings.
 */
export function evaluateEdit(input: EditEvaluationInput): EditEvaluation {
  const graph = buildHierarchyGraph(editedSources(input.sources, input.delta), input.roles, input.scope);
  return { graph, result: runRules(graph, input.rules) };
}
