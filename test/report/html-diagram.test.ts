// Evidence diagrams on their own: one edge per statement (self-loops and repeated statements included), and a palette that reads on white.
import { describe, expect, it } from 'vitest';
import type { Finding } from '../../src/engine/finding.js';
import { diagramSvg } from '../../src/report/html/diagram-svg.js';
import { EDGE_STYLES } from '../../src/report/html/edge-styles.js';
import { layoutEvidence } from '../../src/report/html/evidence-diagram.js';
import { createTermWriter } from '../../src/report/statement-text.js';
import { DCTERMS_IS_PART_OF, DEF, RDFS_SUBCLASS_OF, statement } from './report-fixtures.js';
import { attribute, parseReport, select } from './html-dom.js';

const terms = createTermWriter({ nv: DEF });
const ROLES_OF = {
  [RDFS_SUBCLASS_OF]: { role: 'subclass-of' as const, inverse: false },
  [DCTERMS_IS_PART_OF]: { role: 'part-of' as const, inverse: false },
  'http://purl.org/dc/terms/hasPart': { role: 'part-of' as const, inverse: true },
};

function finding(evidence: Finding['evidence'], focus: string, nodes: string[]): Finding {
  return { ruleId: 'subclass-cycle', level: 'error', focus, nodes, message: 'm', evidence, fingerprint: '0'.repeat(64) };
}

function drawn(value: Finding) {
  const diagram = layoutEvidence(value, { terms, labels: {}, predicateRoles: ROLES_OF });
  const { document, errors } = parseReport(`<!DOCTYPE html><title>t</title>${diagramSvg(diagram, 'test', { terms, cwd: '/srv' })}`);
  expect(errors).toEqual([]);
  return { diagram, nodes: select(document, 'g', 'node'), edges: select(document, 'g', 'edge') };
}

describe('evidence diagrams', () => {
  it('draws a class stated to be its own subclass as one node with one edge', () => {
    const car = `${DEF}Car`;
    const { nodes, edges } = drawn(finding([statement({ subject: car, predicate: RDFS_SUBCLASS_OF, object: car, file: '/srv/a.ttl', line: 3 })], car, [car]));
    expect(nodes).toHaveLength(1);
    expect(edges).toHaveLength(1);
    expect([attribute(edges[0], 'data-from'), attribute(edges[0], 'data-to')]).toEqual(['n0', 'n0']);
  });

  it('draws the same edge stated in two files as two edges, each with its own place', () => {
    const cab = `${DEF}Cab`;
    const car = `${DEF}Car`;
    const evidence = [
      statement({ subject: cab, predicate: DCTERMS_IS_PART_OF, object: car, file: '/srv/a.ttl', line: 3 }),
      statement({ subject: car, predicate: 'http://purl.org/dc/terms/hasPart', object: cab, file: '/srv/b.ttl', line: 9 }),
    ];
    const { nodes, edges, diagram } = drawn(finding(evidence, cab, [cab, car]));
    expect(nodes).toHaveLength(2);
    expect(edges).toHaveLength(2);
    // The hasPart statement is turned round, so both edges run from the part to the whole.
    expect(edges.map((edge) => `${attribute(edge, 'data-from')}>${attribute(edge, 'data-to')}`)).toEqual(['n0>n1', 'n0>n1']);
    expect(diagram.edges.map((edge) => edge.turned)).toEqual([false, true]);
    expect(edges.map((edge) => select(edge, 'title')[0].childNodes.map((node) => ('value' in node ? node.value : '')).join('').split('  ')[0])).toEqual(['a.ttl:3:1', 'b.ttl:9:1']);
  });

  it('places every edge end on the border of its node box', () => {
    const [a, b, c, d] = ['A', 'B', 'C', 'D'].map((name) => `${DEF}${name}`);
    const evidence = [
      statement({ subject: a, predicate: RDFS_SUBCLASS_OF, object: b, file: '/srv/a.ttl', line: 1 }),
      statement({ subject: b, predicate: RDFS_SUBCLASS_OF, object: c, file: '/srv/a.ttl', line: 2 }),
      statement({ subject: a, predicate: RDFS_SUBCLASS_OF, object: d, file: '/srv/a.ttl', line: 3 }),
      statement({ subject: d, predicate: RDFS_SUBCLASS_OF, object: c, file: '/srv/a.ttl', line: 4 }),
    ];
    const { diagram } = drawn(finding(evidence, a, [a, c]));
    const byId = new Map(diagram.nodes.map((node) => [node.id, node]));
    const onBorder = (point: { x: number; y: number }, id: string) => {
      const node = byId.get(id)!;
      const dx = Math.abs(point.x - node.x) - node.width / 2;
      const dy = Math.abs(point.y - node.y) - node.height / 2;
      // On the border: within 1.5 px of one side, and not outside the other.
      return (Math.abs(dx) < 1.5 && dy < 1.5) || (Math.abs(dy) < 1.5 && dx < 1.5);
    };
    for (const edge of diagram.edges) {
      expect(onBorder(edge.points[0], edge.from)).toBe(true);
      expect(onBorder(edge.points[edge.points.length - 1], edge.to)).toBe(true);
    }
    // Bottom to top: each superclass is drawn above its subclass.
    for (const edge of diagram.edges) expect(byId.get(edge.to)!.y).toBeLessThan(byId.get(edge.from)!.y);
  });

  it('uses edge colours with at least 4.5:1 contrast on white, and a distinct colour per kind', () => {
    // WCAG 2.1 relative luminance and contrast ratio (W3C, definitions section; formula from memory);
    // 3:1 is the success criterion 1.4.11 minimum for graphics, 4.5:1 the one for text.
    const luminance = (hex: string) => {
      const [r, g, b] = [1, 3, 5].map((start) => parseInt(hex.slice(start, start + 2), 16) / 255).map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
      return 0.2126 * r + 0.7152 * g + 0.0722 * b;
    };
    for (const style of EDGE_STYLES) expect((1.05 / (luminance(style.colour) + 0.05))).toBeGreaterThanOrEqual(4.5);
    expect(new Set(EDGE_STYLES.map((style) => style.colour)).size).toBe(EDGE_STYLES.length);
  });
});
