// How the evidence diagrams draw each role: line pattern, arrow head and colour, explained by the legend.
import type { Role } from '../../roles/role.js';

/** What an edge of a diagram stands for: a role, or a statement whose predicate has none. */
export type EdgeKind = Role | 'other';

/** The arrow head shapes the diagrams use. */
export type HeadShape = 'hollow-triangle' | 'open-chevron' | 'filled-diamond' | 'bars' | 'dots' | 'open-circle';

/** One edge kind's look; role is told by dash pattern and head shape, colour only repeats it. */
export interface EdgeStyle {
  kind: EdgeKind;
  /** Stroke colour; each is dark enough to read on white and in greyscale print. */
  colour: string;
  /** SVG stroke-dasharray; '' is a solid line. */
  dash: string;
  head: HeadShape;
  /** Whether the head is drawn at both ends (a symmetric role). */
  bothEnds: boolean;
  /** The legend's words for it. */
  meaning: string;
}

/**
 * The edge kinds in legend order. Colours differ in lightness as well as hue (blue, orange, purple,
 * red, black, grey), so they stay apart for red-green colour blindness; the dash patterns and heads
 * alone tell every kind apart in monochrome print. The hollow triangle for subclass-of and the
 * diamond at the whole's end for part-of follow UML class-diagram notation (common practice).
 */
export const EDGE_STYLES: readonly EdgeStyle[] = [
  { kind: 'subclass-of', colour: '#1f4e8c', dash: '', head: 'hollow-triangle', bothEnds: false, meaning: 'subclass of: from the subclass to its superclass' },
  { kind: 'instance-of', colour: '#a34a00', dash: '8 4', head: 'open-chevron', bothEnds: false, meaning: 'instance of: from the member to its class' },
  { kind: 'part-of', colour: '#6a3d9a', dash: '12 3 2 3', head: 'filled-diamond', bothEnds: false, meaning: 'part of: from the part to the whole (diamond at the whole)' },
  { kind: 'disjoint-with', colour: '#b2182b', dash: '2 4', head: 'bars', bothEnds: true, meaning: 'disjoint with: no member in common (both ends barred)' },
  { kind: 'equivalent-to', colour: '#222222', dash: '14 4', head: 'dots', bothEnds: true, meaning: 'equivalent to: the same members (dots at both ends)' },
  { kind: 'other', colour: '#6b6b6b', dash: '1 3', head: 'open-circle', bothEnds: false, meaning: 'another statement of the evidence (an axiom list, a flag), in the direction stated' },
];

const BY_KIND = new Map<EdgeKind, EdgeStyle>(EDGE_STYLES.map((style) => [style.kind, style]));

/** The style of an edge kind. */
export function edgeStyle(kind: EdgeKind): EdgeStyle {
  return BY_KIND.get(kind) ?? BY_KIND.get('other')!;
}
