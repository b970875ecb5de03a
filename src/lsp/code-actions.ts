// Quick fixes for a finding: remove the statement where the rule's fix says so, or allow the finding with a comment.
import { CodeActionKind, type CodeAction, type Diagnostic, type Range, type TextEdit } from 'vscode-languageserver';
import type { Finding } from '../engine/finding.js';
import { UNUSED_ALLOW_RULE } from '../engine/suppress.js';
import { removableLines } from '../fix/text-removal.js';
import type { RdfFormat, Statement } from '../load/statement.js';
import { createTermWriter } from '../report/statement-text.js';
import type { DocumentText } from './document-text.js';

/** What the code actions need to know about the files: their text, format, base IRI and URI. */
export interface ActionFiles {
  textOf(file: string): DocumentText | undefined;
  formatOf(file: string): RdfFormat | undefined;
  baseIriOf(file: string): string;
  uriOf(file: string): string;
}

/** Edits per document URI, as `WorkspaceEdit.changes` holds them. */
export type EditsByUri = Record<string, TextEdit[]>;

/** A quick fix before it is bound to the client's form of workspace edit. */
export interface QuickFix {
  title: string;
  edits: EditsByUri;
  preferred: boolean;
}

/**
 * The quick fixes of one finding as seen from `file` (the document its diagnostic is in):
 * removing each statement the rule's `fix.remove` names, when its lines hold it alone; an
 * `# isapart-allow RULE-ID: ` comment on its own line above the finding's statement in this file,
 * for the user to give the reason; and for an unused allow comment, removing the comment.
 */
export function quickFixes(finding: Finding, file: string, files: ActionFiles, prefixes: Record<string, string>): QuickFix[] {
  if (finding.ruleId === UNUSED_ALLOW_RULE.id) return unusedAllowFixes(finding, files);
  const fixes: QuickFix[] = [];
  const writer = createTermWriter(prefixes);
  for (const statement of finding.fix?.remove ?? []) {
    const edit = removalEdit(statement, files);
    if (edit === undefined) continue;
    fixes.push({
      title: `Remove the statement ${writer.statement(statement)}`,
      edits: { [files.uriOf(statement.position.file)]: [edit] },
      preferred: (finding.fix?.remove.length ?? 0) === 1,
    });
  }
  const anchor = finding.evidence.find((statement) => statement.position.file === file);
  const text = files.textOf(file);
  if (anchor !== undefined && text !== undefined) {
    // An allow comment alone on a line applies to the line below: the line of the statement's object.
    const line = Math.max(0, anchor.objectLine - 1);
    const indent = /^[ \t]*/.exec(text.lineText(line))?.[0] ?? '';
    fixes.push({
      title: `Allow ${finding.ruleId} here with an isapart-allow comment (then write the reason)`,
      edits: { [files.uriOf(file)]: [{ range: emptyRange(line, 0), newText: `${indent}# isapart-allow ${finding.ruleId}: \n` }] },
      preferred: false,
    });
  }
  return fixes;
}

/** The edit deleting a statement's whole lines, when the core says they hold it alone. */
function removalEdit(statement: Statement, files: ActionFiles): TextEdit | undefined {
  const file = statement.position.file;
  const text = files.textOf(file);
  const format = files.formatOf(file);
  if (text === undefined || format === undefined) return undefined;
  const removal = removableLines(statement, text.text, format, { baseIri: files.baseIriOf(file) });
  if (removal === undefined) return undefined;
  // Through the start of the line after the last one, so the line break goes too (to the text's end on the last line).
  const end = removal.lastLine < text.lineCount ? { line: removal.lastLine, character: 0 } : { line: removal.lastLine - 1, character: text.lineText(removal.lastLine - 1).length };
  return { range: { start: { line: removal.firstLine - 1, character: 0 }, end }, newText: '' };
}

/** Removing an allow comment that suppresses nothing: its line when it stands alone, else from its `#` on. */
function unusedAllowFixes(finding: Finding, files: ActionFiles): QuickFix[] {
  const location = finding.location;
  if (location === undefined || location.line < 1) return [];
  const text = files.textOf(location.file);
  if (text === undefined) return [];
  const line = location.line - 1;
  const lineText = text.lineText(line);
  const hash = location.column - 1;
  if (lineText[hash] !== '#') return [];
  const before = lineText.slice(0, hash);
  const range: Range = /^[ \t]*$/.test(before)
    ? line + 1 < text.lineCount
      ? { start: { line, character: 0 }, end: { line: line + 1, character: 0 } }
      : { start: { line, character: 0 }, end: { line, character: lineText.length } }
    : { start: { line, character: before.trimEnd().length }, end: { line, character: lineText.length } };
  return [{ title: 'Remove the unused isapart-allow comment', edits: { [files.uriOf(location.file)]: [{ range, newText: '' }] }, preferred: true }];
}

/** A quick fix as an LSP code action, tied to the diagnostic it answers. */
export function toCodeAction(fix: QuickFix, diagnostic: Diagnostic, documentVersions: (uri: string) => number | null, versioned: boolean): CodeAction {
  const edit = versioned
    ? {
        documentChanges: Object.entries(fix.edits).map(([uri, edits]) => ({ textDocument: { uri, version: documentVersions(uri) }, edits })),
      }
    : { changes: fix.edits };
  return { title: fix.title, kind: CodeActionKind.QuickFix, diagnostics: [diagnostic], isPreferred: fix.preferred, edit };
}

function emptyRange(line: number, character: number): Range {
  return { start: { line, character }, end: { line, character } };
}
