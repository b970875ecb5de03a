// Specification of buildRoleMap and roleMapConflicts: presets plus config mappings to one RoleMap.
import { describe, expect, it } from 'vitest';
import { DEFAULT_PRESETS, KNOWN_PRESETS } from '../../src/config/config.js';
import { buildRoleMap, describeRoleConflict, findRoleConflicts, roleMapConflicts } from '../../src/roles/role-map.js';

const NV = 'https://data.northvale-rail.example/def/';
const RDF_TYPE = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#type';
const SUBCLASS_OF = 'http://www.w3.org/2000/01/rdf-schema#subClassOf';
const SKOS_BROADER = 'http://www.w3.org/2004/02/skos/core#broader';
const SKOS_NARROWER = 'http://www.w3.org/2004/02/skos/core#narrower';

describe('buildRoleMap', () => {
  it('maps the default presets with their inverse flags', () => {
    const roleMap = buildRoleMap(DEFAULT_PRESETS, {});
    expect(roleMap.get(RDF_TYPE)).toEqual({ role: 'instance-of', inverse: false });
    expect(roleMap.get(SUBCLASS_OF)).toEqual({ role: 'subclass-of', inverse: false });
    expect(roleMap.get('http://www.w3.org/2002/07/owl#disjointWith')).toEqual({ role: 'disjoint-with', inverse: false });
    expect(roleMap.get('http://purl.org/dc/terms/hasPart')).toEqual({ role: 'part-of', inverse: true });
    expect(roleMap.get('http://schema.org/hasPart')).toEqual({ role: 'part-of', inverse: true });
    expect(roleMap.get('http://purl.obolibrary.org/obo/BFO_0000050')).toEqual({ role: 'part-of', inverse: false });
    expect(roleMap.get(SKOS_BROADER)).toBeUndefined();
    expect(roleMap.get('http://www.w3.org/2000/01/rdf-schema#label')).toBeUndefined();
    expect(roleMap.predicates.size).toBe(12);
    expect(roleMap.predicates.has(RDF_TYPE)).toBe(true);
  });

  it('collects class types and node flags from the presets used', () => {
    const rdfsOnly = buildRoleMap(['rdfs'], {});
    expect([...rdfsOnly.classTypes].sort()).toEqual(['http://www.w3.org/2000/01/rdf-schema#Class', 'http://www.w3.org/2000/01/rdf-schema#Datatype']);
    expect(rdfsOnly.readsDeprecated).toBe(false);
    expect(rdfsOnly.readsAllDisjointClasses).toBe(false);
    const withOwl = buildRoleMap(['rdfs', 'owl'], {});
    expect(withOwl.classTypes.has('http://www.w3.org/2002/07/owl#Class')).toBe(true);
    expect(withOwl.readsDeprecated).toBe(true);
    expect(withOwl.readsAllDisjointClasses).toBe(true);
  });

  it('adds the opt-in skos preset', () => {
    const roleMap = buildRoleMap([...DEFAULT_PRESETS, 'skos'], {});
    expect(roleMap.get(SKOS_BROADER)).toEqual({ role: 'subclass-of', inverse: false });
    expect(roleMap.get(SKOS_NARROWER)).toEqual({ role: 'subclass-of', inverse: true });
  });

  it('maps a custom roles: list forward and an inverse list backward', () => {
    const roleMap = buildRoleMap(['rdfs'], {
      'subclass-of': { iri: [`${NV}kindOf`], inverse: [] },
      'part-of': { iri: [`${NV}partOf`], inverse: [`${NV}hasPart`] },
    });
    expect(roleMap.get(`${NV}kindOf`)).toEqual({ role: 'subclass-of', inverse: false });
    expect(roleMap.get(`${NV}partOf`)).toEqual({ role: 'part-of', inverse: false });
    expect(roleMap.get(`${NV}hasPart`)).toEqual({ role: 'part-of', inverse: true });
    expect([...roleMap.predicates].sort()).toEqual([RDF_TYPE, SUBCLASS_OF, `${NV}hasPart`, `${NV}kindOf`, `${NV}partOf`].sort());
  });

  it('maps nothing with no presets and no extra predicates', () => {
    const roleMap = buildRoleMap([], {});
    expect(roleMap.predicates.size).toBe(0);
    expect(roleMap.classTypes.size).toBe(0);
    expect(roleMap.get(RDF_TYPE)).toBeUndefined();
  });

  it('keeps the first mapping of a conflicting predicate (presets before roles:)', () => {
    const roleMap = buildRoleMap(['rdfs'], { 'part-of': { iri: [SUBCLASS_OF], inverse: [] } });
    expect(roleMap.get(SUBCLASS_OF)).toEqual({ role: 'subclass-of', inverse: false });
  });

  it('throws on an unknown preset name', () => {
    expect(() => buildRoleMap(['rdfs', 'skoss'], {})).toThrow(/unknown preset `skoss`/);
  });
});

describe('roleMapConflicts', () => {
  it('is empty for all the built-in presets together', () => {
    expect(roleMapConflicts(KNOWN_PRESETS, {})).toEqual([]);
  });

  it('is empty when roles: repeats a preset mapping the same way', () => {
    expect(roleMapConflicts(['rdfs'], { 'subclass-of': { iri: [SUBCLASS_OF], inverse: [] } })).toEqual([]);
  });

  it('reports a predicate mapped to two roles', () => {
    expect(roleMapConflicts(['rdfs'], { 'part-of': { iri: [SUBCLASS_OF], inverse: [] } })).toEqual([
      `predicate <${SUBCLASS_OF}> is mapped to subclass-of by preset rdfs and to part-of by roles: part-of`,
    ]);
  });

  it('reports a predicate mapped to one role both ways', () => {
    const conflicts = findRoleConflicts([], { 'part-of': { iri: [`${NV}partOf`], inverse: [`${NV}partOf`] } });
    expect(conflicts).toHaveLength(1);
    expect(conflicts[0].secondIsExtra).toBe(true);
    expect(describeRoleConflict(conflicts[0])).toBe(
      `predicate <${NV}partOf> is mapped to part-of by roles: part-of and to part-of (inverse) by roles: part-of inverse`,
    );
  });

  it('reports a config mapping that turns a skos predicate around', () => {
    const conflicts = roleMapConflicts(['skos'], { 'subclass-of': { iri: [SKOS_NARROWER], inverse: [] } });
    expect(conflicts).toEqual([
      `predicate <${SKOS_NARROWER}> is mapped to subclass-of (inverse) by preset skos and to subclass-of by roles: subclass-of`,
    ]);
  });
});
