// Hand-built findings, rules and a report context for the reporter tests (Northvale Rail demo data).
import { createHash } from 'node:crypto';
import type { Finding, Level, RuleFailure } from '../../src/engine/finding.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import type { InputError, Literal, Statement } from '../../src/load/statement.js';
import type { ReportContext, RuleInUse } from '../../src/report/context.js';
import { DCTERMS_IS_PART_OF, OWL_DEPRECATED, RDFS_SUBCLASS_OF, XSD_BOOLEAN } from '../../src/roles/vocabulary.js';

export const CWD = '/srv/northvale';
export const DEF = 'https://data.northvale-rail.example/def/';
export const ASSET = 'https://data.northvale-rail.example/asset/';
export { DCTERMS_IS_PART_OF, OWL_DEPRECATED, RDF_TYPE, RDFS_SUBCLASS_OF, XSD_BOOLEAN } from '../../src/roles/vocabulary.js';

export const ROLLING_STOCK = `${CWD}/data/rolling-stock.ttl`;
export const INFRASTRUCTURE = `${CWD}/data/infrastructure.trig`;
export const SIGNALS = `${CWD}/data/signal plans/signals.nt`;
export const CONFIG = `${CWD}/isapart.yaml`;

/** A statement at a position; `object` may be a literal. */
export function statement(options: {
  subject: string;
  predicate: string;
  object: string | Literal;
  file: string;
  line: number;
  column?: number;
  graph?: string;
}): Statement {
  return {
    subject: options.subject,
    predicate: options.predicate,
    object: options.object,
    graph: options.graph ?? '',
    position: { file: options.file, line: options.line, column: options.column ?? 1 },
    objectLine: options.line,
  };
}

/** A sha-256 hex value shaped like a fingerprint (the engine computes the real ones). */
export function fingerprintOf(ruleId: string, nodes: string[]): string {
  return createHash('sha256').update([ruleId, ...nodes].join('\n')).digest('hex');
}

/** A rule definition with just enough in it for the reporters. */
export function rule(options: { id: string; level: Level; summary: string; fix?: boolean }): RuleDefinition {
  return {
    id: options.id,
    level: options.level,
    summary: options.summary,
    description: `What ${options.id} looks for, and how to fix it.\nSecond line of the description.\n`,
    match: [],
    report: { focus: '?a', nodes: ['?a', '?b'], unordered: [], message: '{a} and {b}' },
    ...(options.fix ? { fix: { remove: [{ subject: '?a', role: 'part-of', object: '?b' }] } } : {}),
    examples: {
      flagged: `@prefix nv: <${DEF}> .\nnv:Pantograph nv:partOf nv:Locomotive .\n`,
      clean: `@prefix nv: <${DEF}> .\nnv:Pantograph nv:partOf nv:RoofAssembly .\n`,
    },
    file: `/opt/isapart/rules/${options.id}.yaml`,
  };
}

export const KIND_AND_PART = rule({ id: 'kind-and-part', level: 'warning', summary: 'A class is both a kind of and a part of the same thing.', fix: true });
export const SUBCLASS_CYCLE = rule({ id: 'subclass-cycle', level: 'error', summary: 'Classes are subclasses of each other through a chain.' });
export const DEPRECATED_IN_USE = rule({ id: 'deprecated-in-use', level: 'warning', summary: 'A statement points at a deprecated term.' });
export const ORPHAN_CLASS = rule({ id: 'orphan-class', level: 'warning', summary: 'An in-scope class has no superclass.' });
export const UNUSED_ALLOW = rule({ id: 'unused-allow', level: 'warning', summary: 'An allow comment suppresses nothing.' });

/** Every rule, with the levels of a run: orphan-class off, deprecated-in-use lowered to note. */
export const RULES_IN_USE: RuleInUse[] = [
  { rule: UNUSED_ALLOW, level: 'warning' },
  { rule: SUBCLASS_CYCLE, level: 'error' },
  { rule: KIND_AND_PART, level: 'warning' },
  { rule: ORPHAN_CLASS, level: 'off' },
  { rule: DEPRECATED_IN_USE, level: 'note' },
];

function finding(options: Omit<Finding, 'fingerprint'>): Finding {
  return { ...options, fingerprint: fingerprintOf(options.ruleId, options.nodes) };
}

const pantographPartOf = statement({ subject: `${DEF}Pantograph`, predicate: DCTERMS_IS_PART_OF, object: `${DEF}Locomotive`, file: ROLLING_STOCK, line: 12, column: 1 });
const pantographKindOf = statement({ subject: `${DEF}Pantograph`, predicate: RDFS_SUBCLASS_OF, object: `${DEF}Locomotive`, file: ROLLING_STOCK, line: 13, column: 5 });
const signalCycleA = statement({ subject: `${DEF}MainSignal`, predicate: RDFS_SUBCLASS_OF, object: `${DEF}Signal`, file: INFRASTRUCTURE, line: 7, column: 3, graph: `${ASSET}graph/signalling` });
const signalCycleB = statement({ subject: `${DEF}Signal`, predicate: RDFS_SUBCLASS_OF, object: `${DEF}MainSignal`, file: INFRASTRUCTURE, line: 9, column: 3, graph: `${ASSET}graph/signalling` });

/** A warning with a fix, in rolling-stock.ttl. */
export const PANTOGRAPH_FINDING = finding({
  ruleId: 'kind-and-part',
  level: 'warning',
  focus: `${DEF}Pantograph`,
  nodes: [`${DEF}Pantograph`, `${DEF}Locomotive`],
  message: 'nv:Pantograph is part of nv:Locomotive and also a kind of nv:Locomotive',
  evidence: [pantographPartOf, pantographKindOf],
  fix: { remove: [pantographPartOf] },
});

/** An error in infrastructure.trig, in a named graph. */
export const SIGNAL_CYCLE_FINDING = finding({
  ruleId: 'subclass-cycle',
  level: 'error',
  focus: `${DEF}MainSignal`,
  nodes: [`${DEF}MainSignal`, `${DEF}Signal`],
  message: 'nv:MainSignal and nv:Signal are subclasses of each other',
  evidence: [signalCycleA, signalCycleB],
});

/** A note whose evidence has a literal object, in the file with a space in its folder name. */
export const DEPRECATED_FINDING = finding({
  ruleId: 'deprecated-in-use',
  level: 'note',
  focus: `${DEF}ColourLightSignal`,
  nodes: [`${DEF}ColourLightSignal`, `${DEF}SemaphoreSignal`],
  message: 'nv:ColourLightSignal is a subclass of the deprecated nv:SemaphoreSignal',
  evidence: [
    statement({ subject: `${DEF}ColourLightSignal`, predicate: RDFS_SUBCLASS_OF, object: `${DEF}SemaphoreSignal`, file: SIGNALS, line: 3 }),
    statement({ subject: `${DEF}SemaphoreSignal`, predicate: OWL_DEPRECATED, object: { value: 'true', datatype: XSD_BOOLEAN, language: '' }, file: SIGNALS, line: 4 }),
  ],
});

/** A kind-and-part finding allowed by a comment in the source. */
export const ALLOWED_IN_SOURCE = finding({
  ruleId: 'kind-and-part',
  level: 'warning',
  focus: `${DEF}Bogie`,
  nodes: [`${DEF}Bogie`, `${DEF}Wagon`],
  message: 'nv:Bogie is part of nv:Wagon and also a kind of nv:Wagon',
  evidence: [statement({ subject: `${DEF}Bogie`, predicate: DCTERMS_IS_PART_OF, object: `${DEF}Wagon`, file: ROLLING_STOCK, line: 20 })],
  suppression: { kind: 'inSource', justification: 'bogie kits are sold as wagons', file: ROLLING_STOCK, line: 20 },
});

/** A second kind-and-part finding, allowed by the config. */
export const ALLOWED_BY_CONFIG = finding({
  ruleId: 'kind-and-part',
  level: 'warning',
  focus: `${DEF}Coupler`,
  nodes: [`${DEF}Coupler`, `${DEF}Wagon`],
  message: 'nv:Coupler is part of nv:Wagon and also a kind of nv:Wagon',
  evidence: [statement({ subject: `${DEF}Coupler`, predicate: DCTERMS_IS_PART_OF, object: `${DEF}Wagon`, file: ROLLING_STOCK, line: 24 })],
  suppression: { kind: 'external', justification: 'legacy catalogue term', file: CONFIG, line: 9 },
});

/** An allowed subclass-cycle finding (by config). */
export const ALLOWED_CYCLE = finding({
  ruleId: 'subclass-cycle',
  level: 'error',
  focus: `${DEF}Track`,
  nodes: [`${DEF}Track`, `${DEF}Rail`],
  message: 'nv:Track and nv:Rail are subclasses of each other',
  evidence: [statement({ subject: `${DEF}Track`, predicate: RDFS_SUBCLASS_OF, object: `${DEF}Rail`, file: INFRASTRUCTURE, line: 30 })],
  suppression: { kind: 'external', justification: 'being remodelled', file: CONFIG, line: 11 },
});

/** An unused allow comment: no evidence, a location instead. */
export const UNUSED_ALLOW_FINDING = finding({
  ruleId: 'unused-allow',
  level: 'warning',
  focus: `${DEF}Wheelset`,
  nodes: [`${DEF}Wheelset`],
  message: 'the allow comment for part-cycle suppresses no finding',
  evidence: [],
  location: { file: ROLLING_STOCK, line: 31, column: 40 },
});

export const INPUT_ERRORS: InputError[] = [
  { file: `${CWD}/data/broken.ttl`, line: 4, column: 17, message: 'Expected a term after the predicate, found "."', hint: 'write an object before the full stop' },
  { file: `${CWD}/data/missing.ttl`, line: 0, column: 0, message: 'No such file', hint: 'check the path' },
];

export const INPUT_WARNINGS: InputError[] = [
  { file: `${CWD}/data/rolling-stock.ttl`, line: 12, column: 1, message: 'the object of dcterms:isPartOf is a literal, so no part-of edge was made', hint: 'write the whole as an IRI' },
];

export const RULE_FAILURES: RuleFailure[] = [{ ruleId: 'subclass-cycle', message: 'path compilation failed at "subclass-of+"' }];

/** Every finding of the full run, in an order the reporters must not depend on. */
export const ALL_FINDINGS: Finding[] = [UNUSED_ALLOW_FINDING, ALLOWED_IN_SOURCE, DEPRECATED_FINDING, SIGNAL_CYCLE_FINDING, ALLOWED_BY_CONFIG, PANTOGRAPH_FINDING, ALLOWED_CYCLE];

/** A report context; `problems` adds the input errors and the rule failure. */
export function context(options: { color?: boolean; problems?: boolean } = {}): ReportContext {
  return {
    toolName: 'isapart',
    toolVersion: '0.1.0',
    cwd: CWD,
    sources: [
      { file: ROLLING_STOCK, format: 'turtle', statements: 120 },
      { file: INFRASTRUCTURE, format: 'trig', statements: 45 },
      { file: SIGNALS, format: 'n-triples', statements: 8 },
    ],
    inputErrors: options.problems ? INPUT_ERRORS : [],
    inputWarnings: options.problems ? INPUT_WARNINGS : [],
    ruleFailures: options.problems ? RULE_FAILURES : [],
    rules: RULES_IN_USE,
    configFile: CONFIG,
    color: options.color ?? false,
    startTime: new Date('2025-03-04T08:15:00.000Z'),
    endTime: new Date('2025-03-04T08:15:02.250Z'),
    commandLine: 'isapart check data --format sarif',
  };
}
