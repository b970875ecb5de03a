// Per-rule cases in fixtures/rules/<rule-id>/*.ttl, each with exact expectations in its header comments.
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import { lintTexts } from './lint-texts.js';

const CASES_FOLDER = new URL('../../fixtures/rules/', import.meta.url);

/** What a case's header asks for (see fixtures/rules/README.md). */
interface CaseHeader {
  expected: { focus: string; nodes: string[] }[];
  expectNone: boolean;
  expectCount?: number;
  prefixes: string[];
  roots: string[];
}

function readHeader(text: string): CaseHeader {
  const header: CaseHeader = { expected: [], expectNone: false, prefixes: [], roots: [] };
  for (const line of text.split('\n')) {
    const directive = /^# (expect|expect-count|scope|roots): (.*)$/.exec(line);
    if (directive === null) continue;
    const [, key, value] = directive;
    if (key === 'expect' && value.trim() === 'none') header.expectNone = true;
    else if (key === 'expect') {
      const [focus, nodes] = value.split('|').map((part) => part.trim());
      header.expected.push({ focus, nodes: nodes.split(/\s+/) });
    } else if (key === 'expect-count') header.expectCount = Number(value);
    else if (key === 'scope') header.prefixes.push(value.trim());
    else header.roots.push(value.trim());
  }
  return header;
}

/** Expands a prefixed name with the case file's own prefixes. */
function expand(name: string, prefixes: Record<string, string>): string {
  const colon = name.indexOf(':');
  const namespace = prefixes[name.slice(0, colon)];
  if (namespace === undefined) throw new Error(`the case names ${name}, but declares no prefix for it`);
  return namespace + name.slice(colon + 1);
}

const rulesById = new Map<string, RuleDefinition>(loadBuiltinRules().rules.map((rule) => [rule.id, rule]));
const ruleFolders = readdirSync(CASES_FOLDER, { withFileTypes: true }).filter((entry) => entry.isDirectory()).map((entry) => entry.name).sort();

describe('fixtures/rules', () => {
  it('has a folder of cases for every built-in rule', () => {
    expect(ruleFolders).toEqual([...rulesById.keys()].sort());
  });
});

describe.each(ruleFolders)('%s cases', (ruleId) => {
  const folder = new URL(`${ruleId}/`, CASES_FOLDER);
  const caseFiles = readdirSync(folder).filter((name) => name.endsWith('.ttl')).sort();

  it('has at least one flagged case and one clean case', () => {
    const headers = caseFiles.map((name) => readHeader(readFileSync(new URL(name, folder), 'utf8')));
    expect(headers.some((header) => header.expectNone)).toBe(true);
    expect(headers.some((header) => header.expected.length > 0 || (header.expectCount ?? 0) > 0)).toBe(true);
  });

  it.each(caseFiles)('%s', (name) => {
    const text = readFileSync(new URL(name, folder), 'utf8');
    const header = readHeader(text);
    const stated = Number(header.expectNone) + Number(header.expected.length > 0) + Number(header.expectCount !== undefined);
    expect(stated, 'a case states exactly one kind of expectation').toBe(1);
    const rule = rulesById.get(ruleId) as RuleDefinition;
    const result = lintTexts({
      sources: [{ text, file: `${ruleId}/${name}`, format: 'turtle' }],
      rules: [rule],
      scope: { prefixes: header.prefixes, roots: header.roots },
    });
    expect(result.sources[0].errors).toEqual([]);
    expect(result.failures).toEqual([]);
    for (const finding of result.findings) expect(finding.ruleId).toBe(ruleId);
    if (header.expectNone) expect(result.findings).toEqual([]);
    if (header.expectCount !== undefined) expect(result.findings).toHaveLength(header.expectCount);
    if (header.expected.length > 0) {
      const prefixes = result.sources[0].prefixes;
      const wanted = header.expected.map((finding) => ({ focus: expand(finding.focus, prefixes), nodes: finding.nodes.map((node) => expand(node, prefixes)) }));
      const found = result.findings.map((finding) => ({ focus: finding.focus, nodes: finding.nodes }));
      const order = (left: { focus: string }, right: { focus: string }): number => (left.focus < right.focus ? -1 : left.focus > right.focus ? 1 : 0);
      expect(found.sort(order)).toEqual(wanted.sort(order));
    }
  });
});
