// toSarif: SARIF 2.1.0 output, validated against the OASIS schema and checked against the standard's rules.
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { FINGERPRINT_KEY, PROJECT_ROOT_BASE_ID, SARIF_SCHEMA_URI, toSarif } from '../../src/report/sarif.js';
import { STDIN_FILE } from '../../src/report/paths.js';
import {
  ALL_FINDINGS,
  ALLOWED_BY_CONFIG,
  ALLOWED_IN_SOURCE,
  CWD,
  DEF,
  DEPRECATED_FINDING,
  INPUT_WARNINGS,
  PANTOGRAPH_FINDING,
  SIGNAL_CYCLE_FINDING,
  SIGNALS,
  UNUSED_ALLOW_FINDING,
  context,
} from './report-fixtures.js';
import { SARIF_SCHEMA, sarifValidator } from './sarif-validator.js';

const sarifSchema = SARIF_SCHEMA;
const validate = sarifValidator();

function fullLog() {
  return JSON.parse(toSarif(ALL_FINDINGS, context({ problems: true })));
}

function resultFor(log: any, fingerprint: string) {
  return log.runs[0].results.find((result: any) => result.partialFingerprints[FINGERPRINT_KEY] === fingerprint);
}

describe('toSarif against the OASIS SARIF 2.1.0 schema', () => {
  it('is valid for a run with suppressed findings, input errors, a rule failure, an unused allow and a fix', () => {
    const log = fullLog();
    const valid = validate(log);
    expect(validate.errors ?? []).toEqual([]);
    expect(valid).toBe(true);
    expect(log.runs[0].results).toHaveLength(ALL_FINDINGS.length);
  });

  it('is valid for a clean run with no findings', () => {
    const log = JSON.parse(toSarif([], context()));
    expect(validate(log)).toBe(true);
    expect(log.runs[0].results).toEqual([]);
  });

  it('uses a validator that rejects a log the schema forbids', () => {
    const log = fullLog();
    log.runs[0].results[0].level = 'fatal';
    expect(validate(log)).toBe(false);
    delete log.runs[0].results[0].level;
    delete log.runs[0].invocations[0].executionSuccessful;
    expect(validate(log)).toBe(false);
  });
});

describe('toSarif and the SARIF 2.1.0 rules', () => {
  it('names version "2.1.0", the OASIS schema and the driver', () => {
    const log = fullLog();
    // SARIF 2.1.0: version is "2.1.0"; the schema's own id is the $schema value.
    expect(log.version).toBe('2.1.0');
    expect(log.$schema).toBe(SARIF_SCHEMA_URI);
    expect(log.$schema).toBe(sarifSchema.id);
    // SARIF 2.1.0: runs[].tool.driver.name
    expect(log.runs).toHaveLength(1);
    expect(log.runs[0].tool.driver.name).toBe('isapart');
    expect(log.runs[0].tool.driver.version).toBe('0.1.0');
    expect(log.runs[0].tool.driver.informationUri).toBeUndefined();
  });

  it('states columnKind, as required when results point into text files', () => {
    // SARIF 2.1.0: columnKind is required when results point into text files.
    expect(fullLog().runs[0].columnKind).toBe('utf16CodeUnits');
  });

  it('writes 1-based regions equal to the statements\' 1-based positions', () => {
    const log = fullLog();
    const pantograph = resultFor(log, PANTOGRAPH_FINDING.fingerprint);
    // SARIF 2.1.0: regions are 1-based, as are isapart's positions, so they carry over unchanged.
    expect(pantograph.locations[0].physicalLocation.region).toEqual({ startLine: 12, startColumn: 1 });
    // design.md: the first evidence statement is the location; the rest are related locations.
    expect(pantograph.relatedLocations[0].physicalLocation.region).toEqual({ startLine: 13, startColumn: 5 });
    const regions: any[] = [];
    JSON.stringify(log, (key, value) => {
      if (key === 'region') regions.push(value);
      return value;
    });
    expect(regions.length).toBeGreaterThan(10);
    for (const region of regions) {
      expect(region.startLine).toBeGreaterThanOrEqual(1);
      if (region.startColumn !== undefined) expect(region.startColumn).toBeGreaterThanOrEqual(1);
    }
  });

  it('fills partialFingerprints and never fingerprints', () => {
    const log = fullLog();
    for (const result of log.runs[0].results) {
      // SARIF 2.1.0: producers fill partialFingerprints; fingerprints are for result management systems.
      expect(result.fingerprints).toBeUndefined();
      expect(result.partialFingerprints[FINGERPRINT_KEY]).toMatch(/^[0-9a-f]{64}$/);
    }
    expect(resultFor(log, SIGNAL_CYCLE_FINDING.fingerprint).ruleId).toBe('subclass-cycle');
  });

  it('marks the execution failed when there is an error notification, and successful otherwise', () => {
    const failed = fullLog().runs[0].invocations[0];
    // SARIF 2.1.0: executionSuccessful is required; an error-level toolExecutionNotification means the run failed.
    expect(failed.toolExecutionNotifications.some((notification: any) => notification.level === 'error')).toBe(true);
    expect(failed.executionSuccessful).toBe(false);
    const clean = JSON.parse(toSarif(ALL_FINDINGS, context())).runs[0].invocations[0];
    expect(clean.executionSuccessful).toBe(true);
    expect(clean.toolExecutionNotifications).toBeUndefined();
    expect(clean.commandLine).toBe('isapart check data --format sarif');
    expect(clean.startTimeUtc).toBe('2025-03-04T08:15:00.000Z');
    expect(clean.endTimeUtc).toBe('2025-03-04T08:15:02.250Z');
    // Input warnings alone are warning-level notifications: the run still succeeded.
    const warned = JSON.parse(toSarif(ALL_FINDINGS, { ...context(), inputWarnings: INPUT_WARNINGS })).runs[0].invocations[0];
    expect(warned.toolExecutionNotifications.map((notification: any) => notification.level)).toEqual(['warning']);
    expect(warned.executionSuccessful).toBe(true);
  });

  it('writes an input error as a notification with its location and hint, and a rule failure with its rule', () => {
    const log = fullLog();
    const [broken, missing, failure, warning] = log.runs[0].invocations[0].toolExecutionNotifications;
    expect(warning.level).toBe('warning');
    expect(warning.message.text).toContain('is a literal');
    expect(broken.level).toBe('error');
    expect(broken.message.text).toBe('Expected a term after the predicate, found "." Hint: write an object before the full stop');
    expect(broken.locations[0].physicalLocation).toEqual({
      artifactLocation: { uri: 'data/broken.ttl', uriBaseId: PROJECT_ROOT_BASE_ID },
      region: { startLine: 4, startColumn: 17 },
    });
    // Line 0 means "the file as a whole": no region, since SARIF 2.1.0 regions are 1-based.
    expect(missing.locations[0].physicalLocation.region).toBeUndefined();
    expect(failure.level).toBe('error');
    const rules = log.runs[0].tool.driver.rules;
    expect(rules[failure.associatedRule.index].id).toBe('subclass-cycle');
    expect(failure.associatedRule.id).toBe('subclass-cycle');
    expect(log.runs[0].tool.driver.notifications[failure.descriptor.index].id).toBe(failure.descriptor.id);
  });

  it('lists every rule with descriptions, help and its default configuration', () => {
    const rules = fullLog().runs[0].tool.driver.rules;
    expect(rules.map((rule: any) => rule.id)).toEqual(['deprecated-in-use', 'kind-and-part', 'orphan-class', 'subclass-cycle', 'unused-allow']);
    const orphan = rules.find((rule: any) => rule.id === 'orphan-class');
    expect(orphan.defaultConfiguration).toEqual({ enabled: false, level: 'warning' });
    const deprecated = rules.find((rule: any) => rule.id === 'deprecated-in-use');
    expect(deprecated.defaultConfiguration).toEqual({ level: 'note' });
    expect(deprecated.shortDescription.text).toBe('A statement points at a deprecated term.');
    expect(deprecated.fullDescription.text).toBe('What deprecated-in-use looks for, and how to fix it.\nSecond line of the description.');
    expect(deprecated.help.text).toContain('nv:Pantograph nv:partOf nv:RoofAssembly .');
  });

  it('points each result at its rule, with level, message, focus, nodes and related evidence', () => {
    const log = fullLog();
    const rules = log.runs[0].tool.driver.rules;
    for (const result of log.runs[0].results) {
      expect(rules[result.ruleIndex].id).toBe(result.ruleId);
      // SARIF 2.1.0: level is one of none, note, warning, error.
      expect(['none', 'note', 'warning', 'error']).toContain(result.level);
    }
    const cycle = resultFor(log, SIGNAL_CYCLE_FINDING.fingerprint);
    expect(cycle.level).toBe('error');
    expect(cycle.message.text).toBe(SIGNAL_CYCLE_FINDING.message);
    expect(cycle.locations[0].logicalLocations).toEqual([{ fullyQualifiedName: `${DEF}MainSignal` }]);
    expect(cycle.properties.nodes).toEqual([`${DEF}MainSignal`, `${DEF}Signal`]);
    expect(cycle.relatedLocations.map((location: any) => location.id)).toEqual([1]);
    expect(cycle.relatedLocations[0].message.text).toBe(
      `<${DEF}Signal> <http://www.w3.org/2000/01/rdf-schema#subClassOf> <${DEF}MainSignal> <https://data.northvale-rail.example/asset/graph/signalling>`,
    );
  });

  it('reports an unused allow at its location, as a result of its rule', () => {
    const result = resultFor(fullLog(), UNUSED_ALLOW_FINDING.fingerprint);
    expect(result.ruleId).toBe('unused-allow');
    expect(result.locations[0].physicalLocation.region).toEqual({ startLine: 31, startColumn: 40 });
    expect(result.locations[0].physicalLocation.artifactLocation).toEqual({ uri: 'data/rolling-stock.ttl', uriBaseId: PROJECT_ROOT_BASE_ID, index: 0 });
    expect(result.relatedLocations).toBeUndefined();
    // It is about a comment, not a node: no logical location.
    expect(result.locations[0].logicalLocations).toBeUndefined();
  });

  it('writes suppressions with their kind, justification and where they were stated', () => {
    const log = fullLog();
    const inSource = resultFor(log, ALLOWED_IN_SOURCE.fingerprint).suppressions;
    // SARIF 2.1.0: suppression kind is inSource or external.
    expect(inSource).toEqual([
      {
        kind: 'inSource',
        status: 'accepted',
        justification: 'bogie kits are sold as wagons',
        location: { physicalLocation: { artifactLocation: { uri: 'data/rolling-stock.ttl', uriBaseId: PROJECT_ROOT_BASE_ID, index: 0 }, region: { startLine: 20 } } },
      },
    ]);
    const external = resultFor(log, ALLOWED_BY_CONFIG.fingerprint).suppressions[0];
    expect(external.kind).toBe('external');
    expect(external.location.physicalLocation.artifactLocation.uri).toBe('isapart.yaml');
    expect(resultFor(log, PANTOGRAPH_FINDING.fingerprint).suppressions).toBeUndefined();
  });

  it('carries the proposed removal as a property, since a SARIF fix needs artifact changes', () => {
    const result = resultFor(fullLog(), PANTOGRAPH_FINDING.fingerprint);
    // SARIF 2.1.0 schema: fix requires artifactChanges (minItems 1); a description alone is invalid.
    expect(sarifSchema.definitions.fix.required).toContain('artifactChanges');
    expect(result.fixes).toBeUndefined();
    expect(result.properties.fix.description).toBe(
      `Remove the statement: <${DEF}Pantograph> <http://purl.org/dc/terms/isPartOf> <${DEF}Locomotive>`,
    );
    expect(result.properties.fix.remove).toEqual([
      { statement: `<${DEF}Pantograph> <http://purl.org/dc/terms/isPartOf> <${DEF}Locomotive>`, file: 'data/rolling-stock.ttl', line: 12, column: 1 },
    ]);
  });

  it('writes artifact URIs relative and escaped, resolving against the run folder to the file', () => {
    const log = fullLog();
    const run = log.runs[0];
    const base = run.originalUriBaseIds[PROJECT_ROOT_BASE_ID].uri;
    expect(base).toBe(`${pathToFileURL(CWD).href}/`);
    const signals = resultFor(log, DEPRECATED_FINDING.fingerprint).locations[0].physicalLocation.artifactLocation;
    expect(signals.uri).toBe('data/signal%20plans/signals.nt');
    // The WHATWG URL parser resolves the reference against the base to the file's own file: URL.
    expect(new URL(signals.uri, base).href).toBe(pathToFileURL(SIGNALS).href);
    expect(run.artifacts[signals.index].location.uri).toBe(signals.uri);
    expect(run.artifacts.map((artifact: any) => artifact.mimeType)).toEqual(['text/turtle', 'application/trig', 'application/n-triples']);
    expect(run.artifacts[1].properties).toEqual({ format: 'trig', statements: 45 });
  });

  it('describes standard input, which has no URI, and still points results at its artifact', () => {
    const fromStdin = { ...PANTOGRAPH_FINDING, evidence: PANTOGRAPH_FINDING.evidence.map((value) => ({ ...value, position: { ...value.position, file: STDIN_FILE } })), fix: undefined };
    const log = JSON.parse(toSarif([fromStdin], { ...context(), sources: [{ file: STDIN_FILE, format: 'turtle', statements: 2 }] }));
    expect(validate(log)).toBe(true);
    expect(log.runs[0].artifacts[0].location).toEqual({ index: 0, description: { text: 'standard input' } });
    expect(log.runs[0].results[0].locations[0].physicalLocation.artifactLocation).toEqual({ index: 0, description: { text: 'standard input' } });
  });

  it('gives the same log for the findings in any order', () => {
    const reversed = [...ALL_FINDINGS].reverse();
    expect(toSarif(reversed, context({ problems: true }))).toBe(toSarif(ALL_FINDINGS, context({ problems: true })));
  });
});
