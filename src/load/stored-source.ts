// Moving a parsed source's statements into the run's StatementStore, keeping only the predicates the run needs.
import type { LoadedSource } from './statement.js';
import type { StatementStore } from './statement-store.js';

/**
 * Stores the statements of a source parsed as a whole (Turtle, TriG, or n3 on a whole file) whose
 * predicate is in `keep` (all when undefined), counts the others, and returns the source with its
 * statements read back from the store.
 */
export function storeSource(parsed: LoadedSource, store: StatementStore, keep: ReadonlySet<string> | undefined): LoadedSource {
  store.file(parsed.file);
  const start = store.size;
  let unkept = 0;
  for (const statement of parsed.statements) {
    if (keep === undefined || keep.has(statement.predicate)) {
      store.addStatement(statement);
    } else {
      unkept++;
      if (statement.subject.startsWith('_:')) store.unkeptBlankSubjects.add(store.term(statement.subject));
    }
  }
  const end = store.size;
  const source: LoadedSource = {
    ...parsed,
    statementCount: parsed.statements.length,
    unkeptStatements: unkept,
    rows: { store, start, end },
  };
  Object.defineProperty(source, 'statements', { get: () => store.statementsOf(start, end), enumerable: true });
  return source;
}
