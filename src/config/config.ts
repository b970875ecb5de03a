// The settings of one run, as read from isapart.yaml and the command line.
import type { RuleLevel } from '../engine/finding.js';
import type { EndpointSettings } from '../load/endpoint-settings.js';
import type { Role } from '../roles/role.js';

/** Extra predicates for one role: those that point the role's way and those that point back. */
export interface RolePredicates {
  iri: string[];
  inverse: string[];
}

/** One `allow:` entry: suppress a rule's finding anchored on a focus node. */
export interface AllowEntry {
  rule: string;
  focus: string;
  reason: string;
  file: string;
  line: number;
}

/** A validated configuration. `file` is undefined when no isapart.yaml was used. */
export interface IsapartConfig {
  file?: string;
  presets: string[];
  roles: Partial<Record<Role, RolePredicates>>;
  scope: string[];
  roots: string[];
  rules: Record<string, RuleLevel>;
  /** Where each rules: entry stands, so an unknown rule id can be reported at its line. */
  ruleLines: Record<string, number>;
  /** Absolute folders of extra rule files. */
  ruleDirs: string[];
  allow: AllowEntry[];
  /** JSON-LD context IRI → absolute path of its local copy; no other remote context is read. */
  contexts: Record<string, string>;
  /** The `endpoint:` settings that were written; defaults fill in the rest. */
  endpoint?: Partial<EndpointSettings>;
}

/** The presets applied when a config names none. */
export const DEFAULT_PRESETS = ['rdfs', 'owl', 'dcterms', 'schema', 'obo'] as const;

/** Every preset isapart knows. */
export const KNOWN_PRESETS = ['rdfs', 'owl', 'dcterms', 'schema', 'obo', 'skos'] as const;
