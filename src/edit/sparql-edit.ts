// Reading an --edit file: a SPARQL 1.1 Update (W3C SPARQL 1.1 Update) parsed by sparqljs, each operation placed at its line, refused where it cannot be evaluated here.
import sparqljs, { type Pattern, type Quads, type Triple, type Update, type UpdateOperation } from 'sparqljs';
import { readAllowComment } from '../load/allow-comments.js';
import type { AllowComment, InputError } from '../load/statement.js';
import { readUpdateText, type PlacedTriple, type TemplateTerm, type WrittenOperation } from './update-text.js';
import { tokenize } from './sparql-tokens.js';
import { unsupportedFeature, type WhereDataset } from './where-pattern.js';

/** One operation of an edit: where it is written, its triples with their lines, and what the WHERE reads. */
export interface EditOperation {
  written: WrittenOperation;
  /** The WHERE pattern (for DELETE WHERE, its quad pattern); empty for INSERT DATA and DELETE DATA. */
  where: Pattern[];
  /** The dataset the WHERE reads. */
  dataset: WhereDataset;
  /** The graph WITH names: where template triples outside GRAPH go (default '' for the default graph). */
  withGraph: string;
}

/** A parsed edit, ready to apply to loaded statements. */
export interface SparqlEdit {
  file: string;
  operations: EditOperation[];
  /** `# isapart-allow RULE-ID: reason` comments of the edit, for the findings of its own statements. */
  allowComments: AllowComment[];
}

const EDIT_HINT = 'the edit is a SPARQL 1.1 Update: operations such as INSERT DATA { … }, DELETE DATA { … } or DELETE { … } INSERT { … } WHERE { … }, separated by ;';

/**
 * Parses the edit text and checks every operation before any data is read: a syntax error, an
 * operation that manages graphs (LOAD, CLEAR, …), or a WHERE this linter cannot evaluate exactly
 * is an error with the edit file, the operation's line and a hint.
 */
export function readSparqlEdit(file: string, text: string, options: { baseIri: string; keptPredicates: ReadonlySet<string> }): SparqlEdit | { error: InputError } {
  let parsed: Update;
  try {
    const query = new sparqljs.Parser({ baseIRI: options.baseIri }).parse(text);
    // sparqljs 3.7.4 reads a text of only comments and prologue as an object without a type: an update of no operations.
    if ((query as { type?: string }).type === undefined) {
      return { file, operations: [], allowComments: [] };
    }
    if (query.type !== 'update') {
      return { error: { file, line: 1, column: 1, message: `${file} is a SPARQL ${query.queryType} query, not an update`, hint: EDIT_HINT } };
    }
    parsed = query;
  } catch (error) {
    return { error: syntaxError(file, text, error, options.baseIri) };
  }
  const ambiguous = ambiguousTerm(file, text);
  if (ambiguous !== undefined) return { error: ambiguous };
  const written = readUpdateText(text, options.baseIri);
  if ('error' in written) return { error: { file, ...written.error, message: `the edit could not be read: ${written.error.message}`, hint: EDIT_HINT } };
  if (written.operations.length !== parsed.updates.length) {
    return { error: { file, line: 1, column: 1, message: `isapart read ${written.operations.length} operations where sparqljs read ${parsed.updates.length}, so it cannot place the edit's statements at their lines`, hint: 'please report this edit file as a bug in isapart' } };
  }
  const shared = sharedBlankNode(file, written.operations);
  if (shared !== undefined) return { error: shared };
  const operations: EditOperation[] = [];
  for (const [index, update] of parsed.updates.entries()) {
    const operation = checkedOperation(file, written.operations[index], update, options.keptPredicates);
    if ('error' in operation) return operation;
    operations.push(operation);
  }
  const allowComments: AllowComment[] = [];
  for (const comment of tokenize(text).comments) {
    const reading = readAllowComment(comment.text, { file, line: comment.line, column: comment.column, ownLine: comment.ownLine });
    if (reading.kind === 'malformed') return { error: reading.error };
    if (reading.kind === 'allow') allowComments.push(reading.comment);
  }
  return { file, operations, allowComments };
}

/**
 * A term sparqljs 3.7.4 reads otherwise than the standards, as an error at its place: a prefixed
 * name with a backslash escape (kept in the IRI; SPARQL 1.1 §19.8 PN_LOCAL_ESC drops it), and a
 * relative IRI with `.` or `..` segments (not removed; RFC 3986 §5.2.4 removes them).
 */
function ambiguousTerm(file: string, text: string): InputError | undefined {
  for (const token of tokenize(text).tokens) {
    if (token.kind === 'pname' && token.text.includes('\\')) {
      return {
        file,
        line: token.line,
        column: token.column,
        message: `the prefixed name ${token.text} has a backslash escape, which sparqljs keeps in the IRI and the SPARQL 1.1 grammar (§19.8) drops, so isapart cannot tell which IRI is meant`,
        hint: 'write the IRI in full between < and >',
      };
    }
    if (token.kind === 'iri' && !/^<[A-Za-z][A-Za-z0-9+.-]*:/.test(token.text) && /(^<|\/)\.\.?(\/|[?#]|>$)/.test(token.text)) {
      return {
        file,
        line: token.line,
        column: token.column,
        message: `the relative IRI ${token.text} has . or .. segments, which sparqljs resolves against BASE without removing them (RFC 3986 §5.2.4 removes them), so isapart cannot tell which IRI is meant`,
        hint: 'write the IRI in full, or relative to BASE without ./ and ../',
      };
    }
  }
  return undefined;
}

/** A blank node label written in two operations, as an error at its second use (SPARQL 1.1 Query §19.6 scopes a label to one block). */
function sharedBlankNode(file: string, operations: WrittenOperation[]): InputError | undefined {
  const firstLine = new Map<string, { operation: number; line: number }>();
  for (const [index, operation] of operations.entries()) {
    for (const triple of [...operation.insert, ...operation.delete]) {
      for (const term of [triple.subject, triple.object]) {
        if (term.kind !== 'blank' || term.label.startsWith('-')) continue;
        const earlier = firstLine.get(term.label);
        if (earlier === undefined) firstLine.set(term.label, { operation: index, line: triple.line });
        else if (earlier.operation !== index) {
          return {
            file,
            line: triple.line,
            column: triple.column,
            message: `the blank node _:${term.label} is also used by the operation on line ${operations[earlier.operation].line}; a blank node label belongs to one operation (SPARQL 1.1 Query §19.6), so the two would be different nodes`,
            hint: 'give the node an IRI, or state all its statements in one INSERT DATA',
          };
        }
      }
    }
  }
  return undefined;
}

function checkedOperation(file: string, written: WrittenOperation, update: UpdateOperation, keptPredicates: ReadonlySet<string>): EditOperation | { error: InputError } {
  const refuse = (message: string, hint: string) => ({ error: { file, line: written.line, column: written.column, message, hint } });
  if ('type' in update) {
    return refuse(
      `${written.name} (line ${written.line}) is not evaluated: isapart lints an edit as the statements it adds and removes, and ${written.name} works on whole graphs`,
      'state the statements instead: INSERT DATA / DELETE DATA, or give them as --add FILE / --remove FILE',
    );
  }
  const mismatch = templateMismatch(written, update);
  if (mismatch) {
    return refuse(`isapart and sparqljs read the triples of ${written.name} (line ${written.line}) differently, so their lines cannot be given`, 'please report this edit file as a bug in isapart');
  }
  const where = update.updateType === 'insertdelete' ? update.where : update.updateType === 'deletewhere' ? update.delete.map(quadsAsPattern) : [];
  const unsupported = unsupportedFeature(where, keptPredicates);
  if (unsupported !== undefined) return refuse(`${written.name} (line ${written.line}) reads ${unsupported.reason}, which isapart does not evaluate`, unsupported.hint);
  const withGraph = update.updateType === 'insertdelete' ? (update.graph?.value ?? '') : '';
  const using = update.updateType === 'insertdelete' ? update.using : undefined;
  const usingAny = using !== undefined && (using.default.length > 0 || using.named.length > 0);
  // SPARQL 1.1 Update §3.1.3: USING (and USING NAMED) replace the dataset, and WITH then names only the templates' graph.
  const dataset: WhereDataset = usingAny
    ? { defaultGraphs: using.default.map((iri) => iri.value), namedGraphs: new Set(using.named.map((iri) => iri.value)) }
    : { defaultGraphs: [withGraph] };
  return { written, where, dataset, withGraph };
}

function quadsAsPattern(quads: Quads): Pattern {
  return quads.type === 'bgp' ? quads : { type: 'graph', name: quads.name, patterns: [{ type: 'bgp', triples: quads.triples }] };
}

/** Whether the triples this reader placed differ from sparqljs's (blank node labels aside), as a guard against misplaced lines. */
function templateMismatch(written: WrittenOperation, update: Exclude<UpdateOperation, { type: string }>): boolean {
  const theirs = (quads: Quads[] | undefined) =>
    (quads ?? []).flatMap((block) => block.triples.map((triple) => skeletonOfParsed(triple, block.type === 'graph' ? block.name : undefined))).sort();
  const ours = (triples: PlacedTriple[]) => triples.map(skeletonOfPlaced).sort();
  const insert = 'insert' in update ? update.insert : [];
  const remove = 'delete' in update ? update.delete : [];
  return ours(written.insert).join('\n') !== theirs(insert).join('\n') || ours(written.delete).join('\n') !== theirs(remove).join('\n');
}

function skeletonOfPlaced(triple: PlacedTriple): string {
  const term = (value: TemplateTerm | undefined): string => {
    if (value === undefined) return 'D';
    if (value.kind === 'iri') return `I${value.value}`;
    if (value.kind === 'blank') return 'B';
    if (value.kind === 'variable') return `V${value.name}`;
    return `L${value.literal.value}\u0000${value.literal.datatype}\u0000${value.literal.language}`;
  };
  return [triple.subject, triple.predicate, triple.object, triple.graph].map(term).join('\u0001');
}

function skeletonOfParsed(triple: Triple, graph: Triple['subject'] | undefined): string {
  const term = (value: unknown): string => {
    if (value === undefined) return 'D';
    const rdf = value as { termType?: string; value: string; datatype?: { value: string }; language?: string };
    if (rdf.termType === 'NamedNode') return `I${rdf.value}`;
    if (rdf.termType === 'BlankNode') return 'B';
    if (rdf.termType === 'Variable') return `V${rdf.value}`;
    if (rdf.termType === 'Literal') return `L${rdf.value}\u0000${rdf.datatype?.value ?? ''}\u0000${rdf.language ?? ''}`;
    return `?${JSON.stringify(value)}`;
  };
  return [triple.subject, triple.predicate, triple.object, graph].map(term).join('\u0001');
}

/**
 * A sparqljs error as an input error at its line. sparqljs's parser gives the place of the last
 * token it read, so the error is put at the token after it; errors it raises without a place
 * (an unknown prefix, a blank node in DELETE DATA) are put at the operation that raises them.
 */
function syntaxError(file: string, text: string, error: unknown, baseIri: string): InputError {
  const message = error instanceof Error ? error.message : String(error);
  const firstLine = message.split('\n')[0];
  const expecting = /Expecting (.*), got (.*)$/m.exec(message);
  const detail = expecting ? `expected ${expecting[1]}, found ${expecting[2]}` : firstLine;
  const loc = (error as { hash?: { loc?: { first_line: number; first_column: number; last_column: number } } }).hash?.loc;
  const { tokens } = tokenize(text);
  if (loc !== undefined) {
    const after = tokens.find((token) => token.line > loc.first_line || (token.line === loc.first_line && token.column > loc.first_column + 1));
    const place = after ?? tokens[tokens.length - 1] ?? { line: loc.first_line, column: loc.first_column + 1 };
    // sparqljs names the token's grammar symbol (PNAME_LN); the text as written is what the reader knows.
    const found = after === undefined ? 'the end of the update' : after.text;
    const expected = expecting ? `expected ${expecting[1]}, found ${found}` : detail;
    return { file, line: place.line, column: place.column, message: `SPARQL Update syntax error: ${expected}`, hint: EDIT_HINT };
  }
  const place = failingOperation(text, tokens, baseIri);
  return { file, line: place.line, column: place.column, message: `SPARQL Update error: ${detail}`, hint: EDIT_HINT };
}

/** The start of the first operation that sparqljs rejects when the update is cut after it. */
function failingOperation(text: string, tokens: ReturnType<typeof tokenize>['tokens'], baseIri: string): { line: number; column: number } {
  let depth = 0;
  let start = tokens[0] ?? { line: 1, column: 1, offset: 0 };
  for (const [index, token] of tokens.entries()) {
    if (token.kind !== 'punct') continue;
    if ('{(['.includes(token.text)) depth += 1;
    else if ('})]'.includes(token.text)) depth -= 1;
    else if (token.text === ';' && depth === 0) {
      try {
        new sparqljs.Parser({ baseIRI: baseIri }).parse(text.slice(0, token.offset));
      } catch {
        return start;
      }
      start = tokens[index + 1] ?? start;
    }
  }
  return start;
}
