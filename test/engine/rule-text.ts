// The YAML text of a user rule for tests: a match and a report in the format of rules/, with empty examples.

/** A rule file with the given match and report, in the format of rules/; `purpose` goes into its description. */
export function userRuleText(id: string, match: string, report: string, purpose: string): string {
  return [
    `id: ${id}`,
    'level: warning',
    `summary: The ${id} test rule.`,
    'description: |',
    `  A user rule for the ${purpose}.`,
    'match:',
    ...match.trim().split('\n').map((line) => `  ${line}`),
    'report:',
    ...report.trim().split('\n').map((line) => `  ${line}`),
    'examples:',
    '  flagged: |',
    '    @prefix nv: <https://data.northvale-rail.example/def/> .',
    '  clean: |',
    '    @prefix nv: <https://data.northvale-rail.example/def/> .',
    '',
  ].join('\n');
}
