// Push-down on 1,000 random small graphs: the oxigraph store gives exactly the in-memory findings.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { bothWays, comparable } from './sparql-harness.js';
import { graphs, randomRun } from './sparql-random-graphs.js';

describe('push-down on random graphs', () => {
  const rules = loadBuiltinRules().rules;

  it('gives the in-memory findings of every built-in rule on 1,000 graphs', { timeout: 600_000 }, () => {
    let withFindings = 0;
    fc.assert(
      fc.property(graphs, (graph) => {
        const { sources, setting } = randomRun(graph);
        const { memory, pushed } = bothWays(sources, rules, setting);
        if (memory.length > 0) withFindings++;
        expect(comparable(pushed)).toEqual(comparable(memory));
      }),
      { numRuns: 1000, seed: 20261201 },
    );
    // The generator is useful only if most graphs give findings to compare.
    expect(withFindings).toBeGreaterThan(500);
  });
});
