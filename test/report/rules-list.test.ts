// The rule list as text, JSON and Markdown, and explainRule.
import { describe, expect, it } from 'vitest';
import type { RuleInUse } from '../../src/report/context.js';
import { explainRule, RULES_JSON_FORMAT, rulesToJson, rulesToMarkdown, rulesToText } from '../../src/report/rules-list.js';
import { KIND_AND_PART, RULES_IN_USE, SUBCLASS_CYCLE, rule } from './report-fixtures.js';

const ANSI_ESCAPE = /\u001b\[/;

describe('rulesToMarkdown', () => {
  it('writes a | id | level | flags | table sorted by id', () => {
    expect(rulesToMarkdown(RULES_IN_USE)).toBe(
      [
        '| id | level | flags |',
        '| --- | --- | --- |',
        '| `deprecated-in-use` | note | A statement points at a deprecated term. |',
        '| `kind-and-part` | warning | A class is both a kind of and a part of the same thing. |',
        '| `orphan-class` | off | An in-scope class has no superclass. |',
        '| `subclass-cycle` | error | Classes are subclasses of each other through a chain. |',
        '| `unused-allow` | warning | An allow comment suppresses nothing. |',
        '',
      ].join('\n'),
    );
  });

  it('is the same for the rules in any order, and on every call', () => {
    const reversed = [...RULES_IN_USE].reverse();
    expect(rulesToMarkdown(reversed)).toBe(rulesToMarkdown(RULES_IN_USE));
    expect(rulesToMarkdown(RULES_IN_USE)).toBe(rulesToMarkdown(RULES_IN_USE));
  });

  it('keeps a summary with a | or line breaks inside its cell', () => {
    const piped: RuleInUse = { rule: rule({ id: 'part-cycle', level: 'error', summary: 'A part of itself\n(through part-of | has-part).' }), level: 'error' };
    const row = rulesToMarkdown([piped]).split('\n')[2];
    expect(row).toBe('| `part-cycle` | error | A part of itself (through part-of \\| has-part). |');
    // GitHub Flavored Markdown tables (common practice): a row has as many unescaped `|` as the header.
    expect(row.replace(/\\\|/g, '').split('|').length).toBe('| id | level | flags |'.split('|').length);
  });
});

describe('rulesToText', () => {
  it('lists id, level and summary in aligned columns, sorted by id', () => {
    const lines = rulesToText(RULES_IN_USE, false).trimEnd().split('\n');
    expect(lines).toEqual([
      'id                 level    summary',
      'deprecated-in-use  note     A statement points at a deprecated term.',
      'kind-and-part      warning  A class is both a kind of and a part of the same thing.',
      'orphan-class       off      An in-scope class has no superclass.',
      'subclass-cycle     error    Classes are subclasses of each other through a chain.',
      'unused-allow       warning  An allow comment suppresses nothing.',
    ]);
  });

  it('colours level words only when asked', () => {
    expect(rulesToText(RULES_IN_USE, false)).not.toMatch(ANSI_ESCAPE);
    const coloured = rulesToText(RULES_IN_USE, true);
    // SGR codes (ECMA-48): 31 red, 39 default colour.
    expect(coloured).toContain('\u001b[31merror\u001b[39m');
    expect(coloured.replace(/\u001b\[\d+m/g, '')).toBe(rulesToText(RULES_IN_USE, false));
  });
});

describe('rulesToJson', () => {
  it('writes a versioned document with effective and default levels, sorted by id', () => {
    const text = rulesToJson(RULES_IN_USE);
    const document = JSON.parse(text);
    expect(text).toBe(`${JSON.stringify(document, null, 2)}\n`);
    expect(document.format).toBe(RULES_JSON_FORMAT);
    expect(document.version).toBe(1);
    expect(document.rules.map((entry: any) => entry.id)).toEqual(['deprecated-in-use', 'kind-and-part', 'orphan-class', 'subclass-cycle', 'unused-allow']);
    expect(document.rules[0]).toEqual({
      id: 'deprecated-in-use',
      level: 'note',
      defaultLevel: 'warning',
      summary: 'A statement points at a deprecated term.',
      description: 'What deprecated-in-use looks for, and how to fix it.\nSecond line of the description.',
      fixable: false,
    });
    expect(document.rules[1].fixable).toBe(true);
  });
});

describe('explainRule', () => {
  it('gives the summary, level, fix, description and both examples', () => {
    expect(explainRule(KIND_AND_PART, 'warning')).toBe(
      [
        'kind-and-part: A class is both a kind of and a part of the same thing.',
        '',
        'level: warning',
        'fix: removes ?a part-of ?b',
        '',
        'What kind-and-part looks for, and how to fix it.',
        'Second line of the description.',
        '',
        'Flagged (Turtle that produces this finding):',
        '    @prefix nv: <https://data.northvale-rail.example/def/> .',
        '    nv:Pantograph nv:partOf nv:Locomotive .',
        '',
        'Clean (Turtle that does not):',
        '    @prefix nv: <https://data.northvale-rail.example/def/> .',
        '    nv:Pantograph nv:partOf nv:RoofAssembly .',
        '',
      ].join('\n'),
    );
  });

  it('names the default level when the run changed it, and has no fix line for a rule without one', () => {
    const explained = explainRule(SUBCLASS_CYCLE, 'off');
    expect(explained).toContain('\nlevel: off (default: error)\n');
    expect(explained).not.toContain('fix:');
    const noExamples = explainRule({ ...SUBCLASS_CYCLE, examples: { flagged: '', clean: '  \n' } }, 'error');
    expect(noExamples).toContain('Flagged (Turtle that produces this finding):\n    (none)\n');
    expect(noExamples).toContain('Clean (Turtle that does not):\n    (none)\n');
  });
});
