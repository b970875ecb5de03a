// The engine over the real loader and graph: built-in rule examples, the published RDFS vocabulary, and allow comments.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEFAULT_PRESETS } from '../../src/config/config.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { runRules } from '../../src/engine/run.js';
import { applySuppressions } from '../../src/engine/suppress.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import { parseSource } from '../../src/load/parse.js';
import type { LoadedSource } from '../../src/load/statement.js';
import { buildRoleMap } from '../../src/roles/role-map.js';

function graphOfTurtle(text: string, file: string, prefixes: string[] = []) {
  const source = parseSource(text, file, 'turtle');
  expect(source.errors).toEqual([]);
  return { source, graph: graphOfSources([source], prefixes) };
}

function graphOfSources(sources: LoadedSource[], prefixes: string[]) {
  return buildHierarchyGraph(sources, buildRoleMap([...DEFAULT_PRESETS], {}), { prefixes, roots: [] });
}

describe('built-in rules on their own examples', () => {
  const { rules, errors } = loadBuiltinRules();

  it('loads', () => {
    expect(errors).toEqual([]);
    expect(rules.length).toBe(9);
  });

  for (const rule of rules) {
    it(`${rule.id}: the flagged example is flagged and the clean one is not`, () => {
      const flagged = runRules(graphOfTurtle(rule.examples.flagged, `${rule.id}-flagged.ttl`).graph, [{ rule, level: rule.level }]);
      expect(flagged.failures).toEqual([]);
      expect(flagged.findings.length).toBeGreaterThan(0);
      expect(flagged.findings.every((finding) => finding.ruleId === rule.id && finding.evidence.length > 0)).toBe(true);
      const clean = runRules(graphOfTurtle(rule.examples.clean, `${rule.id}-clean.ttl`).graph, [{ rule, level: rule.level }]);
      expect(clean.failures).toEqual([]);
      expect(clean.findings).toEqual([]);
    });
  }
});

describe('the published RDFS vocabulary (test/standards/w3c-rdf-schema/rdfs.ttl)', () => {
  it('flags rdfs:Datatype as both an instance of and a subclass of rdfs:Class', () => {
    // RDF Schema 1.1 §2.4 (from memory): "rdfs:Datatype is both an instance of and a subclass of rdfs:Class".
    const file = new URL('../standards/w3c-rdf-schema/rdfs.ttl', import.meta.url);
    const rdfs = 'http://www.w3.org/2000/01/rdf-schema#';
    const { graph } = graphOfTurtle(readFileSync(file, 'utf8'), 'rdfs.ttl', [rdfs]);
    const rule = loadBuiltinRules().rules.find((candidate) => candidate.id === 'instance-and-subclass');
    if (rule === undefined) throw new Error('instance-and-subclass is missing');
    const { findings, failures } = runRules(graph, [{ rule, level: 'warning' }]);
    expect(failures).toEqual([]);
    expect(findings.map((finding) => finding.nodes)).toEqual([[`${rdfs}Datatype`, `${rdfs}Class`]]);
    const statements = findings[0].evidence.map((statement) => [statement.subject, statement.predicate, statement.object]);
    expect(statements).toContainEqual([`${rdfs}Datatype`, 'http://www.w3.org/1999/02/22-rdf-syntax-ns#type', `${rdfs}Class`]);
    expect(statements).toContainEqual([`${rdfs}Datatype`, `${rdfs}subClassOf`, `${rdfs}Class`]);
  });

  it('reports nothing from the RDFS namespace when the scope does not name it (design.md, Roles)', () => {
    const file = new URL('../standards/w3c-rdf-schema/rdfs.ttl', import.meta.url);
    const { graph } = graphOfTurtle(readFileSync(file, 'utf8'), 'rdfs.ttl');
    const { rules } = loadBuiltinRules();
    const { findings, failures } = runRules(graph, rules.map((rule) => ({ rule, level: rule.level })));
    expect(failures).toEqual([]);
    expect(findings).toEqual([]);
  });
});

describe('allow comments read by the loader', () => {
  it('suppresses a finding with a trailing comment and reports an allow comment that suppresses nothing', () => {
    const text = [
      '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
      '@prefix dcterms: <http://purl.org/dc/terms/> .',
      '@prefix nv: <https://data.northvale-rail.example/def/> .',
      '',
      'nv:Pantograph dcterms:isPartOf nv:Roof . # isapart-allow kind-and-part: the roof kit is sold as one unit',
      'nv:Pantograph rdfs:subClassOf nv:Roof .',
      '# isapart-allow part-cycle: nothing to see',
      'nv:Bogie dcterms:isPartOf nv:Wagon .',
    ].join('\n');
    const { source, graph } = graphOfTurtle(text, 'fleet.ttl');
    const rules = loadBuiltinRules().rules.filter((rule) => rule.id === 'kind-and-part' || rule.id === 'part-cycle');
    const { findings } = runRules(graph, rules.map((rule) => ({ rule, level: rule.level })));
    expect(findings.map((finding) => finding.ruleId)).toEqual(['kind-and-part']);
    const result = applySuppressions(findings, source.allowComments, []);
    expect(result.findings[0].suppression).toEqual({
      kind: 'inSource',
      justification: 'the roof kit is sold as one unit',
      file: 'fleet.ttl',
      line: 5,
    });
    expect(result.unused.map((finding) => [finding.focus, finding.location?.line])).toEqual([['part-cycle', 7]]);
  });
});
