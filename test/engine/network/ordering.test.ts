import { describe, expect, test } from 'vitest';
import { envelopeStarts, reverseCuthillMcKee } from '../../../src/engine/network/ordering';
import { rng } from '../../helpers/random';

describe('reverse Cuthill–McKee ordering', () => {
  test('numbers a path given out of order along the path, so every envelope is one column wide', () => {
    // A path (chain) has bandwidth 1 in path order, the order Cuthill–McKee finds from an end
    // (George and Liu, Computer Solution of Large Sparse Positive Definite Systems, 1981; from memory).
    const path = [4, 0, 6, 2, 5, 1, 3];
    const edges: [number, number][] = path.slice(1).map((v, k) => [path[k], v]);
    const index = reverseCuthillMcKee(7, edges);
    const first = envelopeStarts(7, edges, index);
    for (let i = 1; i < 7; i++) expect(i - first[i]).toBe(1);
  });

  test('gives a permutation of the vertices for any graph, with loops, repeated edges and isolated vertices', () => {
    const r = rng(71);
    for (let t = 0; t < 300; t++) {
      const n = 1 + Math.floor(r() * 30);
      const edges: [number, number][] = Array.from({ length: Math.floor(r() * 2 * n) }, () => [Math.floor(r() * n), Math.floor(r() * n)]);
      if (edges.length) edges.push([...edges[0]]);
      const index = reverseCuthillMcKee(n, edges);
      expect([...index].sort((a, b) => a - b)).toEqual([...Array(n).keys()]);
    }
  });
});
