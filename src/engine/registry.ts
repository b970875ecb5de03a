// The rule registry: one sorted, frozen map from rule id to definition, built-in and user rules alike.
import type { InputError } from '../load/statement.js';
import { ruleIdLine } from './rule-file.js';
import type { RuleDefinition } from './rule.js';

/** Thrown by createRegistry when two rules share an id; `errors` has one entry per later duplicate. */
export class DuplicateRuleError extends Error {
  constructor(readonly errors: InputError[]) {
    super(errors.map((error) => `${error.file}:${error.line}: ${error.message}`).join('\n'));
    this.name = 'DuplicateRuleError';
  }
}

/** One error per rule whose id an earlier rule already has, naming both files. */
export function duplicateRuleErrors(rules: RuleDefinition[]): InputError[] {
  const first = new Map<string, RuleDefinition>();
  const errors: InputError[] = [];
  for (const rule of rules) {
    const earlier = first.get(rule.id);
    if (earlier === undefined) {
      first.set(rule.id, rule);
      continue;
    }
    errors.push({
      file: rule.file,
      line: ruleIdLine(rule),
      column: 1,
      message: `rule id '${rule.id}' is already defined in ${earlier.file}`,
      hint: `rename one of the two rules (${earlier.file} and ${rule.file}); rule ids must be unique`,
    });
  }
  return errors;
}

/** The registry of rules sorted by id and frozen; throws DuplicateRuleError naming both files of a repeated id. */
export function createRegistry(rules: RuleDefinition[]): ReadonlyMap<string, RuleDefinition> {
  const errors = duplicateRuleErrors(rules);
  if (errors.length > 0) throw new DuplicateRuleError(errors);
  const sorted = [...rules].sort((left, right) => (left.id < right.id ? -1 : left.id > right.id ? 1 : 0));
  return new FrozenMap(sorted.map((rule) => [rule.id, Object.freeze(rule)]));
}

/** A Map whose mutating methods throw, so the registry cannot change after it is built. */
class FrozenMap<K, V> extends Map<K, V> {
  private sealed = false;

  constructor(entries: [K, V][]) {
    super(entries);
    this.sealed = true;
    Object.freeze(this);
  }

  override set(key: K, value: V): this {
    if (this.sealed) throw new TypeError('the rule registry is frozen');
    return super.set(key, value);
  }

  override delete(): boolean {
    throw new TypeError('the rule registry is frozen');
  }

  override clear(): void {
    throw new TypeError('the rule registry is frozen');
  }
}
