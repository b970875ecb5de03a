// The rule list (`isapart rules`) as text, JSON or a Markdown table, and one rule explained (`isapart explain`).
import { Chalk } from 'chalk';
import type { RuleLevel } from '../engine/finding.js';
import type { RuleDefinition } from '../engine/rule.js';
import type { RuleInUse } from './context.js';
import { paintForLevel } from './level-paint.js';
import { compareText } from './findings-summary.js';

/** The `format` value that marks an isapart rule list document. */
export const RULES_JSON_FORMAT = 'isapart-rules';

/** The version of the rule list document. */
export const RULES_JSON_VERSION = 1;

const EXAMPLE_INDENT = '    ';

/** The rules as aligned text lines `id  level  summary`, sorted by id; levels coloured when `color` is true. */
export function rulesToText(rules: RuleInUse[], color: boolean): string {
  const paint = new Chalk({ level: color ? 1 : 0 });
  const sorted = sortRules(rules);
  const idWidth = Math.max('id'.length, ...sorted.map((entry) => entry.rule.id.length));
  const levelWidth = 'warning'.length;
  const header = paint.bold(`${'id'.padEnd(idWidth)}  ${'level'.padEnd(levelWidth)}  summary`);
  const lines = sorted.map((entry) => {
    const level = paintForLevel(entry.level, paint)(entry.level) + ' '.repeat(levelWidth - entry.level.length);
    return `${entry.rule.id.padEnd(idWidth)}  ${level}  ${oneLine(entry.rule.summary)}`;
  });
  return `${[header, ...lines].join('\n')}\n`;
}

/** The rules as a JSON document `{format, version, rules: [...]}`, sorted by id, with a trailing newline. */
export function rulesToJson(rules: RuleInUse[]): string {
  const document = {
    format: RULES_JSON_FORMAT,
    version: RULES_JSON_VERSION,
    rules: sortRules(rules).map((entry) => ({
      id: entry.rule.id,
      level: entry.level,
      defaultLevel: entry.rule.level,
      summary: entry.rule.summary,
      description: entry.rule.description.trim(),
      fixable: entry.rule.fix !== undefined,
    })),
  };
  return `${JSON.stringify(document, null, 2)}\n`;
}

/** The rules as a Markdown table `| id | level | flags |` sorted by id: stable, for the README. */
export function rulesToMarkdown(rules: RuleInUse[]): string {
  const rows = sortRules(rules).map(
    (entry) => `| \`${entry.rule.id}\` | ${entry.level} | ${markdownCell(entry.rule.summary)} |`,
  );
  return `${['| id | level | flags |', '| --- | --- | --- |', ...rows].join('\n')}\n`;
}

/** One rule for `isapart explain`: summary, level, whether it can fix, description, flagged and clean examples. */
export function explainRule(rule: RuleDefinition, level: RuleLevel): string {
  const levelLine = level === rule.level ? `level: ${level}` : `level: ${level} (default: ${rule.level})`;
  const lines = [`${rule.id}: ${oneLine(rule.summary)}`, '', levelLine];
  if (rule.fix) {
    const removed = rule.fix.remove.map((pattern) => `${pattern.subject} ${pattern.role} ${pattern.object}`);
    lines.push(`fix: removes ${removed.join(', ')}`);
  }
  lines.push('', rule.description.trim(), '');
  lines.push('Flagged (Turtle that produces this finding):', ...exampleLines(rule.examples.flagged), '');
  lines.push('Clean (Turtle that does not):', ...exampleLines(rule.examples.clean));
  return `${lines.join('\n')}\n`;
}

function sortRules(rules: RuleInUse[]): RuleInUse[] {
  return [...rules].sort((a, b) => compareText(a.rule.id, b.rule.id));
}

function exampleLines(example: string): string[] {
  const trimmed = example.replace(/^\s*\n/, '').trimEnd();
  if (trimmed === '') return [`${EXAMPLE_INDENT}(none)`];
  return trimmed.split('\n').map((line) => (line === '' ? '' : `${EXAMPLE_INDENT}${line}`));
}

function oneLine(text: string): string {
  return text.trim().replace(/\s+/g, ' ');
}

// A `|` would end the cell (GitHub Flavored Markdown tables escape it as `\|`, common practice).
function markdownCell(text: string): string {
  return oneLine(text).replace(/\|/g, '\\|');
}
