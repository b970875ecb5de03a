// The HTML report: one self-contained page (inline style and script, no network) with an evidence diagram per finding.
import type { Finding } from '../../engine/finding.js';
import type { RuleDefinition } from '../../engine/rule.js';
import type { ReportContext } from '../context.js';
import { compareText, LEVELS, sortFindings } from '../findings-summary.js';
import { createTermWriter } from '../statement-text.js';
import { escapeHtml } from './escape.js';
import { findingFile, findingRows, type RowContext } from './finding-rows.js';
import { legendSection } from './legend.js';
import { overviewSection } from './overview.js';
import { PAGE_SCRIPT } from './page-script.js';
import { pageStyle } from './page-style.js';

/** Rows per page when the script pages the table; the reader can choose another size. */
const PAGE_SIZES = [50, 100, 500];
const DEFAULT_PAGE_SIZE = 100;
/** Up to this many findings the reader may also show all rows at once; above it, showing them all would stall the page. */
const ALL_ROWS_LIMIT = 1000;

// Nothing may be fetched: no scripts, styles, fonts or images but the inline ones (WHATWG HTML, the http-equiv pragma).
const CONTENT_SECURITY_POLICY = "default-src 'none'; style-src 'unsafe-inline'; script-src 'unsafe-inline'; img-src data:";

/** Renders the run as one HTML page, readable without JavaScript; the script adds filters, sorting and pages. */
export function toHtml(findings: Finding[], context: ReportContext): string {
  const sorted = sortFindings(findings);
  const rowContext: RowContext = {
    terms: createTermWriter(context.prefixes),
    cwd: context.cwd,
    labels: context.labels ?? {},
    predicateRoles: context.predicateRoles ?? {},
    rules: new Map<string, RuleDefinition>(context.rules.map((inUse) => [inUse.rule.id, inUse.rule])),
  };
  const reported = sorted.filter((finding) => !finding.suppression).length;
  const title = `isapart report: ${reported} finding${reported === 1 ? '' : 's'}`;
  return [
    '<!DOCTYPE html>',
    '<html lang="en"><head><meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<meta http-equiv="Content-Security-Policy" content="${CONTENT_SECURITY_POLICY}">`,
    `<title>${escapeHtml(title)}</title>`,
    `<style>${pageStyle()}</style>`,
    // Marks the page before the rows are parsed, so that a long table is not laid out before the script pages it.
    "<script>document.documentElement.classList.add('js');</script>",
    '</head><body>',
    headerSection(context),
    '<main>',
    overviewSection(sorted, context),
    legendSection(),
    findingsSection(sorted, rowContext),
    '</main>',
    `<footer>Written by ${escapeHtml(context.toolName)} ${escapeHtml(context.toolVersion)}. The page is self-contained and works without JavaScript; with it, the table can be filtered, sorted and paged.</footer>`,
    `<script>${PAGE_SCRIPT}</script>`,
    '</body></html>',
    '',
  ].join('\n');
}

function headerSection(context: ReportContext): string {
  const seconds = ((context.endTime.getTime() - context.startTime.getTime()) / 1000).toFixed(1);
  return (
    '<header><h1>isapart report</h1>' +
    `<p class="meta">${escapeHtml(context.toolName)} ${escapeHtml(context.toolVersion)} · run at ${escapeHtml(context.startTime.toISOString())} (${seconds} s) · ` +
    `<code>${escapeHtml(context.commandLine)}</code></p></header>`
  );
}

function findingsSection(findings: readonly Finding[], context: RowContext): string {
  const reported = findings.filter((finding) => !finding.suppression).length;
  const rows = findings.map((finding, index) => findingRows(finding, index, context));
  return (
    `<section id="findings"><h2>Findings</h2>${controls(findings, context)}` +
    `<p id="status" role="status" aria-live="polite">${findings.length} findings listed (${reported} reported, ${findings.length - reported} allowed); open a row's details for its explanation and diagram.</p>` +
    '<table id="findings-table"><colgroup><col class="rule"><col class="level"><col class="focus"><col class="message"><col class="location"></colgroup>' +
    '<thead><tr><th scope="col">Rule</th><th scope="col">Level</th><th scope="col">Focus</th><th scope="col">Message</th><th scope="col">First location</th></tr></thead>' +
    `${rows.join('\n')}</table>` +
    '<nav id="pager" hidden><button type="button" id="page-previous">Previous</button><span id="page-label"></span><button type="button" id="page-next">Next</button></nav>' +
    '</section>'
  );
}

/** The filter and sort controls; hidden until the script shows them, since they do nothing without it. */
function controls(findings: readonly Finding[], context: RowContext): string {
  const rules = [...new Set(findings.map((finding) => finding.ruleId))].sort(compareText);
  const files = [...new Set(findings.map((finding) => findingFile(finding, context.cwd)).filter((file) => file !== ''))].sort(compareText);
  const hasBaseline = findings.some((finding) => finding.baselineState !== undefined);
  const select = (id: string, label: string, options: [string, string][], chosen = '') =>
    `<label for="${id}">${label}<select id="${id}">${options
      .map(([value, text]) => `<option value="${escapeHtml(value)}"${value === chosen ? ' selected' : ''}>${escapeHtml(text)}</option>`)
      .join('')}</select></label>`;
  const fields = [
    select('filter-rule', 'Rule', [['', 'all rules'], ...rules.map((rule): [string, string] => [rule, rule])]),
    select('filter-level', 'Level', [['', 'all levels'], ...LEVELS.map((level): [string, string] => [level, level])]),
    select('filter-file', 'File', [['', 'all files'], ...files.map((file): [string, string] => [file, file])]),
    select('filter-allowed', 'Allowed', [['no', 'reported only'], ['yes', 'allowed only'], ['', 'reported and allowed']], 'no'),
    hasBaseline ? select('filter-baseline', 'Baseline', [['', 'all'], ['new', 'new'], ['unchanged', 'unchanged'], ['absent', 'absent']]) : '',
    '<label for="filter-text">Search<input type="search" id="filter-text" placeholder="IRI, label, message, file…"></label>',
    select('sort', 'Sort by', [['location', 'location (file, line)'], ['rule', 'rule'], ['level', 'level'], ['focus', 'focus']]),
    select(
      'page-size',
      'Rows per page',
      [...PAGE_SIZES.map((size): [string, string] => [String(size), String(size)]), ...(findings.length <= ALL_ROWS_LIMIT ? [['all', 'all'] as [string, string]] : [])],
      String(DEFAULT_PAGE_SIZE),
    ),
  ];
  return `<form id="controls" class="controls" hidden role="search">${fields.join('')}</form>`;
}
