// The property path parser: SPARQL 1.1 precedence over role names, and errors that point at a column.
import { describe, expect, it } from 'vitest';
import { formatPath, invertPath, matchesEmpty, parsePath, type PathExpression } from '../../src/engine/path.js';

function parsed(text: string): PathExpression {
  const result = parsePath(text);
  if (!result.ok) throw new Error(`expected '${text}' to parse: ${result.error.message}`);
  return result.path;
}

function failure(text: string) {
  const result = parsePath(text);
  if (result.ok) throw new Error(`expected '${text}' to fail`);
  return result.error;
}

const role = (name: 'instance-of' | 'subclass-of' | 'part-of' | 'disjoint-with' | 'equivalent-to'): PathExpression => ({ type: 'role', role: name });

describe('parsePath precedence (SPARQL 1.1 Query §9.1, grammar rules [88]–[96])', () => {
  it('binds | looser than /', () => {
    // PathAlternative ::= PathSequence ('|' PathSequence)*, so a/b|c is (a/b)|c.
    expect(parsed('part-of/subclass-of|instance-of')).toEqual({
      type: 'alternative',
      options: [{ type: 'sequence', steps: [role('part-of'), role('subclass-of')] }, role('instance-of')],
    });
  });

  it('binds / looser than ^ and ^ looser than the modifier', () => {
    // PathEltOrInverse ::= PathElt | '^' PathElt and PathElt ::= PathPrimary PathMod?, so ^a+ is ^(a+).
    expect(parsed('^part-of+/subclass-of')).toEqual({
      type: 'sequence',
      steps: [{ type: 'inverse', path: { type: 'modified', modifier: '+', path: role('part-of') } }, role('subclass-of')],
    });
  });

  it('reads the design example subclass-of+|instance-of/subclass-of*', () => {
    expect(parsed('subclass-of+|instance-of/subclass-of*')).toEqual({
      type: 'alternative',
      options: [
        { type: 'modified', modifier: '+', path: role('subclass-of') },
        { type: 'sequence', steps: [role('instance-of'), { type: 'modified', modifier: '*', path: role('subclass-of') }] },
      ],
    });
  });

  it('lets parentheses override precedence and allows spaces between tokens', () => {
    expect(parsed('( part-of | subclass-of ) +')).toEqual({
      type: 'modified',
      modifier: '+',
      path: { type: 'alternative', options: [role('part-of'), role('subclass-of')] },
    });
    expect(parsed('^(^part-of)')).toEqual({ type: 'inverse', path: { type: 'inverse', path: role('part-of') } });
  });

  it('writes paths back so that they parse to the same text again', () => {
    for (const text of ['subclass-of+|instance-of/subclass-of*', '^(part-of|subclass-of)?', '(^part-of)*/equivalent-to', '(subclass-of/part-of)+']) {
      const once = formatPath(parsed(text));
      expect(formatPath(parsed(once))).toBe(once);
    }
    expect(formatPath(parsed('( part-of )'))).toBe('part-of');
  });
});

describe('parsePath errors', () => {
  it('names an unknown role at its column with the nearest role', () => {
    const error = failure('subclass-of/part-off');
    expect(error.offset).toBe(12);
    expect(error.message).toContain("unknown role 'part-off'");
    expect(error.hint).toContain('did you mean `part-of`');
  });

  it('points at a dangling operator, an unclosed parenthesis, a double modifier and a stray character', () => {
    expect(failure('part-of/').offset).toBe(8);
    expect(failure('(part-of|subclass-of').offset).toBe(20);
    expect(failure('(part-of|subclass-of').message).toContain('column 1');
    expect(failure('part-of+*').offset).toBe(8);
    expect(failure('part-of subclass-of').offset).toBe(8);
    expect(failure('part-of)').hint).toContain('closes nothing');
    expect(failure('^^part-of').offset).toBe(1);
    expect(failure('').message).toBe('empty path');
    expect(failure('!part-of').message).toContain('negated property sets');
    expect(failure('()').offset).toBe(1);
  });
});

describe('path properties', () => {
  it('knows which paths match zero edges (SPARQL 1.1 Query §9.3: * and ? include the zero-length path)', () => {
    expect(matchesEmpty(parsed('subclass-of*'))).toBe(true);
    expect(matchesEmpty(parsed('part-of?/subclass-of*'))).toBe(true);
    expect(matchesEmpty(parsed('subclass-of+'))).toBe(false);
    expect(matchesEmpty(parsed('instance-of/subclass-of*'))).toBe(false);
    expect(matchesEmpty(parsed('(subclass-of*)+'))).toBe(true);
  });

  it('inverts a sequence by reversing and inverting its steps', () => {
    expect(formatPath(invertPath(parsed('instance-of/subclass-of*')))).toBe('(^subclass-of)*/^instance-of');
  });
});
