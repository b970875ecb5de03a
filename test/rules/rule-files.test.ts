// Every built-in rule file: it parses, has the level and documentation design.md asks for, and its examples hold.
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadBuiltinRules, parseRuleFile } from '../../src/engine/rule-file.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import { lintTexts } from './lint-texts.js';

const RULES_FOLDER = new URL('../../rules/', import.meta.url);

/** The built-in rules and their default levels, as design.md's table and the task fix them. */
const EXPECTED_LEVELS: Record<string, string> = {
  'subclass-cycle': 'error',
  'part-cycle': 'error',
  'disjoint-overlap': 'error',
  'kind-and-part': 'warning',
  'instance-and-subclass': 'warning',
  'individual-as-class': 'warning',
  'deprecated-in-use': 'warning',
  'orphan-class': 'note',
  'redundant-subclass': 'note',
};

/** The published basis each rule's description must name (design.md, "Built-in rules"). */
const EXPECTED_BASIS: Record<string, string[]> = {
  'subclass-cycle': ['RDF Schema 1.1', 'RDF 1.1 Semantics'],
  'part-cycle': ['Simple part-whole relations in OWL Ontologies', 'from memory'],
  'kind-and-part': ['Simple part-whole relations in OWL Ontologies', 'from memory'],
  'disjoint-overlap': ['OWL 2 Structural Specification', 'DisjointClasses'],
  'instance-and-subclass': ['RDF Schema 1.1', 'common practice'],
  'orphan-class': ['common practice'],
  'redundant-subclass': ['RDF Schema 1.1', 'common practice'],
  'individual-as-class': ['common practice'],
  'deprecated-in-use': ['owl:deprecated', 'common practice'],
};

const fileNames = readdirSync(RULES_FOLDER).filter((name) => name.endsWith('.yaml')).sort();

function parsedRule(name: string): RuleDefinition {
  const { rule, errors } = parseRuleFile(readFileSync(new URL(name, RULES_FOLDER), 'utf8'), `rules/${name}`);
  expect(errors).toEqual([]);
  expect(rule).toBeDefined();
  return rule as RuleDefinition;
}

describe('the rules folder', () => {
  it('holds exactly the nine built-in rules, one file each', () => {
    expect(fileNames).toEqual(Object.keys(EXPECTED_LEVELS).map((id) => `${id}.yaml`).sort());
  });

  it('loads as the built-in rule set without errors', () => {
    const { rules, errors } = loadBuiltinRules();
    expect(errors).toEqual([]);
    expect(rules.map((rule) => rule.id).sort()).toEqual(Object.keys(EXPECTED_LEVELS).sort());
  });
});

describe.each(fileNames)('rules/%s', (name) => {
  const rule = parsedRule(name);

  it('is named after its id and has its default level', () => {
    expect(`${rule.id}.yaml`).toBe(name);
    expect(rule.level).toBe(EXPECTED_LEVELS[rule.id]);
  });

  it('has a one-sentence summary and a description that says what, why, how to fix and on what basis', () => {
    expect(rule.summary).toMatch(/^[A-Z][^\n]*\.$/);
    expect(rule.summary.split('. ')).toHaveLength(1);
    expect(rule.description).toMatch(/Flags /);
    expect(rule.description).toMatch(/Why it matters:/);
    expect(rule.description).toMatch(/How to fix:/);
    const flowing = rule.description.replace(/\s+/g, ' ');
    for (const basis of EXPECTED_BASIS[rule.id]) expect(flowing).toContain(basis);
  });

  it('reports in-scope nodes with a message that names them', () => {
    expect(rule.report.nodes).toContain(rule.report.focus);
    expect(rule.report.message).toContain(`{${rule.report.focus.slice(1)}}`);
  });

  it('flags its flagged example', () => {
    const result = lintTexts({ sources: [{ text: rule.examples.flagged, file: 'flagged.ttl', format: 'turtle' }], rules: [rule] });
    expect(result.sources[0].errors).toEqual([]);
    expect(result.failures).toEqual([]);
    expect(result.findings.length).toBeGreaterThanOrEqual(1);
    for (const finding of result.findings) {
      expect(finding.ruleId).toBe(rule.id);
      expect(finding.level).toBe(rule.level);
      expect(finding.evidence.length).toBeGreaterThan(0);
      expect(finding.focus.startsWith('https://data.northvale-rail.example/')).toBe(true);
    }
  });

  it('does not flag its clean example', () => {
    const result = lintTexts({ sources: [{ text: rule.examples.clean, file: 'clean.ttl', format: 'turtle' }], rules: [rule] });
    expect(result.sources[0].errors).toEqual([]);
    expect(result.failures).toEqual([]);
    expect(result.sources[0].statements.length).toBeGreaterThan(0);
    expect(result.findings).toEqual([]);
  });
});

describe('fixes', () => {
  it('redundant-subclass offers to remove exactly the redundant direct statement', () => {
    const rule = parsedRule('redundant-subclass.yaml');
    const { findings } = lintTexts({ sources: [{ text: rule.examples.flagged, file: 'flagged.ttl', format: 'turtle' }], rules: [rule] });
    expect(findings).toHaveLength(1);
    const removed = findings[0].fix?.remove ?? [];
    expect(removed.map((statement) => [statement.subject, statement.predicate, statement.object])).toEqual([
      [
        'https://data.northvale-rail.example/def/TractionMotor',
        'http://www.w3.org/2000/01/rdf-schema#subClassOf',
        'https://data.northvale-rail.example/def/Component',
      ],
    ]);
  });

  it('only redundant-subclass gives a fix: for the others which edge is wrong is the modeller\'s call', () => {
    const withFix = fileNames.map(parsedRule).filter((rule) => rule.fix !== undefined).map((rule) => rule.id);
    expect(withFix).toEqual(['redundant-subclass']);
  });
});
