// Builds the RoleMap of a run from its presets and the config's extra predicate mappings.
import type { RolePredicates } from '../config/config.js';
import { presetByName } from './presets.js';
import { ROLES, type PredicateMapping, type Role, type RoleMap } from './role.js';

/** Where a predicate mapping comes from: a preset, or the config's `roles:` key. */
export interface MappingOrigin {
  role: Role;
  inverse: boolean;
  /** `preset NAME` or `roles: ROLE`. */
  source: string;
}

/** One predicate mapped two incompatible ways: to two roles, or to one role both ways. */
export interface RoleConflict {
  predicate: string;
  first: MappingOrigin;
  second: MappingOrigin;
  /** Whether `second` comes from the config's `roles:` (and not from a preset). */
  secondIsExtra: boolean;
}

interface SourcedMapping extends MappingOrigin {
  predicate: string;
  extra: boolean;
}

/** Every mapping in order: presets in the order given, then `roles:` in ROLES order, iri then inverse. */
function collectMappings(presets: readonly string[], extra: Partial<Record<Role, RolePredicates>>): SourcedMapping[] {
  const mappings: SourcedMapping[] = [];
  for (const name of presets) {
    const preset = presetByName(name);
    if (preset === undefined) {
      throw new Error(`unknown preset \`${name}\` (the config loader validates preset names first)`);
    }
    for (const predicate of preset.predicates) {
      mappings.push({ predicate: predicate.iri, role: predicate.role, inverse: predicate.inverse, source: `preset ${name}`, extra: false });
    }
  }
  for (const role of ROLES) {
    const predicates = extra[role];
    if (predicates === undefined) continue;
    for (const iri of predicates.iri) mappings.push({ predicate: iri, role, inverse: false, source: `roles: ${role}`, extra: true });
    for (const iri of predicates.inverse) mappings.push({ predicate: iri, role, inverse: true, source: `roles: ${role} inverse`, extra: true });
  }
  return mappings;
}

/** The first-come mapping per predicate, and each later mapping that disagrees with it. */
function resolveMappings(mappings: readonly SourcedMapping[]): { chosen: Map<string, SourcedMapping>; conflicts: RoleConflict[] } {
  const chosen = new Map<string, SourcedMapping>();
  const conflicts: RoleConflict[] = [];
  for (const mapping of mappings) {
    const earlier = chosen.get(mapping.predicate);
    if (earlier === undefined) {
      chosen.set(mapping.predicate, mapping);
    } else if (earlier.role !== mapping.role || earlier.inverse !== mapping.inverse) {
      conflicts.push({
        predicate: mapping.predicate,
        first: { role: earlier.role, inverse: earlier.inverse, source: earlier.source },
        second: { role: mapping.role, inverse: mapping.inverse, source: mapping.source },
        secondIsExtra: mapping.extra,
      });
    }
  }
  return { chosen, conflicts };
}

/** The predicates mapped two incompatible ways by the presets and `roles:` together, in reading order. */
export function findRoleConflicts(presets: readonly string[], extra: Partial<Record<Role, RolePredicates>>): RoleConflict[] {
  return resolveMappings(collectMappings(presets, extra)).conflicts;
}

/** A one-line description of a conflict, for an error message. */
export function describeRoleConflict(conflict: RoleConflict): string {
  const way = (origin: MappingOrigin): string => `${origin.role}${origin.inverse ? ' (inverse)' : ''} by ${origin.source}`;
  return `predicate <${conflict.predicate}> is mapped to ${way(conflict.first)} and to ${way(conflict.second)}`;
}

/** Conflicting mappings as messages; empty when `buildRoleMap` of the same input is unambiguous. */
export function roleMapConflicts(presets: readonly string[], extra: Partial<Record<Role, RolePredicates>>): string[] {
  return findRoleConflicts(presets, extra).map(describeRoleConflict);
}

/**
 * The RoleMap of presets plus extra mappings. When a predicate is mapped two ways the first mapping
 * wins (presets in the order given, then `roles:`); `roleMapConflicts` reports such cases so the
 * caller can turn them into config errors. Throws on an unknown preset name.
 */
export function buildRoleMap(presets: readonly string[], extra: Partial<Record<Role, RolePredicates>>): RoleMap {
  const { chosen } = resolveMappings(collectMappings(presets, extra));
  const mappings = new Map<string, PredicateMapping>();
  for (const [predicate, mapping] of chosen) mappings.set(predicate, Object.freeze({ role: mapping.role, inverse: mapping.inverse }));
  const classTypes = new Set<string>();
  let readsDeprecated = false;
  let readsAllDisjointClasses = false;
  for (const name of presets) {
    const preset = presetByName(name);
    if (preset === undefined) continue;
    for (const classType of preset.classTypes) classTypes.add(classType);
    readsDeprecated ||= preset.readsDeprecated;
    readsAllDisjointClasses ||= preset.readsAllDisjointClasses;
  }
  const predicates: ReadonlySet<string> = new Set(mappings.keys());
  return {
    get: (predicate: string) => mappings.get(predicate),
    classTypes,
    readsDeprecated,
    readsAllDisjointClasses,
    predicates,
  };
}
