// Specification of edit distance and "did you mean" hints.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { nearestName, suggestionHint, typoDistance } from '../../src/config/nearest.js';

/** A plain full-matrix Levenshtein distance, the textbook recurrence (Wagner–Fischer), as a reference. */
function referenceDistance(left: string, right: string): number {
  const table = Array.from({ length: left.length + 1 }, (_, i) => Array.from({ length: right.length + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)));
  for (let i = 1; i <= left.length; i++) {
    for (let j = 1; j <= right.length; j++) {
      table[i][j] = Math.min(table[i - 1][j] + 1, table[i][j - 1] + 1, table[i - 1][j - 1] + (left[i - 1] === right[j - 1] ? 0 : 1));
    }
  }
  return table[left.length][right.length];
}

describe('typoDistance on strings without swaps', () => {
  // The classic example of Levenshtein distance: kitten -> sitting is 3 edits (from memory); no swap helps there.
  it('gives 3 for kitten and sitting', () => {
    expect(typoDistance('kitten', 'sitting')).toBe(3);
  });

  it('counts single insertions, deletions and substitutions', () => {
    expect(typoDistance('rule-dirs', 'rule-dir')).toBe(1);
    expect(typoDistance('rule_dirs', 'rule-dirs')).toBe(1);
    expect(typoDistance('', 'scope')).toBe(5);
    expect(typoDistance('roots', 'roots')).toBe(0);
  });
});

/**
 * The optimal string alignment distance by its textbook full-matrix recurrence (Levenshtein's three
 * cases plus d[i-2][j-2] + 1 when the last two characters are swapped), from memory, as a reference.
 */
function referenceTypoDistance(left: string, right: string): number {
  const table = Array.from({ length: left.length + 1 }, (_, i) => Array.from({ length: right.length + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)));
  for (let i = 1; i <= left.length; i++) {
    for (let j = 1; j <= right.length; j++) {
      table[i][j] = Math.min(table[i - 1][j] + 1, table[i][j - 1] + 1, table[i - 1][j - 1] + (left[i - 1] === right[j - 1] ? 0 : 1));
      if (i > 1 && j > 1 && left[i - 1] === right[j - 2] && left[i - 2] === right[j - 1]) table[i][j] = Math.min(table[i][j], table[i - 2][j - 2] + 1);
    }
  }
  return table[left.length][right.length];
}

describe('typoDistance', () => {
  it('counts a swap of two neighbouring characters as one edit', () => {
    expect(typoDistance('scpoe', 'scope')).toBe(1);
    expect(typoDistance('skso', 'skos')).toBe(1);
    expect(typoDistance('ca', 'ac')).toBe(1);
    expect(referenceDistance('scpoe', 'scope')).toBe(2);
  });

  // The textbook example of how the restricted (optimal string alignment) distance differs from
  // the unrestricted Damerau-Levenshtein one: CA to ABC is 3, not 2, since a swapped pair is not edited again (from memory).
  it('gives 3 for CA and ABC, editing no substring twice', () => {
    expect(typoDistance('CA', 'ABC')).toBe(3);
  });

  it('agrees with the full-matrix recurrence on random strings, and is never above the Levenshtein distance', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 12 }), fc.string({ maxLength: 12 }), (left, right) => {
        expect(typoDistance(left, right)).toBe(referenceTypoDistance(left, right));
        expect(typoDistance(left, right)).toBeLessThanOrEqual(referenceDistance(left, right));
      }),
    );
    // Small alphabets make swaps frequent, which random full-range strings rarely produce.
    fc.assert(
      fc.property(fc.string({ unit: fc.constantFrom('a', 'b', 'c'), maxLength: 9 }), fc.string({ unit: fc.constantFrom('a', 'b', 'c'), maxLength: 9 }), (left, right) => {
        expect(typoDistance(left, right)).toBe(referenceTypoDistance(left, right));
      }),
    );
  });
});

describe('nearestName and suggestionHint', () => {
  const keys = ['presets', 'roles', 'scope', 'roots', 'rules', 'rule-dirs', 'allow'];

  it('suggests the closest candidate for a likely typo, ignoring case', () => {
    expect(nearestName('rule_dirs', keys)).toBe('rule-dirs');
    expect(nearestName('Scope', keys)).toBe('scope');
    expect(nearestName('preset', keys)).toBe('presets');
  });

  it('suggests the intended name for swapped letters, which plain edit distance counts as two edits', () => {
    expect(nearestName('scpoe', keys)).toBe('scope');
    expect(nearestName('skso', ['rdfs', 'owl', 'dcterms', 'schema', 'obo', 'skos'])).toBe('skos');
    expect(nearestName('oprhan-class', ['orphan-class', 'part-cycle'])).toBe('orphan-class');
  });

  it('suggests nothing for a name far from every candidate', () => {
    expect(nearestName('baseline', keys)).toBeUndefined();
    expect(nearestName('x', [])).toBeUndefined();
  });

  it('words the hint with the suggestion and the known names', () => {
    expect(suggestionHint('alow', keys, 'keys')).toBe('did you mean `allow`? (known keys: presets, roles, scope, roots, rules, rule-dirs, allow)');
    expect(suggestionHint('zzzzzz', ['rdfs', 'owl'], 'presets')).toBe('known presets: rdfs, owl');
  });
});
