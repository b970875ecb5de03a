// The roles a predicate can play for the linter, and how predicates map to them.

/** Edge roles; edges are stored in the direction given in design.md. */
export const ROLES = ['instance-of', 'subclass-of', 'part-of', 'disjoint-with', 'equivalent-to'] as const;

/** One edge role. */
export type Role = (typeof ROLES)[number];

/** Roles whose edges hold both ways; the graph stores both directions. */
export const SYMMETRIC_ROLES: ReadonlySet<Role> = new Set<Role>(['disjoint-with', 'equivalent-to']);

/** What one predicate IRI means: a role, and whether its statements point the other way. */
export interface PredicateMapping {
  role: Role;
  inverse: boolean;
}

/** Predicate IRI → mapping, plus the node-flag vocabulary switched on by the presets. */
export interface RoleMap {
  /** The mapping of a predicate IRI, or undefined when the predicate plays no role. */
  get(predicate: string): PredicateMapping | undefined;
  /** Objects of rdf:type that make the subject a declared class (rdfs:Class, owl:Class, ...). */
  readonly classTypes: ReadonlySet<string>;
  /** Whether owl:deprecated true marks a term deprecated (owl preset). */
  readonly readsDeprecated: boolean;
  /** Whether owl:AllDisjointClasses with owl:members lists is read (owl preset). */
  readsAllDisjointClasses: boolean;
  /** Every predicate IRI that maps to a role (for fast filtering of statements). */
  readonly predicates: ReadonlySet<string>;
}
