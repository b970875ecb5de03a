// Independent, deliberately plain computations of the nine built-in rules' facts over JS Maps and Sets.
// They follow the rule definitions in design.md ("Roles", the scope paragraph, "Built-in rules") and
// share no code with isapart's graph or engine, so a count that agrees is evidence for both sides.

/** The built-in rule ids, as design.md names them. */
export const BUILTIN_RULE_IDS = [
  'subclass-cycle',
  'part-cycle',
  'kind-and-part',
  'instance-and-subclass',
  'orphan-class',
  'redundant-subclass',
  'disjoint-overlap',
  'individual-as-class',
  'deprecated-in-use',
] as const;

/** One built-in rule id. */
export type BuiltinRuleId = (typeof BUILTIN_RULE_IDS)[number];

/** Node → set of nodes, one direction of one role. */
type Adjacency = Map<string, Set<string>>;

/** The hierarchy as plain maps, every edge in the direction of design.md's role table. */
export interface PlainHierarchy {
  subclassOf: Adjacency;
  instanceOf: Adjacency;
  partOf: Adjacency;
  /** Stored both ways: disjoint-with is symmetric. */
  disjointWith: Adjacency;
  deprecated: Set<string>;
  roots: Set<string>;
  scopePrefixes: string[];
}

/** The edge roles a plain hierarchy keeps. */
export type PlainRole = 'subclass-of' | 'instance-of' | 'part-of' | 'disjoint-with';

/** An empty hierarchy with its scope prefixes and configured roots. */
export function createPlainHierarchy(options: { scopePrefixes: string[]; roots: string[] }): PlainHierarchy {
  return {
    subclassOf: new Map(),
    instanceOf: new Map(),
    partOf: new Map(),
    disjointWith: new Map(),
    deprecated: new Set(),
    roots: new Set(options.roots),
    scopePrefixes: [...options.scopePrefixes],
  };
}

/** Adds one edge of a role (a disjoint-with edge both ways). */
export function addPlainEdge(hierarchy: PlainHierarchy, edge: { role: PlainRole; subject: string; object: string }): void {
  const { role, subject, object } = edge;
  if (role === 'subclass-of') addTo(hierarchy.subclassOf, subject, object);
  if (role === 'instance-of') addTo(hierarchy.instanceOf, subject, object);
  if (role === 'part-of') addTo(hierarchy.partOf, subject, object);
  if (role === 'disjoint-with') {
    addTo(hierarchy.disjointWith, subject, object);
    addTo(hierarchy.disjointWith, object, subject);
  }
}

/** For each built-in rule, one key per distinct fact it should report (nodes joined by spaces). */
export function independentFacts(hierarchy: PlainHierarchy): Record<BuiltinRuleId, string[]> {
  const classes = classNodes(hierarchy);
  const inScope = (term: string): boolean => hierarchy.scopePrefixes.some((prefix) => term.startsWith(prefix));
  const subclassComponents = nontrivialComponents(hierarchy.subclassOf);
  return {
    'subclass-cycle': subclassComponents.map((members) => [...members].sort().join(' ')),
    'part-cycle': nontrivialComponents(hierarchy.partOf).map((members) => [...members].sort().join(' ')),
    'kind-and-part': kindAndPart(hierarchy),
    'instance-and-subclass': instanceAndSubclass(hierarchy),
    'orphan-class': [...classes].filter((node) => isOrphan(hierarchy, { node, inScope })).sort(),
    'redundant-subclass': redundantSubclass(hierarchy, subclassComponents),
    'disjoint-overlap': disjointOverlap(hierarchy, classes),
    'individual-as-class': individualAsClass(hierarchy, inScope),
    'deprecated-in-use': deprecatedInUse(hierarchy),
  };
}

/** Classes: objects of instance-of, subjects and objects of subclass-of (no declared classes here). */
export function classNodes(hierarchy: PlainHierarchy): Set<string> {
  const classes = new Set<string>();
  for (const [subject, objects] of hierarchy.subclassOf) {
    classes.add(subject);
    for (const object of objects) classes.add(object);
  }
  for (const objects of hierarchy.instanceOf.values()) for (const object of objects) classes.add(object);
  return classes;
}

/** Every node reachable from the start nodes by one or more steps (plus the starts when asked). */
export function reachable(adjacency: Adjacency, options: { from: Iterable<string>; includeStart: boolean }): Set<string> {
  const seen = new Set<string>();
  const queue: string[] = [];
  for (const start of options.from) {
    if (options.includeStart && !seen.has(start)) {
      seen.add(start);
      queue.push(start);
    }
    for (const next of adjacency.get(start) ?? []) {
      if (!seen.has(next)) {
        seen.add(next);
        queue.push(next);
      }
    }
  }
  for (let head = 0; head < queue.length; head += 1) {
    for (const next of adjacency.get(queue[head]) ?? []) {
      if (!seen.has(next)) {
        seen.add(next);
        queue.push(next);
      }
    }
  }
  return seen;
}

/**
 * Strongly connected components with more than one member or a self-loop, found without Tarjan:
 * peel nodes that have no incoming or no outgoing edge left (no cycle passes through them), then
 * take each remaining node's forward-reachable ∩ backward-reachable set inside what is left.
 */
export function nontrivialComponents(adjacency: Adjacency): Set<string>[] {
  const forward = new Map<string, Set<string>>();
  const backward = new Map<string, Set<string>>();
  for (const [from, targets] of adjacency) {
    for (const to of targets) {
      addTo(forward, from, to);
      addTo(backward, to, from);
    }
  }
  const remaining = new Set<string>([...forward.keys(), ...backward.keys()]);
  const outDegree = new Map<string, number>();
  const inDegree = new Map<string, number>();
  for (const node of remaining) {
    outDegree.set(node, forward.get(node)?.size ?? 0);
    inDegree.set(node, backward.get(node)?.size ?? 0);
  }
  const peel = [...remaining].filter((node) => outDegree.get(node) === 0 || inDegree.get(node) === 0);
  for (let head = 0; head < peel.length; head += 1) {
    const node = peel[head];
    if (!remaining.delete(node)) continue;
    for (const to of forward.get(node) ?? []) {
      const degree = (inDegree.get(to) ?? 0) - 1;
      inDegree.set(to, degree);
      if (degree === 0 && remaining.has(to)) peel.push(to);
    }
    for (const from of backward.get(node) ?? []) {
      const degree = (outDegree.get(from) ?? 0) - 1;
      outDegree.set(from, degree);
      if (degree === 0 && remaining.has(from)) peel.push(from);
    }
  }
  const inside = (map: Adjacency): Adjacency => {
    const restricted: Adjacency = new Map();
    for (const node of remaining) {
      restricted.set(node, new Set([...(map.get(node) ?? [])].filter((next) => remaining.has(next))));
    }
    return restricted;
  };
  const forwardInside = inside(forward);
  const backwardInside = inside(backward);
  const assigned = new Set<string>();
  const components: Set<string>[] = [];
  for (const node of remaining) {
    if (assigned.has(node)) continue;
    const ahead = reachable(forwardInside, { from: [node], includeStart: true });
    const behind = reachable(backwardInside, { from: [node], includeStart: true });
    const component = new Set([...ahead].filter((member) => behind.has(member)));
    for (const member of component) assigned.add(member);
    if (component.size > 1 || forward.get(node)?.has(node)) components.push(component);
  }
  return components;
}

/** `A part-of B` while A reaches B by subclass-of+ or by instance-of then subclass-of*. */
function kindAndPart(hierarchy: PlainHierarchy): string[] {
  const facts: string[] = [];
  for (const [part, wholes] of hierarchy.partOf) {
    const kinds = kindsOf(hierarchy, part);
    for (const whole of wholes) if (kinds.has(whole)) facts.push(`${part} ${whole}`);
  }
  return facts.sort();
}

/** What a node is a kind of: subclass-of+ ∪ instance-of/subclass-of*. */
function kindsOf(hierarchy: PlainHierarchy, node: string): Set<string> {
  const kinds = reachable(hierarchy.subclassOf, { from: [node], includeStart: false });
  const typed = reachable(hierarchy.subclassOf, { from: hierarchy.instanceOf.get(node) ?? [], includeStart: true });
  for (const kind of typed) kinds.add(kind);
  return kinds;
}

/** `X instance-of C` while X subclass-of+ C. */
function instanceAndSubclass(hierarchy: PlainHierarchy): string[] {
  const facts: string[] = [];
  for (const [instance, types] of hierarchy.instanceOf) {
    const supers = reachable(hierarchy.subclassOf, { from: [instance], includeStart: false });
    for (const type of types) if (supers.has(type)) facts.push(`${instance} ${type}`);
  }
  return facts.sort();
}

/** An in-scope class with no superclass, not a root, and not an instance of an in-scope class. */
function isOrphan(hierarchy: PlainHierarchy, query: { node: string; inScope: (term: string) => boolean }): boolean {
  const { node, inScope } = query;
  if (!inScope(node) || hierarchy.roots.has(node)) return false;
  if ((hierarchy.subclassOf.get(node)?.size ?? 0) > 0) return false;
  return ![...(hierarchy.instanceOf.get(node) ?? [])].some(inScope);
}

/** Direct `A subclass-of C` where another direct superclass B of A reaches C; A outside subclass cycles. */
function redundantSubclass(hierarchy: PlainHierarchy, cycles: Set<string>[]): string[] {
  const inCycle = new Set<string>();
  for (const component of cycles) for (const member of component) inCycle.add(member);
  const facts: string[] = [];
  for (const [node, supers] of hierarchy.subclassOf) {
    if (supers.size < 2 || inCycle.has(node)) continue;
    for (const direct of supers) {
      // Another direct superclass leads up to this one, and this one does not lead back to it
      // (two superclasses in one cycle are left to subclass-cycle: rules/redundant-subclass.yaml).
      const aboveDirect = reachable(hierarchy.subclassOf, { from: [direct], includeStart: false });
      const redundant = [...supers].some(
        (other) => other !== direct && !aboveDirect.has(other) && reachable(hierarchy.subclassOf, { from: [other], includeStart: false }).has(direct),
      );
      if (redundant) facts.push(`${node} ${direct}`);
    }
  }
  return facts.sort();
}

/**
 * X under both classes of a disjoint pair (the pair unordered), reported only at the most general X:
 * not when a direct class or superclass Y of X is under both and Y is not below X (rules/disjoint-overlap.yaml).
 */
function disjointOverlap(hierarchy: PlainHierarchy, classes: Set<string>): string[] {
  const candidates = new Set<string>([...classes, ...hierarchy.instanceOf.keys()]);
  const underCache = new Map<string, Set<string>>();
  const under = (node: string): Set<string> => {
    let found = underCache.get(node);
    if (!found) {
      found = underOf(hierarchy, node);
      underCache.set(node, found);
    }
    return found;
  };
  const facts: string[] = [];
  for (const node of candidates) {
    const mine = under(node);
    for (const first of mine) {
      for (const second of hierarchy.disjointWith.get(first) ?? []) {
        if (!(first < second && mine.has(second))) continue;
        const directs = [...(hierarchy.instanceOf.get(node) ?? []), ...(hierarchy.subclassOf.get(node) ?? [])];
        const carriedAbove = directs.some((direct) => {
          const theirs = under(direct);
          if (!theirs.has(first) || !theirs.has(second)) return false;
          return !reachable(hierarchy.subclassOf, { from: [direct], includeStart: false }).has(node);
        });
        if (!carriedAbove) facts.push(`${node} ${first} ${second}`);
      }
    }
  }
  return facts.sort();
}

/** What a node falls under: itself and its superclasses, and the classes its types fall under. */
function underOf(hierarchy: PlainHierarchy, node: string): Set<string> {
  const under = reachable(hierarchy.subclassOf, { from: [node], includeStart: true });
  for (const type of reachable(hierarchy.subclassOf, { from: hierarchy.instanceOf.get(node) ?? [], includeStart: true })) {
    under.add(type);
  }
  return under;
}

/** An instance-of or subclass-of edge A → Y where Y is an instance of an in-scope class with no superclass. */
function individualAsClass(hierarchy: PlainHierarchy, inScope: (term: string) => boolean): string[] {
  const facts = new Set<string>();
  const looksIndividual = (node: string): boolean =>
    (hierarchy.subclassOf.get(node)?.size ?? 0) === 0 && [...(hierarchy.instanceOf.get(node) ?? [])].some(inScope);
  for (const adjacency of [hierarchy.instanceOf, hierarchy.subclassOf]) {
    for (const [subject, objects] of adjacency) {
      for (const object of objects) if (looksIndividual(object)) facts.add(`${subject} ${object}`);
    }
  }
  return [...facts].sort();
}

/** A subclass-of or instance-of edge whose object is deprecated. */
function deprecatedInUse(hierarchy: PlainHierarchy): string[] {
  const facts = new Set<string>();
  for (const adjacency of [hierarchy.instanceOf, hierarchy.subclassOf]) {
    for (const [subject, objects] of adjacency) {
      for (const object of objects) if (hierarchy.deprecated.has(object)) facts.add(`${subject} ${object}`);
    }
  }
  return [...facts].sort();
}

/** Adds `to` to the set of `from`. */
function addTo(adjacency: Adjacency, from: string, to: string): void {
  let targets = adjacency.get(from);
  if (!targets) {
    targets = new Set();
    adjacency.set(from, targets);
  }
  targets.add(to);
}
