// Specification of the starter isapart.yaml: it parses cleanly, as does each of its examples.
import { describe, expect, it } from 'vitest';
import { checkRuleIds, CONFIG_KEYS, emptyConfig, parseConfig } from '../../src/config/load-config.js';
import { starterConfig } from '../../src/config/starter.js';

const FILE = '/projects/northvale/isapart.yaml';
const NV = 'https://data.northvale-rail.example/';
/** The built-in rule ids of design.md's "Built-in rules" table. */
const BUILT_IN_IDS = ['subclass-cycle', 'part-cycle', 'kind-and-part', 'instance-and-subclass', 'orphan-class', 'redundant-subclass', 'disjoint-overlap', 'individual-as-class', 'deprecated-in-use'];

/** The starter with every `# Example: KEY: ...` line put in place of the active `KEY: ...` line below it. */
function starterWithExamples(): { text: string; examples: number } {
  const lines = starterConfig().split('\n');
  let examples = 0;
  for (let index = 0; index < lines.length; index++) {
    const example = /^# Example: (([a-z-]+):.*)$/.exec(lines[index]);
    if (example === null) continue;
    const active = lines.findIndex((line, at) => at > index && line.startsWith(`${example[2]}:`));
    expect(active, `active line for ${example[2]}`).toBeGreaterThan(index);
    lines[active] = example[1];
    examples++;
  }
  return { text: lines.join('\n'), examples };
}

describe('starterConfig', () => {
  it('parses with no errors and behaves like no config at all', () => {
    const { config, errors } = parseConfig(starterConfig(), FILE);
    expect(errors).toEqual([]);
    expect(config).toEqual({ ...emptyConfig(), file: FILE });
  });

  it('has one active line and one comment naming each key', () => {
    const text = starterConfig();
    for (const key of CONFIG_KEYS) {
      expect(text.split('\n').filter((line) => line.startsWith(`${key}:`))).toHaveLength(1);
      expect(text).toMatch(new RegExp(`^# ${key}: `, 'm'));
    }
  });

  it('has an example for every key, and the examples together parse with no errors', () => {
    const { text, examples } = starterWithExamples();
    expect(examples).toBe(CONFIG_KEYS.length);
    const { config, errors } = parseConfig(text, FILE);
    expect(errors).toEqual([]);
    expect(config.presets).toEqual(['rdfs', 'owl', 'dcterms', 'schema', 'obo', 'skos']);
    expect(config.roles).toEqual({
      'subclass-of': { iri: [`${NV}def/kindOf`], inverse: [] },
      'part-of': { iri: [`${NV}def/partOf`], inverse: [`${NV}def/hasPart`] },
    });
    expect(config.scope).toEqual([NV]);
    expect(config.roots).toEqual([`${NV}def/Asset`, `${NV}def/Infrastructure`]);
    expect(config.rules).toEqual({ 'redundant-subclass': 'note', 'orphan-class': 'off' });
    expect(config.ruleDirs).toEqual(['/projects/northvale/team-rules']);
    expect(config.allow.map((entry) => [entry.rule, entry.focus])).toEqual([['kind-and-part', `${NV}def/Pantograph`]]);
    expect(config.allow[0].reason.length).toBeGreaterThan(0);
    expect(checkRuleIds(config, BUILT_IN_IDS)).toEqual([]);
  });

  it('ends with a newline and uses only the Northvale Rail example namespace', () => {
    const text = starterConfig();
    expect(text.endsWith('\n')).toBe(true);
    const iris = text.match(/https?:\/\/[^\s,\]}]+/g) ?? [];
    expect(iris.length).toBeGreaterThan(0);
    for (const iri of iris) expect(iri.startsWith(NV)).toBe(true);
  });
});
