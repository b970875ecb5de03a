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

/** The handler of an anti-join: its first inner solution settles it. */
const STOP_AT_FIRST: SolutionHandler = () => true;

/**
 * Runs plan steps from the current bindings and calls `onSolution` for each solution. Returns true
 * when a handler asked to stop. The bindings object is reused: copy what you keep.
 */
export function evaluatePlan(graph: HierarchyGraph, steps: PlanStep[], bindings: Bindings, onSolution: SolutionHandler): boolean {
  return new PlanRunner(graph, bindings).run(steps, 0, onSolution);
}

/** Backtracking over plan steps; one runner serves a plan and its anti-joins, so no closure is made per step. */
class PlanRunner {
  private readonly nodes: Int32Array;

  constructor(
    private readonly graph: HierarchyGraph,
    private readonly bindings: Bindings,
  ) {
    this.nodes = bindings.nodes;
  }

  /** Runs `steps` from `index` on; true when `onSolution` asked to stop. */
  run(steps: PlanStep[], index: number, onSolution: SolutionHandler): boolean {
    if (index === steps.length) return onSolution(this.bindings);
    const { graph, nodes } = this;
    const step = steps[index];
    const next = index + 1;
    switch (step.kind) {
      case 'seed':
        for (let index = 0; index < step.ids.length; index++) {
          const id = step.ids[index];
          if (id >= graph.nodeCount || graph.vanished?.(id) === true) continue;
          nodes[step.slot] = id;
          if (this.run(steps, next, onSolution)) return true;
        }
        return false;
      case 'is':
        if (!step.generate) return graph.is(step.nodeKind, nodes[step.slot]) ? this.run(steps, next, onSolution) : false;
        for (let id = 0; id < graph.nodeCount; id++) {
          if (!graph.is(step.nodeKind, id)) continue;
          nodes[step.slot] = id;
          if (this.run(steps, next, onSolution)) return true;
        }
        return false;
      case 'differ':
        return nodes[step.left] !== nodes[step.right] ? this.run(steps, next, onSolution) : false;
      case 'edge-check':
        return hasStep(graph, step.steps, nodes[step.subject], nodes[step.object]) ? this.run(steps, next, onSolution) : false;
      case 'path-check':
        return step.search.holds(nodes[step.subject], nodes[step.object]) ? this.run(steps, next, onSolution) : false;
      case 'absent':
        return step.search.reachesAny(nodes[step.slot]) ? false : this.run(steps, next, onSolution);
      case 'anti-join':
        return this.run(step.steps, 0, STOP_AT_FIRST) ? false : this.run(steps, next, onSolution);
      case 'expand': {
        const ends = step.search.from(nodes[step.bound]);
        for (let end = 0; end < ends.length; end++) {
          nodes[step.free] = ends[end];
          if (this.run(steps, next, onSolution)) return true;
        }
        return false;
      }
      case 'generate':
        return this.generate(step, steps, next, onSolution);
      case 'cycle': {
        const indexes = step.only === undefined ? undefined : step.source.componentsHolding(step.only);
        const count = indexes === undefined ? step.source.count() : indexes.length;
        for (let position = 0; position < count; position++) {
          this.bindings.lists[step.slot] = step.source.component(indexes === undefined ? position : indexes[position]);
          if (this.run(steps, next, onSolution)) return true;
        }
        return false;
      }
    }
  }

  /** Enumerates every (subject, object) pair of a path with neither end bound, subjects ascending, running the steps after it for each. */
  private generate(step: Extract<PlanStep, { kind: 'generate' }>, steps: PlanStep[], next: number, onSolution: SolutionHandler): boolean {
    const { graph, nodes } = this;
    const { subject, object, search } = step;
    const roleSteps = step.steps;
    const vanished = graph.vanished?.bind(graph);
    for (let id = 0; id < graph.nodeCount; id++) {
      // An id an edit stripped of every statement is no node: only a zero-length path could reach it.
      if (vanished !== undefined && vanished(id)) continue;
      if (subject === object) {
        const holds = roleSteps !== undefined ? hasStep(graph, roleSteps, id, id) : search.holds(id, id);
        if (!holds) continue;
        nodes[subject] = id;
        if (this.run(steps, next, onSolution)) return true;
        continue;
      }
      nodes[subject] = id;
      if (roleSteps !== undefined && roleSteps.length === 1 && roleSteps[0].direction === FORWARD) {
        const targets = graph.successors(roleSteps[0].role, id);
        for (let index = 0; index < targets.length; index++) {
          nodes[object] = targets[index];
          if (this.run(steps, next, onSolution)) return true;
        }
        continue;
      }
      const ends = search.from(id);
      for (let index = 0; index < ends.length; index++) {
        nodes[object] = ends[index];
        if (this.run(steps, next, onSolution)) return true;
      }
    }
    return false;
  }
}

/** Whether one of the single steps connects two nodes. */
function hasStep(graph: HierarchyGraph, steps: RoleStep[], from: number, to: number): boolean {
  for (const { role, direction } of steps) {
    if (direction === FORWARD ? graph.hasEdge(role, from, to) : graph.hasEdge(role, to, from)) return true;
  }
  return false;
}
