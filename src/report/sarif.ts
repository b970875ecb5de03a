// The SARIF 2.1.0 report: one run with the rules, results, artifacts and the invocation's notifications.
import type { Finding, RuleFailure, Suppression } from '../engine/finding.js';
import type { LineRemoval } from '../fix/text-removal.js';
import type { InputError, Position, RdfFormat, Statement } from '../load/statement.js';
import type { ReportContext, RuleInUse } from './context.js';
import { compareText, primaryPosition, sortFindings } from './findings-summary.js';
import { JSON_REPORT_VERSION } from './json.js';
import { fileUri, folderUri, isRelativeShownPath, relativePath, STDIN_FILE } from './paths.js';
import { createTermWriter, type TermWriter } from './statement-text.js';

/** The schema a SARIF 2.1.0 log names: the id of the OASIS schema (test/standards/oasis-sarif). */
export const SARIF_SCHEMA_URI = 'https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json';

/** The key of isapart's fingerprint in `partialFingerprints`. */
export const FINGERPRINT_KEY = 'isapart/v1';

/** The run property that names the findings version (that of the JSON report), so a SARIF baseline is read only by an isapart that fingerprints alike. */
export const FINDINGS_VERSION_PROPERTY = 'findingsVersion';

/** The uriBaseId that relative artifact URIs resolve against: the folder the run started in. */
export const PROJECT_ROOT_BASE_ID = 'PROJECTROOT';

// Registered media types of the RDF syntaxes (W3C RDF 1.1 Turtle, TriG, N-Triples, N-Quads, RDF/XML and
// JSON-LD 1.1, their IANA sections; from memory).
const MEDIA_TYPES: Record<RdfFormat, string> = {
  turtle: 'text/turtle',
  trig: 'application/trig',
  'n-triples': 'application/n-triples',
  'n-quads': 'application/n-quads',
  'rdf-xml': 'application/rdf+xml',
  'json-ld': 'application/ld+json',
};

// The media type of a SPARQL 1.1 Update (W3C SPARQL 1.1 Update, its appendix registering application/sparql-update; from memory).
const SPARQL_UPDATE_MEDIA_TYPE = 'application/sparql-update';

/** The edit's files that are not among the data sources, in order. */
function editFiles(context: ReportContext): NonNullable<ReportContext['edit']>['files'] {
  const data = new Set(context.sources.map((source) => source.file));
  return (context.edit?.files ?? []).filter((file) => !data.has(file.file));
}

// Notification descriptors of the driver, in this order (notifications refer to them by index).
const NOTIFICATIONS = [
  { id: 'input-error', shortDescription: { text: 'A source, statement or config entry could not be read.' } },
  { id: 'rule-failure', shortDescription: { text: 'A rule failed while running; its findings are missing.' } },
];
const INPUT_ERROR_NOTIFICATION = 0;
const RULE_FAILURE_NOTIFICATION = 1;

type SarifObject = Record<string, unknown>;

interface SarifWriter {
  cwd: string;
  terms: TermWriter;
  /** Shown file path → index in `run.artifacts`. */
  artifactIndex: Map<string, number>;
  /** Rule id → index in `tool.driver.rules`. */
  ruleIndex: Map<string, number>;
  /** Whether results carry baselineState: on all of them or none (SARIF 2.1.0 §3.27.24). */
  withBaseline: boolean;
  removals: ReadonlyMap<Statement, LineRemoval>;
}

/** Renders the run as a SARIF 2.1.0 log (2-space indentation, trailing newline). */
export function toSarif(findings: Finding[], context: ReportContext): string {
  const rules = [...context.rules].sort((a, b) => compareText(a.rule.id, b.rule.id));
  const writer: SarifWriter = {
    cwd: context.cwd,
    terms: createTermWriter(),
    artifactIndex: new Map([...context.sources.map((source) => source.file), ...editFiles(context).map((file) => file.file)].map((file, index) => [relativePath(file, context.cwd), index])),
    ruleIndex: new Map(rules.map((ruleInUse, index) => [ruleInUse.rule.id, index])),
    withBaseline: context.baseline !== undefined || findings.some((finding) => finding.baselineState !== undefined),
    removals: context.removals ?? new Map(),
  };
  const notifications = [
    ...context.inputErrors.map((error) => inputErrorNotification(error, 'error', writer)),
    ...context.ruleFailures.map((failure) => ruleFailureNotification(failure, writer)),
    ...(context.inputWarnings ?? []).map((warning) => inputErrorNotification(warning, 'warning', writer)),
  ];
  const log = {
    $schema: SARIF_SCHEMA_URI,
    version: '2.1.0',
    runs: [
      {
        tool: {
          driver: {
            name: context.toolName,
            version: context.toolVersion,
            rules: rules.map(ruleDescriptor),
            notifications: NOTIFICATIONS,
          },
        },
        invocations: [
          {
            // SARIF 2.1.0: an error-level tool execution notification means the run did not succeed.
            executionSuccessful: context.inputErrors.length === 0 && context.ruleFailures.length === 0,
            commandLine: context.commandLine,
            startTimeUtc: context.startTime.toISOString(),
            endTimeUtc: context.endTime.toISOString(),
            workingDirectory: { uri: folderUri(context.cwd) },
            ...(notifications.length > 0 ? { toolExecutionNotifications: notifications } : {}),
          },
        ],
        originalUriBaseIds: { [PROJECT_ROOT_BASE_ID]: { uri: folderUri(context.cwd) } },
        artifacts: [
          ...context.sources.map((source) => ({
            location: artifactLocation(source.file, writer),
            mimeType: MEDIA_TYPES[source.format],
            roles: ['analysisTarget'],
            properties: { format: source.format, statements: source.statements },
          })),
          // The edit's files: the statements they add or remove are evidence of the findings they introduce.
          ...editFiles(context).map((file) => ({
            location: artifactLocation(file.file, writer),
            mimeType: file.format === 'sparql-update' ? SPARQL_UPDATE_MEDIA_TYPE : MEDIA_TYPES[file.format],
            roles: ['analysisTarget', 'referencedOnCommandLine'],
            properties: { format: file.format, edit: file.role },
          })),
        ],
        columnKind: 'utf16CodeUnits',
        results: sortFindings(findings).map((finding) => result(finding, writer)),
        properties: { [FINDINGS_VERSION_PROPERTY]: JSON_REPORT_VERSION },
      },
    ],
  };
  return `${JSON.stringify(log, null, 2)}\n`;
}

function ruleDescriptor(ruleInUse: RuleInUse): SarifObject {
  const { rule, level } = ruleInUse;
  const examples = [
    rule.examples.flagged.trim() === '' ? '' : `Flagged (Turtle):\n${rule.examples.flagged.trimEnd()}`,
    rule.examples.clean.trim() === '' ? '' : `Clean (Turtle):\n${rule.examples.clean.trimEnd()}`,
  ].filter((text) => text !== '');
  return {
    id: rule.id,
    shortDescription: { text: rule.summary },
    fullDescription: { text: rule.description.trim() },
    help: { text: [rule.summary, rule.description.trim(), ...examples].join('\n\n') },
    defaultConfiguration: level === 'off' ? { enabled: false, level: rule.level } : { level },
  };
}

function result(finding: Finding, writer: SarifWriter): SarifObject {
  const position = primaryPosition(finding);
  const primary: SarifObject = position ? { physicalLocation: physicalLocation(position, writer) } : {};
  // A finding with no statement evidence (an unused allow) is about a comment, not a node.
  if (finding.focus !== '' && finding.evidence.length > 0) primary.logicalLocations = [{ fullyQualifiedName: finding.focus }];
  const index = writer.ruleIndex.get(finding.ruleId);
  const written: SarifObject = {
    ruleId: finding.ruleId,
    ...(index === undefined ? {} : { ruleIndex: index }),
    level: finding.level,
    message: { text: finding.message },
    locations: Object.keys(primary).length > 0 ? [primary] : [],
  };
  // design.md: the first evidence statement is the location, the other evidence the related locations.
  if (finding.evidence.length > 1) {
    written.relatedLocations = finding.evidence.slice(1).map((statement, evidenceIndex) => ({
      id: evidenceIndex + 1,
      physicalLocation: physicalLocation(statement.position, writer),
      message: { text: writer.terms.statement(statement) },
    }));
  }
  // SARIF 2.1.0: producers fill partialFingerprints and leave fingerprints to result management systems.
  written.partialFingerprints = { [FINGERPRINT_KEY]: finding.fingerprint };
  if (finding.suppression) written.suppressions = [suppression(finding.suppression, writer)];
  // SARIF 2.1.0 §3.27.24: when any result has a baselineState, every result has one.
  if (writer.withBaseline) written.baselineState = finding.baselineState ?? 'new';
  const properties: SarifObject = { nodes: [...finding.nodes] };
  if (finding.fix) {
    const fix = textFix(finding.fix.remove, writer);
    // A SARIF fix needs at least one artifact change (its schema requires them), so a removal that is
    // not a safe deletion of whole lines travels as a described proposal in the properties instead.
    if (fix !== undefined) written.fixes = [fix];
    else properties.fix = proposedFix(finding.fix.remove, writer);
  }
  written.properties = properties;
  return written;
}

/** What removing the statements means, in words. */
function removalDescription(remove: Statement[], writer: SarifWriter): string {
  const statements = remove.map((statement) => writer.terms.statement(statement));
  return `Remove ${remove.length === 1 ? 'the statement' : `${remove.length} statements`}: ${statements.join('; ')}`;
}

/** A SARIF fix deleting each statement's lines, when every one of them is a safe whole-line removal. */
function textFix(remove: Statement[], writer: SarifWriter): SarifObject | undefined {
  const removals = remove.map((statement) => writer.removals.get(statement));
  if (removals.length === 0 || removals.some((removal) => removal === undefined)) return undefined;
  const byFile = new Map<string, LineRemoval[]>();
  for (const removal of removals as LineRemoval[]) {
    const same = byFile.get(removal.file);
    if (same === undefined) byFile.set(removal.file, [removal]);
    else same.push(removal);
  }
  return {
    description: { text: `${removalDescription(remove, writer)}. Review the change before applying it.` },
    artifactChanges: [...byFile].map(([file, fileRemovals]) => ({
      artifactLocation: artifactLocation(file, writer),
      replacements: fileRemovals.sort((left, right) => left.firstLine - right.firstLine).map((removal) => ({ deletedRegion: deletedLines(removal) })),
    })),
  };
}

/**
 * The region of whole lines, line ends included: up to column 1 of the next line, or on a last
 * line without a line end, up to its end (SARIF 2.1.0 text regions, columns in UTF-16 code units).
 */
function deletedLines(removal: LineRemoval): SarifObject {
  const snippet = { text: removal.text };
  if (/(\r\n|\r|\n)$/.test(removal.text)) {
    return { startLine: removal.firstLine, startColumn: 1, endLine: removal.lastLine + 1, endColumn: 1, snippet };
  }
  const lastLine = removal.text.split(/\r\n|\r|\n/).pop() ?? '';
  return { startLine: removal.firstLine, startColumn: 1, endLine: removal.lastLine, endColumn: lastLine.length + 1, snippet };
}

function proposedFix(remove: Statement[], writer: SarifWriter): SarifObject {
  return {
    description: removalDescription(remove, writer),
    remove: remove.map((statement) => ({
      statement: writer.terms.statement(statement),
      file: relativePath(statement.position.file, writer.cwd),
      line: statement.position.line,
      column: statement.position.column,
    })),
  };
}

function suppression(allowed: Suppression, writer: SarifWriter): SarifObject {
  return {
    kind: allowed.kind,
    status: 'accepted',
    justification: allowed.justification,
    location: { physicalLocation: physicalLocation({ file: allowed.file, line: allowed.line, column: 0 }, writer) },
  };
}

function inputErrorNotification(error: InputError, level: 'error' | 'warning', writer: SarifWriter): SarifObject {
  return {
    level,
    message: { text: error.hint ? `${error.message} Hint: ${error.hint}` : error.message },
    locations: [{ physicalLocation: physicalLocation(error, writer) }],
    descriptor: { id: NOTIFICATIONS[INPUT_ERROR_NOTIFICATION].id, index: INPUT_ERROR_NOTIFICATION },
  };
}

function ruleFailureNotification(failure: RuleFailure, writer: SarifWriter): SarifObject {
  const index = writer.ruleIndex.get(failure.ruleId);
  return {
    level: 'error',
    message: { text: `The rule ${failure.ruleId} failed: ${failure.message}` },
    descriptor: { id: NOTIFICATIONS[RULE_FAILURE_NOTIFICATION].id, index: RULE_FAILURE_NOTIFICATION },
    associatedRule: index === undefined ? { id: failure.ruleId } : { id: failure.ruleId, index },
  };
}

// SARIF 2.1.0 regions are 1-based: a line or column below 1 (unknown) is left out.
function physicalLocation(position: Position, writer: SarifWriter): SarifObject {
  const region: SarifObject = {};
  if (position.line >= 1) {
    region.startLine = position.line;
    if (position.column >= 1) region.startColumn = position.column;
  }
  return {
    artifactLocation: artifactLocation(position.file, writer),
    ...(Object.keys(region).length > 0 ? { region } : {}),
  };
}

function artifactLocation(file: string, writer: SarifWriter): SarifObject {
  if (file === STDIN_FILE) {
    const index = writer.artifactIndex.get(STDIN_FILE);
    return { ...(index === undefined ? {} : { index }), description: { text: 'standard input' } };
  }
  const shown = relativePath(file, writer.cwd);
  const index = writer.artifactIndex.get(shown);
  return {
    uri: fileUri(file, writer.cwd),
    ...(isRelativeShownPath(shown) ? { uriBaseId: PROJECT_ROOT_BASE_ID } : {}),
    ...(index === undefined ? {} : { index }),
  };
}
