// Runs a plan: backtracking over its steps (recursion on the step index only, never on graph depth).
import type { HierarchyGraph } from '../graph/hierarchy-graph.js';
import { FORWARD, type RoleStep } from './automaton.js';
import type { CycleComponent } from './cycle.js';
import type { PlanStep } from './plan.js';

/** The bindings of one solution: a node id per node slot (-1 unbound) and a component per list slot. */
export interface Bindings {
  nodes: Int32Array;
  lists: (CycleComponent | undefined)[];
}

/** Called once per solution, in plan order; returning true stops the evaluation. */
export type SolutionHandler = (bindings: Bindings) => boolean;

/** Fresh, unbound bindings for a rule's slots. */
export function createBindings(nodeSlotCount: number, listSlotCount: number): Bindings {
  return { nodes: new Int32Array(nodeSlotCount).fill(-1), lists: new Array(listSlotCount).fill(undefined) };
}

/**
 * Runs plan steps from the current bindings and calls `onSolution` for each solution. Returns true
 * when a handler asked to stop. The bindings object is reused: copy what you keep.
 */
export function evaluatePlan(graph: HierarchyGraph, steps: PlanStep[], bindings: Bindings, onSolution: SolutionHandler): boolean {
  const nodes = bindings.nodes;
  const runFrom = (index: number): boolean => {
    if (index === steps.length) return onSolution(bindings);
    const step = steps[index];
    const next = index + 1;
    switch (step.kind) {
      case 'is':
        if (!step.generate) return graph.is(step.nodeKind, nodes[step.slot]) ? runFrom(next) : false;
        for (let id = 0; id < graph.nodeCount; id++) {
          if (!graph.is(step.nodeKind, id)) continue;
          nodes[step.slot] = id;
          if (runFrom(next)) return true;
        }
        return false;
      case 'differ':
        return nodes[step.left] !== nodes[step.right] ? runFrom(next) : false;
      case 'edge-check':
        return hasStep(graph, step.steps, nodes[step.subject], nodes[step.object]) ? runFrom(next) : false;
      case 'path-check':
        return step.search.holds(nodes[step.subject], nodes[step.object]) ? runFrom(next) : false;
      case 'absent':
        return step.search.reachesAny(nodes[step.slot]) ? false : runFrom(next);
      case 'anti-join':
        return evaluatePlan(graph, step.steps, bindings, () => true) ? false : runFrom(next);
      case 'expand': {
        const ends = step.search.from(nodes[step.bound]);
        for (let index = 0; index < ends.length; index++) {
          nodes[step.free] = ends[index];
          if (runFrom(next)) return true;
        }
        return false;
      }
      case 'generate':
        return generate(graph, step, nodes, () => runFrom(next));
      case 'cycle': {
        const count = step.source.count();
        for (let component = 0; component < count; component++) {
          bindings.lists[step.slot] = step.source.component(component);
          if (runFrom(next)) return true;
        }
        return false;
      }
    }
  };
  return runFrom(0);
}

/** Whether one of the single steps connects two nodes. */
function hasStep(graph: HierarchyGraph, steps: RoleStep[], from: number, to: number): boolean {
  for (const { role, direction } of steps) {
    if (direction === FORWARD ? graph.hasEdge(role, from, to) : graph.hasEdge(role, to, from)) return true;
  }
  return false;
}

/** Enumerates every (subject, object) pair of a path with neither end bound, subjects ascending. */
function generate(graph: HierarchyGraph, step: Extract<PlanStep, { kind: 'generate' }>, nodes: Int32Array, next: () => boolean): boolean {
  const { subject, object, search, steps } = step;
  for (let id = 0; id < graph.nodeCount; id++) {
    if (subject === object) {
      const holds = steps !== undefined ? hasStep(graph, steps, id, id) : search.holds(id, id);
      if (!holds) continue;
      nodes[subject] = id;
      if (next()) return true;
      continue;
    }
    nodes[subject] = id;
    if (steps !== undefined && steps.length === 1 && steps[0].direction === FORWARD) {
      const targets = graph.successors(steps[0].role, id);
      for (let index = 0; index < targets.length; index++) {
        nodes[object] = targets[index];
        if (next()) return true;
      }
      continue;
    }
    const ends = search.from(id);
    for (let index = 0; index < ends.length; index++) {
      nodes[object] = ends[index];
      if (next()) return true;
    }
  }
  return false;
}
