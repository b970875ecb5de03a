// The HTML report on the demo and on hostile input: well formed, self-contained, escaped, one row and one diagram per finding.
import { Graph, alg } from '@dagrejs/graphlib';
import { beforeAll, describe, expect, it } from 'vitest';
import type { CheckResult } from '../../src/check.js';
import type { Finding } from '../../src/engine/finding.js';
import { toHtml } from '../../src/report/html/html.js';
import { PAGE_SCRIPT } from '../../src/report/html/page-script.js';
import { toJsonReport } from '../../src/report/json.js';
import { sortFindings } from '../../src/report/findings-summary.js';
import { ROLES } from '../../src/roles/role.js';
import { attribute, byId, elements, hasClass, parseReport, select, textOf, type HtmlElement } from './html-dom.js';
import { lintDemo } from './html-demo-run.js';

let demo: CheckResult;
let html: string;

beforeAll(async () => {
  demo = await lintDemo();
  html = toHtml(demo.findings, demo.context);
});

/** The `<tbody>` of the first finding of a rule. */
function rowOf(document: HtmlElement | ReturnType<typeof parseReport>['document'], ruleId: string): HtmlElement {
  const row = select(document, 'tbody', 'finding').find((body) => attribute(body, 'data-rule') === ruleId);
  if (row === undefined) throw new Error(`no row for ${ruleId}`);
  return row;
}

/** The diagram of a row: its nodes' terms and its edges as (from term, to term, tooltip). */
function diagramOf(row: HtmlElement) {
  const svg = select(row, 'svg', 'diagram');
  expect(svg).toHaveLength(1);
  const nodes = select(svg[0], 'g', 'node');
  const termOf = new Map<string, string>();
  // Node ids are n0, n1, ... in the order the nodes are drawn.
  nodes.forEach((node, index) => termOf.set(`n${index}`, attribute(node, 'data-term')!));
  const edges = select(svg[0], 'g', 'edge').map((edge) => ({
    from: termOf.get(attribute(edge, 'data-from')!)!,
    to: termOf.get(attribute(edge, 'data-to')!)!,
    role: attribute(edge, 'data-role')!,
    tooltip: textOf(select(edge, 'title')[0]),
  }));
  return { nodes: nodes.map((node) => attribute(node, 'data-term')!), edges, focus: nodes.filter((node) => hasClass(node, 'focus')) };
}

describe('HTML report of the demo', () => {
  it('is well formed: parse5 raises no parse error, and there is one html, head and body', () => {
    // parse5 implements the WHATWG HTML parsing algorithm and recovers from errors, so its onParseError callback is the test.
    const { document, errors } = parseReport(html);
    expect(errors).toEqual([]);
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(select(document, 'html')).toHaveLength(1);
    expect(select(document, 'head')).toHaveLength(1);
    expect(select(document, 'body')).toHaveLength(1);
    const ids = elements(document).map((element) => attribute(element, 'id')).filter((id) => id !== undefined);
    expect(new Set(ids).size).toBe(ids.length);
    // As a browser running the script parses it: also no error, and the diagrams wait as <noscript> text until a row is expanded.
    const scripted = parseReport(html, { scripting: true });
    expect(scripted.errors).toEqual([]);
    expect(select(scripted.document, 'svg', 'diagram')).toEqual([]);
    const waiting = select(scripted.document, 'noscript').map(textOf);
    expect(waiting).toHaveLength(demo.findings.filter((finding) => finding.evidence.length > 0).length);
    expect(waiting.every((text) => text.startsWith('<svg class="diagram"'))).toBe(true);
  });

  it('refers to nothing outside itself: no http(s) in any src or href, no external script, style, font or image', () => {
    const { document } = parseReport(html);
    const all = elements(document);
    const references = all.flatMap((element) => element.attrs.filter((attr) => ['src', 'href', 'xlink:href', 'action', 'srcset', 'poster', 'data'].includes(attr.name)));
    expect(references.filter((attr) => /(https?:)?\/\//i.test(attr.value))).toEqual([]);
    expect(all.filter((element) => ['link', 'img', 'iframe', 'object', 'embed', 'base'].includes(element.tagName))).toEqual([]);
    expect(select(document, 'script').filter((script) => attribute(script, 'src') !== undefined)).toEqual([]);
    for (const style of select(document, 'style')) expect(textOf(style)).not.toMatch(/url\(|@import|@font-face/);
    const policy = select(document, 'meta').find((meta) => attribute(meta, 'http-equiv') === 'Content-Security-Policy');
    expect(attribute(policy!, 'content')).toContain("default-src 'none'");
  });

  it('has one row per finding, in report order, with rule, level, focus label and IRI, message and first location', () => {
    const { document } = parseReport(html);
    const rows = select(document, 'tbody', 'finding');
    const sorted = sortFindings(demo.findings);
    expect(rows).toHaveLength(demo.findings.length);
    expect(rows.map((row) => attribute(row, 'data-rule'))).toEqual(sorted.map((finding) => finding.ruleId));
    const cycle = rowOf(document, 'subclass-cycle');
    const cells = select(cycle, 'td');
    expect(textOf(cells[0])).toBe('subclass-cycle');
    expect(textOf(cells[1])).toBe('error');
    expect(textOf(cells[2])).toBe('Rail vehiclehttps://data.northvale-rail.example/def/RailVehicle');
    expect(textOf(cells[3])).toContain('closes on itself');
    expect(textOf(cells[4])).toBe('rolling-stock.ttl:21:1');
  });

  it('counts per level and per rule as the JSON report does', () => {
    const { document } = parseReport(html);
    const summary = toJsonReport(demo.findings, demo.context).summary;
    const line = textOf(byId(document, 'summary-line')!);
    expect(line).toContain(`${summary.errors} errors, ${summary.warnings} warnings, ${summary.notes} notes; ${summary.suppressed} allowed`);
    const levelBars = Object.fromEntries(
      select(document, 'g', 'bar').filter((bar) => /level-/.test(attribute(bar, 'class')!)).map((bar) => textOf(select(bar, 'title')[0]).split(': ')),
    );
    expect(levelBars).toEqual({ error: String(summary.errors), warning: String(summary.warnings), note: String(summary.notes) });
    const rulesTable = byId(document, 'rules')!;
    const perRule = Object.fromEntries(select(rulesTable, 'tr').slice(1).map((row) => select(row, 'td').map(textOf)).map((cells) => [cells[0], cells[2]]));
    expect(perRule['orphan-class']).toBe('2');
    expect(perRule['disjoint-overlap']).toBe('2');
    expect(textOf(byId(document, 'allowed-count')!)).toMatch(/^2 findings allowed \(1 by allow comment, 1 by config\)/);
  });

  it('lists the inputs, the config file and the input warning', () => {
    const { document } = parseReport(html);
    const inputs = select(byId(document, 'inputs')!, 'tr').slice(1).map((row) => select(row, 'td').map(textOf));
    expect(inputs.map((cells) => cells[0]).sort()).toEqual(['components.ttl', 'depots.nt', 'infrastructure.ttl', 'rolling-stock.ttl']);
    expect(inputs.reduce((sum, cells) => sum + Number(cells[2]), 0)).toBe(toJsonReport(demo.findings, demo.context).summary.statements);
    expect(textOf(byId(document, 'overview')!)).toContain('Config: isapart.yaml');
    expect(textOf(byId(document, 'input-warnings')!)).toContain('README.md');
  });

  it('has a legend with every role, each told apart by its dash pattern and head, not by colour alone', () => {
    const { document } = parseReport(html);
    const entries = select(byId(document, 'legend-edges')!, 'li');
    expect(entries.map((entry) => attribute(entry, 'data-legend-role'))).toEqual(['subclass-of', 'instance-of', 'part-of', 'disjoint-with', 'equivalent-to', 'other']);
    expect(new Set(entries.map((entry) => attribute(entry, 'data-legend-role')))).toEqual(new Set([...ROLES, 'other']));
    const style = textOf(select(document, 'style')[0]);
    const dashes = [...ROLES, 'other'].map((role) => new RegExp(`\\.role-${role} \\.line \\{ stroke-dasharray: ([^;]+);`).exec(style)?.[1]);
    expect(dashes.every((dash) => dash !== undefined)).toBe(true);
    expect(new Set(dashes).size).toBe(ROLES.length + 1);
    const heads = entries.map((entry) => select(entry, 'g', 'edge')[0].childNodes.slice(1).map((node) => `${node.nodeName}.${attribute(node as HtmlElement, 'class')}:${(attribute(node as HtmlElement, 'points') ?? '').split(' ').length}`).join('+'));
    expect(new Set(heads).size).toBe(ROLES.length + 1);
    expect(select(byId(document, 'legend-nodes')!, 'li').map((entry) => attribute(entry, 'data-legend-node'))).toEqual(['focus', 'involved', 'plain', 'blank', 'literal']);
  });

  it("draws a cycle finding with one node per member and one edge per evidence statement, closing one cycle (graphlib's findCycles)", () => {
    const { document } = parseReport(html);
    for (const ruleId of ['subclass-cycle', 'part-cycle']) {
      const finding = demo.findings.find((candidate) => candidate.ruleId === ruleId)!;
      const diagram = diagramOf(rowOf(document, ruleId));
      expect(diagram.nodes.sort()).toEqual([...finding.nodes].sort());
      expect(diagram.edges).toHaveLength(finding.evidence.length);
      expect(diagram.focus.map((node) => attribute(node, 'data-term'))).toEqual([finding.focus]);
      // Reference: @dagrejs/graphlib alg.findCycles; the part-cycle's hasPart statement must be drawn turned round to close it.
      const graph = new Graph({ multigraph: true });
      diagram.edges.forEach((edge, index) => graph.setEdge(edge.from, edge.to, undefined, `e${index}`));
      const cycles = alg.findCycles(graph);
      expect(cycles).toHaveLength(1);
      expect(cycles[0].sort()).toEqual([...finding.nodes].sort());
    }
  });

  it("gives every edge a tooltip with its statement's file:line:column and draws it by its role", () => {
    const { document } = parseReport(html);
    const finding = demo.findings.find((candidate) => candidate.ruleId === 'part-cycle')!;
    const diagram = diagramOf(rowOf(document, 'part-cycle'));
    expect(diagram.edges.map((edge) => edge.tooltip.split('  ')[0])).toEqual(
      finding.evidence.map((statement) => `${statement.position.file}:${statement.position.line}:${statement.position.column}`),
    );
    expect(diagram.edges.map((edge) => edge.role)).toEqual(['part-of', 'part-of']);
    expect(diagram.edges[1].tooltip).toContain('fleet:car-A102-2 nv:hasPart fleet:unit-A102 (an inverse predicate, drawn turned round)');
    const overlap = diagramOf(rowOf(document, 'disjoint-overlap'));
    expect(overlap.edges.map((edge) => edge.role).sort()).toEqual(['disjoint-with', 'subclass-of', 'subclass-of']);
  });

  it('draws every finding with evidence, and places no two boxes of a diagram on top of each other', () => {
    const { document } = parseReport(html);
    for (const row of select(document, 'tbody', 'finding')) {
      const finding = sortFindings(demo.findings)[Number(attribute(row, 'data-order'))];
      const svgs = select(row, 'svg', 'diagram');
      expect(svgs).toHaveLength(finding.evidence.length > 0 ? 1 : 0);
      if (svgs.length === 0) continue;
      const boxes = select(svgs[0], 'rect').map((rect) => ['x', 'y', 'width', 'height'].map((name) => Number(attribute(rect, name))));
      for (let a = 0; a < boxes.length; a++) {
        for (let b = a + 1; b < boxes.length; b++) {
          const [ax, ay, aw, ah] = boxes[a];
          const [bx, by, bw, bh] = boxes[b];
          expect(ax + aw <= bx || bx + bw <= ax || ay + ah <= by || by + bh <= ay).toBe(true);
        }
      }
    }
  });

  it('is readable without JavaScript: rows and diagrams are in the markup, only the controls wait for the script', () => {
    const { document } = parseReport(html);
    expect(select(document, 'tbody', 'finding').filter((row) => attribute(row, 'hidden') !== undefined)).toEqual([]);
    expect(select(document, 'details').length).toBe(demo.findings.length);
    expect(attribute(byId(document, 'controls')!, 'hidden')).toBe('');
    expect(textOf(byId(document, 'status')!)).toBe(`${demo.findings.length} findings listed (13 reported, 2 allowed); open a row's details for its explanation and diagram.`);
  });

  it("expands each row to its rule's summary and how to fix", () => {
    const { document } = parseReport(html);
    const details = textOf(select(rowOf(document, 'kind-and-part'), 'details')[0]);
    const rule = demo.context.rules.find((inUse) => inUse.rule.id === 'kind-and-part')!.rule;
    expect(details).toContain(rule.summary);
    expect(details).toContain('How to fix: decide which of the two statements is meant.');
    expect(details).not.toContain('Why it matters');
  });

  it('shows baseline counts only when a finding has a baseline state', () => {
    expect(byId(parseReport(html).document, 'baseline-counts')).toBeUndefined();
    const states = ['new', 'unchanged', 'absent', 'new'] as const;
    const marked: Finding[] = demo.findings.map((finding, index) => ({ ...finding, baselineState: states[index % states.length] }));
    const { document, errors } = parseReport(toHtml(marked, demo.context));
    expect(errors).toEqual([]);
    const cells = select(byId(document, 'baseline-counts')!, 'td').map((cell) => [attribute(cell, 'data-baseline-count'), Number(textOf(cell))]);
    const expected = (state: string) => marked.filter((finding) => finding.baselineState === state).length;
    expect(cells).toEqual([['new', expected('new')], ['unchanged', expected('unchanged')], ['absent', expected('absent')]]);
    expect(byId(document, 'filter-baseline')).toBeDefined();
  });

  it('has a script that parses as JavaScript and cannot end its own script element early', () => {
    expect(() => new Function(PAGE_SCRIPT)).not.toThrow();
    expect(PAGE_SCRIPT.toLowerCase()).not.toContain('</script');
    expect(PAGE_SCRIPT).not.toMatch(/https?:/);
  });
});
