// Draws a laid-out evidence diagram as inline SVG: one group per node and per edge, each with a tooltip.
import type { Statement } from '../../load/statement.js';
import { relativePath } from '../paths.js';
import type { TermWriter } from '../statement-text.js';
import { edgeStyle, type EdgeStyle, type HeadShape } from './edge-styles.js';
import type { DiagramEdge, DiagramNode, EvidenceDiagram } from './evidence-diagram.js';
import { escapeHtml } from './escape.js';

type Point = { x: number; y: number };

/** How far each head reaches back along its edge; the line stops there so it does not show through. */
const HEAD_LENGTH: Record<HeadShape, number> = {
  'hollow-triangle': 12,
  'open-chevron': 1,
  'filled-diamond': 16,
  bars: 1,
  dots: 8,
  'open-circle': 8,
};

/** What a drawn diagram needs to write its tooltips. */
export interface DiagramText {
  terms: TermWriter;
  cwd: string;
}

/** Where a statement was stated, as `file:line:column`. */
export function statementPlace(statement: Statement, cwd: string): string {
  const { file, line, column } = statement.position;
  return `${relativePath(file, cwd)}:${line}:${column}`;
}

/** The statement's place and text as an edge tooltip shows it: `file:line:column  subject predicate object`. */
export function statementTooltip(statement: Statement, text: DiagramText): string {
  return `${statementPlace(statement, text.cwd)}  ${text.terms.statement(statement)}`;
}

/** The diagram as an `<svg>` element; nodes carry `data-term`, edges `data-role`, `data-from` and `data-to`. */
export function diagramSvg(diagram: EvidenceDiagram, title: string, text: DiagramText): string {
  const parts = [
    `<svg class="diagram" viewBox="0 0 ${diagram.width} ${diagram.height}" width="${diagram.width}" height="${diagram.height}" role="img" aria-label="${escapeHtml(title)}">`,
    ...diagram.edges.map((edge) => edgeSvg(edge, text)),
    ...diagram.nodes.map((node) => nodeSvg(node)),
    '</svg>',
  ];
  return parts.join('');
}

function edgeSvg(edge: DiagramEdge, text: DiagramText): string {
  const style = edgeStyle(edge.kind);
  const tooltip = `${statementTooltip(edge.statement, text)}${edge.turned ? ' (an inverse predicate, drawn turned round)' : ''}`;
  const points = edge.points;
  const line = trimEnd(style.bothEnds ? trimStart(points, HEAD_LENGTH[style.head]) : points, HEAD_LENGTH[style.head]);
  const path = pathData(line);
  const heads = [head(points, style, false)];
  if (style.bothEnds) heads.push(head(points, style, true));
  return (
    `<g class="edge role-${style.kind}" data-role="${style.kind}" data-from="${edge.from}" data-to="${edge.to}">` +
    `<title>${escapeHtml(tooltip)}</title>` +
    `<path class="hit" d="${path}"/><path class="line" d="${path}"/>${heads.join('')}</g>`
  );
}

function nodeSvg(node: DiagramNode): string {
  const left = round(node.x - node.width / 2);
  const top = round(node.y - node.height / 2);
  const term = typeof node.term === 'string' ? node.term : node.text;
  const tooltip = node.label === undefined ? term : `${term}\n${node.label}`;
  // Blank nodes are pill-shaped, literals square-cornered, IRIs slightly rounded.
  const radius = node.kind === 'blank' ? node.height / 2 : node.kind === 'literal' ? 0 : 5;
  const label = node.shownLabel === undefined
    ? ''
    : `<text class="label" x="${round(node.x)}" y="${round(node.y + 13)}">${escapeHtml(`“${node.shownLabel}”`)}</text>`;
  const nameY = node.shownLabel === undefined ? node.y + 4 : node.y - 3;
  return (
    `<g class="node ${node.kind} ${node.emphasis}" data-term="${escapeHtml(term)}">` +
    `<title>${escapeHtml(tooltip)}</title>` +
    `<rect x="${left}" y="${top}" width="${node.width}" height="${node.height}" rx="${radius}"/>` +
    `<text class="name" x="${round(node.x)}" y="${round(nameY)}">${escapeHtml(node.text)}</text>${label}</g>`
  );
}

function pathData(points: Point[]): string {
  if (points.length === 0) return '';
  return points.map((point, index) => `${index === 0 ? 'M' : 'L'}${round(point.x)},${round(point.y)}`).join(' ');
}

/** The unit vector along the edge's end: from the last point that differs from the tip, to the tip. */
function endDirection(points: Point[], atStart: boolean): { tip: Point; along: Point } {
  const ordered = atStart ? [...points].reverse() : points;
  const tip = ordered[ordered.length - 1] ?? { x: 0, y: 0 };
  for (let index = ordered.length - 2; index >= 0; index--) {
    const dx = tip.x - ordered[index].x;
    const dy = tip.y - ordered[index].y;
    const length = Math.hypot(dx, dy);
    if (length > 0.5) return { tip, along: { x: dx / length, y: dy / length } };
  }
  return { tip, along: { x: 0, y: -1 } };
}

function trimEnd(points: Point[], by: number): Point[] {
  if (points.length < 2) return points;
  const { tip, along } = endDirection(points, false);
  return [...points.slice(0, -1), { x: tip.x - along.x * by, y: tip.y - along.y * by }];
}

function trimStart(points: Point[], by: number): Point[] {
  if (points.length < 2) return points;
  const { tip, along } = endDirection(points, true);
  return [{ x: tip.x - along.x * by, y: tip.y - along.y * by }, ...points.slice(1)];
}

/** The head shape at the edge's end (or start), as SVG. */
function head(points: Point[], style: EdgeStyle, atStart: boolean): string {
  const { tip, along } = endDirection(points, atStart);
  const across = { x: -along.y, y: along.x };
  const at = (back: number, side: number) => `${round(tip.x - along.x * back + across.x * side)},${round(tip.y - along.y * back + across.y * side)}`;
  switch (style.head) {
    case 'hollow-triangle':
      return `<polygon class="head hollow" points="${at(0, 0)} ${at(12, 6)} ${at(12, -6)}"/>`;
    case 'open-chevron':
      return `<polyline class="head open" points="${at(10, 6)} ${at(0, 0)} ${at(10, -6)}"/>`;
    case 'filled-diamond':
      return `<polygon class="head filled" points="${at(0, 0)} ${at(8, 5)} ${at(16, 0)} ${at(8, -5)}"/>`;
    case 'bars':
      return `<polyline class="head open" points="${at(2, 7)} ${at(2, -7)}"/>`;
    case 'dots':
      return `<circle class="head filled" cx="${round(tip.x - along.x * 4)}" cy="${round(tip.y - along.y * 4)}" r="4"/>`;
    case 'open-circle':
      return `<circle class="head hollow" cx="${round(tip.x - along.x * 4)}" cy="${round(tip.y - along.y * 4)}" r="4"/>`;
  }
}

function round(value: number): number {
  return Math.round(value * 10) / 10;
}

/** A short sample of an edge kind's line and head, for the legend. */
export function edgeSampleSvg(style: EdgeStyle): string {
  const points = [{ x: 6, y: 11 }, { x: 86, y: 11 }];
  const line = trimEnd(style.bothEnds ? trimStart(points, HEAD_LENGTH[style.head]) : points, HEAD_LENGTH[style.head]);
  const heads = [head(points, style, false), ...(style.bothEnds ? [head(points, style, true)] : [])];
  return (
    `<svg class="sample" viewBox="0 0 92 22" width="92" height="22" aria-hidden="true">` +
    `<g class="edge role-${style.kind}"><path class="line" d="${pathData(line)}"/>${heads.join('')}</g></svg>`
  );
}

/** A sample node box of one emphasis and kind, for the legend. */
export function nodeSampleSvg(kind: DiagramNode['kind'], emphasis: DiagramNode['emphasis'], text: string): string {
  const radius = kind === 'blank' ? 11 : kind === 'literal' ? 0 : 5;
  return (
    `<svg class="sample" viewBox="0 0 92 26" width="92" height="26" aria-hidden="true">` +
    `<g class="node ${kind} ${emphasis}"><rect x="2" y="2" width="88" height="22" rx="${radius}"/>` +
    `<text class="name" x="46" y="17">${escapeHtml(text)}</text></g></svg>`
  );
}
