// Parser for SPARQL 1.1 property path syntax over role names, with errors that point at a column.
import { suggestionHint } from '../config/nearest.js';
import { ROLES, type Role } from '../roles/role.js';

/** A parsed property path (SPARQL 1.1 Query §9.1), over role names instead of IRIs. */
export type PathExpression =
  | { type: 'role'; role: Role }
  | { type: 'inverse'; path: PathExpression }
  | { type: 'sequence'; steps: PathExpression[] }
  | { type: 'alternative'; options: PathExpression[] }
  | { type: 'modified'; modifier: PathModifier; path: PathExpression };

/** The path modifiers: zero or one, zero or more, one or more. */
export type PathModifier = '?' | '*' | '+';

/** A path syntax error: the 0-based offset of the offending character in the path text. */
export interface PathSyntaxError {
  offset: number;
  message: string;
  hint: string;
}

/** The result of parsing a path: the expression, or the first syntax error. */
export type PathParseResult = { ok: true; path: PathExpression } | { ok: false; error: PathSyntaxError };

const ROLE_NAME_START = /[a-z]/;
const ROLE_NAME_PART = /[a-z0-9-]/;

class PathSyntaxFailure extends Error {
  constructor(
    readonly offset: number,
    message: string,
    readonly hint: string,
  ) {
    super(message);
  }
}

/** Recursive-descent parser; recursion depth follows the nesting of the text, never the graph. */
class PathParser {
  private position = 0;

  constructor(private readonly text: string) {}

  parse(): PathExpression {
    this.skipSpace();
    if (this.position >= this.text.length) {
      throw new PathSyntaxFailure(0, 'empty path', 'write a role name such as subclass-of');
    }
    const path = this.alternative();
    this.skipSpace();
    if (this.position < this.text.length) {
      const character = this.text[this.position];
      const hint =
        character === ')'
          ? 'this parenthesis closes nothing; remove it'
          : 'join steps with / (sequence) or | (alternative)';
      throw new PathSyntaxFailure(this.position, `unexpected '${character}'`, hint);
    }
    return path;
  }

  // PathAlternative ::= PathSequence ( '|' PathSequence )*
  private alternative(): PathExpression {
    const options = [this.sequence()];
    while (this.accept('|')) options.push(this.sequence());
    return options.length === 1 ? options[0] : { type: 'alternative', options };
  }

  // PathSequence ::= PathEltOrInverse ( '/' PathEltOrInverse )*
  private sequence(): PathExpression {
    const steps = [this.elementOrInverse()];
    while (this.accept('/')) steps.push(this.elementOrInverse());
    return steps.length === 1 ? steps[0] : { type: 'sequence', steps };
  }

  // PathEltOrInverse ::= PathElt | '^' PathElt
  private elementOrInverse(): PathExpression {
    if (this.accept('^')) return { type: 'inverse', path: this.element() };
    return this.element();
  }

  // PathElt ::= PathPrimary PathMod?
  private element(): PathExpression {
    const primary = this.primary();
    this.skipSpace();
    const character = this.text[this.position];
    if (character !== '?' && character !== '*' && character !== '+') return primary;
    this.position++;
    this.skipSpace();
    const next = this.text[this.position];
    if (next === '?' || next === '*' || next === '+') {
      throw new PathSyntaxFailure(
        this.position,
        `a second modifier '${next}' after '${character}'`,
        'a path element takes one modifier; use parentheses, e.g. (subclass-of+)?',
      );
    }
    return { type: 'modified', modifier: character, path: primary };
  }

  // PathPrimary ::= role | '(' Path ')'
  private primary(): PathExpression {
    this.skipSpace();
    const start = this.position;
    const character = this.text[start];
    if (character === undefined) {
      throw new PathSyntaxFailure(start, 'the path ends where a role was expected', 'add a role name after the last operator');
    }
    if (character === '(') {
      this.position++;
      this.skipSpace();
      if (this.text[this.position] === ')') {
        throw new PathSyntaxFailure(this.position, 'empty parentheses', 'put a path inside the parentheses');
      }
      const inner = this.alternative();
      if (!this.accept(')')) {
        throw new PathSyntaxFailure(this.position, `the parenthesis at column ${start + 1} is not closed`, "add ')'");
      }
      return inner;
    }
    if (character === '^') {
      throw new PathSyntaxFailure(start, "'^' cannot follow '^' directly", 'write ^(^path) or drop both');
    }
    if (character === '!') {
      throw new PathSyntaxFailure(start, 'negated property sets are not supported', 'list the roles wanted with |');
    }
    if (!ROLE_NAME_START.test(character)) {
      throw new PathSyntaxFailure(start, `unexpected '${character}' where a role was expected`, `roles: ${ROLES.join(', ')}`);
    }
    while (this.position < this.text.length && ROLE_NAME_PART.test(this.text[this.position])) this.position++;
    const name = this.text.slice(start, this.position);
    const role = ROLES.find((known) => known === name);
    if (role === undefined) {
      throw new PathSyntaxFailure(start, `unknown role '${name}'`, suggestionHint(name, ROLES, 'roles'));
    }
    return { type: 'role', role };
  }

  private accept(character: string): boolean {
    this.skipSpace();
    if (this.text[this.position] !== character) return false;
    this.position++;
    return true;
  }

  private skipSpace(): void {
    while (this.position < this.text.length && /\s/.test(this.text[this.position])) this.position++;
  }
}

/** Parses a property path written with role names (SPARQL 1.1 Query §9.1 grammar, rules [88]–[96]). */
export function parsePath(text: string): PathParseResult {
  try {
    return { ok: true, path: new PathParser(text).parse() };
  } catch (error) {
    if (error instanceof PathSyntaxFailure) {
      return { ok: false, error: { offset: error.offset, message: error.message, hint: error.hint } };
    }
    throw error;
  }
}

/** Parses a path that is known to be valid (checked by the rule file validator); throws otherwise. */
export function parseValidPath(text: string): PathExpression {
  const result = parsePath(text);
  if (!result.ok) throw new Error(`invalid path '${text}' at column ${result.error.offset + 1}: ${result.error.message}`);
  return result.path;
}

/** Writes a path back in the syntax it was parsed from, fully parenthesised where precedence needs it. */
export function formatPath(path: PathExpression): string {
  switch (path.type) {
    case 'role':
      return path.role;
    case 'inverse':
      return `^${formatOperand(path.path)}`;
    case 'modified':
      return `${formatOperand(path.path)}${path.modifier}`;
    case 'sequence':
      return path.steps.map((step) => (step.type === 'alternative' ? `(${formatPath(step)})` : formatPath(step))).join('/');
    case 'alternative':
      return path.options.map(formatPath).join('|');
  }
}

function formatOperand(path: PathExpression): string {
  return path.type === 'role' ? path.role : `(${formatPath(path)})`;
}

/** Whether the path can match a walk of zero edges (so every node reaches itself). */
export function matchesEmpty(path: PathExpression): boolean {
  switch (path.type) {
    case 'role':
      return false;
    case 'inverse':
      return matchesEmpty(path.path);
    case 'modified':
      return path.modifier !== '+' || matchesEmpty(path.path);
    case 'sequence':
      return path.steps.every(matchesEmpty);
    case 'alternative':
      return path.options.some(matchesEmpty);
  }
}

/** The same path with `^` pushed down to the roles: ^(a/b) = ^b/^a, ^(a|b) = ^a|^b, ^(p*) = (^p)*. */
export function invertPath(path: PathExpression): PathExpression {
  switch (path.type) {
    case 'role':
      return { type: 'inverse', path };
    case 'inverse':
      return path.path;
    case 'modified':
      return { type: 'modified', modifier: path.modifier, path: invertPath(path.path) };
    case 'sequence':
      return { type: 'sequence', steps: path.steps.map(invertPath).reverse() };
    case 'alternative':
      return { type: 'alternative', options: path.options.map(invertPath) };
  }
}
