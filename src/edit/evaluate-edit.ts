// The one place an edit's findings are computed: the graph with the edit applied, and the rules' findings on it.
import { rerunRules } from '../engine/incremental.js';
import type { RuleToRun, RunResult } from '../engine/run.js';
import { applyEditToGraph } from '../graph/apply-edit.js';
import type { EditEvaluationNote } from '../report/context.js';
import type { HierarchyGraph, ScopeOptions } from '../graph/hierarchy-graph.js';
import type { LoadedSource } from '../load/statement.js';
import type { RoleMap } from '../roles/role.js';
import type { EditDelta } from './delta.js';

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
  /** Whether the graph was patched, and which rules ran in full. */
  note: EditEvaluationNote;
}

/**
 * Evaluates the rules on the data as the edit would leave it, incrementally: the built graph is
 * patched with the delta (`applyEditToGraph`, which rebuilds from the edited statements where it
 * cannot patch soundly) and each rule is re-run around the changed nodes (`rerunRules`). The
 * result equals a rebuild from `editedSources` with every rule run; test/edit/ holds it to that.
 */
export function evaluateEdit(input: EditEvaluationInput): EditEvaluation {
  const applied = applyEditToGraph(input.graph, input.delta, input.roles, input.scope);
  const rerun = rerunRules({ graph: input.graph, result: input.before }, applied, input.rules);
  const note: EditEvaluationNote = {
    rebuiltBecause: applied.changes.rebuilt ? applied.changes.reason ?? 'it could not be patched' : undefined,
    fullRuns: applied.changes.rebuilt ? [] : rerun.fullRuns,
    rules: input.rules.length,
  };
  return { graph: applied.graph, result: { findings: rerun.findings, failures: rerun.failures }, note };
}
