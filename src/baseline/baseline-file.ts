// Reading a baseline: an earlier isapart JSON or SARIF report, back into the findings it held.
import { readFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import type { Finding, Level } from '../engine/finding.js';
import type { InputError, Literal, Position, Statement } from '../load/statement.js';
import { JSON_REPORT_FORMAT, JSON_REPORT_VERSION, type JsonFinding, type JsonStatement } from '../report/json.js';
import { FINDINGS_VERSION_PROPERTY, FINGERPRINT_KEY } from '../report/sarif.js';

/** The findings of a baseline, or the error that kept it from being read. */
export type BaselineRead = { findings: Finding[] } | { error: InputError };

const LEVELS = new Set<string>(['error', 'warning', 'note']);
const FINGERPRINT = /^[0-9a-f]{64}$/;

/** How to make a baseline this version reads, for hints. */
const REGENERATE_HINT =
  'write the baseline again with this isapart (isapart check PATH... -f json -o baseline.json at the base revision), or let --since REV lint the base revision itself';

/** Reads a baseline file; a file that cannot be read or is no isapart report of this version is an error. */
export async function readBaselineFile(file: string, shownAs: string = file): Promise<BaselineRead> {
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? String(error);
    return { error: problem(shownAs, `the baseline ${shownAs} cannot be read (${code})`, 'give the path of a JSON or SARIF report written by isapart check') };
  }
  return parseBaseline(text, shownAs);
}

/**
 * The findings of a baseline's text: an isapart findings document (`-f json`) of this version, or a
 * SARIF 2.1.0 log (`-f sarif`) whose run is isapart's and of this findings version. Findings the
 * baseline itself marked `absent` are left out: they were not found in that run.
 */
export function parseBaseline(text: string, file: string): BaselineRead {
  let document: unknown;
  try {
    document = JSON.parse(text);
  } catch (error) {
    return { error: problem(file, `the baseline ${file} is not JSON (${(error as Error).message})`, 'give a JSON or SARIF report written by isapart check, not a text report') };
  }
  if (!isObject(document)) return { error: problem(file, `the baseline ${file} is not a JSON object`, REGENERATE_HINT) };
  if (document.format === JSON_REPORT_FORMAT) return fromJsonReport(document, file);
  if (typeof document.version === 'string' && Array.isArray(document.runs)) return fromSarifLog(document, file);
  return { error: problem(file, `the baseline ${file} is neither an isapart findings document nor a SARIF log`, REGENERATE_HINT) };
}

function fromJsonReport(document: Record<string, unknown>, file: string): BaselineRead {
  if (document.version !== JSON_REPORT_VERSION) {
    return {
      error: problem(
        file,
        `the baseline ${file} is an isapart findings document of version ${JSON.stringify(document.version)}; this isapart compares with version ${JSON_REPORT_VERSION} only, whose fingerprints it computes the same way`,
        REGENERATE_HINT,
      ),
    };
  }
  if (!Array.isArray(document.findings)) return { error: problem(file, `the baseline ${file} has no findings list`, REGENERATE_HINT) };
  const findings: Finding[] = [];
  for (const [index, entry] of document.findings.entries()) {
    const finding = jsonFinding(entry);
    if (finding === undefined) return { error: problem(file, `finding ${index + 1} of the baseline ${file} is malformed (it needs ruleId, level, message and a 64-digit fingerprint)`, REGENERATE_HINT) };
    if ((entry as JsonFinding).baselineState !== 'absent') findings.push(finding);
  }
  return { findings };
}

function jsonFinding(entry: unknown): Finding | undefined {
  if (!isObject(entry)) return undefined;
  const { ruleId, level, message, fingerprint, focus, nodes, evidence } = entry as Partial<Record<keyof JsonFinding, unknown>>;
  if (typeof ruleId !== 'string' || typeof level !== 'string' || !LEVELS.has(level) || typeof message !== 'string') return undefined;
  if (typeof fingerprint !== 'string' || !FINGERPRINT.test(fingerprint)) return undefined;
  const statements = Array.isArray(evidence) ? evidence.flatMap((item) => jsonStatement(item) ?? []) : [];
  const location = isObject(entry.location) ? position(entry.location) : undefined;
  // Evidence and location of a baseline are the positions of that run; they serve to show absent findings.
  return {
    ruleId,
    level: level as Level,
    focus: typeof focus === 'string' ? focus : '',
    nodes: Array.isArray(nodes) ? nodes.filter((node): node is string => typeof node === 'string') : [],
    message,
    evidence: statements,
    fingerprint,
    ...(location === undefined ? {} : { location }),
  };
}

function jsonStatement(item: unknown): Statement | undefined {
  if (!isObject(item)) return undefined;
  const { subject, predicate, object, graph } = item as Partial<Record<keyof JsonStatement, unknown>>;
  const where = position(item);
  if (typeof subject !== 'string' || typeof predicate !== 'string' || where === undefined) return undefined;
  const literal = isObject(object) && typeof object.value === 'string' ? (object as unknown as Literal) : undefined;
  if (typeof object !== 'string' && literal === undefined) return undefined;
  return {
    subject,
    predicate,
    object: literal ?? (object as string),
    graph: typeof graph === 'string' ? graph : '',
    position: where,
    objectLine: where.line,
  };
}

function position(item: Record<string, unknown>): Position | undefined {
  const { file, line, column } = item;
  if (typeof file !== 'string' || typeof line !== 'number' || typeof column !== 'number') return undefined;
  return { file, line, column };
}

function fromSarifLog(document: Record<string, unknown>, file: string): BaselineRead {
  if (document.version !== '2.1.0') {
    return { error: problem(file, `the baseline ${file} is a SARIF ${String(document.version)} log; isapart reads SARIF 2.1.0`, REGENERATE_HINT) };
  }
  const runs = document.runs as unknown[];
  const run = runs.find((candidate) => isObject(candidate) && isObject(candidate.tool) && isObject(candidate.tool.driver) && candidate.tool.driver.name === 'isapart');
  if (!isObject(run)) return { error: problem(file, `the baseline ${file} holds no run of isapart`, 'give a SARIF log written by isapart check -f sarif') };
  const version = isObject(run.properties) ? run.properties[FINDINGS_VERSION_PROPERTY] : undefined;
  if (version !== JSON_REPORT_VERSION) {
    const written = version === undefined ? 'names no findings version (it was written by an isapart older than findings version 2)' : `is of findings version ${JSON.stringify(version)}`;
    return { error: problem(file, `the SARIF baseline ${file} ${written}; this isapart compares with findings version ${JSON_REPORT_VERSION} only, whose fingerprints it computes the same way`, REGENERATE_HINT) };
  }
  const results = Array.isArray(run.results) ? run.results : [];
  const findings: Finding[] = [];
  for (const [index, result] of results.entries()) {
    const finding = sarifFinding(result);
    if (finding === undefined) {
      return { error: problem(file, `result ${index + 1} of the SARIF baseline ${file} is malformed (it needs ruleId, level, message.text and partialFingerprints["${FINGERPRINT_KEY}"])`, REGENERATE_HINT) };
    }
    if ((result as Record<string, unknown>).baselineState !== 'absent') findings.push(finding);
  }
  return { findings };
}

function sarifFinding(result: unknown): Finding | undefined {
  if (!isObject(result)) return undefined;
  const fingerprint = isObject(result.partialFingerprints) ? result.partialFingerprints[FINGERPRINT_KEY] : undefined;
  const message = isObject(result.message) ? result.message.text : undefined;
  const level = result.level ?? 'warning';
  if (typeof result.ruleId !== 'string' || typeof message !== 'string' || typeof level !== 'string' || !LEVELS.has(level)) return undefined;
  if (typeof fingerprint !== 'string' || !FINGERPRINT.test(fingerprint)) return undefined;
  const primary = Array.isArray(result.locations) && isObject(result.locations[0]) ? result.locations[0] : {};
  const logical = Array.isArray(primary.logicalLocations) && isObject(primary.logicalLocations[0]) ? primary.logicalLocations[0].fullyQualifiedName : undefined;
  const nodes = isObject(result.properties) && Array.isArray(result.properties.nodes) ? result.properties.nodes : [];
  const location = isObject(primary.physicalLocation) ? sarifPosition(primary.physicalLocation) : undefined;
  return {
    ruleId: result.ruleId,
    level: level as Level,
    focus: typeof logical === 'string' ? logical : '',
    nodes: nodes.filter((node): node is string => typeof node === 'string'),
    message,
    evidence: [],
    fingerprint,
    ...(location === undefined ? {} : { location }),
  };
}

/** A SARIF physical location as a position; relative URIs are paths from the run's folder. */
function sarifPosition(physical: Record<string, unknown>): Position | undefined {
  const artifact = isObject(physical.artifactLocation) ? physical.artifactLocation : {};
  const region = isObject(physical.region) ? physical.region : {};
  let file: string;
  if (typeof artifact.uri !== 'string') file = '<stdin>';
  else if (artifact.uri.startsWith('file:')) file = fileURLToPath(artifact.uri);
  else file = decodeURIComponent(artifact.uri.replace(/^\.\//, ''));
  // A location without a line (a file as a whole) is kept out: positions are 1-based.
  if (typeof region.startLine !== 'number' || region.startLine < 1) return undefined;
  const column = typeof region.startColumn === 'number' && region.startColumn >= 1 ? region.startColumn : 1;
  return { file, line: region.startLine, column };
}

function problem(file: string, message: string, hint: string): InputError {
  return { file, line: 0, column: 0, message, hint };
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
