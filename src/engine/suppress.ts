// Suppression: allow comments in the sources and `allow:` entries in config, and the ones that suppress nothing.
import type { AllowEntry } from '../config/config.js';
import type { AllowComment, Position } from '../load/statement.js';
import type { Finding, Suppression } from './finding.js';
import { fingerprintOf } from './fingerprint.js';
import type { RuleDefinition } from './rule.js';

/** The internal rule that reports an allow comment or entry that suppressed nothing. */
export const UNUSED_ALLOW_RULE: RuleDefinition = Object.freeze({
  id: 'unused-allow',
  level: 'note',
  summary: 'An allow comment or allow entry suppresses no finding.',
  description: [
    'Flags an `# isapart-allow RULE-ID: reason` comment, or an `allow:` entry in isapart.yaml, that',
    'matched no finding of the rule it names.',
    '',
    'Why it matters: the finding it was written for has gone (the hierarchy was fixed), or the comment',
    'stands on the wrong line, so it would silently allow a different finding later.',
    '',
    'How to fix: remove it, or move it to the end of the line of a statement the finding cites (or',
    'alone on the line above that statement). Common practice: allowances should not outlive their reason.',
    '',
  ].join('\n'),
  match: [],
  report: { focus: '?rule', nodes: ['?rule'], unordered: [], message: '{rule} is allowed here but nothing is reported' },
  examples: {
    flagged: [
      '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
      '@prefix nv: <https://data.northvale-rail.example/def/> .',
      '',
      'nv:Component rdfs:subClassOf nv:Asset .',
      'nv:Bogie rdfs:subClassOf nv:Component .  # isapart-allow orphan-class: Bogie had no superclass once',
      '',
    ].join('\n'),
    clean: [
      '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
      '@prefix nv: <https://data.northvale-rail.example/def/> .',
      '',
      'nv:Component rdfs:subClassOf nv:Asset .',
      'nv:Bogie rdfs:subClassOf nv:Component .',
      '',
    ].join('\n'),
  },
  file: 'built-in',
}) as RuleDefinition;

/** The findings with `suppression` set where an allow applies, and one unused-allow finding per allow that applied to none. */
export interface SuppressionResult {
  findings: Finding[];
  unused: Finding[];
}

/**
 * Applies allow comments and config allow entries. A comment suppresses a finding of its rule when
 * it ends the line of one of the finding's evidence statements (subject or object line), or stands
 * alone on the line above one. An entry suppresses its rule's findings with its focus. Suppressed
 * findings stay in the list, marked; an in-source comment wins over a config entry.
 */
export function applySuppressions(findings: Finding[], comments: AllowComment[], allows: AllowEntry[]): SuppressionResult {
  const byLine = new Map<string, Finding[]>();
  for (const finding of findings) {
    const lines = new Set<string>();
    for (const statement of finding.evidence) {
      lines.add(lineKey(statement.position.file, statement.position.line));
      lines.add(lineKey(statement.position.file, statement.objectLine));
    }
    for (const key of lines) {
      const list = byLine.get(key) ?? [];
      list.push(finding);
      byLine.set(key, list);
    }
  }
  const inSource = new Map<Finding, Suppression>();
  const external = new Map<Finding, Suppression>();
  const unused: Finding[] = [];
  for (const comment of comments) {
    const target = comment.ownLine ? comment.line + 1 : comment.line;
    const matched = (byLine.get(lineKey(comment.file, target)) ?? []).filter((finding) => finding.ruleId === comment.ruleId);
    for (const finding of matched) {
      if (!inSource.has(finding)) inSource.set(finding, { kind: 'inSource', justification: comment.reason, file: comment.file, line: comment.line });
    }
    if (matched.length === 0) unused.push(unusedComment(comment));
  }
  const byFocus = new Map<string, Finding[]>();
  for (const finding of findings) {
    const key = `${finding.ruleId}\n${finding.focus}`;
    const list = byFocus.get(key) ?? [];
    list.push(finding);
    byFocus.set(key, list);
  }
  for (const entry of allows) {
    const matched = byFocus.get(`${entry.rule}\n${entry.focus}`) ?? [];
    const justification = entry.reason !== '' ? entry.reason : `allowed in ${entry.file}`;
    for (const finding of matched) {
      if (!external.has(finding)) external.set(finding, { kind: 'external', justification, file: entry.file, line: entry.line });
    }
    if (matched.length === 0) unused.push(unusedEntry(entry));
  }
  const marked = findings.map((finding) => {
    const suppression = finding.suppression ?? inSource.get(finding) ?? external.get(finding);
    return suppression === undefined ? finding : { ...finding, suppression };
  });
  return { findings: marked, unused };
}

function lineKey(file: string, line: number): string {
  return `${file}\n${line}`;
}

// An unused allow has no node: its focus is the rule it names, and like every fingerprint its
// fingerprint comes from the rule id and the nodes (the named rule, then the reason or the focus),
// never from files or lines, so moving the comment keeps it.
function unusedAllow(named: string, nodes: string[], message: string, location: Position): Finding {
  return {
    ruleId: UNUSED_ALLOW_RULE.id,
    level: 'note',
    focus: named,
    nodes,
    message,
    evidence: [],
    fingerprint: fingerprintOf(UNUSED_ALLOW_RULE.id, nodes),
    location,
  };
}

function unusedComment(comment: AllowComment): Finding {
  return unusedAllow(
    comment.ruleId,
    [comment.ruleId, comment.reason],
    `the allow comment for ${comment.ruleId} suppresses nothing and should be removed`,
    { file: comment.file, line: comment.line, column: comment.column },
  );
}

function unusedEntry(entry: AllowEntry): Finding {
  return unusedAllow(
    entry.rule,
    [entry.rule, entry.focus],
    `the allow entry for ${entry.rule} on ${entry.focus} suppresses nothing and should be removed`,
    { file: entry.file, line: entry.line, column: 1 },
  );
}
