// Shared helpers for reading a rule file's YAML nodes: positions, typed values and errors with hints.
import { isScalar, isSeq, type LineCounter, type Node } from 'yaml';
import { suggestionHint } from '../config/nearest.js';
import type { InputError } from '../load/statement.js';

/** Variables as written in rules: `?` and a name of letters, digits and underscores. */
export const VARIABLE_PATTERN = /^\?[A-Za-z_][A-Za-z0-9_]*$/;

/** Collects errors for one rule file, each with its 1-based line and column and a hint. */
export class RuleFileReader {
  readonly errors: InputError[] = [];

  constructor(
    readonly file: string,
    private readonly lineCounter: LineCounter,
  ) {}

  /** The 1-based line and column of a source offset. */
  position(offset: number): { line: number; column: number } {
    const { line, col } = this.lineCounter.linePos(offset);
    return { line, column: col };
  }

  /** Records an error at a node (or at the start of the file), `within` characters into the node's text. */
  error(node: Node | null | undefined, message: string, hint: string, within = 0): void {
    this.errorAt(nodeOffset(node) + within, message, hint);
  }

  /** Records an error at a source offset. */
  errorAt(offset: number, message: string, hint: string): void {
    const { line, column } = this.position(offset);
    this.errors.push({ file: this.file, line, column, message, hint });
  }

  /** Records an error for a name that is not one of the known ones, suggesting the nearest. */
  unknownName(node: Node | null | undefined, what: string, name: string, known: readonly string[]): void {
    this.error(node, `unknown ${what} '${name}'`, suggestionHint(name, known, `${what}s`));
  }

  /** A string scalar's value, or an error saying what was expected. */
  string(node: Node | null | undefined, what: string, hint: string): string | undefined {
    if (isScalar(node) && typeof node.value === 'string') return node.value;
    this.error(node, `${what} must be text`, hint);
    return undefined;
  }

  /** A non-empty string scalar's value. */
  text(node: Node | null | undefined, what: string, hint: string): string | undefined {
    const value = this.string(node, what, hint);
    if (value !== undefined && value.trim() === '') {
      this.error(node, `${what} is empty`, hint);
      return undefined;
    }
    return value;
  }

  /** A variable such as `?a`. */
  variable(node: Node | null | undefined, where: string): string | undefined {
    const value = isScalar(node) && typeof node.value === 'string' ? node.value : undefined;
    if (value !== undefined && VARIABLE_PATTERN.test(value)) return value;
    const shown = value ?? (isScalar(node) ? String(node.value) : 'this');
    this.error(node, `${where}: '${shown}' is not a variable`, 'write a variable as ? and a name, e.g. ?a or ?class');
    return undefined;
  }

  /** The items of a sequence, or an error. */
  sequence(node: Node | null | undefined, what: string, hint: string): (Node | null)[] | undefined {
    if (isSeq(node)) return node.items as (Node | null)[];
    this.error(node, `${what} must be a list`, hint);
    return undefined;
  }
}

/** The source offset where a node's text starts (0 for a missing node). */
export function nodeOffset(node: Node | null | undefined): number {
  return node?.range?.[0] ?? 0;
}

/** How many characters before a scalar's value starts (the opening quote of a quoted scalar). */
export function valueStart(node: Node | null | undefined): number {
  return isScalar(node) && (node.type === 'QUOTE_DOUBLE' || node.type === 'QUOTE_SINGLE') ? 1 : 0;
}
