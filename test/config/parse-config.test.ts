// Specification of parseConfig: the keys of isapart.yaml, and every error with its line, column and hint.
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { emptyConfig, parseConfig } from '../../src/config/load-config.js';

const FILE = path.resolve('/projects/northvale/isapart.yaml');
const NV = 'https://data.northvale-rail.example/';

/** The errors of a config text as `line:column message | hint` lines. */
function errorsOf(text: string): string[] {
  return parseConfig(text, FILE).errors.map((error) => `${error.line}:${error.column} ${error.message} | ${error.hint ?? ''}`);
}

describe('parseConfig on valid configs', () => {
  it("reads design.md's example config", () => {
    const text = [
      'presets: [rdfs, owl, obo]',
      'roles:                      # extra predicates per role',
      `  subclass-of: [${NV}def/kindOf]`,
      `  part-of: { iri: [${NV}def/partOf], inverse: [${NV}def/hasPart] }`,
      `scope: [${NV}]`,
      `roots: [${NV}def/Asset]`,
      'rules: { redundant-subclass: note, orphan-class: off }',
      'rule-dirs: [./team-rules]   # more rule files',
      'allow:',
      `  - { rule: kind-and-part, focus: ${NV}def/Pantograph }`,
      '',
    ].join('\n');
    const { config, errors } = parseConfig(text, FILE);
    expect(errors).toEqual([]);
    expect(config).toEqual({
      file: FILE,
      presets: ['rdfs', 'owl', 'obo'],
      roles: {
        'subclass-of': { iri: [`${NV}def/kindOf`], inverse: [] },
        'part-of': { iri: [`${NV}def/partOf`], inverse: [`${NV}def/hasPart`] },
      },
      scope: [NV],
      roots: [`${NV}def/Asset`],
      rules: { 'redundant-subclass': 'note', 'orphan-class': 'off' },
      ruleLines: { 'redundant-subclass': 7, 'orphan-class': 7 },
      ruleDirs: [path.resolve('/projects/northvale/team-rules')],
      allow: [{ rule: 'kind-and-part', focus: `${NV}def/Pantograph`, reason: '', file: FILE, line: 10 }],
      contexts: {},
    });
  });

  it('reads block style, reasons, and the role mapping form with only `inverse`', () => {
    const text = [
      'roles:',
      '  part-of:',
      '    inverse:',
      `      - ${NV}def/hasComponent`,
      'rules:',
      '  orphan-class: warning',
      '  part-cycle: error',
      'rule-dirs:',
      '  - ../shared-rules',
      '  - /opt/isapart/rules',
      'allow:',
      '  - rule: orphan-class',
      `    focus: ${NV}def/Timetable`,
      '    reason: timetables are linted in their own graph',
    ].join('\n');
    const { config, errors } = parseConfig(text, FILE);
    expect(errors).toEqual([]);
    expect(config.presets).toEqual(['rdfs', 'owl', 'dcterms', 'schema', 'obo']);
    expect(config.roles).toEqual({ 'part-of': { iri: [], inverse: [`${NV}def/hasComponent`] } });
    expect(config.rules).toEqual({ 'orphan-class': 'warning', 'part-cycle': 'error' });
    expect(config.ruleLines).toEqual({ 'orphan-class': 6, 'part-cycle': 7 });
    expect(config.ruleDirs).toEqual([path.resolve('/projects/shared-rules'), path.resolve('/opt/isapart/rules')]);
    expect(config.allow).toEqual([
      { rule: 'orphan-class', focus: `${NV}def/Timetable`, reason: 'timetables are linted in their own graph', file: FILE, line: 12 },
    ]);
  });

  it('lets `presets` replace the default list, down to none', () => {
    expect(parseConfig('presets: [skos]\n', FILE).config.presets).toEqual(['skos']);
    expect(parseConfig('presets: []\n', FILE).config.presets).toEqual([]);
  });

  it('gives the defaults for an empty file or one with comments only', () => {
    expect(parseConfig('', FILE)).toEqual({ config: { ...emptyConfig(), file: FILE }, errors: [] });
    expect(parseConfig('# nothing set yet\n', FILE)).toEqual({ config: { ...emptyConfig(), file: FILE }, errors: [] });
  });

  it('follows YAML aliases', () => {
    const text = [`scope: &ours [${NV}]`, 'roots: *ours'].join('\n');
    const { config, errors } = parseConfig(text, FILE);
    expect(errors).toEqual([]);
    expect(config.roots).toEqual([NV]);
  });

  it('drops repeated list items without complaint (a repeat changes nothing)', () => {
    const { config, errors } = parseConfig(`presets: [rdfs, rdfs]\nscope: [${NV}, ${NV}]\n`, FILE);
    expect(errors).toEqual([]);
    expect(config.presets).toEqual(['rdfs']);
    expect(config.scope).toEqual([NV]);
  });
});

describe('parseConfig errors', () => {
  it('an unknown key suggests the nearest known key', () => {
    expect(errorsOf('scope: []\nrule_dirs: [./team-rules]\n')).toEqual([
      '2:1 unknown key `rule_dirs` | did you mean `rule-dirs`? (known keys: presets, roles, scope, roots, rules, rule-dirs, allow, contexts, endpoint)',
    ]);
  });

  it('an unknown key far from all keys lists the known keys', () => {
    expect(errorsOf('baseline: old.json\n')).toEqual(['1:1 unknown key `baseline` | known keys: presets, roles, scope, roots, rules, rule-dirs, allow, contexts, endpoint']);
  });

  it('an unknown preset lists the known presets', () => {
    expect(errorsOf('presets: [rdfs, owl2]\n')).toEqual([
      '1:17 unknown preset `owl2` | did you mean `owl`? (known presets: rdfs, owl, dcterms, schema, obo, skos)',
    ]);
  });

  it('an unknown role lists the known roles', () => {
    expect(errorsOf(`roles:\n  kind-of: [${NV}def/kindOf]\n`)).toEqual([
      '2:3 unknown role `kind-of` | known roles: instance-of, subclass-of, part-of, disjoint-with, equivalent-to',
    ]);
    expect(errorsOf(`roles:\n  partof: [${NV}def/partOf]\n`)).toEqual([
      '2:3 unknown role `partof` | did you mean `part-of`? (known roles: instance-of, subclass-of, part-of, disjoint-with, equivalent-to)',
    ]);
  });

  it('an unknown key inside a role mapping suggests `iri` or `inverse`', () => {
    expect(errorsOf(`roles:\n  part-of: { iri: [${NV}def/partOf], invers: [${NV}def/hasPart] }\n`)).toEqual([
      '2:69 unknown key `invers` in `roles: part-of` | did you mean `inverse`? (known keys: iri, inverse)',
    ]);
  });

  it('a malformed IRI says why, at the IRI', () => {
    expect(errorsOf('scope:\n  - data.northvale-rail.example/\n')).toEqual([
      '2:5 `data.northvale-rail.example/` in `scope` is not an absolute IRI: it has no scheme; an absolute IRI starts with a scheme such as `https:` | write a full IRI such as https://data.northvale-rail.example/def/Asset',
    ]);
    expect(errorsOf(`roots: ["${NV}def/Rolling Stock"]\n`)).toEqual([
      '1:9 `https://data.northvale-rail.example/def/Rolling Stock` in `roots` is not an absolute IRI: it contains a space at character 48 | write a full IRI such as https://data.northvale-rail.example/def/Asset',
    ]);
    expect(errorsOf(`roles:\n  subclass-of: ["<${NV}def/kindOf>"]\n`)).toEqual([
      '2:17 `<https://data.northvale-rail.example/def/kindOf>` in `roles: subclass-of` is not an absolute IRI: write the IRI without the angle brackets `<` and `>` | write a full IRI such as https://data.northvale-rail.example/def/Asset',
    ]);
  });

  it('a wrong level lists the levels', () => {
    expect(errorsOf('rules:\n  orphan-class: ignore\n  part-cycle: 2\n')).toEqual([
      '2:17 the level of rule `orphan-class` must be one of error, warning, note, off, found `ignore` | levels: error, warning, note, off',
      '3:15 the level of rule `part-cycle` must be one of error, warning, note, off, found the number 2 | levels: error, warning, note, off',
    ]);
  });

  it('a rule with no level is blamed at its id', () => {
    expect(errorsOf('rules:\n  orphan-class:\n')).toEqual([
      '2:3 the level of rule `orphan-class` must be one of error, warning, note, off, found nothing | levels: error, warning, note, off',
    ]);
  });

  it('a wrong type says the expected type', () => {
    expect(errorsOf(`roots: ${NV}def/Asset\n`)).toEqual([
      '1:8 `roots` must be a list of class IRIs, found the text `https://data.northvale-rail.example/def/Asset` | write a list, for example `roots: [https://data.northvale-rail.example/def/Asset]`',
    ]);
    expect(errorsOf('presets: rdfs\n')).toEqual([
      '1:10 `presets` must be a list of preset names, found the text `rdfs` | write a list, for example `presets: [rdfs, owl, obo]`',
    ]);
    expect(errorsOf('scope: [42]\n')).toEqual([
      '1:9 each item of `scope` must be an IRI prefix, found the number 42 | write an IRI prefix as text; quote it if YAML reads it as another kind',
    ]);
    expect(errorsOf('rules: [orphan-class]\n')).toEqual([
      '1:8 `rules` must be a mapping from rule id to level, found a list | write `rules: { redundant-subclass: note, orphan-class: off }`',
    ]);
    expect(errorsOf('roles: [subclass-of]\n')).toEqual([
      '1:8 `roles` must be a mapping from role to predicate IRIs, found a list | write `roles: { subclass-of: [https://data.northvale-rail.example/def/kindOf] }`',
    ]);
    expect(errorsOf(`roles:\n  part-of: ${NV}def/partOf\n`)).toEqual([
      '2:12 `roles: part-of` must be a list of predicate IRIs or a mapping with `iri` and `inverse` lists, found the text `https://data.northvale-rail.example/def/partOf` | write `part-of: [https://data.northvale-rail.example/def/partOf]` or `part-of: { iri: [...], inverse: [...] }`',
    ]);
    expect(errorsOf('rule-dirs: [true]\n')).toEqual([
      '1:13 each item of `rule-dirs` must be a folder path, found the boolean true | write a folder path as text; quote it if YAML reads it as another kind',
    ]);
  });

  it('a key with no value is blamed at the key', () => {
    expect(errorsOf('scope:\n')).toEqual([
      '1:1 `scope` must be a list of IRI prefixes, found nothing | write a list, for example `scope: [https://data.northvale-rail.example/]`',
    ]);
  });

  it('a config that is not a mapping says what it must be', () => {
    expect(errorsOf('- rdfs\n- owl\n')).toEqual([
      '1:1 the config must be a mapping of keys such as `presets:` and `scope:`, found a list | known keys: presets, roles, scope, roots, rules, rule-dirs, allow, contexts, endpoint',
    ]);
  });

  it('a non-text key is reported', () => {
    expect(errorsOf('scope: []\n12: x\n')).toEqual(['2:1 a key must be text, found the number 12 | write the key as a plain word such as `scope`']);
  });

  it('allow entries: missing focus, unknown key, blank node focus, non-mapping, empty rule-dirs path', () => {
    const text = [
      'allow:',
      '  - { rule: kind-and-part }',
      `  - { rule: kind-and-part, focus: ${NV}def/Bogie, resaon: worn }`,
      '  - { rule: orphan-class, focus: "_:b3" }',
      '  - orphan-class',
      'rule-dirs: [""]',
    ].join('\n');
    expect(errorsOf(text)).toEqual([
      '2:5 an `allow` entry has no `focus` | write `- { rule: kind-and-part, focus: https://data.northvale-rail.example/def/Asset, reason: ... }`',
      '3:82 unknown key `resaon` in an `allow` entry | did you mean `reason`? (known keys: rule, focus, reason)',
      '4:34 the focus `_:b3` of an `allow` entry is not an absolute IRI: it is a blank node label; only IRIs can be named in config | blank node labels differ between runs; suppress such a finding with an `# isapart-allow` comment in the source',
      '5:5 each item of `allow` must be a mapping with `rule` and `focus`, found the text `orphan-class` | write `- { rule: kind-and-part, focus: https://data.northvale-rail.example/def/Asset, reason: ... }`',
      '6:13 an item of `rule-dirs` is an empty path | write a folder relative to this config file, such as ./team-rules',
    ]);
    // The entry with a misspelt key still suppresses: only the unknown key is wrong.
    expect(parseConfig(text, FILE).config.allow.map((entry) => entry.focus)).toEqual([`${NV}def/Bogie`]);
  });

  it('allow entries: both keys missing are both named; a non-text value is reported once', () => {
    expect(errorsOf('allow:\n  - { reason: none }\n  - { rule: [orphan-class], focus: https://data.northvale-rail.example/def/Bogie }\n')).toEqual([
      '2:5 an `allow` entry has no `rule` | write `- { rule: kind-and-part, focus: https://data.northvale-rail.example/def/Asset, reason: ... }`',
      '2:5 an `allow` entry has no `focus` | write `- { rule: kind-and-part, focus: https://data.northvale-rail.example/def/Asset, reason: ... }`',
      '3:13 `rule` of an `allow` entry must be text, found a list | write `- { rule: kind-and-part, focus: https://data.northvale-rail.example/def/Asset, reason: ... }`',
    ]);
  });

  it('a predicate mapped to two roles, or one role both ways, is reported at the roles: IRI', () => {
    const text = [
      'roles:',
      '  part-of: [http://www.w3.org/2000/01/rdf-schema#subClassOf]',
      `  subclass-of: { iri: [${NV}def/kindOf], inverse: [${NV}def/kindOf] }`,
    ].join('\n');
    expect(errorsOf(text)).toEqual([
      '2:13 predicate <http://www.w3.org/2000/01/rdf-schema#subClassOf> is mapped to subclass-of by preset rdfs and to part-of by roles: part-of | map each predicate to one role, one way; remove one of the two mappings',
      '3:83 predicate <https://data.northvale-rail.example/def/kindOf> is mapped to subclass-of by roles: subclass-of and to subclass-of (inverse) by roles: subclass-of inverse | map each predicate to one role, one way; remove one of the two mappings',
    ]);
  });

  it('YAML syntax errors give line, column and a hint, and reading goes on', () => {
    expect(errorsOf('scope: []\nscope: []\n')).toEqual([
      '2:1 YAML syntax error: Map keys must be unique | each key may appear once in a mapping; merge the two entries',
    ]);
    expect(errorsOf('scope: []\n\troots: []\n')[0]).toBe(
      '2:1 YAML syntax error: Tabs are not allowed as indentation | indent nested entries with spaces, by the same amount for entries of one mapping or list',
    );
    expect(errorsOf('scope: []\n---\nroots: []\n')[0]).toMatch(/^2:1 YAML syntax error: .* \| isapart.yaml holds one document; remove the `---` or `...` separator$/);
    const unclosed = parseConfig(`presets: [rdfs\nscope: [${NV}]\n`, FILE);
    expect(unclosed.errors.length).toBeGreaterThan(0);
    expect(unclosed.errors[0].message).toMatch(/^YAML syntax error: /);
    expect(unclosed.errors[0].line).toBe(2);
  });

  it('hints at the unclosed bracket, not at indentation, when a flow list or mapping is left open', () => {
    const hint = 'close the `[` or `{` opened above with `]` or `}` on the same entry, or indent its continuation lines';
    expect(parseConfig(`scope: [${NV}\nroots: []\n`, FILE).errors.map((error) => `${error.line}:${error.column} ${error.hint}`)).toContain(`2:1 ${hint}`);
    expect(parseConfig('rules: { orphan-class: off\nscope: []\n', FILE).errors.map((error) => error.hint)).toContain(hint);
  });

  it('puts the file on every error and returns the best config beside the errors', () => {
    const { config, errors } = parseConfig(`presets: [rdfs, nope]\nscope: [${NV}, "not an iri"]\nrules: { orphan-class: off, part-cycle: loud }\n`, FILE);
    expect(errors.map((error) => error.file)).toEqual([FILE, FILE, FILE]);
    expect(config.presets).toEqual(['rdfs']);
    expect(config.scope).toEqual([NV]);
    expect(config.rules).toEqual({ 'orphan-class': 'off' });
  });
});
