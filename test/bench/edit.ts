// Benchmark of checking a 1,000-statement edit incrementally, next to a full check of the same file in the same run.
import { cpus, loadavg, totalmem } from 'node:os';
import { performance } from 'node:perf_hooks';
import { editedSources, type EditDelta } from '../../src/edit/delta.js';
import { rerunRules } from '../../src/engine/incremental.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { runRules, type RuleToRun, type RunResult } from '../../src/engine/run.js';
import { applyEditToGraph } from '../../src/graph/apply-edit.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import type { HierarchyGraph } from '../../src/graph/hierarchy-graph.js';
import { predicatesTheGraphReads } from '../../src/graph/read-predicates.js';
import { loadSources } from '../../src/load/sources.js';
import type { Literal, LoadedSource, Statement } from '../../src/load/statement.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import { DCTERMS_IS_PART_OF, OWL_DEPRECATED, RDF_TYPE, RDFS_SUBCLASS_OF, XSD_BOOLEAN } from '../../src/roles/vocabulary.js';
import { randomSource } from '../random-source.js';
import { BENCH_NAMESPACE, classIri } from './generate.js';
import { generatedInput } from './scale-inputs.js';
import { median, timed } from './timing.js';

const RUNS = Number(process.env.BENCH_RUNS ?? 5);
const CLASSES = 200_000;
const EDIT_SIZE = 1000;
const TARGET = 0.1;


const roleMap = buildRoleMap(['rdfs', 'owl', 'dcterms', 'schema', 'obo'], {});
const scope = { prefixes: [BENCH_NAMESPACE], roots: [classIri(0)] };
const rules: RuleToRun[] = loadBuiltinRules().rules.map((rule) => ({ rule, level: rule.level }));
const TRUE: Literal = { value: 'true', datatype: XSD_BOOLEAN, language: '' };

/**
 * A deterministic edit of 1,000 role statements: removals of findings' own statements (resolving
 * them) and of random subclass statements, additions of random subclass statements (some close
 * cycles), of part-of statements to a class's own superclass and of instance-of statements to an
 * ancestor (kind-and-part and instance-and-subclass findings), and deprecations of used classes.
 */
function editOf(sources: LoadedSource[], graph: HierarchyGraph, before: RunResult): EditDelta {
  const random = randomSource(8);
  const pick = (count: number): number => Math.floor(random() * count);
  const added: Statement[] = [];
  const removed: Statement[] = [];
  const seen = new Set<string>();
  let line = 0;
  const put = (list: Statement[], subject: string, predicate: string, object: string | Literal): void => {
    const key = `${subject} ${predicate} ${typeof object === 'string' ? object : object.value}`;
    if (seen.has(key)) return;
    seen.add(key);
    line++;
    list.push({ subject, predicate, object, graph: '', position: { file: 'edit.ru', line, column: 1 }, objectLine: line });
  };
  // Resolving: the fix statement of some redundant subclass findings, one statement of each cycle.
  for (const finding of before.findings.filter((found) => found.ruleId === 'redundant-subclass').slice(0, 40)) {
    for (const statement of finding.fix?.remove ?? []) put(removed, statement.subject, statement.predicate, statement.object);
  }
  for (const finding of before.findings.filter((found) => found.ruleId === 'subclass-cycle')) {
    const statement = finding.evidence[0];
    put(removed, statement.subject, statement.predicate, statement.object);
  }
  // Random subclass statements of the data, removed.
  const store = sources[0].rows?.store;
  if (store === undefined) throw new Error('the benchmark file was not read into a store');
  while (removed.length < 350) {
    const statement = store.statement(pick(store.size));
    if (statement.predicate === RDFS_SUBCLASS_OF) put(removed, statement.subject, statement.predicate, statement.object);
  }
  const superclassOf = (term: string): string | undefined => {
    const parents = graph.successors('subclass-of', graph.idOf(term));
    return parents.length === 0 ? undefined : graph.term(parents[0]);
  };
  const ancestorOf = (term: string, steps: number): string | undefined => {
    let current: string | undefined = term;
    for (let step = 0; step < steps && current !== undefined; step++) current = superclassOf(current);
    return current === term ? undefined : current;
  };
  // Random subclass statements added; an upper class below a lower one closes a cycle.
  while (added.length < 300) put(added, classIri(1 + pick(CLASSES - 1)), RDFS_SUBCLASS_OF, classIri(pick(CLASSES)));
  while (added.length < 450) {
    const part = classIri(1 + pick(CLASSES - 1));
    const whole = superclassOf(part);
    if (whole !== undefined) put(added, part, DCTERMS_IS_PART_OF, whole);
  }
  while (added.length < 550) {
    const member = classIri(1 + pick(CLASSES - 1));
    const ancestor = ancestorOf(member, 2);
    if (ancestor !== undefined) put(added, member, RDF_TYPE, ancestor);
  }
  while (added.length + removed.length < EDIT_SIZE) put(added, classIri(1 + pick(CLASSES - 1)), OWL_DEPRECATED, TRUE);
  return { file: 'edit.ru', added, removed, ignored: 0 };
}

/** Findings reduced to what two runs must agree on. */
function comparable(result: RunResult): string[] {
  return result.findings.map(({ ruleId, level, focus, nodes, message, fingerprint }) => JSON.stringify({ fingerprint, ruleId, level, focus, nodes, message })).sort();
}

const input = await generatedInput(CLASSES, 'n-triples', (text) => console.log(text));
const times = { load: [] as number[], check: [] as number[], edit: [] as number[], apply: [] as number[], rerun: [] as number[], rebuild: [] as number[] };
let summary = '';
for (let run = 0; run < RUNS; run++) {
  const loaded = await (async () => {
    const start = performance.now();
    const value = await loadSources([input.file], { keepPredicates: predicatesTheGraphReads(roleMap) });
    return { ms: performance.now() - start, value };
  })();
  times.load.push(loaded.ms);
  const sources = loaded.value.sources;
  const checked = timed(() => {
    const graph = buildHierarchyGraph(sources, roleMap, scope);
    return { graph, result: runRules(graph, rules) };
  });
  times.check.push(checked.ms);
  const { graph, result } = checked.value;
  const delta = editOf(sources, graph, result);
  const applied = timed(() => applyEditToGraph(graph, delta, roleMap, scope));
  const rerun = timed(() => rerunRules({ graph, result }, applied.value, rules));
  times.apply.push(applied.ms);
  times.rerun.push(rerun.ms);
  times.edit.push(applied.ms + rerun.ms);
  // The reference an incremental check must equal: the edited statements rebuilt and linted in full.
  const rebuilt = timed(() => runRules(buildHierarchyGraph(editedSources(sources, delta), roleMap, scope), rules));
  times.rebuild.push(rebuilt.ms);
  if (run === 0) {
    const same = JSON.stringify(comparable(rerun.value)) === JSON.stringify(comparable(rebuilt.value));
    if (!same) throw new Error('the incremental findings differ from the full re-lint of the edited file');
    const before = new Set(result.findings.map((finding) => finding.fingerprint));
    const after = new Set(rerun.value.findings.map((finding) => finding.fingerprint));
    const introduced = [...after].filter((fingerprint) => !before.has(fingerprint)).length;
    const resolved = [...before].filter((fingerprint) => !after.has(fingerprint)).length;
    summary = [
      `edit: ${delta.added.length} added and ${delta.removed.length} removed statements; graph ${applied.value.changes.rebuilt ? `rebuilt (${applied.value.changes.reason})` : 'patched'}`,
      `rules run in full: ${rerun.value.fullRuns.length === 0 ? 'none' : rerun.value.fullRuns.map((full) => `${full.ruleId} (${full.reason})`).join(', ')}`,
      `findings: ${result.findings.length} before, ${rerun.value.findings.length} after; the edit introduces ${introduced}, resolves ${resolved}; incremental equals the full re-lint: ${same}`,
    ].join('\n');
  }
}

const load = median(times.load);
const check = median(times.check);
const edit = median(times.edit);
console.log(`machine: ${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}, load average ${loadavg().map((value) => value.toFixed(1)).join(' ')}`);
console.log(`input: ${input.file} (${input.counts.classes} classes, ${input.counts.statements} statements); runs: ${RUNS}, medians`);
console.log(summary);
console.log('| measure | median ms | ratio to full check |');
console.log('| --- | ---: | ---: |');
const row = (name: string, ms: number): void => console.log(`| ${name} | ${ms.toFixed(0)} | ${(ms / (load + check)).toFixed(3)} |`);
row('load (shared: loadSources)', load);
row('full check beyond the load (build + rules)', check);
row('full check (load + build + rules)', load + check);
row('edit beyond the shared load: applyEditToGraph', median(times.apply));
row('edit beyond the shared load: rerunRules', median(times.rerun));
row('edit beyond the shared load (apply + rerun)', edit);
row('reference: edited sources rebuilt and linted in full', median(times.rebuild));
const ratio = edit / (load + check);
console.log(`edit / full check: ${ratio.toFixed(3)} (target ≤ ${TARGET}: ${ratio <= TARGET ? 'met' : 'missed'}); edit / (build + rules): ${(edit / check).toFixed(3)}; rebuild / edit: ${(median(times.rebuild) / edit).toFixed(1)} ×`);
