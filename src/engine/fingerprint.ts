// The stable identity of a finding: a hash of what it is about, never of where it was stated.
import { createHash } from 'node:crypto';

/** sha-256 hex of the rule id and the finding's nodes, one per line (`ruleId + '\n' + nodes.join('\n')`). */
export function fingerprintOf(ruleId: string, nodes: readonly string[]): string {
  return createHash('sha256').update(`${ruleId}\n${nodes.join('\n')}`).digest('hex');
}
