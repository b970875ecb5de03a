// The findings table's rows: one <tbody> per finding, a summary row and a row that expands to its explanation and diagram.
import type { Finding } from '../../engine/finding.js';
import type { RuleDefinition } from '../../engine/rule.js';
import type { Position } from '../../load/statement.js';
import { primaryPosition } from '../findings-summary.js';
import { relativePath } from '../paths.js';
import type { TermWriter } from '../statement-text.js';
import { diagramSvg, statementPlace, statementTooltip } from './diagram-svg.js';
import { escapeHtml } from './escape.js';
import { layoutEvidence, type DiagramTerms } from './evidence-diagram.js';

/** Everything a row needs besides its finding. */
export interface RowContext extends DiagramTerms {
  terms: TermWriter;
  cwd: string;
  rules: ReadonlyMap<string, RuleDefinition>;
}

const SEVERITY_ORDER = { error: 0, warning: 1, note: 2 } as const;

/** The file a finding is listed under (its first location), relative to the run's folder; '' when it has none. */
export function findingFile(finding: Finding, cwd: string): string {
  const position = primaryPosition(finding);
  return position === undefined ? '' : relativePath(position.file, cwd);
}

/** A position as `file:line:column`, leaving out the parts that are not known (0). */
export function positionText(position: Position, cwd: string): string {
  const file = relativePath(position.file, cwd);
  if (position.line < 1) return file;
  return position.column < 1 ? `${file}:${position.line}` : `${file}:${position.line}:${position.column}`;
}

/** One finding as a `<tbody>`: data attributes for the page's filters, a summary row, and the expanding detail row. */
export function findingRows(finding: Finding, index: number, context: RowContext): string {
  const position = primaryPosition(finding);
  const file = findingFile(finding, context.cwd);
  const label = context.labels[finding.focus];
  const location = position === undefined ? '(no location)' : positionText(position, context.cwd);
  const searchText = [finding.ruleId, finding.level, finding.focus, label ?? '', finding.message, location, ...finding.nodes].join(' ').toLowerCase();
  const attributes = [
    `id="finding-${index}"`,
    'class="finding"',
    `data-rule="${escapeHtml(finding.ruleId)}"`,
    `data-level="${finding.level}"`,
    `data-severity="${SEVERITY_ORDER[finding.level]}"`,
    `data-file="${escapeHtml(file)}"`,
    `data-focus="${escapeHtml(label ?? finding.focus)}"`,
    `data-allowed="${finding.suppression ? 'yes' : 'no'}"`,
    `data-baseline="${finding.baselineState ?? ''}"`,
    `data-order="${index}"`,
    `data-text="${escapeHtml(searchText)}"`,
  ];
  const badges = [
    `<span class="level-badge level-${finding.level}">${finding.level}</span>`,
    finding.suppression ? '<span class="badge allowed">allowed</span>' : '',
    finding.baselineState ? `<span class="badge baseline-${finding.baselineState}">${finding.baselineState}</span>` : '',
  ].join('');
  const focus = label === undefined
    ? `<code class="iri">${escapeHtml(finding.focus)}</code>`
    : `<span class="focus-label">${escapeHtml(label)}</span><code class="iri">${escapeHtml(finding.focus)}</code>`;
  return (
    `<tbody ${attributes.join(' ')}>` +
    `<tr class="summary-row"><td class="rule">${escapeHtml(finding.ruleId)}</td><td class="level">${badges}</td>` +
    `<td class="focus">${focus}</td><td class="message">${escapeHtml(finding.message)}</td>` +
    `<td class="location"><code>${escapeHtml(location)}</code></td></tr>` +
    `<tr class="detail-row"><td colspan="5"><details><summary>Explanation, evidence and diagram</summary>${findingDetails(finding, context)}</details></td></tr>` +
    '</tbody>'
  );
}

/** The expanded part of a row: the rule's summary and how to fix, the diagram, the evidence, fix and suppression. */
function findingDetails(finding: Finding, context: RowContext): string {
  const rule = context.rules.get(finding.ruleId);
  const parts: string[] = ['<div class="details-body">'];
  if (rule !== undefined) {
    parts.push(`<p class="rule-summary"><strong>${escapeHtml(rule.id)}</strong>: ${escapeHtml(rule.summary)}</p>`);
    const howToFix = howToFixText(rule.description);
    parts.push(`<p class="how-to-fix">${escapeHtml(howToFix)}</p>`);
  }
  if (finding.evidence.length > 0) {
    const diagram = layoutEvidence(finding, context);
    const title = `Evidence diagram of ${finding.ruleId} on ${finding.focus}: ${diagram.nodes.length} nodes, ${diagram.edges.length} statements`;
    // Without JavaScript the browser parses the <noscript> markup into the diagram; with it, the markup
    // stays one text node until the row is expanded, so a large report opens without building every SVG.
    parts.push(`<div class="diagram-box"><noscript>${diagramSvg(diagram, title, context)}</noscript></div>`);
    parts.push('<p class="detail-heading">Evidence</p><ol class="evidence">');
    for (const statement of finding.evidence) {
      const place = statementPlace(statement, context.cwd);
      parts.push(`<li><code class="place">${escapeHtml(place)}</code> <code>${escapeHtml(context.terms.statement(statement))}</code></li>`);
    }
    parts.push('</ol>');
  } else if (finding.location !== undefined) {
    parts.push(`<p class="no-evidence">No statement is involved; reported at <code>${escapeHtml(positionText(finding.location, context.cwd))}</code>.</p>`);
  }
  if (finding.fix !== undefined && finding.fix.remove.length > 0) {
    parts.push('<p class="detail-heading">Suggested fix: remove</p><ul class="fix">');
    for (const statement of finding.fix.remove) parts.push(`<li><code>${escapeHtml(statementTooltip(statement, context))}</code></li>`);
    parts.push('</ul>');
  }
  if (finding.suppression !== undefined) {
    const { kind, justification, file, line } = finding.suppression;
    const way = kind === 'inSource' ? 'an allow comment' : 'an allow entry in the config';
    parts.push(`<p class="suppression">Allowed by ${way} at <code>${escapeHtml(positionText({ file, line, column: 0 }, context.cwd))}</code>: ${escapeHtml(justification)}</p>`);
  }
  parts.push(`<p class="fingerprint">Fingerprint <code>${finding.fingerprint}</code></p></div>`);
  return parts.join('');
}

/** The "How to fix" paragraph of a rule's description, else the whole description. */
export function howToFixText(description: string): string {
  const paragraphs = description.split(/\n\s*\n/).map((paragraph) => paragraph.replace(/\s+/g, ' ').trim()).filter(Boolean);
  const fix = paragraphs.find((paragraph) => /^how to fix\b/i.test(paragraph));
  return fix ?? paragraphs.join(' ');
}
