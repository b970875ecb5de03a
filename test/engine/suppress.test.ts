// Suppression: trailing and own-line allow comments, config allow entries, and allows that suppress nothing.
import { describe, expect, it } from 'vitest';
import type { AllowEntry } from '../../src/config/config.js';
import type { Finding } from '../../src/engine/finding.js';
import { fingerprintOf } from '../../src/engine/fingerprint.js';
import { UNUSED_ALLOW_RULE, applySuppressions } from '../../src/engine/suppress.js';
import type { AllowComment, Statement } from '../../src/load/statement.js';

const NV = 'https://data.northvale-rail.example/def/';

function statement(file: string, line: number, objectLine = line): Statement {
  return {
    subject: `${NV}Pantograph`,
    predicate: 'http://purl.org/dc/terms/isPartOf',
    object: `${NV}Roof`,
    graph: '',
    position: { file, line, column: 1 },
    objectLine,
  };
}

function finding(ruleId: string, focus: string, evidence: Statement[]): Finding {
  return { ruleId, level: 'warning', focus, nodes: [focus], message: 'm', evidence, fingerprint: fingerprintOf(ruleId, [focus]) };
}

function comment(file: string, line: number, ruleId: string, ownLine: boolean, reason = 'checked with the fleet engineers'): AllowComment {
  return { file, line, column: ownLine ? 1 : 40, ruleId, reason, ownLine };
}

describe('applySuppressions', () => {
  const pantograph = finding('kind-and-part', `${NV}Pantograph`, [statement('assets.ttl', 10, 11)]);
  const bogie = finding('kind-and-part', `${NV}Bogie`, [statement('assets.ttl', 20)]);

  it('applies a comment at the end of an evidence line (subject line or object line)', () => {
    for (const line of [10, 11]) {
      const { findings, unused } = applySuppressions([pantograph, bogie], [comment('assets.ttl', line, 'kind-and-part', false)], []);
      expect(findings[0].suppression).toEqual({ kind: 'inSource', justification: 'checked with the fleet engineers', file: 'assets.ttl', line });
      expect(findings[1].suppression).toBeUndefined();
      expect(unused).toEqual([]);
    }
  });

  it('applies a comment alone on the line above, but not one two lines above or in another file', () => {
    expect(applySuppressions([pantograph], [comment('assets.ttl', 9, 'kind-and-part', true)], []).findings[0].suppression?.kind).toBe('inSource');
    expect(applySuppressions([pantograph], [comment('assets.ttl', 8, 'kind-and-part', true)], []).findings[0].suppression).toBeUndefined();
    expect(applySuppressions([pantograph], [comment('other.ttl', 10, 'kind-and-part', false)], []).findings[0].suppression).toBeUndefined();
    // A trailing comment on the line above applies to its own line only.
    expect(applySuppressions([pantograph], [comment('assets.ttl', 9, 'kind-and-part', false)], []).findings[0].suppression).toBeUndefined();
  });

  it('applies a comment only to findings of the rule it names', () => {
    const { findings, unused } = applySuppressions([pantograph], [comment('assets.ttl', 10, 'part-cycle', false)], []);
    expect(findings[0].suppression).toBeUndefined();
    expect(unused).toHaveLength(1);
    expect(unused[0]).toMatchObject({
      ruleId: UNUSED_ALLOW_RULE.id,
      level: 'note',
      focus: 'part-cycle',
      evidence: [],
      location: { file: 'assets.ttl', line: 10, column: 40 },
    });
    expect(unused[0].message).toContain('suppresses nothing');
    expect(unused[0].message).toContain('removed');
  });

  it('applies a config allow entry by rule and focus, with its reason or the config file as justification', () => {
    const entry: AllowEntry = { rule: 'kind-and-part', focus: `${NV}Bogie`, reason: '', file: 'isapart.yaml', line: 7 };
    const { findings, unused } = applySuppressions([pantograph, bogie], [], [entry]);
    expect(findings[0].suppression).toBeUndefined();
    expect(findings[1].suppression).toEqual({ kind: 'external', justification: 'allowed in isapart.yaml', file: 'isapart.yaml', line: 7 });
    expect(unused).toEqual([]);
    const withReason = applySuppressions([bogie], [], [{ ...entry, reason: 'legacy data' }]);
    expect(withReason.findings[0].suppression?.justification).toBe('legacy data');
  });

  it('reports every comment and entry that suppressed nothing, with a fingerprint that ignores line moves', () => {
    const entry: AllowEntry = { rule: 'orphan-class', focus: `${NV}Asset`, reason: 'r', file: 'isapart.yaml', line: 3 };
    const { findings, unused } = applySuppressions([pantograph], [comment('assets.ttl', 30, 'kind-and-part', false)], [entry]);
    expect(findings).toEqual([pantograph]);
    expect(unused.map((item) => [item.focus, item.location?.file, item.location?.line])).toEqual([
      ['kind-and-part', 'assets.ttl', 30],
      ['orphan-class', 'isapart.yaml', 3],
    ]);
    const moved = applySuppressions([pantograph], [comment('assets.ttl', 31, 'kind-and-part', false)], []);
    expect(moved.unused[0].fingerprint).toBe(unused[0].fingerprint);
    expect(unused[0].fingerprint).not.toBe(unused[1].fingerprint);
    // design.md: a fingerprint is sha-256 of rule id + nodes, never of files or lines.
    expect(unused[0].fingerprint).toBe(fingerprintOf('unused-allow', unused[0].nodes));
    const renamed = applySuppressions([pantograph], [comment('renamed.ttl', 30, 'kind-and-part', false)], []);
    expect(renamed.unused[0].fingerprint).toBe(unused[0].fingerprint);
  });

  it('prefers the in-source comment when a comment and an entry both apply, and counts both as used', () => {
    const entry: AllowEntry = { rule: 'kind-and-part', focus: `${NV}Pantograph`, reason: 'r', file: 'isapart.yaml', line: 3 };
    const { findings, unused } = applySuppressions([pantograph], [comment('assets.ttl', 10, 'kind-and-part', false)], [entry]);
    expect(findings[0].suppression?.kind).toBe('inSource');
    expect(unused).toEqual([]);
  });

  it('exports the unused-allow rule metadata for reporters', () => {
    expect(UNUSED_ALLOW_RULE).toMatchObject({ id: 'unused-allow', level: 'note', match: [], file: 'built-in' });
    expect(UNUSED_ALLOW_RULE.summary.length).toBeGreaterThan(10);
    expect(UNUSED_ALLOW_RULE.description.length).toBeGreaterThan(50);
  });
});
