// A cycle's members follow a walk chosen by term order, so the statements' order changes no fingerprint.
import { describe, expect, it } from 'vitest';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { runRules } from '../../src/engine/run.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import type { Statement } from '../../src/load/statement.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import { RDFS_SUBCLASS_OF } from '../../src/roles/vocabulary.js';
import { sourceOf } from './sparql-harness.js';

const NV = 'https://data.northvale-rail.example/def/';

function subclass(subject: string, object: string, line: number): Statement {
  return { subject: NV + subject, predicate: RDFS_SUBCLASS_OF, object: NV + object, graph: '', position: { file: 'cycle.nt', line, column: 1 }, objectLine: line };
}

function cycleNodes(order: [string, string][]): string[][] {
  const statements = order.map(([subject, object], index) => subclass(subject, object, index + 1));
  const graph = buildHierarchyGraph([sourceOf('cycle.nt', statements)], buildRoleMap(['rdfs'], {}), { prefixes: [NV], roots: [] });
  const rule = loadBuiltinRules().rules.find((candidate) => candidate.id === 'subclass-cycle');
  if (rule === undefined) throw new Error('no subclass-cycle rule');
  return runRules(graph, [{ rule, level: 'error' }]).findings.map((finding) => finding.nodes);
}

describe('cycle member order', () => {
  it('takes the walk through the successor whose term sorts first, whatever order the statements came in', () => {
    // Two closed walks of length 2 start at Axle (the member that sorts first): via Frame and via Bogie.
    const edges: [string, string][] = [
      ['Axle', 'Bogie'],
      ['Bogie', 'Axle'],
      ['Axle', 'Frame'],
      ['Frame', 'Axle'],
    ];
    const forwards = cycleNodes(edges);
    const backwards = cycleNodes([...edges].reverse());
    expect(forwards).toEqual([[NV + 'Axle', NV + 'Bogie', NV + 'Frame']]);
    expect(backwards).toEqual(forwards);
  });
});
