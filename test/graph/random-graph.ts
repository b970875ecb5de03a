// Small random directed graphs for property tests of the graph algorithms (fast-check).
import fc from 'fast-check';

/** A directed graph on nodes 0..nodeCount-1, edges possibly repeated or looping. */
export interface RandomGraph {
  nodeCount: number;
  edges: [number, number][];
}

/** Up to 40 nodes and three times as many edges. */
export const randomGraph: fc.Arbitrary<RandomGraph> = fc
  .integer({ min: 1, max: 40 })
  .chain((nodeCount) =>
    fc.record({
      nodeCount: fc.constant(nodeCount),
      edges: fc.array(fc.tuple(fc.nat(nodeCount - 1), fc.nat(nodeCount - 1)), { maxLength: nodeCount * 3 }),
    }),
  );

/** Sorted successor lists without repeats. */
export function successorLists({ nodeCount, edges }: RandomGraph): number[][] {
  const lists: number[][] = Array.from({ length: nodeCount }, () => []);
  for (const [from, to] of edges) if (!lists[from].includes(to)) lists[from].push(to);
  for (const list of lists) list.sort((a, b) => a - b);
  return lists;
}
