// An edit as statements to add and to remove, and the sources as they would read once it is applied.
import type { LoadedSource, Statement } from '../load/statement.js';

/** What an edit (a SPARQL Update, or --add/--remove files) would change, in statements. */
export interface EditDelta {
  /** The edit file as shown in reports; each statement's position points into it (or into an --add/--remove file). */
  file: string;
  /** Statements the edit adds, in edit order, without repeats. */
  added: Statement[];
  /** Statements the edit removes, in edit order, without repeats; a removal of a statement the data lacks is kept and changes nothing. */
  removed: Statement[];
  /** Statements of the edit not kept because no role reads their predicate; counted for the summary. */
  ignored: number;
}

/** The key two statements share when they state the same triple in the same graph. */
export function statementKey(statement: Pick<Statement, 'subject' | 'predicate' | 'object' | 'graph'>): string {
  const { object } = statement;
  const objectText = typeof object === 'string' ? `T${object}` : `L${object.value}\u0000${object.datatype}\u0000${object.language}`;
  return `${statement.subject}\u0000${statement.predicate}\u0000${objectText}\u0000${statement.graph}`;
}

/**
 * The sources with the edit applied as whole statements: every statement the edit removes is left
 * out wherever the data states it, and the added statements follow as one more source named after
 * the edit file. This rebuilds from statements; it is what an incremental evaluation must equal.
 */
export function editedSources(sources: readonly LoadedSource[], delta: EditDelta): LoadedSource[] {
  const removed = new Set(delta.removed.map(statementKey));
  const kept = sources.map((source): LoadedSource => {
    const statements = source.statements.filter((statement) => !removed.has(statementKey(statement)));
    const dropped = source.statements.length - statements.length;
    const statementCount = (source.statementCount ?? source.statements.length) - dropped;
    return { ...source, rows: undefined, statements, statementCount };
  });
  const added: LoadedSource = {
    file: delta.file,
    format: 'turtle',
    statements: [...delta.added],
    errors: [],
    allowComments: [],
    prefixes: {},
  };
  return [...kept, added];
}
