// Compiles a property path to a small epsilon-free automaton whose transitions are (role, direction).
import { ROLES, type Role } from '../roles/role.js';
import type { PathExpression } from './path.js';

/** Which way a transition walks a role's stored edges. */
export const FORWARD = 0;
export const BACKWARD = 1;

/**
 * An epsilon-free automaton. State 0 is the start. The transitions of state s are the indexes
 * transitionStart[s] .. transitionStart[s + 1] - 1 of the three transition arrays.
 */
export interface PathAutomaton {
  readonly stateCount: number;
  readonly accepting: Uint8Array;
  readonly transitionStart: Int32Array;
  /** Index into ROLES. */
  readonly transitionRole: Int32Array;
  /** FORWARD or BACKWARD. */
  readonly transitionDirection: Int32Array;
  readonly transitionTarget: Int32Array;
}

/** One labelled transition while building: from, to, role index, direction. */
interface LabelledEdge {
  from: number;
  to: number;
  role: number;
  direction: number;
}

/** Thompson construction: every fragment has one entry and one exit state, joined by epsilon moves. */
class ThompsonBuilder {
  stateCount = 0;
  readonly epsilon: number[][] = [];
  readonly labelled: LabelledEdge[] = [];

  newState(): number {
    this.epsilon.push([]);
    return this.stateCount++;
  }

  link(from: number, to: number): void {
    this.epsilon[from].push(to);
  }

  /** Builds the fragment of a path; `inverted` walks it backwards (^ pushed down to the roles). */
  fragment(path: PathExpression, inverted: boolean): { entry: number; exit: number } {
    switch (path.type) {
      case 'role': {
        const entry = this.newState();
        const exit = this.newState();
        this.labelled.push({ from: entry, to: exit, role: ROLES.indexOf(path.role), direction: inverted ? BACKWARD : FORWARD });
        return { entry, exit };
      }
      case 'inverse':
        return this.fragment(path.path, !inverted);
      case 'sequence': {
        const steps = inverted ? [...path.steps].reverse() : path.steps;
        const fragments = steps.map((step) => this.fragment(step, inverted));
        for (let index = 1; index < fragments.length; index++) this.link(fragments[index - 1].exit, fragments[index].entry);
        return { entry: fragments[0].entry, exit: fragments[fragments.length - 1].exit };
      }
      case 'alternative': {
        const entry = this.newState();
        const exit = this.newState();
        for (const option of path.options) {
          const inner = this.fragment(option, inverted);
          this.link(entry, inner.entry);
          this.link(inner.exit, exit);
        }
        return { entry, exit };
      }
      case 'modified': {
        const entry = this.newState();
        const exit = this.newState();
        const inner = this.fragment(path.path, inverted);
        this.link(entry, inner.entry);
        this.link(inner.exit, exit);
        if (path.modifier !== '+') this.link(entry, exit);
        if (path.modifier !== '?') this.link(inner.exit, inner.entry);
        return { entry, exit };
      }
    }
  }

  /** The states reachable from a state by epsilon moves alone, itself included (iterative). */
  closure(state: number): Set<number> {
    const reached = new Set([state]);
    const stack = [state];
    while (stack.length > 0) {
      const current = stack.pop() as number;
      for (const next of this.epsilon[current]) {
        if (!reached.has(next)) {
          reached.add(next);
          stack.push(next);
        }
      }
    }
    return reached;
  }
}

/**
 * Compiles a path to an epsilon-free automaton; `inverted` gives the automaton of the inverse
 * path, which walks from an end node back to its start nodes.
 */
export function compileAutomaton(path: PathExpression, inverted = false): PathAutomaton {
  const builder = new ThompsonBuilder();
  const { entry, exit } = builder.fragment(path, inverted);
  const outgoing = new Map<number, LabelledEdge[]>();
  for (const edge of builder.labelled) {
    const list = outgoing.get(edge.from) ?? [];
    list.push(edge);
    outgoing.set(edge.from, list);
  }
  // Keep the start and the targets of labelled moves; each kept state takes over its closure's moves.
  const kept = new Map<number, number>([[entry, 0]]);
  const order = [entry];
  const accepting: number[] = [];
  const moves: { role: number; direction: number; target: number }[][] = [];
  for (let index = 0; index < order.length; index++) {
    const closure = builder.closure(order[index]);
    accepting.push(closure.has(exit) ? 1 : 0);
    const stateMoves: { role: number; direction: number; target: number }[] = [];
    const seen = new Set<string>();
    for (const member of [...closure].sort((left, right) => left - right)) {
      for (const edge of outgoing.get(member) ?? []) {
        if (!kept.has(edge.to)) {
          kept.set(edge.to, order.length);
          order.push(edge.to);
        }
        const target = kept.get(edge.to) as number;
        const key = `${edge.role}:${edge.direction}:${target}`;
        if (seen.has(key)) continue;
        seen.add(key);
        stateMoves.push({ role: edge.role, direction: edge.direction, target });
      }
    }
    moves.push(stateMoves);
  }
  const transitionCount = moves.reduce((sum, list) => sum + list.length, 0);
  const transitionStart = new Int32Array(order.length + 1);
  const transitionRole = new Int32Array(transitionCount);
  const transitionDirection = new Int32Array(transitionCount);
  const transitionTarget = new Int32Array(transitionCount);
  let next = 0;
  for (let state = 0; state < order.length; state++) {
    transitionStart[state] = next;
    for (const move of moves[state]) {
      transitionRole[next] = move.role;
      transitionDirection[next] = move.direction;
      transitionTarget[next] = move.target;
      next++;
    }
  }
  transitionStart[order.length] = next;
  return {
    stateCount: order.length,
    accepting: Uint8Array.from(accepting),
    transitionStart,
    transitionRole,
    transitionDirection,
    transitionTarget,
  };
}

/** A role and direction walked by one step of a path, e.g. ^part-of is (part-of, BACKWARD). */
export interface RoleStep {
  role: Role;
  direction: number;
}

/**
 * The single steps of a path that is one role, an inverse role, or an alternative of those
 * (e.g. `subclass-of|^part-of`); undefined for any other path.
 */
export function singleSteps(path: PathExpression): RoleStep[] | undefined {
  if (path.type === 'role') return [{ role: path.role, direction: FORWARD }];
  if (path.type === 'inverse' && path.path.type === 'role') return [{ role: path.path.role, direction: BACKWARD }];
  if (path.type === 'inverse') {
    const inner = singleSteps(path.path);
    return inner?.map((step) => ({ role: step.role, direction: step.direction === FORWARD ? BACKWARD : FORWARD }));
  }
  if (path.type !== 'alternative') return undefined;
  const steps: RoleStep[] = [];
  for (const option of path.options) {
    const inner = singleSteps(option);
    if (inner === undefined) return undefined;
    for (const step of inner) {
      if (!steps.some((known) => known.role === step.role && known.direction === step.direction)) steps.push(step);
    }
  }
  return steps;
}
