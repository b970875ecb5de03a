// The report's overview: counts per level and per rule as bar charts, the inputs, config and rules used, and the run's problems.
import type { Finding } from '../../engine/finding.js';
import type { InputError } from '../../load/statement.js';
import type { ReportContext } from '../context.js';
import { compareText, countFindings, LEVELS } from '../findings-summary.js';
import { relativePath } from '../paths.js';
import { barChart } from './bar-chart.js';
import { escapeHtml } from './escape.js';
import { positionText } from './finding-rows.js';

const BASELINE_STATES = ['new', 'unchanged', 'absent'] as const;

/** The overview section: what was found, what was read, and how. */
export function overviewSection(findings: readonly Finding[], context: ReportContext): string {
  const counts = countFindings([...findings], context);
  const reported = findings.filter((finding) => !finding.suppression);
  const perRule = new Map<string, number>();
  for (const finding of reported) perRule.set(finding.ruleId, (perRule.get(finding.ruleId) ?? 0) + 1);
  const ruleBars = [...perRule.entries()]
    .sort(([ruleA, countA], [ruleB, countB]) => countB - countA || compareText(ruleA, ruleB))
    .map(([name, count]) => ({ name, count, className: 'rule' }));
  const levelBars = LEVELS.map((level) => ({ name: level, count: counts[level], className: `level-${level}` }));
  const summary = [
    LEVELS.map((level) => plural(counts[level], level)).join(', '),
    `${counts.suppressed} allowed`,
    ...(counts.inputErrors > 0 ? [plural(counts.inputErrors, 'input error')] : []),
    ...(counts.ruleFailures > 0 ? [plural(counts.ruleFailures, 'rule failure')] : []),
    `${plural(counts.files, 'file')} and ${plural(counts.statements, 'statement')} read`,
  ].join('; ');
  const parts = [
    '<section id="overview"><h2>Overview</h2>',
    `<p class="summary-line" id="summary-line">${escapeHtml(summary)}</p>`,
    '<div class="charts">',
    `<figure><figcaption>Findings per level (allowed ones left out)</figcaption>${barChart(levelBars, 'Findings per level')}</figure>`,
    ruleBars.length === 0 ? '' : `<figure><figcaption>Findings per rule</figcaption>${barChart(ruleBars, 'Findings per rule')}</figure>`,
    '</div>',
    allowedAndBaseline(findings, context.edit !== undefined),
    problemsList('Input errors', 'input-errors', context.inputErrors, context.cwd),
    problemsList('Input warnings', 'input-warnings', context.inputWarnings ?? [], context.cwd),
    ruleFailures(context),
    inputsTable(context),
    rulesTable(context, perRule),
    '</section>',
  ];
  return parts.join('');
}

function allowedAndBaseline(findings: readonly Finding[], byEdit: boolean): string {
  const allowed = findings.filter((finding) => finding.suppression);
  const byComment = allowed.filter((finding) => finding.suppression!.kind === 'inSource').length;
  const lines = [
    `<p id="allowed-count">${plural(allowed.length, 'finding')} allowed (${byComment} by allow comment, ${allowed.length - byComment} by config); they are listed below when the "Allowed" filter shows them.</p>`,
  ];
  if (findings.some((finding) => finding.baselineState !== undefined)) {
    const cells = BASELINE_STATES.map((state) => {
      const count = findings.filter((finding) => finding.baselineState === state).length;
      return `<td data-baseline-count="${state}">${count}</td>`;
    });
    lines.push(
      byEdit
        ? '<table class="plain" id="baseline-counts"><caption>The edit compared with the data before it</caption>' +
            `<tr><th>new (the edit introduces)</th><th>unchanged</th><th>absent (the edit resolves)</th></tr><tr>${cells.join('')}</tr></table>`
        : '<table class="plain" id="baseline-counts"><caption>Compared with the baseline</caption>' +
            `<tr><th>new</th><th>unchanged</th><th>absent (only in the baseline)</th></tr><tr>${cells.join('')}</tr></table>`,
    );
  }
  return lines.join('');
}

function problemsList(title: string, id: string, problems: readonly InputError[], cwd: string): string {
  if (problems.length === 0) return '';
  const items = problems.map(
    (problem) =>
      `<li><code>${escapeHtml(positionText(problem, cwd))}</code> ${escapeHtml(problem.message)}` +
      `${problem.hint === undefined ? '' : `<br><span class="hint">hint: ${escapeHtml(problem.hint)}</span>`}</li>`,
  );
  return `<h3>${title} (${problems.length})</h3><ul class="problems" id="${id}">${items.join('')}</ul>`;
}

function ruleFailures(context: ReportContext): string {
  if (context.ruleFailures.length === 0) return '';
  const items = context.ruleFailures.map((failure) => `<li><code>${escapeHtml(failure.ruleId)}</code> the rule failed: ${escapeHtml(failure.message)}</li>`);
  return `<h3>Rule failures (${context.ruleFailures.length}): their findings are missing</h3><ul class="problems" id="rule-failures">${items.join('')}</ul>`;
}

function inputsTable(context: ReportContext): string {
  const rows = context.sources.map(
    (source) => `<tr><td><code>${escapeHtml(relativePath(source.file, context.cwd))}</code></td><td>${source.format}</td><td>${source.statements}</td></tr>`,
  );
  const config = context.configFile === undefined ? 'none (built-in defaults and command-line options)' : `<code>${escapeHtml(relativePath(context.configFile, context.cwd))}</code>`;
  return (
    `<h3>Inputs (${context.sources.length})</h3><p>Config: ${config}</p>` +
    (rows.length === 0 ? '<p>No source was read.</p>' : `<table class="plain" id="inputs"><tr><th>file</th><th>syntax</th><th>statements</th></tr>${rows.join('')}</table>`)
  );
}

function rulesTable(context: ReportContext, perRule: ReadonlyMap<string, number>): string {
  const rules = [...context.rules].sort((a, b) => compareText(a.rule.id, b.rule.id));
  const rows = rules.map(
    ({ rule, level }) =>
      `<tr><td><code>${escapeHtml(rule.id)}</code></td><td>${level}</td><td>${level === 'off' ? '–' : perRule.get(rule.id) ?? 0}</td><td>${escapeHtml(rule.summary)}</td></tr>`,
  );
  return `<h3>Rules (${rules.length})</h3><table class="plain" id="rules"><tr><th>rule</th><th>level</th><th>findings</th><th>flags</th></tr>${rows.join('')}</table>`;
}

function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? '' : 's'}`;
}
