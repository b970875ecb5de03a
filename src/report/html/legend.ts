// The legend of the evidence diagrams: every edge kind by line, head and colour, and every node shape.
import { edgeSampleSvg, nodeSampleSvg } from './diagram-svg.js';
import { EDGE_STYLES } from './edge-styles.js';

/** The legend section; its edge samples are drawn by the same code as the diagrams. */
export function legendSection(): string {
  const edges = EDGE_STYLES.map((style) => `<li data-legend-role="${style.kind}">${edgeSampleSvg(style)}<span>${style.meaning}</span></li>`);
  const nodes = [
    `<li data-legend-node="focus">${nodeSampleSvg('iri', 'focus', 'nv:Focus')}<span>the finding's focus: thick border, bold name, shaded</span></li>`,
    `<li data-legend-node="involved">${nodeSampleSvg('iri', 'involved', 'nv:Involved')}<span>another node the finding names</span></li>`,
    `<li data-legend-node="plain">${nodeSampleSvg('iri', 'plain', 'nv:Other')}<span>a node only the evidence mentions</span></li>`,
    `<li data-legend-node="blank">${nodeSampleSvg('blank', 'plain', '_:b1')}<span>a blank node (rounded ends)</span></li>`,
    `<li data-legend-node="literal">${nodeSampleSvg('literal', 'plain', '"true"')}<span>a literal (square corners, dashed border)</span></li>`,
  ];
  return (
    '<section id="legend"><h2>How to read the diagrams</h2>' +
    '<p>Each diagram draws the statements that make a finding, one arrow per statement, laid out with superclasses and wholes above. ' +
    'An arrow points the way its role reads (subclass to superclass, part to whole); a statement made with an inverse predicate, ' +
    'such as a has-part property, is drawn turned round. Hover over an arrow for the file, line and statement, over a box for the full IRI.</p>' +
    `<h3>Arrows</h3><ul class="legend" id="legend-edges">${edges.join('')}</ul>` +
    `<h3>Boxes</h3><ul class="legend" id="legend-nodes">${nodes.join('')}</ul></section>`
  );
}
