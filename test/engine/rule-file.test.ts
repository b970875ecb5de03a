// Rule files: validation errors with line, column and hint; rule folders; the registry.
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DuplicateRuleError, createRegistry } from '../../src/engine/registry.js';
import { loadBuiltinRules, loadRuleDir, parseRuleFile } from '../../src/engine/rule-file.js';

const EXAMPLES = `examples:
  flagged: |
    @prefix nv: <https://data.northvale-rail.example/def/> .
  clean: |
    @prefix nv: <https://data.northvale-rail.example/def/> .
`;

/** A valid rule file whose match and report can be replaced. */
function ruleText(
  options: { id?: string; match?: string; report?: string; extra?: string } = {},
): string {
  return [
    `id: ${options.id ?? 'kind-and-part'}`,
    'level: warning',
    'summary: A class is both a part of and a kind of the same thing.',
    'description: |',
    '  Part-of and kind-of are different relations.',
    'match:',
    options.match ?? '  - [?a, part-of, ?b]\n  - [?a, subclass-of+|instance-of/subclass-of*, ?b]',
    'report:',
    options.report ?? '  focus: ?a\n  nodes: [?a, ?b]\n  message: "{a} is part of {b} and also a kind of {b}"',
    ...(options.extra === undefined ? [] : [options.extra]),
    EXAMPLES,
  ].join('\n');
}

function errorsOf(text: string) {
  const result = parseRuleFile(text, 'rules/sample.yaml');
  expect(result.rule).toBeUndefined();
  return result.errors;
}

describe('parseRuleFile', () => {
  it('reads a valid rule with every part', () => {
    const { rule, errors } = parseRuleFile(
      ruleText({ extra: 'fix:\n  remove: [[?a, part-of, ?b]]', report: '  focus: ?a\n  nodes: [?a, ?b]\n  unordered: [[?a, ?b]]\n  message: "{a} and {b}"' }),
      'rules/sample.yaml',
    );
    expect(errors).toEqual([]);
    expect(rule?.id).toBe('kind-and-part');
    expect(rule?.match).toEqual([
      { type: 'path', subject: '?a', path: 'part-of', object: '?b' },
      { type: 'path', subject: '?a', path: 'subclass-of+|instance-of/subclass-of*', object: '?b' },
    ]);
    expect(rule?.report).toEqual({ focus: '?a', nodes: ['?a', '?b'], unordered: [['?a', '?b']], message: '{a} and {b}' });
    expect(rule?.fix).toEqual({ remove: [{ subject: '?a', role: 'part-of', object: '?b' }] });
    expect(rule?.file).toBe('rules/sample.yaml');
  });

  it('reads every kind of match entry', () => {
    const { rule, errors } = parseRuleFile(
      ruleText({
        match: [
          '  - cycle: { path: subclass-of, members: ?m }',
          '  - { is: [?a, class] }',
          '  - { absent: [?a, subclass-of] }',
          '  - [?a, part-of, ?b]',
          '  - { differ: [?a, ?b] }',
          '  - not:',
          '      - [?b, instance-of, ?k]',
          '      - { is: [?k, in-scope] }',
        ].join('\n'),
        report: '  focus: ?m\n  nodes: [?m, ?a]\n  message: "{m} and {a}"',
      }),
      'x.yaml',
    );
    expect(errors).toEqual([]);
    expect(rule?.match.map((entry) => entry.type)).toEqual(['cycle', 'is', 'absent', 'path', 'differ', 'not']);
  });

  it('names an unknown key with its line and the nearest known key', () => {
    const errors = errorsOf(ruleText({ extra: 'sumary: typo' }));
    expect(errors).toHaveLength(1);
    // Lines 1–12 are the valid rule; the extra key is line 13.
    expect(errors[0]).toMatchObject({ file: 'rules/sample.yaml', line: 13, column: 1 });
    expect(errors[0].message).toContain("unknown key 'sumary'");
    expect(errors[0].hint).toContain('did you mean `summary`');
  });

  it('points a path syntax error at the column inside the path string', () => {
    const errors = errorsOf(ruleText({ match: '  - [?a, subclass-of/part-off, ?b]' }));
    expect(errors).toHaveLength(1);
    // Line 7 is "  - [?a, subclass-of/part-off, ?b]"; the path starts at column 10, part-off at 22.
    expect(errors[0]).toMatchObject({ line: 7, column: 22 });
    expect(errors[0].hint).toContain('part-of');
    const quoted = errorsOf(ruleText({ match: '  - [?a, "subclass-of||part-of", ?b]' }));
    expect(quoted[0]).toMatchObject({ line: 7, column: 23 });
  });

  it('rejects a report variable bound only inside not, and a placeholder naming no bound variable', () => {
    const errors = errorsOf(
      ruleText({
        match: '  - [?a, part-of, ?b]\n  - not:\n      - [?a, instance-of, ?k]',
        report: '  focus: ?a\n  nodes: [?a, ?k]\n  message: "{a} is in {z}"',
      }),
    );
    expect(errors.map((error) => [error.line, error.message])).toEqual([
      [12, '?k is not bound by a positive entry of match'],
      [13, 'message placeholder {z} names no variable bound by a positive entry of match'],
    ]);
    // The placeholder error points at the brace: message: "{a} is in {z}" has {z} at column 23.
    expect(errors[1].column).toBe(23);
  });

  it('rejects a filter on an unbound variable, a list variable used as a node, and an unknown kind', () => {
    const errors = errorsOf(
      ruleText({
        match: '  - cycle: { path: part-of, members: ?m }\n  - { differ: [?m, ?q] }\n  - { is: [?m, klass] }',
        report: '  focus: ?m\n  nodes: [?m]\n  message: "{m}"',
      }),
    );
    const messages = errors.map((error) => error.message);
    expect(messages).toContain("unknown node kind 'klass'");
    expect(errors.find((error) => error.message.includes('klass'))?.hint).toContain('did you mean `class`');
    const all = errorsOf(
      ruleText({
        match: '  - cycle: { path: part-of, members: ?m }\n  - { differ: [?m, ?q] }',
        report: '  focus: ?m\n  nodes: [?m]\n  message: "{m}"',
      }),
    ).map((error) => error.message);
    expect(all).toContain("?m holds a cycle's member list and cannot stand for one node");
    expect(all).toContain('?q is not bound by a positive entry');
  });

  it('rejects a cycle over a path that matches zero edges', () => {
    const errors = errorsOf(ruleText({ match: '  - cycle: { path: subclass-of*, members: ?m }', report: '  focus: ?m\n  nodes: [?m]\n  message: "{m}"' }));
    expect(errors[0].message).toContain('matches zero edges');
    expect(errors[0].hint).toContain('+');
  });

  it('reports missing keys, a bad id, a bad level and missing examples', () => {
    const text = ['id: Kind_And_Part', 'level: off', 'summary: s', 'description: d', 'match:', '  - [?a, part-of, ?b]', 'examples:', '  flagged: x'].join('\n');
    const errors = errorsOf(text);
    const messages = errors.map((error) => error.message);
    expect(messages).toContain("the rule has no 'report'");
    expect(messages).toContain("id 'Kind_And_Part' is not lower-case words joined by hyphens");
    expect(messages).toContain("level 'off' is not a finding level");
    expect(messages).toContain("examples has no 'clean'");
    expect(errors.find((error) => error.message.includes('level'))).toMatchObject({ line: 2, column: 8 });
    expect(errors.find((error) => error.message.includes('level'))?.hint).toContain('isapart.yaml');
  });

  it('turns YAML syntax errors into errors with a line', () => {
    const errors = errorsOf('id: x\nmatch: [\n  - a\n');
    expect(errors.length).toBeGreaterThan(0);
    expect(errors[0].message.startsWith('YAML: ')).toBe(true);
    expect(errors[0].line).toBeGreaterThanOrEqual(2);
    expect(errors.every((error) => error.hint !== undefined && error.hint.length > 0)).toBe(true);
  });

  it('rejects a fix that names a role that does not exist or a variable of a not', () => {
    const errors = errorsOf(ruleText({ extra: 'fix:\n  remove:\n    - [?a, partof, ?b]' }));
    expect(errors[0].message).toBe("unknown role 'partof'");
    // fix: is line 13, remove: 14, the pattern 15.
    expect(errors[0].line).toBe(15);
  });
});

describe('rule folders and the registry', () => {
  it('loads *.yaml and *.yml files in sorted order and reports a duplicate id naming both files', () => {
    const dir = mkdtempSync(join(tmpdir(), 'isapart-rules-'));
    writeFileSync(join(dir, 'b.yml'), ruleText({ id: 'second-rule' }));
    writeFileSync(join(dir, 'a.yaml'), ruleText({ id: 'kind-and-part' }));
    writeFileSync(join(dir, 'c.yaml'), ruleText({ id: 'kind-and-part' }));
    writeFileSync(join(dir, 'notes.txt'), 'not a rule');
    const { rules, errors } = loadRuleDir(dir);
    expect(errors).toEqual([]);
    expect(rules.map((rule) => rule.file)).toEqual([join(dir, 'a.yaml'), join(dir, 'b.yml'), join(dir, 'c.yaml')]);
    let thrown: unknown;
    try {
      createRegistry(rules);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(DuplicateRuleError);
    const [duplicate] = (thrown as DuplicateRuleError).errors;
    expect(duplicate).toMatchObject({ file: join(dir, 'c.yaml'), line: 1 });
    expect(duplicate.message).toContain(join(dir, 'a.yaml'));
    const registry = createRegistry([rules[1], rules[0]]);
    expect([...registry.keys()]).toEqual(['kind-and-part', 'second-rule']);
    expect(() => (registry as Map<string, unknown>).set('x', rules[0])).toThrow(/frozen/);
  });

  it('reports a rule file it cannot read, and still reads the others', () => {
    const dir = mkdtempSync(join(tmpdir(), 'isapart-rules-'));
    writeFileSync(join(dir, 'a.yaml'), ruleText({ id: 'first-rule' }));
    mkdirSync(join(dir, 'b.yaml'));
    const { rules, errors } = loadRuleDir(dir);
    expect(rules.map((rule) => rule.id)).toEqual(['first-rule']);
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatchObject({ file: join(dir, 'b.yaml'), line: 0 });
    expect(errors[0].message).toContain('cannot read the rule file');
  });

  it('reports a missing rule folder', () => {
    const { errors } = loadRuleDir(join(tmpdir(), 'isapart-no-such-folder'));
    expect(errors).toHaveLength(1);
    expect(errors[0].hint).toContain('rule-dirs');
  });

  it('loads the built-in rules without errors, with the ids design.md lists', () => {
    const { rules, errors } = loadBuiltinRules();
    expect(errors).toEqual([]);
    // design.md, "Built-in rules".
    expect(rules.map((rule) => rule.id).sort()).toEqual([
      'deprecated-in-use',
      'disjoint-overlap',
      'individual-as-class',
      'instance-and-subclass',
      'kind-and-part',
      'orphan-class',
      'part-cycle',
      'redundant-subclass',
      'subclass-cycle',
    ]);
    expect([...createRegistry(rules).keys()]).toHaveLength(9);
  });
});
