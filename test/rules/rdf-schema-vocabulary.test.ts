// Outside-source check: the nine rules over the published RDF and RDFS vocabularies (W3C rdf-schema repository).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { lintTexts } from './lint-texts.js';

// Copies of the published vocabularies, unchanged (source and licence: test/standards/README-rdf-schema.md).
const STANDARDS = new URL('../standards/w3c-rdf-schema/', import.meta.url);
const RDF = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#';
const RDFS = 'http://www.w3.org/2000/01/rdf-schema#';

function vocabulary(name: string): { text: string; file: string; format: 'turtle' } {
  return { text: readFileSync(new URL(name, STANDARDS), 'utf8'), file: name, format: 'turtle' };
}

const rules = loadBuiltinRules().rules;

describe('rdfs.ttl as published', () => {
  it('reports rdfs:Datatype as both an instance and a subclass of rdfs:Class, and nothing else', () => {
    const result = lintTexts({ sources: [vocabulary('rdfs.ttl')], rules, scope: { prefixes: [RDFS], roots: [] } });
    expect(result.sources[0].errors).toEqual([]);
    expect(result.failures).toEqual([]);
    // RDF Schema 1.1, section 2.4 (from memory): "rdfs:Datatype is both an instance of and a subclass
    // of rdfs:Class"; rdfs.ttl states `rdfs:Datatype a rdfs:Class` and `rdfs:subClassOf rdfs:Class`.
    expect(result.findings.map((finding) => [finding.ruleId, finding.focus, finding.nodes])).toEqual([
      ['instance-and-subclass', `${RDFS}Datatype`, [`${RDFS}Datatype`, `${RDFS}Class`]],
    ]);
    const evidence = result.findings[0].evidence.map((statement) => [statement.subject, statement.predicate, statement.object]);
    expect(evidence).toContainEqual([`${RDFS}Datatype`, `${RDF}type`, `${RDFS}Class`]);
    expect(evidence).toContainEqual([`${RDFS}Datatype`, `${RDFS}subClassOf`, `${RDFS}Class`]);
  });

  it('reports nothing when no scope names the RDFS namespace (design.md: its terms are out of scope)', () => {
    const result = lintTexts({ sources: [vocabulary('rdfs.ttl')], rules });
    expect(result.sources[0].statements.length).toBeGreaterThan(50);
    expect(result.findings).toEqual([]);
  });

  it('together with rdf.ttl, with both namespaces in scope, still reports only rdfs:Datatype', () => {
    // rdf.ttl declares rdf:Property a rdfs:Class, so the class rdfs.ttl only borrows is placed there.
    const result = lintTexts({ sources: [vocabulary('rdfs.ttl'), vocabulary('rdf.ttl')], rules, scope: { prefixes: [RDFS, RDF], roots: [] } });
    expect(result.sources.flatMap((source) => source.errors)).toEqual([]);
    expect(result.findings.map((finding) => [finding.ruleId, finding.focus])).toEqual([['instance-and-subclass', `${RDFS}Datatype`]]);
  });

  it('alone, with the RDF namespace in scope too, reports rdf:Property, which only rdf.ttl defines', () => {
    const result = lintTexts({ sources: [vocabulary('rdfs.ttl')], rules, scope: { prefixes: [RDFS, RDF], roots: [] } });
    expect(result.findings.map((finding) => [finding.ruleId, finding.focus]).sort()).toEqual([
      ['instance-and-subclass', `${RDFS}Datatype`],
      ['orphan-class', `${RDF}Property`],
    ]);
  });
});
