// The fix script: a SPARQL 1.1 Update request deleting the statements of every finding whose rule has fix.remove.
import type { Finding } from '../engine/finding.js';
import type { Literal, Statement } from '../load/statement.js';
import type { ReportContext } from './context.js';
import { sortFindings } from './findings-summary.js';
import { relativePath } from './paths.js';
import { XSD_STRING } from '../roles/vocabulary.js';

const RDF_LANG_STRING = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString';

// SPARQL 1.1 Query Language §19.8, IRIREF [139]: no <>"{}|^`\ and no code point up to U+0020 inside <...>.
const IRI_REF_CHARACTERS = /^[^<>"{}|^`\\\u0000-\u0020]*$/;

// SPARQL 1.1 Query Language §19.8, ECHAR [160] inside STRING_LITERAL_QUOTE [156], which admits no raw " \ LF CR.
const STRING_ESCAPES: Record<string, string> = { '"': '\\"', '\\': '\\\\', '\n': '\\n', '\r': '\\r', '\t': '\\t', '\b': '\\b', '\f': '\\f' };

// BCP 47 as the SPARQL 1.1 grammar's LANGTAG [145] admits it.
const LANGUAGE_TAG = /^[a-zA-Z]+(-[a-zA-Z0-9]+)*$/;

/**
 * Renders the fix script: a caution first, then one `DELETE DATA { ... }` operation per finding
 * with a fix (suppressed findings and those only in a baseline left out), each after a comment
 * naming the finding, its rule and where its statements are. A statement with a blank node cannot
 * be named in DELETE DATA (SPARQL 1.1 Update forbids blank nodes there, in section 3.1.2 from
 * memory), so such a finding gets a comment saying so instead of an operation. isapart never runs
 * the script.
 */
export function toSparqlUpdate(findings: Finding[], context: ReportContext): string {
  const fixable = sortFindings(findings).filter((finding) => finding.fix !== undefined && !finding.suppression && finding.baselineState !== 'absent');
  const blocks: string[] = [];
  const operations: number[] = [];
  for (const finding of fixable) {
    const block = findingBlock(finding, context.cwd);
    if (block.operation) operations.push(blocks.length);
    blocks.push(block.text);
  }
  const lastOperation = operations[operations.length - 1];
  // SPARQL 1.1 Update §3 (grammar [29] Update): operations in one request are separated by ';'.
  const body = blocks.map((text, index) => (operations.includes(index) && index !== lastOperation ? `${text} ;` : text));
  const header = [
    '# isapart fix script: a SPARQL 1.1 Update request that deletes statements.',
    '# CAUTION: running it changes your data, and isapart never runs it for you.',
    '#   1. Review every block below: each removes the statements a rule proposes to remove for one',
    '#      finding; delete the blocks you do not want.',
    '#   2. Run it against a copy of the graph first (a test store or a dump loaded elsewhere),',
    '#      lint the result, and only then run it against the real store, with a backup at hand.',
    '#   3. The statements are named in the graphs they were read from; a store that loaded the',
    '#      files into other named graphs needs the GRAPH clauses adjusted (WITH does not apply to DELETE DATA).',
    `# Findings with a fix: ${fixable.length}; operations: ${operations.length}.`,
  ];
  if (fixable.length === 0) header.push('# No finding has a fix to apply, so this request holds no operation.');
  return `${[header.join('\n'), ...body].join('\n\n')}\n`;
}

/** One finding's comment and DELETE DATA operation, or its comment and why there is none. */
function findingBlock(finding: Finding, cwd: string): { text: string; operation: boolean } {
  const remove = finding.fix?.remove ?? [];
  const comment = [
    `# ${finding.ruleId} (${finding.level}): ${oneLine(finding.message)}`,
    `# focus: ${oneLine(finding.focus)}`,
    ...remove.map((statement) => `# removes the statement at ${place(statement, cwd)}`),
  ];
  const unwritable = remove.filter((statement) => statementTerms(statement).some((term) => !writable(term)));
  if (unwritable.length > 0) {
    const reason = unwritable.some((statement) => statementTerms(statement).some((term) => typeof term === 'string' && term.startsWith('_:')))
      ? 'it names a blank node, which DELETE DATA cannot name (SPARQL 1.1 Update); edit the file, or write a DELETE ... WHERE that matches that one node (review it: a variable matches every node that fits)'
      : 'it holds a term that SPARQL cannot write as it is; edit the file instead';
    comment.push(`# No operation for this finding: ${unwritable.length === 1 ? 'a statement' : `${unwritable.length} statements`} cannot be deleted here, as ${reason}.`);
    return { text: comment.join('\n'), operation: false };
  }
  return { text: `${comment.join('\n')}\nDELETE DATA {\n${quadData(remove)}}`, operation: true };
}

/** The triples of the default graph, then a GRAPH block per named graph, in first-seen order. */
function quadData(statements: Statement[]): string {
  const byGraph = new Map<string, Statement[]>();
  for (const statement of statements) {
    const same = byGraph.get(statement.graph);
    if (same === undefined) byGraph.set(statement.graph, [statement]);
    else same.push(statement);
  }
  let text = '';
  for (const statement of byGraph.get('') ?? []) text += `  ${triple(statement)}\n`;
  for (const [graph, inGraph] of byGraph) {
    if (graph === '') continue;
    text += `  GRAPH ${iri(graph)} {\n${inGraph.map((statement) => `    ${triple(statement)}\n`).join('')}  }\n`;
  }
  return text;
}

function triple(statement: Statement): string {
  return `${iri(statement.subject)} ${iri(statement.predicate)} ${term(statement.object)} .`;
}

function term(value: string | Literal): string {
  return typeof value === 'string' ? iri(value) : literal(value);
}

function iri(value: string): string {
  return `<${value}>`;
}

/** A literal as SPARQL writes it: quoted and escaped, with its language tag or its datatype (none for xsd:string). */
function literal(value: Literal): string {
  const quoted = `"${value.value.replace(/["\\\n\r\t\b\f]/g, (character) => STRING_ESCAPES[character])}"`;
  if (value.language !== '') return `${quoted}@${value.language}`;
  if (value.datatype === '' || value.datatype === XSD_STRING) return quoted;
  return `${quoted}^^${iri(value.datatype)}`;
}

function statementTerms(statement: Statement): (string | Literal)[] {
  return statement.graph === '' ? [statement.subject, statement.predicate, statement.object] : [statement.subject, statement.predicate, statement.object, statement.graph];
}

/** Whether a term can be written in DELETE DATA: an IRI that IRIREF admits, or a literal with a valid tag or datatype. */
function writable(value: string | Literal): boolean {
  if (typeof value === 'string') return !value.startsWith('_:') && IRI_REF_CHARACTERS.test(value);
  if (value.language !== '') return LANGUAGE_TAG.test(value.language);
  return value.datatype === '' || value.datatype === RDF_LANG_STRING || IRI_REF_CHARACTERS.test(value.datatype);
}

function place(statement: Statement, cwd: string): string {
  return `${relativePath(statement.position.file, cwd)}:${statement.position.line}:${statement.position.column}`;
}

/** A text on one comment line: line breaks would end the comment. */
function oneLine(text: string): string {
  return text.replace(/[\r\n]+/g, ' ');
}
