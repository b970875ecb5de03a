// Role paths as SPARQL 1.1 property paths over the predicates that play each role.
import { BACKWARD, singleSteps } from './automaton.js';
import { formatPath, matchesEmpty, type PathExpression } from './path.js';
import type { GraphTerms } from './sparql-graph-terms.js';
import { PushDownError } from './sparql-text.js';

/** A compiled path: one that matches nothing, only the zero-length walk, or a property path. */
export type CompiledPath = { kind: 'empty' } | { kind: 'zero-length' } | { kind: 'path'; text: string };

const EMPTY: CompiledPath = { kind: 'empty' };
const ZERO_LENGTH: CompiledPath = { kind: 'zero-length' };

/**
 * A role path as a property path (SPARQL 1.1 Query §9.1): each role becomes the alternative of its
 * predicates (`^` for inverse ones, both ways for symmetric roles). A role without predicates
 * matches nothing, and the operators are simplified around it (`x*` of nothing is the zero-length
 * walk). owl:AllDisjointClasses members cannot be walked by a property path, so a disjoint-with
 * step inside a longer path is refused while that axiom is read.
 */
export function propertyPath(path: PathExpression, terms: GraphTerms): CompiledPath {
  switch (path.type) {
    case 'role': {
      if (path.role === 'disjoint-with' && terms.readsAllDisjointClasses) {
        throw new PushDownError(
          'disjoint-with inside a longer path cannot be pushed down while owl:AllDisjointClasses axioms are read: a property path cannot pair the members of their lists',
          'write disjoint-with as a match entry of its own ([?a, disjoint-with, ?b]), or lint an extraction in memory',
        );
      }
      const text = terms.rolePath(path.role);
      return text === undefined ? EMPTY : { kind: 'path', text };
    }
    case 'inverse': {
      const inner = propertyPath(path.path, terms);
      return inner.kind === 'path' ? { kind: 'path', text: `^(${inner.text})` } : inner;
    }
    case 'sequence': {
      const steps = path.steps.map((step) => propertyPath(step, terms));
      if (steps.some((step) => step.kind === 'empty')) return EMPTY;
      const texts = steps.flatMap((step) => (step.kind === 'path' ? [`(${step.text})`] : []));
      return texts.length === 0 ? ZERO_LENGTH : { kind: 'path', text: texts.join('/') };
    }
    case 'alternative': {
      const options = path.options.map((option) => propertyPath(option, terms));
      const texts = options.flatMap((option) => (option.kind === 'path' ? [`(${option.text})`] : []));
      const zeroLength = options.some((option) => option.kind === 'zero-length');
      if (texts.length === 0) return zeroLength ? ZERO_LENGTH : EMPTY;
      const text = texts.join('|');
      return { kind: 'path', text: zeroLength ? `(${text})?` : text };
    }
    case 'modified': {
      const inner = propertyPath(path.path, terms);
      if (inner.kind === 'empty') return path.modifier === '+' ? EMPTY : ZERO_LENGTH;
      if (inner.kind === 'zero-length') return ZERO_LENGTH;
      return { kind: 'path', text: `(${inner.text})${path.modifier}` };
    }
  }
}

/**
 * A match entry `[subject, PATH, object]` as a group pattern. A path of single role steps is
 * written exactly, with both ends checked to be nodes; a longer path as a property path whose ends
 * are checked (its inner nodes are not: see the README). `subjectBound` says that an earlier
 * pattern binds the subject, which picks the form of a closed walk. Returns undefined when the path
 * matches nothing.
 */
export function pathPattern(subject: string, path: PathExpression, object: string, terms: GraphTerms, subjectBound = false): string | undefined {
  const steps = singleSteps(path);
  if (steps !== undefined) {
    const elements: string[] = [];
    let allDisjoint = false;
    for (const step of steps) {
      elements.push(...terms.roleElements(step.role, step.direction === BACKWARD));
      if (step.role === 'disjoint-with' && terms.readsAllDisjointClasses) allDisjoint = true;
    }
    const unique = [...new Set(elements)];
    const branches: string[] = [];
    if (unique.length > 0) branches.push(`${subject} ${unique.length === 1 ? unique[0] : unique.join('|')} ${object}`);
    if (allDisjoint) branches.push(terms.allDisjointPairs(subject, object));
    if (branches.length === 0) return undefined;
    return branches.length === 1 ? branches[0] : branches.map((branch) => `{ ${branch} }`).join(' UNION ');
  }
  if (subject === object && path.type === 'modified' && path.modifier === '+' && !matchesEmpty(path.path)) return closedWalkPattern(subject, path.path, terms, subjectBound);
  const compiled = propertyPath(path, terms);
  if (compiled.kind === 'empty') return undefined;
  if (compiled.kind === 'zero-length') {
    throw new PushDownError(
      `the path '${formatPath(path)}' matches only walks of zero edges with these roles (a role in it has no predicate), which a SPARQL triple pattern cannot state`,
      'map a predicate to each role of the path (presets or roles: in the config), or lint in memory',
    );
  }
  return `${subject} ${compiled.text} ${object}`;
}

/**
 * `[?x, X+, ?x]` as a closure and one step, never as a closure from a variable back to itself (which
 * gives no rows on Virtuoso 7.2). When ?x is already bound, the closure starts at ?x and ends at a
 * fresh variable, and one step leads back: `?x X* ?last . ?last X ?x`; a closure into a bound ?x
 * from a node bound by a step gives wrong answers there. When ?x is not bound yet, a first step
 * binds the next node and the closure leads back: `?x X ?next . ?next X* ?x`, as a closure may not
 * start unbound. Either way the inner node is checked as the in-memory graph would.
 */
function closedWalkPattern(node: string, base: PathExpression, terms: GraphTerms, nodeBound: boolean): string | undefined {
  const inner = terms.names.fresh();
  const step = nodeBound ? pathPattern(inner, base, node, terms) : pathPattern(node, base, inner, terms);
  const closure = propertyPath(base, terms);
  if (step === undefined || closure.kind === 'empty') return undefined;
  if (closure.kind !== 'path') return `${step} . FILTER(sameTerm(${inner}, ${node})) . FILTER(${terms.valid(inner)})`;
  const walk = nodeBound ? `${node} (${closure.text})* ${inner}` : `${inner} (${closure.text})* ${node}`;
  return nodeBound ? `${walk} . ${step} . FILTER(${terms.valid(inner)})` : `${step} . ${walk} . FILTER(${terms.valid(inner)})`;
}
