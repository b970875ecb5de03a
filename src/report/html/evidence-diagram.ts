// The evidence of one finding as a directed graph (graphlib), laid out by dagre when the report is built.
import dagre from '@dagrejs/dagre';
import { Graph } from '@dagrejs/graphlib';
import type { Finding } from '../../engine/finding.js';
import type { Literal, Statement } from '../../load/statement.js';
import type { PredicateMapping } from '../../roles/role.js';
import type { TermWriter } from '../statement-text.js';
import type { EdgeKind } from './edge-styles.js';
import { shortenEnd, shortenStart } from './escape.js';

/** How a node is drawn: the finding's focus, another node the finding names, or a node only the evidence mentions. */
export type NodeEmphasis = 'focus' | 'involved' | 'plain';

/** A node of a diagram, placed: x and y are its centre. */
export interface DiagramNode {
  id: string;
  /** The IRI or `_:label`, or the literal. */
  term: string | Literal;
  kind: 'iri' | 'blank' | 'literal';
  emphasis: NodeEmphasis;
  /** The short name drawn in the box (prefixed name, `_:label` or a literal in Turtle form). */
  text: string;
  /** The node's label as stated, for its tooltip. */
  label?: string;
  /** The label as drawn in the box, shortened when long. */
  shownLabel?: string;
  x: number;
  y: number;
  width: number;
  height: number;
}

/** One evidence statement as an edge, in its role's direction (an inverse predicate turned round). */
export interface DiagramEdge {
  from: string;
  to: string;
  kind: EdgeKind;
  statement: Statement;
  /** Whether the statement points the other way (an inverse predicate such as hasPart). */
  turned: boolean;
  points: { x: number; y: number }[];
}

/** A laid-out evidence diagram. */
export interface EvidenceDiagram {
  nodes: DiagramNode[];
  edges: DiagramEdge[];
  width: number;
  height: number;
}

/** What the diagram builder reads besides the finding. */
export interface DiagramTerms {
  terms: TermWriter;
  labels: Record<string, string>;
  predicateRoles: Record<string, PredicateMapping>;
}

/** Characters shown in a node box before the text is shortened (the full term is in its tooltip). */
const NODE_TEXT_LIMIT = 36;
/** Width of one character of the diagram's 12px monospace font, and the box padding. */
const CHARACTER_WIDTH = 7.3;
const NODE_PADDING = 20;
const LINE_HEIGHT = 16;
/** Node widths are rounded up to this, so findings of the same shape share one layout. */
const WIDTH_STEP = 16;
/** Layouts kept for reuse within a run; bounded so a huge report cannot hold them all. */
const LAYOUT_CACHE_LIMIT = 4096;

const layoutCache = new Map<string, { nodes: { x: number; y: number }[]; edges: { x: number; y: number }[][]; width: number; height: number }>();

/** Builds the graph of a finding's evidence (one node per term, one edge per statement) and lays it out top-down. */
export function layoutEvidence(finding: Finding, options: DiagramTerms): EvidenceDiagram {
  const { nodes, edges } = evidenceGraph(finding, options);
  const key = JSON.stringify([nodes.map((node) => [node.width, node.height]), edges.map((edge) => [edge.from, edge.to])]);
  let placed = layoutCache.get(key);
  if (placed === undefined) {
    placed = runLayout(nodes, edges);
    if (layoutCache.size >= LAYOUT_CACHE_LIMIT) layoutCache.clear();
    layoutCache.set(key, placed);
  }
  nodes.forEach((node, index) => Object.assign(node, placed!.nodes[index]));
  edges.forEach((edge, index) => (edge.points = placed!.edges[index].map((point) => ({ ...point }))));
  return { nodes, edges, width: placed.width, height: placed.height };
}

function evidenceGraph(finding: Finding, options: DiagramTerms): { nodes: DiagramNode[]; edges: DiagramEdge[] } {
  const nodes: DiagramNode[] = [];
  const nodeIds = new Map<string, string>();
  const involved = new Set(finding.nodes);
  const nodeFor = (term: string | Literal): string => {
    const isLiteral = typeof term !== 'string';
    const known = isLiteral ? undefined : nodeIds.get(term);
    if (known !== undefined) return known;
    const id = `n${nodes.length}`;
    // A literal is a node of its own per statement: two equal literals are not one thing.
    if (!isLiteral) nodeIds.set(term, id);
    const label = isLiteral ? undefined : options.labels[term];
    const text = isLiteral ? shortenEnd(options.terms.term(term), NODE_TEXT_LIMIT) : shortenStart(options.terms.term(term), NODE_TEXT_LIMIT);
    const shownLabel = label === undefined ? undefined : shortenEnd(label, NODE_TEXT_LIMIT);
    const characters = Math.max(text.length, shownLabel === undefined ? 0 : shownLabel.length + 2);
    nodes.push({
      id,
      term,
      kind: isLiteral ? 'literal' : term.startsWith('_:') ? 'blank' : 'iri',
      emphasis: !isLiteral && term === finding.focus ? 'focus' : !isLiteral && involved.has(term) ? 'involved' : 'plain',
      text,
      ...(label === undefined || shownLabel === undefined ? {} : { label, shownLabel }),
      x: 0,
      y: 0,
      width: Math.ceil((characters * CHARACTER_WIDTH + NODE_PADDING) / WIDTH_STEP) * WIDTH_STEP,
      height: shownLabel === undefined ? LINE_HEIGHT + 14 : 2 * LINE_HEIGHT + 12,
    });
    return id;
  };
  // The focus comes first, so it keeps its place in layouts of the same shape.
  nodeFor(finding.focus);
  const edges: DiagramEdge[] = finding.evidence.map((statement) => {
    const mapping = options.predicateRoles[statement.predicate];
    const turned = mapping?.inverse === true && typeof statement.object === 'string';
    const subject = nodeFor(statement.subject);
    const object = nodeFor(statement.object);
    return {
      from: turned ? object : subject,
      to: turned ? subject : object,
      kind: mapping?.role ?? 'other',
      statement,
      turned,
      points: [],
    };
  });
  return { nodes, edges };
}

function runLayout(nodes: DiagramNode[], edges: DiagramEdge[]) {
  // A multigraph, so that two statements of the same edge are two edges of the diagram.
  const graph = new Graph({ directed: true, multigraph: true });
  // Bottom to top: superclasses and wholes above, as hierarchies are usually drawn.
  graph.setGraph({ rankdir: 'BT', nodesep: 28, ranksep: 44, edgesep: 14, marginx: 12, marginy: 12 });
  for (const node of nodes) graph.setNode(node.id, { width: node.width, height: node.height });
  edges.forEach((edge, index) => graph.setEdge(edge.from, edge.to, { minlen: 1 }, `e${index}`));
  dagre.layout(graph);
  const size = graph.graph() as { width: number; height: number };
  return {
    nodes: nodes.map((node) => {
      const placed = graph.node(node.id) as { x: number; y: number };
      return { x: placed.x, y: placed.y };
    }),
    edges: edges.map((edge, index) => {
      const placed = graph.edge({ v: edge.from, w: edge.to, name: `e${index}` }) as { points?: { x: number; y: number }[] };
      return (placed.points ?? []).map((point) => ({ x: point.x, y: point.y }));
    }),
    width: Math.ceil(size.width),
    height: Math.ceil(size.height),
  };
}
