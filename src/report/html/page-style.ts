// The report page's inline style sheet: system fonts only, print-friendly, role styles generated from EDGE_STYLES.
import { EDGE_STYLES } from './edge-styles.js';

const BASE_STYLE = `
:root { color-scheme: light; --ink: #1a1a1a; --muted: #555; --rule: #c8c8c8; --paper: #fff; --band: #f4f4f1; }
* { box-sizing: border-box; }
body { margin: 0; font: 14px/1.45 system-ui, -apple-system, "Segoe UI", Roboto, "Noto Sans", "DejaVu Sans", sans-serif; color: var(--ink); background: var(--paper); }
header, main { max-width: 1280px; margin: 0 auto; padding: 0 20px; }
header { padding-top: 16px; border-bottom: 2px solid var(--ink); }
h1 { font-size: 22px; margin: 0 0 4px; }
h2 { font-size: 18px; margin: 28px 0 8px; border-bottom: 1px solid var(--rule); padding-bottom: 4px; }
h3 { font-size: 15px; margin: 16px 0 6px; }
code, .diagram text, .mono { font-family: ui-monospace, "SFMono-Regular", Menlo, Consolas, "DejaVu Sans Mono", "Liberation Mono", monospace; font-size: 12px; }
.meta { color: var(--muted); margin: 0 0 10px; }
.summary-line { font-size: 15px; font-weight: 600; }
.charts { display: flex; flex-wrap: wrap; gap: 24px; }
.chart .bar-name { text-anchor: end; font-size: 12px; fill: var(--ink); }
.chart .bar-count { font-size: 12px; fill: var(--ink); }
.chart .bar rect { fill: #5b6b7f; }
.chart .level-error rect { fill: #9e1b32; }
.chart .level-warning rect { fill: #c77c00; }
.chart .level-note rect { fill: #3b6fa8; }
table.plain { border-collapse: collapse; margin: 4px 0 10px; }
table.plain th, table.plain td { border: 1px solid var(--rule); padding: 3px 8px; text-align: left; vertical-align: top; }
table.plain th { background: var(--band); }
.problems li { margin: 2px 0; }
.hint { color: var(--muted); }
.legend { display: grid; grid-template-columns: repeat(auto-fill, minmax(360px, 1fr)); gap: 4px 24px; padding: 0; list-style: none; }
.legend li { display: flex; align-items: center; gap: 10px; }
.controls { display: flex; flex-wrap: wrap; gap: 8px 16px; align-items: end; padding: 10px; background: var(--band); border: 1px solid var(--rule); }
.controls label { display: flex; flex-direction: column; font-size: 12px; color: var(--muted); }
.controls select, .controls input { font: inherit; font-size: 13px; padding: 3px 4px; min-width: 9em; }
.controls input[type=search] { min-width: 18em; }
#status { margin: 8px 0; }
#findings-table { width: 100%; border-collapse: collapse; table-layout: fixed; }
#findings-table th { text-align: left; background: var(--band); border-bottom: 2px solid var(--ink); padding: 5px 6px; }
#findings-table col.rule { width: 13%; } #findings-table col.level { width: 9%; } #findings-table col.focus { width: 25%; }
#findings-table col.message { width: 35%; } #findings-table col.location { width: 18%; }
#findings-table td { padding: 5px 6px; vertical-align: top; overflow-wrap: anywhere; }
tbody.finding { border-top: 1px solid var(--rule); }
html.js tbody.finding { display: none; }
html.js tbody.finding.on { display: table-row-group; }
html.js tr.summary-row { cursor: pointer; }
tr.summary-row:hover { background: #f8f7f0; }
tr.detail-row td { padding-top: 0; }
details > summary { cursor: pointer; color: var(--muted); font-size: 12px; }
details[open] > summary { color: var(--ink); }
.details-body { padding: 6px 0 10px 14px; border-left: 3px solid var(--rule); margin: 4px 0 6px; }
.details-body p { margin: 4px 0; }
.detail-heading { font-weight: 600; }
.evidence, .fix { margin: 2px 0 6px; padding-left: 22px; }
.place { color: var(--muted); }
.focus-label { display: block; font-weight: 600; }
.iri { display: block; color: var(--muted); }
.level-badge { display: inline-block; padding: 0 6px; border-radius: 3px; font-size: 12px; font-weight: 600; margin: 0 4px 2px 0; }
.level-error { background: #9e1b32; color: #fff; border: 2px solid #9e1b32; }
.level-warning { background: #fff; color: #6b4200; border: 2px solid #c77c00; }
.level-note { background: #fff; color: #234a75; border: 1px dashed #3b6fa8; }
.badge { display: inline-block; padding: 0 5px; border: 1px solid var(--muted); border-radius: 3px; font-size: 11px; margin: 0 4px 2px 0; }
.badge.baseline-new { font-weight: 700; }
.badge.baseline-absent { text-decoration: line-through; }
.diagram-box { overflow-x: auto; margin: 6px 0; }
.diagram { display: block; max-width: none; background: #fff; }
.diagram text, .sample text { text-anchor: middle; fill: var(--ink); }
.diagram text.label { font-style: italic; fill: #333; }
.node rect { fill: #fff; stroke: #777; stroke-width: 1; }
.node.involved rect { fill: #f1f1f1; stroke: #333; stroke-width: 1.6; }
.node.focus rect { fill: #fff3bf; stroke: #000; stroke-width: 3; }
.node.focus text.name { font-weight: 700; }
.node.literal rect { stroke-dasharray: 4 2; }
.edge .line { fill: none; stroke: currentColor; stroke-width: 1.8; }
.edge .hit { fill: none; stroke: transparent; stroke-width: 12; }
.edge .head { stroke: currentColor; stroke-width: 1.6; stroke-linejoin: round; }
.edge .head.hollow { fill: #fff; }
.edge .head.filled { fill: currentColor; }
.edge .head.open { fill: none; }
.edge:hover .line { stroke-width: 3; }
#pager { display: flex; gap: 10px; align-items: center; margin: 10px 0 30px; }
#pager button { font: inherit; padding: 2px 10px; }
.controls[hidden], #pager[hidden] { display: none; }
footer { max-width: 1280px; margin: 20px auto; padding: 0 20px 20px; color: var(--muted); font-size: 12px; }
@media print {
  body { font-size: 10pt; }
  header, main, footer { max-width: none; padding: 0; }
  .controls, #pager { display: none !important; }
  tbody.finding { break-inside: avoid; }
  tr.summary-row:hover { background: none; }
  .diagram-box { overflow: visible; }
  .diagram { max-width: 100%; height: auto; }
  .edge .hit { display: none; }
}
`;

/** The page's style sheet. */
export function pageStyle(): string {
  const roleRules = EDGE_STYLES.map(
    (style) => `.role-${style.kind} { color: ${style.colour}; }\n.role-${style.kind} .line { stroke-dasharray: ${style.dash === '' ? 'none' : style.dash}; }`,
  );
  return `${BASE_STYLE}${roleRules.join('\n')}\n`;
}
