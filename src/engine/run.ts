// Runs rules over a graph and turns their solutions into findings, one per distinct fact.
import type { HierarchyGraph } from '../graph/hierarchy-graph.js';
import type { Statement } from '../load/statement.js';
import { CycleSource } from './cycle.js';
import { createBindings, evaluatePlan, type Bindings } from './evaluate.js';
import type { Finding, Level, RuleFailure } from './finding.js';
import { fingerprintOf } from './fingerprint.js';
import { PathSearch, SearchArena } from './path-search.js';
import { PlanContext, planRule, type RulePlan } from './plan.js';
import { compileRule, type SlotReference } from './program.js';
import type { RuleDefinition } from './rule.js';

/** A rule to run and the level its findings get. */
export interface RuleToRun {
  rule: RuleDefinition;
  level: Level;
}

/** The findings of a run, sorted, and the rules that failed (their findings are left out). */
export interface RunResult {
  findings: Finding[];
  failures: RuleFailure[];
}

/**
 * Runs every rule over the graph. A rule that throws (while compiling, planning or evaluating)
 * becomes a RuleFailure naming it; the other rules still report. Findings are sorted by primary
 * evidence file, line and column, then rule id, then fingerprint.
 */
export function runRules(graph: HierarchyGraph, rules: RuleToRun[]): RunResult {
  const context = planContextFor(graph);
  const findings: Finding[] = [];
  const failures: RuleFailure[] = [];
  for (const { rule, level } of rules) {
    try {
      const plan = planRule(compileRule(rule), context);
      for (const finding of findingsOf(graph, plan, level)) findings.push(finding);
    } catch (error) {
      failures.push({ ruleId: rule.id, message: error instanceof Error ? error.message : String(error) });
    }
  }
  findings.sort(compareFindings);
  return { findings, failures };
}

/** The plan context of each graph, kept while the graph is: its searches' memos and components serve every later run on it. */
const contexts = new WeakMap<HierarchyGraph, PlanContext>();

/** The shared plan context of a graph (a graph never changes, so what its searches learnt stays true). */
export function planContextFor(graph: HierarchyGraph): PlanContext {
  let context = contexts.get(graph);
  if (context === undefined) {
    context = new PlanContext(graph, new SearchArena(graph.nodeCount));
    contexts.set(graph, context);
  }
  return context;
}

/**
 * The findings of one planned rule: in-scope focus only, solutions with the same fingerprint
 * merged. Of merged solutions the one whose focus and message sort first is kept, so the finding
 * does not depend on the order solutions come in (node ids, plan order, a seeded re-run).
 */
export function findingsOf(graph: HierarchyGraph, plan: RulePlan, level: Level): Finding[] {
  const program = plan.program;
  const ruleId = program.rule.id;
  const seen = new Map<string, number>();
  const findings: Finding[] = [];
  const messageIsFixed = messageFollowsNodes(program);
  const bindings = createBindings(program.nodeSlotCount, program.listSlotCount);
  evaluatePlan(graph, plan.steps, bindings, (solution) => {
    const shown = Int32Array.from(solution.nodes);
    for (const [left, right] of program.unordered) {
      if (graph.term(shown[left]) > graph.term(shown[right])) [shown[left], shown[right]] = [shown[right], shown[left]];
    }
    const members = (reference: SlotReference): number[] => {
      if (!reference.list) return [shown[reference.slot]];
      const component = solution.lists[reference.slot];
      if (component === undefined) throw new Error('a member list is read before its cycle entry ran');
      return component.members;
    };
    const focus = members(program.focus)[0];
    if (!graph.is('in-scope', focus)) return false;
    const nodes: string[] = [];
    for (const reference of program.nodes) {
      // A cycle's members go in by term: the walk's start and direction depend on the scope and on
      // statement order, and the fingerprint must not.
      const terms = members(reference).map((id) => graph.term(id));
      if (reference.list) terms.sort(compareText);
      for (const term of terms) nodes.push(term);
    }
    const fingerprint = fingerprintOf(ruleId, nodes);
    const earlier = seen.get(fingerprint);
    if (earlier !== undefined && messageIsFixed) return false;
    const message = program.message
      .map((part) => (typeof part === 'string' ? part : displayMembers(graph, members(part), part.list)))
      .join('');
    const focusTerm = graph.term(focus);
    if (earlier !== undefined) {
      const kept = findings[earlier];
      if (compareText(kept.focus, focusTerm) < 0 || (kept.focus === focusTerm && compareText(kept.message, message) <= 0)) return false;
    }
    const evidence = evidenceOf(graph, plan, solution);
    if (evidence.length === 0) {
      const first = graph.firstStatement(focus);
      if (first !== undefined) evidence.push(first);
    }
    const finding: Finding = { ruleId, level, focus: focusTerm, nodes, message, evidence, fingerprint };
    if (program.remove.length > 0) {
      const remove = new StatementSet();
      for (const pattern of program.remove) {
        remove.addAll(graph.edgeStatements(pattern.role, solution.nodes[pattern.subject], solution.nodes[pattern.object]));
      }
      finding.fix = { remove: remove.statements };
    }
    if (earlier !== undefined) {
      findings[earlier] = finding;
    } else {
      seen.set(fingerprint, findings.length);
      findings.push(finding);
    }
    return false;
  });
  return findings;
}

/** Whether the focus and message read only reported variables, so one fingerprint always has one message. */
export function messageFollowsNodes(program: RulePlan['program']): boolean {
  const reported = new Set(program.nodes.map((reference) => `${reference.list} ${reference.slot}`));
  const references = [program.focus, ...program.message.filter((part) => typeof part !== 'string')];
  return references.every((reference) => reported.has(`${reference.list} ${reference.slot}`));
}

/** The statements of every positive path entry's shortest walk, in match order, and of each cycle's closed walk. */
function evidenceOf(graph: HierarchyGraph, plan: RulePlan, solution: Bindings): Statement[] {
  const collected = new StatementSet();
  plan.program.match.forEach((entry, index) => {
    const source = plan.evidence[index];
    let walk;
    if (entry.type === 'path' && source instanceof PathSearch) {
      walk = source.witness(solution.nodes[entry.subject], solution.nodes[entry.object]);
    } else if (entry.type === 'cycle' && source instanceof CycleSource) {
      walk = solution.lists[entry.members]?.walk;
    }
    for (const edge of walk ?? []) collected.addAll(graph.edgeStatements(edge.role, edge.from, edge.to));
  });
  return collected.statements;
}

/** A list of statements without repeats, in the order first added. */
class StatementSet {
  readonly statements: Statement[] = [];
  private readonly seen = new Set<Statement>();

  addAll(statements: Statement[]): void {
    for (const statement of statements) {
      if (this.seen.has(statement)) continue;
      this.seen.add(statement);
      this.statements.push(statement);
    }
  }
}

/** Display names of a node, or of a cycle's members closing back to the first: `a → b → a`. */
function displayMembers(graph: HierarchyGraph, ids: number[], closed: boolean): string {
  const names = ids.map((id) => graph.displayName(id));
  if (closed && names.length > 0) names.push(names[0]);
  return names.join(' → ');
}

/** Orders findings by primary location (evidence, else `location`), then rule id, then fingerprint. */
export function compareFindings(left: Finding, right: Finding): number {
  const a = left.evidence[0]?.position ?? left.location;
  const b = right.evidence[0]?.position ?? right.location;
  return (
    compareText(a?.file ?? '', b?.file ?? '') ||
    (a?.line ?? 0) - (b?.line ?? 0) ||
    (a?.column ?? 0) - (b?.column ?? 0) ||
    compareText(left.ruleId, right.ruleId) ||
    compareText(left.fingerprint, right.fingerprint)
  );
}

function compareText(left: string, right: string): number {
  return left < right ? -1 : left > right ? 1 : 0;
}
