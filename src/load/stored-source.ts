// Putting a source's statements into the run's StatementStore as they are parsed, keeping only the predicates the run needs.
import type * as RDF from '@rdfjs/types';
import type { LoadedSource } from './statement.js';
import { DEFAULT_GRAPH, type StatementStore } from './statement-store.js';
import { literalOf, termText, type StatementSink } from './statement-sink.js';

/**
 * A sink that stores each statement whose predicate is in `keep` (all when undefined) as a row of
 * the store, the moment the parser gives it, and counts the others; no Statement object is made.
 * Opening it opens the source's file in the store, so its rows follow.
 */
export class StoringSink implements StatementSink {
  private readonly start: number;
  private count = 0;
  private unkept = 0;
  private lastSubject: RDF.Term | undefined;
  private lastSubjectNumber = -1;

  constructor(
    private readonly store: StatementStore,
    private readonly keep: ReadonlySet<string> | undefined,
    file: string,
  ) {
    store.file(file);
    this.start = store.size;
  }

  add(quad: RDF.BaseQuad, line: number, column: number, objectLine: number): void {
    const { store } = this;
    const predicate = quad.predicate.value;
    this.count++;
    if (this.keep !== undefined && !this.keep.has(predicate)) {
      this.unkept++;
      if (quad.subject.termType === 'BlankNode') store.unkeptBlankSubjects.add(store.term(termText(quad.subject)));
      return;
    }
    const { subject, object, graph } = quad;
    // n3 hands the same subject term again for each statement of a `;` list, so its number is remembered.
    if (subject !== this.lastSubject) {
      this.lastSubject = subject;
      this.lastSubjectNumber = store.term(termText(subject));
    }
    store.addRow({
      subject: this.lastSubjectNumber,
      predicate: store.predicate(predicate),
      object: object.termType === 'Literal' ? store.literal(literalOf(object as RDF.Literal)) : store.term(termText(object)),
      graph: graph.termType === 'DefaultGraph' ? DEFAULT_GRAPH : store.term(termText(graph)),
      line,
      column,
      objectLine,
    });
  }

  /** The parsed source with its counts and store rows; its statements are read back from the store when asked for. */
  stored(parsed: LoadedSource): LoadedSource {
    const { store, start } = this;
    const end = store.size;
    const source: LoadedSource = {
      ...parsed,
      statementCount: this.count,
      unkeptStatements: this.unkept,
      rows: { store, start, end },
    };
    Object.defineProperty(source, 'statements', { get: () => store.statementsOf(start, end), enumerable: true });
    return source;
  }
}
